// The layout's rules over the whole source tree: includes only point down the
// stage table, another stage is reached only through its public header, and each
// third-party library stays in its stage (DEVELOPERS.md, "Layout").
#include <catch2/catch.hpp>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <string>
#include <vector>

#include "testing/include_rules.hpp"

namespace firn::testing {
namespace {

namespace fs = std::filesystem;

std::string read_all(const fs::path& p) {
    std::ifstream in(p, std::ios::binary);
    std::ostringstream s;
    s << in.rdbuf();
    return s.str();
}

/// Every C++ file under src/, as a path relative to src/ ('/' separated), sorted.
std::vector<std::string> source_files() {
    fs::path root = fs::path(FIRN_SOURCE_DIR) / "src";
    std::vector<std::string> out;
    for (const auto& e : fs::recursive_directory_iterator(root)) {
        auto ext = e.path().extension();
        if (e.is_regular_file() && (ext == ".cpp" || ext == ".hpp"))
            out.push_back(fs::relative(e.path(), root).generic_string());
    }
    std::sort(out.begin(), out.end());
    return out;
}

TEST_CASE("every include in src/ follows the stage table", "[layout]") {
    std::vector<std::string> files = source_files();
    REQUIRE(files.size() > 100);
    std::vector<std::string> problems;
    for (const std::string& f : files) {
        auto found = include_violations(f, read_all(fs::path(FIRN_SOURCE_DIR) / "src" / f));
        problems.insert(problems.end(), found.begin(), found.end());
    }
    for (const std::string& p : problems)
        UNSCOPED_INFO(p);
    CHECK(problems.empty());
}

TEST_CASE("every folder of src/ is a stage of the table", "[layout]") {
    std::vector<std::string> seen;
    for (const auto& e : fs::directory_iterator(fs::path(FIRN_SOURCE_DIR) / "src")) {
        REQUIRE(e.is_directory());
        seen.push_back(e.path().filename().string());
    }
    std::sort(seen.begin(), seen.end());
    std::vector<std::string> stages = stage_names();
    std::sort(stages.begin(), stages.end());
    CHECK(seen == stages);
}

TEST_CASE("a wrong include is caught", "[layout]") {
    // A stage reaching up: the analysis may not know the report.
    CHECK(include_violations("analyse/solve.cpp", "#include \"report/report.hpp\"\n") ==
          std::vector<std::string>{
              "analyse/solve.cpp: stage analyse may not use stage report (\"report/report.hpp\")"});
    // Another stage's private header.
    CHECK(include_violations("driver/driver.cpp", "#include \"derive/snow_internal.hpp\"\n") ==
          std::vector<std::string>{"driver/driver.cpp: \"derive/snow_internal.hpp\" is private to "
                                   "stage derive; include \"derive/derive.hpp\""});
    // A library outside its stage, and the grammar outside the front end.
    CHECK(include_violations("report/report.cpp", "  #include <Eigen/Sparse>\n") ==
          std::vector<std::string>{"report/report.cpp: <Eigen/Sparse> belongs to analyse only"});
    CHECK(include_violations("resolve/resolve.cpp", "#include \"grammar/keywords.hpp\"\n") ==
          std::vector<std::string>{
              "resolve/resolve.cpp: only front may include the grammar (grammar/keywords.hpp)"});
    CHECK(include_violations("ir/model.hpp", "#include \"model.hpp\"\n").size() == 1);
    CHECK(include_violations("misc/x.cpp", "").size() == 1);
}

TEST_CASE("what the table allows passes", "[layout]") {
    CHECK(include_violations("derive/snow.cpp",
                             "#include \"derive/snow_internal.hpp\"\n#include \"ir/model.hpp\"\n"
                             "#include \"base/units.hpp\"\n#include <vector>\n")
              .empty());
    CHECK(include_violations("draw/draw.cpp", "#include \"analyse/analyse.hpp\"\n").empty());
    // Tests may use any stage's public header and the helpers in testing/.
    CHECK(include_violations("analyse/solve_test.cpp",
                             "#include \"driver/driver.hpp\"\n#include \"testing/test_text.hpp\"\n")
              .empty());
    CHECK(include_violations("front/parse.cpp", "#include <tao/pegtl.hpp>\n").empty());
}

}  // namespace
}  // namespace firn::testing
