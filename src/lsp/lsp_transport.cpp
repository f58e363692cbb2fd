// lsp_transport: the protocol's framing. Every message is a header block
// ("Content-Length: N", other headers ignored, ended by an empty line) and N bytes.
#include <charconv>
#include <cstddef>

#include "lsp/lsp_internal.hpp"

namespace firn::lsp {
namespace {

constexpr std::size_t kMaxBody = std::size_t{64} << 20;

/// One header line without its "\r\n"; false at the end of the stream.
bool read_header_line(std::istream& in, std::string& line) {
    if (!std::getline(in, line))
        return false;
    if (!line.empty() && line.back() == '\r')
        line.pop_back();
    return true;
}

/// The length a "Content-Length: N" line gives, or none for any other line.
std::optional<std::size_t> content_length(std::string_view line) {
    constexpr std::string_view key = "content-length:";
    if (line.size() < key.size())
        return std::nullopt;
    for (std::size_t i = 0; i < key.size(); ++i) {
        char c = line[i];
        if (c >= 'A' && c <= 'Z')
            c = static_cast<char>(c - 'A' + 'a');
        if (c != key[i])
            return std::nullopt;
    }
    std::string_view digits = line.substr(key.size());
    while (!digits.empty() && digits.front() == ' ')
        digits.remove_prefix(1);
    std::size_t n = 0;
    auto [end, error] = std::from_chars(digits.data(), digits.data() + digits.size(), n);
    if (error != std::errc() || end != digits.data() + digits.size())
        return std::nullopt;
    return n;
}

}  // namespace

ReadStatus read_message(std::istream& in, std::string& body) {
    std::optional<std::size_t> length;
    bool bad = false;
    std::string line;
    bool any = false;
    while (true) {
        if (!read_header_line(in, line))
            return ReadStatus::end;
        if (line.empty()) {
            if (!any)
                continue;  // stray blank lines between messages
            break;
        }
        any = true;
        if (std::optional<std::size_t> n = content_length(line))
            length = n;
        else if (line.find(':') == std::string::npos)
            bad = true;
    }
    if (!length || *length > kMaxBody)
        return ReadStatus::bad_header;
    // A header line that is no header still leaves the body to skip.
    body.assign(*length, '\0');
    in.read(body.data(), static_cast<std::streamsize>(*length));
    if (static_cast<std::size_t>(in.gcount()) != *length)
        return ReadStatus::end;
    return bad ? ReadStatus::bad_header : ReadStatus::message;
}

void write_message(std::ostream& out, const Json& message) {
    // Invalid UTF-8 from a model's text is replaced, never a reason to throw.
    std::string body = message.dump(-1, ' ', false, Json::error_handler_t::replace);
    out << "Content-Length: " << body.size() << "\r\n\r\n" << body;
    out.flush();
}

bool input_waiting(std::istream& in) {
    return in.good() && in.rdbuf()->in_avail() > 0;
}

}  // namespace firn::lsp
