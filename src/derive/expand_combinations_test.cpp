// Tests of load arrangements (pattern rules, spans, ASCE 7-16 Sec. 7.5.1
// partial loading) and of load combinations (the stdlib sets of ASCE 7-16
// Sec. 2.3.1 and 2.4.1, their expansion, and the envelopes of a model).
#include <fmt/format.h>
#include <algorithm>
#include <catch2/catch.hpp>

#include "derive/arrange.hpp"
#include "driver/driver.hpp"
#include "testing/test_text.hpp"

using namespace firn;

using firn::testing::analysed;

namespace {

constexpr double kPsf = 4.4482216152605 / (0.3048 * 0.3048);  // exact: lbf / ft^2 in Pa
constexpr double kFt = 0.3048;
constexpr double kKipFt = 4448.2216152605 * 0.3048;

/// A beam on pin and rollers over `spans` equal spans of 20 ft under snow: pg = 40
/// psf, heated, Ce = 1.0, Is = 1.0, so ps = pf = 0.7 x 40 = 28 psf (ASCE 7-16
/// Eq. 7.3-1) on a 10 ft tributary width; `extra` adds statements.
std::string snow_beam(int spans, const std::string& extra) {
    const char* lines = "ABCDEF";
    return fmt::format(
        "model \"beam\"\nuse materials\nuse asce7_16\nreport units kip, ft\n"
        "grid x A..{} spacing 20 ft\ngrid y base = 0 ft\n"
        "section girder structural_steel, A = 11.8 in2, I = 510 in4\n"
        "beams along base from A to {} section girder\n"
        "support pinned at A.base\nsupport roller at {}\n"
        "snow S {{\n  standard = asce7_16\n  pg = 40 psf\n  terrain = C\n"
        "  exposure = partially\n  thermal = heated\n  risk = II\n}}\n"
        "roof main on base.* {{\n  tributary = 10 ft\n}}\n{}",
        lines[spans], lines[spans],
        [&] {
            std::string rollers;
            for (int i = 1; i <= spans; ++i)
                rollers += fmt::format("{}{}.base", i > 1 ? ", " : "", lines[i]);
            return rollers;
        }(),
        extra);
}

std::vector<std::string> case_names(const Model& m, const std::string& prefix) {
    std::vector<std::string> out;
    for (const LoadCase& lc : m.cases) {
        if (lc.name.rfind(prefix, 0) == 0)
            out.push_back(lc.name);
    }
    return out;
}

std::size_t member_index(const Model& m, const std::string& name) {
    for (std::size_t i = 0; i < m.members.size(); ++i) {
        if (m.members[i].name == name)
            return i;
    }
    FAIL("no member " << name);
    return 0;
}

}  // namespace

TEST_CASE("arrangements: the spans of a run between supports, a cantilever counting as one") {
    // ASCE 7-16 Sec. 7.5.1 (from memory): a cantilever counts as a span.
    std::string text = snow_beam(3, "");
    text += "node tip at x = 68 ft, y = 0 ft\nmember over from D.base to tip section girder\n";
    text.replace(text.find("roof main on base.*"), 19, "roof main on base.*, over");
    Analysis a = analysed(text);
    std::vector<Span> spans = spans_of(a.model, a.model.roofs[0].members);
    REQUIRE(spans.size() == 4);
    CHECK(spans[0].name == "A-B");
    CHECK(spans[3].name == "D-tip");
    CHECK(spans[3].cantilever);
    CHECK_FALSE(spans[1].cantilever);
}

TEST_CASE("arrangements: ASCE 7-16 Sec. 7.5.1 cases 1, 2 and 3 on four spans, and on three") {
    // Sec. 7.5.1 (from memory): case 1 full on either exterior span, half elsewhere;
    // case 2 half on either exterior span, full elsewhere; case 3 full on each pair of
    // adjacent spans (n - 1 of them), half elsewhere. On four spans all 2 + 2 + 3 differ.
    Analysis four = analysed(snow_beam(4, ""));
    CHECK(case_names(four.model, "S.partial.") ==
          std::vector<std::string>{"S.partial.main.case1.A_B", "S.partial.main.case1.D_E",
                                   "S.partial.main.case2.A_B", "S.partial.main.case2.D_E",
                                   "S.partial.main.case3.A_C", "S.partial.main.case3.B_D",
                                   "S.partial.main.case3.C_E"});
    // On three spans the pairs A-C and B-D are case 2's arrangements: listed once.
    Analysis three = analysed(snow_beam(3, ""));
    CHECK(case_names(three.model, "S.partial.").size() == 4);
    // One span: nothing to arrange.
    Analysis one = analysed(snow_beam(1, ""));
    CHECK(case_names(one.model, "S.partial.").empty());
}

