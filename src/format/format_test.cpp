// Tests of `firn fmt`'s layout: each rule on a small input with its exact
// output, idempotence on every model of the repository, and that formatting
// never changes a model's results.
#include <catch2/catch.hpp>
#include <filesystem>
#include <fstream>
#include <sstream>

#include "driver/driver.hpp"
#include "format/format.hpp"
#include "report/report.hpp"

using namespace firn;
namespace fs = std::filesystem;

namespace {

std::optional<std::string> try_format(const std::string& text, std::string* errors = nullptr) {
    SourceMap sources;
    Diagnostics d;
    std::optional<std::string> out = format_source(sources, sources.add("input", text), d);
    if (errors != nullptr)
        *errors = render(d, sources);
    return out;
}

/// The formatted text, which must format to itself.
std::string formatted(const std::string& text) {
    std::string errors;
    std::optional<std::string> out = try_format(text, &errors);
    INFO(errors);
    REQUIRE(out);
    CHECK(try_format(*out) == *out);
    return *out;
}

std::string read(const fs::path& p) {
    std::ifstream in(p, std::ios::binary);
    std::stringstream ss;
    ss << in.rdbuf();
    return ss.str();
}

/// The .firn files of a folder of the repository, sorted.
std::vector<fs::path> models_in(const std::string& folder) {
    std::vector<fs::path> found;
    for (const auto& entry : fs::directory_iterator(fs::path(FIRN_SOURCE_DIR) / folder)) {
        if (entry.path().extension() == ".firn")
            found.push_back(entry.path());
    }
    std::sort(found.begin(), found.end());
    return found;
}

}  // namespace

TEST_CASE("fmt: statements joined by semicolons go on lines of their own") {
    CHECK(formatted("let a = 1 ft; let b = 2 ft;let c = 3 ft ;\n") ==
          "let a = 1 ft\nlet b = 2 ft\nlet c = 3 ft\n");
    CHECK(formatted("case D dead { self weight; uniform 1 kip/ft down on B1 }\n") ==
          "case D dead {\n  self weight\n  uniform 1 kip/ft down on B1\n}\n");
}

TEST_CASE("fmt: an empty combine block is kept as a block, a combine without one stays so") {
    // `combine S { }` runs (the block is optional); formatting it once ended in exit 3.
    CHECK(formatted("combine asce7_16.strength {   }\n") == "combine asce7_16.strength {\n}\n");
    CHECK(formatted("combine asce7_16.strength\n") == "combine asce7_16.strength\n");
}

TEST_CASE("fmt: spacing between words, around '=', ',' and operators") {
    CHECK(formatted("node   N1\tat x=0 ft ,y =  12 ft\n") == "node N1 at x = 0 ft, y = 12 ft\n");
    CHECK(formatted("let a = (b+2 ft)*c/ -d - 3ft\n") == "let a = (b + 2 ft) * c / -d - 3 ft\n");
    CHECK(formatted("let a = min( b ,max(c,d) )+abs( - 2 ft)+sqrt(e)\n") ==
          "let a = min(b, max(c, d)) + abs(-2 ft) + sqrt(e)\n");
    CHECK(formatted("grid x A..F spacing  24 ft,30 ft   from 10 ft\n") ==
          "grid x A..F spacing 24 ft, 30 ft from 10 ft\n");
    CHECK(formatted("columns on A , C..E from base to roof section post hinge at A.roof tag "
                    "x1,x2\n") ==
          "columns on A, C..E from base to roof section post hinge at A.roof tag x1, x2\n");
    CHECK(formatted("case L   roof\tlive {\n}\n") == "case L roof live {\n}\n");
}

TEST_CASE("fmt: numbers and units keep their spelling, only spaces inside a unit go") {
    CHECK(formatted("let a = 2.50 kip * ft + 1e3 kip-ft + 3 kip / ft * 1 ft + .5 in4 + 2 in^4\n") ==
          "let a = 2.50 kip*ft + 1e3 kip-ft + 3 kip/ft * 1 ft + .5 in4 + 2 in^4\n");
    CHECK(formatted("report units kip ,ft,displacement   in\n") ==
          "report units kip, ft, displacement in\n");
    CHECK(
        formatted("support spring at N5 x = fixed,y = 120 kip / in,rotation = 2 kip * ft/rad\n") ==
        "support spring at N5 x = fixed, y = 120 kip/in, rotation = 2 kip*ft/rad\n");
}

