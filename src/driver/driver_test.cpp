// Tests of the driver's order: the names expectations use are checked against the
// declared and derived cases and values before anything is solved.
#include <catch2/catch.hpp>
#include <cmath>
#include <span>
#include <string>

#include "analyse/analyse.hpp"
#include "driver/driver.hpp"
#include "testing/test_text.hpp"

using namespace firn;

namespace {

/// The base frame with a dead load case D (lines 9-11) and `expectation` on line 12.
std::string with_expectation(const std::string& expectation) {
    return std::string(testing::kBaseModel) + "case D dead {\n  uniform 1 kip/ft down on B1\n}\n" +
           expectation + "\n";
}

/// A one-bay frame under snow data S (its cases S.balanced, ...) and `expectation`.
std::string snow_frame(const std::string& expectation) {
    return "model \"snow\"\nuse materials\nuse asce7_16\nreport units kip, ft\n"
           "grid x A..B spacing 24 ft\ngrid y base = 0 ft, eave = 16 ft\n"
           "section post structural_steel, A = 9.12 in2, I = 110 in4\n"
           "columns on A..B from base to eave section post\n"
           "beams along eave from A to B section post\nsupport fixed at base\n"
           "snow S {\n  standard = asce7_16\n  pg = 40 psf\n  terrain = C\n"
           "  exposure = partially\n  thermal = unheated\n  risk = II\n}\n"
           "roof main on eave.* {\n  tributary = 20 ft\n}\n" +
           expectation + "\n";
}

/// The diagnostics as `line:col: message`, one a line.
std::string located(const Analysis& a) {
    std::string out;
    for (const Diagnostic& d : a.diagnostics.all()) {
        out += std::to_string(d.where.begin.line) + ":" + std::to_string(d.where.begin.column) +
               ": " + d.message + "\n";
    }
    return out;
}

}  // namespace

TEST_CASE("driver: an unknown source of an expectation stops the run before the solve",
          "[driver][expect]") {
    Analysis a = analyse_text("input", with_expectation("expect moment of B1 under Dead <= 50 "
                                                        "kip*ft"));
    CHECK_FALSE(a.ok);
    CHECK(located(a) == "12:27: no load case or chosen set of combinations 'Dead'\n");
    // Nothing was solved, no results were made, and nothing was checked.
    CHECK_FALSE(a.solution.ok);
    CHECK(a.results.cases.empty());
    CHECK(a.loads.cases.empty());
    CHECK(a.expectations.empty());
}

TEST_CASE("driver: an unknown snow value stops the run before the solve", "[driver][expect]") {
    Analysis a = analyse_text("input", snow_frame("expect snow main.psx <= 40 psf"));
    CHECK(located(a) == "22:1: no derived snow value 'main.psx'; did you mean 'main.ps'?\n");
    CHECK(a.results.cases.empty());
}

TEST_CASE("driver: expectations may name the derived cases and values", "[driver][expect]") {
    // pf = 0.7 Ce Ct Is pg = 0.7 x 1.0 x 1.2 x 1.0 x 40 psf = 33.6 psf (ASCE 7-16 Eq. 7.3-1,
    // Ce from Table 7.3-1 and Is from Table 1.5-2 from memory, Ct from Table 7.3-2).
    Analysis a =
        testing::analysed(snow_frame("expect snow pf = 33.6 psf\n"
                                     "expect moment of eave.* under S.balanced <= 1000 "
                                     "kip*ft"));
    REQUIRE(a.expectations.size() == 2);
    CHECK(a.expectations[0].checked);
    CHECK(a.expectations[1].checked);
    // The derived cases follow the declared ones (here none) in the model that was solved.
    REQUIRE_FALSE(a.model.cases.empty());
    CHECK(a.model.cases.front().name == "S.balanced");
    CHECK(a.derivation.cases.empty());
    CHECK(a.results.cases.size() == a.model.cases.size());
}

namespace {

/// A portal under dead and snow load whose strength combinations are solved to second order.
std::string second_order_frame(const std::string& settings) {
    return "model \"shed\"\nreport units kip, ft\ngrid x A..B spacing 24 ft\n"
           "grid y base = 0 ft, eave = 16 ft\nmaterial steel E = 29000 ksi\n"
           "section post steel, A = 9.12 in2, I = 110 in4\n"
           "columns on A..B from base to eave section post\n"
           "beams along eave from A to B section post\nsupport fixed at base\nuse asce7_16\n"
           "use aisc360_16\ncase D dead {\n  uniform 0.5 kip/ft down on eave.*\n}\n"
           "case S snow {\n  uniform 1.2 kip/ft down on eave.*\n}\n"
           "combine asce7_16.strength {\n" +
           settings + "}\n";
}

}  // namespace

