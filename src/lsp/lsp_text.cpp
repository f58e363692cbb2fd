// lsp_text: protocol positions (0-based lines, UTF-16 code units) against the byte
// offsets every stage records, file URIs, and the name under the cursor.
#include <fmt/format.h>
#include <algorithm>

#include "lsp/lsp_internal.hpp"

namespace firn::lsp {
namespace {

/// Bytes in the UTF-8 sequence that starts with `lead` (1 for a stray byte).
std::uint32_t sequence_length(unsigned char lead) {
    if (lead >= 0xF0 && lead < 0xF8)
        return 4;
    if (lead >= 0xE0)
        return lead < 0xF0 ? 3 : 1;
    if (lead >= 0xC0)
        return 2;
    return 1;
}

/// UTF-16 code units of a sequence: characters beyond the BMP take two.
std::uint32_t utf16_units(std::uint32_t bytes) {
    return bytes == 4 ? 2 : 1;
}

bool is_name_char(char c) {
    return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9') || c == '_' ||
           c == '.';
}

int hex_value(char c) {
    if (c >= '0' && c <= '9')
        return c - '0';
    if (c >= 'a' && c <= 'f')
        return c - 'a' + 10;
    if (c >= 'A' && c <= 'F')
        return c - 'A' + 10;
    return -1;
}

}  // namespace

LineIndex::LineIndex(std::string_view text) : text_(text) {
    starts_.push_back(0);
    for (std::size_t i = 0; i < text.size(); ++i) {
        if (text[i] == '\n')
            starts_.push_back(static_cast<std::uint32_t>(i + 1));
    }
}

bool LineIndex::is_line_end(std::uint32_t i) const {
    return text_[i] == '\n' || (text_[i] == '\r' && i + 1 < text_.size() && text_[i + 1] == '\n');
}

TextPosition LineIndex::position(std::uint32_t offset) const {
    offset = std::min(offset, static_cast<std::uint32_t>(text_.size()));
    auto after = std::upper_bound(starts_.begin(), starts_.end(), offset);
    auto line = static_cast<std::uint32_t>(after - starts_.begin() - 1);
    std::uint32_t units = 0;
    for (std::uint32_t i = starts_[line]; i < offset;) {
        std::uint32_t n = sequence_length(static_cast<unsigned char>(text_[i]));
        units += utf16_units(n);
        i += n;
    }
    return {line, units};
}

std::uint32_t LineIndex::offset(TextPosition position) const {
    if (position.line >= starts_.size())
        return static_cast<std::uint32_t>(text_.size());
    std::uint32_t i = starts_[position.line];
    std::uint32_t units = 0;
    // A character past the line's end means its end (the protocol says so).
    while (i < text_.size() && !is_line_end(i) && units < position.character) {
        std::uint32_t n = sequence_length(static_cast<unsigned char>(text_[i]));
        units += utf16_units(n);
        i = std::min(i + n, static_cast<std::uint32_t>(text_.size()));
    }
    return i;
}

Json position_json(TextPosition p) {
    return Json{{"line", p.line}, {"character", p.character}};
}

Json range_json(const LineIndex& lines, std::uint32_t begin, std::uint32_t end) {
    return Json{{"start", position_json(lines.position(begin))},
                {"end", position_json(lines.position(std::max(begin, end)))}};
}

std::string path_of_uri(std::string_view uri) {
    constexpr std::string_view scheme = "file://";
    if (!uri.starts_with(scheme))
        return std::string(uri);
    uri.remove_prefix(scheme.size());
    std::string path;
    for (std::size_t i = 0; i < uri.size(); ++i) {
        if (uri[i] == '%' && i + 2 < uri.size() && hex_value(uri[i + 1]) >= 0 &&
            hex_value(uri[i + 2]) >= 0) {
            path += static_cast<char>(hex_value(uri[i + 1]) * 16 + hex_value(uri[i + 2]));
            i += 2;
        } else {
            path += uri[i];
        }
    }
    return path;
}

std::string uri_of_path(std::string_view path) {
    std::string uri = "file://";
    for (char c : path) {
        auto u = static_cast<unsigned char>(c);
        bool plain = is_name_char(c) || c == '/' || c == '-' || c == '~';
        uri += plain ? std::string(1, c) : fmt::format("%{:02X}", u);
    }
    return uri;
}

std::string_view name_at(std::string_view text, std::uint32_t offset, std::uint32_t& begin) {
    offset = std::min(offset, static_cast<std::uint32_t>(text.size()));
    std::uint32_t b = offset, e = offset;
    while (b > 0 && is_name_char(text[b - 1]))
        --b;
    while (e < text.size() && is_name_char(text[e]))
        ++e;
    // A name ends before a closing '.', as in a sentence.
    while (e > b && text[e - 1] == '.')
        --e;
    begin = b;
    return text.substr(b, e - b);
}

}  // namespace firn::lsp
