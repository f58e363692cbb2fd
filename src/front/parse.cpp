// parse: PEGTL actions that build the syntax tree, and error recovery.
//
// Actions fill a draft of the statement being read; the draft is committed
// when the statement matches, and thrown away when an error is raised inside
// it. The grammar is written so that a rule with an action is never
// backtracked over once it has matched (keywords are followed by must<>).
#include "front/front.hpp"

#include <fmt/format.h>
#include <algorithm>
#include <array>
#include <charconv>
#include <cmath>
#include <limits>
#include <stdexcept>

#include "grammar/errors.hpp"
#include "grammar/grammar.hpp"

namespace firn {
namespace {

namespace g = grammar;
namespace pegtl = tao::pegtl;
using syntax::Expr;

/// Expressions nested deeper than this are refused, so hostile input cannot
/// exhaust the stack.
constexpr int kMaxNesting = 100;
/// The same for the depth of an expression's tree, which a long chain such as
/// `1 ft + 1 ft + ...` builds without nesting; the tree is walked recursively.
constexpr std::uint32_t kMaxDepth = 1000;
/// After this many syntax errors the rest of the file is not read.
constexpr std::size_t kMaxSyntaxErrors = 50;

struct TooManyErrors {};

bool is_keyword(std::string_view word) {
    return std::find(g::keywords.begin(), g::keywords.end(), word) != g::keywords.end();
}

bool is_word_char(char c) {
    return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9') || c == '_';
}

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
    std::vector<Expr> exprs;
    std::vector<syntax::UnitFactor> unit;
    std::optional<syntax::Name> pending_name;
    std::optional<syntax::Axis> pending_axis;
    std::optional<syntax::Name> pending_role;
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

    std::uint32_t offset(const char* p) const { return static_cast<std::uint32_t>(p - base); }
    SourceRange range(const char* begin, const char* end) const {
        return SourceRange{file, sources.position(file, offset(begin)),
                           sources.position(file, offset(end))};
    }
    template <typename Input>
    SourceRange range(const Input& in) const {
        return range(in.begin(), in.end());
    }
    template <typename Input>
    syntax::Name name(const Input& in) const {
        return syntax::Name{in.string(), range(in)};
    }
    Expr pop_expr() {
        Expr e = std::move(exprs.back());
        exprs.pop_back();
        return e;
    }
    template <typename T>
    T& current() {
        return std::get<T>(statement->node);
    }
    template <typename T, typename Input>
    void begin(const Input& in) {
        statement = syntax::Statement{T{}, range(in)};
    }
    template <typename Input>
    void enter_nesting(const Input& in) {
        if (++nesting > kMaxNesting) {
            throw pegtl::parse_error(
                fmt::format("expressions nest too deeply (more than {} levels)", kMaxNesting), in);
        }
    }