TEST_CASE("arrangements: a partial case carries ps on its full spans and ps/2 on the others") {
    // Sec. 7.5.1 (from memory), Eq. 7.3-1: ps = 28 psf x 10 ft = 0.28 kip/ft full, half 0.14.
    Analysis a = analysed(snow_beam(3, ""));
    const LoadCase* lc = nullptr;
    for (const LoadCase& c : a.model.cases) {
        if (c.name == "S.partial.main.case1.A_B")
            lc = &c;
    }
    REQUIRE(lc != nullptr);
    REQUIRE(lc->distributed.size() == 3);
    CHECK(lc->distributed[0].w_start == Approx(28 * kPsf * 10 * kFt));
    CHECK(lc->distributed[1].w_start == Approx(14 * kPsf * 10 * kFt));
    CHECK(lc->distributed[2].w_end == Approx(14 * kPsf * 10 * kFt));
}

TEST_CASE("envelopes: three equal spans under partial snow match the three-moment equation") {
    // Three-moment equation (Clapeyron) for three equal spans L, EI constant, ends
    // pinned: uniform p on span 1 alone gives M_B = -pL^2/15 and M_C = +pL^2/60; on span 2
    // alone M_B = M_C = -pL^2/20. With span factors (f1, f2, f3):
    //   M_B = -pL^2 (f1/15 + f2/20 - f3/60).
    // Balanced (1, 1, 1): -pL^2/10. Case 2 at the right end (1, 1, 0.5): -6.5/60 pL^2,
    // the most negative of all arrangements. In span A-B, the largest sagging moment
    // comes from case 1 at the left end (1, 0.5, 0.5): M_B = -5/60 pL^2 and, by statics,
    // M(x) = p x (L - x)/2 + M_B x/L is largest at x = L (1/2 - 5/60) = 0.41667 L, where
    // it is 0.086806 pL^2 (against 0.08 pL^2 under the balanced load).
    Analysis a =
        analysed(snow_beam(3, "combinations snow_only {\n  1 = S\n}\ncombine snow_only\n"));
    REQUIRE(a.envelopes.size() == 1);
    const Envelopes& env = a.envelopes[0];
    const CombinationList& list = a.combinations;
    double p = 28 * kPsf * 10 * kFt, L = 20 * kFt;
    const MemberEnvelope& ab = env.members[member_index(a.model, "base.A.B")];
    CHECK(ab.moment_min.value == Approx(-6.5 / 60 * p * L * L).epsilon(1e-9));
    CHECK(list.combinations[ab.moment_min.combination].terms.size() == 1);
    CHECK(a.model.cases[at(list.combinations[ab.moment_min.combination].terms[0].case_id)].name ==
          "S.partial.main.case2.C_D");
    CHECK(ab.moment_max.value == Approx(0.086806 * p * L * L).epsilon(1e-5));
    CHECK(ab.moment_max.position == Approx(0.416667 * L).epsilon(1e-5));
    CHECK(a.model.cases[at(list.combinations[ab.moment_max.combination].terms[0].case_id)].name ==
          "S.partial.main.case1.A_B");
    // The balanced load alone would have given 0.08 pL^2: the partial arrangement governs.
    CHECK(ab.moment_max.value > 0.08 * p * L * L * 1.08);
    CHECK(ab.moment_max.value / kKipFt == Approx(0.086806 * 0.28 * 400).epsilon(1e-5));
}

TEST_CASE("arrangements: arrange a live case by a rule of the model's own") {
    // Statics, common practice: alternate spans of a live load; "each = 1, others = 0"
    // gives one case per span, each with the load on that span only.
    std::string text = snow_beam(3, R"(
pattern alternate {
  one: each = 1.0
}
case L live {
  uniform 0.5 kip/ft down on base.*
}
arrange L on base.* by alternate
)");
    Analysis a = analysed(text);
    CHECK(case_names(a.model, "L.") ==
          std::vector<std::string>{"L.one.A_B", "L.one.B_C", "L.one.C_D"});
    const LoadCase& mid = a.model.cases[a.model.cases.size() - 2];
    CHECK(mid.distributed[0].w_start == 0.0);
    CHECK(mid.distributed[1].w_start == Approx(0.5 * 4448.2216152605 / kFt));
    CHECK(mid.arrangement_of == "L");
}

