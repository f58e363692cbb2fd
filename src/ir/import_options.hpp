// import_options: how `use` finds the files and library modules a model names.
#pragma once

#include <functional>
#include <optional>
#include <string>

namespace firn {

/// How `use` finds what it names.
struct ImportOptions {
    /// A folder whose NAME.firn files replace the built-in standard library
    /// (for library development), or none for the built-in one.
    std::optional<std::string> stdlib_dir;
    /// Reads a file; a seam for tests. Defaults to read_file.
    std::function<bool(const std::string& path, std::string& text, std::string& error)> read;
};

}  // namespace firn
