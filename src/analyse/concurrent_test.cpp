// Concurrent forces: what acts with each enveloped value under the combination
// that gives it, checked by hand on a two-span beam and a statically determinate
// portal, and a support's reaction set under one combination against the
// factored sum of its cases' reactions.
#include <catch2/catch.hpp>
#include <cmath>
#include <vector>

#include "analyse/analyse.hpp"
#include "testing/test_model_builder.hpp"

namespace firn {
namespace {

using testing::exactly;
using testing::ModelBuilder;

constexpr double E = 200e9, A = 0.01, I = 8e-5;

/// The enveloped moment of larger size, whichever sign it has.
const Governing& larger_moment(const MemberEnvelope& e) {
    return std::abs(e.moment_max.value) >= std::abs(e.moment_min.value) ? e.moment_max
                                                                        : e.moment_min;
}

TEST_CASE("two spans: the shear and moment acting with the governing moments", "[concurrent]") {
    // Two equal spans A-B-C of L = 6 m, pinned at A, rollers at B and C. Dead load
    // on both spans; live load on span 1 only or on both (pattern loading).
    const double L = 6.0, wd = 10e3, wl = 20e3;
    ModelBuilder b;
    SectionId s = b.section(b.material(E), A, I);
    NodeId na = b.node("A", 0.0, 0.0), nb = b.node("B", L, 0.0), nc = b.node("C", 2 * L, 0.0);
    MemberId ab = b.member("AB", na, nb, s), bc = b.member("BC", nb, nc, s);
    b.support(na, Support::Kind::pinned);
    b.support(nb, Support::Kind::roller_free_x);
    b.support(nc, Support::Kind::roller_free_x);
    CaseId dead = b.load_case("D"), live1 = b.load_case("L span 1"),
           live2 = b.load_case("L span 2");
    for (MemberId m : {ab, bc})
        b.uniform(dead, m, LoadDirection::down, wd);
    b.uniform(live1, ab, LoadDirection::down, wl);
    b.uniform(live2, bc, LoadDirection::down, wl);
    auto a = testing::analyse(b.model);
    testing::require_solved(a);
    // ASCE 7-16 Sec. 2.3.1 combinations 1 and 2 (from memory), live on one span or both.
    std::vector<Combination> ks = {{"1.4D", {{dead, 1.4}}},
                                   {"1.2D + 1.6L1", {{dead, 1.2}, {live1, 1.6}}},
                                   {"1.2D + 1.6L", {{dead, 1.2}, {live1, 1.6}, {live2, 1.6}}}};
    Envelopes e = compute_envelopes(b.model, a.loads, a.solution, a.results, ks);
    const double q_all = 1.2 * wd + 1.6 * wl;  // 44 kN/m on both spans
    // Two equal spans, uniform q on both: M_B = -qL^2/8, R_A = 3qL/8, the shear just
    // left of B -5qL/8, M+ = 9qL^2/128 at 3L/8 where V = 0 (three-moment equation,
    // tests/SOURCES.md [C: S20]; statics for the shears).
    const Governing& hog = e.members[at(ab)].moment_min;
    CHECK(hog.combination == 2);
    CHECK(hog.value == exactly(-q_all * L * L / 8, q_all * L * L));
    CHECK(hog.position == exactly(L, L));
    CHECK(hog.concurrent[0] == exactly(0.0, q_all * L));  // no axial load (statics)
    CHECK(hog.concurrent[1] == exactly(-5 * q_all * L / 8, q_all * L));
    CHECK(hog.concurrent[2] == exactly(hog.value, q_all * L * L));
    // The first span's sagging moment is largest with live load on span 1 alone:
    // q1 = 44 kN/m on AB, q2 = 12 kN/m on BC. Three-moment equation for two equal
    // spans: M_B = -(q1 + q2) L^2 / 16; R_A = q1 L/2 + M_B/L; M+ = R_A^2/(2 q1) at
    // x = R_A/q1, where V = 0.
    const double q1 = q_all, q2 = 1.2 * wd;
    const double mb = -(q1 + q2) * L * L / 16, ra = q1 * L / 2 + mb / L;
    const Governing& sag = e.members[at(ab)].moment_max;
    CHECK(sag.combination == 1);
    CHECK(sag.value == exactly(ra * ra / (2 * q1), q1 * L * L));
    CHECK(sag.position == exactly(ra / q1, L));
    CHECK(sag.concurrent[1] == exactly(0.0, q1 * L));
    CHECK(sag.concurrent[2] == exactly(sag.value, q1 * L * L));
    // The largest shear of span BC is just right of B under live on both spans:
    // +5qL/8, with M_B = -qL^2/8 acting there (the same side of the support).
    const Governing& shear = e.members[at(bc)].shear_max;
    CHECK(shear.combination == 2);
    CHECK(shear.value == exactly(5 * q_all * L / 8, q_all * L));
    CHECK(shear.position == exactly(0.0, L));
    CHECK(shear.concurrent[1] == exactly(shear.value, q_all * L));
    CHECK(shear.concurrent[2] == exactly(-q_all * L * L / 8, q_all * L * L));
    // Support B's largest reaction, 10qL/8 = 1.25qL (statics with M_B), comes with
    // the same combination's other components: no horizontal force, no moment.
    const Governing& rb = e.reactions[1].max[1];
    CHECK(rb.combination == 2);
    CHECK(rb.value == exactly(1.25 * q_all * L, q_all * L));
    CHECK(rb.concurrent[0] == exactly(0.0, q_all * L));
    CHECK(rb.concurrent[1] == rb.value);
    CHECK(rb.concurrent[2] == exactly(0.0, q_all * L * L));
}

/// A portal A-B-D-E (columns of height h, a beam of span L), pinned at A and on a
/// roller at E: statically determinate, so every force follows from statics.
struct DeterminatePortal {
    static constexpr double h = 5.0, L = 10.0, w = 10e3, H = 20e3;
    ModelBuilder b;
    MemberId left{}, beam{}, right{};
    CaseId dead{}, wind{};
    DeterminatePortal() {
        SectionId s = b.section(b.material(E), A, I);
        NodeId na = b.node("A", 0.0, 0.0), nb = b.node("B", 0.0, h);
        NodeId nd = b.node("D", L, h), ne = b.node("E", L, 0.0);
        left = b.member("AB", na, nb, s);
        beam = b.member("BD", nb, nd, s);
        right = b.member("DE", nd, ne, s);
        b.support(na, Support::Kind::pinned);
        b.support(ne, Support::Kind::roller_free_x);
        dead = b.load_case("D");
        b.uniform(dead, beam, LoadDirection::down, w);
        wind = b.load_case("W");
        b.nodal(wind, nb, H, 0.0, 0.0);
    }
};

TEST_CASE("a determinate portal: the axial force acting with the governing moment",
          "[concurrent]") {
    using P = DeterminatePortal;
    P p;
    auto a = testing::analyse(p.b.model);
    testing::require_solved(a);
    // ASCE 7-16 Sec. 2.3.1 combinations 1, 4 (no L, Lr, S) and 5 (from memory).
    std::vector<Combination> ks = {{"1.4D", {{p.dead, 1.4}}},
                                   {"1.2D + 1.0W", {{p.dead, 1.2}, {p.wind, 1.0}}},
                                   {"0.9D + 1.0W", {{p.dead, 0.9}, {p.wind, 1.0}}}};
    Envelopes e = compute_envelopes(p.b.model, a.loads, a.solution, a.results, ks);
    // Statics. Dead load: each column carries wL/2 = 50 kN in compression, no
    // moment (the roller takes no horizontal force). The push H at B: Rx_A = -H,
    // Ry_E = Hh/L = 10 kN up, Ry_A = -Hh/L; column AB in tension Hh/L, its moment
    // growing from 0 at the pin to H h = 100 kN m at B; DE in compression Hh/L, no
    // moment.
    const double wl2 = P::w * P::L / 2, hhl = P::H * P::h / P::L;
    const MemberEnvelope& ab = e.members[at(p.left)];
    const Governing& m = larger_moment(ab);
    CHECK(m.combination == 1);  // both wind combinations bend AB alike; the first wins
    CHECK(std::abs(m.value) == exactly(P::H * P::h, P::H * P::h));
    CHECK(m.position == exactly(P::h, P::h));
    // With it: N = -1.2 wL/2 + Hh/L = -50 kN (compression), |V| = H.
    CHECK(m.concurrent[0] == exactly(-1.2 * wl2 + hhl, wl2));
    CHECK(std::abs(m.concurrent[1]) == exactly(P::H, P::H));
    CHECK(m.concurrent[2] == m.value);
    // The largest compression of AB is under 1.4D, -70 kN, with no moment at the pin
    // (N is constant along the column, so its first point, at A, is taken).
    CHECK(ab.compression.combination == 0);
    CHECK(ab.compression.value == exactly(-1.4 * wl2, wl2));
    CHECK(ab.compression.concurrent[2] == exactly(0.0, P::H * P::h));
    // DE: the largest compression, -(1.2 wL/2 + Hh/L) = -70 kN, ties with 1.4D (-70 kN):
    // the first combination governs, with no moment in the column.
    const MemberEnvelope& de = e.members[at(p.right)];
    CHECK(de.compression.combination == 0);
    CHECK(de.compression.value == exactly(-1.4 * wl2, wl2));
    CHECK(de.compression.concurrent[0] == de.compression.value);
    CHECK(de.compression.concurrent[2] == exactly(0.0, P::H * P::h));
    // Supports. A: the largest horizontal reaction -H (both wind combinations; the
    // first) with Ry = 1.2 wL/2 - Hh/L = 50 kN; the least vertical reaction under
    // 0.9D + 1.0W, 0.9 wL/2 - Hh/L = 35 kN, with Rx = -H.
    const ReactionEnvelope& ra = e.reactions[0];
    CHECK(ra.min[0].combination == 1);
    CHECK(ra.min[0].value == exactly(-P::H, P::H));
    CHECK(ra.min[0].concurrent[1] == exactly(1.2 * wl2 - hhl, wl2));
    CHECK(ra.min[1].combination == 2);
    CHECK(ra.min[1].value == exactly(0.9 * wl2 - hhl, wl2));
    CHECK(ra.min[1].concurrent[0] == exactly(-P::H, P::H));
    CHECK(ra.min[1].concurrent[2] == exactly(0.0, P::H * P::h));
    // E: the largest vertical reaction 1.2 wL/2 + Hh/L = 70 kN ties with 1.4 wL/2;
    // 1.4D is first. Its set has no horizontal force (a roller).
    const ReactionEnvelope& re = e.reactions[1];
    CHECK(re.max[1].value == exactly(1.4 * wl2, wl2));
    CHECK(re.max[1].concurrent[0] == exactly(0.0, P::H));
}

TEST_CASE("a fixed base's reaction set under one combination is the factored sum of its cases'",
          "[concurrent]") {
    // A fixed-base portal (statically indeterminate), so that every component of
    // the base reaction is at work; the cases are solved, the combination is not.
    ModelBuilder b;
    SectionId s = b.section(b.material(E), A, I);
    NodeId na = b.node("A", 0.0, 0.0), nb = b.node("B", 0.0, 4.0);
    NodeId nd = b.node("D", 8.0, 4.0), ne = b.node("E", 8.0, 0.0);
    b.member("AB", na, nb, s);
    MemberId beam = b.member("BD", nb, nd, s);
    b.member("DE", nd, ne, s);
    b.support(na, Support::Kind::fixed);
    b.support(ne, Support::Kind::fixed);
    CaseId dead = b.load_case("D"), wind = b.load_case("W");
    CaseId direct = b.load_case("0.9D + 1.0W, solved");
    b.uniform(dead, beam, LoadDirection::down, 12e3);
    b.nodal(wind, nb, 15e3, 0.0, 0.0);
    b.uniform(direct, beam, LoadDirection::down, 0.9 * 12e3);
    b.nodal(direct, nb, 15e3, 0.0, 0.0);
    auto a = testing::analyse(b.model);
    testing::require_solved(a);
    Combination k{"0.9D + 1.0W", {{dead, 0.9}, {wind, 1.0}}};
    CaseResults r = combination_results(b.model, a.loads, a.solution, a.results, k);
    const auto& rd = a.results.cases[at(dead)].reactions;
    const auto& rw = a.results.cases[at(wind)].reactions;
    const auto& solved = a.results.cases[at(direct)].reactions;
    // Superposition (linear elastic analysis, common practice): the set is the
    // factored sum of the cases' sets and equals a direct solve of the factored loads.
    for (std::size_t support = 0; support < 2; ++support) {
        for (std::size_t d = 0; d < 3; ++d) {
            double sum = 0.9 * rd[support][d] + 1.0 * rw[support][d];
            CHECK(r.reactions[support][d] == exactly(sum, 1e5));
            CHECK(r.reactions[support][d] == exactly(solved[support][d], 1e5));
        }
    }
    // Statics of the whole frame: the bases together carry the 0.9 x 96 kN of the
    // beam and the 15 kN push.
    CHECK(r.reactions[0][1] + r.reactions[1][1] == exactly(0.9 * 12e3 * 8.0, 1e5));
    CHECK(r.reactions[0][0] + r.reactions[1][0] == exactly(-15e3, 1e5));
    // The envelope of this one combination carries the set with each component.
    Envelopes e = compute_envelopes(b.model, a.loads, a.solution, a.results, {&k, 1});
    for (std::size_t d = 0; d < 3; ++d) {
        CHECK(e.reactions[0].max[d].concurrent == r.reactions[0]);
        CHECK(e.reactions[0].min[d].concurrent == r.reactions[0]);
    }
}

}  // namespace
}  // namespace firn
