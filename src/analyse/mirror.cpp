// mirror: symmetry of the frame about a vertical axis, and the load cases that
// are each other's mirror images.
//
// Sign rules. The reflection R maps a global vector (gx, gy) to (-gx, gy) and,
// since it reverses the sense of turning, a counterclockwise moment to a
// clockwise one. A member has local axes e = (c, s) and n = e turned 90 degrees
// counterclockwise = (-s, c). Its image member either
//  - runs the same way (the image of its start node is the image's start):
//    e' = R e = (-c, s), but n' = (-s, -c) = -R n, so the image of a load
//    qx e + qy n at s is qx e' - qy n' at s: qx and N are kept, qy flips. M is
//    positive when the local -y face is in tension; the image of that face is the
//    image member's +y face, so M flips, and so do V = dM/ds and the deflection;
//  - runs the other way: e' = -R e and n' = R n, so the load becomes
//    -qx e' + qy n' at L - s: qx flips, qy is kept; the -y face maps to the -y
//    face, so M and the deflection are kept, while V = dM/ds flips because s
//    runs the other way; N is kept.
// A point moment on a member flips either way, as any moment does.
//
// Comparing loads. Member loads are compared as the functions they add up to,
// not as lists, so their order and the way a distributed load is split do not
// matter: the summed distributed intensities qx(s), qy(s) are piecewise linear,
// so two sums agree everywhere when they agree on both sides of every end of
// every load of either; point actions are summed per position. Nodal loads are
// compared per node. To stay near members x cases, each case first gets a
// fingerprint that the mirror leaves unchanged (weighted magnitudes of each
// member's and node's resultants, with equal pseudo-random weights for a member
// and its image); only cases with close fingerprints are compared in full.
#include "ir/mirror.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdint>
#include <limits>
#include <span>
#include <utility>

#include "analyse/analyse.hpp"
#include "base/parallel.hpp"

namespace firn {
namespace {

constexpr double kTol = mirror_tolerance;
/// The fingerprint tolerance, per load, as a share of the case's scale. A load
/// whose image agrees within kTol (intensities within kTol x scale / size, ends
/// within kTol x size) moves the weighted resultants by at most about 15 kTol x
/// scale, so a true partner always passes; a different arrangement differs by
/// whole loads and does not.
constexpr double kCandidateTol = 100 * kTol;

bool close(double a, double b, double tol) {
    return std::abs(a - b) <= tol;
}
bool close_relative(double a, double b) {
    return close(a, b, kTol * std::max(std::abs(a), std::abs(b)));
}

// ---------------------------------------------------------------- geometry

struct Extent {
    double x0 = 0.0, y0 = 0.0;
    double axis = 0.0;
    double size = 1.0;  ///< m: the larger of width and height (1 for a single point)
};

Extent frame_extent(const Model& model) {
    constexpr double inf = std::numeric_limits<double>::infinity();
    double x0 = inf, x1 = -inf, y0 = inf, y1 = -inf;
    for (const Node& n : model.nodes) {
        x0 = std::min(x0, n.x);
        x1 = std::max(x1, n.x);
        y0 = std::min(y0, n.y);
        y1 = std::max(y1, n.y);
    }
    double size = std::max(x1 - x0, y1 - y0);
    return Extent{x0, y0, 0.5 * (x0 + x1), size > 0.0 ? size : 1.0};
}

/// Nodes sorted by cells one tolerance wide, counted from the frame's corner:
/// a node within the tolerance of a point lies in the point's cell or a neighbour.
class NodeIndex {
  public:
    NodeIndex(const Model& model, const Extent& extent)
        : model_(model), extent_(extent), tol_(kTol * extent.size) {
        for (std::size_t i = 0; i < model.nodes.size(); ++i)
            cells_.push_back({cell(model.nodes[i].x, model.nodes[i].y), make_id<NodeId>(i)});
        std::sort(cells_.begin(), cells_.end());
    }

