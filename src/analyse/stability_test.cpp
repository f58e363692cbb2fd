// The member under axial force: the basis functions, the stability functions
// against their closed forms, continuity across N = 0, the first-order member
// at N = 0, and the pinned end.
#include "analyse/stability.hpp"

#include <catch2/catch.hpp>
#include <cmath>

namespace firn {
namespace {

constexpr double E = 200e9, I = 8e-5, EI = E * I, A = 0.01, L = 4.0;

ElementProperties member(bool hinge_start = false, bool hinge_end = false) {
    return ElementProperties{L, E * A, EI, hinge_start, hinge_end};
}

/// The axial force (tension positive) that gives kL = u: -u^2 EI / L^2 under compression.
double compression_for(double u) {
    return -u * u * EI / (L * L);
}

TEST_CASE("stability functions equal their closed forms in compression and tension",
          "[stability]") {
    // Stability functions of the prismatic member (Timoshenko & Gere, Theory of
    // Elastic Stability, Sec. 1.10 on the beam-column's end rotations; the
    // s and sc forms as in W.F. Chen and E.M. Lui, Structural Stability,
    // Sec. 4.3; from memory): compression
    //   s = u (sin u - u cos u) / (2 - 2 cos u - u sin u), sc = u (u - sin u) / (same);
    // tension
    //   s = u (u cosh u - sinh u) / (2 - 2 cosh u + u sinh u), sc = u (sinh u - u) / (same).
    for (double u : {0.5, 1.0, 2.0, 3.0, 4.0, 5.5, 6.0}) {
        double den = 2.0 - 2.0 * std::cos(u) - u * std::sin(u);
        StabilityFunctions f = stability_functions(member(), compression_for(u));
        CHECK(f.s == Approx(u * (std::sin(u) - u * std::cos(u)) / den).epsilon(1e-10));
        CHECK(f.sc == Approx(u * (u - std::sin(u)) / den).epsilon(1e-10));
    }
    for (double u : {0.5, 1.0, 2.0, 5.0, 12.0}) {
        double den = 2.0 - 2.0 * std::cosh(u) + u * std::sinh(u);
        StabilityFunctions f = stability_functions(member(), u * u * EI / (L * L));
        CHECK(f.s == Approx(u * (u * std::cosh(u) - std::sinh(u)) / den).epsilon(1e-10));
        CHECK(f.sc == Approx(u * (std::sinh(u) - u) / den).epsilon(1e-10));
    }
}

TEST_CASE("stability functions are continuous across no axial force", "[stability]") {
    // At N = 0 the member is the Euler-Bernoulli one: s = 4, sc = 2 (slope-deflection
    // equations, common practice); the first terms of the series are
    // s = 4 - (2/15) q - (11/6300) q^2, sc = 2 + q/30 + (13/12600) q^2 with
    // q = -N L^2 / EI (Chen and Lui, series of the stability functions; from memory).
    for (double q : {1e-12, 1e-8, 1e-5, 1e-3}) {
        for (double sign : {1.0, -1.0}) {
            StabilityFunctions f = stability_functions(member(), -sign * q * EI / (L * L));
            CHECK(f.s ==
                  Approx(4.0 - 2.0 / 15.0 * sign * q - 11.0 / 6300.0 * q * q).epsilon(1e-12));
            CHECK(f.sc == Approx(2.0 + sign * q / 30.0 + 13.0 / 12600.0 * q * q).epsilon(1e-12));
        }
    }
    StabilityFunctions zero = stability_functions(member(), 0.0);
    CHECK(zero.s == Approx(4.0).epsilon(1e-15));
    CHECK(zero.sc == Approx(2.0).epsilon(1e-15));
}

TEST_CASE("the basis functions meet at the switch from series to closed form", "[stability]") {
    // C_n is one analytic function of lambda: both sides of |lambda t^2| = 4
    // must agree (to the digits the closed form keeps there).
    for (double sign : {1.0, -1.0}) {
        double below = sign * 4.0 * (1.0 - 1e-12) / (L * L);
        double above = sign * 4.0 * (1.0 + 1e-12) / (L * L);
        BasisValues a = beam_column_basis(below, L), b = beam_column_basis(above, L);
        double power = 1.0;
        for (std::size_t n = 0; n < a.size(); ++n) {
            CHECK(a[n] == Approx(b[n]).epsilon(1e-11).margin(1e-13 * power));
            power *= L / static_cast<double>(n + 1);
        }
    }
}

TEST_CASE("with no axial force the second-order member is the first-order one", "[stability]") {
    for (int hinges = 0; hinges < 4; ++hinges) {
        ElementProperties e = member((hinges & 1) != 0, (hinges & 2) != 0);
        ElementMatrix k1 = local_stiffness(e), k2 = second_order_stiffness(e, 0.0);
        for (std::size_t i = 0; i < 6; ++i) {
            for (std::size_t j = 0; j < 6; ++j)
                CHECK(k2[i][j] == Approx(k1[i][j]).margin(1e-9 * EI / (L * L * L)));
        }
    }
    // Loads: a linear load over part of the span and a point force and moment.
    LocalDistributed q{0.5, 3.5, 1e3, 2e3, -4e3, -9e3};
    LocalPoint p{1.25, 2e3, -7e3, 3e3};
    ElementProperties e = member();
    ElementVector f1 = consistent_loads(e, {&q, 1}, {&p, 1});
    ElementVector f2 = second_order_consistent_loads(e, 0.0, {&q, 1}, {&p, 1});
    for (std::size_t i = 0; i < 6; ++i)
        CHECK(f2[i] == Approx(f1[i]).margin(1e-9));
}

TEST_CASE("a pinned end has the modified stiffness under axial force", "[stability]") {
    // The member pinned at its far end: the end moment per rotation of the
    // held end is (s^2 - (sc)^2) / s EI/L and the far rotation follows
    // (Chen and Lui, modified stability function; from memory). At N = 0: 3EI/L.
    for (double u : {0.0, 1.0, 2.5, 4.0}) {
        double axial = compression_for(u);
        ElementProperties e = member(false, true);
        StabilityFunctions f = stability_functions(member(), axial);
        ElementMatrix k = second_order_stiffness(e, axial);
        CHECK(k[2][2] == Approx((f.s * f.s - f.sc * f.sc) / f.s * EI / L).epsilon(1e-10));
        CHECK(k[5][5] == 0.0);
    }
    CHECK(second_order_stiffness(member(false, true), 0.0)[2][2] == Approx(3.0 * EI / L));
    // The held-pinned member buckles at u = 4.4934 (tan u = u): past it the
    // member is beyond its own buckling load (Timoshenko & Gere, Sec. 2.5, from memory).
    CHECK(below_member_buckling(member(false, true), compression_for(4.49)));
    CHECK_FALSE(below_member_buckling(member(false, true), compression_for(4.50)));
    // The pin-ended strut at u = pi, the clamped one at u = 2 pi (Euler).
    CHECK(below_member_buckling(member(true, true), compression_for(3.14)));
    CHECK_FALSE(below_member_buckling(member(true, true), compression_for(3.15)));
    CHECK(below_member_buckling(member(), compression_for(6.28)));
    CHECK_FALSE(below_member_buckling(member(), compression_for(6.29)));
}

TEST_CASE("the pin-ended bar keeps only its chord term", "[stability]") {
    // A strut pinned at both ends resists sway by N/L alone (tension stiffens,
    // compression softens: the leaning column; statics, common practice).
    double axial = compression_for(1.0);
    ElementMatrix k = second_order_stiffness(member(true, true), axial);
    CHECK(k[1][1] == Approx(axial / L));
    CHECK(k[1][4] == Approx(-axial / L));
    CHECK(k[1][2] == 0.0);
    CHECK(k[2][2] == 0.0);
}

}  // namespace
}  // namespace firn
