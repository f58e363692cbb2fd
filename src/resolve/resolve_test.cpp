// Tests of resolve: names, units, dimensions and model rules, each error
// asserted by exact message, line and column.
#include <catch2/catch.hpp>
#include <cmath>

#include "driver/driver.hpp"
#include "testing/test_text.hpp"

using namespace firn;
using firn::testing::first_message;
using firn::testing::kBaseModel;
using firn::testing::messages_for;

namespace {

/// The base model plus `extra` (starting on line 9).
std::string with(const std::string& extra) {
    return std::string(kBaseModel) + extra;
}

Model resolved(const std::string& text) {
    Analysis a = analyse_text("input", text);
    INFO(render(a.diagnostics, a.sources));
    REQUIRE_FALSE(a.diagnostics.has_errors());
    return std::move(a.model);
}

}  // namespace

TEST_CASE("the base model of these tests is valid") {
    CHECK(messages_for(kBaseModel).empty());
}

TEST_CASE("quantities convert exactly to SI") {
    // Exact definitions: 1 ft = 0.3048 m, 1 in = 0.0254 m, 1 lb = 0.45359237 kg x 9.80665 m/s^2.
    Model m = resolved(with(
        "node N3 at x = 3 ft + 6 in, y = 2 m - 500 mm\nmember B2 from N2 to N3 section beam\n"));
    CHECK(m.nodes[2].x == Approx(3.5 * 0.3048).epsilon(1e-15));
    CHECK(m.nodes[2].y == Approx(1.5).epsilon(1e-15));
    CHECK(m.materials[0].elastic_modulus ==
          Approx(29000.0 * 1000.0 * 4.4482216152605 / (0.0254 * 0.0254)).epsilon(1e-14));
    CHECK(m.materials[0].unit_weight ==
          Approx(490.0 * 4.4482216152605 / (0.3048 * 0.3048 * 0.3048)).epsilon(1e-14));
    CHECK(m.sections[0].inertia == Approx(100.0 * std::pow(0.0254, 4)).epsilon(1e-14));
}

TEST_CASE("sections computed from shapes") {
    // Solid rectangle: A = b d, I = b d^3 / 12 (statics of areas, common practice).
    // I-shape of plates: A = 2 bf tf + (d - 2 tf) tw, I = [bf d^3 - (bf - tw)(d - 2 tf)^3] / 12.
    Model m =
        resolved(with("section r steel, rectangle b = 4 in, d = 12 in\n"
                      "section w steel, ishape d = 16 in, bf = 7 in, tf = 0.5 in, tw = 0.3 in\n"));
    double in2 = 0.0254 * 0.0254, in4 = in2 * in2;
    CHECK(m.sections[1].area == Approx(48.0 * in2));
    CHECK(m.sections[1].inertia == Approx(576.0 * in4));
    CHECK(m.sections[2].area == Approx(2 * 7 * 0.5 * in2 + 15 * 0.3 * in2));  // 11.5 in^2
    CHECK(m.sections[2].inertia ==
          Approx((7.0 * 4096.0 - 6.7 * 3375.0) / 12.0 * in4));  // 504.0417 in^4
}

TEST_CASE("grid lines place nodes, and supports get their restraints") {
    Model m =
        resolved(with("grid x A = 0 ft, B = 24 ft\ngrid y base = 0 ft, eave = 16 ft\n"
                      "node G at B, eave\nmember B2 from N2 to G section beam\n"
                      "support roller free y at G\n"));
    CHECK(m.nodes[2].x == Approx(24 * 0.3048));
    CHECK(m.nodes[2].y == Approx(16 * 0.3048));
    REQUIRE(m.supports.size() == 2);
    CHECK(m.supports[1].restraint[dof_x].kind == Restraint::Kind::fixed);
    CHECK(m.supports[1].restraint[dof_y].kind == Restraint::Kind::free);
}

TEST_CASE("load directions, clockwise moments and projected loads resolve to the model's loads") {
    Model m =
        resolved(with("case D dead {\n"
                      "  point 2 kip down at N2\n"
                      "  moment 3 kip*ft clockwise at N2\n"
                      "  uniform 1 kip/ft down projected on B1 from 2 ft to 4 ft\n"
                      "}\n"));
    const LoadCase& c = m.cases[0];
    REQUIRE(c.nodal.size() == 2);
    CHECK(c.nodal[0].fy == Approx(-2000 * 4.4482216152605));
    CHECK(c.nodal[1].moment == Approx(-3000 * 4.4482216152605 * 0.3048));
    REQUIRE(c.distributed.size() == 1);
    CHECK(c.distributed[0].projected);
    CHECK(c.distributed[0].start == Approx(2 * 0.3048));
}

