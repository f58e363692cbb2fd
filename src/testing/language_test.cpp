// Tests of the language at building scale: values, grid runs, generators,
// groups and patterns, and imports with the built-in library.
#include <fmt/format.h>
#include <algorithm>
#include <catch2/catch.hpp>
#include <cmath>
#include <map>

#include "driver/driver.hpp"
#include "testing/test_text.hpp"

using namespace firn;
using firn::testing::first_message;
using firn::testing::messages_for;

namespace {

constexpr double kFt = 0.3048;  // exact

Model resolved(const std::string& text, const ImportOptions& options = {}) {
    Analysis a = analyse_text("input", text, nullptr, options);
    INFO(render(a.diagnostics, a.sources));
    REQUIRE_FALSE(a.diagnostics.has_errors());
    return std::move(a.model);
}

std::vector<std::string> member_names(const Model& m) {
    std::vector<std::string> names;
    for (const Member& member : m.members)
        names.push_back(member.name);
    return names;
}

const Node& node_named(const Model& m, const std::string& name) {
    for (const Node& n : m.nodes) {
        if (n.name == name)
            return n;
    }
    FAIL("no node " << name);
    return m.nodes.front();
}

/// A two-bay, two-storey frame written with generators.
const char* const kFrame =
    "model \"generated\"\n"
    "report units kip, ft\n"
    "let bay = 24 ft\n"
    "grid x A..C spacing bay\n"
    "grid y base = 0 ft, floor = 12 ft, roof = 2 * storey\n"
    "let storey = 12 ft\n"
    "material steel E = 29000 ksi, density = 490 pcf\n"
    "section post steel, A = 9.12 in2, I = 110 in4\n"
    "section girder steel, A = 11.8 in2, I = 510 in4\n"
    "columns on A..C from base to roof section post\n"
    "beams along floor, roof from A to C section girder tag level_beams\n"
    "support fixed at base\n";

}  // namespace

TEST_CASE("values: constants in any order, functions and powers with units") {
    Model m = resolved(std::string(kFrame) +
                       "let w = max(10 psf, 0.5 kPa) * bay\n"
                       "let a = sqrt((3 ft)^2 + (4 ft)^2)\n"
                       "let b = abs(-2 ft) + min(1 ft, 6 in, 2 ft)\n"
                       "node P at x = a + b, y = 30 ft\n"
                       "member M from C.roof to P section post\n"
                       "case D dead { uniform w down on floor.* }\n");
    // 0.5 kPa = 10.44 psf (1 psf = 47.880259 Pa, exact by definition), so max picks it.
    CHECK(m.cases[0].distributed[0].w_start == Approx(500.0 * 24 * kFt).epsilon(1e-12));
    const Node& p = node_named(m, "P");
    CHECK(p.x == Approx((5.0 + 2.0 + 0.5) * kFt).epsilon(1e-12));  // 3-4-5 triangle
}

TEST_CASE("values: a dimension mismatch shows both dimensions") {
    CHECK(first_message(std::string(kFrame) + "let z = 2 ft + 3 kip\n") ==
          "input:13:9: error: cannot add a length and a force");
    CHECK(first_message(std::string(kFrame) + "let z = sqrt(2 ft)\n") ==
          "input:13:9: error: the square root of a length has no unit");
    CHECK(first_message(std::string(kFrame) + "let z = 2 ft ^ bay\n") ==
          "input:13:16: error: a power must be a plain number, found a length");
}

TEST_CASE("values: a value defined by itself is reported with its chain") {
    CHECK(first_message(std::string(kFrame) + "let p = q + 1 ft\nlet q = p\n") ==
          "input:14:9: error: value 'p' depends on itself: p -> q -> p");
}

TEST_CASE("grid runs: letters skip I and O, numbers and prefixes count") {
    Model m = resolved(
        "grid x A..J spacing 10 ft, 10 ft, 10 ft, 10 ft, 10 ft, 10 ft, 10 ft, 12 ft from 5 ft\n"
        "grid y L1..L3 spacing 3 m\n"
        "material steel E = 200 GPa\nsection s steel, A = 1 in2, I = 1 in4\n"
        "beams along L2 from A to J section s\nsupport pinned at L2\n");
    std::vector<std::string> x;
    for (const GridLine& g : m.grid_x)
        x.push_back(g.name);
    CHECK(x == std::vector<std::string>{"A", "B", "C", "D", "E", "F", "G", "H", "J"});
    CHECK(m.grid_x.front().position == Approx(5 * kFt));
    CHECK(m.grid_x.back().position == Approx((5 + 70 + 12) * kFt));
    CHECK(m.grid_y[2].name == "L3");
    CHECK(m.grid_y[2].position == Approx(6.0));
    CHECK(m.supports.size() == 9);
}

