// format: the one canonical layout of a model file (`firn fmt`).
//
// The layout is printed from the syntax tree and the file's comments, so it is
// the same whatever spacing and line breaks the author used. Only whitespace,
// line breaks and ';' between statements ever change: every other character,
// comments included, stays in its order. See DEVELOPERS.md for the rules.
#pragma once

#include <optional>
#include <stdexcept>
#include <string>

#include "base/diag.hpp"

namespace firn {

/// The formatter's own checks found that its layout would change the model (a
/// bug in firn, never the user's): the file is left as it is.
class FormatterError : public std::logic_error {
  public:
    using std::logic_error::logic_error;
};

/// The canonical text of `file`, or nullopt when it has syntax errors (they are
/// added to `diagnostics`). Only parses the file: names need not resolve and
/// `use` is not followed. Throws FormatterError when the layout fails its
/// self-checks: it must parse to the same tree, keep every token and comment
/// in order, and format to itself.
std::optional<std::string> format_source(const SourceMap& sources, FileId file,
                                         Diagnostics& diagnostics);

}  // namespace firn
