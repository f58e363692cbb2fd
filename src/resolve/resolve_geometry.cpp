// resolve_geometry: the checks that a frame's members meet where they seem to,
// run once, after every member and support exists. A frame that draws right but
// is joined wrong (a beam ending on a column's length, a member written twice,
// two members along one line, a part standing on nothing) would otherwise be
// analysed without a word, with forces that are wrong.
//
// Every check compares places within the geometry tolerance: 1 mm, or a
// millionth of the frame's largest extent where that is larger (only a frame
// over 1 km across, which a typing slip makes, gets more), so that round-off in
// coordinates computed from grids, slopes and arithmetic never splits one joint
// in two, while a node placed a real distance off a member is not taken as on
// it. `geometry tolerance 2 mm` sets it.
//
// No check is quadratic: nodes are binned in square cells about one mean member
// long, and a member reads only the cells along its own length.
#include <fmt/format.h>
#include <algorithm>
#include <cmath>
#include <cstdint>
#include <unordered_map>
#include <unordered_set>

#include "resolve/resolve_internal.hpp"

namespace firn::resolve_detail {
namespace {

constexpr double kDefaultTolerance = 1e-3;   // m
constexpr double kRelativeTolerance = 1e-6;  // of the frame's largest extent
constexpr double kFinestTolerance = 1e-6;    // m: places are keyed to micrometres

/// Two indices as one key (the two nodes of a member, a node and a member).
std::uint64_t pair_key(std::size_t a, std::size_t b) {
    return (static_cast<std::uint64_t>(a) << 32) | static_cast<std::uint64_t>(b);
}

/// A small length for messages, in mm or in by the model's units: "0.4 mm", "0.0394 in".
std::string show_small_length(const Model& model, double metres) {
    const std::string& unit = model.units.length.name;
    bool customary = unit == "ft" || unit == "in";
    double v = customary ? metres / 0.0254 : metres * 1000.0;  // 1 in = 25.4 mm exactly
    const char* unit_name = customary ? "in" : "mm";
    if (v >= 100.0)
        return fmt::format("{:.0f} {}", v, unit_name);
    return fmt::format("{:.3g} {}", v, unit_name);
}

struct Point {
    double x, y;
};

Point place(const Model& model, NodeId n) {
    const Node& node = model.nodes[at(n)];
    return {node.x, node.y};
}

/// Where `p` is against the segment a-b: how far along it from a, and how far off its line.
struct Projection {
    double along, off, length;
};

Projection project(Point a, Point b, Point p) {
    double dx = b.x - a.x, dy = b.y - a.y, length = std::hypot(dx, dy);
    double along = ((p.x - a.x) * dx + (p.y - a.y) * dy) / length;
    double off = std::abs((p.x - a.x) * dy - (p.y - a.y) * dx) / length;
    return {along, off, length};
}

/// The used nodes binned in square cells, so that a search along a member or
/// near a point reads only the cells there.
class NodeCells {
  public:
    NodeCells(const Resolver& r, double cell) : cell_(cell) {
        for (std::size_t i = 0; i < r.model.nodes.size(); ++i) {
            if (r.node_status[i].used && r.node_status[i].placed) {
                const Node& n = r.model.nodes[i];
                cells_[{index(n.x), index(n.y)}].push_back(make_id<NodeId>(i));
            }
        }
    }

    /// Calls f(node) once for each node of the cells within `reach` of the segment a-b.
    template <typename F>
    void along(Point a, Point b, double reach, F f) const {
        // Column by column along the segment's steeper axis: across it, one column
        // holds the segment within one cell and the reach, since |slope| <= 1.
        bool steep = std::abs(b.y - a.y) > std::abs(b.x - a.x);
        double u0 = steep ? a.y : a.x, u1 = steep ? b.y : b.x;
        double v0 = steep ? a.x : a.y, v1 = steep ? b.x : b.y;
        if (u0 > u1) {
            std::swap(u0, u1);
            std::swap(v0, v1);
        }
        double slope = u1 > u0 ? (v1 - v0) / (u1 - u0) : 0.0;
        auto v_at = [&](double u) { return v0 + slope * (std::clamp(u, u0, u1) - u0); };
        for (long long k = index(u0 - reach); k <= index(u1 + reach); ++k) {
            double lo = std::max(u0, static_cast<double>(k) * cell_) - reach;
            double hi = std::min(u1, static_cast<double>(k + 1) * cell_) + reach;
            double va = v_at(lo), vb = v_at(hi);
            for (long long j = index(std::min(va, vb) - reach);
                 j <= index(std::max(va, vb) + reach); ++j) {
                auto it = cells_.find(steep ? Key{j, k} : Key{k, j});
                if (it != cells_.end())
                    std::for_each(it->second.begin(), it->second.end(), f);
            }
        }
    }