TEST_CASE("combinations: the stdlib sets list ASCE 7-16's factors") {
    // ASCE 7-16 Sec. 2.3.1 (from memory; IBC 1605.2 lists the same factors):
    // 1. 1.4D  2. 1.2D + 1.6L + 0.5(Lr or S or R)  3. 1.2D + 1.6(Lr or S or R) + (L or 0.5W)
    // 4. 1.2D + 1.0W + L + 0.5(Lr or S or R)  5. 0.9D + 1.0W.
    // Sec. 2.4.1 (from memory): 1. D  2. D + L  3. D + (Lr or S or R)
    // 4. D + 0.75L + 0.75(Lr or S or R)  5. D + 0.6W  6. D + 0.75L + 0.75(0.6W) +
    // 0.75(Lr or S or R)  7. 0.6D + 0.6W.
    Analysis a = analysed(snow_beam(1, ""));
    auto text_of = [&](const std::string& name) {
        std::string out;
        for (const CombinationSet& set : a.model.combination_sets) {
            if (set.name != name)
                continue;
            for (const CombinationRule& rule : set.rules) {
                out += rule.label + (rule.half_live ? "*:" : ":");
                for (const CombinationRule::Term& term : rule.terms) {
                    out += " +";
                    for (const auto& alt : term.alternatives)
                        out += fmt::format(" {:g}{}", alt.factor, alt.symbol);
                }
                out += "\n";
            }
        }
        return out;
    };
    CHECK(text_of("asce7_16.strength") ==
          "1: + 1.4D\n"
          "2: + 1.2D + 1.6L + 0.5Lr 0.5S 0.5R\n"
          "3*: + 1.2D + 1.6Lr 1.6S 1.6R + 1L 0.5W\n"
          "4*: + 1.2D + 1W + 1L + 0.5Lr 0.5S 0.5R\n"
          "5: + 0.9D + 1W\n");
    CHECK(text_of("asce7_16.allowable") ==
          "1: + 1D\n"
          "2: + 1D + 1L\n"
          "3: + 1D + 1Lr 1S 1R\n"
          "4: + 1D + 0.75L + 0.75Lr 0.75S 0.75R\n"
          "5: + 1D + 0.6W\n"
          "6: + 1D + 0.75L + 0.45W + 0.75Lr 0.75S 0.75R\n"
          "7: + 0.6D + 0.6W\n");
}

namespace {

/// The beam with dead, live, roof live, wind and snow cases and a set `extra` chooses.
std::string all_kinds(const std::string& choose) {
    return snow_beam(2, R"(
case D dead {
  uniform 0.2 kip/ft down on base.*
}
case L live {
  uniform 0.3 kip/ft down on base.*
}
case Lr roof live {
  uniform 0.1 kip/ft down on base.*
}
case WL wind {
  uniform 0.05 kip/ft up on base.*
}
)" + choose);
}

std::vector<std::string> formulas(const Analysis& a) {
    return a.combinations.formulas;
}

}  // namespace

TEST_CASE("combinations: alternatives expand one case at a time; Lr and S never together") {
    // ASCE 7-16 Sec. 2.3.1 (from memory): "(Lr or S or R)" takes one of them; R has no
    // case here and drops out. Two spans: partial loading gives case1 at each end
    // (case 2's arrangements repeat them), so S has balanced, minimum and two partials.
    Analysis a = analysed(all_kinds("combine asce7_16.strength\n"));
    std::vector<std::string> f = formulas(a);
    for (const std::string& formula : f) {
        bool lr = formula.find("Lr") != std::string::npos;
        bool s = formula.find("S.") != std::string::npos;
        CHECK_FALSE((lr && s));
    }
    CHECK(std::count(f.begin(), f.end(), "1.2 D + 1.6 L + 0.5 Lr") == 1);
    CHECK(std::count(f.begin(), f.end(), "1.2 D + 1.6 S.balanced + 0.5 WL") == 1);
    CHECK(std::count(f.begin(), f.end(), "1.2 D + 1.6 S.balanced + 1.0 L") == 1);
    CHECK(std::count(f.begin(), f.end(), "0.9 D + 1.0 WL") == 1);
    // Rule 3: (Lr + 4 snow cases) x (L or W) = 10 combinations.
    std::size_t rule3 = 0;
    for (const Combination& c : a.combinations.combinations)
        rule3 += c.name.rfind("asce7_16.strength.3/", 0) == 0 ? 1U : 0U;
    CHECK(rule3 == 10);
}