    std::optional<NodeId> near(double x, double y) const {
        auto [ix, iy] = cell(x, y);
        for (std::int64_t dx = -1; dx <= 1; ++dx) {
            for (std::int64_t dy = -1; dy <= 1; ++dy) {
                Cell c{ix + dx, iy + dy};
                auto it = std::lower_bound(cells_.begin(), cells_.end(), std::pair{c, NodeId{}});
                for (; it != cells_.end() && it->first == c; ++it) {
                    const Node& n = model_.nodes[at(it->second)];
                    if (close(n.x, x, tol_) && close(n.y, y, tol_))
                        return it->second;
                }
            }
        }
        return std::nullopt;
    }

  private:
    using Cell = std::pair<std::int64_t, std::int64_t>;
    Cell cell(double x, double y) const {
        return {std::llround((x - extent_.x0) / tol_), std::llround((y - extent_.y0) / tol_)};
    }
    const Model& model_;
    Extent extent_;
    double tol_;
    std::vector<std::pair<Cell, NodeId>> cells_;
};

/// Whether a complete map is its own inverse, as a mirror map must be (two
/// entities claiming the same image would break it).
template <typename Id>
bool is_involution(const std::vector<std::optional<Id>>& map) {
    for (std::size_t i = 0; i < map.size(); ++i) {
        if (at(*map[at(*map[i])]) != i)
            return false;
    }
    return true;
}

/// Maps every node to the node at its image; false when one has none, or when
/// two nodes claim the same image (the map must be its own inverse).
bool map_nodes(const Model& model, const Extent& extent, Mirror& mirror) {
    NodeIndex index(model, extent);
    mirror.node.resize(model.nodes.size());
    for (std::size_t i = 0; i < model.nodes.size(); ++i) {
        const Node& n = model.nodes[i];
        mirror.node[i] = index.near(2.0 * extent.axis - n.x, n.y);
        if (!mirror.node[i])
            return false;
    }
    return is_involution(mirror.node);
}

bool same_section(const Model& model, SectionId a, SectionId b) {
    const Section& sa = model.sections[at(a)];
    const Section& sb = model.sections[at(b)];
    return close_relative(sa.area, sb.area) && close_relative(sa.inertia, sb.inertia) &&
           close_relative(model.materials[at(sa.material)].elastic_modulus,
                          model.materials[at(sb.material)].elastic_modulus);
}

/// Whether `image` can be the image of `m`: same section, and each hinge at
/// the image of the end it releases.
bool can_be_image(const Model& model, const Member& m, const Member& image, bool reversed) {
    bool start = reversed ? image.hinge_end : image.hinge_start;
    bool end = reversed ? image.hinge_start : image.hinge_end;
    return m.hinge_start == start && m.hinge_end == end &&
           same_section(model, m.section, image.section);
}

std::uint64_t ends_key(NodeId a, NodeId b) {
    std::uint64_t i = at(a), j = at(b);
    return std::min(i, j) << 32 | std::max(i, j);
}

/// The image of every member: the member joining its nodes' images that
/// mirrors it (itself first, for parallel members between the same nodes).
bool map_members(const Model& model, Mirror& mirror) {
    std::vector<std::pair<std::uint64_t, MemberId>> by_ends;
    for (std::size_t i = 0; i < model.members.size(); ++i) {
        const Member& m = model.members[i];
        by_ends.push_back({ends_key(m.start, m.end), make_id<MemberId>(i)});
    }
    std::sort(by_ends.begin(), by_ends.end());
    mirror.member.resize(model.members.size());
    mirror.member_reversed.resize(model.members.size());
    for (std::size_t i = 0; i < model.members.size(); ++i) {
        const Member& m = model.members[i];
        NodeId start = *mirror.node[at(m.start)], end = *mirror.node[at(m.end)];
        auto it = std::lower_bound(by_ends.begin(), by_ends.end(),
                                   std::pair{ends_key(start, end), MemberId{}});
        for (; it != by_ends.end() && it->first == ends_key(start, end); ++it) {
            bool reversed = model.members[at(it->second)].start != start;
            bool better = !mirror.member[i] || at(it->second) == i;
            if (better && can_be_image(model, m, model.members[at(it->second)], reversed)) {
                mirror.member[i] = it->second;
                mirror.member_reversed[i] = reversed;
            }
        }
        if (!mirror.member[i])
            return false;
    }
    return is_involution(mirror.member);
}

/// A support restrains global x, y and rotation. The reflection maps each of
/// these onto itself (a restraint in x resists +x and -x alike, a rotational
/// spring either sense alike), so the image support restrains each the same way:
/// a roller free in x stays free in x, a spring keeps its stiffness.
bool same_restraints(const Support& a, const Support& b) {
    for (std::size_t d = 0; d < a.restraint.size(); ++d) {
        if (a.restraint[d].kind != b.restraint[d].kind ||
            (a.restraint[d].kind == Restraint::Kind::spring &&
             !close_relative(a.restraint[d].stiffness, b.restraint[d].stiffness)))
            return false;
    }
    return true;
}

bool supports_mirror(const Model& model, const Mirror& mirror) {
    std::vector<const Support*> support_at(model.nodes.size(), nullptr);
    for (const Support& s : model.supports)
        support_at[at(s.node)] = &s;  // resolve allows one support per node
    for (const Support& s : model.supports) {
        const Support* image = support_at[at(*mirror.node[at(s.node)])];
        if (image == nullptr || !same_restraints(s, *image))
            return false;
    }
    return true;
}

// ------------------------------------------------------------------- loads

/// Member loads carried into the axes of the image member (the rules above).
struct Imaged {
    std::vector<LocalDistributed> distributed;
    std::vector<LocalPoint> points;

