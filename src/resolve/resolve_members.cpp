// resolve_members: the statements that create members: `member`, and the
// generators `columns`, `beams` and `rafters`, split at the grid lines they cross.
//
// Generated members run left to right and bottom to top, and take their names
// from the grid (`eave.A.B`, `A.base.floor`, `gable.B.C`), so a name does not
// change when an unrelated line is added.
#include <fmt/format.h>
#include <algorithm>
#include <cmath>

#include "resolve/resolve_internal.hpp"

namespace firn::resolve_detail {
namespace {

constexpr double kMinMemberLength = 1e-6;  // m
// A limit of a whole model, far above any building frame (the largest benchmark
// frame has 20,100 members): a few generators in a small file could otherwise ask
// for a hundred million members.
constexpr std::size_t kMaxMembers = 100000;

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

}  // namespace
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
            r_.node_status[at(m.start)].used = r_.node_status[at(m.end)].used = true;
            valid = check_member_length(r_, m, end_where) && valid;
            set_hinges(member);
        }
        MemberId id = make_id<MemberId>(r_.model.members.size());
        for (const syntax::Name& tag : options_.tags)
            r_.tagged.emplace_back(tag, id);
        r_.member_status.push_back(Resolver::MemberStatus{valid, section_.has_value()});
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
    return n && r.node_status[at(*n)].placed;
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