  private:
    using Key = std::pair<long long, long long>;
    struct Hash {
        std::size_t operator()(const Key& k) const {
            auto a = static_cast<std::uint64_t>(k.first), b = static_cast<std::uint64_t>(k.second);
            return static_cast<std::size_t>(a * 0x9E3779B97F4A7C15ULL ^ b);
        }
    };
    long long index(double v) const { return static_cast<long long>(std::floor(v / cell_)); }

    double cell_;
    std::unordered_map<Key, std::vector<NodeId>, Hash> cells_;
};

/// What the checks share: the tolerance, which members take part, and the
/// members at each node.
struct Frame {
    Resolver& r;
    double tolerance;
    std::vector<char> usable;                    ///< per member: valid, not too short, not a repeat
    std::vector<std::vector<MemberId>> at_node;  ///< the usable members ending at each node

    const Model& model() const { return r.model; }
    std::string tolerance_text() const { return show_small_length(r.model, tolerance); }
    const std::string& node_name(NodeId n) const { return r.model.nodes[at(n)].name; }
    const Member& member(MemberId m) const { return r.model.members[at(m)]; }
};

/// The written tolerance, or the default from the frame's size.
double frame_tolerance(Resolver& r, const syntax::GeometryTolerance* decl) {
    if (decl != nullptr) {
        auto v = r.value(decl->value, expected::length);
        if (v && !(*v >= kFinestTolerance)) {
            r.diagnostics.error(decl->value.where,
                                "a geometry tolerance must be at least 0.001 mm, the precision "
                                "to which firn places nodes");
        } else if (v && r.within(decl->value, *v, kMaxCoordinate, "tolerance")) {
            return *v;
        }
    }
    double lo_x = HUGE_VAL, hi_x = -HUGE_VAL, lo_y = HUGE_VAL, hi_y = -HUGE_VAL;
    for (std::size_t i = 0; i < r.model.nodes.size(); ++i) {
        if (!r.node_status[i].used || !r.node_status[i].placed)
            continue;
        const Node& n = r.model.nodes[i];
        lo_x = std::min(lo_x, n.x), hi_x = std::max(hi_x, n.x);
        lo_y = std::min(lo_y, n.y), hi_y = std::max(hi_y, n.y);
    }
    double extent = lo_x <= hi_x ? std::max(hi_x - lo_x, hi_y - lo_y) : 0.0;
    return std::max(kDefaultTolerance, kRelativeTolerance * extent);
}

/// A member no longer than the tolerance joins two places that are one joint.
void check_short_members(Frame& f) {
    for (std::size_t i = 0; i < f.usable.size(); ++i) {
        if (!f.usable[i])
            continue;
        const Member& m = f.model().members[i];
        double length = member_geometry(f.model(), make_id<MemberId>(i)).length;
        if (length > f.tolerance)
            continue;
        f.usable[i] = 0;
        f.r.diagnostics.error(
            m.where, fmt::format("member '{}' is {} long, within the geometry tolerance ({}), so "
                                 "its nodes '{}' and '{}' are one joint; join the members there "
                                 "at one node, or set a smaller 'geometry tolerance'",
                                 m.name, show_small_length(f.model(), length), f.tolerance_text(),
                                 f.node_name(m.start), f.node_name(m.end)));
    }
}

/// Two members between the same two nodes (either way round) would add their
/// stiffness, doubling a column without a word. Returns the members by their nodes.
std::unordered_map<std::uint64_t, MemberId> check_repeated_members(Frame& f) {
    std::unordered_map<std::uint64_t, MemberId> by_nodes;
    for (std::size_t i = 0; i < f.usable.size(); ++i) {
        if (!f.usable[i])
            continue;
        const Member& m = f.model().members[i];
        std::size_t a = at(m.start), b = at(m.end);  // by value: minmax returns references
        auto [it, fresh] =
            by_nodes.emplace(pair_key(std::min(a, b), std::max(a, b)), make_id<MemberId>(i));
        if (fresh)
            continue;
        f.usable[i] = 0;
        const Member& first = f.member(it->second);
        f.r.diagnostics
            .error(m.where,
                   fmt::format("member '{}' joins the same two nodes as member '{}' ('{}' "
                               "and '{}'), so the frame would take its stiffness twice; "
                               "remove one of them, or give one a section for both",
                               m.name, first.name, f.node_name(m.start), f.node_name(m.end)))
            .note(first.where, fmt::format("member '{}' is here", first.name));
    }
    return by_nodes;
}

/// The `unjoined` statements: each node and member they name, and whether the
/// search found the node on the member's length (a pair never found is stale).
class Unjoins {
  public:
    void read(Resolver& r, const std::vector<const syntax::UnjoinedDecl*>& decls) {
        for (const syntax::UnjoinedDecl* decl : decls) {
            std::vector<MemberId> members;
            for (const syntax::Name& ref : decl->members) {
                if (auto found = r.find_members(ref))
                    members.insert(members.end(), found->begin(), found->end());
            }
            for (const syntax::Name& name : decl->nodes) {
                auto node = r.find_node(name);
                for (MemberId m : members) {
                    if (node && index_.emplace(pair_key(at(*node), at(m)), found_.size()).second) {
                        r.model.unjoined.push_back(Unjoined{*node, m, name.where});
                        found_.push_back(0);
                    }
                }
            }
        }
    }

