// number_format: fast, locale-free, fixed-precision numbers for reports.
#pragma once

#include <cstddef>
#include <string>
#include <string_view>

namespace firn {

/// Room for any number format_fixed writes.
inline constexpr std::size_t kNumberBuffer = 64;

/// Writes `value` with exactly `decimals` decimals into `buffer` (kNumberBuffer
/// chars) and returns its text ("-0.000" is written "0.000").
std::string_view format_fixed(char* buffer, double value, int decimals);

/// Appends `value` with exactly `decimals` decimals ("-0.000" is written "0.000").
/// Uses std::to_chars: independent of locale and faster than printf-style formatting.
void append_fixed(std::string& out, double value, int decimals);

/// `value` rounded to `decimals` decimals, with -0 made 0 (for JSON).
double round_to(double value, int decimals);

/// Appends `text` right-aligned in `width` columns (never truncated).
void append_right(std::string& out, std::string_view text, std::size_t width);

/// Appends `text` left-aligned in `width` columns (never truncated).
void append_left(std::string& out, std::string_view text, std::size_t width);

}  // namespace firn