TEST_CASE("combinations: the 0.5 L permission applies where the set allows it, with its reason") {
    // ASCE 7-16 Sec. 2.3.1 exception 1 (from memory): L's factor in 3 and 4 may be 0.5
    // where Lo <= 100 psf; combination 2's 1.6 L is not affected.
    Analysis a = analysed(all_kinds(
        "combine asce7_16.strength {\n  half_live = yes because \"offices, Lo = 50 psf\"\n}\n"));
    std::vector<std::string> f = formulas(a);
    CHECK(std::count(f.begin(), f.end(), "1.2 D + 1.6 S.balanced + 0.5 L") == 1);
    CHECK(std::count(f.begin(), f.end(), "1.2 D + 1.0 WL + 0.5 L + 0.5 S.balanced") == 1);
    CHECK(std::count(f.begin(), f.end(), "1.2 D + 1.6 L + 0.5 S.balanced") == 1);
    Analysis refused =
        analyse_text("input", all_kinds("combine asce7_16.strength {\n  half_live = yes\n}\n"));
    CHECK_FALSE(refused.ok);
}

TEST_CASE("combinations: an ice-dam case is combined with dead load only") {
    // ASCE 7-16 Sec. 7.4.5 (from memory): the ice-dam load 2 pf on overhangs is combined
    // with dead load only: the live and wind terms of its combinations drop out.
    std::string text = all_kinds("combine asce7_16.strength\n");
    text += "node tip at x = 44 ft, y = 0 ft\nmember over from C.base to tip section girder\n";
    text.replace(text.find("roof main on base.*"), 19, "roof main on base.*, over");
    Analysis a = analysed(text);
    std::vector<std::string> f = formulas(a);
    CHECK(std::count(f.begin(), f.end(), "1.2 D + 1.6 S.ice_dam") == 1);
    CHECK(std::count(f.begin(), f.end(), "1.2 D + 0.5 S.ice_dam") == 1);
    for (const std::string& formula : f) {
        if (formula.find("ice_dam") != std::string::npos) {
            CHECK(formula.find(" L") == std::string::npos);
            CHECK(formula.find("WL") == std::string::npos);
        }
    }
}

TEST_CASE("combinations: a rain case takes R's place beside Lr and S in ASCE 7-16's sets") {
    // ASCE 7-16 Sec. 2.3.1 and 2.4.1 (from memory): R stands where Lr and S stand, as
    // one of the alternatives "(Lr or S or R)", never added to them.
    Analysis a =
        analysed(all_kinds("case R rain {\n  uniform 0.15 kip/ft down on base.*\n}\n"
                           "combine asce7_16.strength, asce7_16.allowable\n"));
    std::vector<std::string> f = formulas(a);
    for (const char* want :
         {"1.2 D + 1.6 L + 0.5 R", "1.2 D + 1.6 R + 1.0 L", "1.2 D + 1.6 R + 0.5 WL",
          "1.2 D + 1.0 WL + 1.0 L + 0.5 R", "1.0 D + 1.0 R", "1.0 D + 0.75 L + 0.75 R",
          "1.0 D + 0.75 L + 0.45 WL + 0.75 R"}) {
        INFO(want);
        CHECK(std::count(f.begin(), f.end(), want) == 1);
    }
    for (const std::string& formula : f) {
        bool rain = formula.find(" R") != std::string::npos;
        bool other =
            formula.find("Lr") != std::string::npos || formula.find("S.") != std::string::npos;
        CHECK_FALSE((rain && other));
    }
    auto rain = std::find_if(a.model.cases.begin(), a.model.cases.end(),
                             [](const LoadCase& lc) { return lc.name == "R"; });
    REQUIRE(rain != a.model.cases.end());
    CHECK(rain->kind == CaseKind::rain);
}

