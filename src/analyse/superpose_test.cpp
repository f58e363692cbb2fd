// Combinations and envelopes: pattern loading of a three-span beam against the
// three-moment equation, superposition against a direct solve, reaction and
// displacement envelopes against textbook beam formulas, and the envelope
// across a shear jump.
#include <catch2/catch.hpp>
#include <cmath>
#include <initializer_list>
#include <string>
#include <vector>

#include "analyse/analyse.hpp"
#include "testing/test_model_builder.hpp"

namespace firn {
namespace {

using testing::exactly;
using testing::ModelBuilder;

constexpr double E = 200e9, A = 0.01, I = 8e-5, EI = E * I;

/// A straight beam along x of `pieces` equal members of length `piece`,
/// pinned at its first node and on rollers at the nodes listed in `rollers`
/// (so support 0 is the pin and support i the i-th roller).
struct StraightBeam {
    ModelBuilder b;
    std::vector<NodeId> nodes;
    std::vector<MemberId> members;

    StraightBeam(std::size_t pieces, double piece, std::initializer_list<std::size_t> rollers) {
        SectionId s = b.section(b.material(E), A, I);
        for (std::size_t i = 0; i <= pieces; ++i)
            nodes.push_back(b.node(fmt::format("N{}", i), piece * static_cast<double>(i), 0.0));
        for (std::size_t i = 0; i < pieces; ++i)
            members.push_back(b.member(fmt::format("M{}", i + 1), nodes[i], nodes[i + 1], s));
        b.support(nodes[0], Support::Kind::pinned);
        for (std::size_t node : rollers)
            b.support(nodes[node], Support::Kind::roller_free_x);
    }
};

/// Three equal spans A-B-C-D of length L on a pin (A) and rollers, EI constant;
/// case i carries w on span i only.
struct ThreeSpans : StraightBeam {
    static constexpr double L = 7.0, w = 12e3;
    std::vector<CaseId> cases;
    std::vector<Combination> patterns;

