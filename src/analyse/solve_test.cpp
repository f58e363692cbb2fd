// Tests of the solver: stability checks and their messages, released
// rotations, springs, and the many-case solve. Expected numbers come from
// textbook beam formulas and statics, as noted beside each check.
#include <fmt/format.h>
#include <catch2/catch.hpp>
#include <cmath>

#include "analyse/analyse.hpp"
#include "testing/test_model_builder.hpp"

namespace firn {
namespace {

using testing::exactly;
using testing::ModelBuilder;

constexpr double E = 200e9, A = 0.01, I = 8e-5, EI = E * I;
constexpr double L = 6.0, w = 10e3, P = 25e3;

bool all_finite(const Solution& s) {
    for (double v : s.displacements) {
        if (!std::isfinite(v))
            return false;
    }
    return true;
}

/// The one error of a failed solve: its message and the line it points at.
const Diagnostic& only_error(const testing::Analysis& a) {
    REQUIRE(a.diagnostics.error_count() == 1);
    CHECK_FALSE(a.solution.ok);
    CHECK(all_finite(a.solution));
    CHECK(a.results.cases.empty());
    return a.diagnostics.all().front();
}

/// Checks that the solve failed with a mechanism error pointing at `node`.
void require_mechanism_at(const testing::Analysis& a, const Model& model, NodeId node,
                          const std::string& movement) {
    const Diagnostic& d = only_error(a);
    CHECK(d.message == "the structure is unstable: node '" + model.nodes[at(node)].name +
                           "' is free to " + movement +
                           " (its members and supports form a mechanism)");
    CHECK(d.where.begin.line == model.nodes[at(node)].where.begin.line);
}

TEST_CASE("a beam on two rollers slides in x", "[solve]") {
    ModelBuilder b;
    SectionId s = b.section(b.material(E), A, I);
    NodeId na = b.node("A", 0.0, 0.0), nb = b.node("B", L, 0.0);
    MemberId m = b.member("AB", na, nb, s);
    b.support(na, Support::Kind::roller_free_x);
    b.support(nb, Support::Kind::roller_free_x);
    b.uniform(b.load_case("load"), m, LoadDirection::down, w);
    require_mechanism_at(testing::analyse(b.model), b.model, na, "move in x");
}

TEST_CASE("a pinned portal with a hinge at each beam end sways", "[solve]") {
    ModelBuilder b;
    SectionId s = b.section(b.material(E), A, I);
    NodeId na = b.node("A", 0.0, 0.0), nb = b.node("B", 0.0, 4.0);
    NodeId nc = b.node("C", 10.0, 4.0), nd = b.node("D", 10.0, 0.0);
    b.member("AB", na, nb, s);
    MemberId beam = b.member("BC", nb, nc, s, true, true);
    b.member("DC", nd, nc, s);
    b.support(na, Support::Kind::pinned);
    b.support(nd, Support::Kind::pinned);
    b.uniform(b.load_case("load"), beam, LoadDirection::down, w);
    require_mechanism_at(testing::analyse(b.model), b.model, nb, "move in x");
}

TEST_CASE("a loose node and a bar end with nothing across it", "[solve]") {
    ModelBuilder b;
    SectionId s = b.section(b.material(E), A, I);
    NodeId na = b.node("A", 0.0, 0.0), nb = b.node("B", L, 0.0);
    b.member("AB", na, nb, s, true, true);  // a bar: no stiffness across it at B
    b.support(na, Support::Kind::fixed);
    b.nodal(b.load_case("load"), nb, P, 0.0, 0.0);
    auto bar = testing::analyse(b.model);
    CHECK(only_error(bar).message ==
          "the structure is unstable: node 'B' is free to move in y "
          "(nothing restrains it in that direction)");
    ModelBuilder c;
    SectionId t = c.section(c.material(E), A, I);
    NodeId ca = c.node("A", 0.0, 0.0), cb = c.node("B", L, 0.0);
    c.node("stray", 3.0, 3.0);
    c.member("AB", ca, cb, t);
    c.support(ca, Support::Kind::fixed);
    c.load_case("empty");
    auto loose = testing::analyse(c.model);
    REQUIRE(loose.diagnostics.error_count() == 2);  // x and y of the stray node
    CHECK(loose.diagnostics.all()[0].message ==
          "the structure is unstable: node 'stray' is free to "
          "move in x (nothing restrains it in that direction)");
}

TEST_CASE("a node where every member is hinged keeps its rotation at 0", "[solve]") {
    ModelBuilder b;
    SectionId s = b.section(b.material(E), A, I);
    NodeId na = b.node("A", 0.0, 0.0), nb = b.node("B", L, 0.0), nc = b.node("C", 2 * L, 0.0);
    b.member("AB", na, nb, s, false, true);
    b.member("CB", nc, nb, s, false, true);
    b.support(na, Support::Kind::fixed);
    b.support(nc, Support::Kind::fixed);
    CaseId c = b.load_case("load");
    b.nodal(c, nb, 0.0, -P, 0.0);
    auto a = testing::analyse(b.model);
    testing::require_solved(a);
    CHECK(a.solution.rotation_free[at(nb)] == 1);
    CHECK(a.displacement(c, nb, dof_rotation) == 0.0);
    // Two cantilevers of stiffness 3EI/L^3 share the load (textbook cantilever):
    // delta = P L^3 / 6EI, and each root takes P/2 and P L / 2.
    CHECK(a.displacement(c, nb, dof_y) == exactly(-P * L * L * L / (6 * EI)));
    CHECK(a.reaction(c, 0)[1] == exactly(P / 2));
    CHECK(a.reaction(c, 1)[2] == exactly(-P * L / 2));

    b.nodal(c, nb, 0.0, 0.0, 1e3);  // now a couple where nothing can resist it
    auto bad = testing::analyse(b.model);
    CHECK(only_error(bad).message ==
          "the structure is unstable: node 'B' is free to rotate under "
          "this moment (every member is hinged there and no support "
          "holds its rotation)");
}

TEST_CASE("springs", "[solve]") {
    ModelBuilder b;
    SectionId s = b.section(b.material(E), A, I);
    NodeId na = b.node("A", 0.0, 0.0), nb = b.node("B", L, 0.0);
    NodeId nc = b.node("C", 0.0, 3.0), nd = b.node("D", L, 3.0);
    MemberId beam = b.member("AB", na, nb, s);
    b.member("CD", nc, nd, s);
    double ky = 2e6, kr = 5e6;
    b.support(na, Support::Kind::pinned);
    b.springs(nb, 0.0, ky, 0.0);
    b.springs(nc, -1.0, -1.0, kr);  // fixed in x and y, a rotational spring
    CaseId c = b.load_case("load");
    b.uniform(c, beam, LoadDirection::down, w);
    b.nodal(c, nd, 0.0, -P, 0.0);
    auto a = testing::analyse(b.model);
    testing::require_solved(a);
    // Simple span on a spring (statics): the spring carries wL/2 and sinks wL/2k.
    CHECK(a.reaction(c, 1)[1] == exactly(w * L / 2));
    CHECK(a.displacement(c, nb, dof_y) == exactly(-w * L / 2 / ky));
    // Cantilever on a rotational spring (superposition): PL^3/3EI + (PL/kr) L.
    CHECK(a.displacement(c, nd, dof_y) == exactly(-P * L * L * L / (3 * EI) - P * L * L / kr));
    CHECK(a.reaction(c, 2)[2] == exactly(P * L));
}

TEST_CASE("every case is a right-hand side of one factorization", "[solve]") {
    ModelBuilder b;
    SectionId s = b.section(b.material(E), A, I);
    std::vector<NodeId> base, top;
    for (int i = 0; i <= 4; ++i) {
        base.push_back(b.node(fmt::format("A{}", i), 5.0 * i, 0.0));
        top.push_back(b.node(fmt::format("B{}", i), 5.0 * i, 4.0));
        b.support(base.back(), Support::Kind::fixed);
        b.member(fmt::format("C{}", i), base.back(), top.back(), s);
    }
    std::vector<MemberId> beams;
    for (std::size_t i = 0; i < 4; ++i)
        beams.push_back(b.member(fmt::format("G{}", i), top[i], top[i + 1], s));
    std::vector<CaseId> cases;
    for (int k = 0; k < 7; ++k) {
        cases.push_back(b.load_case(fmt::format("case{}", k)));
        b.uniform(cases.back(), beams[static_cast<std::size_t>(k) % 4], LoadDirection::down,
                  w * (k + 1));
        b.nodal(cases.back(), top[static_cast<std::size_t>(k) % 5], P * (k - 3), 0.0, 1e3 * k);
    }
    // The last case is case0 + 2 case1, loads copied.
    CaseId sum = b.load_case("sum");
    for (int k = 0; k < 2; ++k) {
        for (DistributedLoad d :
             b.model.cases[at(cases[static_cast<std::size_t>(k)])].distributed) {
            d.w_start *= k + 1;
            d.w_end *= k + 1;
            b.loads(sum).distributed.push_back(d);
        }
        for (NodalLoad n : b.model.cases[at(cases[static_cast<std::size_t>(k)])].nodal) {
            n.fx *= k + 1;
            n.moment *= k + 1;
            b.loads(sum).nodal.push_back(n);
        }
    }
    Diagnostics diagnostics;
    LoadSet loads = derive_loads(b.model, diagnostics);
    SolveTimings timings;
    timings.factor = -1.0;
    Solution solution = solve(b.model, loads, diagnostics, &timings);
    REQUIRE(solution.ok);
    CHECK(timings.factor >= 0.0);
    // Superposition (linear elasticity): u(sum) = u(case0) + 2 u(case1).
    for (std::size_t n = 0; n < b.model.nodes.size(); ++n) {
        for (Dof d : {dof_x, dof_y, dof_rotation}) {
            NodeId id = make_id<NodeId>(n);
            double expected =
                solution.displacement(cases[0], id, d) + 2 * solution.displacement(cases[1], id, d);
            CHECK(solution.displacement(sum, id, d) ==
                  Approx(expected).epsilon(1e-9).margin(1e-15));
        }
    }
    testing::Analysis a = testing::analyse(b.model);
    testing::require_solved(a);
}

TEST_CASE("a case's results do not depend on the other cases solved with it", "[solve]") {
    // Cases are solved and summarized in groups, one per thread; a case solved
    // alone must give the same bits as the same case among others.
    ModelBuilder b;
    SectionId s = b.section(b.material(E), A, I);
    NodeId na = b.node("A", 0.0, 0.0), nb = b.node("B", 0.0, 4.0), nc = b.node("C", L, 4.0);
    NodeId nd = b.node("D", L, 0.0);
    b.member("AB", na, nb, s);
    MemberId beam = b.member("BC", nb, nc, s);
    b.member("DC", nd, nc, s);
    b.support(na, Support::Kind::fixed);
    b.support(nd, Support::Kind::pinned);
    for (int k = 0; k < 5; ++k) {
        CaseId c = b.load_case(fmt::format("case{}", k));
        b.spread(c, beam, LoadDirection::down, 0.5 * k, L, w, w * (1 + k));
        b.nodal(c, nb, P * k, 0.0, 0.0);
    }
    ModelBuilder single = b;
    single.model.cases = {b.model.cases[3]};
    auto all = testing::analyse(b.model), one = testing::analyse(single.model);
    testing::require_solved(all);
    testing::require_solved(one);
    CaseId third = make_id<CaseId>(3), only = make_id<CaseId>(0);
    for (std::size_t n = 0; n < b.model.nodes.size(); ++n) {
        for (Dof d : {dof_x, dof_y, dof_rotation}) {
            NodeId id = make_id<NodeId>(n);
            CHECK(all.displacement(third, id, d) == one.displacement(only, id, d));
        }
    }
    const MemberSummary &x = all.member(third, beam), &y = one.member(only, beam);
    CHECK(x.moment_max.value == y.moment_max.value);
    CHECK(x.moment_max.position == y.moment_max.position);
    CHECK(x.deflection_max.value == y.deflection_max.value);
}

TEST_CASE("members without stiffness are reported, not solved", "[solve]") {
    ModelBuilder b;
    SectionId s = b.section(b.material(E), A, 0.0);
    NodeId na = b.node("A", 0.0, 0.0), nb = b.node("B", L, 0.0);
    MemberId m = b.member("AB", na, nb, s);
    b.support(na, Support::Kind::fixed);
    b.load_case("load");
    auto a = testing::analyse(b.model);
    const Diagnostic& d = only_error(a);
    CHECK(d.message == "member 'AB' has no stiffness: E*A and E*I must be positive");
    CHECK(d.where.begin.line == b.model.members[at(m)].where.begin.line);
}

}  // namespace
}  // namespace firn