    void take(const CaseLoads& loads, MemberId m, double length, bool reversed) {
        distributed.clear();
        points.clear();
        for (LocalDistributed d : loads.distributed_on(m)) {
            if (reversed) {
                d = {length - d.b, length - d.a, -d.qx_b, -d.qx_a, d.qy_b, d.qy_a};
            } else {
                d.qy_a = -d.qy_a;
                d.qy_b = -d.qy_b;
            }
            distributed.push_back(d);
        }
        for (LocalPoint p : loads.points_on(m)) {
            if (reversed)
                p = {length - p.a, -p.px, p.py, p.mz};
            else
                p.py = -p.py;
            p.mz = -p.mz;
            points.push_back(p);
        }
    }
};

struct Tolerances {
    double position = 0.0;   ///< m
    double force = 0.0;      ///< N
    double intensity = 0.0;  ///< N/m
    double moment = 0.0;     ///< N*m
};

/// The summed intensities (qx, qy) at t, just before it (side -1) or just after
/// it (+1); loads shorter than the tolerance are nil on either side.
std::array<double, 2> intensity_at(std::span<const LocalDistributed> loads, double t, double side,
                                   double tol) {
    std::array<double, 2> q{};
    double u = t + side * tol;
    for (const LocalDistributed& l : loads) {
        if (l.b - l.a <= tol || u <= l.a || u >= l.b)
            continue;
        double r = std::clamp((t - l.a) / (l.b - l.a), 0.0, 1.0);
        q[0] += l.qx_a + (l.qx_b - l.qx_a) * r;
        q[1] += l.qy_a + (l.qy_b - l.qy_a) * r;
    }
    return q;
}

/// Whether the two lists hold the same loads in the same order: the usual
/// case, and much cheaper to confirm than the functions.
bool same_list(std::span<const LocalDistributed> a, std::span<const LocalDistributed> b,
               const Tolerances& tol) {
    if (a.size() != b.size())
        return false;
    for (std::size_t i = 0; i < a.size(); ++i) {
        const LocalDistributed &p = a[i], &q = b[i];
        if (!close(p.a, q.a, tol.position) || !close(p.b, q.b, tol.position) ||
            !close(p.qx_a, q.qx_a, tol.intensity) || !close(p.qx_b, q.qx_b, tol.intensity) ||
            !close(p.qy_a, q.qy_a, tol.intensity) || !close(p.qy_b, q.qy_b, tol.intensity))
            return false;
    }
    return true;
}

bool same_distributed(std::span<const LocalDistributed> a, std::span<const LocalDistributed> b,
                      const Tolerances& tol) {
    if (same_list(a, b, tol))
        return true;
    auto agree_at = [&](double t) {
        for (double side : {-1.0, 1.0}) {
            auto qa = intensity_at(a, t, side, tol.position);
            auto qb = intensity_at(b, t, side, tol.position);
            if (!close(qa[0], qb[0], tol.intensity) || !close(qa[1], qb[1], tol.intensity))
                return false;
        }
        return true;
    };
    for (auto loads : {a, b}) {
        for (const LocalDistributed& l : loads) {
            if (!agree_at(l.a) || !agree_at(l.b))
                return false;
        }
    }
    return true;
}

/// The point actions (px, py, mz) within the tolerance of t, summed.
std::array<double, 3> points_at(std::span<const LocalPoint> points, double t, double tol) {
    std::array<double, 3> sum{};
    for (const LocalPoint& p : points) {
        if (close(p.a, t, tol)) {
            sum[0] += p.px;
            sum[1] += p.py;
            sum[2] += p.mz;
        }
    }
    return sum;
}

bool same_points(std::span<const LocalPoint> a, std::span<const LocalPoint> b,
                 const Tolerances& tol) {
    for (auto points : {a, b}) {
        for (const LocalPoint& p : points) {
            auto pa = points_at(a, p.a, tol.position);
            auto pb = points_at(b, p.a, tol.position);
            if (!close(pa[0], pb[0], tol.force) || !close(pa[1], pb[1], tol.force) ||
                !close(pa[2], pb[2], tol.moment))
                return false;
        }
    }
    return true;
}

/// A weight in [1, 2) for an orbit (a member or node and its image share it),
/// from the splitmix64 finaliser, so that different load patterns rarely share
/// a fingerprint.
double orbit_weight(std::size_t orbit, std::uint64_t salt) {
    std::uint64_t z = static_cast<std::uint64_t>(orbit) * 0x9E3779B97F4A7C15ULL + salt;
    z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9ULL;
    z = (z ^ (z >> 27)) * 0x94D049BB133111EBULL;
    z ^= z >> 31;
    return 1.0 + static_cast<double>(z >> 11) * 0x1.0p-53;
}

/// What the case comparison needs of the model, computed once.
struct MirrorContext {
    const Mirror& mirror;
    double size = 1.0;
    std::vector<double> lengths;
    std::vector<double> member_weight, node_weight;  ///< equal for an entity and its image

