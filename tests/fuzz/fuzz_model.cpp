// libFuzzer target: any bytes as a model must give a report or located
// errors, never a crash, a hang or a sanitizer report.
//   cmake -S . -B build-fuzz -DCMAKE_CXX_COMPILER=clang++ -DFIRN_FUZZ=ON -DFIRN_WERROR=OFF
//   cmake --build build-fuzz --target firn_fuzz
//   build-fuzz/firn_fuzz -dict=tests/fuzz/firn.dict -max_len=2048 CORPUS tests/golden examples
#include <cstddef>
#include <cstdint>
#include <string>

#include "driver.hpp"
#include "report.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    std::string text(reinterpret_cast<const char*>(data), size);
    firn::Analysis a = firn::analyse_text("fuzz.firn", std::move(text));
    std::string shown = firn::render(a.diagnostics, a.sources);
    if (a.ok) {
        shown += firn::text_report(a.model, a.results, {});
        shown += firn::json_report(a.model, a.results, {});
    }
    (void)shown;  // only how the output was made is judged, by the sanitizers
    return 0;
}
