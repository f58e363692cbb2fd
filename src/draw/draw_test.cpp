// Tests of the drawings: well-formed, deterministic, and agreeing with the
// text report; the values checked against outside sources name them (keys as
// in tests/SOURCES.md).
#include <catch2/catch.hpp>
#include <regex>
#include <string>

#include "base/file_io.hpp"
#include "base/number_format.hpp"
#include "draw/draw.hpp"
#include "draw/draw_internal.hpp"
#include "driver/driver.hpp"
#include "report/report.hpp"
#include "testing/svg_xml_check.hpp"

namespace firn {
namespace {

using testing::XmlChecker;

Analysis analyse_example(const std::string& name) {
    std::string path = std::string(FIRN_SOURCE_DIR) + "/examples/" + name;
    std::string text, error;
    REQUIRE(read_file(path, text, error));
    Analysis a = analyse_text("examples/" + name, text);
    REQUIRE(a.ok);
    return a;
}

Analysis analyse(const std::string& text) {
    Analysis a = analyse_text("input", text);
    INFO(render(a.diagnostics, a.sources));
    REQUIRE(a.ok);
    return a;
}

std::vector<Sheet> sheets_of(const Analysis& a, const DrawOptions& options = {}) {
    std::vector<std::string> errors;
    std::vector<Sheet> sheets = draw_sheets(a, options, errors);
    REQUIRE(errors.empty());
    return sheets;
}

const Sheet& sheet_named(const std::vector<Sheet>& sheets, const std::string& path) {
    for (const Sheet& s : sheets) {
        if (s.path == path)
            return s;
    }
    FAIL("no sheet " << path);
    return sheets.front();
}

std::string report_text(const Analysis& a) {
    return text_report(a.model, a.results, report_options(a));
}

/// The text of the label for `quantity` of `member`, or "" if there is none.
std::string label(const std::string& svg, const std::string& member, const std::string& quantity) {
    std::string key = "data-member=\"" + member + "\" data-quantity=\"" + quantity + "\">";
    std::size_t at = svg.find(key);
    if (at == std::string::npos)
        return "";
    at += key.size();
    return svg.substr(at, svg.find('<', at) - at);
}

/// The x attribute of the text element holding `key`.
double label_x(const std::string& svg, const std::string& key) {
    std::size_t at = svg.rfind("<text x=\"", svg.find(key));
    REQUIRE(at != std::string::npos);
    return std::stod(svg.substr(at + 9));
}

/// x1, y1, x2, y2 of the first member line of a sheet.
std::array<double, 4> first_member_line(const std::string& svg) {
    std::smatch m;
    std::regex line(
        "<line x1=\"([-0-9.]+)\" y1=\"([-0-9.]+)\" x2=\"([-0-9.]+)\" y2=\"([-0-9.]+)\" "
        "class=\"member");
    REQUIRE(std::regex_search(svg, m, line));
    return {std::stod(m[1]), std::stod(m[2]), std::stod(m[3]), std::stod(m[4])};
}

constexpr const char* kSimpleBeam =
    "model \"simple beam\"\n"
    "report units kN, m\n"
    "node N1 at x = 0 m, y = 0 m\n"
    "node N2 at x = 10 m, y = 0 m\n"
    "material steel E = 200000 MPa, density = 0 pcf\n"
    "section beam steel, A = 0.01 m2, I = 0.0001 m4\n"
    "member B1 from N1 to N2 section beam\n"
    "support pinned at N1\n"
    "support roller at N2\n"
    "case D dead { uniform 12 kN/m down on B1 }\n";

TEST_CASE("every sheet and the HTML report are well-formed XML", "[draw]") {
    for (const char* example : {"shelter.firn", "gable_hall.firn"}) {
        Analysis a = analyse_example(example);
        DrawOptions options;
        options.cases = {"D", "S.*"};
        std::vector<Sheet> sheets = sheets_of(a, options);
        REQUIRE(sheets.size() > 4);
        for (const Sheet& s : sheets) {
            INFO(example << " " << s.path);
            CHECK(XmlChecker::check(s.svg).empty());
            CHECK(XmlChecker::check(s.svg) == "");
        }
        std::string html = html_report(a.model, report_text(a), sheets);
        CHECK(XmlChecker::check(html) == "");
        CHECK(html.find("<script") == std::string::npos);  // nothing to run, nothing to fetch
        CHECK(html.find("http://") == html.find("http://www.w3.org/2000/svg"));
    }
}

TEST_CASE("every sheet and the HTML report carry the caution", "[draw]") {
    Analysis a = analyse_example("shelter.firn");
    std::vector<Sheet> sheets = sheets_of(a);
    for (const Sheet& s : sheets) {
        INFO(s.path);
        CHECK(s.svg.find("support, and do not replace, the judgement of a licensed engineer") !=
              std::string::npos);
        CHECK(s.svg.find("authority having jurisdiction govern") != std::string::npos);
    }
    std::string html = html_report(a.model, report_text(a), sheets);
    CHECK(html.find(svg::escape(kCaution)) != std::string::npos);
}

TEST_CASE("drawings are the same bytes every time and never print -0", "[draw]") {
    Analysis a = analyse_example("gable_hall.firn");
    Analysis b = analyse_example("gable_hall.firn");
    std::vector<Sheet> first = sheets_of(a), second = sheets_of(b);
    REQUIRE(first.size() == second.size());
    std::regex number("-[0-9]+(\\.[0-9]+)?");
    for (std::size_t i = 0; i < first.size(); ++i) {
        INFO(first[i].path);
        CHECK(first[i].path == second[i].path);
        CHECK(first[i].svg == second[i].svg);
        for (auto it = std::sregex_iterator(first[i].svg.begin(), first[i].svg.end(), number);
             it != std::sregex_iterator(); ++it) {
            CHECK(std::stod(it->str()) != 0.0);
        }
        CHECK(first[i].svg.find("/work/") == std::string::npos);  // no absolute paths
    }
}

TEST_CASE("the envelope diagrams label exactly the report's envelope values", "[draw]") {
    // Consistency with the text report (the same numbers twice), not a check of
    // the values themselves: those are tested in combine_test.cpp.
    Analysis a = analyse_example("shelter.firn");
    std::vector<Sheet> sheets = sheets_of(a);
    std::string report = report_text(a);
    std::size_t section = report.find("== Envelopes of asce7_16.strength ==");
    REQUIRE(section != std::string::npos);
    std::size_t next = report.find("== Envelopes of asce7_16.allowable");
    REQUIRE(next != std::string::npos);
    std::string envelope = report.substr(section, next - section);
    const std::string& moment =
        sheet_named(sheets, "diagrams/envelope-asce7_16.strength-moment.svg").svg;
    const std::string& shear =
        sheet_named(sheets, "diagrams/envelope-asce7_16.strength-shear.svg").svg;
    const std::string& axial =
        sheet_named(sheets, "diagrams/envelope-asce7_16.strength-axial.svg").svg;
    std::regex row("  (\\S+)? +(M\\+|M-|V\\+|V-|N\\+|N-)[^\\]]*\\] +(-?[0-9.]+) ");
    std::string member;
    int compared = 0;
    for (auto it = std::sregex_iterator(envelope.begin(), envelope.end(), row);
         it != std::sregex_iterator(); ++it) {
        if ((*it)[1].matched)
            member = (*it)[1];
        std::string quantity = (*it)[2], value = (*it)[3];
        const std::string& svg = quantity[0] == 'M' ? moment : quantity[0] == 'V' ? shear : axial;
        INFO(member << " " << quantity);
        if (std::stod(value) == 0.0) {
            CHECK(label(svg, member, quantity).empty());
        } else {
            CHECK(label(svg, member, quantity) == value);
            ++compared;
        }
    }
    CHECK(compared >= 30);                               // 7 members, most of their six values
    CHECK(label(moment, "eave.A.B", "M+") == "57.626");  // as the golden report prints it
}

TEST_CASE("a simply supported beam's moment, wL^2/8, is labelled at midspan on the tension side",
          "[draw]") {
    // M_mid = wL^2/8 = 12 kN/m x (10 m)^2 / 8 = 150 kN*m; V_end = wL/2 = 60 kN
    // (simply supported, UDL: [D], AISC Table 3-23 case 1, from memory).
    Analysis a = analyse(kSimpleBeam);
    DrawOptions options;
    options.loads = false;
    std::vector<Sheet> sheets = sheets_of(a, options);  // no combinations: each case's diagrams
    const std::string& moment = sheet_named(sheets, "diagrams/case-D-moment.svg").svg;
    CHECK(label(moment, "B1", "M+") == "150.000");
    CHECK(label(moment, "B1", "M-").empty());
    auto [x1, y1, x2, y2] = first_member_line(moment);
    CHECK(label_x(moment, "data-quantity=\"M+\"") == Approx(0.5 * (x1 + x2)).margin(0.01));
    // Sagging (local -y face in tension) hangs below the beam: larger y on the sheet.
    std::smatch m;
    REQUIRE(std::regex_search(moment, m, std::regex("<polygon points=\"([^\"]*)\" class=\"pos\"")));
    double lowest = y1;
    std::string points = m[1];
    std::regex pair(",([-0-9.]+)");
    for (auto it = std::sregex_iterator(points.begin(), points.end(), pair);
         it != std::sregex_iterator(); ++it)
        lowest = std::max(lowest, std::stod((*it)[1]));
    CHECK(lowest > y1 + 40.0);
    CHECK(moment.find("Moment is drawn on the tension side") != std::string::npos);
    const std::string& shear = sheet_named(sheets, "diagrams/case-D-shear.svg").svg;
    std::string v = label(shear, "B1", "V");
    CHECK((v == "60.000" || v == "-60.000"));
    // delta_mid = 5 w L^4 / (384 E I) = 5 x 12 kN/m x (10 m)^4 / (384 x 200000 MPa x 1e-4 m^4)
    // = 78.125 mm, downward (simply supported, UDL: [D], AISC Table 3-23 case 1, from memory).
    const std::string& shape = sheet_named(sheets, "diagrams/case-D-deflected.svg").svg;
    std::smatch d;
    REQUIRE(std::regex_search(shape, d, std::regex(">deflection (-?[0-9.]+) mm \\(B1\\)<")));
    CHECK(std::stod(d[1]) == Approx(-78.125).margin(0.01));
}

TEST_CASE("a cantilever's deflected shape labels the tip deflection PL^3/3EI", "[draw]") {
    // delta = P L^3 / (3 E I) = 10 kN x (4 m)^3 / (3 x 200000 MPa x 1e-4 m^4) = 10.667 mm
    // (cantilever, tip load: [D]).
    Analysis a = analyse(
        "model \"cantilever\"\n"
        "report units kN, m\n"
        "node N1 at x = 0 m, y = 0 m\n"
        "node N2 at x = 4 m, y = 0 m\n"
        "material steel E = 200000 MPa, density = 0 pcf\n"
        "section beam steel, A = 0.01 m2, I = 0.0001 m4\n"
        "member B1 from N1 to N2 section beam\n"
        "support fixed at N1\n"
        "case P other { point 10 kN down at N2 }\n");
    std::vector<Sheet> sheets = sheets_of(a);
    const std::string& shape = sheet_named(sheets, "diagrams/case-P-deflected.svg").svg;
    CHECK(XmlChecker::check(shape) == "");
    std::smatch m;
    REQUIRE(std::regex_search(shape, m, std::regex(">dy (-?[0-9.]+) mm at N2<")));
    CHECK(std::stod(m[1]) == Approx(-10.6667).margin(0.01));
    CHECK(shape.find("Displacements are drawn ") != std::string::npos);
    CHECK(shape.find(" times their size") != std::string::npos);
    // The tip moment is -PL = -40 kN*m at the fixed end (cantilever, tip load: [D]).
    CHECK(label(sheet_named(sheets, "diagrams/case-P-moment.svg").svg, "B1", "M-") == "-40.000");
}

TEST_CASE("a loads sheet shows every kind of load with its value", "[draw]") {
    Analysis a = analyse(
        "model \"loads\"\n"
        "report units kN, m\n"
        "node N1 at x = 0 m, y = 0 m\n"
        "node N2 at x = 6 m, y = 0 m\n"
        "node N3 at x = 6 m, y = 4 m\n"
        "material steel E = 200000 MPa, density = 78.5 kN/m3\n"
        "section beam steel, A = 0.01 m2, I = 0.0001 m4\n"
        "member B1 from N1 to N2 section beam\n"
        "member C1 from N2 to N3 section beam\n"
        "support fixed at N1\n"
        "support pinned at N3\n"
        "case H other {\n"
        "  uniform 5 kN/m down on B1 from 1 m to 4 m\n"
        "  linear 2 kN/m to 8 kN/m x on C1\n"
        "  point 7 kN down on B1 at 5 m\n"
        "  moment 3 kN*m clockwise on B1 at 2 m\n"
        "  point 4 kN x at N2\n"
        "  self weight\n"
        "}\n");
    std::vector<Sheet> sheets = sheets_of(a);
    const std::string& svg = sheet_named(sheets, "loads/H.svg").svg;
    CHECK(XmlChecker::check(svg) == "");
    auto shown_in = [&a](double si, const DisplayUnit& u) {
        std::string out;
        append_fixed(out, u.from_si(si), u.decimals);
        return out + " " + u.name;
    };
    const DisplayUnits& u = a.model.units;
    auto has_text = [&svg](const std::string& text) {
        std::string key(">");
        key += text;
        key += '<';
        return svg.find(key) != std::string::npos;
    };
    std::string from = shown_in(2e3, u.force_per_length);
    from.resize(from.find(' '));
    CHECK(has_text(shown_in(5e3, u.force_per_length)));
    CHECK(has_text(from + " to " + shown_in(8e3, u.force_per_length)));
    CHECK(has_text(shown_in(7e3, u.force)));
    CHECK(has_text(shown_in(4e3, u.force)));
    CHECK(has_text(shown_in(-3e3, u.moment)));
    // Self weight = unit weight x area = 78.5 kN/m^3 x 0.01 m^2 = 0.785 kN/m (statics).
    CHECK(has_text("self weight " + shown_in(785.0, u.force_per_length)));
    CHECK(svg.find("One scale on every loads sheet") != std::string::npos);
}

TEST_CASE("the frame sheet names nodes, members and grid lines and draws each support kind",
          "[draw]") {
    Analysis a = analyse_example("gable_hall.firn");
    std::vector<Sheet> sheets = sheets_of(a);
    const std::string& svg = sheet_named(sheets, "frame.svg").svg;
    for (const char* name : {">W0<", ">RW<", ">CEU<", ">west<", ">eave<", ">18.000 ft<"})
        CHECK(svg.find(name) != std::string::npos);
    CHECK(svg.find("pinned support") != std::string::npos);
    CHECK(svg.find("class=\"hinge\"") != std::string::npos);
    CHECK(svg.find("hinge: moment released") != std::string::npos);
}

TEST_CASE("cases and combinations are chosen by name or pattern; unknown names are errors",
          "[draw]") {
    Analysis a = analyse_example("shelter.firn");
    DrawOptions options;
    options.loads = false;
    options.envelopes = false;
    options.cases = {"S.partial.*.A_B"};
    options.combinations = {"asce7_16.strength.2/*"};
    options.diagrams = {Diagram::moment};
    std::vector<Sheet> sheets = sheets_of(a, options);
    std::vector<std::string> paths;
    for (const Sheet& s : sheets)
        paths.push_back(s.path);
    CHECK(paths.front() == "frame.svg");
    CHECK(std::count(paths.begin(), paths.end(),
                     "diagrams/case-S.partial.main.case1.A_B-moment.svg") == 1);
    CHECK(std::count(paths.begin(), paths.end(),
                     "diagrams/case-S.partial.main.case2.A_B-moment.svg") == 1);
    CHECK(std::count_if(paths.begin(), paths.end(), [](const std::string& p) {
              return p.rfind("diagrams/combination-asce7_16.strength.2_", 0) == 0;
          }) >= 1);

    options.cases = {"Q", "D"};
    std::vector<std::string> errors;
    CHECK(draw_sheets(a, options, errors).empty());
    CHECK(errors == std::vector<std::string>{"no load case is named 'Q'"});
}

TEST_CASE("sheet file stems", "[draw]") {
    CHECK(draw::file_stem("asce7_16.strength.3/4") == "asce7_16.strength.3_4");
    CHECK(draw::file_stem("..") == "_..");
}

TEST_CASE("draw: sets solved to second order are not drawn with first-order curves", "[draw]") {
    // The diagrams come from first-order member functions; a second-order set
    // gets no envelope sheets, and asking for its combinations is an error.
    std::string path = std::string(FIRN_SOURCE_DIR) + "/tests/golden/second_order_shelter.firn";
    std::string text, error;
    REQUIRE(read_file(path, text, error));
    Analysis a = analyse(text);
    for (const Sheet& s : sheets_of(a))
        CHECK(s.path.rfind("diagrams/", 0) != 0);
    DrawOptions options;
    options.combinations = {"*"};
    std::vector<std::string> errors;
    CHECK(draw_sheets(a, options, errors).empty());
    CHECK(errors == std::vector<std::string>{"combinations solved to second order have no "
                                             "diagrams yet; their values are in the report"});
}

}  // namespace
}  // namespace firn
