// results: exact member functions, summaries, reactions and equilibrium.
//
// A member's end forces come from its end displacements (element.hpp). From
// the start end, the loads are integrated piece by piece: N' = -qx, V' = qy,
// M' = V, and EI v'' = M, so every piece is an exact polynomial. Summaries
// look at piece ends (both sides of each jump) and at the real roots of each
// derivative, never at samples.
#include "ir/results.hpp"

#include <algorithm>
#include <cmath>
#include <span>
#include <type_traits>

#include "analyse/analyse.hpp"
#include "analyse/element.hpp"
#include "analyse/results_internal.hpp"
#include "base/parallel.hpp"
#include "base/polynomial.hpp"

namespace firn {

MemberInfo member_info(const Model& model, MemberId id) {
    const Member& m = model.members[at(id)];
    return MemberInfo{element_properties(model, id), member_geometry(model, id), at(m.start),
                      at(m.end)};
}

std::vector<MemberInfo> member_infos(const Model& model) {
    std::vector<MemberInfo> out(model.members.size());
    for (std::size_t i = 0; i < model.members.size(); ++i)
        out[i] = member_info(model, make_id<MemberId>(i));
    return out;
}

ElementVector local_displacements(const Solution& s, CaseId c, const MemberInfo& m) {
    const double* u = s.displacements.data() + at(c) * s.node_count * 3;
    ElementVector global{u[m.start * 3], u[m.start * 3 + 1], u[m.start * 3 + 2],
                         u[m.end * 3],   u[m.end * 3 + 1],   u[m.end * 3 + 2]};
    return to_local(global, m.geometry);
}

namespace {

/// Piece boundaries: the ends and every load start, end and point, sorted,
/// with near-coincident positions (closer than `tolerance`) merged.
void collect_breaks(double length, double tolerance, std::span<const LocalDistributed> spread,
                    std::span<const LocalPoint> points, std::vector<double>& breaks) {
    breaks.assign({0.0, length});
    if (spread.empty() && points.empty())
        return;  // the usual case: one piece
    for (const LocalDistributed& q : spread) {
        breaks.push_back(std::clamp(q.a, 0.0, length));
        breaks.push_back(std::clamp(q.b, 0.0, length));
    }
    for (const LocalPoint& p : points)
        breaks.push_back(std::clamp(p.a, 0.0, length));
    std::sort(breaks.begin(), breaks.end());
    auto close = [tolerance](double a, double b) { return b - a <= tolerance; };
    breaks.erase(std::unique(breaks.begin(), breaks.end(), close), breaks.end());
    breaks.back() = length;  // the last group holds the end; keep its exact position
}

/// Internal actions at the start of a piece, carried from piece to piece.
struct Carried {
    double n = 0.0, v = 0.0, m = 0.0;  ///< N, V, M
    double w = 0.0, slope = 0.0;       ///< deflection from the start tangent, and its slope
};

/// The jumps of N, V and M where point actions sit (at the piece start `s0`).
void apply_points(std::span<const LocalPoint> points, double s0, bool first, double tolerance,
                  Carried& at_start) {
    for (const LocalPoint& p : points) {
        bool here = first ? p.a <= s0 + tolerance : std::abs(p.a - s0) <= tolerance;
        if (!here)
            continue;
        at_start.n -= p.px;
        at_start.v += p.py;
        at_start.m -= p.mz;
    }
}

/// The summed distributed load on [s0, s1] as qx0 + qx1 t, qy0 + qy1 t.
std::array<double, 4> load_on_piece(std::span<const LocalDistributed> spread, double s0, double s1,
                                    double tolerance) {
    std::array<double, 4> q{};
    for (const LocalDistributed& d : spread) {
        if (d.a > s0 + tolerance || d.b < s1 - tolerance || d.b <= d.a)
            continue;
        double run = d.b - d.a;
        double sx = (d.qx_b - d.qx_a) / run, sy = (d.qy_b - d.qy_a) / run;
        q[0] += d.qx_a + sx * (s0 - d.a);
        q[1] += sx;
        q[2] += d.qy_a + sy * (s0 - d.a);
        q[3] += sy;
    }
    return q;
}

/// One piece's exact polynomials from the values at its start and its load.
FunctionPiece make_piece(double s0, double s1, const Carried& c, const std::array<double, 4>& q,
                         double bending_rigidity) {
    Polynomial shear{{c.v, q[2], 0.5 * q[3], 0.0, 0.0, 0.0}};
    Polynomial moment = antiderivative(shear);
    moment.c[0] = c.m;
    Polynomial curvature{{moment.c[0] / bending_rigidity, moment.c[1] / bending_rigidity,
                          moment.c[2] / bending_rigidity, moment.c[3] / bending_rigidity, 0.0,
                          0.0}};
    Polynomial slope = antiderivative(curvature);
    slope.c[0] = c.slope;
    Polynomial deflection = antiderivative(slope);
    deflection.c[0] = c.w;
    // Built whole rather than filled in: this runs for every member in every case.
    return FunctionPiece{s0,    s1,     Polynomial{{c.n, -q[0], -0.5 * q[1], 0.0, 0.0, 0.0}},
                         shear, moment, deflection};
}

}  // namespace

void build_functions(const MemberInfo& m, std::span<const LocalDistributed> spread,
                     std::span<const LocalPoint> points, const ElementVector& forces, Scratch& s) {
    double length = m.geometry.length, tolerance = 1e-12 * length;
    collect_breaks(length, tolerance, spread, points, s.breaks);
    s.pieces.clear();
    s.ends.clear();
    Carried c{-forces[0], forces[1], -forces[2], 0.0, 0.0};
    for (std::size_t i = 0; i + 1 < s.breaks.size(); ++i) {
        double s0 = s.breaks[i], s1 = s.breaks[i + 1], h = s1 - s0;
        apply_points(points, s0, i == 0, tolerance, c);
        FunctionPiece p = make_piece(s0, s1, c, load_on_piece(spread, s0, s1, tolerance),
                                     m.properties.bending_rigidity);
        // Degrees by construction: N and V at most 2, M 3, deflection 5.
        c = Carried{evaluate(p.axial, 2, h), evaluate(p.shear, 2, h), evaluate(p.moment, 3, h),
                    p.deflection(h), evaluate(derivative(p.deflection), 4, h)};
        s.pieces.push_back(p);
        s.ends.push_back(PieceEnd{c.n, c.v, c.m, c.w});
    }
    // Measure the deflection from the chord through the displaced ends.
    double chord_slope = c.w / length;
    for (std::size_t i = 0; i < s.pieces.size(); ++i) {
        FunctionPiece& p = s.pieces[i];
        p.deflection.c[0] -= chord_slope * p.a;
        p.deflection.c[1] -= chord_slope;
        s.ends[i].w -= chord_slope * p.b;
    }
}

namespace {

/// Calls visit(t, value) at both ends of [0, h] (p(h) = end) and wherever p'
/// vanishes inside.
template <typename Visit>
void visit_stationary(const Polynomial& p, const Polynomial& dp, double h, double end,
                      Visit visit) {
    visit(0.0, p.c[0]);
    RealRoots roots = real_roots(dp, 0.0, h);
    for (std::size_t i = 0; i < roots.count; ++i) {
        if (roots.x[i] > 0.0 && roots.x[i] < h)
            visit(roots.x[i], p(roots.x[i]));
    }
    visit(h, end);
}

/// Which function a candidate value belongs to, passed as a type so that the
/// code keeping each candidate is chosen at compile time.
template <Function F>
using FunctionTag = std::integral_constant<Function, F>;

/// A candidate's place on its piece: the N, V and M acting there, taken on the
/// candidate's own side of a jump (the piece's end values at its end, as the
/// candidate's value is).
struct CandidatePlace {
    const FunctionPiece& piece;
    const PieceEnd& end;
    double t, h;