TEST_CASE("resolve errors: exact message, line and column") {
    CHECK(first_message(with("node N3 at x = 12, y = 0 ft\n")) ==
          "input:9:16: error: expected a length such as 12 ft, found 12");
    CHECK(first_message(with("node N3 at x = 12 psf, y = 0 ft\n")) ==
          "input:9:16: error: expected a length such as 12 ft, found 12 psf, a pressure");
    CHECK(first_message(with("node N3 at x = 12 kips, y = 0 ft\n")) ==
          "input:9:19: error: unknown unit 'kips'; did you mean 'kip'?");
    CHECK(first_message(with("node N3 at x = 2 ft + 3 kip, y = 0 ft\n")) ==
          "input:9:16: error: cannot add a length and a force");
    CHECK(first_message(with("node N3 at x = 1/2 in, y = 0 ft\n")) ==
          "input:9:16: error: expected a length such as 12 ft, found a quantity of dimension "
          "1/length "
          "('1/2 in' means 1 divided by 2 in; write (1/2) in or 0.5 in)");
    CHECK(first_message(with("member B2 from N2 to N4 section beam\n")) ==
          "input:9:22: error: unknown node 'N4'; did you mean 'N1'?");
    CHECK(first_message(with("member B1 from N2 to N1 section beam\n")) ==
          "input:9:8: error: member 'B1' is already defined");
    CHECK(
        first_message(
            with("node N3 at x = 0 ft, y = 0 ft\nmember Z from N1 to N3 section beam\n")) ==
        "input:9:6: warning: node 'N3' is at the same place as node 'N1'; they are not connected");
    CHECK(first_message(with("member B2 from N2 to N2 section beam\n")) ==
          "input:9:22: error: member 'B2' starts and ends at node 'N2'");
    CHECK(first_message(with("member B2 from N2 to N1 section beem\n")) ==
          "input:9:33: error: unknown section 'beem'; did you mean 'beam'?");
    CHECK(first_message(with("node N3 at x = 20 ft, y = 0 ft\nmember B2 from N2 to N3 section beam "
                             "hinge at N1\n")) ==
          "input:10:47: error: node 'N1' is not an end of member 'B2'");
    CHECK(first_message(with("support pinned at N1\n")) ==
          "input:9:19: error: node 'N1' already has a support");
    CHECK(first_message(with("support fixed at N2 x = 10 kip/in\n")) ==
          "input:9:21: error: springs are given only for 'support spring'");
    CHECK(first_message(with("section s2 steel, A = 10 in2\n")) ==
          "input:9:9: error: section 's2' needs 'I', a second moment of area");
    CHECK(first_message(with("section s2 steel, A = 10 in2, I = 2 in4, Ix = 3 in4\n")) ==
          "input:9:42: error: unknown property 'Ix' of section 's2'; expected A, I; did you mean "
          "'I'?");
    CHECK(first_message(with("section s2 steel, A = -10 in2, I = 3 in4\n")) ==
          "input:9:23: error: 'A' must be greater than zero");
    CHECK(first_message(with("node N3 at x = 1e300 ft * 1e300, y = 0 ft\n")) ==
          "input:9:16: error: this value is too large to be a finite number");
    CHECK(first_message(with("node N3 at x = 1e999 ft, y = 0 ft\n")) ==
          "input:9:16: error: the number 1e999 is too large");
    CHECK(first_message(with("node N3 at x = 1e9 ft, y = 0 ft\n")) ==
          "input:9:16: error: this coordinate is out of range (beyond 100000 in SI units)");
}

TEST_CASE("load errors: exact message, line and column") {
    CHECK(first_message(with("case D dead {\n  uniform 1 kip/ft down on B9\n}\n")) ==
          "input:10:28: error: unknown member or group 'B9'; did you mean 'B1'?");
    CHECK(
        first_message(with("case D dead {\n  uniform 1 kip down on B1\n}\n")) ==
        "input:10:11: error: expected a force per length such as 0.5 kip/ft, found 1 kip, a force");
    CHECK(first_message(with("case D dead {\n  point 1 kip down on B1 at 12 ft\n}\n")) ==
          "input:10:29: error: 12.000 ft lies outside member 'B1', which is 10.000 ft long");
    CHECK(first_message(
              with("case D dead {\n  uniform 1 kip/ft down on B1 from 6 ft to 4 ft\n}\n")) ==
          "input:10:44: error: a loaded part must end after it starts");
    CHECK(first_message(with("case D dead {\n  point 1 kip axial at N2\n}\n")) ==
          "input:10:15: error: a load at a node takes a global direction (x, y, up or down)");
    CHECK(first_message(with("case D dead {\n  uniform 1 kip/ft x projected on B1\n}\n")) ==
          "input:10:20: error: 'projected' is for vertical loads (down, up or y) given per "
          "horizontal length");
    CHECK(first_message(
              with("case D dead {\n  uniform 1 kip/ft down on B1\n}\ncase D live {\n}\n")) ==
          "input:12:6: error: load case 'D' is already defined");
    CHECK(first_message(with("material wood E = 1600 ksi\nsection j wood, A = 1 in2, I = 1 in4\n"
                             "node N3 at x = 10 ft, y = 5 ft; member B2 from N2 to N3 section j\n"
                             "case D dead {\n  self weight\n}\n")) ==
          "input:13:3: error: self weight needs the density of material 'wood'");
}

