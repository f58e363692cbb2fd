// parse_builder: the helpers the parser's actions share, for the text they
// read (numbers, quoted text) and the draft statement they fill.
#include "front/parse_builder.hpp"

#include <charconv>
#include <limits>
#include <stdexcept>
#include <variant>

namespace firn::parsing {

bool is_word_char(char c) {
    return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9') || c == '_';
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

syntax::Axis axis_of(std::string_view text) {
    return text == "x" ? syntax::Axis::x : syntax::Axis::y;
}

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

/// The line ranges of the `columns` or `beams` statement being read.
std::vector<syntax::LineRange>& ranges_of(syntax::Statement& s) {
    if (auto* c = std::get_if<syntax::ColumnsDecl>(&s.node))
        return c->lines;
    return std::get<syntax::BeamsDecl>(s.node).levels;
}

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

}  // namespace firn::parsing