TEST_CASE("grid runs: lettered lines go on after Z to AA, AB") {
    Model m = resolved(
        "grid x Y..AB spacing 1 m\ngrid y g = 0 m\n"
        "material steel E = 200 GPa\nsection s steel, A = 1 in2, I = 1 in4\n"
        "beams along g from Y to AB section s\nsupport fixed at Y.g\n");
    CHECK(member_names(m) == std::vector<std::string>{"g.Y.Z", "g.Z.AA", "g.AA.AB"});
}

TEST_CASE("generators: names follow the grid; members run left to right and upwards") {
    Model m = resolved(std::string(kFrame) + "case D dead { self weight }\n");
    CHECK(member_names(m) == std::vector<std::string>{"A.base.floor", "A.floor.roof",
                                                      "B.base.floor", "B.floor.roof",
                                                      "C.base.floor", "C.floor.roof", "floor.A.B",
                                                      "floor.B.C", "roof.A.B", "roof.B.C"});
    const Member& beam = m.members[7];
    CHECK(m.nodes[at(beam.start)].name == "B.floor");
    CHECK(m.nodes[at(beam.end)].name == "C.floor");
    CHECK(m.nodes[at(m.members[0].start)].y < m.nodes[at(m.members[0].end)].y);
    CHECK(m.supports.size() == 3);  // `support fixed at base`: every node on the level
}

TEST_CASE("generators: a new line outside a run leaves existing names as they were") {
    std::string more = std::string(kFrame);
    more.replace(more.find("grid x A..C spacing bay"), 23, "grid x A..D spacing bay");
    Model before = resolved(std::string(kFrame) + "case D dead { self weight }\n");
    Model after = resolved(more + "case D dead { self weight }\n");
    auto names = member_names(after);
    for (const std::string& name : member_names(before))
        CHECK(std::find(names.begin(), names.end(), name) != names.end());
}

TEST_CASE("rafters: split where they cross a column line, at the height on the slope") {
    Model m = resolved(
        "grid x A..E spacing 10 ft\ngrid y base = 0 ft, eave = 12 ft, ridge = 20 ft\n"
        "material steel E = 29000 ksi\nsection s steel, A = 5 in2, I = 100 in4\n"
        "columns on A, E from base to eave section s\n"
        "rafters gable from A.eave to C.ridge to E.eave section s hinge at C.ridge\n"
        "support pinned at base\n");
    CHECK(member_names(m) == std::vector<std::string>{"A.base.eave", "E.base.eave", "gable.A.B",
                                                      "gable.B.C", "gable.C.D", "gable.D.E"});
    CHECK(node_named(m, "B.gable").y == Approx(16 * kFt));  // halfway up a 12 ft to 20 ft slope
    CHECK(m.members[3].hinge_end);                          // gable.B.C ends at the ridge
    CHECK(m.members[4].hinge_start);                        // gable.C.D starts there
}

TEST_CASE("generators: an intersection at a declared node joins that node") {
    Model m = resolved(
        "grid x A..B spacing 20 ft\ngrid y base = 0 ft, top = 10 ft\n"
        "node K at x = 0 ft, y = 10 ft\n"
        "material steel E = 29000 ksi\nsection s steel, A = 5 in2, I = 100 in4\n"
        "columns on A..B from base to top section s\n"
        "beams along top from A to B section s\nsupport fixed at A.base, B.base\n");
    CHECK(m.nodes[at(m.members[0].end)].name == "K");
    CHECK(m.nodes[at(m.members[2].start)].name == "K");
}

TEST_CASE("groups, tags and patterns select members wherever a list is expected") {
    Model m = resolved(std::string(kFrame) +
                       "group floor_and_roof = floor.*, roof.A.B, roof.B.C\n"
                       "case D dead {\n"
                       "  uniform 1 kip/ft down on level_beams\n"
                       "  uniform 2 kip/ft down on floor_and_roof\n"
                       "  uniform 3 kip/ft x on *.base.floor\n"
                       "}\n");
    const auto& loads = m.cases[0].distributed;
    REQUIRE(loads.size() == 4 + 4 + 3);
    std::map<std::string, int> count;
    for (const auto& l : loads)
        ++count[m.members[at(l.member)].name];
    CHECK(count["floor.A.B"] == 2);
    CHECK(count["roof.B.C"] == 2);
    CHECK(count["B.base.floor"] == 1);
}

TEST_CASE("groups: a member listed twice in one load takes it once, with a warning") {
    Analysis a =
        analyse_text("input", std::string(kFrame) +
                                  "case D dead { uniform 1 kip/ft down on floor.A.B, floor.* }\n");
    CHECK(a.ok);
    CHECK(a.model.cases[0].distributed.size() == 2);
    CHECK(render(a.diagnostics, a.sources)
              .starts_with("input:13:51: warning: member 'floor.A.B' is listed twice"));
}

