// baseline_compare: a fresh run's values against a baseline's, key by key.
// Values are compared in SI, so a baseline written in other report units
// still compares; each change is shown in the fresh run's unit.
#include "baseline/baseline.hpp"

#include <fmt/format.h>
#include <algorithm>
#include <charconv>
#include <cmath>
#include <limits>
#include <unordered_map>

#include "base/number_format.hpp"

namespace firn {
namespace {

/// The defaults, in SI: far below anything a design depends on, far above the
/// round-off of a solve (common practice for regression tolerances, chosen here).
const std::array<Tolerances::Floor, 6> kDefaultFloors{{
    {dim::force, 1.0, "1 N"},
    {dim::moment, 1.0, "1 N*m"},
    {dim::length, 1e-6, "0.001 mm"},
    {dim::number, 1e-5, "0.00001 rad"},  // rotations; ratios have the same dimension
    {dim::pressure, 1.0, "1 Pa"},
    {dim::force_per_length, 1.0, "1 N/m"},
}};

/// Size in SI of a value's unit (already checked when it was read or made).
double unit_size(const BaselineValue& v, Dimension& dimension) {
    double to_si = 1.0;
    if (!parse_unit(v.unit, to_si, dimension))
        dimension = dim::number;
    return to_si;
}

/// The change of one value present in both, or nothing when it is within tolerance.
std::optional<ValueChange> change_of(const BaselineValue& old, const BaselineValue& now,
                                     const Tolerances& tolerances) {
    Dimension old_dim, new_dim;
    double old_si = old.value * unit_size(old, old_dim);
    double new_size = unit_size(now, new_dim);
    double new_si = now.value * new_size;
    ValueChange c{ValueChange::Kind::moved, now.key, old, now, old_si / new_size, 0.0};
    c.percent = old_si == 0.0 ? std::numeric_limits<double>::infinity()
                              : (new_si - old_si) / old_si * 100.0;
    if (old_dim == new_dim) {
        double allowed =
            std::max(tolerances.floor(new_dim), tolerances.relative * std::fabs(old_si));
        if (std::fabs(new_si - old_si) <= allowed)
            return std::nullopt;
    }
    return c;
}

std::string percent_text(const ValueChange& c) {
    if (c.kind != ValueChange::Kind::moved)
        return c.kind == ValueChange::Kind::added ? "added" : "removed";
    if (std::isinf(c.percent))
        return "from 0";
    return fmt::format("{:+.2f} %", c.percent);
}

/// `member AB`, `moment_min`, `case D`: the key's parts in reading order.
struct KeyParts {
    std::string entity, quantity, scope;
};

KeyParts split_key(std::string_view key) {
    // Keys are `SCOPE NAME KIND NAME QUANTITY...`, or `snow SITE NAME` (see baseline_write.cpp).
    std::vector<std::size_t> spaces;
    for (std::size_t i = 0; i < key.size() && spaces.size() < 4; ++i) {
        if (key[i] == ' ')
            spaces.push_back(i);
    }
    if (spaces.size() < 2)
        return {std::string(key), "", ""};
    std::string scope(key.substr(0, spaces[1]));
    if (spaces.size() < 4)
        return {std::string(key.substr(spaces[1] + 1)), "", scope};
    return {std::string(key.substr(spaces[1] + 1, spaces[3] - spaces[1] - 1)),
            std::string(key.substr(spaces[3] + 1)), scope};
}

std::string shown_number(double v) {
    std::array<char, kNumberBuffer> buffer;
    double magnitude = v == 0.0 ? 0.0 : std::floor(std::log10(std::fabs(v)));
    int decimals = std::clamp(5 - static_cast<int>(magnitude), 0, 9);
    return std::string(format_fixed(buffer.data(), v, decimals));
}

/// The cells of one line: entity, quantity, scope, old, new with unit, change.
std::array<std::string, 6> cells(const ValueChange& c) {
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
    return {parts.entity, parts.quantity, parts.scope, old_text, "-> " + new_text, percent_text(c)};
}

}  // namespace

double Tolerances::floor(Dimension dimension) const {
    for (const Floor& f : floors) {
        if (f.dimension == dimension)
            return f.si;
    }
    return 0.0;
}

Tolerances default_tolerances() {
    Tolerances t;
    t.floors.assign(kDefaultFloors.begin(), kDefaultFloors.end());
    return t;
}

bool set_floor(Tolerances& tolerances, std::string_view value, std::string_view unit,
               std::string& error) {
    double number = 0.0;
    const char* end = value.data() + value.size();
    auto [ptr, ec] = std::from_chars(value.data(), end, number);
    if (ec != std::errc() || ptr != end || !(number >= 0.0) || !std::isfinite(number)) {
        error = fmt::format("--abs {} {}: expected a number of zero or more", value, unit);
        return false;
    }
    double to_si = 1.0;
    Dimension dimension = dim::number;
    if (unit != "ratio" && !parse_unit(unit, to_si, dimension)) {
        error = fmt::format(
            "--abs {} {}: unknown unit '{}' (a unit such as kip*ft, kN, in, rad, "
            "or ratio)",
            value, unit, unit);
        return false;
    }
    Tolerances::Floor floor{dimension, number * to_si, fmt::format("{} {}", value, unit)};
    auto same = [&](const Tolerances::Floor& f) { return f.dimension == dimension; };
    auto it = std::find_if(tolerances.floors.begin(), tolerances.floors.end(), same);
    if (it == tolerances.floors.end())
        tolerances.floors.push_back(std::move(floor));
    else
        *it = std::move(floor);
    return true;
}

Comparison compare_baselines(const Baseline& old, const Baseline& fresh,
                             const Tolerances& tolerances) {
    Comparison out;
    // Looked up only; every list below follows the baselines' own order.
    std::unordered_map<std::string_view, const BaselineValue*> old_by_key, new_by_key;
    for (const BaselineValue& v : old.values)
        old_by_key.emplace(v.key, &v);
    for (const BaselineValue& v : fresh.values)
        new_by_key.emplace(v.key, &v);
    std::vector<ValueChange> moved, added, removed;
    for (const BaselineValue& v : fresh.values) {
        auto it = old_by_key.find(v.key);
        if (it == old_by_key.end()) {
            added.push_back({ValueChange::Kind::added, v.key, std::nullopt, v, 0.0, 0.0});
            continue;
        }
        ++out.compared;
        if (std::optional<ValueChange> c = change_of(*it->second, v, tolerances))
            moved.push_back(std::move(*c));
    }
    for (const BaselineValue& v : old.values) {
        if (!new_by_key.contains(v.key))
            removed.push_back({ValueChange::Kind::removed, v.key, v, std::nullopt, 0.0, 0.0});
    }
    std::stable_sort(moved.begin(), moved.end(), [](const ValueChange& a, const ValueChange& b) {
        return std::fabs(a.percent) > std::fabs(b.percent);
    });
    out.changes = std::move(moved);
    out.changes.insert(out.changes.end(), added.begin(), added.end());
    out.changes.insert(out.changes.end(), removed.begin(), removed.end());
    return out;
}

std::string describe_changes(const Comparison& comparison) {
    std::vector<std::array<std::string, 6>> rows;
    std::array<std::size_t, 6> widths{};
    for (const ValueChange& c : comparison.changes) {
        rows.push_back(cells(c));
        for (std::size_t i = 0; i < widths.size(); ++i)
            widths[i] = std::max(widths[i], rows.back()[i].size());
    }
    std::string out;
    for (const auto& row : rows) {
        out += "  ";
        append_left(out, row[0], widths[0]);
        out += "  ";
        append_left(out, row[1], widths[1]);
        out += "  ";
        append_left(out, row[2], widths[2]);
        out += "  ";
        append_right(out, row[3], widths[3]);
        out += " ";
        append_left(out, row[4], widths[4]);
        out += "  ";
        append_right(out, row[5], widths[5]);
        while (!out.empty() && out.back() == ' ')
            out.pop_back();
        out += '\n';
    }
    return out;
}

}  // namespace firn
