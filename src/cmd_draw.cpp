// cmd_draw: `firn draw` (being built; see the open issue).
#include <CLI/CLI.hpp>
#include <cstdio>

#include "commands.hpp"

namespace firn {

void add_draw_command(CLI::App& app, int& status) {
    CLI::App* cmd = app.add_subcommand("draw", "(not built yet)");
    cmd->callback([&status] {
        std::fputs("firn: error: 'draw' is not built yet\n", stderr);
        status = exit_model_error;
    });
}

}  // namespace firn
