// check_internal: the lookups the check stage's two passes share (the names
// before solving, the values after). Private to the stage.
#pragma once

#include <optional>
#include <string>

#include "ir/derivation.hpp"
#include "ir/model.hpp"

namespace firn {

/// The derived snow value called `name`, if there is one.
std::optional<SnowValue> find_snow_value(const Derivation& derivation, const std::string& name);

/// The index of the support at node `n`, if one holds it.
std::optional<std::size_t> support_at(const Model& model, NodeId n);

}  // namespace firn
