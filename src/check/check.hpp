// check: holds a model's expectations (`expect` statements) to its results: a
// member's enveloped moment, shear, axial force or deflection, a reaction, a
// displacement or rotation, or a derived snow value. A stage after the
// envelopes; `firn check` and the report print what it finds.
#pragma once

#include <vector>

#include "base/diag.hpp"
#include "ir/checks.hpp"
#include "ir/combinations.hpp"
#include "ir/load_set.hpp"
#include "ir/model.hpp"
#include "ir/results.hpp"
#include "ir/solution.hpp"

namespace firn {

/// What the results of an analysed model need to be checked.
struct CheckInputs {
    const Model& model;
    const LoadSet& loads;
    const Solution& solution;
    const Results& results;
    const CombinationList& combinations;
    const std::vector<Envelopes>& envelopes;
};

/// Checks every expectation of the model in statement order. A source (`under`) or snow
/// value that does not exist is reported to `diagnostics` and its outcome is unchecked.
std::vector<ExpectationOutcome> check_expectations(const CheckInputs& in, Diagnostics& diagnostics);

}  // namespace firn