TEST_CASE("whole-model errors") {
    CHECK(first_message("node N1 at x = 0 ft, y = 0 ft\n") ==
          "input:1:1: error: the model has no members");
    CHECK(first_message(with("node N9 at x = 5 ft, y = 5 ft\n")) ==
          "input:9:6: error: node 'N9' is not connected to any member");
}

TEST_CASE("independent resolve errors are all reported in one run") {
    std::string all =
        messages_for(with("node N3 at x = 12, y = 0 ft\nmember B2 from N2 to N4 section beem\n"));
    CHECK(all.find("input:9:16: error: expected a length") != std::string::npos);
    CHECK(all.find("input:10:22: error: unknown node 'N4'") != std::string::npos);
    CHECK(all.find("input:10:33: error: unknown section 'beem'") != std::string::npos);
}

TEST_CASE("report units left out follow the family of those given") {
    auto units_of = [](const std::string& line) {
        Analysis a = analyse_text(
            "input", line + std::string(kBaseModel).substr(std::string(kBaseModel).find("node")));
        REQUIRE(a.ok);
        return a.model.units.force.name + " " + a.model.units.length.name + " " +
               a.model.units.moment.name + " " + a.model.units.displacement.name;
    };
    CHECK(units_of("report units kip\n") == "kip ft kip*ft in");
    CHECK(units_of("report units mm\n") == "kN mm kN*mm mm");
    CHECK(units_of("report units lb, in, displacement mm\n") == "lb in lb*in mm");
    CHECK(units_of("report units kN, m, kN*mm\n") == "kN m kN*mm mm");
    CHECK(units_of("") == "kN m kN*m mm");
}

TEST_CASE("a text value is a name for the library; it is no number") {
    // A text that nothing uses is fine; used in an expression, it is an error there.
    CHECK(messages_for(std::string(kBaseModel) + "let site.edition = \"Local rules\"\n").empty());
    CHECK(first_message(std::string(kBaseModel) +
                        "let site.edition = \"Local rules\"\nlet bay = 2 * site.edition\n") ==
          "input:10:15: error: 'site.edition' is a text, not a number");
}

TEST_CASE("a cover's fields come from any file once each, in the report's order") {
    Model m =
        resolved(with("cover {\n  revision = \"C\"\n  project = \"Barn\"\n}\n"
                      "cover {\n  dated = \"2026-01-05\"\n}\n"));
    REQUIRE(m.cover.size() == 3);
    CHECK(m.cover[0].label == "Project");
    CHECK(m.cover[0].text == "Barn");
    CHECK(m.cover[1].key == "revision");
    CHECK(m.cover[2].label == "Dated");
    CHECK(first_message(with("cover {\n  drawn = \"x\"\n}\n")) ==
          "input:10:3: error: a cover has no field 'drawn'; it gives project, structure, "
          "prepared_by, checked_by, revision or dated");
    CHECK(first_message(with("cover {\n  revision = \"A\"\n}\ncover {\n  revision = \"B\"\n}\n")) ==
          "input:13:3: error: the cover's revision is already given");
    CHECK(first_message(with("cover {\n  revision = C\n}\n")) ==
          "input:10:14: error: expected the text in double quotes, as in: project = \"Seed "
          "store\", found 'C'");
}

TEST_CASE("bounds take any expression, (1/2) in is half an inch, and bounds show as written") {
    // The base model's member B1 is 10 ft long. 1 in = 0.0254 m exactly (NIST SP 811).
    Model m =
        resolved(with("case D dead {\n  uniform 1 kip/ft down on B1\n}\n"
                      "expect deflection of B1 between -4 m / 150 and 4 m / 150\n"
                      "expect deflection of B1 <= 4 m / 150 within 0.1 mm\n"
                      "expect deflection of B1 <= (1/2) in\n"
                      "expect rotation at N2 <= 0.01 within 0.001\n"));
    REQUIRE(m.expectations.size() == 4);
    CHECK(m.expectations[0].low == Approx(-4.0 / 150.0));
    CHECK(m.expectations[0].high == Approx(4.0 / 150.0));
    CHECK(m.expectations[0].bound_written == "between -4 m / 150 and 4 m / 150");
    CHECK(m.expectations[1].tolerance == Approx(1e-4));
    CHECK(m.expectations[1].bound_written == "<= 4 m / 150 within 0.1 mm");
    CHECK(m.expectations[2].high == Approx(0.0127).epsilon(1e-12));
    CHECK(m.expectations[2].bound_written == "<= (1 / 2) in");
    // `within` after a plain-number bound (a rotation) is a tolerance, not a unit.
    CHECK(m.expectations[3].tolerance == Approx(0.001));
    CHECK(first_message(with("let h = (1/2) kip\nsection s2 steel, A = h, I = 100 in4\n")) ==
          "input:10:23: error: expected an area such as 9.12 in^2, found 'h', a force");
}
