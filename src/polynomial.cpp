// polynomial: calculus and real roots of the short polynomials that describe
// member actions.
#include "polynomial.hpp"

#include <algorithm>
#include <cassert>
#include <cmath>
#include <limits>

namespace firn {

int degree(const Polynomial& p) {
    for (std::size_t i = p.c.size(); i-- > 0;) {
        if (p.c[i] != 0.0) return static_cast<int>(i);
    }
    return -1;
}

Polynomial derivative(const Polynomial& p) {
    Polynomial d;
    for (std::size_t i = 1; i < p.c.size(); ++i) d.c[i - 1] = static_cast<double>(i) * p.c[i];
    return d;
}

Polynomial antiderivative(const Polynomial& p) {
    assert(p.c.back() == 0.0);
    Polynomial a;
    for (std::size_t i = 0; i + 1 < p.c.size(); ++i) a.c[i + 1] = p.c[i] / static_cast<double>(i + 1);
    return a;
}

namespace {

constexpr double eps = std::numeric_limits<double>::epsilon();

/// A bound on the rounding error of evaluating p at t by Horner's rule
/// (about 2n eps times the sum of the magnitudes of the terms, with margin).
double evaluation_error(const Polynomial& p, double t) {
    double sum = 0.0, at = std::abs(t);
    for (std::size_t i = p.c.size(); i-- > 0;) sum = sum * at + std::abs(p.c[i]);
    return 16.0 * eps * sum;
}

bool is_zero_at(const Polynomial& p, double t) {
    return std::abs(p(t)) <= evaluation_error(p, t);
}

/// Appends x unless it repeats the last root (roots arrive in ascending order).
void add_root(RealRoots& roots, double x) {
    if (roots.count > 0 && x <= roots.x[roots.count - 1]) return;
    if (roots.count < roots.x.size()) roots.x[roots.count++] = x;
}

/// Adds x if it lies in [lo, hi], pulling in values that round-off put just outside.
void add_if_inside(RealRoots& roots, double x, double lo, double hi) {
    double tolerance = 8.0 * eps * std::max(std::abs(lo), std::abs(hi));
    if (x < lo - tolerance || x > hi + tolerance) return;
    add_root(roots, std::clamp(x, lo, hi));
}

void quadratic_roots(const Polynomial& p, double lo, double hi, RealRoots& roots) {
    double a = p.c[2], b = p.c[1], c = p.c[0];
    double disc = b * b - 4.0 * a * c;
    if (disc < 0.0) {
        // A double root whose discriminant round-off made slightly negative.
        if (disc >= -16.0 * eps * (b * b + 4.0 * std::abs(a * c))) {
            add_if_inside(roots, -b / (2.0 * a), lo, hi);
        }
        return;
    }
    // The stable form: never subtract nearly equal numbers.
    double q = -0.5 * (b + std::copysign(std::sqrt(disc), b));
    double x1 = q / a, x2 = q != 0.0 ? c / q : x1;
    if (x1 > x2) std::swap(x1, x2);
    add_if_inside(roots, x1, lo, hi);
    add_if_inside(roots, x2, lo, hi);
}

/// The root of p in (l, r), where p is monotone and p(l) has the sign of pl,
/// p(r) the other: Newton steps, replaced by bisection whenever they leave
/// the shrinking bracket.
double refine_root(const Polynomial& p, const Polynomial& dp, double l, double r, double pl) {
    double x = 0.5 * (l + r);
    for (int i = 0; i < 200; ++i) {
        double px = p(x);
        if (px == 0.0) return x;
        if ((px < 0.0) == (pl < 0.0)) {
            l = x;
        } else {
            r = x;
        }
        double slope = dp(x);
        double next = slope != 0.0 ? x - px / slope : 0.5 * (l + r);
        if (!(next > l && next < r)) next = 0.5 * (l + r);
        bool converged = std::abs(next - x) <= 2.0 * eps * std::abs(x) ||
                         r - l <= 4.0 * eps * std::max(std::abs(l), std::abs(r));
        x = next;
        if (converged) break;
    }
    return x;
}

/// Degree 3 and up: between consecutive roots of p' (and the interval ends)
/// p is monotone, so each such stretch holds at most one root.
void isolated_roots(const Polynomial& p, double lo, double hi, RealRoots& roots) {
    Polynomial dp = derivative(p);
    RealRoots critical = real_roots(dp, lo, hi);
    std::array<double, 7> knots{};
    std::size_t n = 0;
    knots[n++] = lo;
    for (std::size_t i = 0; i < critical.count; ++i) {
        if (critical.x[i] > knots[n - 1] && critical.x[i] < hi) knots[n++] = critical.x[i];
    }
    if (hi > knots[n - 1]) knots[n++] = hi;
    for (std::size_t i = 0; i + 1 < n; ++i) {
        double a = knots[i], b = knots[i + 1];
        double pa = p(a), pb = p(b);
        if (is_zero_at(p, a)) {
            add_root(roots, a);
        } else if (!is_zero_at(p, b) && (pa < 0.0) != (pb < 0.0)) {
            add_root(roots, refine_root(p, dp, a, b, pa));
        }
    }
    if (is_zero_at(p, knots[n - 1])) add_root(roots, knots[n - 1]);
}

}  // namespace

RealRoots real_roots(const Polynomial& p, double lo, double hi) {
    RealRoots roots;
    switch (degree(p)) {
        case -1:
        case 0:
            break;
        case 1:
            add_if_inside(roots, -p.c[0] / p.c[1], lo, hi);
            break;
        case 2:
            quadratic_roots(p, lo, hi, roots);
            break;
        default:
            isolated_roots(p, lo, hi, roots);
            break;
    }
    return roots;
}

}  // namespace firn
