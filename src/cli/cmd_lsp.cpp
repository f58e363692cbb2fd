// cmd_lsp: `firn lsp` serves an editor over standard input and output (src/lsp/).
#include <CLI/CLI.hpp>
#include <memory>

#include "cli/cmd_common.hpp"
#include "cli/commands.hpp"
#include "lsp/lsp.hpp"

namespace firn {

void add_lsp_command(CLI::App& app, int& status) {
    CLI::App* cmd = app.add_subcommand(
        "lsp", "Serve an editor: the language server protocol over standard input and output");
    // Editors' clients add --stdio when they talk over the standard streams; it is the
    // only way this server talks, so the flag changes nothing.
    struct LspArgs {
        bool stdio = false;
        std::string stdlib;
    };
    auto args = std::make_shared<LspArgs>();
    cmd->add_flag("--stdio", args->stdio, "Talk over standard input and output (the default)");
    add_stdlib_option(cmd, args->stdlib);
    cmd->callback(
        [&status, args] { status = serve_language_on_stdio(imports_from(args->stdlib)); });
}

}  // namespace firn
