// cmd_run: `firn run MODEL [--format text|json] [--full] [--output FILE]`.
#include <CLI/CLI.hpp>
#include <cstdio>
#include <memory>

#include "commands.hpp"
#include "driver.hpp"
#include "file_io.hpp"
#include "report.hpp"
#include "stations.hpp"

namespace firn {
namespace {

struct RunArgs {
    std::string model;
    std::string format = "text";
    std::string output;
    bool full = false;
};

/// Points per member in the full report: the ends and every tenth between.
constexpr std::size_t kStationsPerMember = 11;

int run(const RunArgs& args) {
    Analysis a = analyse_file(args.model);
    std::string messages = render(a.diagnostics, a.sources);
    std::fputs(messages.c_str(), stderr);
    if (!a.ok) return exit_model_error;

    Stations stations;
    ReportOptions options;
    if (args.full) {
        stations = compute_stations(a.model, a.loads, a.solution, kStationsPerMember);
        options.stations = &stations;
    }
    std::string report = args.format == "json" ? json_report(a.model, a.results, options)
                                               : text_report(a.model, a.results, options);
    if (args.output.empty()) {
        std::fwrite(report.data(), 1, report.size(), stdout);
        return std::fflush(stdout) == 0 ? exit_ok : exit_internal;
    }
    std::string error;
    if (!write_file_atomically(args.output, report, error)) {
        std::fprintf(stderr, "firn: error: %s\n", error.c_str());
        return exit_model_error;
    }
    return exit_ok;
}

}  // namespace

void add_run_command(CLI::App& app, int& status) {
    auto args = std::make_shared<RunArgs>();
    CLI::App* cmd = app.add_subcommand("run", "Analyse a model and print its report");
    cmd->add_option("model", args->model, "The model file (.firn)")->required();
    cmd->add_option("--format", args->format, "Report format")
        ->check(CLI::IsMember({"text", "json"}))
        ->capture_default_str();
    cmd->add_flag("--full", args->full, "Add member stations (values at tenths of each member)");
    cmd->add_option("-o,--output", args->output,
                    "Write the report to this file (atomically) instead of standard output");
    cmd->callback([args, &status] { status = run(*args); });
}

}  // namespace firn