    ThreeSpans() : StraightBeam(3, L, {1, 2, 3}) {
        for (std::size_t i = 0; i < 3; ++i) {
            cases.push_back(b.load_case(fmt::format("w on span {}", i + 1)));
            b.uniform(cases.back(), members[i], LoadDirection::down, w);
        }
        // Every arrangement of full load on some spans (indices used below).
        patterns = {loaded("all spans", {1, 2, 3}), loaded("spans 1+2", {1, 2}),
                    loaded("spans 2+3", {2, 3}),    loaded("span 1", {1}),
                    loaded("span 3", {3}),          loaded("spans 1+3", {1, 3}),
                    loaded("span 2", {2})};
    }
    Combination loaded(std::string name, std::initializer_list<std::size_t> which) const {
        Combination k{std::move(name), {}};
        for (std::size_t span : which)
            k.terms.push_back({cases[span - 1], 1.0});
        return k;
    }
};

/// Three-moment equation (Clapeyron) for three equal spans, EI constant, ends
/// pinned (M_A = M_D = 0), uniform w_i on span i, derived here:
///   4 M_B + M_C = -(w1 + w2) L^2 / 4,   M_B + 4 M_C = -(w2 + w3) L^2 / 4,
/// so M_B = -(4 w1 + 3 w2 - w3) L^2 / 60 and M_C = -(-w1 + 3 w2 + 4 w3) L^2 / 60.
/// Span 1 alone: M_B = -wL^2/15; all spans: M_B = M_C = -wL^2/10 (tests/SOURCES.md [C: S20]).
std::array<double, 2> support_moments(double w1, double w2, double w3, double L) {
    return {-(4 * w1 + 3 * w2 - w3) * L * L / 60, -(-w1 + 3 * w2 + 4 * w3) * L * L / 60};
}

/// check_governing, with the expression checked named in a failure's message.
#define CHECK_GOVERNING(g, ...)          \
    do {                                 \
        INFO(#g);                        \
        check_governing(g, __VA_ARGS__); \
    } while (false)

void check_governing(const Governing& g, double value, double position, std::size_t combination,
                     double scale, double length) {
    CHECK(g.value == exactly(value, scale));
    CHECK(g.position == exactly(position, length));
    CHECK(g.combination == combination);
}

TEST_CASE("three spans under pattern loading: support and span moments", "[combine]") {
    ThreeSpans t;
    const double L = ThreeSpans::L, w = ThreeSpans::w, wl2 = w * L * L;
    auto a = testing::analyse(t.b.model);
    testing::require_solved(a);
    Envelopes e = compute_envelopes(t.b.model, a.loads, a.solution, a.results, t.patterns);
    REQUIRE(e.combinations.size() == t.patterns.size());
    // Each arrangement's support moments by the three-moment equation above.
    for (std::size_t k = 0; k < t.patterns.size(); ++k) {
        std::array<double, 3> on{};
        for (const CombinationTerm& term : t.patterns[k].terms)
            on[at(term.case_id)] = w;
        auto [mb, mc] = support_moments(on[0], on[1], on[2], L);
        CHECK(e.combinations[k].members[0].end[2] == exactly(mb, wl2));
        CHECK(e.combinations[k].members[2].start[2] == exactly(mc, wl2));
    }
    const MemberEnvelope& end_span = e.members[0];
    const MemberEnvelope& centre = e.members[1];
    const MemberEnvelope& far_span = e.members[2];
    // Most negative support moment: spans 1+2 give M_B = -(4 + 3) wL^2/60 = -7wL^2/60;
    // spans 2+3 give the same at C (symmetry), so the centre span ties and the
    // first combination (spans 1+2, at B) governs.
    CHECK_GOVERNING(end_span.moment_min, -7 * wl2 / 60, L, 1, wl2, L);
    CHECK_GOVERNING(centre.moment_min, -7 * wl2 / 60, 0.0, 1, wl2, L);
    CHECK_GOVERNING(far_span.moment_min, -7 * wl2 / 60, 0.0, 2, wl2, L);
    // End span, statics of span 1 with M_B: R_A = wL/2 + M_B/L and M+ = R_A^2/2w at
    // x = R_A/w. The least hogging M_B with span 1 loaded is spans 1+3 (-3wL^2/60),
    // so R_A = 0.45wL and M+ = 0.10125wL^2 at 0.45L: a closed-form position, not a station.
    CHECK_GOVERNING(end_span.moment_max, 0.10125 * wl2, 0.45 * L, 5, wl2, L);
    CHECK_GOVERNING(far_span.moment_max, 0.10125 * wl2, 0.55 * L, 5, wl2, L);
    // Centre span: span 2 alone, M_B = M_C = -3wL^2/60, so M+ = wL^2/8 - wL^2/20 = 3wL^2/40.
    CHECK_GOVERNING(centre.moment_max, 3 * wl2 / 40, 0.5 * L, 6, wl2, L);
    // Shears (statics with the support moments): V at B in span 1 is
    // -(wL/2 - M_B/L) = -37wL/60 under spans 1+2; in span 2, V = wL/2 + (M_C - M_B)/L
    // = 35wL/60 at B under spans 1+2 and -35wL/60 at C under spans 2+3; R_A = 0.45wL.
    CHECK_GOVERNING(end_span.shear_min, -37 * w * L / 60, L, 1, w * L, L);
    CHECK_GOVERNING(end_span.shear_max, 0.45 * w * L, 0.0, 5, w * L, L);
    CHECK_GOVERNING(centre.shear_max, 35 * w * L / 60, 0.0, 1, w * L, L);
    CHECK_GOVERNING(centre.shear_min, -35 * w * L / 60, L, 2, w * L, L);
    // No axial load, so no axial force (statics): nothing governs.
    CHECK(end_span.tension.value == exactly(0.0, w * L));
    CHECK(end_span.compression.value == exactly(0.0, w * L));

    // The functions of the governing combination peak where the envelope says.
    MemberFunctions f =
        combination_functions(t.b.model, a.loads, a.solution, t.patterns[5], t.members[0]);
    REQUIRE(f.pieces.size() == 1);
    CHECK(f.pieces[0].moment(0.45 * L) == exactly(0.10125 * wl2));
    CHECK(f.pieces[0].shear(0.45 * L) == exactly(0.0, w * L));
}

TEST_CASE("factors other than one: half loads on the other spans", "[combine]") {
    ThreeSpans t;
    const double L = ThreeSpans::L, w = ThreeSpans::w, wl2 = w * L * L;
    auto a = testing::analyse(t.b.model);
    testing::require_solved(a);
    // Full load on an end span and half on the others (the partial loading of
    // continuous beams, ASCE 7-16 Sec. 7.5.1 case 1, from memory).
    Combination k{"span 1 full, others half",
                  {{t.cases[0], 1.0}, {t.cases[1], 0.5}, {t.cases[2], 0.5}}};
    CaseResults r = combination_results(t.b.model, a.loads, a.solution, a.results, k);
    // Three-moment equation above with w1 = w, w2 = w3 = w/2:
    // M_B = -(4 + 1.5 - 0.5) wL^2/60 = -wL^2/12, M_C = -(-1 + 1.5 + 2) wL^2/60 = -wL^2/24.
    CHECK(r.members[0].end[2] == exactly(-wl2 / 12));
    CHECK(r.members[2].start[2] == exactly(-wl2 / 24));
    // Statics: the reactions carry the whole load, (1 + 0.5 + 0.5) wL.
    double total = 0.0;
    for (const auto& reaction : r.reactions)
        total += reaction[1];
    CHECK(total == exactly(2 * w * L));
}

/// A portal with a pitched roof, a hinge and a pinned base, loaded in two cases
/// whose loads can also be added to a third case with factors.
struct Portal {
    ModelBuilder b;
    NodeId eave_left{};
    MemberId column_left{}, rafter_left{}, rafter_right{}, column_right{};
    Portal() {
        SectionId s = b.section(b.material(E), A, I);
        NodeId base_l = b.node("A", 0.0, 0.0);
        eave_left = b.node("B", 0.0, 4.0);
        NodeId ridge = b.node("C", 5.0, 5.5), eave_r = b.node("D", 10.0, 4.0);
        NodeId base_r = b.node("E", 10.0, 0.0);
        column_left = b.member("AB", base_l, eave_left, s);
        rafter_left = b.member("BC", eave_left, ridge, s);
        rafter_right = b.member("CD", ridge, eave_r, s, false, true);
        column_right = b.member("DE", eave_r, base_r, s);
        b.support(base_l, Support::Kind::fixed);
        b.support(base_r, Support::Kind::pinned);
    }
    /// Dead-like loads times `f`: roof weight, a lateral push and a bracket load.
    void dead(CaseId c, double f) {
        b.uniform(c, rafter_left, LoadDirection::down, f * 3e3);
        b.uniform(c, rafter_right, LoadDirection::down, f * 3e3);
        b.nodal(c, eave_left, f * 5e3, 0.0, 0.0);
        b.point(c, column_left, LoadDirection::transverse, 2.5, f * 8e3);
    }
    /// Snow-like loads times `f`: a part-span projected load, a point load,
    /// wind on a column and a couple.
    void snow(CaseId c, double f) {
        b.spread(c, rafter_left, LoadDirection::down, 1.0, 4.0, f * 6e3, f * 2e3, true);
        b.point(c, rafter_right, LoadDirection::down, 3.0, f * 12e3);
        b.uniform(c, column_right, LoadDirection::global_x, f * -1.5e3);
        b.moment(c, column_right, 1.0, f * 4e3);
    }
};

void check_same_extreme(const Extreme& got, const Extreme& want, double scale, double length) {
    CHECK(got.value == exactly(want.value, scale));
    CHECK(got.position == exactly(want.position, length));
}

void check_same_summary(const MemberSummary& got, const MemberSummary& want, double force,
                        double moment, double deflection, double length) {
    for (std::size_t d = 0; d < 3; ++d) {
        double scale = d < 2 ? force : moment;
        CHECK(got.start[d] == exactly(want.start[d], scale));
        CHECK(got.end[d] == exactly(want.end[d], scale));
    }
    check_same_extreme(got.moment_max, want.moment_max, moment, length);
    check_same_extreme(got.moment_min, want.moment_min, moment, length);
    check_same_extreme(got.shear_max, want.shear_max, force, length);
    check_same_extreme(got.axial_max, want.axial_max, force, length);
    check_same_extreme(got.axial_min, want.axial_min, force, length);
    check_same_extreme(got.deflection_max, want.deflection_max, deflection, length);
}

TEST_CASE("a combination equals the combined loads solved directly", "[combine]") {
    Portal p;
    CaseId dead = p.b.load_case("dead"), snow = p.b.load_case("snow");
    CaseId direct = p.b.load_case("1.2 dead + 1.6 snow, solved");
    p.dead(dead, 1.0);
    p.snow(snow, 1.0);
    p.dead(direct, 1.2);
    p.snow(direct, 1.6);
    auto a = testing::analyse(p.b.model);
    testing::require_solved(a);
    Combination k{"1.2D + 1.6S", {{dead, 1.2}, {snow, 1.6}}};
    CaseResults got = combination_results(p.b.model, a.loads, a.solution, a.results, k);
    const CaseResults& want = a.results.cases[at(direct)];
    // Superposition (linear elastic analysis, common practice): the same to round-off.
    double reach = 0.0;
    for (const auto& u : want.displacements)
        reach = std::max({reach, std::abs(u[0]), std::abs(u[1])});
    for (std::size_t n = 0; n < want.displacements.size(); ++n) {
        for (std::size_t d = 0; d < 3; ++d)
            CHECK(got.displacements[n][d] == exactly(want.displacements[n][d], reach));
    }
    for (std::size_t s = 0; s < want.reactions.size(); ++s) {
        for (std::size_t d = 0; d < 3; ++d)
            CHECK(got.reactions[s][d] == exactly(want.reactions[s][d], 1e5));
    }
    for (std::size_t m = 0; m < want.members.size(); ++m)
        check_same_summary(got.members[m], want.members[m], 1e5, 1e5, reach, 10.0);
    CHECK(got.equilibrium.relative_residual < 1e-9);
    // The envelope of that one combination holds the same results, bit for bit.
    Envelopes e = compute_envelopes(p.b.model, a.loads, a.solution, a.results, {&k, 1});
    CHECK(e.combinations[0].members[1].moment_max.value == got.members[1].moment_max.value);
    CHECK(e.members[1].moment_max.value == got.members[1].moment_max.value);
}

TEST_CASE("reaction envelope of three spans under pattern loading", "[combine]") {
    ThreeSpans t;
    const double wl = ThreeSpans::w * ThreeSpans::L;
    auto a = testing::analyse(t.b.model);
    testing::require_solved(a);
    Envelopes e = compute_envelopes(t.b.model, a.loads, a.solution, a.results, t.patterns);
    REQUIRE(e.reactions.size() == 4);
    // Statics with the three-moment support moments: R_A = w1 L/2 + M_B/L and
    // R_B = w1 L/2 - M_B/L + w2 L/2 + (M_C - M_B)/L. R_A: 0.45wL under spans 1+3,
    // -0.05wL (uplift) under span 2 alone. R_B: 1.20wL under spans 1+2, -0.10wL
    // under span 3 alone.
    CHECK_GOVERNING(e.reactions[0].max[1], 0.45 * wl, 0.0, 5, wl, 1.0);
    CHECK_GOVERNING(e.reactions[0].min[1], -0.05 * wl, 0.0, 6, wl, 1.0);
    CHECK_GOVERNING(e.reactions[1].max[1], 1.20 * wl, 0.0, 1, wl, 1.0);
    CHECK_GOVERNING(e.reactions[1].min[1], -0.10 * wl, 0.0, 4, wl, 1.0);
    // Pins and rollers take no moment: every combination ties at 0 and the first governs.
    CHECK_GOVERNING(e.reactions[2].max[2], 0.0, 0.0, 0, wl, 1.0);
    CHECK_GOVERNING(e.reactions[2].min[2], 0.0, 0.0, 0, wl, 1.0);
}

TEST_CASE("displacement envelope of a simple beam under factored dead, snow and uplift",
          "[combine]") {
    const double L = 8.0, dead = 2e3, snow = 5e3, uplift = 4e3;
    StraightBeam beam(2, L / 2, {2});
    ModelBuilder& b = beam.b;
    NodeId left = beam.nodes[0], mid = beam.nodes[1], right = beam.nodes[2];
    CaseId d = b.load_case("dead"), sn = b.load_case("snow"), wind = b.load_case("uplift");
    for (MemberId m : beam.members) {
        b.uniform(d, m, LoadDirection::down, dead);
        b.uniform(sn, m, LoadDirection::down, snow);
        b.uniform(wind, m, LoadDirection::global_y, uplift);
    }
    auto a = testing::analyse(b.model);
    testing::require_solved(a);
    // Factors of ASCE 7-16 Sec. 2.3.1 combinations 1, 3 and 6 (from memory); the
    // checks below hold for any factors.
    std::vector<Combination> ks = {{"1.4D", {{d, 1.4}}},
                                   {"1.2D + 1.6S", {{d, 1.2}, {sn, 1.6}}},
                                   {"0.9D + 1.0W", {{d, 0.9}, {wind, 1.0}}}};
    Envelopes e = compute_envelopes(b.model, a.loads, a.solution, a.results, ks);
    // Net downward load per combination: 2.8, 10.4 and -2.2 kN/m.
    const double most = 1.2 * dead + 1.6 * snow, least = 0.9 * dead - uplift;
    // Simple beam under a uniform q: deflection 5qL^4/384EI and moment qL^2/8 at
    // mid-span (tests/SOURCES.md simply supported [D], AISC); end rotations
    // qL^3/24EI, clockwise at A (integration of M/EI, from memory); reactions qL/2
    // (statics).
    auto sag = [&](double q) { return -5 * q * L * L * L * L / (384 * EI); };
    auto turn = [&](double q) { return q * L * L * L / (24 * EI); };
    double reach = -sag(most), spin = turn(most);
    CHECK_GOVERNING(e.displacements[at(mid)].min[1], sag(most), 0.0, 1, reach, 1.0);
    CHECK_GOVERNING(e.displacements[at(mid)].max[1], sag(least), 0.0, 2, reach, 1.0);
    CHECK_GOVERNING(e.displacements[at(left)].min[2], -turn(most), 0.0, 1, spin, 1.0);
    CHECK_GOVERNING(e.displacements[at(left)].max[2], -turn(least), 0.0, 2, spin, 1.0);
    CHECK_GOVERNING(e.displacements[at(right)].max[2], turn(most), 0.0, 1, spin, 1.0);
    CHECK_GOVERNING(e.reactions[0].max[1], most * L / 2, 0.0, 1, most * L, 1.0);
    CHECK_GOVERNING(e.reactions[0].min[1], least * L / 2, 0.0, 2, most * L, 1.0);
    double m_scale = most * L * L;
    CHECK_GOVERNING(e.members[0].moment_max, most * L * L / 8, L / 2, 1, m_scale, L);
    CHECK_GOVERNING(e.members[0].moment_min, least * L * L / 8, L / 2, 2, m_scale, L);
    CHECK_GOVERNING(e.members[1].moment_max, most * L * L / 8, 0.0, 1, m_scale, L);
}

TEST_CASE("the shear envelope sees both sides of a point load's jump", "[combine]") {
    const double L = 8.0, pa = 6.0, P = 40e3, q = 5e3;
    StraightBeam beam(1, L, {1});
    ModelBuilder& b = beam.b;
    MemberId m = beam.members[0];
    CaseId point = b.load_case("point"), lift = b.load_case("uplift");
    b.point(point, m, LoadDirection::down, pa, P);
    b.uniform(lift, m, LoadDirection::global_y, q);
    auto a = testing::analyse(b.model);
    testing::require_solved(a);
    std::vector<Combination> ks = {{"P", {{point, 1.0}}},
                                   {"P + uplift", {{point, 1.0}, {lift, 1.0}}}};
    Envelopes e = compute_envelopes(b.model, a.loads, a.solution, a.results, ks);
    const MemberEnvelope& env = e.members[0];
    // Statics. P alone: V = Pb/L = 10 kN left of the load, -Pa/L = -30 kN right of
    // it; M = Pab/L = 60 kN m under it. With the uplift q: R_A = Pb/L - qL/2 =
    // -10 kN and V = R_A + qx rises to +20 kN just left of the load and drops to
    // -20 kN just right of it; M = R_A x + qx^2/2 is least, -10 kN m, where V = 0
    // at x = 2 m.
    CHECK_GOVERNING(env.shear_max, 20e3, pa, 1, P, L);
    CHECK_GOVERNING(env.shear_min, -30e3, pa, 0, P, L);
    CHECK_GOVERNING(env.moment_max, 60e3, pa, 0, P * L, L);
    CHECK_GOVERNING(env.moment_min, -10e3, 2.0, 1, P * L, L);
}

/// Every number of an envelope, in a fixed order, for comparing two of them.
std::vector<double> flatten(const Envelopes& e) {
    std::vector<double> out;
    auto put = [&out](const auto& values) { out.insert(out.end(), values.begin(), values.end()); };
    auto put_extremes = [&](std::initializer_list<Extreme> xs) {
        for (const Extreme& x : xs)
            put(std::array<double, 2>{x.value, x.position});
    };
    auto put_governing = [&](std::initializer_list<Governing> gs) {
        for (const Governing& g : gs) {
            put(std::array<double, 3>{g.value, g.position, static_cast<double>(g.combination)});
            put(g.concurrent);
        }
    };
    for (const CaseResults& c : e.combinations) {
        for (const auto& u : c.displacements)
            put(u);
        for (const auto& r : c.reactions)
            put(r);
        for (const MemberSummary& s : c.members) {
            put(s.start);
            put(s.end);
            put_extremes({s.moment_max, s.moment_min, s.shear_max, s.axial_max, s.axial_min,
                          s.deflection_max});
        }
    }
    for (const MemberEnvelope& m : e.members) {
        put_governing({m.moment_max, m.moment_min, m.shear_max, m.shear_min, m.tension,
                       m.compression, m.deflection_max, m.deflection_min});
    }
    for (const auto* list : {&e.reactions, &e.displacements}) {
        for (const ComponentEnvelope& c : *list) {
            put_governing({c.max[0], c.max[1], c.max[2], c.min[0], c.min[1], c.min[2]});
        }
    }
    return out;
}

TEST_CASE("envelopes are the same however the work is cut", "[combine]") {
    Portal p;
    CaseId dead = p.b.load_case("dead"), snow = p.b.load_case("snow");
    p.dead(dead, 1.0);
    p.snow(snow, 1.0);
    auto a = testing::analyse(p.b.model);
    testing::require_solved(a);
    std::vector<Combination> ks = {{"D", {{dead, 1.0}}},
                                   {"S", {{snow, 1.0}}},
                                   {"1.2D + 1.6S", {{dead, 1.2}, {snow, 1.6}}},
                                   {"0.9D - S", {{dead, 0.9}, {snow, -1.0}}},
                                   {"empty", {}}};
    std::vector<double> one =
        flatten(compute_envelopes(p.b.model, a.loads, a.solution, a.results, ks, 1));
    REQUIRE(!one.empty());
    for (std::size_t parts : std::array<std::size_t, 4>{0, 2, 3, 7}) {
        CAPTURE(parts);
        CHECK(flatten(compute_envelopes(p.b.model, a.loads, a.solution, a.results, ks, parts)) ==
              one);
    }
}

}  // namespace
}  // namespace firn
