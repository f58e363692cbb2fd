// name_pattern: names with `*` for any run of characters (`eave.*`), as member
// lists, drawing options and case patterns write them.
#pragma once

#include <cstddef>
#include <functional>
#include <string>
#include <string_view>
#include <vector>

namespace firn {

/// True if `name` matches `pattern`, where `*` stands for any run of characters.
bool name_matches(std::string_view pattern, std::string_view name);

/// Indices, ascending and each once, of the `count` names (name_of(i)) that match any
/// of `patterns`; each pattern that matches nothing is reported as "no WHAT is named
/// 'PATTERN'" into `errors`.
std::vector<std::size_t> matching_names(const std::vector<std::string>& patterns, std::size_t count,
                                        const std::function<std::string(std::size_t)>& name_of,
                                        const char* what, std::vector<std::string>& errors);

}  // namespace firn