    /// True if the model says that `node` passes `member`; notes that it does.
    bool take(NodeId node, MemberId member) {
        auto it = index_.find(pair_key(at(node), at(member)));
        if (it == index_.end())
            return false;
        found_[it->second] = 1;
        return true;
    }

    /// Reports the pairs whose node the search did not find on the member's length.
    void report_stale(const Frame& f) const;

  private:
    std::unordered_map<std::uint64_t, std::size_t> index_;  ///< pair -> index in model.unjoined
    std::vector<char> found_;
};

void Unjoins::report_stale(const Frame& f) const {
    for (std::size_t i = 0; i < found_.size(); ++i) {
        const Unjoined& u = f.model().unjoined[i];
        if (found_[i] || !f.usable[at(u.member)] || !f.r.node_status[at(u.node)].placed)
            continue;
        const Member& m = f.member(u.member);
        const std::string& node = f.node_name(u.node);
        std::string message =
            u.node == m.start || u.node == m.end
                ? fmt::format(
                      "node '{}' is an end of member '{}', so the two are joined; "
                      "'unjoined' is for a node that passes a member along its length",
                      node, m.name)
                : fmt::format(
                      "node '{}' does not lie on member '{}' (within the geometry "
                      "tolerance, {}), so there is no joint to leave out; remove it "
                      "from 'unjoined'",
                      node, m.name, f.tolerance_text());
        f.r.diagnostics.error(u.where, std::move(message));
    }
}

/// True if member `k`, which ends at `p` on the length of `m`, runs along `m`'s
/// line. From a node inside `m` by more than the tolerance, a member longer than
/// the tolerance along that line always shares a length with `m`.
bool runs_along(const Frame& f, MemberId k, NodeId p, MemberId m) {
    const Member& along = f.member(k);
    const Member& line = f.member(m);
    NodeId other = along.start == p ? along.end : along.start;
    Point a = place(f.model(), line.start), b = place(f.model(), line.end);
    return project(a, b, place(f.model(), other)).off <= f.tolerance;
}

/// Pairs of members that overlap, each once, in the order found.
struct Overlaps {
    std::unordered_set<std::uint64_t> seen;
    std::vector<std::pair<MemberId, MemberId>> pairs;  ///< (earlier, later) by declaration

