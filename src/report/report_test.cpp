// Tests of the reports: determinism, units in headers, caution, locality of
// changes, and that JSON is the same results.
#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>
#include <regex>
#include <sstream>

#include "driver/driver.hpp"
#include "report/report.hpp"
#include "testing/test_text.hpp"

using namespace firn;

namespace {

const std::string kFrame = std::string(testing::kBaseModel) +
                           "case D dead {\n  uniform 1 kip/ft down on B1\n}\n"
                           "case W wind {\n  point 2 kip x at N2\n}\n";

std::string report_of(const std::string& text, bool json = false) {
    Analysis a = analyse_text("frame.firn", text);
    INFO(render(a.diagnostics, a.sources));
    REQUIRE(a.ok);
    return json ? json_report(a.model, a.results, {}) : text_report(a.model, a.results, {});
}

std::vector<std::string> lines(const std::string& text) {
    std::vector<std::string> out;
    std::istringstream in(text);
    for (std::string line; std::getline(in, line);)
        out.push_back(line);
    return out;
}

}  // namespace

TEST_CASE("the report carries the caution, the units and the sign conventions") {
    std::string r = report_of(kFrame);
    CHECK(r.find("Caution: These results support, and do not replace, the judgement of a licensed "
                 "engineer. "
                 "Local codes, amendments and the authority having jurisdiction govern.") !=
          std::string::npos);
    CHECK(r.find("Units: force kip, length ft, moment kip*ft, displacement in, rotation rad") !=
          std::string::npos);
    CHECK(r.find("N  axial force, tension positive.") != std::string::npos);
    CHECK(r.find("Rx [kip]") != std::string::npos);
    CHECK_FALSE(std::regex_search(r, std::regex(R"((^|\s)-0\.0*(\s|$))")));  // no negative zero
}

TEST_CASE("two runs give identical bytes") {
    CHECK(report_of(kFrame) == report_of(kFrame));
    CHECK(report_of(kFrame, true) == report_of(kFrame, true));
}

TEST_CASE("a one-line change to a load changes only that case's lines") {
    std::string changed = kFrame;
    changed.replace(changed.find("point 2 kip"), 11, "point 3 kip");
    auto a = lines(report_of(kFrame));
    auto b = lines(report_of(changed));
    REQUIRE(a.size() == b.size());
    std::size_t wind_starts = 0;
    while (a[wind_starts].find("== Load case W") != 0)
        ++wind_starts;
    std::size_t differing = 0;
    for (std::size_t i = 0; i < a.size(); ++i) {
        if (a[i] == b[i])
            continue;
        ++differing;
        CHECK(i > wind_starts);
    }
    CHECK(differing > 0);
    CHECK(differing < 15);
}

TEST_CASE("exact JSON numbers read back to the unrounded values") {
    // A simple beam of 7 m under 1 kN/m, reported in kip*ft: M = wL^2/8 = 6.125 kN*m
    // (statics, common practice) = 6125 / (4.4482216152605 x 304.8) kip*ft, with the exact
    // definitions of the pound-force and the foot (NIST SP 811, Appendix B).
    const char* beam = R"(model "Exact numbers"
report units kip, ft
node A at x = 0 m, y = 0 m
node B at x = 7 m, y = 0 m
material steel E = 200 GPa
section s steel, A = 0.01 m2, I = 1e-4 m4
member AB from A to B section s
support pinned at A
support roller at B
case D dead { uniform 1 kN/m down on AB }
)";
    Analysis a = analyse_text("beam.firn", beam);
    REQUIRE(a.ok);
    ReportOptions exact;
    exact.exact_numbers = true;
    auto j = nlohmann::json::parse(json_report(a.model, a.results, exact));
    auto rounded = nlohmann::json::parse(json_report(a.model, a.results, {}));
    double expected = 6125.0 / (4.4482216152605 * 304.8);
    double m = j["cases"][0]["members"][0]["moment_max"]["value"].get<double>();
    CHECK(std::abs(m - expected) <= 1e-12 * expected);
    CHECK(rounded["cases"][0]["members"][0]["moment_max"]["value"].get<double>() ==
          4.51757);  // 3 + 2 decimals
    CHECK(j["numbers"].get<std::string>().rfind("exact", 0) == 0);
    CHECK_FALSE(rounded.contains("numbers"));
}

TEST_CASE("the JSON report states units and matches the analysis") {
    auto j = nlohmann::json::parse(report_of(kFrame, true));
    CHECK(j["format"] == 1);
    CHECK(j["units"]["force"] == "kip");
    CHECK(j["units"]["moment"] == "kip*ft");
    CHECK(j["cases"][0]["name"] == "D");
    // Cantilever of 10 ft under 1 kip/ft: fixed-end reaction wL = 10 kip up and
    // moment wL^2/2 = 50 kip*ft counterclockwise (statics, common practice).
    CHECK(j["cases"][0]["reactions"][0]["Ry"].get<double>() == Approx(10.0));
    CHECK(j["cases"][0]["reactions"][0]["M"].get<double>() == Approx(50.0));
    CHECK(j["cases"][0]["members"][0]["moment_min"]["value"].get<double>() == Approx(-50.0));
}