TEST_CASE("combinations: a set by case names cases with any factors, kind other included") {
    Analysis a = analysed(all_kinds(R"(case WR wind {
  uniform 0.05 kip/ft down on base.*
}
case hoist other {
  point 2 kip down at B.base
}
combinations site by case {
  gravity = 1.2 D + 1.6 Lr + 0.5 WL
  lift = 1.2 D + 1.0 hoist + 0.5 (WL or WR)
  heavy = 1.1 D + 1.3 S.balanced
  floor = 1.2 D + 1.6 L
}
pattern alt {
  odd: each = 1.0, others = 0
}
arrange L on base.* by alt
combine site
)"));
    std::vector<std::string> f = formulas(a);
    // The factors as written, one combination per alternative; a case with
    // arrangements stands for itself and each of them in turn (the snow stage's
    // cases are named one by one).
    REQUIRE(f.size() == 7);
    CHECK(f[0] == "1.2 D + 1.6 Lr + 0.5 WL");
    CHECK(f[1] == "1.2 D + 1.0 hoist + 0.5 WL");
    CHECK(f[2] == "1.2 D + 1.0 hoist + 0.5 WR");
    CHECK(f[3] == "1.1 D + 1.3 S.balanced");
    CHECK(f[4] == "1.2 D + 1.6 L");
    CHECK(f[5] == "1.2 D + 1.6 L.odd.A_B");
    CHECK(f[6] == "1.2 D + 1.6 L.odd.B_C");
    // A case of kind other in a combination is no longer noted as left out.
    for (const std::string& note : a.combinations.notes)
        CHECK(note.find("hoist") == std::string::npos);
    // The combination's results are the factored sum of its cases' (superposition).
    std::size_t hoist = 0, d = 0, wl = 0;
    for (std::size_t c = 0; c < a.model.cases.size(); ++c) {
        hoist = a.model.cases[c].name == "hoist" ? c : hoist;
        d = a.model.cases[c].name == "D" ? c : d;
        wl = a.model.cases[c].name == "WL" ? c : wl;
    }
    const CaseResults& lift = a.envelopes[0].combinations[1];
    for (std::size_t s = 0; s < a.model.supports.size(); ++s) {
        double sum = 1.2 * a.results.cases[d].reactions[s][1] +
                     1.0 * a.results.cases[hoist].reactions[s][1] +
                     0.5 * a.results.cases[wl].reactions[s][1];
        CHECK(lift.reactions[s][1] == Approx(sum).margin(1e-9 * 4448.2216));
    }
}

TEST_CASE("combinations: a set by case gets located errors for bad names") {
    std::string head = "case WR wind {\n  uniform 0.05 kip/ft down on base.*\n}\n";
    CHECK(firn::testing::first_message(
              all_kinds(head + "combinations site by case {\n  1 = 1.2 D + 1.0 (WL or WX)\n}\n")) ==
          "input:39:26: error: no load case 'WX' (combination site.1); did you mean 'WL'?");
    CHECK(firn::testing::first_message(all_kinds(
              head + "combinations site by case {\n  1 = 1.2 D + 0.5 WL + 1.0 (WR or WL)\n}\n")) ==
          "input:39:35: error: case 'WL' is named twice in combination '1'; write it once with "
          "its whole factor");
    CHECK(firn::testing::first_message(
              all_kinds(head + "combinations site by case {\n  1 = 1.2 D + 1.6 L\n  "
                               "half_live_in = 1\n}\n")) ==
          "input:40:18: error: half_live_in is for sets by load symbol; in a set by case, write "
          "the live case's factor as it is to be taken");
}

TEST_CASE("combinations: bad sets and choices get located errors") {
    CHECK(
        firn::testing::first_message(all_kinds("combinations mine {\n  1 = 1.2 D + 1.6 Q\n}\n")) ==
        "input:36:19: error: unknown load symbol 'Q'; the symbols are D (dead), L (live), "
        "Lr (roof live), S (snow), R (rain) and W (wind)");
    CHECK(firn::testing::first_message(all_kinds("combine asce7_16.strenght\n")) ==
          "input:35:9: error: unknown set of combinations 'asce7_16.strenght'; did you mean "
          "'asce7_16.strength'?");
}

namespace {

/// A simply supported 24 ft beam (steel, I = 510 in^4, E = 29,000 ksi) and a
/// cantilever 8 ft long fixed at its root, each under the cases in `cases`.
std::string deflection_model(const std::string& cases) {
    return "model \"deflection\"\nuse materials\nuse ibc2018\nreport units kip, ft, displacement "
           "in\n"
           "grid x A = 0 ft, B = 24 ft\ngrid y base = 0 ft\n"
           "section girder structural_steel, A = 11.8 in2, I = 510 in4\n"
           "beams along base from A to B section girder\n"
           "support pinned at A.base\nsupport roller at B.base\n"
           "node root at x = 40 ft, y = 0 ft\nnode tip at x = 48 ft, y = 0 ft\n"
           "member arm from root to tip section girder\nsupport fixed at root\n" +
           cases + "deflection base.A.B, arm limit ibc2018.roof_no_ceiling\n";
}

}  // namespace

