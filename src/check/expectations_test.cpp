// Tests of expectations (`expect`): the language, the values they are held to
// and their margins, against closed forms of a simply supported beam.
#include <fmt/format.h>
#include <catch2/catch.hpp>
#include <cmath>

#include "driver/driver.hpp"
#include "testing/test_text.hpp"

using namespace firn;

using firn::testing::analysed;

namespace {

constexpr double kKip = 4448.2216152605;  // N, exact
constexpr double kFt = 0.3048;            // m, exact
constexpr double kInch = 0.0254;          // m, exact
constexpr double kKipFt = kKip * kFt;
constexpr double kPsf = 4.4482216152605 / (kFt * kFt);

/// A simply supported 20 ft beam, E = 29000 ksi, I = 100 in^4, under D = 1 kip/ft and
/// L = 0.5 kip/ft. Closed forms (any beam table, e.g. AISC Manual Table 3-23 case 1):
/// M = wL^2/8 (D: 50 kip*ft), R = V = wL/2 (D: 10 kip), midspan deflection
/// 5wL^4/384EI (D: 1.24138 in).
std::string beam(const std::string& expectations) {
    return "model \"beam\"\n"
           "report units kip, ft, displacement in\n"
           "node N1 at x = 0 ft, y = 0 ft\n"
           "node N2 at x = 20 ft, y = 0 ft\n"
           "material steel E = 29000 ksi, density = 490 pcf\n"
           "section beam steel, A = 10 in2, I = 100 in4\n"
           "member B1 from N1 to N2 section beam\n"
           "support pinned at N1\n"
           "support roller at N2\n"
           "case D dead {\n  uniform 1 kip/ft down on B1\n}\n"
           "case L live {\n  uniform 0.5 kip/ft down on B1\n}\n" +
           expectations;
}

/// The one expectation's outcome.
ExpectationOutcome only(const std::string& expectation) {
    Analysis a = analysed(beam(expectation + "\n"));
    REQUIRE(a.expectations.size() == 1);
    REQUIRE(a.expectations[0].checked);
    return a.expectations[0];
}

}  // namespace

TEST_CASE("expect: a moment bound passes or fails by its margin", "[expect]") {
    // M = wL^2/8 = 1 x 20^2 / 8 = 50 kip*ft under D alone (simple-beam formula).
    ExpectationOutcome pass = only("expect moment of B1 under D <= 55 kip*ft");
    CHECK(pass.passed());
    CHECK(pass.closest.value == Approx(50.0 * kKipFt));
    CHECK(pass.closest.margin == Approx(5.0 * kKipFt));
    CHECK(pass.closest.position == Approx(10.0 * kFt));
    CHECK(pass.closest.governing == "D");

    ExpectationOutcome fail = only("expect moment of B1 under D <= 45 kip*ft");
    CHECK_FALSE(fail.passed());
    REQUIRE(fail.failures.size() == 1);
    CHECK(fail.failures[0].place == "B1");
    CHECK(fail.failures[0].margin == Approx(-5.0 * kKipFt));
    // A tolerance lets the bound be passed by that much: 45 x 1.12 = 50.4 > 50.
    CHECK(only("expect moment of B1 under D <= 45 kip*ft within 12 %").passed());
    CHECK_FALSE(only("expect moment of B1 under D <= 45 kip*ft within 4 kip*ft").passed());
    // Sagging everywhere: the least moment is 0, so a lower bound of 0 holds exactly.
    CHECK(only("expect moment of B1 under D >= 0 kip*ft").passed());
}

TEST_CASE(
    "expect: without 'under', a model without combinations is checked over every case "
    "alone",
    "[expect]") {
    // D governs: wL^2/8 = 50 kip*ft against L's 25 kip*ft.
    ExpectationOutcome o = only("expect moment of B1 <= 49 kip*ft");
    REQUIRE(o.failures.size() == 1);
    CHECK(o.failures[0].value == Approx(50.0 * kKipFt));
    CHECK(o.failures[0].governing == "D");
    ExpectationOutcome live = only("expect moment of B1 under L = 25.0 kip*ft");
    CHECK(live.passed());
    CHECK(live.closest.value == Approx(25.0 * kKipFt));
}

TEST_CASE("expect: '=' holds to half the last digit written, or to the tolerance given",
          "[expect]") {
    // R = wL/2 = 10 kip (simple-beam formula).
    CHECK(only("expect reaction y at N1 under D = 10 kip").passed());          // within 0.5 kip
    CHECK_FALSE(only("expect reaction y at N1 under D = 10.4 kip").passed());  // 0.05 kip
    CHECK(only("expect reaction y at N1 under D = 10.3 kip within 0.35 kip").passed());
    CHECK_FALSE(only("expect reaction y at N1 under D = 10.06 kip").passed());  // 0.005 kip
    CHECK(only("expect reaction y at N1 under D = 10.000 kip").passed());
    CHECK(only("expect reaction y at N1 under D = 10.3 kip within 5 %").passed());
    CHECK_FALSE(only("expect reaction y at N1 under D = 10.6 kip within 5 %").passed());
}

