// Tests of the plane frame element. Expected values are the standard beam
// element stiffness and fixed-end actions found in any matrix structural
// analysis text, and statics.
#include <catch2/catch.hpp>
#include <cmath>
#include <vector>

#include "analyse/element.hpp"

namespace firn {
namespace {

constexpr double E = 200e9, A = 0.01, I = 2e-4, L = 6.0;

ElementProperties beam(bool hinge_start = false, bool hinge_end = false) {
    return ElementProperties{L, E * A, E * I, hinge_start, hinge_end};
}

Approx same(double v, double scale) {
    return Approx(v).epsilon(1e-12).margin(1e-12 * scale);
}

TEST_CASE("local stiffness is the standard beam-column matrix", "[element]") {
    ElementMatrix k = local_stiffness(beam());
    double ei = E * I;
    // Textbook plane frame element: EA/L, 12EI/L^3, 6EI/L^2, 4EI/L, 2EI/L.
    CHECK(k[0][0] == same(E * A / L, 1.0));
    CHECK(k[0][3] == same(-E * A / L, 1.0));
    CHECK(k[1][1] == same(12 * ei / (L * L * L), 1.0));
    CHECK(k[1][2] == same(6 * ei / (L * L), 1.0));
    CHECK(k[2][2] == same(4 * ei / L, 1.0));
    CHECK(k[2][5] == same(2 * ei / L, 1.0));
    CHECK(k[4][5] == same(-6 * ei / (L * L), 1.0));
    for (std::size_t i = 0; i < 6; ++i) {
        for (std::size_t j = 0; j < 6; ++j)
            CHECK(k[i][j] == same(k[j][i], k[i][i]));
    }
}

TEST_CASE("a hinge condenses to the propped member stiffness", "[element]") {
    double ei = E * I;
    ElementMatrix k = local_stiffness(beam(true, false));
    // Member pinned at its start: 3EI/L^3, 3EI/L^2, 3EI/L (textbook modified stiffness).
    CHECK(k[1][1] == same(3 * ei / (L * L * L), k[1][1]));
    CHECK(k[1][5] == same(3 * ei / (L * L), k[1][5]));
    CHECK(k[5][5] == same(3 * ei / L, k[5][5]));
    CHECK(k[0][0] == same(E * A / L, 1.0));
    for (std::size_t j = 0; j < 6; ++j)
        CHECK(k[2][j] == 0.0);
    // Both ends released: an axial bar, nothing left in bending.
    ElementMatrix bar = local_stiffness(beam(true, true));
    for (std::size_t i : {1u, 2u, 4u, 5u}) {
        for (std::size_t j = 0; j < 6; ++j)
            CHECK(bar[i][j] == same(0.0, E * A / L));
    }
    CHECK(bar[3][3] == same(E * A / L, 1.0));
}

TEST_CASE("consistent loads are the fixed-end actions", "[element]") {
    double w = 12e3, P = 50e3, a = 2.0, b = L - a, M = 30e3;
    std::vector<LocalDistributed> udl{{0.0, L, 0.0, 0.0, -w, -w}};
    ElementVector f = consistent_loads(beam(), udl, {});
    // Fixed-end UDL: wL/2 and wL^2/12 (textbook fixed-end moments).
    CHECK(f[1] == same(-w * L / 2, w * L));
    CHECK(f[2] == same(-w * L * L / 12, w * L * L));
    CHECK(f[4] == same(-w * L / 2, w * L));
    CHECK(f[5] == same(w * L * L / 12, w * L * L));
    std::vector<LocalPoint> point{{a, 0.0, -P, 0.0}};
    f = consistent_loads(beam(), {}, point);
    // Point load: P b^2 (3a + b)/L^3, P a b^2/L^2, P a^2 b/L^2 (textbook fixed-end actions).
    CHECK(f[1] == same(-P * b * b * (3 * a + b) / (L * L * L), P));
    CHECK(f[2] == same(-P * a * b * b / (L * L), P * L));
    CHECK(f[5] == same(P * a * a * b / (L * L), P * L));
    double c = 1.5, d = L - c;
    std::vector<LocalPoint> couple{{c, 0.0, 0.0, M}};
    f = consistent_loads(beam(), {}, couple);
    // Couple M at c: fixed-end moments M d (2c - d)/L^2 and M c (2d - c)/L^2 in
    // the couple's sense, end forces 6 M c d / L^3 (textbook fixed-end actions);
    // the equivalent nodal loads are their opposites.
    CHECK(f[2] == same(-M * d * (2 * c - d) / (L * L), M));
    CHECK(f[5] == same(-M * c * (2 * d - c) / (L * L), M));
    CHECK(f[1] == same(-6 * M * c * d / (L * L * L), M / L));
    CHECK(f[4] == same(6 * M * c * d / (L * L * L), M / L));
}

TEST_CASE("linearly varying and axial loads", "[element]") {
    double w = 9e3, q = 4e3;
    std::vector<LocalDistributed> triangle{{0.0, L, 0.0, 0.0, 0.0, -w}};
    ElementVector f = consistent_loads(beam(), triangle, {});
    // Triangular load rising to w at the end: wL^2/30 and wL^2/20, end forces
    // 3wL/20 and 7wL/20 (textbook fixed-end actions).
    CHECK(f[2] == same(-w * L * L / 30, w * L * L));
    CHECK(f[5] == same(w * L * L / 20, w * L * L));
    CHECK(f[1] == same(-3 * w * L / 20, w * L));
    CHECK(f[4] == same(-7 * w * L / 20, w * L));
    // Two halves of a uniform load add up to the whole (superposition).
    std::vector<LocalDistributed> halves{{0.0, 2.5, q, q, -w, -w}, {2.5, L, q, q, -w, -w}};
    std::vector<LocalDistributed> whole{{0.0, L, q, q, -w, -w}};
    ElementVector fh = consistent_loads(beam(), halves, {}),
                  fw = consistent_loads(beam(), whole, {});
    for (std::size_t i = 0; i < 6; ++i)
        CHECK(fh[i] == same(fw[i], w * L * L));
    // Uniform axial load: half to each end (statics).
    CHECK(fw[0] == same(q * L / 2, q * L));
    CHECK(fw[3] == same(q * L / 2, q * L));
}

TEST_CASE("condensed loads of a hinged member are the propped cantilever reactions", "[element]") {
    double w = 10e3;
    std::vector<LocalDistributed> udl{{0.0, L, 0.0, 0.0, -w, -w}};
    ElementProperties e = beam(true, false);
    ElementVector f = condensed_loads(e, consistent_loads(e, udl, {}));
    // Propped cantilever, pinned at the start: 3wL/8 there, 5wL/8 and wL^2/8 at
    // the fixed end (textbook; tests/SOURCES.md propped cantilever [C: S21]).
    CHECK(f[1] == same(-3 * w * L / 8, w * L));
    CHECK(f[2] == 0.0);
    CHECK(f[4] == same(-5 * w * L / 8, w * L));
    CHECK(f[5] == same(w * L * L / 8, w * L * L));
    ElementProperties both = beam(true, true);
    ElementVector g = condensed_loads(both, consistent_loads(both, udl, {}));
    CHECK(g[1] == same(-w * L / 2, w * L));  // simple span: wL/2 each (statics)
    CHECK(g[5] == 0.0);
}

TEST_CASE("released rotations and end forces of a hinged member", "[element]") {
    double w = 10e3, ei = E * I;
    std::vector<LocalDistributed> udl{{0.0, L, 0.0, 0.0, -w, -w}};
    ElementProperties both = beam(true, true);
    ElementVector f = consistent_loads(both, udl, {});
    ElementVector d = with_released_rotations(both, ElementVector{}, f);
    // Simple span, UDL: end slopes wL^3/24EI, clockwise at the start (textbook).
    CHECK(d[2] == same(-w * L * L * L / (24 * ei), 1e-3));
    CHECK(d[5] == same(w * L * L * L / (24 * ei), 1e-3));
    ElementVector forces = local_end_forces(both, ElementVector{}, f);
    CHECK(forces[1] == same(w * L / 2, w * L));  // reactions wL/2 (statics)
    CHECK(forces[2] == same(0.0, w * L * L));
    CHECK(forces[5] == same(0.0, w * L * L));
    ElementProperties propped = beam(false, true);
    ElementVector dp =
        with_released_rotations(propped, ElementVector{}, consistent_loads(propped, udl, {}));
    // Propped cantilever, pinned end slope wL^3/48EI (textbook).
    CHECK(dp[5] == same(w * L * L * L / (48 * ei), 1e-3));
}

TEST_CASE("rotation to global axes", "[element]") {
    MemberGeometry g{5.0, 0.6, 0.8};
    ElementVector v{1.0, 2.0, 3.0, -4.0, 5.0, -6.0};
    ElementVector back = to_global(to_local(v, g), g);
    for (std::size_t i = 0; i < 6; ++i)
        CHECK(back[i] == same(v[i], 1.0));
    // A vertical member: its axial stiffness acts in global y, bending in x.
    MemberGeometry up{L, 0.0, 1.0};
    ElementMatrix k = to_global(local_stiffness(beam()), up);
    CHECK(k[1][1] == same(E * A / L, 1.0));
    CHECK(k[0][0] == same(12 * E * I / (L * L * L), 1.0));
    CHECK(k[0][2] == same(-6 * E * I / (L * L), 1.0));  // x = -(local y) for a member pointing up
}

}  // namespace
}  // namespace firn