TEST_CASE("deflection: a simple span and a cantilever against IBC Table 1604.3 limits") {
    // Simply supported beam under uniform w (textbook formula): delta = 5 w L^4 / (384 E I)
    // = 5 x (0.5/12 kip/in) x 288^4 / (384 x 29,000 x 510) = 0.25237 in; IBC 2018 Table
    // 1604.3, roof not supporting a ceiling, S or W: l/180 = 1.6 in, ratio 0.15773.
    // Cantilever with a tip load P (textbook formula): delta = P L^3 / (3 E I) = 2 x 96^3 /
    // (3 x 29,000 x 510) = 0.039880 in; footnote i (from memory): l = 2 x 96 in, limit
    // 1.0667 in, ratio 0.037387. D + L (0.2 + 0.3 kip/ft) gives the same 0.25237 in
    // against l/120 = 2.4 in.
    Analysis a =
        analysed(deflection_model("case D dead {\n  uniform 0.2 kip/ft down on base.A.B\n}\n"
                                  "case L live {\n  uniform 0.3 kip/ft down on base.A.B\n}\n"
                                  "case S1 snow {\n  uniform 0.5 kip/ft down on base.A.B\n  point "
                                  "2 kip down on arm at 8 ft\n}\n"));
    const double in = 0.0254;
    REQUIRE(a.deflections.size() == 6);  // two members x (L or Lr, S or W, D + L)
    const DeflectionCheck& beam_snow = a.deflections[2];
    CHECK(std::string(beam_snow.column) == "S or W");
    CHECK(beam_snow.governing == "S1");
    CHECK(beam_snow.deflection / in == Approx(-0.252365).epsilon(1e-5));
    CHECK(beam_snow.ratio() == Approx(0.157728).epsilon(1e-5));
    CHECK(beam_snow.passes());
    const DeflectionCheck& arm_snow = a.deflections[3];
    CHECK(arm_snow.cantilever);
    CHECK(arm_snow.span / in == Approx(192).epsilon(1e-12));
    CHECK(std::abs(arm_snow.deflection) / in == Approx(0.0398799).epsilon(1e-5));
    CHECK(arm_snow.ratio() == Approx(0.0373874).epsilon(1e-5));
    const DeflectionCheck& beam_total = a.deflections[4];
    CHECK(std::string(beam_total.column) == "D + L");
    CHECK(std::abs(beam_total.deflection) / in == Approx(0.252365).epsilon(1e-5));
    CHECK(beam_total.n == 120);
}

TEST_CASE("deflection: a member past its limit fails, and an unknown row is an error") {
    // 5 w L^4 / (384 E I) with w = 4 kip/ft: 8 x 0.25237 = 2.0189 in > l/180 = 1.6 in.
    Analysis a =
        analysed(deflection_model("case S1 snow {\n  uniform 4 kip/ft down on base.A.B\n}\n"));
    REQUIRE(!a.deflections.empty());
    CHECK_FALSE(a.deflections[0].passes());
    CHECK(a.deflections[0].ratio() == Approx(8 * 0.157728).epsilon(1e-5));
    std::string bad = deflection_model("");
    bad.replace(bad.find("roof_no_ceiling"), 15, "roof_no_ceilng");
    // The beam and the arm are two frames on their own supports: a warning comes first.
    CHECK(firn::testing::messages_for(bad).find("no row of deflection limits "
                                                "'ibc2018.roof_no_ceilng'") != std::string::npos);
}

TEST_CASE("envelopes: in the shelter example a partial snow arrangement governs a beam") {
    // ASCE 7-16 Sec. 7.5.1 (from memory): taking snow off the middle and far spans raises
    // the sagging moment of an end span (three-moment equation, as in the test above), so
    // the end beam's largest M+ under strength design comes from a partial arrangement.
    Analysis a = analyse_file(FIRN_SOURCE_DIR "/examples/shelter.firn");
    REQUIRE(a.ok);
    REQUIRE(a.envelopes.size() == 2);  // strength, then allowable stress
    const MemberEnvelope& end_beam = a.envelopes[0].members[member_index(a.model, "eave.A.B")];
    const Combination& governing = a.combinations.combinations[end_beam.moment_max.combination];
    bool partial =
        std::any_of(governing.terms.begin(), governing.terms.end(), [&](const CombinationTerm& t) {
            return a.model.cases[at(t.case_id)].name == "S.partial.main.case1.A_B";
        });
    CHECK(partial);
}
