// cmd_baseline: `firn baseline` (being built; see the open issue).
#include <CLI/CLI.hpp>
#include <cstdio>

#include "commands.hpp"

namespace firn {

void add_baseline_command(CLI::App& app, int& status) {
    CLI::App* cmd = app.add_subcommand("baseline", "(not built yet)");
    cmd->callback([&status] {
        std::fputs("firn: error: 'baseline' is not built yet\n", stderr);
        status = exit_model_error;
    });
}

}  // namespace firn
