// number_format: fixed-precision numbers without locale or -0.
#include "base/number_format.hpp"

#include <array>
#include <charconv>
#include <cmath>
#include <string_view>

namespace firn {

std::string_view format_fixed(char* buffer, double value, int decimals) {
    auto [end, ec] =
        std::to_chars(buffer, buffer + kNumberBuffer, value, std::chars_format::fixed, decimals);
    if (ec != std::errc()) {  // only for absurd magnitudes; keep output readable
        end = std::to_chars(buffer, buffer + kNumberBuffer, value).ptr;
    }
    std::string_view text(buffer, static_cast<std::size_t>(end - buffer));
    if (text.front() == '-' && text.find_first_not_of("-0.") == std::string_view::npos) {
        text.remove_prefix(1);  // a value that rounds to zero is shown unsigned
    }
    return text;
}

void append_fixed(std::string& out, double value, int decimals) {
    std::array<char, kNumberBuffer> buffer;
    out.append(format_fixed(buffer.data(), value, decimals));
}

double round_to(double value, int decimals) {
    static constexpr std::array<double, 10> kScales{1e0, 1e1, 1e2, 1e3, 1e4,
                                                    1e5, 1e6, 1e7, 1e8, 1e9};
    double scale = decimals >= 0 && decimals < 10 ? kScales[static_cast<std::size_t>(decimals)]
                                                  : std::pow(10.0, decimals);
    double r = std::round(value * scale) / scale;
    return r == 0.0 ? 0.0 : r;
}

void append_right(std::string& out, std::string_view text, std::size_t width) {
    if (text.size() < width)
        out.append(width - text.size(), ' ');
    out.append(text);
}

void append_left(std::string& out, std::string_view text, std::size_t width) {
    out.append(text);
    if (text.size() < width)
        out.append(width - text.size(), ' ');
}

}  // namespace firn
