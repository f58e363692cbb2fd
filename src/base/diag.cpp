// diag: source map, diagnostic collection and rendering with a caret.
#include "base/diag.hpp"

#include <fmt/format.h>
#include <algorithm>

namespace firn {

FileId SourceMap::add(std::string name, std::string text) {
    std::vector<std::uint32_t> starts{0};
    for (std::size_t i = 0; i < text.size(); ++i) {
        if (text[i] == '\n')
            starts.push_back(static_cast<std::uint32_t>(i + 1));
    }
    files_.push_back(SourceFile{std::move(name), std::move(text)});
    line_starts_.push_back(std::move(starts));
    return static_cast<FileId>(files_.size() - 1);
}

std::string_view SourceMap::line_text(FileId id, std::uint32_t line) const {
    const auto& starts = line_starts_.at(id);
    const std::string& text = files_.at(id).text;
    if (line == 0 || line > starts.size())
        return {};
    std::size_t begin = starts[line - 1];
    std::size_t end = text.find('\n', begin);
    if (end == std::string::npos)
        end = text.size();
    if (end > begin && text[end - 1] == '\r')
        --end;
    return std::string_view(text).substr(begin, end - begin);
}

Position SourceMap::position(FileId id, std::uint32_t offset) const {
    const auto& starts = line_starts_.at(id);
    auto after = std::upper_bound(starts.begin(), starts.end(), offset);
    auto line = static_cast<std::uint32_t>(after - starts.begin());
    return Position{offset, line, offset - starts[line - 1] + 1};
}

Diagnostic& Diagnostics::error(const SourceRange& where, std::string message) {
    ++errors_;
    items_.push_back(Diagnostic{Severity::error, where, std::move(message), {}});
    return items_.back();
}

Diagnostic& Diagnostics::warning(const SourceRange& where, std::string message) {
    items_.push_back(Diagnostic{Severity::warning, where, std::move(message), {}});
    return items_.back();
}

void Diagnostics::error_without_place(std::string message) {
    ++errors_;
    unplaced_.push_back(std::move(message));
}

namespace {

const char* severity_word(Severity s) {
    switch (s) {
        case Severity::error:
            return "error";
        case Severity::warning:
            return "warning";
        case Severity::note:
            return "note";
    }
    return "error";
}

// More diagnostics than this help nobody; the rest are counted, not shown.
constexpr std::size_t kMaxShown = 100;

// Lines longer than this are shown as a window around the caret, so a
// pathological input cannot flood the terminal.
constexpr std::size_t kShownWidth = 100;

/// `text` with control bytes (a NUL, a terminal escape) shown as '?', one byte for one,
/// so a message can neither stop short at a NUL nor drive the terminal.
std::string printable(std::string_view text) {
    std::string shown(text);
    for (char& c : shown) {
        auto byte = static_cast<unsigned char>(c);
        if ((byte < 0x20 && c != '\t') || byte == 0x7f)
            c = '?';
    }
    return shown;
}

// The quoted line and the caret line under it. Tabs in the source are kept in
// the caret line so the caret stays aligned in any terminal.
void quote_line(std::string& out, std::string_view line, const SourceRange& where) {
    std::size_t col = where.begin.column > 0 ? where.begin.column - 1 : 0;
    col = std::min(col, line.size());
    std::size_t width = 1;
    if (where.end.line == where.begin.line && where.end.column > where.begin.column) {
        width = where.end.column - where.begin.column;
    }
    std::size_t first = 0;
    std::string prefix, suffix;
    if (line.size() > kShownWidth) {
        first = col > kShownWidth / 2 ? col - kShownWidth / 2 : 0;
        if (first > 0)
            prefix = "...";
        if (first + kShownWidth < line.size())
            suffix = "...";
        line = line.substr(first, kShownWidth);
    }
    std::size_t shown_col = col - first;
    width = std::max<std::size_t>(
        1, std::min(width, line.size() > shown_col ? line.size() - shown_col : 1));
    std::string shown = printable(line);
    out += "    " + prefix + shown + suffix + "\n    " + std::string(prefix.size(), ' ');
    for (std::size_t i = 0; i < shown_col; ++i)
        out += line[i] == '\t' ? '\t' : ' ';
    out += '^';
    out += std::string(width - 1, '~');
    out += '\n';
}

void render_one(std::string& out, const Diagnostic& d, const SourceMap& sources) {
    const SourceFile& file = sources.file(d.where.file);
    out += fmt::format("{}:{}:{}: {}: {}\n", printable(file.name), d.where.begin.line,
                       d.where.begin.column, severity_word(d.severity), printable(d.message));
    quote_line(out, sources.line_text(d.where.file, d.where.begin.line), d.where);
    for (const Diagnostic& note : d.notes)
        render_one(out, note, sources);
}

bool comes_before(const Diagnostic& a, const Diagnostic& b) {
    if (a.where.file != b.where.file)
        return a.where.file < b.where.file;
    if (a.where.begin.line != b.where.begin.line)
        return a.where.begin.line < b.where.begin.line;
    return a.where.begin.column < b.where.begin.column;
}

/// Optimal string alignment distance: insertions, deletions, substitutions
/// and swaps of neighbouring letters ("pots" for "post") each count one.
std::size_t edit_distance(std::string_view a, std::string_view b) {
    std::vector<std::vector<std::size_t>> d(a.size() + 1, std::vector<std::size_t>(b.size() + 1));
    for (std::size_t i = 0; i <= a.size(); ++i)
        d[i][0] = i;
    for (std::size_t j = 0; j <= b.size(); ++j)
        d[0][j] = j;
    for (std::size_t i = 1; i <= a.size(); ++i) {
        for (std::size_t j = 1; j <= b.size(); ++j) {
            std::size_t cost = a[i - 1] == b[j - 1] ? 0 : 1;
            d[i][j] = std::min({d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + cost});
            if (i > 1 && j > 1 && a[i - 1] == b[j - 2] && a[i - 2] == b[j - 1]) {
                d[i][j] = std::min(d[i][j], d[i - 2][j - 2] + 1);
            }
        }
    }
    return d[a.size()][b.size()];
}

}  // namespace

std::string render(const Diagnostics& diagnostics, const SourceMap& sources) {
    std::string out;
    for (const std::string& message : diagnostics.unplaced())
        out += "firn: error: " + printable(message) + "\n";
    std::vector<const Diagnostic*> sorted;
    for (const Diagnostic& d : diagnostics.all())
        sorted.push_back(&d);
    std::stable_sort(sorted.begin(), sorted.end(),
                     [](const Diagnostic* a, const Diagnostic* b) { return comes_before(*a, *b); });
    std::size_t shown = std::min(sorted.size(), kMaxShown);
    for (std::size_t i = 0; i < shown; ++i)
        render_one(out, *sorted[i], sources);
    if (sorted.size() > shown)
        out += fmt::format("firn: {} more diagnostics not shown\n", sorted.size() - shown);
    return out;
}

std::string closest_match(std::string_view word, const std::vector<std::string>& candidates) {
    // Long inputs are never near-misses; skipping them keeps this cheap on hostile input.
    if (word.size() > 64)
        return {};
    // One slip per three letters; a one-letter name is too short to guess from.
    const std::size_t allowed = word.size() < 2 ? 0 : std::max<std::size_t>(1, word.size() / 3);
    std::string best;
    std::size_t best_distance = allowed + 1;
    for (const std::string& candidate : candidates) {
        if (candidate.size() > word.size() + allowed || candidate.size() + allowed < word.size()) {
            continue;
        }
        std::size_t d = edit_distance(word, candidate);
        if (d < best_distance) {
            best_distance = d;
            best = candidate;
        }
    }
    return best;
}

std::string did_you_mean(std::string_view word, const std::vector<std::string>& candidates) {
    std::string best = closest_match(word, candidates);
    return best.empty() ? std::string() : fmt::format("; did you mean '{}'?", best);
}

}  // namespace firn