    void recover_from(const pegtl::parse_error& e, const char* at, bool in_block);
    void report_unclosed_block();
    /// Drops the draft of the broken statement (or load).
    void reset_draft(bool in_block);
    /// Counts a reported syntax error; stops reading the file after too many.
    void count_error();
    std::string found_at(const char* at, std::size_t& width) const;
};

/// "found 'x'", "found the end of the line", ... for the text at `at`.
std::string Builder::found_at(const char* at, std::size_t& width) const {
    const char* end = sources.file(file).text.data() + sources.file(file).text.size();
    width = 1;
    if (at >= end)
        return "the end of the file";
    if (*at == '\n' || *at == '\r')
        return "the end of the line";
    if (*at == ' ' || *at == '\t')  // where the grammar allows no space, as in `A.. D`
        return *at == ' ' ? "a space" : "a tab";
    if (is_word_char(*at)) {
        const char* p = at;
        while (p < end && p - at < 64 && (is_word_char(*p) || *p == '.' || *p == '*'))
            ++p;
        std::string word(at, p);
        width = word.size();
        return is_keyword(word) ? fmt::format("'{}' (a reserved word)", word)
                                : fmt::format("'{}'", word);
    }
    unsigned char c = static_cast<unsigned char>(*at);
    if (c < 0x20 || c >= 0x7f)
        return fmt::format("a character that is not allowed here (byte 0x{:02X})", c);
    return fmt::format("'{}'", *at);
}

/// True if only spaces stand between the start of its line and `at`.
bool starts_line(const char* at, const char* begin) {
    while (at > begin && (at[-1] == ' ' || at[-1] == '\t'))
        --at;
    return at == begin || at[-1] == '\n';
}

/// True if the text at `at` begins with a keyword that starts a top-level statement.
bool starts_statement(const char* at, const char* end) {
    static constexpr std::array<std::string_view, 24> words{
        "snow",    "roof",    "projection", "amend",    "combinations", "combine",
        "pattern", "arrange", "deflection", "model",    "use",          "let",
        "report",  "grid",    "node",       "material", "section",      "member",
        "columns", "beams",   "rafters",    "group",    "support",      "case"};
    for (std::string_view w : words) {
        if (static_cast<std::size_t>(end - at) < w.size())
            continue;
        bool word_ends =
            static_cast<std::size_t>(end - at) == w.size() || !is_word_char(at[w.size()]);
        if (std::string_view(at, w.size()) == w && word_ends)
            return true;
    }
    return false;
}

/// Keywords a message names, for a "did you mean" on a misspelt keyword.
std::vector<std::string> keywords_in(std::string_view message) {
    std::vector<std::string> found;
    std::size_t i = 0;
    while (i < message.size()) {
        std::size_t j = i;
        while (j < message.size() && message[j] >= 'a' && message[j] <= 'z')
            ++j;
        if (j > i && is_keyword(message.substr(i, j - i)))
            found.emplace_back(message.substr(i, j - i));
        i = j + 1;
    }
    return found;
}

bool is_pattern_char(char c) {
    return is_word_char(c) || c == '.' || c == '*';
}

/// True if `message` is that of a rule that reads a name (of a node, a grid
/// line, a group, ...), where a pattern is not allowed.
bool expects_name(std::string_view message) {
    static const std::array<const char*, 25> rules{
        g::errors::message<g::node_name>,        g::errors::message<g::coordinate>,
        g::errors::message<g::material_name>,    g::errors::message<g::section_name>,
        g::errors::message<g::section_material>, g::errors::message<g::member_name>,
        g::errors::message<g::member_start>,     g::errors::message<g::member_end>,
        g::errors::message<g::member_section>,   g::errors::message<g::hinge_node>,
        g::errors::message<g::support_node>,     g::errors::message<g::case_name>,
        g::errors::message<g::node_list>,        g::errors::message<g::load_node>,
        g::errors::message<g::let_name>,         g::errors::message<g::run_last>,
        g::errors::message<g::line_ranges>,      g::errors::message<g::line_range>,
        g::errors::message<g::range_last>,       g::errors::message<g::span_from>,
        g::errors::message<g::span_to>,          g::errors::message<g::rafter_run>,
        g::errors::message<g::rafter_point>,     g::errors::message<g::group_name>,
        g::errors::message<g::tag_name>};
    return std::find(rules.begin(), rules.end(), message) != rules.end();
}

/// The member pattern (`A.*`, `*.base`) that an error at `at` falls in, or an
/// empty view. A name is read up to the '*', so a pattern written where a name
/// is due fails inside it (`A.*`: at the '.'), whatever was expected next; or
/// at its start if it starts with '*', when a name was expected there.
std::string_view pattern_around(const char* at, const char* begin, const char* end,
                                std::string_view message) {
    if (at >= end || !is_pattern_char(*at))
        return {};
    bool inside = at > begin && is_pattern_char(at[-1]);
    if (!inside && !(*at == '*' && expects_name(message)))
        return {};
    const char* first = at;
    while (first > begin && is_pattern_char(first[-1]))
        --first;
    const char* last = at;
    while (last < end && is_pattern_char(*last))
        ++last;
    std::string_view word(first, static_cast<std::size_t>(last - first));
    bool named = std::any_of(word.begin(), word.end(), is_word_char);
    bool starred = word.find('*') != std::string_view::npos;
    // `**` is an operator slip in an expression (a power), not a pattern.
    if (!named || !starred || word.find("**") != std::string_view::npos)
        return {};
    return word;
}

void Builder::recover_from(const pegtl::parse_error& e, const char* at, bool in_block) {
    const char* text_end = base + sources.file(file).text.size();
    bool unclosed_block =
        in_block && block_line > 0 && starts_line(at, base) && starts_statement(at, text_end);
    if (unclosed_block && block_close_reported) {
        reset_draft(in_block);
        return;
    }
    if (e.message() == g::errors::message<g::block_close> && block_line > 0) {
        report_unclosed_block();
        reset_draft(in_block);
        return;
    }
    std::string_view pattern = pattern_around(at, base, text_end, e.message());
    if (!pattern.empty()) {
        diagnostics.error(range(pattern.data(), pattern.data() + pattern.size()),
                          fmt::format("'{}' is a pattern; a pattern with '*' names members and "
                                      "may be used only in a group or after 'on' in a load",
                                      pattern));
        reset_draft(in_block);
        count_error();
        return;
    }
    std::size_t width = 1;
    std::string found = found_at(at, width);
    std::string message(e.message());
    if (message.rfind("parse error matching", 0) == 0)
        message = "this is not valid here";
    bool expected_something = message.rfind("expected", 0) == 0;
    if (expected_something)
        message += ", found " + found;
    if (expected_something && found.front() == '\'' &&
        found.find("reserved") == std::string::npos) {
        message += did_you_mean(found.substr(1, width), keywords_in(e.message()));
    }
    if (unclosed_block) {
        message += fmt::format(" (is the '}}' of the {} block opened at line {} missing?)",
                               block_kind, block_line);
        block_close_reported = true;
    }
    const char* stop = std::min(at + width, text_end);
    diagnostics.error(range(at, stop), std::move(message));
    reset_draft(in_block);
    count_error();
}

/// The file ends inside a case block. The error is put at the '{' that is
/// never closed: the end of the file is no place to look at, and a '}'
/// reported missing before a statement inside the block was this same slip.
void Builder::report_unclosed_block() {
    if (block_close_reported)
        return;
    block_close_reported = true;
    diagnostics.error(range(block_open, block_open + 1),
                      fmt::format("this {} block is never closed: expected '}}' before the end of "
                                  "the file",
                                  block_kind));
    count_error();
}

void Builder::reset_draft(bool in_block) {
    exprs.clear();
    calls.clear();
    unit.clear();
    pending_name.reset();
    pending_axis.reset();
    pending_role.reset();
    pending_reason.reset();
    nesting = 0;
    load.reset();
    if (!in_block)
        statement.reset();
}

void Builder::count_error() {
    if (++syntax_errors >= kMaxSyntaxErrors)
        throw TooManyErrors{};
}

double number_value(std::string_view text) {
    double value = 0.0;
    auto [end, ec] = std::from_chars(text.data(), text.data() + text.size(), value);
    if (ec == std::errc::result_out_of_range) {
        // Too small rounds to zero; too large stays infinite and `resolve` says so.
        bool tiny =
            text.find("e-") != std::string_view::npos || text.find("E-") != std::string_view::npos;
        return tiny ? 0.0 : std::numeric_limits<double>::infinity();
    }
    return value;
}

/// One unit factor from the text of unit_lead/unit_times/unit_hyphen/unit_per.
template <typename Input>
syntax::UnitFactor unit_factor(const Input& in, const Builder& b, bool divides) {
    const char* p = in.begin();
    while (!((*p >= 'a' && *p <= 'z') || (*p >= 'A' && *p <= 'Z')))
        ++p;
    const char* name_end = p;
    while (name_end < in.end() &&
           ((*name_end >= 'a' && *name_end <= 'z') || (*name_end >= 'A' && *name_end <= 'Z'))) {
        ++name_end;
    }
    syntax::UnitFactor f;
    f.name.assign(p, name_end);
    f.divides = divides;
    const char* q = name_end;
    if (q < in.end() && *q == '^')
        ++q;
    if (q < in.end()) {
        int exponent = 1;
        auto [end, ec] = std::from_chars(q, in.end(), exponent);
        // Too large for an int: keep it far beyond any dimension, so that
        // evaluate refuses it instead of reading the unit without its power.
        if (ec == std::errc::result_out_of_range)
            exponent = std::numeric_limits<int>::max();
        (void)end;
        f.exponent = exponent;
    }
    f.where = b.range(p, in.end());
    return f;
}

template <typename Rule>
struct action : pegtl::nothing<Rule> {};

// ---------------------------------------------------------------- comments, numbers, units

template <>
struct action<g::comment> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        // Backtracking can read a comment twice; keep each once.
        if (b.offset(in.begin()) < b.next_comment_offset)
            return;
        b.next_comment_offset = b.offset(in.end());
        b.tree.comments.push_back(syntax::Comment{in.string(), b.range(in)});
    }
};

