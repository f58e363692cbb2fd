// test_text: runs model text through the pipeline for the language tests.
#pragma once

#include <catch2/catch.hpp>
#include <string>

#include "base/diag.hpp"
#include "driver/driver.hpp"
#include "front/front.hpp"

namespace firn::testing {

/// Every diagnostic the whole pipeline reports for `text` (named "input"), rendered.
inline std::string messages_for(const std::string& text) {
    firn::Analysis a = analyse_text("input", text);
    return render(a.diagnostics, a.sources);
}

/// The first rendered line (file:line:col: error: message) for `text`.
inline std::string first_message(const std::string& text) {
    std::string all = messages_for(text);
    return all.substr(0, all.find('\n'));
}

/// The analysis of `text`, which must have no errors (they are shown if it has).
inline firn::Analysis analysed(const std::string& text) {
    firn::Analysis a = analyse_text("input", text);
    INFO(render(a.diagnostics, a.sources));
    REQUIRE(a.ok);
    return a;
}

/// A small, valid frame that tests extend with one more line.
inline const char* const kBaseModel =
    "model \"test\"\n"
    "report units kip, ft\n"
    "node N1 at x = 0 ft, y = 0 ft\n"
    "node N2 at x = 10 ft, y = 0 ft\n"
    "material steel E = 29000 ksi, density = 490 pcf\n"
    "section beam steel, A = 10 in2, I = 100 in4\n"
    "member B1 from N1 to N2 section beam\n"
    "support fixed at N1\n";

}  // namespace firn::testing
