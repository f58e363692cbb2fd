// include_rules: the stage table and the check of one file's #include lines.
#include "testing/include_rules.hpp"

#include <fmt/format.h>
#include <algorithm>
#include <map>
#include <regex>
#include <set>

namespace firn::testing {
namespace {

/// What each stage may include besides itself (ORDER STAGES; DEVELOPERS.md).
const std::map<std::string, std::set<std::string>>& allowed() {
    static const std::map<std::string, std::set<std::string>> table{
        {"base", {}},
        {"ir", {"base"}},
        {"front", {"base", "ir"}},
        {"resolve", {"base", "ir"}},
        {"derive", {"base", "ir"}},
        {"analyse", {"base", "ir"}},
        {"check", {"base", "ir", "analyse"}},
        {"report", {"base", "ir"}},
        {"baseline", {"base", "ir", "report"}},
        {"draw", {"base", "ir", "analyse", "report"}},
        {"format", {"base", "ir", "front"}},
        {"driver", {"base", "ir", "front", "resolve", "derive", "analyse", "check"}},
        {"lsp", {"base", "ir", "front", "resolve", "derive", "check", "format", "report"}},
        {"cli",
         {"base", "ir", "front", "analyse", "check", "report", "baseline", "draw", "format",
          "driver", "lsp"}},
        {"testing",
         {"base", "ir", "front", "resolve", "derive", "analyse", "check", "report", "baseline",
          "draw", "format", "driver", "lsp"}},
    };
    return table;
}

/// A third-party library and the only places that may include it: a stage, or a
/// stage's file (`report/report_json.cpp`). Tests of those places may too.
struct Library {
    const char* prefix;  ///< of the include path: `Eigen/`
    std::set<std::string> places;
};

const std::vector<Library>& libraries() {
    static const std::vector<Library> table{
        {"Eigen/", {"analyse"}},
        {"tao/pegtl", {"front"}},
        {"CLI/", {"cli"}},
        {"nlohmann/",
         {"report/report_json.cpp", "report/report_test.cpp", "testing/editor_support_test.cpp",
          "lsp"}},
    };
    return table;
}

bool is_test(std::string_view path) {
    return path.ends_with("_test.cpp") || path.starts_with("testing/");
}

/// The stage's own public header; base and ir have only public headers.
bool is_public(const std::string& stage, std::string_view file) {
    return stage == "base" || stage == "ir" || stage == "testing" || file == stage + ".hpp";
}

void check_local(std::string_view path, const std::string& own, const std::string& included,
                 std::vector<std::string>& out) {
    auto slash = included.find('/');
    if (slash == std::string::npos) {
        out.push_back(fmt::format("{}: includes \"{}\" without its stage folder", path, included));
        return;
    }
    std::string stage = included.substr(0, slash), file = included.substr(slash + 1);
    if (stage == "grammar") {
        // The language server offers the reserved words as completions.
        bool keywords_for_lsp = own == "lsp" && file == "keywords.hpp";
        if (own != "front" && !keywords_for_lsp && !is_test(path))
            out.push_back(
                fmt::format("{}: only front may include the grammar ({})", path, included));
        return;
    }
    if (allowed().count(stage) == 0) {
        out.push_back(fmt::format("{}: includes \"{}\" from no stage", path, included));
        return;
    }
    if (stage == own)
        return;
    if (stage == "testing" && !is_test(path)) {
        out.push_back(fmt::format("{}: only tests may include \"{}\"", path, included));
        return;
    }
    if (!is_test(path) && allowed().at(own).count(stage) == 0) {
        out.push_back(
            fmt::format("{}: stage {} may not use stage {} (\"{}\")", path, own, stage, included));
        return;
    }
    if (!is_public(stage, file))
        out.push_back(fmt::format("{}: \"{}\" is private to stage {}; include \"{}/{}.hpp\"", path,
                                  included, stage, stage, stage));
}

void check_library(std::string_view path, const std::string& own, const std::string& included,
                   std::vector<std::string>& out) {
    for (const Library& lib : libraries()) {
        if (!included.starts_with(lib.prefix))
            continue;
        bool ok = lib.places.count(own) != 0 || lib.places.count(std::string(path)) != 0;
        if (!ok)
            out.push_back(fmt::format("{}: <{}> belongs to {} only", path, included,
                                      fmt::join(lib.places, ", ")));
    }
}

}  // namespace

const std::vector<std::string>& stage_names() {
    static const std::vector<std::string> names{
        "base",     "ir",   "front",  "resolve", "derive", "analyse", "check",  "report",
        "baseline", "draw", "format", "driver",  "lsp",    "cli",     "testing"};
    return names;
}

std::vector<std::string> include_violations(std::string_view path, std::string_view text) {
    std::vector<std::string> out;
    std::string own(path.substr(0, path.find('/')));
    if (allowed().count(own) == 0) {
        out.push_back(fmt::format("{}: is in no stage folder", path));
        return out;
    }
    static const std::regex line(R"(^[ \t]*#[ \t]*include[ \t]*([<"])([^>"]+)[>"])");
    std::size_t start = 0;
    while (start < text.size()) {
        std::size_t end = std::min(text.find('\n', start), text.size());
        std::string one(text.substr(start, end - start));
        start = end + 1;
        std::smatch m;
        if (!std::regex_search(one, m, line))
            continue;
        if (m[1].str() == "\"")
            check_local(path, own, m[2].str(), out);
        else
            check_library(path, own, m[2].str(), out);
    }
    return out;
}

}  // namespace firn::testing