template <>
struct action<g::number> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        Expr e;
        e.literal = in.string();
        e.value = number_value(e.literal);
        e.where = b.range(in);
        b.exprs.push_back(std::move(e));
    }
};

template <>
struct action<g::unit_lead> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.unit.push_back(unit_factor(in, b, false));
    }
};
template <>
struct action<g::unit_times> : action<g::unit_lead> {};
template <>
struct action<g::unit_hyphen> : action<g::unit_lead> {};
template <>
struct action<g::unit_per> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.unit.push_back(unit_factor(in, b, true));
    }
};

template <>
struct action<g::quantity> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.exprs.back().unit = std::move(b.unit);
        b.unit.clear();
        b.exprs.back().where = b.range(in);
    }
};

template <>
struct action<g::bad_unit> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.exprs.back().bad_unit = b.name(in);
    }
};

// ---------------------------------------------------------------- expressions

template <>
struct action<g::paren_open> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.enter_nesting(in);
    }
};
template <>
struct action<g::minus_sign> : action<g::paren_open> {};

/// Refuses an expression whose tree has grown too deep.
template <typename Input>
void check_depth(const Expr& e, const Input& in) {
    if (e.depth > kMaxDepth) {
        throw pegtl::parse_error(
            fmt::format("this expression is too long (more than {} operations)", kMaxDepth), in);
    }
}

Expr unary(Expr::Kind kind, Expr operand, SourceRange where) {
    Expr e;
    e.kind = kind;
    e.depth = operand.depth + 1;
    e.rhs = std::make_unique<Expr>(std::move(operand));
    e.where = where;
    return e;
}

template <>
struct action<g::group> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.exprs.push_back(unary(Expr::Kind::group, b.pop_expr(), b.range(in)));
        check_depth(b.exprs.back(), in);
        --b.nesting;
    }
};

template <>
struct action<g::negation> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.exprs.push_back(unary(Expr::Kind::negate, b.pop_expr(), b.range(in)));
        check_depth(b.exprs.back(), in);
        --b.nesting;
    }
};

/// Folds the two topmost expressions into one binary expression.
template <typename Input>
void fold_binary(const Input& in, Builder& b) {
    std::string_view text(in.begin(), in.size());
    char op = text[text.find_first_not_of(" \t")];
    Expr rhs = b.pop_expr();
    Expr lhs = b.pop_expr();
    Expr e;
    e.kind = op == '*'   ? Expr::Kind::multiply
             : op == '/' ? Expr::Kind::divide
             : op == '+' ? Expr::Kind::add
             : op == '^' ? Expr::Kind::power
                         : Expr::Kind::subtract;
    e.where = SourceRange{lhs.where.file, lhs.where.begin, rhs.where.end};
    e.depth = std::max(lhs.depth, rhs.depth) + 1;
    check_depth(e, in);
    e.lhs = std::make_unique<Expr>(std::move(lhs));
    e.rhs = std::make_unique<Expr>(std::move(rhs));
    b.exprs.push_back(std::move(e));
}

