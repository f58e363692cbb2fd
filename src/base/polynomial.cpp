// polynomial: calculus and real roots of the short polynomials that describe
// member actions.
#include "base/polynomial.hpp"

#include <algorithm>
#include <cassert>
#include <cmath>
#include <limits>

namespace firn {

namespace {

constexpr double eps = std::numeric_limits<double>::epsilon();

/// p(t), and whether it is zero within the rounding error of Horner's rule
/// (about 2n eps times the sum of the magnitudes of the terms, with margin).
struct Sample {
    double value;
    bool zero;
};
Sample sample(const Polynomial& p, int top, double t) {
    double v = 0.0, bound = 0.0, at = std::abs(t);
    for (int i = top; i >= 0; --i) {
        v = v * t + p.c[static_cast<std::size_t>(i)];
        bound = bound * at + std::abs(p.c[static_cast<std::size_t>(i)]);
    }
    return Sample{v, std::abs(v) <= 16.0 * eps * bound};
}

/// Appends x unless it repeats the last root (roots arrive in ascending order).
void add_root(RealRoots& roots, double x) {
    if (roots.count > 0 && x <= roots.x[roots.count - 1])
        return;
    if (roots.count < roots.x.size())
        roots.x[roots.count++] = x;
}

/// Adds x if it lies in [lo, hi], pulling in values that round-off put just outside.
void add_if_inside(RealRoots& roots, double x, double lo, double hi) {
    double tolerance = 8.0 * eps * std::max(std::abs(lo), std::abs(hi));
    if (x < lo - tolerance || x > hi + tolerance)
        return;
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
    if (x1 > x2)
        std::swap(x1, x2);
    add_if_inside(roots, x1, lo, hi);
    add_if_inside(roots, x2, lo, hi);
}

/// The root of p in (l, r), where p is monotone and p(l) = pl, p(r) = pr
/// differ in sign: Newton steps from the secant point, replaced by bisection
/// whenever they leave the shrinking bracket. Newton converges quadratically,
/// so once a step is below 1e-12 of the scale the next error is far below
/// round-off and the step is the last one.
double refine_root(const Polynomial& p, const Polynomial& dp, int top, double l, double r,
                   double pl, double pr) {
    double scale = std::max({std::abs(l), std::abs(r), r - l});
    double x = l - pl * (r - l) / (pr - pl);
    if (!(x > l && x < r))
        x = 0.5 * (l + r);
    for (int i = 0; i < 200; ++i) {
        double px = evaluate(p, top, x);
        if (px == 0.0)
            return x;
        if ((px < 0.0) == (pl < 0.0)) {
            l = x;
        } else {
            r = x;
        }
        double slope = evaluate(dp, top - 1, x);
        double next = slope != 0.0 ? x - px / slope : 0.5 * (l + r);
        if (!(next > l && next < r))
            next = 0.5 * (l + r);
        bool converged = std::abs(next - x) <= 1e-12 * scale ||
                         r - l <= 4.0 * eps * std::max(std::abs(l), std::abs(r));
        x = next;
        if (converged)
            break;
    }
    return x;
}

/// Degree 3 and up: between consecutive roots of p' (and the interval ends)
/// p is monotone, so each such stretch holds at most one root.
void isolated_roots(const Polynomial& p, int top, double lo, double hi, RealRoots& roots) {
    Polynomial dp = derivative(p);
    RealRoots critical = real_roots(dp, lo, hi);
    std::array<double, 7> knots{};
    std::size_t n = 0;
    knots[n++] = lo;
    for (std::size_t i = 0; i < critical.count; ++i) {
        if (critical.x[i] > knots[n - 1] && critical.x[i] < hi)
            knots[n++] = critical.x[i];
    }
    if (hi > knots[n - 1])
        knots[n++] = hi;
    Sample left = sample(p, top, knots[0]);
    for (std::size_t i = 0; i + 1 < n; ++i) {
        Sample right = sample(p, top, knots[i + 1]);
        if (left.zero) {
            add_root(roots, knots[i]);
        } else if (!right.zero && (left.value < 0.0) != (right.value < 0.0)) {
            add_root(roots,
                     refine_root(p, dp, top, knots[i], knots[i + 1], left.value, right.value));
        }
        left = right;
    }
    if (left.zero)
        add_root(roots, knots[n - 1]);
}

}  // namespace

RealRoots real_roots(const Polynomial& p, double lo, double hi) {
    RealRoots roots;
    int top = degree(p);
    switch (top) {
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
            isolated_roots(p, top, lo, hi, roots);
            break;
    }
    return roots;
}

}  // namespace firn