TEST_CASE("fmt: a power is written a^b, but stands apart after a number with a unit") {
    CHECK(formatted("let a = b ^ 2 + 2 ^ -1 + (c) ^ d ^ 2\n") == "let a = b^2 + 2^-1 + (c)^d^2\n");
    // `2 ft^2` would be the number 2 with the unit ft^2.
    CHECK(formatted("let a = 2 ft ^ 2 + 3 ft^2 + -4 in ^ 2\n") ==
          "let a = 2 ft ^ 2 + 3 ft^2 + -4 in ^ 2\n");
}

TEST_CASE("fmt: a line break that keeps a constant named like a unit apart is kept") {
    // On one line `2 kip * ft` would be the number 2 with the unit kip*ft.
    CHECK(formatted("let a = 2 kip *\n ft\nlet b = 2 kip * ft_x\n") ==
          "let a = 2 kip *\n    ft\nlet b = 2 kip * ft_x\n");
}

TEST_CASE("fmt: titles, paths and names keep their exact text") {
    CHECK(formatted("model   \"A \\\"quoted\\\"  title\"\nuse outside   \"../a b.firn\"\n"
                    "use materials\ngroup roof=eave.* ,R1,*.base.*\n") ==
          "model \"A \\\"quoted\\\"  title\"\nuse outside \"../a b.firn\"\nuse materials\n"
          "group roof = eave.*, R1, *.base.*\n");
}

TEST_CASE("fmt: keywords the tree does not tell apart are kept as written") {
    CHECK(formatted("support roller at A\nsupport roller  free x at B\n") ==
          "support roller at A\nsupport roller free x at B\n");
    CHECK(formatted("case M other {\n moment 5 kip*ft at N1\n moment 5 kip*ft  counterclockwise at "
                    "N1\n moment 1 kN*m clockwise on B1 at 3 ft\n}\n") ==
          "case M other {\n  moment 5 kip*ft at N1\n  moment 5 kip*ft counterclockwise at N1\n"
          "  moment 1 kN*m clockwise on B1 at 3 ft\n}\n");
}

TEST_CASE("fmt: loads are indented two spaces and '}' stands alone at column 1") {
    CHECK(
        formatted("case D dead {\nself weight\n        uniform 1 kip/ft down on B1 from 2 ft to 4 "
                  "ft\n    }\n") ==
        "case D dead {\n  self weight\n  uniform 1 kip/ft down on B1 from 2 ft to 4 ft\n}\n");
    CHECK(formatted("case E other {}\ncase F other {\n\n}\n") ==
          "case E other {\n}\ncase F other {\n}\n");
    CHECK(formatted(
              "case Q live { linear 0 kN/m to 6 kN/m down projected on R from 2 m to 8 m }\n") ==
          "case Q live {\n  linear 0 kN/m to 6 kN/m down projected on R from 2 m to 8 m\n}\n");
}

TEST_CASE("fmt: blank lines collapse to one, none at the start, after '{' or before '}'") {
    CHECK(
        formatted("\n\n\nlet a = 1\n\n\n\nlet b = 2\nlet c = 3\n\n# note\n\n\n\nlet d = 4\n\n\n") ==
        "let a = 1\n\nlet b = 2\nlet c = 3\n\n# note\n\nlet d = 4\n");
    CHECK(formatted("case D dead {\n\n\n  self weight\n\n\n  self weight\n\n}\n") ==
          "case D dead {\n  self weight\n\n  self weight\n}\n");
}

TEST_CASE("fmt: a byte order mark goes, CRLF becomes LF, the file ends in one newline") {
    CHECK(formatted("\xEF\xBB\xBF# head\r\nlet a = 1 ft\r\n\r\n\r\nlet b = 2\r\n") ==
          "# head\nlet a = 1 ft\n\nlet b = 2\n");
    CHECK(formatted("let a = 1") == "let a = 1\n");
    CHECK(formatted("") == "");
    CHECK(formatted("\n \n\t\n") == "");
}