template <>
struct action<g::product_tail> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        fold_binary(in, b);
    }
};
template <>
struct action<g::sum_tail> : action<g::product_tail> {};
template <>
struct action<g::caret> : action<g::paren_open> {};  // powers nest to the right
template <>
struct action<g::power_tail> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        fold_binary(in, b);
        --b.nesting;
    }
};

template <>
struct action<g::constant> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        Expr e;
        e.kind = Expr::Kind::constant;
        e.literal = in.string();
        e.where = b.range(in);
        b.exprs.push_back(std::move(e));
    }
};

template <>
struct action<g::call_head> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.enter_nesting(in);
        syntax::Name function{std::string(in.begin(), in.size() - 1),
                              b.range(in.begin(), in.end() - 1)};
        b.calls.push_back(Builder::OpenCall{std::move(function), b.exprs.size()});
    }
};

template <>
struct action<g::call> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        Builder::OpenCall open = std::move(b.calls.back());
        b.calls.pop_back();
        Expr e;
        e.kind = Expr::Kind::call;
        e.literal = std::move(open.function.text);
        e.where = b.range(in);
        auto first = b.exprs.begin() + static_cast<std::ptrdiff_t>(open.first_argument);
        e.args.assign(std::make_move_iterator(first), std::make_move_iterator(b.exprs.end()));
        b.exprs.erase(first, b.exprs.end());
        for (const Expr& a : e.args)
            e.depth = std::max(e.depth, a.depth + 1);
        check_depth(e, in);
        b.exprs.push_back(std::move(e));
        --b.nesting;
    }
};

// ---------------------------------------------------------------- statements

/// Starts the draft of a statement of type T at its keyword.
template <typename T>
struct begin_statement {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.begin<T>(in);
    }
};

template <typename Pointer>
struct owner_of;
template <typename Owner, typename Field>
struct owner_of<Field Owner::*> {
    using type = Owner;
};

/// Stores the matched name in `Field` of the statement being read.
template <auto Field>
struct store_name {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        using Statement = typename owner_of<decltype(Field)>::type;
        b.current<Statement>().*Field = b.name(in);
    }
};

/// Commits the statement draft once the whole statement has matched.
template <>
struct action<g::statement> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        if (!b.statement)
            return;
        b.statement->where = b.range(b.base + b.statement->where.begin.offset, in.end());
        b.tree.statements.push_back(std::move(*b.statement));
        b.statement.reset();
    }
};

template <>
struct action<g::model_begin> : begin_statement<syntax::ModelTitle> {};

/// The offset of the first byte that breaks UTF-8 in `text`, or npos.
std::size_t invalid_utf8_at(std::string_view text) {
    for (std::size_t i = 0; i < text.size();) {
        auto c = static_cast<unsigned char>(text[i]);
        std::size_t more = c < 0x80                 ? 0
                           : c >= 0xC2 && c <= 0xDF ? 1
                           : c >= 0xE0 && c <= 0xEF ? 2
                           : c >= 0xF0 && c <= 0xF4 ? 3
                                                    : text.size();
        if (i + more >= text.size() && more > 0)
            return i;
        for (std::size_t k = 1; k <= more; ++k) {
            if ((static_cast<unsigned char>(text[i + k]) & 0xC0) != 0x80)
                return i;
        }
        i += more + 1;
    }
    return std::string_view::npos;
}

/// The text between double quotes, with backslash escapes undone.
std::string unquote(std::string_view quoted) {
    std::string text;
    for (std::size_t i = 1; i + 1 < quoted.size(); ++i) {
        if (quoted[i] == '\\')
            ++i;
        text += quoted[i];
    }
    return text;
}

template <>
struct action<g::title> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        std::size_t bad = invalid_utf8_at(in.string_view());
        if (bad != std::string_view::npos) {
            // recover_from reads only the byte offset of the position.
            std::size_t offset = static_cast<std::size_t>(in.begin() - b.base) + bad;
            throw pegtl::parse_error("a title must be UTF-8 text",
                                     pegtl::position(offset, 0, 0, ""));
        }
        b.current<syntax::ModelTitle>().title = unquote(in.string_view());
    }
};

template <>
struct action<g::let_begin> : begin_statement<syntax::LetDecl> {};

template <>
struct action<g::let_name> : store_name<&syntax::LetDecl::name> {};

template <>
struct action<g::let_text> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::LetDecl>().text = unquote(in.string_view());
        b.current<syntax::LetDecl>().text_where = b.range(in);
    }
};

template <>
struct action<g::let_stmt> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        if (!b.current<syntax::LetDecl>().text)
            b.current<syntax::LetDecl>().value = b.pop_expr();
    }
};

template <>
struct action<g::use_begin> : begin_statement<syntax::UseDecl> {};

template <>
struct action<g::use_outside> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.current<syntax::UseDecl>().outside = true;
    }
};

template <>
struct action<g::use_module> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::UseDecl>().module = b.name(in);
    }
};

template <>
struct action<g::path> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        auto& use = b.current<syntax::UseDecl>();
        use.path = unquote(in.string_view());
        use.path_where = b.range(in);
    }
};

template <>
struct action<g::report_begin> : begin_statement<syntax::ReportUnits> {};

template <>
struct action<g::displacement_role> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.pending_role = b.name(in);
    }
};

