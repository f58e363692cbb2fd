// beam_column: second-order member functions and their summary.
//
// Along a member under the constant axial force N used for P-delta, M'' +
// lambda M = qy (lambda = -N/EI) and EI w'' = M; the pieces hold the closed
// form (ir/second_order.hpp). V is dM/dx, the shear normal to the deflected
// axis; it jumps by a point force, M by a point moment, as in first order.
#include "analyse/beam_column.hpp"

#include <algorithm>
#include <cmath>
#include <vector>

#include "analyse/results_internal.hpp"
#include "analyse/stability.hpp"

namespace firn {

BeamColumnValues evaluate(const BeamColumnPiece& p, double t) {
    BasisValues c = beam_column_basis(p.lambda, t);
    double ei = p.bending_rigidity;
    return BeamColumnValues{
        p.axial(t), -p.lambda * p.m0 * c[1] + p.v0 * c[0] + p.q0 * c[1] + p.q1 * c[2],
        p.m0 * c[0] + p.v0 * c[1] + p.q0 * c[2] + p.q1 * c[3],
        p.w0 + p.slope0 * t + (p.m0 * c[2] + p.v0 * c[3] + p.q0 * c[4] + p.q1 * c[5]) / ei,
        p.slope0 + (p.m0 * c[1] + p.v0 * c[2] + p.q0 * c[3] + p.q1 * c[4]) / ei};
}

namespace {

std::vector<double> piece_breaks(double l, std::span<const LocalDistributed> spread,
                                 std::span<const LocalPoint> points) {
    std::vector<double> breaks{0.0, l};
    for (const LocalDistributed& q : spread) {
        breaks.push_back(std::clamp(q.a, 0.0, l));
        breaks.push_back(std::clamp(q.b, 0.0, l));
    }
    for (const LocalPoint& p : points)
        breaks.push_back(std::clamp(p.a, 0.0, l));
    std::sort(breaks.begin(), breaks.end());
    double tolerance = 1e-12 * l;
    breaks.erase(std::unique(breaks.begin(), breaks.end(),
                             [&](double x, double y) { return y - x <= tolerance; }),
                 breaks.end());
    breaks.back() = l;
    return breaks;
}

/// The summed load on [s0, s1] as qx0 + qx1 t, qy0 + qy1 t.
std::array<double, 4> piece_load(std::span<const LocalDistributed> spread, double s0, double s1,
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

}  // namespace

BeamColumnFunctions build_beam_column(const ElementProperties& e, double axial,
                                      std::span<const LocalDistributed> spread,
                                      std::span<const LocalPoint> points,
                                      const ElementVector& displacements,
                                      const ElementVector& forces) {
    double l = e.length, tolerance = 1e-12 * l, lambda = -axial / e.bending_rigidity;
    std::vector<double> breaks = piece_breaks(l, spread, points);
    BeamColumnFunctions out;
    out.chord_w0 = displacements[1];
    out.chord_slope = (displacements[4] - displacements[1]) / l;
    // At the start: N = -F0, the transverse force V_T = F1 (global to the
    // undeflected axis), M = -F2, and V = dM/dx = V_T + N w'.
    double n = -forces[0], m = -forces[2], v = forces[1] + axial * displacements[2];
    double w = displacements[1], slope = displacements[2];
    for (std::size_t i = 0; i + 1 < breaks.size(); ++i) {
        double s0 = breaks[i], s1 = breaks[i + 1];
        for (const LocalPoint& p : points) {
            bool here = i == 0 ? p.a <= s0 + tolerance : std::abs(p.a - s0) <= tolerance;
            if (here) {
                n -= p.px;
                v += p.py;
                m -= p.mz;
            }
        }
        std::array<double, 4> q = piece_load(spread, s0, s1, tolerance);
        BeamColumnPiece piece{s0,
                              s1,
                              lambda,
                              e.bending_rigidity,
                              m,
                              v,
                              w,
                              slope,
                              q[2],
                              q[3],
                              Polynomial{{n, -q[0], -0.5 * q[1], 0.0, 0.0, 0.0}}};
        BeamColumnValues end = evaluate(piece, s1 - s0);
        n = end.n;
        v = end.v;
        m = end.m;
        w = end.w;
        slope = end.slope;
        out.pieces.push_back(piece);
    }
    return out;
}

namespace {

/// The functions of a summary, as indices (ORDER FUNCTION of results_internal.hpp).
std::array<double, 4> values_of(const BeamColumnFunctions& f, const BeamColumnPiece& p, double t) {
    BeamColumnValues x = evaluate(p, t);
    return {x.n, x.v, x.m, x.w - f.chord_w0 - f.chord_slope * (p.a + t)};
}

/// The derivative of function `which` (shear, moment, deflection) at t.
double derivative_of(const BeamColumnFunctions& f, const BeamColumnPiece& p, std::size_t which,
                     double t) {
    BeamColumnValues x = evaluate(p, t);
    if (which == f_moment)
        return x.v;
    if (which == f_shear)  // V' = qy + N w'' = qy - lambda M
        return p.q0 + p.q1 * t - p.lambda * x.m;
    return x.slope - f.chord_slope;
}

/// Where the derivative changes sign in (t0, t1), by bisection to round-off.
double refine_root(const BeamColumnFunctions& f, const BeamColumnPiece& p, std::size_t which,
                   double t0, double t1) {
    double d0 = derivative_of(f, p, which, t0);
    for (int i = 0; i < 200 && t1 - t0 > 1e-15 * (p.b - p.a); ++i) {
        double mid = 0.5 * (t0 + t1), dm = derivative_of(f, p, which, mid);
        if ((dm < 0.0) == (d0 < 0.0)) {
            t0 = mid;
            d0 = dm;
        } else {
            t1 = mid;
        }
    }
    return 0.5 * (t0 + t1);
}

/// Every candidate position of an extreme in a piece: its ends, the samples
/// and the refined stationary points of the shear, moment and deflection.
template <typename Visit>
void visit_piece(const BeamColumnFunctions& f, const BeamColumnPiece& p, Visit visit) {
    double h = p.b - p.a;
    double waves = std::sqrt(std::abs(p.lambda)) * h / (3.14159265358979323846 / 16.0);
    auto steps = static_cast<std::size_t>(std::max(16.0, std::ceil(waves)));
    for (std::size_t k = 0; k <= steps; ++k) {
        double t = h * static_cast<double>(k) / static_cast<double>(steps);
        visit(p.a + t, values_of(f, p, t));
        if (k == 0)
            continue;
        double t0 = h * static_cast<double>(k - 1) / static_cast<double>(steps);
        for (std::size_t which :
             {std::size_t{f_shear}, std::size_t{f_moment}, std::size_t{f_deflection}}) {
            double d0 = derivative_of(f, p, which, t0), d1 = derivative_of(f, p, which, t);
            if ((d0 < 0.0) != (d1 < 0.0) && d0 != 0.0 && d1 != 0.0) {
                double r = refine_root(f, p, which, t0, t);
                visit(p.a + r, values_of(f, p, r));
            }
        }
    }
}

bool keep_max(Extreme& e, double v, double x, double tie) {
    if (!(v > e.value + tie))
        return false;
    e = Extreme{v, x};
    return true;
}
bool keep_min(Extreme& e, double v, double x, double tie) {
    if (!(v < e.value - tie))
        return false;
    e = Extreme{v, x};
    return true;
}
void keep_magnitude(Extreme& e, double v, double x, double tie) {
    if (std::abs(v) > std::abs(e.value) + tie)
        e = Extreme{v, x};
}

}  // namespace

MemberSummary summarize(const BeamColumnFunctions& f, SignedExtremes* extremes) {
    MemberSummary s;
    if (extremes != nullptr)
        *extremes = SignedExtremes{};
    const BeamColumnPiece& first = f.pieces.front();
    const BeamColumnPiece& last = f.pieces.back();
    std::array<double, 4> start = values_of(f, first, 0.0);
    std::array<double, 4> end = values_of(f, last, last.b - last.a);
    s.start = {start[0], start[1], start[2]};
    s.end = {end[0], end[1], end[2]};
    std::vector<std::pair<double, std::array<double, 4>>> candidates;
    for (const BeamColumnPiece& p : f.pieces) {
        visit_piece(
            f, p, [&](double x, const std::array<double, 4>& v) { candidates.emplace_back(x, v); });
    }
    std::array<double, 4> tie{};
    for (const auto& [x, v] : candidates) {
        for (std::size_t i = 0; i < 4; ++i)
            tie[i] = std::max(tie[i], kTie * std::abs(v[i]));
    }
    for (const auto& [x, v] : candidates) {
        keep_max(s.moment_max, v[f_moment], x, tie[f_moment]);
        keep_min(s.moment_min, v[f_moment], x, tie[f_moment]);
        keep_magnitude(s.shear_max, v[f_shear], x, tie[f_shear]);
        keep_max(s.axial_max, v[f_axial], x, tie[f_axial]);
        keep_min(s.axial_min, v[f_axial], x, tie[f_axial]);
        keep_magnitude(s.deflection_max, v[f_deflection], x, tie[f_deflection]);
        if (extremes == nullptr)
            continue;
        std::array<double, 3> acting{v[f_axial], v[f_shear], v[f_moment]};
        for (std::size_t i = 0; i < 4; ++i) {
            if (keep_max(extremes->max[i], v[i], x, tie[i]))
                extremes->max_with[i] = acting;
            if (keep_min(extremes->min[i], v[i], x, tie[i]))
                extremes->min_with[i] = acting;
        }
    }
    return s;
}

}  // namespace firn