    void add(MemberId a, MemberId b) {
        std::size_t lo = std::min(at(a), at(b)), hi = std::max(at(a), at(b));
        if (seen.insert(pair_key(lo, hi)).second)
            pairs.emplace_back(make_id<MemberId>(lo), make_id<MemberId>(hi));
    }
};

void report_node_on_member(const Frame& f, NodeId p, MemberId m) {
    const Node& node = f.model().nodes[at(p)];
    const Member& member = f.member(m);
    f.r.diagnostics
        .error(node.where,
               fmt::format("node '{0}' lies on member '{1}' but is not one of its ends, so the two "
                           "are not joined; split '{1}' at '{0}' (end a member there, or add a "
                           "grid line through the node for the generator to split at), or write "
                           "'unjoined {0} on {1}' if they pass without a connection",
                           node.name, member.name))
        .note(member.where, fmt::format("member '{}' is here", member.name));
}

/// A node found on the length of `m`: a member ending there along `m`'s line
/// overlaps it; any other meets `m` where nothing joins them, unless the model
/// says the node passes `m`.
void node_on_member(Frame& f, NodeId p, MemberId m, Unjoins& unjoins, Overlaps& overlaps) {
    bool declared = unjoins.take(p, m);
    bool crossing = false;
    for (MemberId k : f.at_node[at(p)]) {
        if (runs_along(f, k, p, m))
            overlaps.add(k, m);
        else
            crossing = true;
    }
    if (crossing && !declared)
        report_node_on_member(f, p, m);
}

void report_overlaps(const Frame& f, const Overlaps& overlaps) {
    for (const auto& [first, second] : overlaps.pairs) {
        const Member& a = f.member(first);
        const Member& b = f.member(second);
        f.r.diagnostics
            .error(b.where,
                   fmt::format("members '{}' and '{}' lie along one line and overlap, so they "
                               "are not joined where they share their length; end one where the "
                               "other begins, or make them one member",
                               b.name, a.name))
            .note(a.where, fmt::format("member '{}' is here", a.name));
    }
}

/// Nodes on a member's length, more than the tolerance from both its ends and
/// within it of its line, that are not its ends.
void check_nodes_on_members(Frame& f, const NodeCells& cells, Unjoins& unjoins) {
    Overlaps overlaps;
    for (std::size_t i = 0; i < f.usable.size(); ++i) {
        if (!f.usable[i])
            continue;
        const Member& m = f.model().members[i];
        Point a = place(f.model(), m.start), b = place(f.model(), m.end);
        std::vector<NodeId> found;
        cells.along(a, b, f.tolerance, [&](NodeId p) {
            Projection q = project(a, b, place(f.model(), p));
            if (p != m.start && p != m.end && q.off <= f.tolerance && q.along > f.tolerance &&
                q.along < q.length - f.tolerance)
                found.push_back(p);
        });
        std::sort(found.begin(), found.end());  // cells come in no set order
        for (NodeId p : found)
            node_on_member(f, p, make_id<MemberId>(i), unjoins, overlaps);
    }
    report_overlaps(f, overlaps);
}

/// Two nodes within the tolerance of each other but not one node: members
/// meeting there are not joined. At exactly one place, resolve_nodes has
/// already said so; a member between them is already an error.
void check_near_nodes(Frame& f, const NodeCells& cells,
                      const std::unordered_map<std::uint64_t, MemberId>& by_nodes) {
    const Model& model = f.model();
    for (std::size_t i = 0; i < model.nodes.size(); ++i) {
        if (!f.r.node_status[i].used || !f.r.node_status[i].placed)
            continue;
        Point p{model.nodes[i].x, model.nodes[i].y};
        std::vector<std::size_t> near;
        cells.along(p, p, f.tolerance, [&](NodeId n) {
            Point q = place(model, n);
            double gap = std::hypot(q.x - p.x, q.y - p.y);
            if (at(n) < i && gap <= f.tolerance && place_key(q.x, q.y) != place_key(p.x, p.y) &&
                !by_nodes.contains(pair_key(at(n), i)))
                near.push_back(at(n));
        });
        std::sort(near.begin(), near.end());
        for (std::size_t j : near) {
            const Node& first = model.nodes[j];
            double gap = std::hypot(first.x - p.x, first.y - p.y);
            f.r.diagnostics
                .warning(model.nodes[i].where,
                         fmt::format("node '{}' is {} from node '{}', within the geometry "
                                     "tolerance ({}), but they are two nodes, so members meeting "
                                     "there are not joined; use one node for both",
                                     model.nodes[i].name, show_small_length(model, gap), first.name,
                                     f.tolerance_text()))
                .note(first.where, fmt::format("node '{}' is here", first.name));
        }
    }
}

}  // namespace
namespace {

/// Parts of the frame that share no node, by union of the members' ends.
class Parts {
  public:
    explicit Parts(std::size_t nodes) : parent_(nodes) {
        for (std::size_t i = 0; i < nodes; ++i)
            parent_[i] = i;
    }
    std::size_t find(std::size_t n) {
        while (parent_[n] != n)
            n = parent_[n] = parent_[parent_[n]];
        return n;
    }
    void join(std::size_t a, std::size_t b) { parent_[find(a)] = find(b); }

