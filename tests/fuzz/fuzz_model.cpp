// libFuzzer target: any bytes as a model must give a report or located
// errors, never a crash, a hang or a sanitizer report; and a model that parses
// must format without the formatter's self-checks failing, to a text that
// gives the same report. A model that analyses also goes through every stage
// after the analysis: the full text report with stations and every section, both
// JSON forms, the drawings and the HTML report, and its baseline written, read
// back and compared with itself (which must show no change).
//   cmake -S . -B build-fuzz -DCMAKE_CXX_COMPILER=clang++ -DFIRN_FUZZ=ON -DFIRN_WERROR=OFF
//   cmake --build build-fuzz --target firn_fuzz
//   tests/fuzz/seed_corpus CORPUS
//   UBSAN_OPTIONS=halt_on_error=1:print_stacktrace=1 build-fuzz/firn_fuzz -entropic=0
//       -dict=tests/fuzz/firn.dict -max_len=4096 -timeout=5 CORPUS
#include <fmt/format.h>
#include <cstddef>
#include <cstdint>
#include <cstdio>
#include <cstdlib>
#include <optional>
#include <regex>
#include <string>

#include "analyse/analyse.hpp"
#include "baseline/baseline.hpp"
#include "draw/draw.hpp"
#include "driver/driver.hpp"
#include "format/format.hpp"
#include "report/report.hpp"

namespace {

/// `use "FILE"` finds nothing: a fuzz input must not read the disk.
firn::ImportOptions no_files() {
    firn::ImportOptions options;
    options.read = [](const std::string& path, std::string&, std::string& error) {
        error = fmt::format("cannot read '{}': No such file or directory", path);
        return false;
    };
    return options;
}

[[noreturn]] void fail(const std::string& why, const std::string& text) {
    std::fprintf(stderr, "%s\n--- input:\n%s\n--- end\n", why.c_str(), text.c_str());
    std::abort();
}

/// The text report of an analysed model with every section (empty when it has
/// errors). The diagnostics are rendered too, but left out, as they name places.
std::string report_of(const firn::Analysis& a) {
    (void)firn::render(a.diagnostics, a.sources);
    return a.ok ? firn::text_report(a.model, a.results, firn::report_options(a)) : std::string();
}

/// Above this many member-cases, the stages after the analysis are left out, so that
/// one input runs in well under a second (generators can make large frames).
constexpr std::size_t kMaxMemberCases = 20000;

/// Every stage after the analysis, on a model that analysed.
void later_stages(const firn::Analysis& a, const std::string& text) {
    if (a.model.members.size() * a.model.cases.size() > kMaxMemberCases)
        return;
    firn::ReportOptions full = firn::report_options(a);
    firn::Stations stations = firn::compute_stations(a.model, a.loads, a.solution, 11);
    full.full = true;
    full.stations = &stations;
    (void)firn::text_report(a.model, a.results, full);
    full.exact_numbers = true;
    (void)firn::json_report(a.model, a.results, full);
    std::vector<std::string> errors;
    firn::DrawOptions draw;
    draw.combinations = {"*"};
    std::vector<firn::Sheet> sheets = firn::draw_sheets(a, draw, errors);
    (void)firn::html_report(a.model, report_of(a), sheets);
    firn::Baseline baseline = firn::make_baseline(a);
    std::string written = firn::baseline_text(baseline), error;
    std::optional<firn::Baseline> read = firn::read_baseline(written, "fuzz.baseline", error);
    if (!read)
        fail("a baseline firn wrote does not read back: " + error, text);
    if (firn::compare_baselines(*read, baseline, firn::default_tolerances()).moved())
        fail("a baseline read back differs from the one written", text);
}

/// A report without the source lines it cites (`line 63: moment of ...` in its
/// expectations): formatting may join blank lines and so move them.
std::string without_lines(const std::string& report) {
    static const std::regex cited("line [0-9]+: ");
    return std::regex_replace(report, cited, "line: ");
}

/// The canonical layout of `text`, or none when it does not parse. A
/// FormatterError is a bug in the formatter, so it is a finding too.
std::optional<std::string> formatted(const std::string& text) {
    firn::SourceMap sources;
    firn::FileId id = sources.add("fuzz.firn", text);
    firn::Diagnostics diagnostics;
    try {
        return firn::format_source(sources, id, diagnostics);
    } catch (const firn::FormatterError& e) {
        fail(e.what(), text);
    }
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    static const firn::ImportOptions options = no_files();
    std::string text(reinterpret_cast<const char*>(data), size);
    firn::Analysis a = firn::analyse_text("fuzz.firn", text, nullptr, options);
    std::string report = report_of(a);
    if (a.ok) {
        (void)firn::json_report(a.model, a.results, firn::report_options(a));
        later_stages(a, text);
    }
    std::optional<std::string> layout = formatted(text);
    // Formatting changes only whitespace, so a model that analyses gives the
    // same report after it (messages may move, so only reports are compared).
    if (a.ok && layout && *layout != text) {
        firn::Analysis b = firn::analyse_text("fuzz.firn", *layout, nullptr, options);
        if (!b.ok || without_lines(report_of(b)) != without_lines(report))
            fail("the formatted model gives a different report", text);
    }
    return 0;
}
