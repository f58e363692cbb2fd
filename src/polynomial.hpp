// polynomial: calculus and real roots of the short polynomials that describe
// member actions (degree <= 5), exact to round-off.
#pragma once

#include <array>
#include <cstddef>

#include "results.hpp"

namespace firn {

/// Highest power with a non-zero coefficient; -1 for the zero polynomial.
int degree(const Polynomial& p);

/// dp/dt.
Polynomial derivative(const Polynomial& p);

/// The antiderivative that is 0 at t = 0. The t^5 term of p must be zero.
Polynomial antiderivative(const Polynomial& p);

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
