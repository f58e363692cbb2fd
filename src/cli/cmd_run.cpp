// cmd_run: `firn run MODEL [--format text|json] [--full] [--summary]
// [--combination NAME]... [--output FILE]`.
#include <CLI/CLI.hpp>
#include <cstdio>
#include <memory>

#include "analyse/analyse.hpp"
#include "base/file_io.hpp"
#include "base/name_pattern.hpp"
#include "cli/cmd_common.hpp"
#include "cli/commands.hpp"
#include "driver/driver.hpp"
#include "report/report.hpp"

namespace firn {
namespace {

struct RunArgs {
    std::string model;
    std::string format = "text";
    std::string output;
    std::string stdlib;
    std::vector<std::string> combinations;  ///< names or patterns; `all` for every one
    bool full = false;
    bool summary = false;
    bool exact_numbers = false;
    bool strict = false;
};

/// Points per member in the full report: the ends and every tenth between.
constexpr std::size_t kStationsPerMember = 11;

/// The file of the run that `output` would overwrite (the model, a used file), if any.
const SourceFile* input_at(const SourceMap& sources, const std::string& output) {
    for (std::size_t i = 0; i < sources.count(); ++i) {
        const SourceFile& f = sources.file(static_cast<FileId>(i));
        if (same_file(f.name, output))
            return &f;
    }
    return nullptr;
}

/// The combinations `--combination` names, in the list's order; false (and the
/// message printed) when a name matches none.
bool choose_combinations(const Analysis& a, const RunArgs& args, std::vector<std::size_t>& out) {
    std::vector<std::string> patterns = args.combinations;
    for (std::string& p : patterns) {
        if (p == "all")
            p = "*";  // combination names are SET.LABEL/N, never `all`
    }
    const std::vector<Combination>& list = a.combinations.combinations;
    std::vector<std::string> errors;
    out = matching_names(
        patterns, list.size(), [&](std::size_t i) { return list[i].name; }, "combination", errors);
    for (const std::string& e : errors)
        std::fprintf(stderr, "firn: error: %s (the report's Load combinations list them)\n",
                     e.c_str());
    return errors.empty();
}

int run(const RunArgs& args) {
    std::string messages;
    std::optional<Analysis> analysed =
        analyse_for_command(args.model, args.stdlib, args.strict, messages);
    if (!analysed)
        return exit_model_error;
    const Analysis& a = *analysed;
    if (const SourceFile* input =
            args.output.empty() ? nullptr : input_at(a.sources, args.output)) {
        std::fprintf(stderr,
                     "firn: error: the report would overwrite '%s', an input of this run; give "
                     "-o another file\n",
                     input->name.c_str());
        return exit_model_error;
    }

    Stations stations, combination_stations;
    ReportOptions options = report_options(a);
    options.full = args.full;
    options.exact_numbers = args.exact_numbers;
    options.summary_only = args.summary;
    if (!choose_combinations(a, args, options.chosen_combinations))
        return exit_model_error;
    if (args.full) {
        stations = compute_stations(a.model, a.loads, a.solution, kStationsPerMember);
        options.stations = &stations;
        std::vector<Combination> chosen;
        for (std::size_t k : options.chosen_combinations)
            chosen.push_back(a.combinations.combinations[k]);
        combination_stations =
            compute_combination_stations(a.model, a.loads, a.solution, chosen, kStationsPerMember);
        options.combination_stations = &combination_stations;
    }
    auto write_report = [&](const ReportSink& sink) {
        if (args.format == "json") {
            write_json_report(a.model, a.results, options, sink);
        } else {
            write_text_report(a.model, a.results, options, sink);
        }
    };
    int status = exit_ok;
    if (args.output.empty() || args.output == "-") {
        // `-o -` is standard output, as for most tools; a failed write there is reported
        // once, by main.
        write_report(write_stdout);
    } else {
        AtomicFile file;
        std::string error;
        bool written = file.open(args.output, error);
        if (written) {
            write_report([&file](std::string_view piece) { file.write(piece); });
            written = file.commit(error);
        }
        if (!written) {
            std::fprintf(stderr, "firn: error: %s\n", error.c_str());
            status = exit_model_error;
        }
    }
    std::fputs(messages.c_str(), stderr);  // warnings, after the report they qualify
    return status;
}

}  // namespace

void add_run_command(CLI::App& app, int& status) {
    auto args = std::make_shared<RunArgs>();
    CLI::App* cmd = app.add_subcommand("run", "Analyse a model and print its report");
    cmd->add_option("model", args->model, "The model file (.firn)")->required();
    cmd->add_option("--format", args->format, "Report format")
        ->check(CLI::IsMember({"text", "json"}))
        ->capture_default_str();
    cmd->add_flag("--full", args->full,
                  "Also print every node's displacements, member end forces and member stations "
                  "(values at tenths of each member)");
    cmd->add_option("--combination", args->combinations,
                    "Print these combinations' own results in a load case's layout (a name, a "
                    "pattern with *, or all; repeatable); text: with the header only, JSON: "
                    "added as combination_results")
        ->type_name("NAME");
    cmd->add_flag("--summary", args->summary,
                  "Text: print only the header and the design summary (the governing forces, "
                  "with what acts with them, and the reaction sets)");
    cmd->add_flag("--exact-numbers", args->exact_numbers,
                  "JSON: write every number unrounded, as the shortest text that reads back to "
                  "the same double (for checking firn with other tools)");
    cmd->add_option("-o,--output", args->output,
                    "Write the report to this file (atomically) instead of standard output; "
                    "'-' is standard output");
    add_stdlib_option(cmd, args->stdlib);
    add_strict_option(cmd, args->strict);
    cmd->callback([args, &status] { status = run(*args); });
}

}  // namespace firn
