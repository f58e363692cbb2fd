// name_pattern: names with `*` for any run of characters (`eave.*`), as member
// lists, drawing options and case patterns write them.
#pragma once

#include <string_view>

namespace firn {

/// True if `name` matches `pattern`, where `*` stands for any run of characters.
bool name_matches(std::string_view pattern, std::string_view name);

}  // namespace firn
