// second_order: one combination solved with second-order effects.
//
// The combination's loads are summed once (with its notional loads); each
// iteration assembles the frame's stiffness with every member's stiffness under
// its current axial force (stability.hpp: P-Delta through the chord term, P-delta
// through the stability functions), factors it (one LDL^T alive at a time),
// solves, and takes the members' axial forces from the new end forces. A member
// past its own buckling load or a non-positive pivot means the combination is
// beyond the frame's critical load; the critical load factor is then found by
// bisection on whether the stiffness at a multiple of the axial forces is
// positive definite (Sylvester's law of inertia: the LDL^T pivots have the
// signs of the eigenvalues).
#include "analyse/analyse.hpp"

#include <fmt/format.h>
#include <Eigen/Core>
#include <Eigen/SparseCholesky>
#include <Eigen/SparseCore>
#include <algorithm>
#include <cmath>
#include <cstdint>
#include <vector>

#include "analyse/beam_column.hpp"
#include "analyse/results_internal.hpp"
#include "analyse/stability.hpp"

namespace firn {
namespace {

using SparseMatrix = Eigen::SparseMatrix<double, Eigen::ColMajor, int>;
/// The one factorization of a worker, with its pattern analysed once.
struct Factor {
    Eigen::SimplicialLDLT<SparseMatrix, Eigen::Lower> ldlt;
    bool analysed = false;
};

constexpr std::int64_t no_equation = -1;

/// Critical load factors are found to this relative accuracy.
constexpr double kCriticalAccuracy = 1e-10;
/// Above this factor the frame is taken to have no critical load worth a number.
constexpr double kCriticalCeiling = 1e8;

/// The combination's frame: equations, members with their (reduced)
/// properties, and the summed loads.
struct Frame {
    std::vector<std::int64_t> equation;  ///< 3 per node
    std::size_t count = 0;
    std::vector<MemberInfo> members;
    std::vector<std::array<std::int64_t, 6>> member_equation;
    std::vector<std::array<double, 3>> springs;         ///< per node
    std::vector<double> nodal;                          ///< 3 per node, with notional loads
    std::vector<std::vector<LocalDistributed>> spread;  ///< per member
    std::vector<std::vector<LocalPoint>> points;        ///< per member
};

void number_equations(const Model& model, Frame& f) {
    std::vector<char> joined(model.nodes.size(), 0);
    for (const Member& m : model.members) {
        joined[at(m.start)] |= static_cast<char>(!m.hinge_start);
        joined[at(m.end)] |= static_cast<char>(!m.hinge_end);
    }
    std::vector<std::array<Restraint, 3>> restraint(model.nodes.size());
    for (const Support& s : model.supports)
        restraint[at(s.node)] = s.restraint;
    f.equation.assign(model.nodes.size() * 3, no_equation);
    f.springs.assign(model.nodes.size(), {0.0, 0.0, 0.0});
    for (std::size_t n = 0; n < model.nodes.size(); ++n) {
        for (std::size_t d = 0; d < 3; ++d) {
            const Restraint& r = restraint[n][d];
            if (r.kind == Restraint::Kind::fixed)
                continue;
            bool spring = r.kind == Restraint::Kind::spring && r.stiffness > 0.0;
            if (spring)
                f.springs[n][d] = r.stiffness;
            if (d == dof_rotation && !joined[n] && !spring)
                continue;  // nothing turns it: held at 0, as in solve
            f.equation[n * 3 + d] = static_cast<std::int64_t>(f.count++);
        }
    }
}

void add_members(const Model& model, const SecondOrderOptions& options, Frame& f) {
    f.members = member_infos(model);
    f.member_equation.resize(f.members.size());
    for (std::size_t i = 0; i < f.members.size(); ++i) {
        f.members[i].properties.bending_rigidity *= options.flexural_factor;
        f.members[i].properties.axial_rigidity *= options.axial_factor;
        for (std::size_t d = 0; d < 3; ++d) {
            f.member_equation[i][d] = f.equation[f.members[i].start * 3 + d];
            f.member_equation[i][3 + d] = f.equation[f.members[i].end * 3 + d];
        }
    }
}

/// The combination's factored loads, summed per node and per member.
void add_loads(const Model& model, const LoadSet& loads, const Combination& k, Frame& f) {
    f.nodal.assign(model.nodes.size() * 3, 0.0);
    f.spread.assign(model.members.size(), {});
    f.points.assign(model.members.size(), {});
    for (const CombinationTerm& term : k.terms) {
        const CaseLoads& cl = loads.cases[at(term.case_id)];
        double s = term.factor;
        for (std::size_t i = 0; i < f.nodal.size(); ++i)
            f.nodal[i] += s * cl.nodal[i];
        for (std::size_t m = 0; m < model.members.size(); ++m) {
            for (LocalDistributed q : cl.distributed_on(make_id<MemberId>(m))) {
                q.qx_a *= s, q.qx_b *= s, q.qy_a *= s, q.qy_b *= s;
                f.spread[m].push_back(q);
            }
            for (LocalPoint p : cl.points_on(make_id<MemberId>(m))) {
                p.px *= s, p.py *= s, p.mz *= s;
                f.points[m].push_back(p);
            }
        }
    }
}

/// AISC 360-16 C2.2b: a lateral load of factor x the vertical load at each
/// node (member loads as their first-order nodal equivalents, so the sum over
/// the frame is the whole gravity load), along global x times the direction.
std::vector<double> notional_loads(const Frame& f, const SecondOrderOptions& options) {
    std::vector<double> vertical(f.nodal.size() / 3, 0.0);
    for (std::size_t n = 0; n < vertical.size(); ++n)
        vertical[n] = f.nodal[n * 3 + 1];
    for (std::size_t m = 0; m < f.members.size(); ++m) {
        const MemberInfo& info = f.members[m];
        ElementVector g =
            to_global(consistent_loads(info.properties, f.spread[m], f.points[m]), info.geometry);
        vertical[info.start] += g[1];
        vertical[info.end] += g[4];
    }
    std::vector<double> out(vertical.size(), 0.0);
    for (std::size_t n = 0; n < out.size(); ++n)
        out[n] = -options.notional_factor * options.notional_direction * vertical[n];
    return out;
}

/// The frame's stiffness with each member under scale * axial[m].
SparseMatrix assemble(const Frame& f, const std::vector<double>& axial, double scale) {
    std::vector<Eigen::Triplet<double, int>> triplets;
    triplets.reserve(f.members.size() * 21 + f.count);
    for (std::size_t m = 0; m < f.members.size(); ++m) {
        const MemberInfo& info = f.members[m];
        ElementMatrix k =
            to_global(second_order_stiffness(info.properties, scale * axial[m]), info.geometry);
        const auto& eq = f.member_equation[m];
        for (std::size_t i = 0; i < 6; ++i) {
            for (std::size_t j = 0; j < 6; ++j) {
                // Zeros are kept: every assembly then has the same pattern, which is
                // ordered and analysed once per combination (see factor_positive).
                if (eq[i] == no_equation || eq[j] == no_equation || eq[i] < eq[j])
                    continue;
                triplets.emplace_back(static_cast<int>(eq[i]), static_cast<int>(eq[j]), k[i][j]);
            }
        }
    }
    for (std::size_t n = 0; n < f.springs.size(); ++n) {
        for (std::size_t d = 0; d < 3; ++d) {
            std::int64_t e = f.equation[n * 3 + d];
            if (e != no_equation && f.springs[n][d] > 0.0)
                triplets.emplace_back(static_cast<int>(e), static_cast<int>(e), f.springs[n][d]);
        }
    }
    auto size = static_cast<Eigen::Index>(f.count);
    SparseMatrix k(size, size);
    k.setFromTriplets(triplets.begin(), triplets.end());
    return k;
}

bool members_below_buckling(const Frame& f, const std::vector<double>& axial, double scale) {
    for (std::size_t m = 0; m < f.members.size(); ++m) {
        if (!below_member_buckling(f.members[m].properties, scale * axial[m]))
            return false;
    }
    return true;
}

/// Factors k and says whether it is positive definite: every pivot positive
/// (each kept above round-off of its diagonal).
bool factor_positive(const SparseMatrix& k, Factor& factor) {
    if (k.rows() == 0)
        return true;
    if (!factor.analysed) {
        factor.ldlt.analyzePattern(k);
        factor.analysed = true;
    }
    factor.ldlt.factorize(k);
    if (factor.ldlt.info() != Eigen::Success)
        return false;
    Eigen::VectorXd d = factor.ldlt.vectorD();
    for (Eigen::Index i = 0; i < d.size(); ++i) {
        if (!(d[i] > 0.0))
            return false;
    }
    return true;
}

/// Whether the frame under scale times the axial forces is still stable.
bool stable_at(const Frame& f, const std::vector<double>& axial, double scale, Factor& factor) {
    return members_below_buckling(f, axial, scale) &&
           factor_positive(assemble(f, axial, scale), factor);
}

double critical_factor_of(const Frame& f, const std::vector<double>& axial) {
    bool compressed = std::any_of(axial.begin(), axial.end(), [](double n) { return n < 0.0; });
    if (!compressed)
        return std::numeric_limits<double>::infinity();
    Factor factor;
    double low = 0.0, high = 1.0;
    while (stable_at(f, axial, high, factor)) {
        low = high;
        high *= 2.0;
        if (high > kCriticalCeiling)
            return std::numeric_limits<double>::infinity();
    }
    while (high - low > kCriticalAccuracy * high) {
        double mid = 0.5 * (low + high);
        (stable_at(f, axial, mid, factor) ? low : high) = mid;
    }
    return 0.5 * (low + high);
}

Eigen::VectorXd load_vector(const Frame& f, const std::vector<double>& axial,
                            std::vector<ElementVector>& consistent) {
    Eigen::VectorXd r = Eigen::VectorXd::Zero(static_cast<Eigen::Index>(f.count));
    for (std::size_t i = 0; i < f.nodal.size(); ++i) {
        if (f.equation[i] != no_equation)
            r[f.equation[i]] += f.nodal[i];
    }
    consistent.resize(f.members.size());
    for (std::size_t m = 0; m < f.members.size(); ++m) {
        const MemberInfo& info = f.members[m];
        consistent[m] =
            second_order_consistent_loads(info.properties, axial[m], f.spread[m], f.points[m]);
        if (f.spread[m].empty() && f.points[m].empty())
            continue;
        ElementVector g = to_global(
            second_order_condensed_loads(info.properties, axial[m], consistent[m]), info.geometry);
        for (std::size_t j = 0; j < 6; ++j) {
            if (f.member_equation[m][j] != no_equation)
                r[f.member_equation[m][j]] += g[j];
        }
    }
    return r;
}

/// Node displacements (3 per node) from the solved equations.
std::vector<double> node_displacements(const Frame& f, const Eigen::VectorXd& u) {
    std::vector<double> out(f.equation.size(), 0.0);
    for (std::size_t i = 0; i < out.size(); ++i) {
        if (f.equation[i] != no_equation)
            out[i] = u[f.equation[i]];
    }
    return out;
}

ElementVector member_local(const std::vector<double>& u, const MemberInfo& m) {
    ElementVector g{u[m.start * 3], u[m.start * 3 + 1], u[m.start * 3 + 2],
                    u[m.end * 3],   u[m.end * 3 + 1],   u[m.end * 3 + 2]};
    return to_local(g, m.geometry);
}

/// One iteration's state: displacements, member ends, and the axial forces
/// they imply (the mean of the two ends' N: common practice for the constant
/// force of the stability functions).
struct Iterate {
    std::vector<double> displacements;
    std::vector<SecondOrderEnds> ends;
    std::vector<ElementVector> consistent;
    std::vector<double> used;   ///< the axial forces of this solve's stiffness
    std::vector<double> axial;  ///< the axial forces its end forces give
};

Iterate ends_of(const Frame& f, const std::vector<double>& axial, std::vector<double> u,
                std::vector<ElementVector> consistent) {
    Iterate out{std::move(u), {}, std::move(consistent), axial, {}};
    out.ends.resize(f.members.size());
    out.axial.resize(f.members.size());
    for (std::size_t m = 0; m < f.members.size(); ++m) {
        const MemberInfo& info = f.members[m];
        out.ends[m] = second_order_end_forces(
            info.properties, axial[m], member_local(out.displacements, info), out.consistent[m]);
        out.axial[m] = 0.5 * (-out.ends[m].forces[0] + out.ends[m].forces[3]);
    }
    return out;
}

double relative_change(const std::vector<double>& a, const std::vector<double>& b) {
    double largest = 0.0, change = 0.0;
    for (std::size_t i = 0; i < a.size(); ++i) {
        largest = std::max(largest, std::abs(b[i]));
        change = std::max(change, std::abs(a[i] - b[i]));
    }
    return largest > 0.0 ? change / largest : change;
}

}  // namespace

namespace {

Frame make_frame(const Model& model, const LoadSet& loads, const Combination& combination,
                 const SecondOrderOptions& options, std::vector<double>& notional) {
    Frame f;
    number_equations(model, f);
    add_members(model, options, f);
    add_loads(model, loads, combination, f);
    notional = notional_loads(f, options);
    for (std::size_t n = 0; n < notional.size(); ++n)
        f.nodal[n * 3] += notional[n];
    return f;
}

/// The reactions: what the members need at a supported node less what is
/// applied there (fixed), -k u (spring), 0 (free).
std::vector<std::array<double, 3>> reactions_of(const Model& model, const Frame& f,
                                                const Iterate& it) {
    std::vector<std::array<double, 3>> sums(model.nodes.size(), {0.0, 0.0, 0.0});
    for (std::size_t m = 0; m < f.members.size(); ++m) {
        ElementVector g = to_global(it.ends[m].forces, f.members[m].geometry);
        for (std::size_t d = 0; d < 3; ++d) {
            sums[f.members[m].start][d] += g[d];
            sums[f.members[m].end][d] += g[3 + d];
        }
    }
    std::vector<std::array<double, 3>> out(model.supports.size(), {0.0, 0.0, 0.0});
    for (std::size_t i = 0; i < model.supports.size(); ++i) {
        std::size_t n = at(model.supports[i].node);
        for (std::size_t d = 0; d < 3; ++d) {
            const Restraint& r = model.supports[i].restraint[d];
            if (r.kind == Restraint::Kind::fixed)
                out[i][d] = sums[n][d] - f.nodal[n * 3 + d];
            else if (r.kind == Restraint::Kind::spring)
                out[i][d] = -r.stiffness * it.displacements[n * 3 + d];
        }
    }
    return out;
}

/// Force equilibrium (moments balance only about the deflected geometry, which
/// the check does not rebuild): applied loads and reactions, Fx and Fy.
Equilibrium force_equilibrium(const Frame& f, const std::vector<std::array<double, 3>>& reactions) {
    Equilibrium e;
    double scale = 0.0;
    for (std::size_t n = 0; n < f.nodal.size() / 3; ++n) {
        e.applied[0] += f.nodal[n * 3];
        e.applied[1] += f.nodal[n * 3 + 1];
        scale += std::abs(f.nodal[n * 3]) + std::abs(f.nodal[n * 3 + 1]);
    }
    for (std::size_t m = 0; m < f.members.size(); ++m) {
        const MemberGeometry& g = f.members[m].geometry;
        auto add = [&](double px, double py) {
            e.applied[0] += g.c * px - g.s * py;
            e.applied[1] += g.s * px + g.c * py;
            scale += std::abs(px) + std::abs(py);
        };
        for (const LocalDistributed& q : f.spread[m])
            add(0.5 * (q.qx_a + q.qx_b) * (q.b - q.a), 0.5 * (q.qy_a + q.qy_b) * (q.b - q.a));
        for (const LocalPoint& p : f.points[m])
            add(p.px, p.py);
    }
    for (const auto& r : reactions) {
        e.reactions[0] += r[0];
        e.reactions[1] += r[1];
        scale += std::abs(r[0]) + std::abs(r[1]);
    }
    for (std::size_t d = 0; d < 2; ++d) {
        if (scale > 0.0)
            e.relative_residual =
                std::max(e.relative_residual, std::abs(e.applied[d] + e.reactions[d]) / scale);
    }
    return e;
}

CaseResults results_of(const Model& model, const Frame& f, const Iterate& it,
                       std::vector<SignedExtremes>& extremes) {
    CaseResults out;
    out.displacements.resize(model.nodes.size());
    for (std::size_t n = 0; n < model.nodes.size(); ++n) {
        for (std::size_t d = 0; d < 3; ++d)
            out.displacements[n][d] = it.displacements[n * 3 + d];
    }
    out.reactions = reactions_of(model, f, it);
    out.members.resize(f.members.size());
    extremes.resize(f.members.size());
    for (std::size_t m = 0; m < f.members.size(); ++m) {
        const MemberInfo& info = f.members[m];
        BeamColumnFunctions fn =
            build_beam_column(info.properties, it.used[m], f.spread[m], f.points[m],
                              it.ends[m].displacements, it.ends[m].forces);
        out.members[m] = summarize(fn, &extremes[m]);
    }
    out.equilibrium = force_equilibrium(f, out.reactions);
    return out;
}

/// Solves the frame with the members under `axial`; false if it is not
/// positive definite there (beyond the critical load).
bool solve_once(const Frame& f, const std::vector<double>& axial, Factor& factor, Iterate& out) {
    if (!stable_at(f, axial, 1.0, factor))
        return false;
    std::vector<ElementVector> consistent;
    Eigen::VectorXd r = load_vector(f, axial, consistent);
    Eigen::VectorXd u = f.count == 0 ? r : Eigen::VectorXd(factor.ldlt.solve(r));
    out = ends_of(f, axial, node_displacements(f, u), std::move(consistent));
    return true;
}

void report_exceeded(const Combination& combination, double critical, const SourceRange& where,
                     Diagnostics& diagnostics) {
    diagnostics.error(where, fmt::format("combination '{}' exceeds the frame's critical load: its "
                                         "critical load factor is {:.3f}, so its loads are {:.3f} "
                                         "times the critical load",
                                         combination.name, critical, 1.0 / critical));
}

}  // namespace

SecondOrderResults solve_second_order(const Model& model, const LoadSet& loads,
                                      const Combination& combination,
                                      const SecondOrderOptions& options, const SourceRange& where,
                                      Diagnostics& diagnostics) {
    SecondOrderResults out;
    Frame f = make_frame(model, loads, combination, options, out.outcome.notional);
    std::vector<double> axial(f.members.size(), 0.0);
    Factor factor;  // the one factorization alive in this worker
    Iterate it;
    for (std::size_t i = 1; i <= options.max_iterations; ++i) {
        Iterate next;
        if (!solve_once(f, axial, factor, next)) {
            out.outcome.exceeded = true;
            out.outcome.critical_factor =
                critical_factor_of(f, it.axial.empty() ? axial : it.axial);
            report_exceeded(combination, out.outcome.critical_factor, where, diagnostics);
            return out;
        }
        out.outcome.iterations = i;
        if (i > 1) {
            out.outcome.change = std::max(relative_change(next.axial, it.axial),
                                          relative_change(next.displacements, it.displacements));
        }
        axial = next.axial;
        it = std::move(next);
        if (i > 1 && out.outcome.change <= options.tolerance) {
            out.outcome.converged = true;
            break;
        }
    }
    if (!out.outcome.converged) {
        diagnostics.error(where, fmt::format("the second-order analysis of combination '{}' did "
                                             "not converge in {} iterations: the last change was "
                                             "{:.2e}, the tolerance {:.2e}",
                                             combination.name, out.outcome.iterations,
                                             out.outcome.change, options.tolerance));
        return out;
    }
    // The results belong to the axial forces the last solve used, so the
    // functions, reactions and summaries agree with its stiffness exactly.
    out.outcome.axial = it.used;
    out.outcome.critical_factor = critical_factor_of(f, it.used);
    double lcr = out.outcome.critical_factor;
    out.outcome.amplification = std::isfinite(lcr) && lcr > 1.0 ? 1.0 / (1.0 - 1.0 / lcr) : 1.0;
    out.results = results_of(model, f, it, out.extremes);
    return out;
}

double critical_load_factor(const Model& model, const std::vector<double>& axial,
                            const SecondOrderOptions& options) {
    Frame f;
    number_equations(model, f);
    add_members(model, options, f);
    return critical_factor_of(f, axial);
}

}  // namespace firn
