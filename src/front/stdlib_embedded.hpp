// stdlib_embedded: the modules of stdlib/, built into the binary so that firn finds its
// standard library from any folder. The definition is generated at build time from
// stdlib/*.firn by cmake/embed_stdlib.cmake.
#pragma once

#include <span>
#include <string_view>

namespace firn {

/// A module of the standard library: its name ("materials", the file name without .firn) and its
/// text.
struct StdlibModule {
    std::string_view name;
    std::string_view text;
};

/// The modules built into the binary, sorted by name.
std::span<const StdlibModule> embedded_stdlib();

}  // namespace firn
