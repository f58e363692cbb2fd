// baseline_compare: a fresh run's values against a baseline's, key by key.
// Values are compared in SI, so a baseline written in other report units
// still compares; each change is shown in the fresh run's unit.
#include "baseline/baseline.hpp"

#include <fmt/format.h>
#include <algorithm>
#include <charconv>
#include <cmath>
#include <limits>
#include <map>
#include <unordered_map>

#include "baseline/baseline_key.hpp"

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
    ValueChange c{ValueChange::Kind::moved, now.key, old, now, old_si / new_size, 0.0, "", 0.0};
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

/// What a value is measured against: values of one dimension (every moment, every
/// force: shears, axial forces and reactions), and plain numbers by their quantity
/// (rotations apart from ratios and snow factors).
std::string kind_of(const BaselineValue& v) {
    Dimension d;
    unit_size(v, d);
    if (d == dim::moment)
        return "moment";
    if (d == dim::force)
        return "force";
    if (d == dim::length)
        return "displacement";
    if (d == dim::pressure)
        return "pressure";
    if (d == dim::force_per_length)
        return "line load";
    if (d == dim::number) {
        std::string quantity = baseline_detail::split_key(v.key).quantity;
        return quantity.empty() ? "factor" : quantity;
    }
    return describe(d);
}

/// The largest |value| in SI of each kind, over both baselines (so that a value that
/// went away still sets the scale its kind had).
std::map<std::string, double> largest_by_kind(const Baseline& old, const Baseline& fresh) {
    std::map<std::string, double> largest;
    for (const Baseline* b : {&old, &fresh}) {
        for (const BaselineValue& v : b->values) {
            Dimension d;
            double& top = largest[kind_of(v)];
            top = std::max(top, std::fabs(v.value * unit_size(v, d)));
        }
    }
    return largest;
}

/// Sets each change's kind and significance against its kind's largest value.
void weigh(std::vector<ValueChange>& moved, const std::map<std::string, double>& largest) {
    for (ValueChange& c : moved) {
        c.quantity_kind = kind_of(*c.new_value);
        Dimension d;
        double now = c.new_value->value * unit_size(*c.new_value, d);
        double was = c.old_value->value * unit_size(*c.old_value, d);
        double scale = largest.at(c.quantity_kind);
        c.significance = scale > 0.0 ? std::fabs(now - was) / scale : 0.0;
    }
}

/// 0 for the values members and footings are sized from (moments and forces), 1 for
/// the rest (displacements, rotations, snow values), which a group lists after them.
int design_rank(const ValueChange& c) {
    return c.quantity_kind == "moment" || c.quantity_kind == "force" ? 0 : 1;
}

/// Groups the moved values by what they belong to, the group with the most significant
/// change first; in a group, moments and forces first, each part by significance; ties
/// keep the fresh baseline's order.
void order_by_significance(std::vector<ValueChange>& moved) {
    struct Place {
        std::size_t group = 0, index = 0;
    };
    std::unordered_map<std::string, std::size_t> group_of;  // numbered as first seen
    std::vector<double> weight;                             // per group: its largest change
    std::vector<Place> places;
    for (std::size_t i = 0; i < moved.size(); ++i) {
        auto [it, fresh] =
            group_of.emplace(baseline_detail::split_key(moved[i].key).entity, group_of.size());
        if (fresh)
            weight.push_back(0.0);
        weight[it->second] = std::max(weight[it->second], moved[i].significance);
        places.push_back({it->second, i});
    }
    std::sort(places.begin(), places.end(), [&](const Place& a, const Place& b) {
        if (a.group != b.group)
            return weight[a.group] != weight[b.group] ? weight[a.group] > weight[b.group]
                                                      : a.group < b.group;
        int pa = design_rank(moved[a.index]), pb = design_rank(moved[b.index]);
        if (pa != pb)
            return pa < pb;
        double sa = moved[a.index].significance, sb = moved[b.index].significance;
        return sa != sb ? sa > sb : a.index < b.index;
    });
    std::vector<ValueChange> ordered;
    ordered.reserve(moved.size());
    for (const Place& p : places)
        ordered.push_back(std::move(moved[p.index]));
    moved = std::move(ordered);
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
            added.push_back({ValueChange::Kind::added, v.key, std::nullopt, v, 0.0, 0.0, "", 0.0});
            continue;
        }
        ++out.compared;
        if (std::optional<ValueChange> c = change_of(*it->second, v, tolerances))
            moved.push_back(std::move(*c));
    }
    for (const BaselineValue& v : old.values) {
        if (!new_by_key.contains(v.key))
            removed.push_back(
                {ValueChange::Kind::removed, v.key, v, std::nullopt, 0.0, 0.0, "", 0.0});
    }
    weigh(moved, largest_by_kind(old, fresh));
    order_by_significance(moved);
    out.significant = static_cast<std::size_t>(
        std::count_if(moved.begin(), moved.end(),
                      [](const ValueChange& c) { return c.significance > kSignificantShare; }));
    out.changes = std::move(moved);
    out.changes.insert(out.changes.end(), added.begin(), added.end());
    out.changes.insert(out.changes.end(), removed.begin(), removed.end());
    return out;
}

}  // namespace firn
