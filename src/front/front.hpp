// front: model text -> syntax trees. `parse` reads one file (the only code that
// sees PEGTL, recovering at the next statement after an error); `load_model`
// reads a model file and every file and library module it `use`s, each parsed
// once, in an order where every file comes after the files it uses.
#pragma once

#include <vector>

#include "base/diag.hpp"
#include "ir/import_options.hpp"
#include "ir/syntax.hpp"

namespace firn {

/// Parses the file `file` of `sources`. Syntax errors go to `diagnostics`; the
/// parser recovers at the next statement, so the tree holds every statement
/// that parsed and all independent errors are reported.
syntax::Tree parse(const SourceMap& sources, FileId file, Diagnostics& diagnostics);

/// Parses the model file `main` (already in `sources`) and everything it uses.
/// Returns the trees with `main` last. Errors (a missing file, a cycle, a
/// file outside the model's folder without `use outside`) go to `diagnostics`.
std::vector<syntax::Tree> load_model(SourceMap& sources, FileId main, Diagnostics& diagnostics,
                                     const ImportOptions& options = {});

}  // namespace firn
