// cmd_check: `firn check` (being built; see the open issue).
#include <CLI/CLI.hpp>
#include <cstdio>

#include "commands.hpp"

namespace firn {

void add_check_command(CLI::App& app, int& status) {
    CLI::App* cmd = app.add_subcommand("check", "(not built yet)");
    cmd->callback([&status] {
        std::fputs("firn: error: 'check' is not built yet\n", stderr);
        status = exit_model_error;
    });
}

}  // namespace firn
