// lsp_internal: the parts of the language server, private to the stage. Only the
// lsp stage's files see nlohmann-json (the include test checks).
#pragma once

#include <cstdint>
#include <istream>
#include <memory>
#include <nlohmann/json.hpp>
#include <optional>
#include <ostream>
#include <string>
#include <string_view>
#include <vector>

#include "base/diag.hpp"
#include "ir/derivation.hpp"
#include "ir/import_options.hpp"
#include "ir/model.hpp"
#include "ir/syntax.hpp"

namespace firn::lsp {

using Json = nlohmann::json;

// ---- transport (lsp_transport.cpp) ----

enum class ReadStatus {
    message,     ///< `body` holds one message
    end,         ///< the stream ended (between messages or inside one)
    bad_header,  ///< a header block without a usable Content-Length; skipped
};

/// Reads one Content-Length framed message. Bodies above 64 MiB are refused as a bad
/// header and skipped, so a wrong length cannot make the server allocate without bound.
ReadStatus read_message(std::istream& in, std::string& body);

/// Writes one framed message and flushes it.
void write_message(std::ostream& out, const Json& message);

/// True when more bytes are already waiting in `in` (the editor typed on).
bool input_waiting(std::istream& in);

// ---- text and places (lsp_text.cpp) ----

/// A protocol position: 0-based line, and 0-based character in UTF-16 code units.
struct TextPosition {
    std::uint32_t line = 0;
    std::uint32_t character = 0;
};

/// The starts of a text's lines, to turn byte offsets into protocol positions and back.
class LineIndex {
  public:
    explicit LineIndex(std::string_view text);
    TextPosition position(std::uint32_t offset) const;
    std::uint32_t offset(TextPosition position) const;

  private:
    bool is_line_end(std::uint32_t i) const;
    std::string_view text_;
    std::vector<std::uint32_t> starts_;
};

/// The protocol's {line, character} object.
Json position_json(TextPosition p);
/// {start, end} of the bytes [begin, end) of `text`.
Json range_json(const LineIndex& lines, std::uint32_t begin, std::uint32_t end);

/// "file:///a/b%20c.firn" -> "/a/b c.firn"; other schemes are kept whole.
std::string path_of_uri(std::string_view uri);
std::string uri_of_path(std::string_view path);

/// The name under byte `offset`: letters, digits, '_' and '.' (member names such as
/// `eave.A.B`). Sets [begin, end); empty when there is none.
std::string_view name_at(std::string_view text, std::uint32_t offset, std::uint32_t& begin);

// ---- one check of a model (lsp_check.cpp) ----

/// What checking a model's text found: its sources, diagnostics, trees and, when
/// they resolved, the model and its snow derivation.
struct CheckedModel {
    SourceMap sources;
    FileId main = 0;
    Diagnostics diagnostics;
    std::vector<syntax::Tree> trees;
    Model model;
    Derivation derivation;
    /// The units hovers show values in: the model's, or while it does not resolve those
    /// of the last check that did (kN and m before any did, as the compiler's default).
    DisplayUnits units;
    bool resolved = false;  ///< resolve ran: `model` names what it could bind
    bool complete = false;  ///< and reported no error, so every value in `model` holds
    bool derived = false;   ///< `derivation` holds the snow values
};

/// Parses, resolves and derives the model; never solves it. `previous` is the last
/// check of the same document, if any.
std::unique_ptr<CheckedModel> check_model(std::string path, std::string text,
                                          const ImportOptions& options,
                                          const CheckedModel* previous);

/// The publishDiagnostics items of the main file: messages placed in other files
/// (a used file, the library) are shown at the top, naming their place.
Json diagnostics_json(const CheckedModel& checked);

// ---- what the editor asks about (lsp_features.cpp, lsp_values.cpp) ----

/// The hover text for the name at `offset` of the main file, or none.
std::optional<std::string> hover_text(const CheckedModel& checked, std::uint32_t offset);

/// A place a name or `use` at `offset` is defined, or none.
struct Definition {
    FileId file = 0;
    SourceRange where;
};
std::optional<Definition> definition_at(const CheckedModel& checked, std::uint32_t offset);

/// The documentSymbol reply: cases, members, groups and roofs.
Json document_symbols(const CheckedModel& checked);

/// The completion reply: keywords, the names the model defines, and units that start
/// with `prefix`, at most 1000 (then marked incomplete).
Json completion_items(const CheckedModel* checked, std::string_view prefix);

/// `let` values evaluated to SI with their dimension, by name (lsp_values.cpp).
struct LetValue {
    std::string name;
    double value = 0.0;
    Dimension dimension;
    SourceRange where;
};
std::vector<LetValue> let_values(const CheckedModel& checked);

/// `value` (SI) in the model's display unit for `dimension`: "24.000 ft".
std::string show_quantity(const DisplayUnits& units, double value, Dimension dimension);

}  // namespace firn::lsp
