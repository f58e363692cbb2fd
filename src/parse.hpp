// parse: model text -> syntax tree. The only stage that sees PEGTL.
#pragma once

#include "diag.hpp"
#include "syntax.hpp"

namespace firn {

/// Parses the file `file` of `sources`. Syntax errors go to `diagnostics`; the
/// parser recovers at the next statement, so the tree holds every statement
/// that parsed and all independent errors are reported.
syntax::Tree parse(const SourceMap& sources, FileId file, Diagnostics& diagnostics);

}  // namespace firn