template <>
struct action<g::report_item> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::ReportUnits>().items.push_back(
            syntax::ReportUnits::Item{std::move(b.pending_role), std::move(b.unit), b.range(in)});
        b.pending_role.reset();
        b.unit.clear();
    }
};

syntax::Axis axis_of(std::string_view text) {
    return text == "x" ? syntax::Axis::x : syntax::Axis::y;
}

template <>
struct action<g::grid_begin> : begin_statement<syntax::Grid> {};

template <>
struct action<g::grid_axis> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::Grid>().axis = axis_of(in.string_view());
        b.current<syntax::Grid>().plan = in.string_view() == "plan";
    }
};

template <>
struct action<g::grid_line_name> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.pending_name = b.name(in);
    }
};
template <>
struct action<g::property_key> : action<g::grid_line_name> {};
template <>
struct action<g::spring_direction> : action<g::grid_line_name> {};

template <>
struct action<g::grid_line> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.current<syntax::Grid>().lines.push_back(
            syntax::Grid::Line{std::move(*b.pending_name), b.pop_expr()});
    }
};

template <>
struct action<g::run_first> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::Grid>().run.emplace().first = b.name(in);
    }
};

template <>
struct action<g::run_last> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::Grid>().run->last = b.name(in);
    }
};

template <>
struct action<g::run_spacing> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.current<syntax::Grid>().run->spacings.push_back(b.pop_expr());
    }
};

template <>
struct action<g::run_start> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.current<syntax::Grid>().run->start = b.pop_expr();
    }
};

template <>
struct action<g::node_begin> : begin_statement<syntax::NodeDecl> {};

template <>
struct action<g::node_name> : store_name<&syntax::NodeDecl::name> {};

template <>
struct action<g::coordinate_axis> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.pending_axis = axis_of(in.string_view());
    }
};

template <>
struct action<g::axis_coordinate> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        syntax::NodeDecl::Coordinate c;
        c.axis = b.pending_axis;
        c.value = b.pop_expr();
        c.where = b.range(in);
        b.current<syntax::NodeDecl>().coordinates.push_back(std::move(c));
    }
};

template <>
struct action<g::grid_coordinate> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        syntax::NodeDecl::Coordinate c;
        c.grid_line = b.name(in);
        c.where = b.range(in);
        b.current<syntax::NodeDecl>().coordinates.push_back(std::move(c));
    }
};

template <>
struct action<g::material_begin> : begin_statement<syntax::MaterialDecl> {};

template <>
struct action<g::material_name> : store_name<&syntax::MaterialDecl::name> {};

template <>
struct action<g::property> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        syntax::Property p{std::move(*b.pending_name), b.pop_expr()};
        if (auto* m = std::get_if<syntax::MaterialDecl>(&b.statement->node)) {
            m->properties.push_back(std::move(p));
        } else {
            b.current<syntax::SectionDecl>().properties.push_back(std::move(p));
        }
    }
};

template <>
struct action<g::section_begin> : begin_statement<syntax::SectionDecl> {};

template <>
struct action<g::section_name> : store_name<&syntax::SectionDecl::name> {};

template <>
struct action<g::section_material> : store_name<&syntax::SectionDecl::material> {};

template <>
struct action<g::section_shape> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        auto& s = b.current<syntax::SectionDecl>();
        s.shape = in.string_view() == "rectangle" ? syntax::SectionDecl::Shape::rectangle
                                                  : syntax::SectionDecl::Shape::ishape;
        s.shape_where = b.range(in);
    }
};

template <>
struct action<g::member_begin> : begin_statement<syntax::MemberDecl> {};

template <>
struct action<g::member_name> : store_name<&syntax::MemberDecl::name> {};

template <>
struct action<g::member_start> : store_name<&syntax::MemberDecl::start> {};

template <>
struct action<g::member_end> : store_name<&syntax::MemberDecl::end> {};

/// The options (section, hinges, tags) of the member statement being read.
syntax::MemberOptions& options_of(syntax::Statement& s) {
    return std::visit(
        [](auto& node) -> syntax::MemberOptions& {
            if constexpr (requires { node.options; }) {
                return node.options;
            } else {
                throw std::logic_error("member options outside a member statement");
            }
        },
        s.node);
}

template <>
struct action<g::member_section> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        options_of(*b.statement).section = b.name(in);
    }
};

template <>
struct action<g::hinge_node> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        options_of(*b.statement).hinges.push_back(b.name(in));
    }
};

template <>
struct action<g::tag_name> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        options_of(*b.statement).tags.push_back(b.name(in));
    }
};

template <>
struct action<g::columns_begin> : begin_statement<syntax::ColumnsDecl> {};
template <>
struct action<g::beams_begin> : begin_statement<syntax::BeamsDecl> {};

/// The line ranges of the `columns` or `beams` statement being read.
std::vector<syntax::LineRange>& ranges_of(syntax::Statement& s) {
    if (auto* c = std::get_if<syntax::ColumnsDecl>(&s.node))
        return c->lines;
    return std::get<syntax::BeamsDecl>(s.node).levels;
}

template <>
struct action<g::range_first> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        ranges_of(*b.statement).push_back(syntax::LineRange{b.name(in), std::nullopt});
    }
};

template <>
struct action<g::range_last> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        ranges_of(*b.statement).back().last = b.name(in);
    }
};

