// imports: a model file and the files and library modules it `use`s, each
// parsed once, in an order where every file comes after the files it uses.
// The first stage of the pipeline; it calls `parse` for every file.
#pragma once

#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "diag.hpp"
#include "syntax.hpp"

namespace firn {

/// How `use` finds what it names.
struct ImportOptions {
    /// A folder whose NAME.firn files replace the built-in standard library
    /// (for library development), or none for the built-in one.
    std::optional<std::string> stdlib_dir;
    /// Reads a file; a seam for tests. Defaults to read_file.
    std::function<bool(const std::string& path, std::string& text, std::string& error)> read;
};

/// Parses the model file `main` (already in `sources`) and everything it uses.
/// Returns the trees with `main` last. Errors (a missing file, a cycle, a
/// file outside the model's folder without `use outside`) go to `diagnostics`.
std::vector<syntax::Tree> load_model(SourceMap& sources, FileId main, Diagnostics& diagnostics,
                                     const ImportOptions& options = {});

}  // namespace firn
