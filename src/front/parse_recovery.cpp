// parse_recovery: the syntax errors' messages and the recovery after them.
// A message says what was expected and what was found, with a "did you mean"
// for a misspelt keyword, a word on patterns written where a name is due, and
// a hint when a block whose '}' is missing runs into the next statement.
#include <fmt/format.h>
#include <algorithm>

#include "front/parse_builder.hpp"
#include "grammar/errors.hpp"

namespace firn::parsing {
namespace {

namespace g = grammar;

bool is_keyword(std::string_view word) {
    return std::find(g::keywords.begin(), g::keywords.end(), word) != g::keywords.end();
}

/// True if only spaces stand between the start of its line and `at`.
bool starts_line(const char* at, const char* begin) {
    while (at > begin && (at[-1] == ' ' || at[-1] == '\t'))
        --at;
    return at == begin || at[-1] == '\n';
}

/// True if the text at `at` begins with a keyword that starts a top-level statement
/// (`statement_start` is derived from the grammar's own list of statements).
bool starts_statement(const char* at, const char* end) {
    pegtl::memory_input in(at, end, "");
    return pegtl::parse<g::statement_start>(in);
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

/// True if `message` is the error message of one of the `Rules`.
template <typename... Rules>
bool is_message_of(std::string_view message) {
    return ((message == std::string_view(g::errors::message<Rules>)) || ...);
}

/// True if `message` is that of a rule that reads a name (of a node, a grid
/// line, a group, ...), where a pattern is not allowed.
bool expects_name(std::string_view message) {
    return is_message_of<g::node_name, g::coordinate, g::material_name, g::section_name,
                         g::section_material, g::member_name, g::member_start, g::member_end,
                         g::member_section, g::hinge_node, g::support_node, g::case_name,
                         g::node_list, g::load_node, g::let_name, g::run_last, g::line_ranges,
                         g::line_range, g::range_last, g::span_from, g::span_to, g::rafter_run,
                         g::rafter_point, g::group_name, g::tag_name>(message);
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

}  // namespace

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

/// The error's message with what was found at `at` and a "did you mean" for a
/// misspelt keyword; sets `width` to the characters found.
std::string Builder::expected_found(std::string_view raised, const char* at,
                                    std::size_t& width) const {
    std::string found = found_at(at, width);
    std::string message(raised);
    if (message.rfind("parse error matching", 0) == 0)
        message = "this is not valid here";
    bool expected_something = message.rfind("expected", 0) == 0;
    if (expected_something)
        message += ", found " + found;
    if (expected_something && found.front() == '\'' &&
        found.find("reserved") == std::string::npos) {
        message += did_you_mean(found.substr(1, width), keywords_in(raised));
    }
    return message;
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
    std::string message = expected_found(e.message(), at, width);
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

}  // namespace firn::parsing
