// stability: the exact prismatic member under constant axial force.
//
// The member functions from the start end, with M0 and V0 = M'(0) there and
// the transverse load qy = q0 + q1 t (Timoshenko & Gere, Theory of Elastic
// Stability, Sec. 1.2, written with the functions C_n of stability.hpp):
//   M(t) = M0 C0 + V0 C1 + q0 C2 + q1 C3
//   w(t) = w0 + w0' t + (M0 C2 + V0 C3 + q0 C4 + q1 C5) / EI.
// The stiffness and the clamped end forces are these with the end conditions
// imposed, so the stiffness, the loads and the functions along the member can
// never disagree.
#include "analyse/stability.hpp"

#include <algorithm>
#include <cassert>
#include <cmath>
#include <vector>

namespace firn {

namespace {

/// Below this |lambda t^2| the series is used: there the closed forms lose
/// digits to cancellation (about log10(20 / |lambda t^2|) of them in C5), while
/// the series still converges in a dozen terms.
constexpr double kSeriesLimit = 4.0;

BasisValues series_basis(double lambda, double t) {
    BasisValues out{};
    double z = -lambda * t * t;
    double power = 1.0;  // t^n / n!
    for (std::size_t n = 0; n < out.size(); ++n) {
        double term = power, sum = power;
        for (int j = 1; j < 40 && std::abs(term) > 1e-18 * std::abs(sum); ++j) {
            double a = static_cast<double>(2 * j + static_cast<int>(n));
            term *= z / (a * (a - 1.0));
            sum += term;
        }
        out[n] = sum;
        power *= t / static_cast<double>(n + 1);
    }
    return out;
}

}  // namespace

BasisValues beam_column_basis(double lambda, double t) {
    if (std::abs(lambda) * t * t <= kSeriesLimit)
        return series_basis(lambda, t);
    BasisValues out{};
    double k = std::sqrt(std::abs(lambda));
    if (lambda > 0.0) {  // compression: trigonometric
        out[0] = std::cos(k * t);
        out[1] = std::sin(k * t) / k;
    } else {  // tension: hyperbolic
        out[0] = std::cosh(k * t);
        out[1] = std::sinh(k * t) / k;
    }
    // C_(n+2) = (t^n / n! - C_n) / lambda, from the series.
    double power = 1.0;
    for (std::size_t n = 0; n + 2 < out.size(); ++n) {
        out[n + 2] = (power - out[n]) / lambda;
        power *= t / static_cast<double>(n + 1);
    }
    return out;
}

namespace {

double lambda_of(const ElementProperties& e, double axial) {
    return -axial / e.bending_rigidity;
}

/// C2^2 - C1 C3 at the member's length: zero where the member clamped at
/// both ends buckles (u = 2 pi), positive below.
double clamped_determinant(const BasisValues& c) {
    return c[2] * c[2] - c[1] * c[3];
}

}  // namespace

StabilityFunctions stability_functions(const ElementProperties& e, double axial) {
    double l = e.length, lambda = lambda_of(e, axial), q = lambda * l * l;
    if (std::abs(q) <= kSeriesLimit) {  // from the series of C_n: no cancellation near N = 0
        BasisValues c = beam_column_basis(lambda, l);
        double det = clamped_determinant(c);
        double turned = l * c[2] - c[3], far = c[2] - l * c[1];
        return StabilityFunctions{l * turned / det, -l * (turned * c[0] + far * c[1]) / det};
    }
    double u = std::sqrt(std::abs(q));
    if (q > 0.0) {  // compression
        double den = 2.0 - 2.0 * std::cos(u) - u * std::sin(u);
        return StabilityFunctions{u * (std::sin(u) - u * std::cos(u)) / den,
                                  u * (u - std::sin(u)) / den};
    }
    // Tension, divided through by cosh u so that a long tie does not overflow.
    double t = std::tanh(u), sech = 1.0 / std::cosh(u);
    double den = 2.0 * sech - 2.0 + u * t;
    return StabilityFunctions{u * (u - t) / den, u * (t - u * sech) / den};
}

bool below_member_buckling(const ElementProperties& e, double axial) {
    double l = e.length;
    BasisValues c = beam_column_basis(lambda_of(e, axial), l);
    // Relative to its value at N = 0, L^4 / 12, so the test does not depend on units.
    if (!(clamped_determinant(c) > 1e-12 * l * l * l * l / 12.0))
        return false;
    StabilityFunctions f = stability_functions(e, axial);
    if (e.hinge_start && e.hinge_end)
        return f.s > std::abs(f.sc) * (1.0 + 1e-12);  // the pinned strut: s^2 - (sc)^2 > 0
    if (e.hinge_start || e.hinge_end)
        return f.s > 1e-12;  // one end pinned: the condensed pivot s EI/L
    return true;
}

namespace {

constexpr std::size_t theta1 = 2, theta2 = 5;

ElementMatrix full_second_order(const ElementProperties& e, double axial) {
    double l = e.length, ei = e.bending_rigidity;
    StabilityFunctions f = stability_functions(e, axial);
    double ax = e.axial_rigidity / l;
    double c = f.s * ei / l, d = f.sc * ei / l;
    double b = (f.s + f.sc) * ei / (l * l);
    double a = 2.0 * (f.s + f.sc) * ei / (l * l * l) + axial / l;
    return ElementMatrix{{{ax, 0.0, 0.0, -ax, 0.0, 0.0},
                          {0.0, a, b, 0.0, -a, b},
                          {0.0, b, c, 0.0, -b, d},
                          {-ax, 0.0, 0.0, ax, 0.0, 0.0},
                          {0.0, -a, -b, 0.0, a, -b},
                          {0.0, b, d, 0.0, -b, c}}};
}

/// State along the member: deflection and slope in local axes, M and V = M'.
struct BeamColumnState {
    double w = 0.0, slope = 0.0, m = 0.0, v = 0.0;
};

/// The state at distance h further on under qy = q0 + q1 t.
BeamColumnState advance(const BeamColumnState& s, double lambda, double ei, double h, double q0,
                        double q1) {
    BasisValues c = beam_column_basis(lambda, h);
    return BeamColumnState{
        s.w + s.slope * h + (s.m * c[2] + s.v * c[3] + q0 * c[4] + q1 * c[5]) / ei,
        s.slope + (s.m * c[1] + s.v * c[2] + q0 * c[3] + q1 * c[4]) / ei,
        s.m * c[0] + s.v * c[1] + q0 * c[2] + q1 * c[3],
        -lambda * s.m * c[1] + s.v * c[0] + q0 * c[1] + q1 * c[2]};
}

/// The transverse loads of the member as pieces between every load start,
/// end and point: qy on each piece as q0 + q1 t, and the point actions at its start.
struct TransversePiece {
    double a = 0.0, b = 0.0, q0 = 0.0, q1 = 0.0;
};

std::vector<double> load_breaks(double l, std::span<const LocalDistributed> spread,
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

/// The particular state at the far end: the loads alone on a member whose
/// start is held with no moment and no shear, and the point actions at the end.
struct ParticularEnd {
    BeamColumnState before_end;  ///< just before the end's own point actions
    double end_v = 0.0, end_m = 0.0;
};

ParticularEnd particular_end(const ElementProperties& e, double lambda,
                             std::span<const LocalDistributed> spread,
                             std::span<const LocalPoint> points) {
    double l = e.length, tolerance = 1e-12 * l;
    std::vector<double> breaks = load_breaks(l, spread, points);
    BeamColumnState s;
    for (std::size_t i = 0; i + 1 < breaks.size(); ++i) {
        double s0 = breaks[i], s1 = breaks[i + 1];
        for (const LocalPoint& p : points) {
            bool here = i == 0 ? p.a <= s0 + tolerance : std::abs(p.a - s0) <= tolerance;
            if (here) {
                s.v += p.py;
                s.m -= p.mz;
            }
        }
        double q0 = 0.0, q1 = 0.0;
        for (const LocalDistributed& d : spread) {
            if (d.a > s0 + tolerance || d.b < s1 - tolerance || d.b <= d.a)
                continue;
            double slope = (d.qy_b - d.qy_a) / (d.b - d.a);
            q0 += d.qy_a + slope * (s0 - d.a);
            q1 += slope;
        }
        s = advance(s, lambda, e.bending_rigidity, s1 - s0, q0, q1);
    }
    ParticularEnd out{s, s.v, s.m};
    for (const LocalPoint& p : points) {
        if (p.a >= l - tolerance) {  // merged into the last break: no piece starts there
            out.end_v += p.py;
            out.end_m -= p.mz;
        }
    }
    return out;
}

}  // namespace

ElementMatrix second_order_stiffness(const ElementProperties& e, double axial) {
    assert(below_member_buckling(e, axial));
    if (e.hinge_start && e.hinge_end) {
        // The pin-ended bar: its only transverse stiffness is the chord term N/L,
        // written exactly (condensing would leave round-off, see local_stiffness).
        ElementMatrix k{};
        double ax = e.axial_rigidity / e.length, chord = axial / e.length;
        k[0][0] = k[3][3] = ax;
        k[0][3] = k[3][0] = -ax;
        k[1][1] = k[4][4] = chord;
        k[1][4] = k[4][1] = -chord;
        return k;
    }
    ElementMatrix k = full_second_order(e, axial);
    condense_released(e, k, nullptr);
    return k;
}

ElementVector second_order_consistent_loads(const ElementProperties& e, double axial,
                                            std::span<const LocalDistributed> spread,
                                            std::span<const LocalPoint> points) {
    // The axial part does not depend on N: the first-order values are exact.
    ElementVector first = consistent_loads(e, spread, points);
    double lambda = lambda_of(e, axial), ei = e.bending_rigidity, l = e.length;
    ParticularEnd p = particular_end(e, lambda, spread, points);
    BasisValues c = beam_column_basis(lambda, l);
    // Clamped: choose M0, V0 so that w(L) = w'(L) = 0.
    double det = clamped_determinant(c);
    double rw = -ei * p.before_end.w, rs = -ei * p.before_end.slope;
    double m0 = (c[2] * rw - c[3] * rs) / det;
    double v0 = (c[2] * rs - c[1] * rw) / det;
    double end_m = p.end_m + m0 * c[0] + v0 * c[1];
    double end_v = p.end_v - lambda * m0 * c[1] + v0 * c[0];
    // The clamped member's end forces are (., v0, -m0) and (., -end_v, end_m);
    // the equivalent nodal loads are their opposites.
    return ElementVector{first[0], -v0, m0, first[3], end_v, -end_m};
}

ElementVector second_order_condensed_loads(const ElementProperties& e, double axial,
                                           const ElementVector& consistent) {
    ElementVector f = consistent;
    if (!e.hinge_start && !e.hinge_end)
        return f;
    ElementMatrix k = full_second_order(e, axial);
    condense_released(e, k, &f);
    return f;
}

SecondOrderEnds second_order_end_forces(const ElementProperties& e, double axial,
                                        const ElementVector& d, const ElementVector& consistent) {
    ElementMatrix k = full_second_order(e, axial);
    ElementVector u = d;
    if (e.hinge_start)
        u[theta1] = 0.0;
    if (e.hinge_end)
        u[theta2] = 0.0;
    auto residual = [&](std::size_t r) {
        double sum = consistent[r];
        for (std::size_t j = 0; j < 6; ++j)
            sum -= k[r][j] * u[j];
        return sum;
    };
    if (e.hinge_start && e.hinge_end) {
        double r1 = residual(theta1), r2 = residual(theta2);
        double det = k[theta1][theta1] * k[theta2][theta2] - k[theta1][theta2] * k[theta2][theta1];
        u[theta1] = (k[theta2][theta2] * r1 - k[theta1][theta2] * r2) / det;
        u[theta2] = (k[theta1][theta1] * r2 - k[theta2][theta1] * r1) / det;
    } else if (e.hinge_start) {
        u[theta1] = residual(theta1) / k[theta1][theta1];
    } else if (e.hinge_end) {
        u[theta2] = residual(theta2) / k[theta2][theta2];
    }
    SecondOrderEnds out{u, {}};
    for (std::size_t i = 0; i < 6; ++i) {
        double sum = -consistent[i];
        for (std::size_t j = 0; j < 6; ++j)
            sum += k[i][j] * u[j];
        out.forces[i] = sum;
    }
    return out;
}

}  // namespace firn
