// diag: source files, positions and the diagnostics every stage reports into.
// Stage 0 of the pipeline; it knows nothing of the stages that use it.
#pragma once

#include <cstdint>
#include <string>
#include <string_view>
#include <vector>

namespace firn {

/// Index of a file in a SourceMap.
using FileId = std::uint32_t;

/// A point in a source file; line and column count from 1, column in bytes.
struct Position {
    std::uint32_t offset = 0;
    std::uint32_t line = 0;
    std::uint32_t column = 0;
};

/// A half-open range [begin, end) in one source file.
struct SourceRange {
    FileId file = 0;
    Position begin;
    Position end;
};

/// One loaded source text, named as the user gave it (never made absolute).
struct SourceFile {
    std::string name;
    std::string text;
};

/// Owns every source text of a run, so diagnostics can quote lines later.
class SourceMap {
  public:
    /// Adds a file and returns its id.
    FileId add(std::string name, std::string text);
    const SourceFile& file(FileId id) const { return files_.at(id); }
    /// How many files it holds; their ids are 0 .. count - 1.
    std::size_t count() const { return files_.size(); }
    /// The text of the line `line` (1-based) of `id`, without its end of line.
    std::string_view line_text(FileId id, std::uint32_t line) const;
    /// Line and column of the byte `offset` of `id`.
    Position position(FileId id, std::uint32_t offset) const;

  private:
    std::vector<SourceFile> files_;
    std::vector<std::vector<std::uint32_t>> line_starts_;
};

enum class Severity { error, warning, note };

/// A message about the user's input, tied to the place that caused it.
struct Diagnostic {
    Severity severity = Severity::error;
    SourceRange where;
    std::string message;
    std::vector<Diagnostic> notes;  ///< follow-ups such as "first defined here"

    /// Adds a note pointing at another place ("first defined here").
    Diagnostic& note(const SourceRange& place, std::string text) {
        notes.push_back(Diagnostic{Severity::note, place, std::move(text), {}});
        return *this;
    }
};

/// Collects the diagnostics of a run. Stages add to it and go on where they can,
/// so independent mistakes are all reported in one run.
class Diagnostics {
  public:
    Diagnostic& error(const SourceRange& where, std::string message);
    Diagnostic& warning(const SourceRange& where, std::string message);
    /// An error not tied to a place in a model (a missing file, say).
    void error_without_place(std::string message);

    std::size_t error_count() const { return errors_; }
    bool has_errors() const { return errors_ > 0; }
    const std::vector<Diagnostic>& all() const { return items_; }
    const std::vector<std::string>& unplaced() const { return unplaced_; }

  private:
    std::vector<Diagnostic> items_;
    std::vector<std::string> unplaced_;
    std::size_t errors_ = 0;
};

/// Renders every diagnostic, sorted by file and position, as
/// `file:line:col: error: message`, the source line and a caret under the place.
std::string render(const Diagnostics& diagnostics, const SourceMap& sources);

/// The closest of `candidates` to `word` by edit distance, or "" if none is close.
std::string closest_match(std::string_view word, const std::vector<std::string>& candidates);

/// "; did you mean 'X'?" or "" when nothing is close.
std::string did_you_mean(std::string_view word, const std::vector<std::string>& candidates);

}  // namespace firn