template <auto Which>
struct store_span_end {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        if (auto* c = std::get_if<syntax::ColumnsDecl>(&b.statement->node)) {
            c->*(Which ? &syntax::ColumnsDecl::to : &syntax::ColumnsDecl::from) = b.name(in);
        } else {
            auto& beams = b.current<syntax::BeamsDecl>();
            beams.*(Which ? &syntax::BeamsDecl::to : &syntax::BeamsDecl::from) = b.name(in);
        }
    }
};
template <>
struct action<g::span_from> : store_span_end<false> {};
template <>
struct action<g::span_to> : store_span_end<true> {};

template <>
struct action<g::rafters_begin> : begin_statement<syntax::RaftersDecl> {};
template <>
struct action<g::rafter_run> : store_name<&syntax::RaftersDecl::run> {};
template <>
struct action<g::rafter_point> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::RaftersDecl>().points.push_back(b.name(in));
    }
};

template <>
struct action<g::group_begin> : begin_statement<syntax::GroupDecl> {};
template <>
struct action<g::group_name> : store_name<&syntax::GroupDecl::name> {};
template <>
struct action<g::group_member> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::GroupDecl>().members.push_back(b.name(in));
    }
};

template <>
struct action<g::support_begin> : begin_statement<syntax::SupportDecl> {};

template <syntax::SupportDecl::Kind Kind>
struct set_support_kind {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.current<syntax::SupportDecl>().kind = Kind;
    }
};
template <>
struct action<g::support_fixed> : set_support_kind<syntax::SupportDecl::Kind::fixed> {};
template <>
struct action<g::support_pinned> : set_support_kind<syntax::SupportDecl::Kind::pinned> {};
template <>
struct action<g::support_roller> : set_support_kind<syntax::SupportDecl::Kind::roller> {};
template <>
struct action<g::support_spring> : set_support_kind<syntax::SupportDecl::Kind::spring> {};

template <>
struct action<g::roller_axis> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::SupportDecl>().roller_free = axis_of(in.string_view());
    }
};

template <>
struct action<g::support_node> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::SupportDecl>().nodes.push_back(b.name(in));
    }
};

template <>
struct action<g::spring_fixed> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.pending_spring_fixed = true;
    }
};

template <>
struct action<g::spring_item> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        syntax::SupportDecl::Spring spring{std::move(*b.pending_name), std::nullopt};
        if (!b.pending_spring_fixed)
            spring.stiffness = b.pop_expr();
        b.pending_spring_fixed = false;
        b.current<syntax::SupportDecl>().springs.push_back(std::move(spring));
    }
};

// ---------------------------------------------------------------- load cases

template <>
struct action<g::case_begin> : begin_statement<syntax::CaseDecl> {};

template <>
struct action<g::case_name> : store_name<&syntax::CaseDecl::name> {};

template <syntax::CaseDecl::Kind Kind>
struct set_case_kind {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.current<syntax::CaseDecl>().kind = Kind;
    }
};
template <>
struct action<g::kind_dead> : set_case_kind<syntax::CaseDecl::Kind::dead> {};
template <>
struct action<g::kind_live> : set_case_kind<syntax::CaseDecl::Kind::live> {};
template <>
struct action<g::kind_roof_live> : set_case_kind<syntax::CaseDecl::Kind::roof_live> {};
template <>
struct action<g::kind_snow> : set_case_kind<syntax::CaseDecl::Kind::snow> {};
template <>
struct action<g::kind_wind> : set_case_kind<syntax::CaseDecl::Kind::wind> {};
template <>
struct action<g::kind_other> : set_case_kind<syntax::CaseDecl::Kind::other> {};

/// What an open block belongs to, for messages about it.
const char* block_kind_of(const decltype(syntax::Statement::node)& node) {
    if (std::holds_alternative<syntax::SnowDecl>(node))
        return "snow";
    if (const auto* roof = std::get_if<syntax::RoofDecl>(&node))
        return roof->projection ? "projection" : "roof";
    if (std::holds_alternative<syntax::CombinationsDecl>(node))
        return "combinations";
    if (std::holds_alternative<syntax::CombineDecl>(node))
        return "combine";
    if (std::holds_alternative<syntax::PatternDecl>(node))
        return "pattern";
    return "case";
}

template <>
struct action<g::block_open> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.block_line = b.range(in).begin.line;
        b.block_open = in.begin();
        b.block_kind = block_kind_of(b.statement->node);
        b.block_close_reported = false;
    }
};

template <>
struct action<g::combinations_open> : action<g::block_open> {};
template <>
struct action<g::pattern_open> : action<g::block_open> {};

template <>
struct action<g::block_close> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.block_line = 0;
    }
};

// ---------------------------------------------------------------- snow data

template <>
struct action<g::snow_begin> : begin_statement<syntax::SnowDecl> {};
template <>
struct action<g::snow_name> : store_name<&syntax::SnowDecl::name> {};
template <>
struct action<g::roof_begin> : begin_statement<syntax::RoofDecl> {};
template <>
struct action<g::projection_begin> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        action<g::roof_begin>::apply(in, b);
        b.current<syntax::RoofDecl>().projection = true;
    }
};
template <>
struct action<g::roof_name> : store_name<&syntax::RoofDecl::name> {};
template <>
struct action<g::projection_name> : store_name<&syntax::RoofDecl::name> {};

template <>
struct action<g::roof_member> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::RoofDecl>().members.push_back(b.name(in));
    }
};
template <>
struct action<g::projection_roof> : action<g::roof_member> {};

