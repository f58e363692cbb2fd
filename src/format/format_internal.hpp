// format_internal: the pieces of the formatter, shared by format.cpp (the file's
// structure and the self-checks), format_print.cpp (statements as atoms) and
// format_layout.cpp (atoms as lines). Not for use outside the formatter.
#pragma once

#include <cstddef>
#include <cstdint>
#include <string>
#include <string_view>
#include <vector>

#include "ir/syntax.hpp"

namespace firn::format_detail {

/// Lines are broken to stay within this many columns where a list allows it.
inline constexpr std::size_t kLineWidth = 100;
/// Continuation lines that do not continue a list are indented this much more
/// than their statement.
inline constexpr std::size_t kContinuationIndent = 4;

/// A comment of the file, and whether code came before it on its source line
/// (such a comment stays trailing; any other stays on a line of its own).
struct Remark {
    const syntax::Comment* comment = nullptr;
    bool after_code = false;
    std::uint32_t offset() const { return comment->where.begin.offset; }
    std::uint32_t line() const { return comment->where.begin.line; }
};

/// One token of a statement as it is printed, with the place it came from.
struct Atom {
    std::string text;
    /// Source offset of the token (of the token before it when the tree does not
    /// record one); a comment goes after the last atom that starts before it.
    std::uint32_t src = 0;
    bool space_before = true;      ///< false: glued to the atom before
    bool forced_break = false;     ///< the line must break before this atom
    int list = -1;                 ///< >= 0: this atom starts an item of that list
    bool first_item = false;       ///< ... and the item is the list's first
    std::vector<Remark> comments;  ///< comments right after this atom
};

/// One output line: code with its indentation and a trailing comment, or an
/// own-line comment, or (both empty) a blank line.
struct Line {
    std::string code;
    std::string comment;
    std::size_t indent = 0;  ///< of an own-line comment
    bool own_comment = false;
};

/// The atoms of a statement other than a block. `signature` collects a
/// description of its structure, for the self-check.
std::vector<Atom> statement_atoms(const syntax::Statement& statement, std::string_view source,
                                  std::string& signature);
/// The atoms of a block statement's first lines, up to its '{' at `brace`:
/// `case NAME KIND {`, `snow NAME {`, `roof NAME on MEMBERS {`.
std::vector<Atom> block_header_atoms(const syntax::Statement& statement, std::uint32_t brace,
                                     std::string_view source, std::string& signature);
/// The atoms of one load of a case block.
std::vector<Atom> load_atoms(const syntax::LoadDecl& load, const SourceRange& where,
                             std::string_view source, std::string& signature);
/// The atoms of one setting of a snow or roof block, `key = value because "reason"`.
/// The atoms of one field of a `cover` block.
std::vector<Atom> cover_field_atoms(const syntax::CoverDecl::Field& field, std::string_view source,
                                    std::string& signature);

std::vector<Atom> setting_atoms(const syntax::Setting& setting, std::string_view source,
                                std::string& signature);

/// The atoms of one line of a combinations or pattern block: its words as written.
std::vector<Atom> source_line_atoms(const SourceRange& where, std::string_view source,
                                    std::string& signature);

/// Gives each comment inside the statement to the atom it follows.
void attach_comments(std::vector<Atom>& atoms, const std::vector<Remark>& inside);

/// Lays the atoms of one statement out from column `indent`, breaking lists
/// greedily at kLineWidth, and after every comment inside the statement.
void lay_out(const std::vector<Atom>& atoms, std::size_t indent, std::vector<Line>& out);

/// Lines with a trailing comment, consecutive, get their comments in one column.
void align_trailing_comments(std::vector<Line>& lines);
/// The lines as text: no trailing whitespace, each line ending in '\n'.
std::string render_lines(const std::vector<Line>& lines);
/// A comment's text without trailing whitespace.
std::string comment_text(const syntax::Comment& comment);
/// Columns a string takes (UTF-8 code points).
std::size_t width_of(std::string_view text);

}  // namespace firn::format_detail
