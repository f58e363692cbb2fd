// Member results of single beams against closed forms: handbook beam
// formulas, tests/SOURCES.md and statics. Member functions are checked at
// points and through their exact extremes.
#include <catch2/catch.hpp>
#include <cmath>

#include "base/polynomial.hpp"
#include "ir/results.hpp"
#include "testing/test_model_builder.hpp"

namespace firn {
namespace {

using testing::exactly;
using testing::ModelBuilder;

constexpr double E = 200e9, A = 0.01, I = 8e-5, EI = E * I;
constexpr double L = 8.0, w = 15e3, P = 40e3;

/// A horizontal beam A-B of span L with the given end supports and one load case.
struct Beam {
    ModelBuilder b;
    NodeId a{}, e{};
    MemberId m{};
    CaseId c{};
    Beam(Support::Kind start, Support::Kind end, bool hinge_start = false, bool hinge_end = false) {
        SectionId s = b.section(b.material(E), A, I);
        a = b.node("A", 0.0, 0.0);
        e = b.node("B", L, 0.0);
        m = b.member("AB", a, e, s, hinge_start, hinge_end);
        b.support(a, start);
        b.support(e, end);
        c = b.load_case("load");
    }
};

/// The value of a member function at s (from the piece holding s, its left side at a jump).
double value_at(const MemberFunctions& f, double s, Polynomial FunctionPiece::*which) {
    for (const FunctionPiece& p : f.pieces) {
        if (s <= p.b)
            return (p.*which)(s - p.a);
    }
    return (f.pieces.back().*which)(f.pieces.back().b - f.pieces.back().a);
}

TEST_CASE("simply supported beam under a uniform load", "[results]") {
    Beam beam(Support::Kind::pinned, Support::Kind::roller_free_x);
    beam.b.uniform(beam.c, beam.m, LoadDirection::down, w);
    auto a = testing::analyse(beam.b.model);
    testing::require_solved(a);
    const MemberSummary& s = a.member(beam.c, beam.m);
    // tests/SOURCES.md simply supported: R = wL/2, M = wL^2/8, delta = 5wL^4/384EI at mid-span.
    CHECK(a.reaction(beam.c, 0)[1] == exactly(w * L / 2));
    CHECK(a.reaction(beam.c, 1)[1] == exactly(w * L / 2));
    CHECK(a.reaction(beam.c, 0)[0] == exactly(0.0, w * L));
    CHECK(s.moment_max.value == exactly(w * L * L / 8));
    CHECK(s.moment_max.position == exactly(L / 2));
    CHECK(s.moment_min.value == exactly(0.0, w * L * L));
    CHECK(s.deflection_max.value == exactly(-5 * w * L * L * L * L / (384 * EI)));
    CHECK(s.deflection_max.position == exactly(L / 2));
    CHECK(std::abs(s.shear_max.value) == exactly(w * L / 2));
    // Shear is dM/dx: +wL/2 at the start, -wL/2 at the end (statics).
    CHECK(s.start[1] == exactly(w * L / 2));
    CHECK(s.end[1] == exactly(-w * L / 2));
    MemberFunctions f =
        member_functions(beam.b.model, a.loads.cases[0], a.solution, beam.c, beam.m);
    REQUIRE(f.pieces.size() == 1);
    // M(x) = w x (L - x) / 2 (statics) at the quarter point.
    CHECK(f.pieces[0].moment(L / 4) == exactly(w * (L / 4) * (3 * L / 4) / 2));
}

TEST_CASE("fixed-fixed beam under a uniform load", "[results]") {
    Beam beam(Support::Kind::fixed, Support::Kind::fixed);
    beam.b.uniform(beam.c, beam.m, LoadDirection::down, w);
    auto a = testing::analyse(beam.b.model);
    testing::require_solved(a);
    const MemberSummary& s = a.member(beam.c, beam.m);
    // tests/SOURCES.md fixed-fixed [C: S21]: -wL^2/12 at the ends, +wL^2/24
    // and wL^4/384EI at mid-span, inflection points 0.2113L from each end.
    CHECK(s.start[2] == exactly(-w * L * L / 12));
    CHECK(s.end[2] == exactly(-w * L * L / 12));
    CHECK(s.moment_min.value == exactly(-w * L * L / 12));
    CHECK(s.moment_max.value == exactly(w * L * L / 24));
    CHECK(s.moment_max.position == exactly(L / 2));
    CHECK(s.deflection_max.value == exactly(-w * L * L * L * L / (384 * EI)));
    CHECK(a.reaction(beam.c, 0)[2] ==
          exactly(w * L * L / 12));  // the wall turns it counterclockwise
    MemberFunctions f =
        member_functions(beam.b.model, a.loads.cases[0], a.solution, beam.c, beam.m);
    RealRoots zeros = real_roots(f.pieces[0].moment, 0.0, L);
    REQUIRE(zeros.count == 2);
    CHECK(zeros.x[0] / L == Approx(0.5 - 0.5 / std::sqrt(3.0)).epsilon(1e-9));  // 0.2113 exactly
    CHECK(zeros.x[1] / L == Approx(0.5 + 0.5 / std::sqrt(3.0)).epsilon(1e-9));
}

TEST_CASE("propped cantilever under a uniform load", "[results]") {
    for (bool hinged_member : {false, true}) {
        Beam beam(Support::Kind::fixed, Support::Kind::pinned, false, hinged_member);
        beam.b.uniform(beam.c, beam.m, LoadDirection::down, w);
        auto a = testing::analyse(beam.b.model);
        testing::require_solved(a);
        const MemberSummary& s = a.member(beam.c, beam.m);
        // tests/SOURCES.md propped cantilever [C: S21]: M_A = -wL^2/8, R_A = 5wL/8,
        // R_B = 3wL/8, M+ = 9wL^2/128 at 3L/8 from the pinned end, deflection
        // (39 + 55 sqrt 33)/65536 wL^4/EI at (1 + sqrt 33)/16 L = 0.4215L from it.
        CHECK(s.start[2] == exactly(-w * L * L / 8));
        CHECK(a.reaction(beam.c, 0)[1] == exactly(5 * w * L / 8));
        CHECK(a.reaction(beam.c, 1)[1] == exactly(3 * w * L / 8));
        CHECK(s.moment_max.value == exactly(9 * w * L * L / 128));
        CHECK(s.moment_max.position == exactly(L - 3 * L / 8));
        double k = (39 + 55 * std::sqrt(33.0)) / 65536;
        CHECK(s.deflection_max.value == exactly(-k * w * L * L * L * L / EI));
        CHECK(s.deflection_max.position ==
              Approx(L - (1 + std::sqrt(33.0)) / 16 * L).epsilon(1e-8));
        CHECK(s.end[2] == exactly(0.0, w * L * L));
        // The pinned end's node turns freely; with the member hinged there
        // nothing else meets it, so its rotation is undetermined and held.
        CHECK(a.solution.rotation_free[1] == (hinged_member ? 1 : 0));
    }
}

TEST_CASE("cantilever under a tip load and a uniform load", "[results]") {
    ModelBuilder b;
    SectionId sec = b.section(b.material(E), A, I);
    NodeId root = b.node("A", 0.0, 0.0), tip = b.node("B", L, 0.0);
    MemberId m = b.member("AB", root, tip, sec);
    b.support(root, Support::Kind::fixed);
    CaseId point = b.load_case("tip"), spread = b.load_case("uniform");
    b.nodal(point, tip, 0.0, -P, 0.0);
    b.uniform(spread, m, LoadDirection::down, w);
    auto a = testing::analyse(b.model);
    testing::require_solved(a);
    // tests/SOURCES.md cantilever: M = -PL, delta = PL^3/3EI, theta = PL^2/2EI;
    // UDL: M = -wL^2/2, delta = wL^4/8EI, theta = wL^3/6EI (clockwise, so negative).
    CHECK(a.member(point, m).start[2] == exactly(-P * L));
    CHECK(a.displacement(point, tip, dof_y) == exactly(-P * L * L * L / (3 * EI)));
    CHECK(a.displacement(point, tip, dof_rotation) == exactly(-P * L * L / (2 * EI)));
    CHECK(a.member(spread, m).start[2] == exactly(-w * L * L / 2));
    CHECK(a.member(spread, m).moment_min.value == exactly(-w * L * L / 2));
    CHECK(a.displacement(spread, tip, dof_y) == exactly(-w * L * L * L * L / (8 * EI)));
    CHECK(a.displacement(spread, tip, dof_rotation) == exactly(-w * L * L * L / (6 * EI)));
    CHECK(a.reaction(spread, 0)[2] == exactly(w * L * L / 2));
}

TEST_CASE("point load at a distance on a simple beam", "[results]") {
    Beam beam(Support::Kind::pinned, Support::Kind::roller_free_x);
    double pa = 2 * L / 3, pb = L - pa;
    beam.b.point(beam.c, beam.m, LoadDirection::down, pa, P);
    auto a = testing::analyse(beam.b.model);
    testing::require_solved(a);
    const MemberSummary& s = a.member(beam.c, beam.m);
    // Simple beam, load at any point (textbook): R_A = Pb/L, M = Pab/L under the
    // load, shear Pb/L left of it and -Pa/L right of it, deflection
    // Pb (L^2 - b^2)^1.5 / (9 sqrt3 L EI) at sqrt((L^2 - b^2)/3) for a > b.
    CHECK(a.reaction(beam.c, 0)[1] == exactly(P * pb / L));
    CHECK(s.moment_max.value == exactly(P * pa * pb / L));
    CHECK(s.moment_max.position == exactly(pa));
    CHECK(s.shear_max.value == exactly(-P * pa / L));  // the larger side of the jump
    CHECK(s.start[1] == exactly(P * pb / L));
    double lb = L * L - pb * pb;
    CHECK(s.deflection_max.value ==
          exactly(-P * pb * std::pow(lb, 1.5) / (9 * std::sqrt(3.0) * L * EI)));
    CHECK(s.deflection_max.position == Approx(std::sqrt(lb / 3)).epsilon(1e-8));
}

TEST_CASE("point moment at a distance on a simple beam", "[results]") {
    Beam beam(Support::Kind::pinned, Support::Kind::roller_free_x);
    double M0 = 60e3, pa = 3.0, pb = L - pa;
    beam.b.moment(beam.c, beam.m, pa, M0);
    auto a = testing::analyse(beam.b.model);
    testing::require_solved(a);
    const MemberSummary& s = a.member(beam.c, beam.m);
    // Statics: R_A = M0/L up, M = M0 x/L left of the couple, jumping to -M0 b/L.
    CHECK(a.reaction(beam.c, 0)[1] == exactly(M0 / L));
    CHECK(s.moment_max.value == exactly(M0 * pa / L));
    CHECK(s.moment_max.position == exactly(pa));
    CHECK(s.moment_min.value == exactly(-M0 * pb / L));
    CHECK(s.moment_min.position == exactly(pa));
    CHECK(s.shear_max.value == exactly(M0 / L));
}

TEST_CASE("partial uniform, triangular and trapezoidal loads", "[results]") {
    Beam beam(Support::Kind::pinned, Support::Kind::roller_free_x);
    CaseId partial = beam.c, triangle = beam.b.load_case("triangle"),
           trapezoid = beam.b.load_case("trapezoid");
    double pa = 3.0;
    beam.b.spread(partial, beam.m, LoadDirection::down, 0.0, pa, w, w);
    beam.b.spread(triangle, beam.m, LoadDirection::down, 0.0, L, 0.0, w);
    double t1 = 1.0, t2 = 5.0, w1 = 4e3, w2 = 10e3;
    beam.b.spread(trapezoid, beam.m, LoadDirection::down, t1, t2, w1, w2);
    auto a = testing::analyse(beam.b.model);
    testing::require_solved(a);
    // Partial load on [0, a] (statics): R_A = w a (L - a/2) / L, M max = R_A^2 / 2w at R_A / w.
    double ra = w * pa * (L - pa / 2) / L;
    CHECK(a.reaction(partial, 0)[1] == exactly(ra));
    CHECK(a.member(partial, beam.m).moment_max.value == exactly(ra * ra / (2 * w)));
    CHECK(a.member(partial, beam.m).moment_max.position == exactly(ra / w));
    // Triangular load rising to w (textbook): R = wL/6 and wL/3, M max = wL^2/(9 sqrt3) at L/sqrt3.
    CHECK(a.reaction(triangle, 0)[1] == exactly(w * L / 6));
    CHECK(a.reaction(triangle, 1)[1] == exactly(w * L / 3));
    CHECK(a.member(triangle, beam.m).moment_max.value == exactly(w * L * L / (9 * std::sqrt(3.0))));
    CHECK(a.member(triangle, beam.m).moment_max.position == exactly(L / std::sqrt(3.0)));
    // Trapezoid on [t1, t2] (statics): resultant W at its centroid; right of the load M = R_B (L -
    // x).
    double W = 0.5 * (w1 + w2) * (t2 - t1);
    double centroid = t1 + (t2 - t1) * (w1 + 2 * w2) / (3 * (w1 + w2));
    double rb = W * centroid / L;
    CHECK(a.reaction(trapezoid, 1)[1] == exactly(rb));
    MemberFunctions f =
        member_functions(beam.b.model, a.loads.cases[2], a.solution, trapezoid, beam.m);
    CHECK(f.pieces.size() == 3);
    CHECK(value_at(f, 6.5, &FunctionPiece::moment) == exactly(rb * (L - 6.5)));
    CHECK(value_at(f, 0.5, &FunctionPiece::moment) == exactly((W - rb) * 0.5));
}

TEST_CASE("axial, transverse and global x loads", "[results]") {
    ModelBuilder b;
    SectionId sec = b.section(b.material(E), A, I);
    double h = 5.0;
    NodeId base = b.node("A", 0.0, 0.0), top = b.node("B", 0.0, h);
    MemberId column = b.member("AB", base, top, sec);
    b.support(base, Support::Kind::fixed);
    CaseId gravity = b.load_case("gravity"), wind = b.load_case("wind"),
           mixed = b.load_case("mixed");
    b.uniform(gravity, column, LoadDirection::down, w);
    b.uniform(wind, column, LoadDirection::global_x, w);
    b.point(mixed, column, LoadDirection::axial, 2.0, P);     // up the column
    b.point(mixed, column, LoadDirection::transverse, h, P);  // local y of an upward member: -x
    auto a = testing::analyse(b.model);
    testing::require_solved(a);
    // Gravity along the column (statics): compression w h at the base, none at the top.
    CHECK(a.member(gravity, column).axial_min.value == exactly(-w * h));
    CHECK(a.member(gravity, column).axial_min.position == exactly(0.0, h));
    CHECK(a.member(gravity, column).axial_max.value == exactly(0.0, w * h));
    CHECK(a.reaction(gravity, 0)[1] == exactly(w * h));
    // Wind on a cantilever column (statics; tip deflection wh^4/8EI, textbook):
    // the base pushes back w h and turns it counterclockwise by wh^2/2.
    CHECK(a.reaction(wind, 0)[0] == exactly(-w * h));
    CHECK(a.reaction(wind, 0)[2] == exactly(w * h * h / 2));
    CHECK(a.member(wind, column).start[2] == exactly(-w * h * h / 2));
    CHECK(a.displacement(wind, top, dof_x) == exactly(w * h * h * h * h / (8 * E * I)));
    // Statics: a push P up the column at 2 m is held by the base pulling down,
    // so the column below it is in tension P; a transverse tip force acts in -x
    // (local y of a member pointing up), so the base pushes +x and turns it by -Ph.
    CHECK(a.member(mixed, column).axial_max.value == exactly(P));
    CHECK(a.member(mixed, column).axial_max.position == exactly(0.0, h));
    CHECK(a.reaction(mixed, 0)[1] == exactly(-P));
    CHECK(a.reaction(mixed, 0)[0] == exactly(P));
    CHECK(a.reaction(mixed, 0)[2] == exactly(-P * h));
}

TEST_CASE("hinged beam: the hinge carries no moment", "[results]") {
    ModelBuilder b;
    SectionId sec = b.section(b.material(E), A, I);
    double l1 = 3.0, l2 = 6.0;
    NodeId na = b.node("A", 0.0, 0.0), nb = b.node("B", l1, 0.0), nc = b.node("C", l1 + l2, 0.0);
    MemberId ab = b.member("AB", na, nb, sec, false, true);
    MemberId bc = b.member("BC", nb, nc, sec);
    b.support(na, Support::Kind::fixed);
    b.support(nc, Support::Kind::roller_free_x);
    CaseId c = b.load_case("uniform");
    b.uniform(c, ab, LoadDirection::down, w);
    b.uniform(c, bc, LoadDirection::down, w);
    auto a = testing::analyse(b.model);
    testing::require_solved(a);
    // Statics: BC spans from the hinge to C, so R_C = w l2 / 2 and the hinge
    // passes w l2 / 2 to the cantilever AB: M_A = -w l1^2/2 - (w l2/2) l1.
    CHECK(a.reaction(c, 1)[1] == exactly(w * l2 / 2));
    CHECK(a.reaction(c, 0)[1] == exactly(w * l1 + w * l2 / 2));
    CHECK(a.member(c, ab).start[2] == exactly(-w * l1 * l1 / 2 - w * l2 * l1 / 2));
    CHECK(a.member(c, ab).end[2] == exactly(0.0, w * l1 * l1));
    CHECK(a.member(c, bc).start[2] == exactly(0.0, w * l1 * l1));
    CHECK(a.member(c, bc).moment_max.value == exactly(w * l2 * l2 / 8));
    CHECK(a.member(c, bc).moment_max.position == exactly(l2 / 2));
    CHECK(a.solution.rotation_free[at(nb)] == 0);
}

TEST_CASE("sloped rafter under a load per horizontal projection", "[results]") {
    ModelBuilder b;
    SectionId sec = b.section(b.material(E), A, I);
    double lh = 9.0, rise = 3.0, length = std::hypot(lh, rise), sin_a = rise / length;
    NodeId low = b.node("A", 0.0, 0.0), high = b.node("B", lh, rise);
    MemberId m = b.member("AB", low, high, sec);
    b.support(low, Support::Kind::pinned);
    b.support(high, Support::Kind::roller_free_x);
    CaseId c = b.load_case("snow");
    b.uniform(c, m, LoadDirection::down, w, true);
    auto a = testing::analyse(b.model);
    testing::require_solved(a);
    // Statics of an inclined simple beam, w per horizontal length: vertical
    // reactions w Lh / 2, M max = w Lh^2 / 8 at mid-span, axial force from
    // -(w Lh/2) sin(a) at the low end to +(w Lh/2) sin(a) at the high end.
    CHECK(a.reaction(c, 0)[1] == exactly(w * lh / 2));
    CHECK(a.reaction(c, 1)[1] == exactly(w * lh / 2));
    CHECK(a.reaction(c, 0)[0] == exactly(0.0, w * lh));
    const MemberSummary& s = a.member(c, m);
    CHECK(s.moment_max.value == exactly(w * lh * lh / 8));
    CHECK(s.moment_max.position == exactly(length / 2));
    CHECK(s.axial_min.value == exactly(-w * lh / 2 * sin_a));
    CHECK(s.axial_max.value == exactly(w * lh / 2 * sin_a));
    CHECK(s.axial_max.position == exactly(length));
}

}  // namespace
}  // namespace firn
