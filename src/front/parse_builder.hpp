// parse_builder: what the parser's actions build while they read one file (the
// tree, and the draft of the statement being read), and the helpers they share.
// Private to src/front/: parse.cpp runs the grammar with the actions of
// parse_actions.hpp, parse_recovery.cpp reports errors and recovers after them.
//
// Actions fill a draft of the statement being read; the draft is committed
// when the statement matches, and thrown away when an error is raised inside
// it. The grammar is written so that a rule with an action is never
// backtracked over once it has matched (keywords are followed by must<>).
#pragma once

#include <fmt/format.h>
#include <cstddef>
#include <cstdint>
#include <optional>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include "base/diag.hpp"
#include "grammar/grammar.hpp"
#include "ir/syntax.hpp"

namespace firn::parsing {

namespace pegtl = tao::pegtl;

/// Expressions nested deeper than this are refused, so hostile input cannot
/// exhaust the stack.
inline constexpr int kMaxNesting = 100;
/// The same for the depth of an expression's tree, which a long chain such as
/// `1 ft + 1 ft + ...` builds without nesting; the tree is walked recursively.
inline constexpr std::uint32_t kMaxDepth = 1000;
/// After this many syntax errors the rest of the file is not read.
inline constexpr std::size_t kMaxSyntaxErrors = 50;

/// Thrown by `Builder::count_error` to stop reading a file with too many errors.
struct TooManyErrors {};

/// True for the characters of a word: letters, digits and '_'.
bool is_word_char(char c);
/// The value of a number's literal; out of range is 0 (too small) or infinity.
double number_value(std::string_view text);
/// The text between double quotes, with backslash escapes undone.
std::string unquote(std::string_view quoted);
/// The offset of the first byte that breaks UTF-8 in `text`, or npos.
std::size_t invalid_utf8_at(std::string_view text);
/// The axis a coordinate word names: `x`, else `y`.
syntax::Axis axis_of(std::string_view text);
/// The options (section, hinges, tags) of the member statement `s`.
syntax::MemberOptions& options_of(syntax::Statement& s);
/// The line ranges of the `columns` or `beams` statement `s`.
std::vector<syntax::LineRange>& ranges_of(syntax::Statement& s);
/// What an open block belongs to ("case", "snow", ...), for messages about it.
const char* block_kind_of(const decltype(syntax::Statement::node)& node);

/// Everything the actions build: the tree and the draft of the current statement.
struct Builder {
    Builder(const SourceMap& s, FileId f, Diagnostics& d)
        : sources(s), file(f), base(s.file(f).text.data()), diagnostics(d) {
        tree.file = f;
    }

    const SourceMap& sources;
    FileId file;
    const char* base;
    Diagnostics& diagnostics;
    syntax::Tree tree;

    std::optional<syntax::Statement> statement;
    std::optional<syntax::LoadDecl> load;
    const char* load_begin = nullptr;
    std::vector<syntax::Expr> exprs;
    std::vector<syntax::UnitFactor> unit;
    std::optional<syntax::Name> pending_name;
    std::optional<syntax::Name> pending_role;
    std::optional<syntax::Axis> pending_axis;
    std::optional<std::pair<std::string, SourceRange>> pending_reason;  ///< `because "..."`
    /// Open calls: the function's name and where its arguments start on `exprs`.
    struct OpenCall {
        syntax::Name function;
        std::size_t first_argument;
    };
    std::vector<OpenCall> calls;
    bool pending_spring_fixed = false;
    int nesting = 0;
    std::uint32_t block_line = 0;
    const char* block_kind = "case";               ///< what the open block belongs to, for messages
    std::optional<syntax::Factor> pending_factor;  ///< a combination factor before its symbol
    /// The open block's missing '}' is reported: the statements after it are
    /// not reported again, one by one, as loads that are not loads.
    bool block_close_reported = false;
    const char* block_open = nullptr;  ///< the '{' of the open block
    std::size_t syntax_errors = 0;
    std::uint32_t next_comment_offset = 0;

    /// The offset of `p` in the file.
    std::uint32_t offset(const char* p) const { return static_cast<std::uint32_t>(p - base); }
    /// The source range from `begin` to `end`.
    SourceRange range(const char* begin, const char* end) const {
        return SourceRange{file, sources.position(file, offset(begin)),
                           sources.position(file, offset(end))};
    }
    /// The source range of a match.
    template <typename Input>
    SourceRange range(const Input& in) const {
        return range(in.begin(), in.end());
    }
    /// A match as a name, with its range.
    template <typename Input>
    syntax::Name name(const Input& in) const {
        return syntax::Name{in.string(), range(in)};
    }
    /// Takes the expression read last off the stack.
    syntax::Expr pop_expr() {
        syntax::Expr e = std::move(exprs.back());
        exprs.pop_back();
        return e;
    }
    /// The draft statement, which is a T.
    template <typename T>
    T& current() {
        return std::get<T>(statement->node);
    }
    /// Starts the draft of a T at its keyword.
    template <typename T, typename Input>
    void begin(const Input& in) {
        statement = syntax::Statement{T{}, range(in)};
    }
    /// Counts a level of nesting; refuses one too many.
    template <typename Input>
    void enter_nesting(const Input& in) {
        if (++nesting > kMaxNesting) {
            throw pegtl::parse_error(
                fmt::format("expressions nest too deeply (more than {} levels)", kMaxNesting), in);
        }
    }

    /// Reports the error `e` raised at `at` (with the hints that fit) and drops the draft.
    void recover_from(const pegtl::parse_error& e, const char* at, bool in_block);
    /// Reports, once, an open block that the end of the file leaves unclosed.
    void report_unclosed_block();
    /// Drops the draft of the broken statement (or load).
    void reset_draft(bool in_block);
    /// Counts a reported syntax error; stops reading the file after too many.
    void count_error();
    /// "found 'x'", "found the end of the line", ... for the text at `at`; sets
    /// `width` to the number of characters it names.
    std::string found_at(const char* at, std::size_t& width) const;
    /// The raised message with what was found at `at` and a "did you mean" for a
    /// misspelt keyword; sets `width` as `found_at` does.
    std::string expected_found(std::string_view raised, const char* at, std::size_t& width) const;
};

}  // namespace firn::parsing
