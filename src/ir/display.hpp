// display: how the model shows an expectation's values, in its report units. A
// pure query shared by the check stage's messages and the report.
#pragma once

#include <string>

#include "base/units.hpp"
#include "ir/model.hpp"

namespace firn {

/// The unit the model reports an expectation's values in; nothing for a plain number.
const DisplayUnit* expectation_unit(const Model& model, const Expectation& x);

/// `value` in the unit the model reports the expectation's quantity in: "45.23 kip*ft".
std::string show_expected_value(const Model& model, const Expectation& x, double value);

}  // namespace firn