template <>
struct action<g::setting_key> : action<g::grid_line_name> {};

template <>
struct action<g::reason> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.pending_reason = std::pair{unquote(in.string_view()), b.range(in)};
    }
};

template <>
struct action<g::setting> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        syntax::Setting setting{std::move(*b.pending_name), b.pop_expr(), std::nullopt, {}};
        if (b.pending_reason) {
            setting.reason = std::move(b.pending_reason->first);
            setting.reason_where = b.pending_reason->second;
        }
        b.pending_reason.reset();
        if (auto* snow = std::get_if<syntax::SnowDecl>(&b.statement->node)) {
            snow->settings.push_back(std::move(setting));
        } else if (auto* combine = std::get_if<syntax::CombineDecl>(&b.statement->node)) {
            combine->settings.push_back(std::move(setting));
        } else {
            b.current<syntax::RoofDecl>().settings.push_back(std::move(setting));
        }
    }
};

template <>
struct action<g::amend_begin> : begin_statement<syntax::AmendDecl> {};
template <>
struct action<g::amend_name> : store_name<&syntax::AmendDecl::name> {};
template <>
struct action<g::amend_stmt> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        auto& amend = b.current<syntax::AmendDecl>();
        amend.value = b.pop_expr();
        amend.reason = std::move(b.pending_reason->first);
        amend.reason_where = b.pending_reason->second;
        b.pending_reason.reset();
    }
};

// ---------------------------------------------------------------- combinations

template <>
struct action<g::combinations_begin> : begin_statement<syntax::CombinationsDecl> {};
template <>
struct action<g::combinations_name> : store_name<&syntax::CombinationsDecl::name> {};

template <>
struct action<g::combination_label> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        syntax::CombinationLine line;
        line.label = b.name(in);
        b.current<syntax::CombinationsDecl>().lines.push_back(std::move(line));
    }
};

template <>
struct action<g::combination_term_begin> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.current<syntax::CombinationsDecl>().lines.back().terms.emplace_back();
        b.pending_factor.reset();
    }
};

template <>
struct action<g::combination_factor> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.pending_factor = syntax::Factor{number_value(in.string_view()), b.range(in)};
    }
};

/// A factor before '(' multiplies every alternative inside.
template <>
struct action<g::alternatives_open> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        auto& term = b.current<syntax::CombinationsDecl>().lines.back().terms.back();
        if (b.pending_factor)
            term.factor = *b.pending_factor;
        b.pending_factor.reset();
    }
};

template <>
struct action<g::combination_symbol> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        auto& term = b.current<syntax::CombinationsDecl>().lines.back().terms.back();
        syntax::CombinationTerm::Alternative alternative;
        if (b.pending_factor)
            alternative.factor = *b.pending_factor;
        alternative.symbol = b.name(in);
        term.alternatives.push_back(std::move(alternative));
        b.pending_factor.reset();
    }
};

template <>
struct action<g::half_live_label> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::CombinationsDecl>().half_live_in.push_back(b.name(in));
    }
};

template <>
struct action<g::combination_body> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        auto& set = b.current<syntax::CombinationsDecl>();
        SourceRange where = b.range(in.begin(), in.end());
        set.line_where.push_back(where);
        if (!set.lines.empty() && set.lines.back().where.begin.line == 0)
            set.lines.back().where = where;
    }
};

template <>
struct action<g::combine_begin> : begin_statement<syntax::CombineDecl> {};
template <>
struct action<g::combine_set> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::CombineDecl>().sets.push_back(b.name(in));
    }
};

// ---------------------------------------------------------------- arrangements

template <>
struct action<g::pattern_begin> : begin_statement<syntax::PatternDecl> {};
template <>
struct action<g::pattern_name> : store_name<&syntax::PatternDecl::name> {};
template <>
struct action<g::pattern_label> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        syntax::PatternDecl::Line line;
        line.label = b.name(in);
        b.current<syntax::PatternDecl>().lines.push_back(std::move(line));
    }
};
template <>
struct action<g::pattern_selector> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        syntax::PatternDecl::Part part;
        part.selector = b.name(in);
        b.current<syntax::PatternDecl>().lines.back().parts.push_back(std::move(part));
    }
};
template <>
struct action<g::pattern_factor> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::PatternDecl>().lines.back().parts.back().factor =
            syntax::Factor{number_value(in.string_view()), b.range(in)};
    }
};
template <>
struct action<g::pattern_line> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::PatternDecl>().lines.back().where = b.range(in.begin(), in.end());
    }
};

template <>
struct action<g::arrange_begin> : begin_statement<syntax::ArrangeDecl> {};
template <>
struct action<g::arrange_case> : store_name<&syntax::ArrangeDecl::load_case> {};
template <>
struct action<g::arrange_rule> : store_name<&syntax::ArrangeDecl::rule> {};
template <>
struct action<g::arrange_member> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::ArrangeDecl>().members.push_back(b.name(in));
    }
};

template <>
struct action<g::deflection_begin> : begin_statement<syntax::DeflectionDecl> {};
template <>
struct action<g::deflection_row> : store_name<&syntax::DeflectionDecl::row> {};
template <>
struct action<g::deflection_member> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::DeflectionDecl>().members.push_back(b.name(in));
    }
};