TEST_CASE("expect: shear, deflection and displacement bounds", "[expect]") {
    // V = +-wL/2 = +-10 kip at the ends under D.
    ExpectationOutcome v = only("expect shear of B1 under D between -10 kip and 10 kip");
    CHECK(v.passed());
    CHECK(v.closest.margin == Approx(0.0).margin(1e-6 * kKip));
    // 5wL^4/384EI = 5 (1/12 kip/in)(240 in)^4 / (384 x 29000 ksi x 100 in^4) = 1.24138 in.
    double delta = 5.0 * (1.0 / 12.0) * std::pow(240.0, 4) / (384.0 * 29000.0 * 100.0);
    ExpectationOutcome d = only("expect deflection of B1 under D >= -1.2 in");
    REQUIRE(d.failures.size() == 1);
    CHECK(d.failures[0].value == Approx(-delta * kInch).epsilon(1e-6));
    CHECK(d.failures[0].position == Approx(10.0 * kFt).epsilon(1e-4));
    // The roller end moves along the beam by nothing: no axial force, no load along x.
    CHECK(only("expect displacement x at N2 under D between -0.001 in and 0.001 in").passed());
    CHECK(only("expect axial of B1 under D = 0 kip").passed());
}

TEST_CASE("expect: a pattern of members is held member by member", "[expect]") {
    std::string text = beam("") +
                       "node N3 at x = 30 ft, y = 0 ft\n"
                       "member B2 from N2 to N3 section beam\n"
                       "support roller at N3\n"
                       "expect moment of B* under D <= 10 kip*ft\n";
    Analysis a = analysed(text);
    REQUIRE(a.expectations.size() == 1);
    const ExpectationOutcome& o = a.expectations[0];
    CHECK_FALSE(o.passed());
    REQUIRE(o.failures.size() == 1);  // B2 carries no load: its sagging moment is 0
    CHECK(o.failures[0].place == "B1");
}

TEST_CASE("expect: a derived snow value", "[expect]") {
    // pf = 0.7 Ce Ct Is pg = 0.7 x 1.0 x 1.0 x 1.0 x 40 psf = 28 psf (ASCE 7-16 Eq. 7.3-1,
    // Ce of Table 7.3-1 for terrain C partially exposed, Ct of Table 7.3-2 heated).
    std::string text =
        "model \"roof\"\nuse materials\nuse asce7_16\nreport units kip, ft\n"
        "grid x A..B spacing 20 ft\ngrid y base = 0 ft\n"
        "section girder structural_steel, A = 11.8 in2, I = 510 in4\n"
        "beams along base from A to B section girder\n"
        "support pinned at A.base\nsupport roller at B.base\n"
        "snow S {\n  standard = asce7_16\n  pg = 40 psf\n  terrain = C\n"
        "  exposure = partially\n  thermal = heated\n  risk = II\n}\n"
        "roof main on base.* {\n  tributary = 10 ft\n}\n"
        "expect snow pf = 28.0 psf\n"
        "expect snow main.ps <= 27 psf\n"
        "expect snow Ce = 1.0\n";
    Analysis a = analysed(text);
    REQUIRE(a.expectations.size() == 3);
    CHECK(a.expectations[0].passed());
    CHECK(a.expectations[0].closest.value == Approx(28.0 * kPsf));
    REQUIRE(a.expectations[1].failures.size() == 1);
    CHECK(a.expectations[1].failures[0].margin == Approx(-1.0 * kPsf));  // ps = Cs pf, Cs = 1
    CHECK(a.expectations[2].passed());
}

TEST_CASE("expect: mistakes are reported where they are", "[expect]") {
    using firn::testing::first_message;
    CHECK(first_message(beam("expect moment of B1 under W <= 4 kip*ft\n")) ==
          "input:16:27: error: no load case or chosen set of combinations 'W'");
    CHECK(first_message(beam("expect moment of B1 <= 4 kip\n")) ==
          "input:16:24: error: expected a moment such as 10 kip*ft, found 4 kip, a force");
    CHECK(first_message(beam("expect reaction y at N2 under D <= 4 kip\nexpect moment of B9 "
                             "<= 1 kip*ft\n")) ==
          "input:17:18: error: unknown member or group 'B9'; did you mean 'B1'?");
    CHECK(first_message(beam("expect snow pf = 30 psf\n")) ==
          "input:16:1: error: no derived snow value 'pf'; the model has no snow data");
    CHECK(first_message(beam("expect moment of B1 = 2 * 3 kip*ft\n")) ==
          "input:16:23: error: '=' to a computed value needs a tolerance: add 'within' and a "
          "value or a percentage, as in: within 1 %");
    CHECK(first_message(beam("expect shear of B1 between 4 kip and 2 kip\n")) ==
          "input:16:38: error: the upper bound is below the lower one; write the lower first");
    CHECK(first_message(beam("expect moment of B1 < 4 kip*ft\n")) ==
          "input:16:21: error: expected the bound: <= value, >= value, = value, or between low "
          "and high, found '<'");
    CHECK(first_message(beam("expect reaction y at N1 <= 4 kip within -1 kip\n")) ==
          "input:16:41: error: a tolerance cannot be negative");
}