TEST_CASE("fmt: comments keep their place, text and order") {
    CHECK(formatted("# top   \n\nlet a = 1   # trailing  \n  # own, indented\nlet b = 2\n"
                    "case D dead {   # after the brace\n# before a load\n self weight # on it\n"
                    "     # last in the block\n} # after the block\n# end of file\n") ==
          "# top\n\nlet a = 1  # trailing\n# own, indented\nlet b = 2\n"
          "case D dead {  # after the brace\n  # before a load\n  self weight  # on it\n"
          "  # last in the block\n}  # after the block\n# end of file\n");
    CHECK(formatted("let a = 1; # after the ';'\nlet b = 1; let c = 2 # on the second\n") ==
          "let a = 1  # after the ';'\nlet b = 1\nlet c = 2  # on the second\n");
}

TEST_CASE("fmt: trailing comments on consecutive lines line up two after the longest code") {
    CHECK(formatted("let a = 1 # one\nlet bbbbbb = 22 # two\nlet c = 3\nlet d = 4   # alone\n") ==
          "let a = 1        # one\nlet bbbbbb = 22  # two\nlet c = 3\nlet d = 4  # alone\n");
    // A blank line or an own-line comment ends a run too.
    CHECK(formatted("let a = 1 # one\n\nlet bbbbbb = 22 # two\n# own\nlet c = 333 # three\n") ==
          "let a = 1  # one\n\nlet bbbbbb = 22  # two\n# own\nlet c = 333  # three\n");
}

TEST_CASE("fmt: a run whose aligned comments would start past column 100 is not aligned") {
    std::string longest = "let " + std::string(90, 'n') + " = 1";  // 98 columns
    CHECK(formatted(longest + " # long\nlet a = 1 # short\n") ==
          longest + "  # long\nlet a = 1  # short\n");
    std::string fits = "let " + std::string(89, 'n') + " = 1";  // 97: comments at column 100
    CHECK(formatted(fits + " # long\nlet a = 1 # short\n") ==
          fits + "  # long\nlet a = 1" + std::string(90, ' ') + "# short\n");
}

TEST_CASE("fmt: a comment inside a statement keeps its line break") {
    CHECK(formatted("grid x A = 0 ft, # west wall\n  B = 24 ft,\n\n  # the middle line\n"
                    "  C = 48 ft\n") ==
          "grid x A = 0 ft,  # west wall\n       B = 24 ft,\n       # the middle line\n"
          "       C = 48 ft\n");
    CHECK(formatted("section post steel, # a tube\n A = 4.4 in2, I = 7.2 in4\n") ==
          "section post steel,  # a tube\n    A = 4.4 in2, I = 7.2 in4\n");
    CHECK(formatted("let a = min(1 ft, # the first\n 2 ft) + ( # open\n 3 ft)\n") ==
          "let a = min(1 ft,  # the first\n    2 ft) + (      # open\n    3 ft)\n");
    CHECK(formatted("case D dead {\n  uniform 1 kip/ft down on B1, # one\n B2\n}\n") ==
          "case D dead {\n  uniform 1 kip/ft down on B1,  # one\n" + std::string(27, ' ') +
              "B2\n}\n");
}

TEST_CASE("fmt: an author's line breaks inside a list are reflowed") {
    CHECK(formatted("support fixed at A0,\n   B0,\n        C0\n") ==
          "support fixed at A0, B0, C0\n");
    CHECK(formatted("let a = 1 ft +\n  2 ft *\n (3 +\n 4)\n") == "let a = 1 ft + 2 ft * (3 + 4)\n");
}

TEST_CASE("fmt: a list longer than the line breaks after commas, aligned under its first item") {
    std::string grid =
        "grid x A = 0 ft, B = 24 ft, C = 48 ft, D = 72 ft, E = 96 ft, F = 120 ft, "
        "G = 144 ft, H = 168 ft, I = 192 ft, J = 216 ft\n";
    CHECK(formatted(grid) ==
          "grid x A = 0 ft, B = 24 ft, C = 48 ft, D = 72 ft, E = 96 ft, F = 120 ft, G = 144 ft, "
          "H = 168 ft,\n       I = 192 ft, J = 216 ft\n");
    std::string support =
        "support fixed at Node_001, Node_002, Node_003, Node_004, Node_005, "
        "Node_006, Node_007, Node_008, Node_009, Node_010\n";
    CHECK(formatted(support) ==
          "support fixed at Node_001, Node_002, Node_003, Node_004, Node_005, Node_006, Node_007, "
          "Node_008,\n                 Node_009, Node_010\n");
    std::string load =
        "case D dead { uniform 15 psf * 20 ft down projected on Member_001, "
        "Member_002, Member_003, Member_004, Member_005, Member_006 from 2 ft to "
        "4 ft }\n";
    CHECK(formatted(load) ==
          "case D dead {\n  uniform 15 psf * 20 ft down projected on Member_001, Member_002, "
          "Member_003, Member_004,\n                                           Member_005, "
          "Member_006 from 2 ft to 4 ft\n}\n");
    // A line of exactly 100 columns is not broken.
    std::string hundred = "support fixed at " + std::string(83, 'N') + "\n";
    CHECK(formatted(hundred) == hundred);
}