  private:
    std::vector<std::size_t> parent_;
};

/// One part: its first member in declaration order, how many it has, and
/// whether a support holds it.
struct Part {
    MemberId first{};
    std::size_t members = 0;
    bool supported = false;
};

std::vector<Part> frame_parts(Frame& f) {
    const Model& model = f.model();
    Parts parts(model.nodes.size());
    for (const Member& m : model.members)
        parts.join(at(m.start), at(m.end));
    std::unordered_map<std::size_t, std::size_t> part_of;  // root -> index in the result
    std::vector<Part> found;
    for (std::size_t i = 0; i < model.members.size(); ++i) {
        auto [it, fresh] = part_of.emplace(parts.find(at(model.members[i].start)), found.size());
        if (fresh)
            found.push_back(Part{make_id<MemberId>(i), 0, false});
        ++found[it->second].members;
    }
    for (const Support& s : model.supports) {
        auto it = part_of.find(parts.find(at(s.node)));
        if (it != part_of.end())
            found[it->second].supported = true;
    }
    return found;
}

/// Parts of the frame that share no node with the rest (the largest part).
/// A part on supports of its own is a frame of its own: two frames in one model
/// (a canopy on its own posts beside a hall) may be deliberate and analyse
/// correctly, so it is a warning; but it is also what a joint typed as two nodes
/// looks like, so it is said. A part without a support has nothing holding it up:
/// the solver would stop at a singular stiffness without naming the members, so
/// it is an error here, naming them.
void check_parts(Frame& f) {
    Resolver& r = f.r;
    if (r.diagnostics.has_errors() || r.members_missing || r.model.supports.empty())
        return;  // a missing or broken member splits a frame; that error comes first
    std::vector<Part> parts = frame_parts(f);
    if (parts.size() < 2)
        return;
    auto largest = std::max_element(parts.begin(), parts.end(), [](const Part& a, const Part& b) {
        return a.members < b.members;
    });
    for (auto it = parts.begin(); it != parts.end(); ++it) {
        if (it == largest && it->supported)
            continue;
        const Member& m = f.member(it->first);
        std::string who = fmt::format(
            "the part of the frame around node '{}' ({} member{}, '{}' first) shares no node "
            "with the rest",
            f.node_name(m.start), it->members, it->members == 1 ? "" : "s", m.name);
        if (it->supported) {
            r.diagnostics.warning(m.where, who +
                                               " and stands on supports of its own, so it is "
                                               "analysed as a frame apart; if it should be "
                                               "joined to the rest, give them a node in common");
        } else {
            r.diagnostics.error(m.where, who +
                                             " and has no support, so nothing holds it up; join "
                                             "it to the rest at a node in common, or support it");
        }
    }
}

}  // namespace

void check_geometry(Resolver& r, const syntax::GeometryTolerance* tolerance,
                    const std::vector<const syntax::UnjoinedDecl*>& unjoined) {
    Frame f{r, frame_tolerance(r, tolerance), {}, {}};
    r.model.geometry_tolerance = f.tolerance;
    Unjoins unjoins;
    unjoins.read(r, unjoined);
    f.usable.resize(r.model.members.size());
    for (std::size_t i = 0; i < f.usable.size(); ++i)
        f.usable[i] = r.member_status[i].valid ? 1 : 0;
    auto by_nodes = check_repeated_members(f);  // first: a short member's nodes are then known
    check_short_members(f);
    f.at_node.resize(r.model.nodes.size());
    double total = 0.0;
    std::size_t count = 0;
    for (std::size_t i = 0; i < f.usable.size(); ++i) {
        if (!f.usable[i])
            continue;
        const Member& m = r.model.members[i];
        f.at_node[at(m.start)].push_back(make_id<MemberId>(i));
        f.at_node[at(m.end)].push_back(make_id<MemberId>(i));
        total += member_geometry(r.model, make_id<MemberId>(i)).length;
        ++count;
    }
    // Cells about one mean member long: a member then reads a few cells, and
    // the cells along all members together are about as many as the members.
    double cell = std::max(4.0 * f.tolerance, count > 0 ? total / static_cast<double>(count) : 1.0);
    NodeCells cells(r, cell);
    check_nodes_on_members(f, cells, unjoins);
    check_near_nodes(f, cells, by_nodes);
    unjoins.report_stale(f);
    check_parts(f);
}

}  // namespace firn::resolve_detail