    std::array<double, 3> actions() const {
        if (t >= h)
            return {end.n, end.v, end.m};
        return {piece.axial(t), piece.shear(t), piece.moment(t)};
    }
};

/// Calls visit(FunctionTag, position, value, CandidatePlace) at every place an
/// extreme of a member function can be: both sides of each piece end and each
/// stationary point, piece by piece from the start node.
template <typename Visit>
void visit_candidates(const Scratch& functions, Visit visit) {
    for (std::size_t i = 0; i < functions.pieces.size(); ++i) {
        const FunctionPiece& p = functions.pieces[i];
        const PieceEnd& end = functions.ends[i];
        double h = p.b - p.a;
        auto of = [&](auto tag) {
            return [&, tag](double t, double v) {
                visit(tag, p.a + t, v, CandidatePlace{p, end, t, h});
            };
        };
        visit_stationary(p.moment, p.shear, h, end.m, of(FunctionTag<f_moment>{}));
        visit_stationary(p.shear, derivative(p.shear), h, end.v, of(FunctionTag<f_shear>{}));
        visit_stationary(p.axial, derivative(p.axial), h, end.n, of(FunctionTag<f_axial>{}));
        visit_stationary(p.deflection, derivative(p.deflection), h, end.w,
                         of(FunctionTag<f_deflection>{}));
    }
}

void keep_largest(Extreme& e, double value, double position, double tie) {
    if (value > e.value + tie)
        e = Extreme{value, position};
}
void keep_smallest(Extreme& e, double value, double position, double tie) {
    if (value < e.value - tie)
        e = Extreme{value, position};
}
void keep_largest_magnitude(Extreme& e, double value, double position, double tie) {
    if (std::abs(value) > std::abs(e.value) + tie)
        e = Extreme{value, position};
}

/// The tie tolerance of each function (ORDER FUNCTION): kTie times its largest
/// |value| at the piece ends.
std::array<double, 4> tie_tolerances(const Scratch& functions) {
    std::array<double, 4> scale{};
    for (std::size_t i = 0; i < functions.pieces.size(); ++i) {
        const FunctionPiece& p = functions.pieces[i];
        const PieceEnd& e = functions.ends[i];
        scale[0] = std::max({scale[0], std::abs(p.axial.c[0]), std::abs(e.n)});
        scale[1] = std::max({scale[1], std::abs(p.shear.c[0]), std::abs(e.v)});
        scale[2] = std::max({scale[2], std::abs(p.moment.c[0]), std::abs(e.m)});
        scale[3] = std::max({scale[3], std::abs(p.deflection.c[0]), std::abs(e.w)});
    }
    for (double& t : scale)
        t *= kTie;
    return scale;
}

/// The summary's end values, and the tolerances for its extremes.
std::array<double, 4> start_summary(const Scratch& functions, MemberSummary& s) {
    const FunctionPiece& first = functions.pieces.front();
    const PieceEnd& last = functions.ends.back();
    s.start = {first.axial.c[0], first.shear.c[0], first.moment.c[0]};
    s.end = {last.n, last.v, last.m};
    return tie_tolerances(functions);
}

/// Keeps a candidate of function F in the summary.
template <Function F>
void keep_in_summary(MemberSummary& s, double position, double v, double tie) {
    if constexpr (F == f_moment) {
        keep_largest(s.moment_max, v, position, tie);
        keep_smallest(s.moment_min, v, position, tie);
    } else if constexpr (F == f_shear) {
        keep_largest_magnitude(s.shear_max, v, position, tie);
    } else if constexpr (F == f_axial) {
        keep_largest(s.axial_max, v, position, tie);
        keep_smallest(s.axial_min, v, position, tie);
    } else {
        keep_largest_magnitude(s.deflection_max, v, position, tie);
    }
}

}  // namespace

MemberSummary summarize(const Scratch& functions) {
    MemberSummary s;
    std::array<double, 4> tie = start_summary(functions, s);
    visit_candidates(functions, [&](auto tag, double position, double v, const CandidatePlace&) {
        constexpr Function f = decltype(tag)::value;
        keep_in_summary<f>(s, position, v, tie[f]);
    });
    return s;
}

MemberSummary summarize(const Scratch& functions, FunctionExtremes& extremes) {
    MemberSummary s;
    extremes = FunctionExtremes{};
    std::array<double, 4> tie = start_summary(functions, s);
    visit_candidates(functions,
                     [&](auto tag, double position, double v, const CandidatePlace& place) {
                         constexpr Function f = decltype(tag)::value;
                         keep_in_summary<f>(s, position, v, tie[f]);
                         // The forces acting with an extreme are read only when it is replaced,
                         // which happens a few times per member, not at every candidate.
                         if (v > extremes.max[f].value + tie[f]) {
                             extremes.max[f] = Extreme{v, position};
                             extremes.max_with[f] = place.actions();
                         }
                         if (v < extremes.min[f].value - tie[f]) {
                             extremes.min[f] = Extreme{v, position};
                             extremes.min_with[f] = place.actions();
                         }
                     });
    return s;
}

namespace {

/// Everything a case needs besides the model, shared by all workers.
struct Context {
    const Model& model;
    const LoadSet& loads;
    const Solution& solution;
    std::vector<MemberInfo> members;
    std::vector<std::ptrdiff_t> support_at;  ///< per node: a support index, or -1
};

/// Local end forces of member m in case c (released rotations filled in).
ElementVector end_forces(const MemberInfo& info, const CaseLoads& cl, const Solution& solution,
                         CaseId c, MemberId m) {
    ElementVector f = consistent_loads(info.properties, cl.distributed_on(m), cl.points_on(m));
    return local_end_forces(info.properties, local_displacements(solution, c, info), f);
}

/// Sums of the global forces the supported nodes' members pull on them with.
void add_member_ends(const Context& x, const MemberInfo& m, const ElementVector& local_forces,
                     std::vector<std::array<double, 3>>& node_sums) {
    ElementVector g = to_global(local_forces, m.geometry);
    for (std::size_t end = 0; end < 2; ++end) {
        std::ptrdiff_t support = x.support_at[end == 0 ? m.start : m.end];
        if (support < 0)
            continue;
        auto& sum = node_sums[static_cast<std::size_t>(support)];
        for (std::size_t d = 0; d < 3; ++d)
            sum[d] += g[end * 3 + d];
    }
}

/// The force each support applies to the structure: what the members need at
/// the node less what is applied there (fixed), or -k u (spring), or 0 (free).
void support_reactions(const Context& x, CaseId c,
                       const std::vector<std::array<double, 3>>& node_sums,
                       std::vector<std::array<double, 3>>& reactions) {
    const CaseLoads& cl = x.loads.cases[at(c)];
    reactions.assign(x.model.supports.size(), {0.0, 0.0, 0.0});
    for (std::size_t i = 0; i < x.model.supports.size(); ++i) {
        const Support& s = x.model.supports[i];
        std::size_t node = at(s.node);
        for (std::size_t d = 0; d < 3; ++d) {
            const Restraint& r = s.restraint[d];
            if (r.kind == Restraint::Kind::fixed) {
                reactions[i][d] = node_sums[i][d] - cl.nodal[node * 3 + d];
            } else if (r.kind == Restraint::Kind::spring) {
                reactions[i][d] =
                    -r.stiffness * x.solution.displacement(c, s.node, static_cast<Dof>(d));
            }
        }
    }
}

/// Running sums of forces and moments about the global origin, with the sums
/// of their magnitudes as the scale of the round-off to expect.
struct Totals {
    std::array<double, 3> sum{};
    double force_scale = 0.0, moment_scale = 0.0;