TEST_CASE("fmt: a section's properties continue under the shape word") {
    CHECK(formatted("section big_long_section_name steel, ishape d = 16 in, bf = 7 in, tf = 0.5 "
                    "in, tw = 0.3 in, extra = 12 in\n") ==
          "section big_long_section_name steel, ishape d = 16 in, bf = 7 in, tf = 0.5 in, tw = 0.3 "
          "in,\n                                     extra = 12 in\n");
}

TEST_CASE("fmt: a snow block has its header, then one setting a line indented two") {
    CHECK(formatted("snow   S{\nstandard=asce7_16\n      pg = 40   psf\n  exposure =partially\n"
                    "    }\n") ==
          "snow S {\n  standard = asce7_16\n  pg = 40 psf\n  exposure = partially\n}\n");
    CHECK(formatted("snow S { pg = 40 psf }\n") == "snow S {\n  pg = 40 psf\n}\n");
}

TEST_CASE("fmt: a setting's reason follows its value, the string exactly as written") {
    CHECK(formatted("snow S {\n  Ct = 1.1   because  \"kept just above  freezing\"\n"
                    "  Is = 1.2 because \"a \\\"shelter\\\"\"\n  terrain = C\n}\n") ==
          "snow S {\n  Ct = 1.1 because \"kept just above  freezing\"\n"
          "  Is = 1.2 because \"a \\\"shelter\\\"\"\n  terrain = C\n}\n");
}

TEST_CASE("fmt: a roof block's header names its members") {
    CHECK(formatted("roof  main on eave.* ,gable.*,\n  R1 {\ntributary = 20 ft\n surface=slippery\n"
                    "}\n") ==
          "roof main on eave.*, gable.*, R1 {\n  tributary = 20 ft\n  surface = slippery\n}\n");
}

TEST_CASE("fmt: settings joined by semicolons go on lines of their own") {
    CHECK(formatted("snow S { terrain = C; exposure = partially ;pg = 40 psf; }\n") ==
          "snow S {\n  terrain = C\n  exposure = partially\n  pg = 40 psf\n}\n");
    CHECK(formatted("roof R on B1 { tributary = 20 ft;surface = slippery }\n") ==
          "roof R on B1 {\n  tributary = 20 ft\n  surface = slippery\n}\n");
}

TEST_CASE("fmt: an empty snow or roof block is its header and '}'") {
    CHECK(formatted("snow S {}\nroof R on B1 {\n\n}\nsnow T {    }\n") ==
          "snow S {\n}\nroof R on B1 {\n}\nsnow T {\n}\n");
}

TEST_CASE("fmt: comments in a snow or roof block keep their place and line up") {
    CHECK(formatted("# site\nsnow S {   # after the brace\n# before a setting\n"
                    "  pg = 40 psf # ground\n  Ct = 1.1 because \"owner\"    # override\n\n\n"
                    "  terrain = C\n     # last in the block\n} # after the block\n") ==
          "# site\nsnow S {  # after the brace\n  # before a setting\n"
          "  pg = 40 psf               # ground\n  Ct = 1.1 because \"owner\"  # override\n\n"
          "  terrain = C\n  # last in the block\n}  # after the block\n");
    CHECK(formatted("snow S {\n  pg = 30 psf + # base\n 10 psf\n}\n") ==
          "snow S {\n  pg = 30 psf +  # base\n      10 psf\n}\n");
    CHECK(formatted("roof R on B1, # the eave\n B2 { # brace\n tributary = 20 ft\n}\n") ==
          "roof R on B1,   # the eave\n          B2 {  # brace\n  tributary = 20 ft\n}\n");
}

