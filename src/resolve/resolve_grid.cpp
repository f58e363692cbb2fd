// resolve_grid: grid lines (listed or in runs such as A..F), the nodes at their
// intersections, and the statements that create members: `member`, and the
// generators `columns`, `beams` and `rafters`.
//
// Generated members run left to right and bottom to top, and take their names
// from the grid (`eave.A.B`, `A.base.floor`, `gable.B.C`), so a name does not
// change when an unrelated line is added.
#include <fmt/format.h>
#include <algorithm>
#include <cctype>
#include <cmath>

#include "resolve/resolve_internal.hpp"

namespace firn::resolve_detail {
namespace {

constexpr double kMinMemberLength = 1e-6;  // m
constexpr double kOnLine = 1e-6;           // m: a point this close to a line lies on it
constexpr std::size_t kMaxRunLines = 10000;
// Limits of a whole model, far above any building frame (the largest benchmark
// frame has 202 lines and 20,100 members): a few runs and generators in a
// small file could otherwise ask for a hundred million members.
constexpr std::size_t kMaxGridLines = 2 * kMaxRunLines;
constexpr std::size_t kMaxMembers = 100000;

/// False, after an error at `where`, if `count` more grid lines would pass kMaxGridLines.
bool room_for_lines(Resolver& r, std::size_t count, SourceRange where) {
    if (r.grid.size() + count <= kMaxGridLines)
        return true;
    r.diagnostics.error(where, fmt::format("a model has at most {} grid lines", kMaxGridLines));
    return false;
}

/// False, after an error at `where`, if `count` more members would pass kMaxMembers.
bool room_for_members(Resolver& r, std::size_t count, SourceRange where, const char* what) {
    std::size_t total = r.model.members.size() + count;
    if (total <= kMaxMembers)
        return true;
    r.diagnostics.error(where, fmt::format("{} would bring the model to {} members; a model "
                                           "has at most {}",
                                           what, total, kMaxMembers));
    r.members_missing = true;
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
        auto v = r.value(*run.start, expect::length);
        if (!v || !r.within(*run.start, *v, kMaxCoordinate, "coordinate"))
            return std::nullopt;
        place = *v;
    }
    std::vector<double> spacing;
    for (const syntax::Expr& e : run.spacings) {
        auto v = r.value(e, expect::length);
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

const char* axis_noun(syntax::Axis axis) {
    return axis == syntax::Axis::x ? "column line" : "level";
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
        auto v = r.value(line.at, expect::length);
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
            auto v = r.value(line.at, expect::length);
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

std::vector<std::string> line_names(const Resolver& r, syntax::Axis axis) {
    std::vector<std::string> names;
    for (std::size_t i = 0; i < r.grid.size(); ++i) {
        if (r.grid[i].axis == axis)
            names.push_back(r.grid_lines.names()[i]);
    }
    return names;
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
    node_placed.push_back(1);
    node_used.push_back(0);
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

// ---------------------------------------------------------------- members

namespace {

/// A member a statement asks for, before it is added.
struct NewMember {
    std::string name;
    NodeId start, end;
    SourceRange where;
};

bool check_member_length(Resolver& r, const NewMember& m, SourceRange end_where) {
    const Node& a = r.model.nodes[at(m.start)];
    const Node& b = r.model.nodes[at(m.end)];
    if (m.start == m.end) {
        r.diagnostics.error(
            end_where, fmt::format("member '{}' starts and ends at node '{}'", m.name, a.name));
        return false;
    }
    if (std::hypot(b.x - a.x, b.y - a.y) < kMinMemberLength) {
        r.diagnostics.error(
            m.where,
            fmt::format("member '{}' has zero length: nodes '{}' and '{}' are at the same place",
                        m.name, a.name, b.name));
        return false;
    }
    return true;
}

/// Adds the members of one statement with its section, hinges and tags.
class MemberAdder {
  public:
    MemberAdder(Resolver& r, const syntax::MemberOptions& options)
        : r_(r), options_(options), section_(r.lookup<SectionId>(r.sections, options.section)) {
        for (const syntax::Name& h : options.hinges)
            hinges_.push_back(r.find_node(h));
        hinge_used_.assign(hinges_.size(), 0);
    }

    /// `placed`: both nodes are known and placed (otherwise the member is kept
    /// but marked invalid, its error already reported).
    void add(const NewMember& m, bool placed, SourceRange end_where) {
        all_placed_ = all_placed_ && placed;
        if (auto first = r_.members.find_quietly(m.name)) {
            note_duplicate(m, *first);
            return;
        }
        r_.members.add(syntax::Name{m.name, m.where}, r_.diagnostics);
        Member member{m.name, m.start, m.end,  section_.value_or(SectionId{}),
                      false,  false,   m.where};
        bool valid = section_.has_value() && placed;
        if (placed) {
            r_.node_used[at(m.start)] = r_.node_used[at(m.end)] = 1;
            valid = check_member_length(r_, m, end_where) && valid;
            set_hinges(member);
        }
        MemberId id = make_id<MemberId>(r_.model.members.size());
        for (const syntax::Name& tag : options_.tags)
            r_.tagged.emplace_back(tag, id);
        r_.member_valid.push_back(valid);
        r_.member_section_known.push_back(section_.has_value());
        r_.model.members.push_back(std::move(member));
    }

    /// Reports a hinge at a node where no member of the statement ends (unless
    /// a member's nodes had errors: the hinge may be right and the node wrong).
    void finish(const char* what) {
        report_duplicates();
        if (!all_placed_)
            return;
        for (std::size_t i = 0; i < hinges_.size(); ++i) {
            if (hinges_[i] && !hinge_used_[i]) {
                r_.diagnostics.error(
                    options_.hinges[i].where,
                    fmt::format("node '{}' is not an end of {}", options_.hinges[i].text, what));
            }
        }
    }

  private:
    /// Names a statement makes that are taken, by the place in the statement
    /// that made them, with the first taken name's index.
    struct Duplicates {
        SourceRange where;
        std::size_t first;
        std::vector<std::string> names;
    };

    void note_duplicate(const NewMember& m, std::size_t first) {
        auto same_place = [&](const Duplicates& d) {
            return d.where.file == m.where.file && d.where.begin.offset == m.where.begin.offset;
        };
        auto it = std::find_if(duplicates_.begin(), duplicates_.end(), same_place);
        if (it == duplicates_.end())
            it = duplicates_.insert(it, Duplicates{m.where, first, {}});
        it->names.push_back(m.name);
    }

    /// One error per place that made taken names (a generator over a line
    /// already done makes several), naming them all.
    void report_duplicates() {
        for (const Duplicates& d : duplicates_) {
            std::vector<std::string> rest(d.names.begin(), d.names.end() - 1);
            std::string message =
                rest.empty() ? fmt::format("member '{}' is already defined", d.names.back())
                             : fmt::format("members '{}' and '{}' are already defined",
                                           fmt::join(rest, "', '"), d.names.back());
            r_.diagnostics.error(d.where, std::move(message))
                .note(r_.members.where(d.first), "first defined here");
        }
        duplicates_.clear();
    }

    void set_hinges(Member& m) {
        for (std::size_t i = 0; i < hinges_.size(); ++i) {
            if (hinges_[i] == m.start || hinges_[i] == m.end) {
                m.hinge_start = m.hinge_start || hinges_[i] == m.start;
                m.hinge_end = m.hinge_end || hinges_[i] == m.end;
                hinge_used_[i] = 1;
            }
        }
    }

    Resolver& r_;
    const syntax::MemberOptions& options_;
    std::optional<SectionId> section_;
    std::vector<std::optional<NodeId>> hinges_;
    std::vector<char> hinge_used_;
    std::vector<Duplicates> duplicates_;
    bool all_placed_ = true;
};

bool placed(const Resolver& r, std::optional<NodeId> n) {
    return n && r.node_placed[at(*n)];
}

void resolve_member(Resolver& r, const syntax::MemberDecl& decl) {
    auto start = r.find_node(decl.start);
    auto end = r.find_node(decl.end);
    if (!room_for_members(r, 1, decl.name.where, "this member"))
        return;
    MemberAdder adder(r, decl.options);
    NewMember m{decl.name.text, start.value_or(NodeId{}), end.value_or(NodeId{}), decl.name.where};
    adder.add(m, placed(r, start) && placed(r, end), decl.end.where);
    adder.finish(fmt::format("member '{}'", decl.name.text).c_str());
}

/// The grid line `name` on `axis`, or nullopt after an error.
/// Reports a line a generator names that does not exist. Single letters and
/// numbers are never near misses, so a short grid is listed instead.
void report_unknown_line(Resolver& r, const syntax::Name& name, syntax::Axis axis) {
    constexpr std::size_t kListed = 8;
    std::vector<std::string> names = line_names(r, axis);
    std::string hint = did_you_mean(name.text, r.grid_lines.names());
    if (hint.empty() && !names.empty() && names.size() <= kListed)
        hint = fmt::format("; the {}s are {}", axis_noun(axis), fmt::join(names, ", "));
    r.diagnostics.error(name.where, fmt::format("unknown grid line '{}'{}", name.text, hint));
}

std::optional<std::size_t> grid_line_on(Resolver& r, const syntax::Name& name, syntax::Axis axis) {
    auto i = r.grid_lines.find_quietly(name.text);
    if (!i) {
        report_unknown_line(r, name, axis);
        return std::nullopt;
    }
    if (r.grid[*i].axis != axis) {
        r.diagnostics.error(name.where,
                            fmt::format("'{}' is a {}, not a {}", name.text,
                                        axis == syntax::Axis::x ? "level" : "column line",
                                        axis == syntax::Axis::x ? "column line" : "level"));
        return std::nullopt;
    }
    if (!r.grid[*i].valid)
        return std::nullopt;
    return i;
}

/// Lines of `axis` from `a` to `b` inclusive, in position order.
std::vector<std::size_t> lines_between(const Resolver& r, syntax::Axis axis, std::size_t a,
                                       std::size_t b) {
    double lo = std::min(r.grid[a].position, r.grid[b].position);
    double hi = std::max(r.grid[a].position, r.grid[b].position);
    std::vector<std::size_t> lines;
    for (std::size_t i = 0; i < r.grid.size(); ++i) {
        const GridRef& g = r.grid[i];
        if (g.axis == axis && g.valid && g.position >= lo - kOnLine && g.position <= hi + kOnLine)
            lines.push_back(i);
    }
    std::stable_sort(lines.begin(), lines.end(), [&](std::size_t p, std::size_t q) {
        return r.grid[p].position < r.grid[q].position;
    });
    return lines;
}

/// The lines a list of names and runs (A, C..F) covers, in the order given,
/// each with the place in the statement that named it.
std::vector<std::pair<std::size_t, SourceRange>> expand_ranges(
    Resolver& r, const std::vector<syntax::LineRange>& ranges, syntax::Axis axis) {
    std::vector<std::pair<std::size_t, SourceRange>> lines;
    for (const syntax::LineRange& range : ranges) {
        auto first = grid_line_on(r, range.first, axis);
        auto last = range.last ? grid_line_on(r, *range.last, axis) : first;
        if (!first || !last) {
            r.members_missing = true;
            continue;
        }
        SourceRange where = range.first.where;
        if (range.last)
            where.end = range.last->where.end;
        for (std::size_t i : lines_between(r, axis, *first, *last))
            lines.emplace_back(i, where);
    }
    return lines;
}

/// Nodes along one grid line between two crossing lines, each at an intersection.
template <typename Emit>
void split_along(Resolver& r, std::size_t along, const std::vector<std::size_t>& crossing,
                 SourceRange where, Emit emit) {
    const std::string& line = r.grid_lines.names()[along];
    bool vertical = r.grid[along].axis == syntax::Axis::x;
    for (std::size_t k = 0; k + 1 < crossing.size(); ++k) {
        auto node = [&](std::size_t c) {
            const GridRef& g = r.grid[c];
            const std::string& cross = r.grid_lines.names()[c];
            std::string name =
                vertical ? fmt::format("{}.{}", line, cross) : fmt::format("{}.{}", cross, line);
            double x = vertical ? r.grid[along].position : g.position;
            double y = vertical ? g.position : r.grid[along].position;
            return r.node_at_place(name, x, y, where);
        };
        NewMember m{fmt::format("{}.{}.{}", line, r.grid_lines.names()[crossing[k]],
                                r.grid_lines.names()[crossing[k + 1]]),
                    node(crossing[k]), node(crossing[k + 1]), where};
        emit(m);
    }
}

bool on_axis(const Resolver& r, const syntax::Name& name, syntax::Axis axis) {
    auto i = r.grid_lines.find_quietly(name.text);
    return i && r.grid[*i].axis == axis;
}

/// `columns on base from A to D` or `beams along A from base to eave`: every
/// line is of the other kind, so the other generator was meant. One message
/// says so, instead of one per name.
template <typename Decl>
bool report_swapped(Resolver& r, const Decl& decl, const std::vector<syntax::LineRange>& along,
                    syntax::Axis along_axis) {
    syntax::Axis across = along_axis == syntax::Axis::x ? syntax::Axis::y : syntax::Axis::x;
    bool swapped = on_axis(r, decl.from, along_axis) && on_axis(r, decl.to, along_axis);
    std::vector<std::string> ranges;
    for (const syntax::LineRange& range : along) {
        swapped = swapped && on_axis(r, range.first, across) &&
                  (!range.last || on_axis(r, *range.last, across));
        ranges.push_back(range.last ? fmt::format("{}..{}", range.first.text, range.last->text)
                                    : range.first.text);
    }
    if (!swapped)
        return false;
    bool columns = along_axis == syntax::Axis::x;
    r.diagnostics.error(
        along.front().first.where,
        fmt::format("'{}' is a {}, not a {}; for {} {} it, write '{} {} from {} to {}'",
                    along.front().first.text, axis_noun(across), axis_noun(along_axis),
                    columns ? "beams" : "columns", columns ? "along" : "on",
                    columns ? "beams along" : "columns on", fmt::join(ranges, ", "), decl.from.text,
                    decl.to.text));
    r.members_missing = true;
    return true;
}

/// `columns on A, C..E from base to roof` and `beams along roof from A to D`.
template <typename Decl>
void resolve_grid_members(Resolver& r, const Decl& decl,
                          const std::vector<syntax::LineRange>& along, syntax::Axis along_axis,
                          const char* what) {
    if (report_swapped(r, decl, along, along_axis))
        return;
    syntax::Axis across = along_axis == syntax::Axis::x ? syntax::Axis::y : syntax::Axis::x;
    auto from = grid_line_on(r, decl.from, across);
    auto to = grid_line_on(r, decl.to, across);
    auto lines = expand_ranges(r, along, along_axis);
    MemberAdder adder(r, decl.options);
    if (from && to) {
        std::vector<std::size_t> crossing = lines_between(r, across, *from, *to);
        if (crossing.size() < 2) {
            r.members_missing = true;
            r.diagnostics.error(decl.to.where,
                                fmt::format("{} from '{}' to '{}' need two different {}s", what,
                                            decl.from.text, decl.to.text, axis_noun(across)));
        }
        std::size_t count = lines.size() * (std::max<std::size_t>(crossing.size(), 1) - 1);
        SourceRange named{
            along.front().first.where.file, along.front().first.where.begin,
            along.back().last ? along.back().last->where.end : along.back().first.where.end};
        if (!room_for_members(r, count, named, fmt::format("these {}", what).c_str()))
            lines.clear();
        for (const auto& [line, where] : lines) {
            split_along(r, line, crossing, where,
                        [&](const NewMember& m) { adder.add(m, true, decl.to.where); });
        }
    }
    r.members_missing = r.members_missing || !from || !to;
    adder.finish(fmt::format("a member of these {}", what).c_str());
}

/// The name a rafter end takes in member names: its column line if it is on one.
std::string point_label(const Resolver& r, NodeId n) {
    for (std::size_t i = 0; i < r.grid.size(); ++i) {
        if (r.grid[i].axis == syntax::Axis::x && r.grid[i].valid &&
            std::abs(r.grid[i].position - r.model.nodes[at(n)].x) <= kOnLine) {
            return r.grid_lines.names()[i];
        }
    }
    return r.model.nodes[at(n)].name;
}

/// One straight piece of a run of rafters, split where it crosses column lines.
/// False if the model has no room for it.
bool rafter_piece(Resolver& r, const syntax::RaftersDecl& decl, NodeId a, NodeId b,
                  SourceRange where, MemberAdder& adder) {
    Node pa = r.model.nodes[at(a)], pb = r.model.nodes[at(b)];
    if (pa.x > pb.x) {
        std::swap(pa, pb);
        std::swap(a, b);
    }
    std::vector<NodeId> points{a};
    std::vector<std::size_t> crossing;
    for (std::size_t i = 0; i < r.grid.size(); ++i) {
        const GridRef& g = r.grid[i];
        if (g.axis == syntax::Axis::x && g.valid && g.position > pa.x + kOnLine &&
            g.position < pb.x - kOnLine) {
            crossing.push_back(i);
        }
    }
    std::stable_sort(crossing.begin(), crossing.end(), [&](std::size_t p, std::size_t q) {
        return r.grid[p].position < r.grid[q].position;
    });
    if (!room_for_members(r, crossing.size() + 1, where, "these rafters"))
        return false;
    // A crossing is labelled by its line: looking each point up among all
    // lines would make a long run quadratic.
    std::vector<std::string> labels{point_label(r, a)};
    for (std::size_t i : crossing) {
        double t = (r.grid[i].position - pa.x) / (pb.x - pa.x);
        std::string name = fmt::format("{}.{}", r.grid_lines.names()[i], decl.run.text);
        points.push_back(
            r.node_at_place(name, r.grid[i].position, pa.y + t * (pb.y - pa.y), where));
        labels.push_back(r.grid_lines.names()[i]);
    }
    points.push_back(b);
    labels.push_back(point_label(r, b));
    for (std::size_t k = 0; k + 1 < points.size(); ++k) {
        NewMember m{fmt::format("{}.{}.{}", decl.run.text, labels[k], labels[k + 1]), points[k],
                    points[k + 1], where};
        adder.add(m, true, where);
    }
    return true;
}

/// Why no rafter can run from `a` to `b`, or nullptr if one can.
const char* unusable_piece(const Resolver& r, NodeId a, NodeId b) {
    if (a == b)
        return "have no length: both are the same point";
    if (std::abs(r.model.nodes[at(a)].x - r.model.nodes[at(b)].x) <= kOnLine)
        return "would be vertical; use columns for that";
    return nullptr;
}

void resolve_rafters(Resolver& r, const syntax::RaftersDecl& decl) {
    std::vector<std::optional<NodeId>> points;
    for (const syntax::Name& p : decl.points)
        points.push_back(r.find_node(p));
    MemberAdder adder(r, decl.options);
    for (std::size_t k = 0; k + 1 < points.size(); ++k) {
        if (!placed(r, points[k]) || !placed(r, points[k + 1])) {
            r.members_missing = true;
            continue;
        }
        if (const char* why = unusable_piece(r, *points[k], *points[k + 1])) {
            r.diagnostics.error(decl.points[k + 1].where,
                                fmt::format("rafters from '{}' to '{}' {}", decl.points[k].text,
                                            decl.points[k + 1].text, why));
            r.members_missing = true;
            continue;
        }
        if (!rafter_piece(r, decl, *points[k], *points[k + 1], decl.run.where, adder))
            break;
    }
    adder.finish("these rafters");
}

}  // namespace

void resolve_member_statements(Resolver& r, const std::vector<const syntax::Statement*>& stmts) {
    for (const syntax::Statement* s : stmts) {
        if (const auto* m = std::get_if<syntax::MemberDecl>(&s->node)) {
            resolve_member(r, *m);
        } else if (const auto* c = std::get_if<syntax::ColumnsDecl>(&s->node)) {
            resolve_grid_members(r, *c, c->lines, syntax::Axis::x, "columns");
        } else if (const auto* b = std::get_if<syntax::BeamsDecl>(&s->node)) {
            resolve_grid_members(r, *b, b->levels, syntax::Axis::y, "beams");
        } else if (const auto* f = std::get_if<syntax::RaftersDecl>(&s->node)) {
            resolve_rafters(r, *f);
        }
    }
}

}  // namespace firn::resolve_detail
