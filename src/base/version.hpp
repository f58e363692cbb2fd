// version: firn's version, from the project's CMake version, for `--version` and
// for the reports, which name the firn that wrote them.
#pragma once

#include <string_view>

namespace firn {

inline constexpr std::string_view kFirnVersion = FIRN_VERSION;

}  // namespace firn
