// The error corpus: every tests/errors/NAME.firn is a broken model whose first
// comment lines give, one per line as `# expect: LINE:COL: severity: message`,
// every diagnostic firn reports for it, in the order they are printed. Files
// the models use live in tests/errors/parts/ and are not models themselves.
//
// A diagnostic in the model file is written without its file name; one in
// another file keeps its name relative to tests/errors (`parts/x.firn:1:5: ...`).
// Only first lines are compared: notes ("first defined here") are not.
#include <fmt/format.h>
#include <algorithm>
#include <catch2/catch.hpp>
#include <filesystem>
#include <fstream>
#include <regex>
#include <sstream>
#include <string>
#include <vector>

#include "base/diag.hpp"
#include "driver/driver.hpp"

using namespace firn;
namespace fs = std::filesystem;

namespace {

constexpr std::size_t kMinimumCorpus = 110;
const std::string kExpect = "# expect: ";

/// Normalised, so the names of used files (joined and normalised by the
/// imports stage) start with exactly this text.
const fs::path& corpus_dir() {
    static const fs::path dir = fs::path(FIRN_SOURCE_DIR "/tests/errors").lexically_normal();
    return dir;
}

std::vector<fs::path> corpus_files() {
    std::vector<fs::path> files;
    for (const auto& entry : fs::directory_iterator(corpus_dir())) {
        if (entry.is_regular_file() && entry.path().extension() == ".firn")
            files.push_back(entry.path());
    }
    std::sort(files.begin(), files.end());
    return files;
}

/// The `# expect:` lines of the comment block the file starts with.
std::vector<std::string> expected_lines(const fs::path& file) {
    std::ifstream in(file, std::ios::binary);
    std::vector<std::string> expected;
    std::string line;
    while (std::getline(in, line) && line.starts_with("#")) {
        if (line.starts_with(kExpect))
            expected.push_back(line.substr(kExpect.size()));
    }
    return expected;
}

void replace_all(std::string& text, const std::string& from, const std::string& to) {
    for (std::size_t at = text.find(from); at != std::string::npos;
         at = text.find(from, at + to.size())) {
        text.replace(at, from.size(), to);
    }
}

/// The first lines of the rendered diagnostics, notes left out, with the
/// model's name removed and other paths made relative to the corpus folder
/// (or, outside it, to the source folder), as the `# expect:` lines write them.
std::vector<std::string> reported_lines(const Analysis& analysis, const fs::path& model) {
    static const std::regex note(R"(^(.*:)?\d+:\d+: note: )");
    const std::string own = model.string() + ":";
    const std::string source_dir = fs::path(FIRN_SOURCE_DIR).lexically_normal().string();
    std::istringstream rendered(render(analysis.diagnostics, analysis.sources));
    std::vector<std::string> lines;
    std::string line;
    while (std::getline(rendered, line)) {
        if (line.empty() || line.starts_with(" ") || std::regex_search(line, note))
            continue;  // the quoted source line, the caret under it, a note
        if (line.starts_with(own))
            line.erase(0, own.size());
        replace_all(line, corpus_dir().string() + "/", "");
        replace_all(line, source_dir + "/", "");
        lines.push_back(line);
    }
    return lines;
}

std::string listed(const std::vector<std::string>& lines) {
    std::string out;
    for (const std::string& line : lines)
        out += fmt::format("  {}\n", line);
    return out.empty() ? "  (none)\n" : out;
}

}  // namespace

TEST_CASE("error corpus: there are enough broken models") {
    CHECK(corpus_files().size() >= kMinimumCorpus);
}

TEST_CASE("error corpus: each broken model reports exactly the diagnostics it expects") {
    for (const fs::path& file : corpus_files()) {
        DYNAMIC_SECTION(file.filename().string()) {
            std::vector<std::string> expected = expected_lines(file);
            Analysis analysis = analyse_file(file.string());
            std::vector<std::string> reported = reported_lines(analysis, file);
            INFO("expected:\n" << listed(expected) << "reported:\n" << listed(reported));
            CHECK_FALSE(expected.empty());  // a model that expects nothing tests nothing
            CHECK_FALSE(analysis.ok);
            CHECK(reported == expected);
        }
    }
}