namespace firn {
namespace {

/// The first warning of an analysis that solved, or none.
std::string first_warning(const testing::Analysis& a) {
    for (const Diagnostic& d : a.diagnostics.all()) {
        if (d.severity == Severity::warning)
            return d.message;
    }
    return "";
}

TEST_CASE("pin-ended bars in a straight line are a mechanism, across and along", "[solve]") {
    // A tie of two bars hinged at both ends, split at a hoist node C: nothing holds C
    // across the line (statics: two collinear two-force members carry no transverse load).
    for (double slope : {0.0, 0.5}) {
        ModelBuilder b;
        SectionId s = b.section(b.material(E), A, I);
        NodeId na = b.node("A", 0.0, 0.0), nc = b.node("C", 4.0, 4.0 * slope);
        NodeId nb = b.node("B", 8.0, 8.0 * slope);
        b.member("AC", na, nc, s, true, true);
        b.member("CB", nc, nb, s, true, true);
        b.support(na, Support::Kind::pinned);
        b.support(nb, Support::Kind::pinned);
        b.nodal(b.load_case("hoist"), nc, 0.0, -P, 0.0);
        auto a = testing::analyse(b.model);
        const Diagnostic& d = only_error(a);
        INFO(d.message);
        CHECK(d.message.find("node 'C' is free to move in") != std::string::npos);
    }
}

TEST_CASE("a stiffness ratio of 1e12 is stable: solved, with a conditioning warning", "[solve]") {
    // A fixed-base portal whose beam is 1e12 times as stiff as its columns: the beam is
    // rigid, so a lateral load H at the top sways both columns as fixed-fixed members,
    // each 12EI/h^3: sway = H h^3 / (24 EI) (statics with the slope-deflection stiffness).
    ModelBuilder b;
    MaterialId steel = b.material(E);
    SectionId beam = b.section(steel, A * 1e12, I * 1e12), column = b.section(steel, A, I);
    double h = 4.0, H = 10e3;
    NodeId na = b.node("A", 0.0, 0.0), nb = b.node("B", 0.0, h);
    NodeId nc = b.node("C", 8.0, h), nd = b.node("D", 8.0, 0.0);
    b.member("left", na, nb, column);
    b.member("beam", nb, nc, beam);
    b.member("right", nd, nc, column);
    b.support(na, Support::Kind::fixed);
    b.support(nd, Support::Kind::fixed);
    CaseId c = b.load_case("push");
    b.nodal(c, nb, H, 0.0, 0.0);
    auto a = testing::analyse(b.model);
    REQUIRE(a.diagnostics.error_count() == 0);
    REQUIRE(a.solution.ok);
    // To the digits such a conditioning leaves: kappa x 1.1e-16 = 4e13 x 1.1e-16 ~ 5e-3.
    CHECK(a.displacement(c, nc, dof_x) == Approx(H * h * h * h / (24 * EI)).epsilon(1e-2));
    std::string warning = first_warning(a);
    INFO(warning);
    CHECK(warning.rfind("the stiffness matrix is badly conditioned (estimate", 0) == 0);
    // Stiffness scales max(EA/L, 12EI/L^3): beam 2.5e20 N/m, columns EA/h = 5e8 N/m.
    CHECK(warning.find("member 'beam' is 5.0e+11 times as stiff as member 'left'") !=
          std::string::npos);
}

TEST_CASE("a 1 mm link between two 10 m spans is stable and solved", "[solve]") {
    // Two 10 m spans joined by a 1 mm link, pinned at the far ends and a roller under the
    // link: the link is rigid beside the spans, so each span is propped at the link and the
    // link node hardly moves (statics: the roller takes the load at the link).
    ModelBuilder b;
    SectionId s = b.section(b.material(E), A, I);
    NodeId na = b.node("A", 0.0, 0.0), nb = b.node("B", 10.0, 0.0);
    NodeId nc = b.node("C", 10.001, 0.0), nd = b.node("D", 20.001, 0.0);
    MemberId left = b.member("left", na, nb, s);
    b.member("link", nb, nc, s);
    b.member("right", nc, nd, s);
    b.support(na, Support::Kind::pinned);
    b.support(nb, Support::Kind::roller_free_x);
    b.support(nd, Support::Kind::roller_free_x);
    CaseId c = b.load_case("load");
    b.uniform(c, left, LoadDirection::down, w);
    auto a = testing::analyse(b.model);
    REQUIRE(a.diagnostics.error_count() == 0);
    REQUIRE(a.solution.ok);
    // Equilibrium of the whole frame (statics): the reactions carry the 10 m of load, to
    // the digits such a conditioning leaves (the warning says how many are lost).
    double total = a.reaction(c, 0)[1] + a.reaction(c, 1)[1] + a.reaction(c, 2)[1];
    CHECK(total == Approx(w * 10.0).epsilon(1e-6));
    // Through the link the beam is continuous over B: a two-span beam with one span
    // loaded, R_A = 7wL/16 (three-moment equation), the 1 mm link changing it by ~1e-4.
    CHECK(a.reaction(c, 0)[1] == Approx(7.0 * w * 10.0 / 16.0).epsilon(1e-3));
    // Once refused as a mechanism; its pivots lose fewer than 8 digits, so no warning.
    CHECK(first_warning(a).empty());
}

TEST_CASE("a frame held only by a soft rotational spring is solved with warnings", "[solve]") {
    // A cantilever column on a base spring of 1e-4 kN*m/rad under a lateral load H at its
    // top: the spring alone resists, so the top sways H h^2 / k (rigid-body rotation about
    // the base, statics), far beyond what a linear analysis describes.
    ModelBuilder b;
    SectionId s = b.section(b.material(E), A, I);
    NodeId base = b.node("base", 0.0, 0.0), top = b.node("top", 0.0, 4.0);
    b.member("column", base, top, s);
    b.springs(base, -1.0, -1.0, 0.1);
    CaseId c = b.load_case("push");
    b.nodal(c, top, 1e3, 0.0, 0.0);
    auto a = testing::analyse(b.model);
    REQUIRE(a.diagnostics.error_count() == 0);
    REQUIRE(a.solution.ok);
    CHECK(a.displacement(c, top, dof_x) == Approx(1e3 * 16.0 / 0.1).epsilon(1e-6));
    bool large = false, conditioned = false;
    for (const Diagnostic& d : a.diagnostics.all()) {
        large = large || d.message.rfind("load case 'push' moves node 'top' by", 0) == 0;
        conditioned = conditioned || d.message.find("badly conditioned") != std::string::npos;
    }
    CHECK(large);
    CHECK(conditioned);
}

}  // namespace
}  // namespace firn