template <>
struct action<g::expect_begin> : begin_statement<syntax::ExpectDecl> {};
template <>
struct action<g::expect_member_quantity> : store_name<&syntax::ExpectDecl::quantity> {};
template <>
struct action<g::expect_reaction_word> : store_name<&syntax::ExpectDecl::quantity> {};
template <>
struct action<g::expect_displacement_word> : store_name<&syntax::ExpectDecl::quantity> {};
template <>
struct action<g::expect_rotation_word> : store_name<&syntax::ExpectDecl::quantity> {};
template <>
struct action<g::expect_snow_word> : store_name<&syntax::ExpectDecl::quantity> {};
template <>
struct action<g::expect_reaction_component> : store_name<&syntax::ExpectDecl::component> {};
template <>
struct action<g::expect_displacement_component> : store_name<&syntax::ExpectDecl::component> {};
template <>
struct action<g::expect_member> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::ExpectDecl>().places.push_back(b.name(in));
    }
};
template <>
struct action<g::expect_node> : action<g::expect_member> {};
template <>
struct action<g::expect_snow_value> : action<g::expect_member> {};
template <>
struct action<g::expect_source> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::ExpectDecl>().source = b.name(in);
    }
};
template <>
struct action<g::expect_relation> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        auto& expect = b.current<syntax::ExpectDecl>();
        expect.relation = in.string();
        expect.relation_where = b.range(in);
    }
};
template <>
struct action<g::expect_between_word> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        auto& expect = b.current<syntax::ExpectDecl>();
        expect.relation = "between";
        expect.relation_where = b.range(in);
    }
};
template <>
struct action<g::expect_value> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.current<syntax::ExpectDecl>().value = b.pop_expr();
    }
};
template <>
struct action<g::expect_high> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.current<syntax::ExpectDecl>().high = b.pop_expr();
    }
};
template <>
struct action<g::expect_percent> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        auto& expect = b.current<syntax::ExpectDecl>();
        expect.tolerance = b.pop_expr();
        expect.tolerance_percent = true;
    }
};
template <>
struct action<g::expect_tolerance_value> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.current<syntax::ExpectDecl>().tolerance = b.pop_expr();
    }
};
template <>
struct action<g::expect_stmt> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        auto& expect = b.current<syntax::ExpectDecl>();
        if (b.pending_reason) {
            expect.reason = std::move(b.pending_reason->first);
            expect.reason_where = b.pending_reason->second;
        }
        b.pending_reason.reset();
    }
};

template <syntax::LoadDecl::Form Form>
struct begin_load {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.load = syntax::LoadDecl{};
        b.load->form = Form;
        b.load_begin = in.begin();
    }
};
template <>
struct action<g::uniform_begin> : begin_load<syntax::LoadDecl::Form::uniform> {};
template <>
struct action<g::linear_begin> : begin_load<syntax::LoadDecl::Form::linear> {};
template <>
struct action<g::point_begin> : begin_load<syntax::LoadDecl::Form::point> {};
template <>
struct action<g::moment_begin> : begin_load<syntax::LoadDecl::Form::moment> {};
template <>
struct action<g::self_weight_begin> : begin_load<syntax::LoadDecl::Form::self_weight> {};

template <>
struct action<g::load_value> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.load->value = b.pop_expr();
    }
};

template <>
struct action<g::load_end_value> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.load->end_value = b.pop_expr();
    }
};

template <>
struct action<g::load_from> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.load->from = b.pop_expr();
    }
};

template <>
struct action<g::load_to> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.load->to = b.pop_expr();
    }
};

template <>
struct action<g::load_at> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.load->at = b.pop_expr();
    }
};

template <>
struct action<g::direction> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        using D = syntax::LoadDecl::Direction;
        std::string_view w = in.string_view();
        b.load->direction = w == "x"       ? D::x
                            : w == "y"     ? D::y
                            : w == "up"    ? D::up
                            : w == "down"  ? D::down
                            : w == "axial" ? D::axial
                                           : D::transverse;
        b.load->direction_where = b.range(in);
    }
};

template <>
struct action<g::projected> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.load->projected = true;
    }
};

template <>
struct action<g::rotation_sense> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.load->clockwise = in.string_view() == "clockwise";
    }
};

template <>
struct action<g::at_nodes> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.load->on_members = false;
    }
};

template <>
struct action<g::load_member> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.load->targets.push_back(b.name(in));
    }
};
template <>
struct action<g::load_node> : action<g::load_member> {};

template <>
struct action<g::load_stmt> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        auto& c = b.current<syntax::CaseDecl>();
        c.loads.push_back(std::move(*b.load));
        c.load_where.push_back(b.range(b.load_begin, in.end()));
        b.load.reset();
    }
};

}  // namespace

syntax::Tree parse(const SourceMap& sources, FileId file, Diagnostics& diagnostics) {
    const SourceFile& source = sources.file(file);
    Builder b(sources, file, diagnostics);
    pegtl::memory_input<pegtl::tracking_mode::lazy, pegtl::eol::lf_crlf> in(
        source.text.data(), source.text.data() + source.text.size(), source.name);
    try {
        pegtl::parse<g::file, action, g::control>(in, b);
    } catch (const TooManyErrors&) {
        diagnostics.error_without_place(fmt::format(
            "{}: too many syntax errors; the rest of the file was not read", source.name));
    }
    return std::move(b.tree);
}

}  // namespace firn
