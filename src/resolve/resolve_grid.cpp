// resolve_grid: grid lines (listed or in runs such as A..F) and the nodes at
// their intersections (`A.eave`), created when first named. The members that run
// along the grid are made in resolve_members.cpp.
#include <fmt/format.h>
#include <algorithm>
#include <cctype>
#include <cmath>

#include "resolve/resolve_internal.hpp"

namespace firn::resolve_detail {
namespace {

constexpr std::size_t kMaxRunLines = 10000;
// Limits of a whole model, far above any building frame (the largest benchmark
// frame has 202 lines): a few runs in a small file could otherwise ask for
// millions of lines.
constexpr std::size_t kMaxGridLines = 2 * kMaxRunLines;

/// False, after an error at `where`, if `count` more grid lines would pass kMaxGridLines.
bool room_for_lines(Resolver& r, std::size_t count, SourceRange where) {
    if (r.grid.size() + count <= kMaxGridLines)
        return true;
    r.diagnostics.error(where, fmt::format("a model has at most {} grid lines", kMaxGridLines));
    return false;
}

// ---------------------------------------------------------------- grid runs

bool all_upper(std::string_view s) {
    return !s.empty() &&
           std::all_of(s.begin(), s.end(), [](char c) { return c >= 'A' && c <= 'Z'; });
}

/// Lettered lines skip I and O, which read as 1 and 0 on drawings (common practice).
constexpr std::string_view kGridLetters = "ABCDEFGHJKLMNPQRSTUVWXYZ";

/// The position of a lettered name in the sequence A..Z, AA..AZ, BA.. (I and O
/// skipped), or nullopt if it uses I or O. Long names saturate: such a run is
/// refused as too long anyway.
std::optional<std::size_t> letter_index(std::string_view name) {
    constexpr std::size_t kSaturated = kMaxRunLines * kGridLetters.size();
    std::size_t index = 0;
    for (char c : name) {
        auto digit = kGridLetters.find(c);
        if (digit == std::string_view::npos)
            return std::nullopt;
        index = std::min(index * kGridLetters.size() + digit + 1, kSaturated);
    }
    return index - 1;
}

std::string letter_name(std::size_t index) {
    std::string name;
    for (std::size_t n = index + 1; n > 0; n = (n - 1) / kGridLetters.size())
        name.insert(name.begin(), kGridLetters[(n - 1) % kGridLetters.size()]);
    return name;
}

/// Splits `L12` into ("L", 12); numbers of more than 18 digits saturate (such a
/// run is refused as too long anyway).
std::optional<std::pair<std::string, long long>> prefix_number(std::string_view name) {
    std::size_t digits = name.size();
    while (digits > 0 && name[digits - 1] >= '0' && name[digits - 1] <= '9')
        --digits;
    if (digits == name.size())
        return std::nullopt;
    long long number = 0;
    for (char c : name.substr(digits))
        number = std::min(number * 10 + (c - '0'), 100'000'000'000'000'000LL);
    return std::pair{std::string(name.substr(0, digits)), number};
}

/// The range of the whole run `A..F`, for messages about it.
SourceRange run_range(const syntax::Grid::Run& run) {
    return SourceRange{run.first.where.file, run.first.where.begin, run.last.where.end};
}

/// The names of a lettered run, or nullopt after reporting the end that uses I or O.
std::optional<std::vector<std::string>> lettered_names(Resolver& r, const syntax::Grid::Run& run) {
    auto i = letter_index(run.first.text), j = letter_index(run.last.text);
    if (!i || !j) {
        const syntax::Name& bad = i ? run.last : run.first;
        r.diagnostics.error(bad.where,
                            fmt::format("lettered grid lines skip I and O (they read as 1 and 0), "
                                        "so a run cannot start or end at '{}'",
                                        bad.text));
        return std::nullopt;
    }
    std::vector<std::string> names;
    for (std::size_t k = *i; k <= *j && names.size() <= kMaxRunLines; ++k)
        names.push_back(letter_name(k));
    return names;
}

/// The names of the lines from `first` to `last`, or nullopt after an error.
std::optional<std::vector<std::string>> run_names(Resolver& r, const syntax::Grid::Run& run) {
    const std::string& a = run.first.text;
    const std::string& b = run.last.text;
    std::vector<std::string> names;
    if (all_upper(a) && all_upper(b)) {
        auto lettered = lettered_names(r, run);
        if (!lettered)
            return std::nullopt;
        names = std::move(*lettered);
    } else if (auto pa = prefix_number(a), pb = prefix_number(b);
               pa && pb && pa->first == pb->first) {
        for (long long k = pa->second; k <= pb->second && names.size() <= kMaxRunLines; ++k)
            names.push_back(fmt::format("{}{}", pa->first, k));
    } else {
        r.diagnostics.error(run_range(run),
                            "a run of grid lines goes from letter to letter (A..F), number "
                            "to number (1..9) or prefix and number to the same prefix "
                            "(L1..L4)");
        return std::nullopt;
    }
    // The two short cases are told apart: a reversed run is fixed by swapping
    // its ends, a one-line run by writing the line on its own.
    if (names.empty()) {
        r.diagnostics.error(run_range(run),
                            fmt::format("the run {}..{} goes backwards; write {}..{}", a, b, b, a));
        return std::nullopt;
    }
    if (names.size() == 1 && a == b) {
        r.diagnostics.error(run_range(run),
                            fmt::format("the run {}..{} names only one line; write a single "
                                        "line as '{} =' and its place",
                                        a, b, a));
        return std::nullopt;
    }
    // Two different names giving one line are long names saturated by letter_index.
    if (names.size() > kMaxRunLines || names.size() == 1) {
        r.diagnostics.error(run_range(run),
                            fmt::format("a run has at most {} lines", kMaxRunLines));
        return std::nullopt;
    }
    return names;
}

/// Places of the lines of a run from its spacings, or nullopt after an error.
std::optional<std::vector<double>> run_places(Resolver& r, const syntax::Grid::Run& run,
                                              std::size_t lines) {
    std::size_t bays = lines - 1;
    if (run.spacings.size() != 1 && run.spacings.size() != bays) {
        SourceRange all{run.spacings.front().where.file, run.spacings.front().where.begin,
                        run.spacings.back().where.end};
        r.diagnostics.error(
            all, fmt::format("grid lines {}..{} make {} bays: give one spacing for "
                             "all of them or {} spacings, found {}",
                             run.first.text, run.last.text, bays, bays, run.spacings.size()));
        return std::nullopt;
    }
    double place = 0.0;
    if (run.start) {
        auto v = r.value(*run.start, expected::length);
        if (!v || !r.within(*run.start, *v, kMaxCoordinate, "coordinate"))
            return std::nullopt;
        place = *v;
    }
    std::vector<double> spacing;
    for (const syntax::Expr& e : run.spacings) {
        auto v = r.value(e, expected::length);
        if (v && !(*v > 0.0)) {
            r.diagnostics.error(e.where, "a spacing must be greater than zero");
            v.reset();
        }
        if (!v || !r.within(e, *v, kMaxCoordinate, "spacing"))
            return std::nullopt;
        spacing.push_back(*v);
    }
    std::vector<double> places{place};
    for (std::size_t k = 0; k < bays; ++k) {
        place += spacing[spacing.size() == 1 ? 0 : k];
        places.push_back(place);
    }
    if (std::abs(place) > kMaxCoordinate) {
        r.diagnostics.error(
            run.spacings.back().where,
            fmt::format("the run's last line is out of range (beyond {:g} m)", kMaxCoordinate));
        return std::nullopt;
    }
    return places;
}

/// Column lines and levels share one set of names; a clash across the two is
/// told as such, since "already defined" alone points at a line of the other kind.
bool other_axis_clash(Resolver& r, syntax::Axis axis, const syntax::Name& name) {
    auto i = r.grid_lines.find_quietly(name.text);
    if (!i || r.grid[*i].axis == axis)
        return false;
    r.diagnostics
        .error(name.where, fmt::format("'{}' is already a {}; a {} needs a name of its own",
                                       name.text, axis_noun(r.grid[*i].axis), axis_noun(axis)))
        .note(r.grid_lines.where(*i), "first defined here");
    return true;
}

void add_grid_line(Resolver& r, syntax::Axis axis, const syntax::Name& name,
                   std::optional<double> place) {
    if (other_axis_clash(r, axis, name) || !r.grid_lines.add(name, r.diagnostics))
        return;
    GridLine g{name.text, place.value_or(0.0), name.where};
    (axis == syntax::Axis::x ? r.model.grid_x : r.model.grid_y).push_back(g);
    r.grid.push_back(GridRef{axis, g.position, place.has_value()});
}

/// After an error in a run, the names it was probably meant to define: every
/// single letter (I and O included) or number between its ends, in either
/// order, or else just its ends.
std::vector<std::string> meant_names(const syntax::Grid::Run& run) {
    const std::string& a = run.first.text;
    const std::string& b = run.last.text;
    std::vector<std::string> names;
    auto pa = prefix_number(a), pb = prefix_number(b);
    if (a.size() == 1 && b.size() == 1 && all_upper(a) && all_upper(b)) {
        for (char c = std::min(a[0], b[0]); c <= std::max(a[0], b[0]); ++c)
            names.emplace_back(1, c);
    } else if (pa && pb && pa->first == pb->first) {
        auto [lo, hi] = std::minmax(pa->second, pb->second);
        for (long long k = lo; k <= hi && names.size() <= kMaxRunLines; ++k)
            names.push_back(fmt::format("{}{}", pa->first, k));
    } else {
        names = {a, b};
    }
    return names;
}

/// Defines the lines a run with an error was meant to have, without places,
/// so statements naming them are quiet instead of repeating the run's error.
void add_unplaced_lines(Resolver& r, const syntax::Grid& grid) {
    std::vector<std::string> names = meant_names(*grid.run);
    if (r.grid.size() + names.size() > kMaxGridLines)
        return;  // statements naming them may report them unknown: a rare second error
    for (const std::string& name : names) {
        if (!r.grid_lines.find_quietly(name))
            add_grid_line(r, grid.axis, syntax::Name{name, run_range(*grid.run)}, std::nullopt);
    }
}

void resolve_run(Resolver& r, const syntax::Grid& grid) {
    const syntax::Grid::Run& run = *grid.run;
    auto names = run_names(r, run);
    if (!names) {
        add_unplaced_lines(r, grid);
        return;
    }
    SourceRange where = run_range(run);
    if (!room_for_lines(r, names->size(), where))
        return;
    auto places = run_places(r, run, names->size());
    for (std::size_t k = 0; k < names->size(); ++k) {
        add_grid_line(r, grid.axis, syntax::Name{(*names)[k], where},
                      places ? std::optional((*places)[k]) : std::nullopt);
    }
}

/// Two lines of one kind at one place would give zero-length members between
/// them in every generator that crosses them; the later line is refused (and
/// left out of generators) so the slip is reported once, where it was made.
void refuse_coincident_lines(Resolver& r) {
    std::vector<std::size_t> order(r.grid.size());
    for (std::size_t i = 0; i < order.size(); ++i)
        order[i] = i;
    auto before = [&](std::size_t p, std::size_t q) {
        const GridRef &a = r.grid[p], &b = r.grid[q];
        return std::tie(a.axis, a.position, p) < std::tie(b.axis, b.position, q);
    };
    std::sort(order.begin(), order.end(), before);
    std::size_t first = 0;  // the first-defined valid line of the current place
    for (std::size_t k = 0; k < order.size(); ++k) {
        GridRef& g = r.grid[order[k]];
        if (!g.valid)
            continue;
        const GridRef& f = r.grid[first];
        bool same =
            k > 0 && f.valid && f.axis == g.axis && std::abs(f.position - g.position) <= kOnLine;
        if (!same) {
            first = order[k];
            continue;
        }
        std::size_t later = std::max(first, order[k]), earlier = std::min(first, order[k]);
        const auto& names = r.grid_lines.names();
        r.diagnostics
            .error(r.grid_lines.where(later),
                   fmt::format("{} '{}' is at the same place as {} '{}'", axis_noun(g.axis),
                               names[later], axis_noun(g.axis), names[earlier]))
            .note(r.grid_lines.where(earlier), "that line is here");
        r.grid[later].valid = false;
        first = earlier;
    }
}

}  // namespace

namespace {

/// `grid plan ...`: the plan lines the building's frames stand on, kept apart
/// from the frame's own grid (they run across it, not in its plane).
void resolve_plan_grid(Resolver& r, const syntax::Grid& grid) {
    auto add = [&](const syntax::Name& name, double place) {
        if (r.plan_lines.add(name, r.diagnostics))
            r.model.plan_lines.push_back(GridLine{name.text, place, name.where});
    };
    if (grid.run) {
        auto names = run_names(r, *grid.run);
        auto places = names ? run_places(r, *grid.run, names->size()) : std::nullopt;
        if (!names || !places)
            return;
        for (std::size_t k = 0; k < names->size(); ++k)
            add(syntax::Name{(*names)[k], run_range(*grid.run)}, (*places)[k]);
        return;
    }
    for (const syntax::Grid::Line& line : grid.lines) {
        auto v = r.value(line.at, expected::length);
        if (v && r.within(line.at, *v, kMaxCoordinate, "coordinate"))
            add(line.name, *v);
    }
}

}  // namespace

void resolve_grids(Resolver& r, const std::vector<const syntax::Grid*>& grids) {
    for (const syntax::Grid* grid : grids) {
        if (grid->plan) {
            resolve_plan_grid(r, *grid);
            continue;
        }
        if (grid->run) {
            resolve_run(r, *grid);
            continue;
        }
        if (!room_for_lines(r, grid->lines.size(), grid->lines.front().name.where))
            continue;
        for (const syntax::Grid::Line& line : grid->lines) {
            auto v = r.value(line.at, expected::length);
            if (v && !r.within(line.at, *v, kMaxCoordinate, "coordinate"))
                v.reset();
            add_grid_line(r, grid->axis, line.name, v);
        }
    }
    refuse_coincident_lines(r);
}

// ---------------------------------------------------------------- nodes

namespace {

/// The column line and level an intersection name such as `A.eave` joins.
std::optional<std::pair<std::size_t, std::size_t>> intersection(const Resolver& r,
                                                                const std::string& name) {
    for (std::size_t dot = name.find('.'); dot != std::string::npos;
         dot = name.find('.', dot + 1)) {
        auto x = r.grid_lines.find_quietly(name.substr(0, dot));
        auto y = r.grid_lines.find_quietly(name.substr(dot + 1));
        if (x && y && r.grid[*x].axis == syntax::Axis::x && r.grid[*y].axis == syntax::Axis::y)
            return std::pair{*x, *y};
    }
    return std::nullopt;
}

/// The part of a (one-line) name from byte `offset`, `length` bytes long.
SourceRange part_of(const syntax::Name& name, std::size_t offset, std::size_t length) {
    SourceRange where = name.where;
    where.begin.offset += static_cast<std::uint32_t>(offset);
    where.begin.column += static_cast<std::uint32_t>(offset);
    where.end = where.begin;
    where.end.offset += static_cast<std::uint32_t>(length);
    where.end.column += static_cast<std::uint32_t>(length);
    return where;
}

/// Reports why `name` is not the intersection it looks like, at the part to
/// fix: `Q.eave` (no column line Q), `A.eve` (no level eve), `eave.A` (level
/// first). Returns false if no part of the name is a grid line.
bool explain_intersection(Resolver& r, const syntax::Name& name) {
    const std::string& text = name.text;
    for (std::size_t dot = text.find('.'); dot != std::string::npos;
         dot = text.find('.', dot + 1)) {
        std::string left = text.substr(0, dot), right = text.substr(dot + 1);
        auto x = r.grid_lines.find_quietly(left), y = r.grid_lines.find_quietly(right);
        bool x_is_line = x && r.grid[*x].axis == syntax::Axis::x;
        bool y_is_level = y && r.grid[*y].axis == syntax::Axis::y;
        if (x && y && !x_is_line && !y_is_level) {
            r.diagnostics.error(name.where, fmt::format("'{}' names the level first; write the "
                                                        "column line first: '{}.{}'",
                                                        text, right, left));
            return true;
        }
        if (x && y) {
            r.diagnostics.error(name.where,
                                fmt::format("'{}' and '{}' are both {}s; an intersection joins a "
                                            "column line and a level",
                                            left, right, axis_noun(r.grid[*x].axis)));
            return true;
        }
        if (x_is_line && !y) {
            r.diagnostics.error(part_of(name, dot + 1, right.size()),
                                fmt::format("unknown level '{}' in '{}'{}", right, text,
                                            did_you_mean(right, line_names(r, syntax::Axis::y))));
            return true;
        }
        if (y_is_level && !x) {
            r.diagnostics.error(part_of(name, 0, dot),
                                fmt::format("unknown column line '{}' in '{}'{}", left, text,
                                            did_you_mean(left, line_names(r, syntax::Axis::x))));
            return true;
        }
    }
    return false;
}

}  // namespace

NodeId Resolver::node_at_place(const std::string& name, double x, double y, SourceRange where) {
    auto [it, fresh] = node_at.emplace(place_key(x, y), make_id<NodeId>(model.nodes.size()));
    if (!fresh) {
        if (model.nodes[at(it->second)].name != name)
            node_aliases.emplace(name, it->second);
        return it->second;
    }
    nodes.add(syntax::Name{name, where}, diagnostics);
    model.nodes.push_back(Node{name, x, y, where});
    node_status.push_back(NodeStatus{true, false});
    return it->second;
}

std::optional<NodeId> Resolver::find_node(const syntax::Name& name) {
    if (auto i = nodes.find_quietly(name.text))
        return make_id<NodeId>(*i);
    if (auto it = node_aliases.find(name.text); it != node_aliases.end())
        return it->second;
    if (auto lines = intersection(*this, name.text)) {
        const GridRef& x = grid[lines->first];
        const GridRef& y = grid[lines->second];
        if (!x.valid || !y.valid)
            return std::nullopt;  // the line's own error is reported
        return node_at_place(name.text, x.position, y.position, name.where);
    }
    if (explain_intersection(*this, name))
        return std::nullopt;
    if (members.find_quietly(name.text)) {
        diagnostics.error(name.where, fmt::format("'{}' is a member; a node is expected here, "
                                                  "such as one of its ends",
                                                  name.text));
        return std::nullopt;
    }
    return lookup<NodeId>(nodes, name);  // reports it unknown
}

const char* axis_noun(syntax::Axis axis) {
    return axis == syntax::Axis::x ? "column line" : "level";
}

std::vector<std::string> line_names(const Resolver& r, syntax::Axis axis) {
    std::vector<std::string> names;
    for (std::size_t i = 0; i < r.grid.size(); ++i) {
        if (r.grid[i].axis == axis)
            names.push_back(r.grid_lines.names()[i]);
    }
    return names;
}

}  // namespace firn::resolve_detail
