// firn_bench: phase timings for large generated frames.
//   firn_bench [BAYS STOREYS CASES]      default 100 100 100
//   firn_bench --write FILE [BAYS STOREYS CASES]   write the model and stop
// Runs the frame twice: written with generators (a grid run, `columns`,
// `beams`, patterns) and written out one node and member per line. Prints the
// wall time of every phase of each and the peak resident memory.
#include <fmt/format.h>
#include <sys/resource.h>
#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <string>
#include <utility>
#include <vector>

#include "analyse/analyse.hpp"
#include "base/file_io.hpp"
#include "driver/driver.hpp"
#include "frame_generator.hpp"
#include "report/report.hpp"

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

/// Every case alone, then 1.2 x case 0 + 1.6 x each other case: about twice
/// as many combinations as cases, as a strength design set would have.
std::vector<firn::Combination> bench_combinations(std::size_t cases) {
    using firn::make_id;
    std::vector<firn::Combination> out;
    for (std::size_t c = 0; c < cases; ++c)
        out.push_back({fmt::format("K{}", c), {{make_id<firn::CaseId>(c), 1.0}}});
    for (std::size_t c = 1; c < cases; ++c) {
        out.push_back({fmt::format("1.2 K0 + 1.6 K{}", c),
                       {{make_id<firn::CaseId>(0), 1.2}, {make_id<firn::CaseId>(c), 1.6}}});
    }
    return out;
}

/// Seconds to combine and envelope every case of an analysis, and how many combinations.
std::pair<double, std::size_t> time_envelopes(const firn::Analysis& a) {
    auto start = std::chrono::steady_clock::now();
    std::vector<firn::Combination> combinations = bench_combinations(a.loads.cases.size());
    firn::Envelopes e =
        firn::compute_envelopes(a.model, a.loads, a.solution, a.results, combinations);
    return {seconds_since(start), e.combinations.size()};
}

/// Analyses one model text and prints its phase timings; 0 on success.
int run(const char* style, const std::string& text, std::size_t bays, std::size_t storeys,
        std::size_t cases) {
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
    firn::ReportOptions options;
    options.derivation = &a.derivation;  // the snow trace, as `firn run` writes it
    firn::write_text_report(a.model, a.results, options, [&report_bytes](std::string_view piece) {
        report_bytes += piece.size();
    });
    double report_time = seconds_since(report_start);
    auto [combine_time, combination_count] = time_envelopes(a);
    std::printf("%s", fmt::format("frame {} bays x {} storeys, {} cases, {}: {} nodes, {} members, "
                                  "{} unknowns\nmodel text {:.3f} MB, report {:.1f} MB, "
                                  "{} combinations\n",
                                  bays, storeys, cases, style, a.model.nodes.size(),
                                  a.model.members.size(), 3 * (a.model.nodes.size() - bays - 1),
                                  static_cast<double>(text.size()) / 1e6,
                                  static_cast<double>(report_bytes) / 1e6, combination_count)
                          .c_str());
    double analysis_only = t.loads + t.assemble + t.factor + t.solve + t.results;
    const std::pair<const char*, double> phases[] = {{"parse", t.parse},
                                                     {"resolve", t.resolve},
                                                     {"loads", t.loads},
                                                     {"assemble", t.assemble},
                                                     {"factor", t.factor},
                                                     {"solve", t.solve},
                                                     {"results", t.results},
                                                     {"model to member results", analysis},
                                                     {"report (text, to memory)", report_time},
                                                     {"combinations + envelopes", combine_time}};
    for (const auto& [name, seconds] : phases)
        std::printf("  %-24s %8.3f s\n", name, seconds);
    std::printf("  %-24s %8.1f %%\n", "parse+resolve / analysis",
                100.0 * (t.parse + t.resolve) / analysis_only);
    return 0;
}

/// The frame under derived snow with ASCE 7-16's arrangements on its roof, combined
/// for strength design by the driver itself: the phases up to the envelopes.
int run_snow(std::size_t bays, std::size_t storeys) {
    firn::PhaseTimes t;
    auto start = std::chrono::steady_clock::now();
    firn::Analysis a = firn::analyse_text("bench.firn", firn::bench::snow_frame(bays, storeys), &t);
    double total = seconds_since(start);
    if (!a.ok) {
        std::fputs(firn::render(a.diagnostics, a.sources).c_str(), stderr);
        return 2;
    }
    std::printf("%s",
                fmt::format("frame {} bays x {} storeys under snow with ASCE 7-16 partial "
                            "loading on its roof: {} cases, {} strength combinations\n",
                            bays, storeys, a.model.cases.size(), a.combinations.combinations.size())
                    .c_str());
    const std::pair<const char*, double> phases[] = {{"parse + resolve", t.parse + t.resolve},
                                                     {"snow, loads", t.loads},
                                                     {"assemble + factor", t.assemble + t.factor},
                                                     {"solve", t.solve},
                                                     {"results", t.results},
                                                     {"combinations + envelopes", t.combinations},
                                                     {"model to envelopes", total}};
    for (const auto& [name, seconds] : phases)
        std::printf("  %-24s %8.3f s\n", name, seconds);
    return 0;
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
    if (!write_to.empty()) {
        std::string error;
        std::string text = firn::bench::generated_frame(bays, storeys, cases);
        if (!firn::write_file_atomically(write_to, text, error)) {
            std::fprintf(stderr, "%s\n", error.c_str());
            return 2;
        }
        return 0;
    }
    int status = run("written with generators", firn::bench::generated_frame(bays, storeys, cases),
                     bays, storeys, cases);
    if (status == 0) {
        status = run("written one node and member per line",
                     firn::bench::rectangular_frame(bays, storeys, cases), bays, storeys, cases);
    }
    if (status == 0)
        status = run_snow(bays, storeys);
    std::printf("  %-24s %8.0f MiB\n", "peak memory", peak_memory_mib());
    return status;
}