TEST_CASE("driver: second-order sets are enveloped from each combination's own solve") {
    // Envelopes work on second-order combinations as on first-order ones: each
    // combination's results are those of its own second-order solve, and the
    // envelope takes the furthest of them (statics of the envelope, common practice).
    Analysis a = analyse_text("input", second_order_frame("  second_order = yes\n  notional = "
                                                          "aisc360_16.notional\n"));
    REQUIRE(a.ok);
    REQUIRE(a.second_order.size() == 1);
    const Envelopes& env = a.envelopes[0];
    auto set = std::span(a.combinations.combinations)
                   .subspan(a.combinations.sets[0].first, a.combinations.sets[0].count);
    SecondOrderOptions options = a.model.combine->second_order_options;
    CHECK(options.notional_factor == 0.002);  // AISC 360-16 C2.2b, alpha = 1.0
    double most = 0.0;
    for (std::size_t k = 0; k < set.size(); ++k) {
        Diagnostics d;
        SecondOrderResults own =
            solve_second_order(a.model, a.loads, set[k], options, SourceRange{}, d);
        REQUIRE(own.outcome.converged);
        CHECK(a.second_order[0][k].critical_factor == own.outcome.critical_factor);
        CHECK(env.combinations[k].members[0].end[2] == own.results.members[0].end[2]);
        most = std::min(most, own.results.members[0].moment_min.value);
    }
    CHECK(env.members[0].moment_min.value == most);
    // The second-order moment exceeds the first-order one of the same combination.
    Analysis first = analyse_text("input", second_order_frame(""));
    REQUIRE(first.ok);
    CHECK(std::abs(env.members[0].moment_min.value) >
          std::abs(first.envelopes[0].members[0].moment_min.value));
}

TEST_CASE("driver: a low critical load factor is warned of where it is stated") {
    // The columns' Euler load pi^2 EI / h^2 = 854 kip each (K = 1, an upper bound
    // for this sway frame; Timoshenko & Gere, Sec. 2.1) against the 60.5 kip of
    // gravity load of 1.2 D + 1.6 S bounds its critical load factor by 28, so a
    // stated threshold of 50 must warn.
    Analysis a = analyse_text(
        "input", second_order_frame("  second_order = yes\n  critical_factor_warning = 50\n"));
    REQUIRE(a.ok);
    bool warned = false;
    for (const Diagnostic& d : a.diagnostics.all())
        warned = warned || (d.severity == Severity::warning &&
                            d.message.find("has a critical load factor of") != std::string::npos);
    CHECK(warned);
}

TEST_CASE("driver: second-order envelopes carry the forces that act with each value") {
    // Issue 18 item 5 with issue 15's concurrent forces: what acts with an enveloped value
    // comes from the same second-order solve. Statics: where M peaks in the beam, V = 0 and
    // the concurrent M is the value; a support's reaction set is one combination's, and
    // the two bases' Rx differ by the notional load 0.002 x the gravity load (AISC 360-16
    // C2.2b, alpha = 1.0), which sums to zero over all horizontal forces.
    Analysis a = analyse_text("input", second_order_frame("  second_order = yes\n  notional = "
                                                          "aisc360_16.notional\n"));
    REQUIRE(a.ok);
    const Envelopes& env = a.envelopes[0];
    std::size_t beam = a.model.members.size() - 1;  // eave.A.B, after the two columns
    REQUIRE(a.model.members[beam].name == "eave.A.B");
    const Governing& peak = env.members[beam].moment_max;
    CHECK(peak.concurrent[2] == peak.value);
    CHECK(std::abs(peak.concurrent[1]) < 1e-6 * std::abs(peak.value));
    CHECK(peak.concurrent[0] < 0.0);  // the beam is in compression (the columns sway in)
    const Governing& ry = env.reactions[0].max[1];
    REQUIRE(ry.combination != no_combination);
    const CaseResults& own = env.combinations[ry.combination];
    CHECK(ry.concurrent == own.reactions[0]);
    double rx = own.reactions[0][0] + own.reactions[1][0];
    double gravity = own.reactions[0][1] + own.reactions[1][1];
    CHECK(rx == Approx(-0.002 * gravity).epsilon(1e-6));
}
