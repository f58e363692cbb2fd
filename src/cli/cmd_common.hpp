// cmd_common: what the commands share once a model is analysed: where `use`
// finds the library, and the report sections an analysis fills.
#pragma once

#include <CLI/CLI.hpp>
#include <string>

#include "driver/driver.hpp"

namespace firn {

/// Import options for `--stdlib DIR`; empty: the built-in library.
inline ImportOptions imports_from(const std::string& stdlib) {
    ImportOptions imports;
    if (!stdlib.empty())
        imports.stdlib_dir = stdlib;
    return imports;
}

/// `--stdlib DIR` (or FIRN_STDLIB): where `use NAME` finds the library.
inline void add_stdlib_option(CLI::App* cmd, std::string& stdlib) {
    cmd->add_option("--stdlib", stdlib,
                    "Read library modules (use NAME) from this folder instead of the built-in "
                    "library; for library development")
        ->envname("FIRN_STDLIB");
}

}  // namespace firn
