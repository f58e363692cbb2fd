// cmd_draw: `firn draw MODEL -o FOLDER [--case NAME]... [--combination NAME]...`:
// SVG drawings of the frame, its loads and force diagrams, and report.html.
#include <CLI/CLI.hpp>
#include <cstdio>
#include <memory>

#include "cli/cmd_common.hpp"
#include "cli/commands.hpp"
#include "draw/draw.hpp"
#include "driver/driver.hpp"
#include "report/report.hpp"

namespace firn {
namespace {

struct DrawArgs {
    std::string model;
    std::string folder;
    std::string stdlib;
    std::vector<std::string> cases, combinations, diagrams;
    bool no_loads = false, no_envelopes = false, html_only = false, force = false;
    bool strict = false;  ///< --warnings-as-errors
};

Diagram diagram_named(const std::string& name) {
    if (name == "shear")
        return Diagram::shear;
    if (name == "axial")
        return Diagram::axial;
    if (name == "deflection")
        return Diagram::deflection;
    return Diagram::moment;
}

DrawOptions draw_options(const DrawArgs& args) {
    DrawOptions options;
    options.loads = !args.no_loads;
    options.envelopes = !args.no_envelopes;
    options.cases = args.cases;
    options.combinations = args.combinations;
    if (!args.diagrams.empty()) {
        options.diagrams.clear();
        for (const std::string& d : args.diagrams)
            options.diagrams.push_back(diagram_named(d));
    }
    return options;
}

std::string text_report_of(const Analysis& a) {
    return text_report(a.model, a.results, report_options(a));
}

int run(const DrawArgs& args) {
    std::string messages;
    std::optional<Analysis> analysed =
        analyse_for_command(args.model, args.stdlib, args.strict, messages);
    if (!analysed)
        return exit_model_error;
    const Analysis& a = *analysed;
    std::vector<std::string> errors;
    std::vector<Sheet> sheets = draw_sheets(a, draw_options(args), errors);
    if (!errors.empty()) {
        for (const std::string& e : errors)
            std::fprintf(stderr, "firn: error: %s\n", e.c_str());
        return exit_model_error;
    }
    std::vector<OutputFile> files;
    if (!args.html_only) {
        for (const Sheet& s : sheets)
            files.push_back({s.path, s.svg});
    }
    files.push_back({"report.html", html_report(a.model, text_report_of(a), sheets)});
    if (args.folder == "-") {
        // A folder cannot go down a pipe; the one file that stands alone (every drawing
        // inline) can, so `-o -` prints report.html. A failed write is reported by main.
        write_stdout(files.back().content);
        std::fputs(messages.c_str(), stderr);
        return exit_ok;
    }
    std::string error;
    if (!write_drawings(args.folder, files, args.force, error)) {
        std::fprintf(stderr, "firn: error: %s\n", error.c_str());
        return exit_model_error;
    }
    std::fprintf(stdout, "wrote %zu drawings%s and report.html to %s\n", sheets.size(),
                 args.html_only ? " (inside the report only)" : "", args.folder.c_str());
    std::fputs(messages.c_str(), stderr);  // warnings, after the output they qualify
    return exit_ok;
}

}  // namespace

void add_draw_command(CLI::App& app, int& status) {
    auto args = std::make_shared<DrawArgs>();
    CLI::App* cmd = app.add_subcommand(
        "draw", "Draw the frame, its loads and force diagrams as SVG, with an HTML report");
    cmd->add_option("model", args->model, "The model file (.firn)")->required();
    cmd->add_option("-o,--output", args->folder,
                    "The folder to write into (created if missing): frame.svg, loads/, "
                    "diagrams/, report.html; '-' prints report.html alone to standard output")
        ->required();
    cmd->add_option("--case", args->cases,
                    "Also draw the diagrams of these load cases (a name or a pattern with *; "
                    "repeatable)");
    cmd->add_option("--combination", args->combinations,
                    "Also draw the diagrams of these combinations (a name or a pattern with *; "
                    "repeatable)");
    cmd->add_option("--diagrams", args->diagrams, "Which diagrams to draw (default: all of them)")
        ->delimiter(',')
        ->check(CLI::IsMember({"moment", "shear", "axial", "deflection"}));
    cmd->add_flag("--no-loads", args->no_loads, "Leave out the loads sheets");
    cmd->add_flag("--no-envelopes", args->no_envelopes, "Leave out the envelope diagrams");
    cmd->add_flag("--html-only", args->html_only,
                  "Write only report.html (with every drawing inside it)");
    cmd->add_flag("--force", args->force,
                  "Write into a folder that holds files firn did not write (only the files "
                  "firn names are replaced)");
    add_stdlib_option(cmd, args->stdlib);
    add_strict_option(cmd, args->strict);
    cmd->callback([args, &status] { status = run(*args); });
}

}  // namespace firn