TEST_CASE("imports: the built-in library's materials, E from f'c") {
    Model m = resolved(
        "use materials\ngrid x A..B spacing 20 ft\ngrid y base = 0 ft, top = 10 ft\n"
        "section s concrete_4000, rectangle b = 12 in, d = 24 in\n"
        "columns on A..B from base to top section s\nsupport fixed at base\n");
    // ACI 318-19 Sec. 19.2.2.1(b): Ec = 57,000 sqrt(f'c) psi, f'c = 4000 psi (from memory).
    const double psi = 4.4482216152605 / (0.0254 * 0.0254);
    const Material* concrete = nullptr;
    for (const Material& mat : m.materials) {
        if (mat.name == "concrete_4000")
            concrete = &mat;
    }
    REQUIRE(concrete != nullptr);
    CHECK(concrete->elastic_modulus == Approx(57000.0 * std::sqrt(4000.0) * psi).epsilon(1e-12));
}

namespace {

/// Files of an in-memory project, read through the import seam.
ImportOptions project(std::map<std::string, std::string> files) {
    ImportOptions options;
    options.read = [files](const std::string& path, std::string& text, std::string& error) {
        auto it = files.find(path);
        if (it == files.end()) {
            error = fmt::format("cannot read '{}': No such file or directory", path);
            return false;
        }
        text = it->second;
        return true;
    };
    return options;
}

const char* const kFrameBody =
    "grid x A..B spacing bay\ngrid y base = 0 ft, top = 10 ft\n"
    "section s structural_steel, A = 5 in2, I = 100 in4\n"
    "columns on A..B from base to top section s\nbeams along top from A to B section s\n"
    "support fixed at base\n";

}  // namespace

TEST_CASE("imports: values shared through a file used twice load once") {
    auto options = project({{"shared/values.firn", "use materials\nlet bay = 30 ft\n"},
                            {"shared/more.firn", "use \"values.firn\"\nlet roofing = 12 psf\n"}});
    Analysis a =
        analyse_text("input",
                     std::string("use \"shared/values.firn\"\nuse \"shared/more.firn\"\n") +
                         kFrameBody + "case D dead { uniform roofing * bay down on top.* }\n",
                     nullptr, options);
    INFO(render(a.diagnostics, a.sources));
    REQUIRE(a.ok);
    CHECK(a.model.grid_x[1].position == Approx(30 * kFt));
}

TEST_CASE("imports: a cycle is an error showing the chain") {
    auto options =
        project({{"a.firn", "use \"b.firn\"\nlet bay = 1 ft\n"}, {"b.firn", "use \"a.firn\"\n"}});
    Analysis a =
        analyse_text("input", std::string("use \"a.firn\"\n") + kFrameBody, nullptr, options);
    CHECK(render(a.diagnostics, a.sources)
              .starts_with("b.firn:1:5: error: the files use each other in a cycle: a.firn -> "
                           "b.firn -> a.firn"));
}

TEST_CASE("imports: a file outside the model's folder needs 'use outside'") {
    auto options = project({{"common/bay.firn", "let bay = 20 ft\n"}});
    std::string body = std::string(kFrameBody) + "use materials\n";
    Analysis refused =
        analyse_text("project/frame.firn", "use \"../common/bay.firn\"\n" + body, nullptr, options);
    CHECK(render(refused.diagnostics, refused.sources)
              .starts_with("project/frame.firn:1:5: error: 'common/bay.firn' is outside the "
                           "model's folder; write 'use outside \"../common/bay.firn\"' to use it "
                           "anyway"));
    Analysis allowed = analyse_text(
        "project/frame.firn", "use outside \"../common/bay.firn\"\n" + body, nullptr, options);
    INFO(render(allowed.diagnostics, allowed.sources));
    CHECK(allowed.ok);
}

TEST_CASE("imports: a library folder replaces the built-in library when given") {
    auto options = project(
        {{"mylib/materials.firn", "material structural_steel E = 30000 ksi, density = 490 pcf\n"},
         {"mylib/extra.firn", "let bay = 10 ft\n"}});
    options.stdlib_dir = "mylib";
    Model m = resolved(std::string("use materials\nuse extra\n") + kFrameBody, options);
    CHECK(m.materials[0].elastic_modulus == Approx(30000 * 6894757.293168361).epsilon(1e-12));
    CHECK(first_message("use matrials\n") ==
          "input:1:5: error: unknown library module 'matrials'; did you mean 'materials'?");
}