TEST_CASE("fmt: a roof's member list breaks after commas at 100 columns, under its first item") {
    std::string roof =
        "roof long_roof_name on Member_001, Member_002, Member_003, Member_004, "
        "Member_005, Member_006, Member_007, Member_008 { tributary = 20 ft }\n";
    CHECK(formatted(roof) ==
          "roof long_roof_name on Member_001, Member_002, Member_003, Member_004, Member_005, "
          "Member_006,\n                       Member_007, Member_008 {\n  tributary = 20 ft\n}\n");
    // The '{' goes with the last member: a line of exactly 100 columns is not broken.
    std::string hundred = "roof R on " + std::string(88, 'M') + " {\n}\n";
    CHECK(formatted(hundred) == hundred);
    CHECK(formatted("roof R on " + std::string(89, 'M') + ", B2 {}\n") ==
          "roof R on " + std::string(89, 'M') + ",\n          B2 {\n}\n");
}

TEST_CASE("fmt: an amendment is one line with its reason") {
    CHECK(formatted("amend   asce7_16.pm.cap=30 psf   because \"county  amendment 4\"  # why\n") ==
          "amend asce7_16.pm.cap = 30 psf because \"county  amendment 4\"  # why\n");
    CHECK(formatted("amend a.b = 2 * (c + 1 psf) because \"x\";amend a.c = 1 because \"y\"\n") ==
          "amend a.b = 2 * (c + 1 psf) because \"x\"\namend a.c = 1 because \"y\"\n");
    // Nothing in it is a list: a long one stays on its line.
    std::string long_amend = "amend a.b = 1 psf because \"" + std::string(90, 'r') + "\"\n";
    CHECK(formatted(long_amend) == long_amend);
}

TEST_CASE("fmt: a file with syntax errors is refused with its errors") {
    std::string errors;
    CHECK_FALSE(try_format("model \"x\"\nnod N1 at x = 0 ft\n", &errors));
    CHECK(errors.find("input:2:1: error: expected a statement") == 0);
}

TEST_CASE("fmt: unknown names still format, nothing is resolved or read") {
    CHECK(formatted("use \"no/such/file.firn\"\nmember M from nowhere to N2 section none\n") ==
          "use \"no/such/file.firn\"\nmember M from nowhere to N2 section none\n");
}

TEST_CASE("fmt: formatting is idempotent on every model of the repository") {
    std::vector<fs::path> files;
    for (const char* folder : {"examples", "stdlib", "tests/golden", "tests/cli", "tests/fmt"}) {
        for (const fs::path& p : models_in(folder))
            files.push_back(p);
    }
    REQUIRE(files.size() >= 8);
    for (const fs::path& p : files) {
        INFO(p.filename().string());
        std::optional<std::string> once = try_format(read(p));
        if (!once) {
            // Only the cases of syntax errors may fail to parse.
            CHECK(p.filename().string().find("syntax") != std::string::npos);
            continue;
        }
        CHECK(try_format(*once) == once);
    }
}

TEST_CASE("fmt: every example and stdlib file is already formatted") {
    for (const char* folder : {"examples", "stdlib"}) {
        for (const fs::path& p : models_in(folder)) {
            INFO(folder << "/" << p.filename().string()
                        << " is not formatted: run `firn fmt` on it");
            std::string text = read(p);
            bool is_formatted = try_format(text) == text;
            CHECK(is_formatted);
        }
    }
}

TEST_CASE("fmt: formatting does not change the results of any example") {
    for (const fs::path& p : models_in("examples")) {
        INFO(p.filename().string());
        std::string original = read(p);
        std::optional<std::string> text = try_format(original);
        REQUIRE(text);
        Analysis before = analyse_text(p.string(), original);
        Analysis after = analyse_text(p.string(), *text);
        INFO(render(before.diagnostics, before.sources));
        REQUIRE(before.ok);
        REQUIRE(after.ok);
        CHECK(text_report(before.model, before.results, {}) ==
              text_report(after.model, after.results, {}));
    }
}

TEST_CASE("fmt: a text value keeps its quotes and escapes as written") {
    CHECK(formatted("let  site.edition=\"Rules \\\"B\\\", 2024\"\n") ==
          "let site.edition = \"Rules \\\"B\\\", 2024\"\n");
}
