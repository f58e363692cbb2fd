// commands: the subcommands of the firn executable, one file each (cmd_*.cpp).
#pragma once

#include <string_view>

namespace CLI {
class App;
}

namespace firn {

/// Writes to standard output; a failed write is remembered for stdout_error().
void write_stdout(std::string_view text);

/// The errno of the first write_stdout that failed, 0 if none has.
int stdout_error();

/// Exit statuses of the firn executable.
enum ExitStatus : int {
    exit_ok = 0,
    exit_check_failed = 1,  ///< an expectation or baseline comparison failed
    exit_model_error = 2,   ///< the model (or the command line) has errors
    exit_internal = 3,      ///< a bug in firn
};

/// `firn run MODEL`: analyse a model and print its report. Sets `status` when run.
void add_run_command(CLI::App& app, int& status);

/// `firn fmt [--check] [--stdout] FILE...`: rewrite model files in the canonical layout.
void add_fmt_command(CLI::App& app, int& status);

/// `firn check MODEL...`: evaluate every model's expectations (cmd_check.cpp).
void add_check_command(CLI::App& app, int& status);

/// `firn baseline MODEL...`: compare results with committed baselines, or update them
/// when asked (cmd_baseline.cpp).
void add_baseline_command(CLI::App& app, int& status);

/// `firn draw MODEL`: SVG drawings of the frame, its loads and diagrams, and the HTML
/// report (cmd_draw.cpp).
void add_draw_command(CLI::App& app, int& status);

/// `firn lsp`: the language server for editors, on standard input and output (cmd_lsp.cpp).
void add_lsp_command(CLI::App& app, int& status);

}  // namespace firn
