// lsp: `firn lsp`, a language server for editors (the Language Server Protocol
// 3.17, the part editors use) over two byte streams. The model is checked as the
// author types: parse, resolve and derive, never a solve (DEVELOPERS.md says why).
#pragma once

#include <iosfwd>

#include "ir/import_options.hpp"

namespace firn {

/// Serves one editor session: Content-Length framed JSON-RPC messages are read from
/// `in` and answered on `out` until `exit` or the end of `in`. Returns the process
/// status the protocol asks for: 0 after `shutdown` then `exit`, 1 otherwise.
/// Changes already waiting in `in` are read before a document is checked again.
/// `library` says where `use NAME` finds the standard library.
int serve_language(std::istream& in, std::ostream& out, const ImportOptions& library = {});

/// The same on the process's standard input and output.
int serve_language_on_stdio(const ImportOptions& library = {});

}  // namespace firn
