// baseline_listing: the changes of a comparison as aligned lines, the most
// significant first (see compare_baselines), cut to what a reviewer reads: the
// top N moved values, and none below a noise floor of its kind's largest value.
#include <fmt/format.h>
#include <algorithm>
#include <array>
#include <cmath>

#include "base/number_format.hpp"
#include "baseline/baseline.hpp"
#include "baseline/baseline_key.hpp"

namespace firn {
namespace {

using baseline_detail::KeyParts;
using baseline_detail::split_key;

constexpr std::size_t kColumns = 7;
using Row = std::array<std::string, kColumns>;

std::string percent_text(const ValueChange& c) {
    if (c.kind != ValueChange::Kind::moved)
        return c.kind == ValueChange::Kind::added ? "added" : "removed";
    if (std::isinf(c.percent))
        return "from 0";
    return fmt::format("{:+.2f} %", c.percent);
}

/// "4.21 % of largest moment": the change against its kind's largest value.
std::string share_text(const ValueChange& c) {
    if (c.kind != ValueChange::Kind::moved)
        return "";
    return fmt::format("{:.2f} % of largest {}", c.significance * 100.0, c.quantity_kind);
}

std::string shown_number(double v) {
    std::array<char, kNumberBuffer> buffer;
    double magnitude = v == 0.0 ? 0.0 : std::floor(std::log10(std::fabs(v)));
    int decimals = std::clamp(5 - static_cast<int>(magnitude), 0, 9);
    return std::string(format_fixed(buffer.data(), v, decimals));
}

/// The cells of one line: entity, quantity, scope, old, new with unit, change, share.
Row cells(const ValueChange& c) {
    KeyParts parts = split_key(c.key);
    std::string old_text = "-", new_text = "-";
    if (c.new_value) {
        new_text = c.new_value->text;
        if (!c.new_value->unit.empty())
            new_text += " " + c.new_value->unit;
    }
    if (c.old_value) {
        bool same_unit = !c.new_value || c.old_value->unit == c.new_value->unit;
        old_text = same_unit ? c.old_value->text : shown_number(c.old_in_new_unit);
        if (!c.new_value && !c.old_value->unit.empty())
            old_text += " " + c.old_value->unit;
    }
    return {parts.entity,     parts.quantity,  parts.scope,  old_text,
            "-> " + new_text, percent_text(c), share_text(c)};
}

/// Whether a listing shows the change: every value added or removed; a moved value
/// when it is not below the noise floor.
bool listed(const ValueChange& c, const Listing& listing) {
    return c.kind != ValueChange::Kind::moved || !(c.significance < listing.noise);
}

std::string aligned(const std::vector<Row>& rows) {
    std::array<std::size_t, kColumns> widths{};
    for (const Row& row : rows) {
        for (std::size_t i = 0; i < kColumns; ++i)
            widths[i] = std::max(widths[i], row[i].size());
    }
    static constexpr std::array<bool, kColumns> kRight{false, false, false, true,
                                                       false, true,  false};
    static constexpr std::array<const char*, kColumns> kBefore{"  ", "  ", "  ", "  ",
                                                               " ",  "  ", "  "};
    std::string out;
    for (const Row& row : rows) {
        for (std::size_t i = 0; i < kColumns; ++i) {
            out += kBefore[i];
            if (kRight[i])
                append_right(out, row[i], widths[i]);
            else
                append_left(out, row[i], widths[i]);
        }
        while (!out.empty() && out.back() == ' ')
            out.pop_back();
        out += '\n';
    }
    return out;
}

}  // namespace

std::string describe_changes(const Comparison& comparison, const Listing& listing) {
    std::vector<Row> rows;
    std::size_t noise = 0, beyond_top = 0, moved_shown = 0;
    for (const ValueChange& c : comparison.changes) {
        if (!listed(c, listing)) {
            ++noise;
        } else if (c.kind == ValueChange::Kind::moved && listing.top != 0 &&
                   moved_shown == listing.top) {
            ++beyond_top;
        } else {
            moved_shown += c.kind == ValueChange::Kind::moved ? 1 : 0;
            rows.push_back(cells(c));
        }
    }
    std::string out = aligned(rows);
    if (beyond_top > 0)
        out +=
            fmt::format("  ... {} more moved, less significant (--top 0 lists all)\n", beyond_top);
    if (noise > 0)
        out += fmt::format(
            "  ... {} more moved by less than {:g} % of their kind's largest (--noise 0 lists "
            "them)\n",
            noise, listing.noise * 100.0);
    return out;
}

}  // namespace firn
