// report_table: the fixed-width table every part of the text report writes
// with, so that a change to one value changes one line.
#pragma once

#include <fmt/format.h>
#include <algorithm>
#include <array>
#include <string>
#include <string_view>
#include <vector>

#include "base/number_format.hpp"
#include "base/units.hpp"

namespace firn::report_detail {

constexpr std::size_t kNumberWidth = 12;

/// Writes one table: a header row whose cells fix each column's width (a
/// number column is 12 wide, or as wide as its header), then rows that fill
/// the columns in order. Trailing spaces are trimmed from every row.
class Table {
  public:
    explicit Table(std::string& out) : out_(out) {}

    Table& name_column(std::string_view header, std::size_t width) {
        widths_.push_back(std::max(width, header.size()));
        out_ += "  ";
        append_left(out_, header, widths_.back());
        return *this;
    }
    Table& number_column(std::string_view title, const DisplayUnit& unit) {
        std::string header = fmt::format("{} [{}]", title, unit.name);
        widths_.push_back(std::max(kNumberWidth, header.size()));
        out_ += "  ";
        append_right(out_, header, widths_.back());
        return *this;
    }
    /// A right-aligned column whose rows carry their own units.
    Table& text_column(std::string_view header) {
        widths_.push_back(std::max(kNumberWidth, header.size()));
        out_ += "  ";
        append_right(out_, header, widths_.back());
        return *this;
    }
    Table& name(std::string_view text) {
        out_ += "  ";
        append_left(out_, text, next_width());
        return *this;
    }
    Table& number(double si_value, const DisplayUnit& unit) {
        std::array<char, kNumberBuffer> buffer;
        return text(format_fixed(buffer.data(), unit.from_si(si_value), unit.decimals));
    }
    Table& text(std::string_view right_aligned) {
        out_ += "  ";
        append_right(out_, right_aligned, next_width());
        return *this;
    }
    void end_row() {
        while (!out_.empty() && out_.back() == ' ')
            out_.pop_back();
        out_ += '\n';
        column_ = 0;
    }

  private:
    std::size_t next_width() {
        return column_ < widths_.size() ? widths_[column_++] : kNumberWidth;
    }

    std::string& out_;
    std::vector<std::size_t> widths_;
    std::size_t column_ = 0;
};

template <typename T>
inline std::size_t name_width(const std::vector<T>& items, std::string_view header) {
    std::size_t w = header.size();
    for (const T& item : items)
        w = std::max(w, item.name.size());
    return w;
}

}  // namespace firn::report_detail