    MirrorContext(const Model& model, const Mirror& m, double frame_size)
        : mirror(m), size(frame_size) {
        for (std::size_t i = 0; i < model.members.size(); ++i) {
            lengths.push_back(member_geometry(model, make_id<MemberId>(i)).length);
            member_weight.push_back(orbit_weight(std::min(i, at(*m.member[i])), 1));
        }
        for (std::size_t n = 0; n < model.nodes.size(); ++n)
            node_weight.push_back(orbit_weight(std::min(n, at(*m.node[n])), 2));
    }
};

bool has_member_loads(const CaseLoads& loads, MemberId m) {
    return !loads.distributed_on(m).empty() || !loads.points_on(m).empty();
}

/// Scalars of one case that the mirror leaves unchanged, and where its loads are.
struct CaseSummary {
    double fingerprint = 0.0;
    double scale = 0.0;  ///< N: largest force, intensity x size, or moment / size
    std::size_t load_count = 0;
    std::vector<std::uint32_t> members, nodes;  ///< loaded ones, ascending
};

/// Whether case d's nodal load at `image` is the image of case c's at node n.
bool nodal_mirrors(const CaseLoads& c, std::size_t n, const CaseLoads& d, std::size_t image,
                   const Tolerances& tol) {
    const double* f = &c.nodal[n * 3];
    const double* g = &d.nodal[image * 3];
    return close(-f[dof_x], g[dof_x], tol.force) && close(f[dof_y], g[dof_y], tol.force) &&
           close(-f[dof_rotation], g[dof_rotation], tol.moment);
}

/// Whether case d's loads on the image of member i are the image of case c's on i.
bool member_loads_mirror(const MirrorContext& ctx, const CaseLoads& c, const CaseLoads& d,
                         std::size_t i, const Tolerances& tol, Imaged& scratch) {
    MemberId image = *ctx.mirror.member[i];
    scratch.take(c, make_id<MemberId>(i), ctx.lengths[i], ctx.mirror.member_reversed[i]);
    return same_distributed(scratch.distributed, d.distributed_on(image), tol) &&
           same_points(scratch.points, d.points_on(image), tol);
}

/// Whether case d holds exactly the mirror image of case c's loads: each loaded
/// node and member of either is compared with its image in the other.
bool case_mirrors(const MirrorContext& ctx, const CaseLoads& c, const CaseSummary& sc,
                  const CaseLoads& d, const CaseSummary& sd, const Tolerances& tol,
                  Imaged& scratch) {
    for (std::uint32_t n : sc.nodes) {
        if (!nodal_mirrors(c, n, d, at(*ctx.mirror.node[n]), tol))
            return false;
    }
    for (std::uint32_t n : sd.nodes) {
        if (!nodal_mirrors(c, at(*ctx.mirror.node[n]), d, n, tol))
            return false;
    }
    for (std::uint32_t i : sc.members) {
        if (!member_loads_mirror(ctx, c, d, i, tol, scratch))
            return false;
    }
    for (std::uint32_t j : sd.members) {
        MemberId i = *ctx.mirror.member[j];
        if (!has_member_loads(c, i) && !member_loads_mirror(ctx, c, d, at(i), tol, scratch))
            return false;
    }
    return true;
}

// ------------------------------------------------------------ fingerprints

/// Resultants of one member's loads: forces along and across it and their
/// moments about its middle, each of which at most changes sign under the
/// mirror (the rules above), so their magnitudes are kept.
struct MemberTotals {
    double rx = 0.0, ry = 0.0, axial_moment = 0.0, moment = 0.0;
    double peak = 0.0;  ///< N, as CaseSummary::scale
};

MemberTotals member_totals(const CaseLoads& loads, MemberId m, double length, double size) {
    MemberTotals t;
    double mid = 0.5 * length;
    for (const LocalDistributed& d : loads.distributed_on(m)) {
        double h = d.b - d.a, ka = 2.0 * d.a + d.b - 3.0 * mid, kb = d.a + 2.0 * d.b - 3.0 * mid;
        t.rx += 0.5 * h * (d.qx_a + d.qx_b);
        t.ry += 0.5 * h * (d.qy_a + d.qy_b);
        t.axial_moment += h / 6.0 * (d.qx_a * ka + d.qx_b * kb);  // integral of q (s - mid)
        t.moment += h / 6.0 * (d.qy_a * ka + d.qy_b * kb);
        for (double q : {d.qx_a, d.qx_b, d.qy_a, d.qy_b})
            t.peak = std::max(t.peak, std::abs(q) * size);
    }
    for (const LocalPoint& p : loads.points_on(m)) {
        t.rx += p.px;
        t.ry += p.py;
        t.axial_moment += p.px * (p.a - mid);
        t.moment += p.py * (p.a - mid) + p.mz;
        t.peak = std::max({t.peak, std::abs(p.px), std::abs(p.py), std::abs(p.mz) / size});
    }
    return t;
}

CaseSummary summarize(const MirrorContext& ctx, const CaseLoads& loads) {
    CaseSummary s;
    for (std::size_t i = 0; i < ctx.lengths.size(); ++i) {
        MemberId m = make_id<MemberId>(i);
        if (!has_member_loads(loads, m))
            continue;
        s.members.push_back(static_cast<std::uint32_t>(i));
        MemberTotals t = member_totals(loads, m, ctx.lengths[i], ctx.size);
        double moments = 0.6 * std::abs(t.axial_moment) + 0.9 * std::abs(t.moment);
        s.fingerprint +=
            ctx.member_weight[i] * (std::abs(t.rx) + 0.7 * std::abs(t.ry) + moments / ctx.size);
        s.scale = std::max(s.scale, t.peak);
    }
    for (std::size_t n = 0; n < ctx.node_weight.size(); ++n) {
        const double* f = &loads.nodal[n * 3];
        if (f[dof_x] == 0.0 && f[dof_y] == 0.0 && f[dof_rotation] == 0.0)
            continue;
        s.nodes.push_back(static_cast<std::uint32_t>(n));
        double mz = std::abs(f[dof_rotation]) / ctx.size;
        s.fingerprint +=
            ctx.node_weight[n] * (std::abs(f[dof_x]) + 0.7 * std::abs(f[dof_y]) + 0.9 * mz);
        s.scale = std::max({s.scale, std::abs(f[dof_x]), std::abs(f[dof_y]), mz});
    }
    s.load_count = s.nodes.size() + loads.distributed.size() + loads.points.size();
    return s;
}

Tolerances tolerances(const MirrorContext& ctx, const CaseSummary& a, const CaseSummary& b) {
    double force = kTol * std::max(a.scale, b.scale);
    return {kTol * ctx.size, force, force / ctx.size, force * ctx.size};
}

/// Cases whose fingerprint is close to case c's: c first, then in declaration order.
std::vector<std::size_t> candidates(const std::vector<std::pair<double, std::size_t>>& sorted,
                                    const CaseSummary& s, std::size_t c) {
    double tol = kCandidateTol * s.scale * static_cast<double>(s.load_count + 1);
    auto it = std::lower_bound(sorted.begin(), sorted.end(),
                               std::pair{s.fingerprint - tol, std::size_t{0}});
    std::vector<std::size_t> out{c};
    for (; it != sorted.end() && it->first <= s.fingerprint + tol; ++it) {
        if (it->second != c)
            out.push_back(it->second);
    }
    std::sort(out.begin() + 1, out.end());
    return out;
}

/// Cases are independent of each other, so they are summarized and matched in
/// parallel; each writes only its own entry, so the result does not depend on threads.
std::vector<std::optional<CaseId>> mirror_cases(const MirrorContext& ctx, const LoadSet& loads) {
    std::size_t count = loads.cases.size();
    std::vector<CaseSummary> summaries(count);
    for_each_chunk(count, [&](std::size_t begin, std::size_t end) {
        for (std::size_t c = begin; c < end; ++c)
            summaries[c] = summarize(ctx, loads.cases[c]);
    });
    std::vector<std::pair<double, std::size_t>> sorted;
    for (std::size_t c = 0; c < count; ++c)
        sorted.push_back({summaries[c].fingerprint, c});
    std::sort(sorted.begin(), sorted.end());
    std::vector<std::optional<CaseId>> out(count);
    for_each_chunk(count, [&](std::size_t begin, std::size_t end) {
        Imaged scratch;
        for (std::size_t c = begin; c < end; ++c) {
            for (std::size_t d : candidates(sorted, summaries[c], c)) {
                Tolerances tol = tolerances(ctx, summaries[c], summaries[d]);
                if (case_mirrors(ctx, loads.cases[c], summaries[c], loads.cases[d], summaries[d],
                                 tol, scratch)) {
                    out[c] = make_id<CaseId>(d);
                    break;
                }
            }
        }
    });
    return out;
}

}  // namespace

Mirror find_mirror(const Model& model, const LoadSet& loads) {
    Mirror mirror;
    if (model.members.empty())
        return mirror;
    Extent extent = frame_extent(model);
    if (!map_nodes(model, extent, mirror) || !map_members(model, mirror) ||
        !supports_mirror(model, mirror))
        return Mirror{};
    mirror.symmetric = true;
    mirror.axis = extent.axis;
    MirrorContext ctx(model, mirror, extent.size);
    mirror.case_mirror = mirror_cases(ctx, loads);
    return mirror;
}

}  // namespace firn
