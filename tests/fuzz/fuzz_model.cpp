// libFuzzer target: any bytes as a model must give a report or located
// errors, never a crash, a hang or a sanitizer report; and a model that parses
// must format without the formatter's self-checks failing, to a text that
// gives the same report.
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
#include <string>

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

/// The report options with the snow and arrangement traces.
firn::ReportOptions with_traces(const firn::Analysis& a) {
    firn::ReportOptions options;
    options.derivation = &a.derivation;
    return options;
}

/// The text report of an analysed model (empty when it has errors). The
/// diagnostics are rendered too, but left out, as they name places.
std::string report_of(const firn::Analysis& a) {
    (void)firn::render(a.diagnostics, a.sources);
    return a.ok ? firn::text_report(a.model, a.results, with_traces(a)) : std::string();
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
    if (a.ok)
        (void)firn::json_report(a.model, a.results, with_traces(a));
    std::optional<std::string> layout = formatted(text);
    // Formatting changes only whitespace, so a model that analyses gives the
    // same report after it (messages may move, so only reports are compared).
    if (a.ok && layout && *layout != text) {
        firn::Analysis b = firn::analyse_text("fuzz.firn", *layout, nullptr, options);
        if (!b.ok || report_of(b) != report)
            fail("the formatted model gives a different report", text);
    }
    return 0;
}