    /// A global force (fx, fy) at (px, py) plus a couple `moment`.
    void add(double px, double py, double fx, double fy, double moment) {
        sum[0] += fx;
        sum[1] += fy;
        sum[2] += px * fy - py * fx + moment;
        force_scale += std::abs(fx) + std::abs(fy);
        moment_scale += std::abs(px * fy) + std::abs(py * fx) + std::abs(moment);
    }
};

/// Adds a member's loads, turned back to global: each distributed load as
/// its resultant at its start node plus the couple of its first moment.
void add_member_loads(const Model& model, const MemberInfo& m,
                      std::span<const LocalDistributed> spread, std::span<const LocalPoint> points,
                      Totals& t) {
    const Node& start = model.nodes[m.start];
    double c = m.geometry.c, s = m.geometry.s;
    for (const LocalDistributed& q : spread) {
        double run = q.b - q.a;
        double fx = 0.5 * (q.qx_a + q.qx_b) * run, fy = 0.5 * (q.qy_a + q.qy_b) * run;
        // Only qy has a moment arm along the member: the integral of x qy.
        double first_moment = run / 6.0 * (q.qy_a * (2.0 * q.a + q.b) + q.qy_b * (q.a + 2.0 * q.b));
        t.add(start.x, start.y, c * fx - s * fy, s * fx + c * fy, first_moment);
    }
    for (const LocalPoint& p : points) {
        t.add(start.x + c * p.a, start.y + s * p.a, c * p.px - s * p.py, s * p.px + c * p.py, p.mz);
    }
}

Equilibrium check_equilibrium(const Context& x, CaseId c,
                              const std::vector<std::array<double, 3>>& reactions) {
    const CaseLoads& cl = x.loads.cases[at(c)];
    Totals applied, resisting;
    for (std::size_t n = 0; n < x.model.nodes.size(); ++n) {
        const Node& node = x.model.nodes[n];
        applied.add(node.x, node.y, cl.nodal[n * 3], cl.nodal[n * 3 + 1], cl.nodal[n * 3 + 2]);
    }
    for (std::size_t m = 0; m < x.members.size(); ++m) {
        MemberId id = make_id<MemberId>(m);
        add_member_loads(x.model, x.members[m], cl.distributed_on(id), cl.points_on(id), applied);
    }
    for (std::size_t i = 0; i < reactions.size(); ++i) {
        const Node& node = x.model.nodes[at(x.model.supports[i].node)];
        resisting.add(node.x, node.y, reactions[i][0], reactions[i][1], reactions[i][2]);
    }
    Equilibrium e{applied.sum, resisting.sum, 0.0};
    double force_scale = applied.force_scale + resisting.force_scale;
    double moment_scale = applied.moment_scale + resisting.moment_scale;
    for (std::size_t d = 0; d < 3; ++d) {
        double scale = d < 2 ? force_scale : moment_scale;
        double residual = std::abs(e.applied[d] + e.reactions[d]);
        if (scale > 0.0)
            e.relative_residual = std::max(e.relative_residual, residual / scale);
    }
    return e;
}

CaseResults case_results(const Context& x, CaseId c, Scratch& scratch,
                         std::vector<std::array<double, 3>>& node_sums) {
    CaseResults out;
    const CaseLoads& cl = x.loads.cases[at(c)];
    node_sums.assign(x.model.supports.size(), {0.0, 0.0, 0.0});
    out.members.resize(x.members.size());
    for (std::size_t m = 0; m < x.members.size(); ++m) {
        MemberId id = make_id<MemberId>(m);
        ElementVector forces = end_forces(x.members[m], cl, x.solution, c, id);
        add_member_ends(x, x.members[m], forces, node_sums);
        build_functions(x.members[m], cl.distributed_on(id), cl.points_on(id), forces, scratch);
        out.members[m] = summarize(scratch);
    }
    support_reactions(x, c, node_sums, out.reactions);
    out.displacements.resize(x.model.nodes.size());
    for (std::size_t n = 0; n < x.model.nodes.size(); ++n) {
        for (std::size_t d = 0; d < 3; ++d) {
            out.displacements[n][d] =
                x.solution.displacement(c, make_id<NodeId>(n), static_cast<Dof>(d));
        }
    }
    out.equilibrium = check_equilibrium(x, c, out.reactions);
    return out;
}

/// For each node, the first support at it (or -1).
std::vector<std::ptrdiff_t> supports_by_node(const Model& model) {
    std::vector<std::ptrdiff_t> out(model.nodes.size(), -1);
    for (std::size_t i = model.supports.size(); i-- > 0;) {
        out[at(model.supports[i].node)] = static_cast<std::ptrdiff_t>(i);
    }
    return out;
}

}  // namespace

Results compute_results(const Model& model, const LoadSet& loads, const Solution& solution) {
    Results results;
    if (!solution.ok)
        return results;  // an unstable structure has no results to show
    Context x{model, loads, solution, member_infos(model), supports_by_node(model)};
    results.cases.resize(loads.cases.size());
    results.rotation_free = solution.rotation_free;
    for_each_chunk(loads.cases.size(), [&](std::size_t first, std::size_t last) {
        Scratch scratch;
        std::vector<std::array<double, 3>> node_sums;
        for (std::size_t c = first; c < last; ++c) {
            results.cases[c] = case_results(x, make_id<CaseId>(c), scratch, node_sums);
        }
    });
    return results;
}

MemberFunctions member_functions(const Model& model, const CaseLoads& loads,
                                 const Solution& solution, CaseId c, MemberId m) {
    MemberInfo info = member_info(model, m);
    ElementVector forces = end_forces(info, loads, solution, c, m);
    Scratch scratch;
    build_functions(info, loads.distributed_on(m), loads.points_on(m), forces, scratch);
    return MemberFunctions{std::move(scratch.pieces)};
}

}  // namespace firn
