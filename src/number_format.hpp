// number_format: fast, locale-free, fixed-precision numbers for reports.
#pragma once

#include <string>

namespace firn {

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
