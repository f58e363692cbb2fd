// Tests of the polynomial helpers. Every expected root comes from a
// polynomial built from known factors (algebra), so the answers are known
// before the code runs.
#include <catch2/catch.hpp>
#include <cmath>
#include <vector>

#include "base/polynomial.hpp"

namespace firn {
namespace {

/// The polynomial with the given roots and leading coefficient `lead`.
Polynomial from_roots(const std::vector<double>& roots, double lead = 1.0) {
    Polynomial p;
    p.c[0] = lead;
    for (double r : roots) {  // multiply by (t - r)
        for (std::size_t i = p.c.size() - 1; i > 0; --i)
            p.c[i] = p.c[i - 1] - r * p.c[i];
        p.c[0] = -r * p.c[0];
    }
    return p;
}

std::vector<double> roots_of(const Polynomial& p, double lo, double hi) {
    RealRoots r = real_roots(p, lo, hi);
    return std::vector<double>(r.x.begin(), r.x.begin() + static_cast<std::ptrdiff_t>(r.count));
}

TEST_CASE("degree, derivative and antiderivative follow the power rule", "[polynomial]") {
    Polynomial p{{1.0, 2.0, 3.0, 4.0, 0.0, 0.0}};  // 1 + 2t + 3t^2 + 4t^3
    CHECK(degree(p) == 3);
    CHECK(degree(Polynomial{}) == -1);
    Polynomial d = derivative(p);  // 2 + 6t + 12t^2 (power rule)
    CHECK(d.c[0] == 2.0);
    CHECK(d.c[1] == 6.0);
    CHECK(d.c[2] == 12.0);
    CHECK(d.c[3] == 0.0);
    Polynomial a = antiderivative(p);  // t + t^2 + t^3 + t^4 (power rule)
    CHECK(a.c[0] == 0.0);
    for (std::size_t i = 1; i <= 4; ++i)
        CHECK(a.c[i] == 1.0);
    CHECK(a(2.0) == 2.0 + 4.0 + 8.0 + 16.0);
}

TEST_CASE("linear and quadratic roots", "[polynomial]") {
    CHECK(roots_of(Polynomial{{-3.0, 2.0}}, 0.0, 10.0) == std::vector<double>{1.5});
    CHECK(roots_of(Polynomial{{-3.0, 2.0}}, 2.0, 10.0).empty());
    auto r = roots_of(from_roots({1.0, 2.0}), -5.0, 5.0);
    REQUIRE(r.size() == 2);
    CHECK(r[0] == Approx(1.0).epsilon(1e-15));
    CHECK(r[1] == Approx(2.0).epsilon(1e-15));
    // t^2 - 1e8 t + 1: the small root 1e-8 must not be lost to cancellation.
    auto small = roots_of(Polynomial{{1.0, -1e8, 1.0}}, 0.0, 1.0);
    REQUIRE(small.size() == 1);
    CHECK(small[0] == Approx(1e-8).epsilon(1e-14));
    CHECK(roots_of(Polynomial{{1.0, 0.0, 1.0}}, -10.0, 10.0).empty());  // t^2 + 1
    auto touching = roots_of(from_roots({0.3, 0.3}), 0.0, 1.0);         // (t - 0.3)^2
    REQUIRE(touching.size() == 1);
    CHECK(touching[0] == Approx(0.3).epsilon(1e-7));
}

TEST_CASE("cubic and quintic roots are isolated and refined to round-off", "[polynomial]") {
    auto r = roots_of(from_roots({1.0, 2.0, 3.0}), 0.0, 4.0);
    REQUIRE(r.size() == 3);
    CHECK(r[0] == Approx(1.0).epsilon(1e-14));
    CHECK(r[1] == Approx(2.0).epsilon(1e-14));
    CHECK(r[2] == Approx(3.0).epsilon(1e-14));
    std::vector<double> five{0.1, 0.2, 0.5, 0.7, 0.9};
    auto q = roots_of(from_roots(five, -3.5), 0.0, 1.0);
    REQUIRE(q.size() == 5);
    for (std::size_t i = 0; i < 5; ++i)
        CHECK(q[i] == Approx(five[i]).epsilon(1e-12));
    // Only the roots inside the interval, and roots sitting on its ends.
    auto inside = roots_of(from_roots(five), 0.2, 0.7);
    REQUIRE(inside.size() == 3);
    CHECK(inside[0] == Approx(0.2).epsilon(1e-12));
    CHECK(inside[1] == Approx(0.5).epsilon(1e-12));
    CHECK(inside[2] == Approx(0.7).epsilon(1e-12));
}

TEST_CASE("multiple roots and scaled polynomials", "[polynomial]") {
    // (t - 2)^2 (t - 5): a double root where the cubic only touches zero.
    auto r = roots_of(from_roots({2.0, 2.0, 5.0}), 0.0, 10.0);
    REQUIRE(r.size() == 2);
    CHECK(r[0] == Approx(2.0).epsilon(1e-7));
    CHECK(r[1] == Approx(5.0).epsilon(1e-13));
    // (t - 1)^3: a triple root is found once, to the cube root of round-off.
    auto triple = roots_of(from_roots({1.0, 1.0, 1.0}), 0.0, 3.0);
    REQUIRE_FALSE(triple.empty());
    CHECK(triple[0] == Approx(1.0).epsilon(1e-4));
    // Roots of a member-sized problem: positions in m, coefficients near 1e5.
    auto big = roots_of(from_roots({1.25, 7.5, 11.0}, 4.0e5), 0.0, 12.0);
    REQUIRE(big.size() == 3);
    CHECK(big[1] == Approx(7.5).epsilon(1e-13));
    CHECK(roots_of(Polynomial{}, 0.0, 1.0).empty());
    CHECK(roots_of(Polynomial{{2.0}}, 0.0, 1.0).empty());
}

}  // namespace
}  // namespace firn
