// firn_bench: phase timings for large generated frames.
//   firn_bench [BAYS STOREYS CASES]      default 100 100 100
//   firn_bench --write FILE [BAYS STOREYS CASES]   write the model and stop
// Prints the wall time of every phase and the peak resident memory.
#include <fmt/format.h>
#include <sys/resource.h>
#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <string>

#include "driver.hpp"
#include "file_io.hpp"
#include "frame_generator.hpp"
#include "report.hpp"

namespace {

double seconds_since(std::chrono::steady_clock::time_point start) {
    return std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
}

double peak_memory_mib() {
    rusage usage{};
    getrusage(RUSAGE_SELF, &usage);
    return static_cast<double>(usage.ru_maxrss) / 1024.0;
}

std::size_t arg(int argc, char** argv, int i, std::size_t fallback) {
    return argc > i ? static_cast<std::size_t>(std::strtoul(argv[i], nullptr, 10)) : fallback;
}

}  // namespace

int main(int argc, char** argv) {
    std::string write_to;
    if (argc > 2 && std::strcmp(argv[1], "--write") == 0) {
        write_to = argv[2];
        argv += 2;
        argc -= 2;
    }
    std::size_t bays = arg(argc, argv, 1, 100), storeys = arg(argc, argv, 2, 100),
                cases = arg(argc, argv, 3, 100);
    std::string text = firn::bench::rectangular_frame(bays, storeys, cases);
    if (!write_to.empty()) {
        std::string error;
        if (!firn::write_file_atomically(write_to, text, error)) {
            std::fprintf(stderr, "%s\n", error.c_str());
            return 2;
        }
        return 0;
    }

    firn::PhaseTimes t;
    auto start = std::chrono::steady_clock::now();
    firn::Analysis a = firn::analyse_text("bench.firn", text, &t);
    double analysis = seconds_since(start);
    if (!a.ok) {
        std::fputs(firn::render(a.diagnostics, a.sources).c_str(), stderr);
        return 2;
    }
    auto report_start = std::chrono::steady_clock::now();
    std::size_t report_bytes = 0;
    firn::write_text_report(a.model, a.results, {}, [&report_bytes](std::string_view piece) {
        report_bytes += piece.size();
    });
    double report_time = seconds_since(report_start);

    std::printf(
        "%s",
        fmt::format("frame {} bays x {} storeys, {} cases: {} nodes, {} members, {} unknowns\n"
                    "model text {:.1f} MB, report {:.1f} MB\n",
                    bays, storeys, cases, a.model.nodes.size(), a.model.members.size(),
                    3 * (a.model.nodes.size() - bays - 1), static_cast<double>(text.size()) / 1e6,
                    static_cast<double>(report_bytes) / 1e6)
            .c_str());
    const std::pair<const char*, double> phases[] = {{"parse", t.parse},
                                                     {"resolve", t.resolve},
                                                     {"loads", t.loads},
                                                     {"assemble", t.assemble},
                                                     {"factor", t.factor},
                                                     {"solve", t.solve},
                                                     {"results", t.results},
                                                     {"model to member results", analysis},
                                                     {"report (text, to memory)", report_time}};
    for (const auto& [name, seconds] : phases)
        std::printf("  %-24s %8.3f s\n", name, seconds);
    std::printf("  %-24s %8.0f MiB\n", "peak memory", peak_memory_mib());
    return 0;
}
