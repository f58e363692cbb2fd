// polynomial: calculus and real roots of the short polynomials that describe
// member actions (degree <= 5), exact to round-off.
#pragma once

#include <array>
#include <cassert>
#include <cstddef>

namespace firn {

/// A polynomial in the distance t from the start of its piece, degree <= 5.
struct Polynomial {
    std::array<double, 6> c{};
    double operator()(double t) const {
        double v = 0.0;
        for (std::size_t i = c.size(); i-- > 0;)
            v = v * t + c[i];
        return v;
    }
};

// The three below are inline: the result stage calls them for every member
// in every case.

/// Highest power with a non-zero coefficient; -1 for the zero polynomial.
inline int degree(const Polynomial& p) {
    for (std::size_t i = p.c.size(); i-- > 0;) {
        if (p.c[i] != 0.0)
            return static_cast<int>(i);
    }
    return -1;
}

/// dp/dt.
inline Polynomial derivative(const Polynomial& p) {
    return Polynomial{{p.c[1], 2.0 * p.c[2], 3.0 * p.c[3], 4.0 * p.c[4], 5.0 * p.c[5], 0.0}};
}

/// The antiderivative that is 0 at t = 0. The t^5 term of p must be zero.
inline Polynomial antiderivative(const Polynomial& p) {
    assert(p.c[5] == 0.0);
    return Polynomial{{0.0, p.c[0], p.c[1] / 2.0, p.c[2] / 3.0, p.c[3] / 4.0, p.c[4] / 5.0}};
}

/// p(t) by Horner's rule, for a p known to have no terms above t^top: cheaper
/// than p(t) when the top coefficients are known zeros.
inline double evaluate(const Polynomial& p, int top, double t) {
    double v = 0.0;
    for (int i = top; i >= 0; --i)
        v = v * t + p.c[static_cast<std::size_t>(i)];
    return v;
}

/// Real roots of a polynomial inside an interval, ascending, each listed once.
struct RealRoots {
    std::array<double, 5> x{};
    std::size_t count = 0;
};

/// The real roots of p in [lo, hi]. Roots are isolated between the roots of
/// the derivative (found the same way), then refined by bracketed Newton
/// steps to round-off. A root where p only touches zero counts when p there
/// is zero within its evaluation error. The zero polynomial has no roots.
RealRoots real_roots(const Polynomial& p, double lo, double hi);

}  // namespace firn
