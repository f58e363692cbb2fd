// include_rules: which stage may include which, checked over the source tree by
// include_rules_test.cpp. The table is the one DEVELOPERS.md draws; change both
// together (ORDER STAGES).
#pragma once

#include <string>
#include <string_view>
#include <vector>

namespace firn::testing {

/// Every way `text`, the file at `path` (relative to src/, as `derive/snow.cpp`),
/// breaks the layout's rules, one sentence each: a stage it may not use, another
/// stage's private header, or a third-party library outside its stage.
std::vector<std::string> include_violations(std::string_view path, std::string_view text);

/// The stages, lowest first (ORDER STAGES).
const std::vector<std::string>& stage_names();

}  // namespace firn::testing
