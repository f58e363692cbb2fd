// firn: compile a frame model, analyse it, print deterministic results.
// A thin driver: each subcommand lives in its own cmd_*.cpp.
#include <fmt/format.h>
#include <CLI/CLI.hpp>
#include <cerrno>
#include <cstdio>
#include <cstring>
#include <exception>
#include <string>
#include <vector>

#include "base/diag.hpp"
#include "base/version.hpp"
#include "cli/commands.hpp"

namespace {

/// CLI11 answers a mistyped command with "a subcommand is required"; say what
/// was wrong instead.
bool is_unknown_command(CLI::App& app, int argc, char** argv) {
    if (argc < 2 || argv[1][0] == '-')
        return false;
    std::vector<std::string> names;
    for (const CLI::App* sub : app.get_subcommands({}))
        names.push_back(sub->get_name());
    std::string word = argv[1];
    for (const std::string& name : names) {
        if (name == word)
            return false;
    }
    std::fprintf(stderr,
                 "firn: error: unknown command '%s'%s\nRun with --help for more information.\n",
                 word.c_str(), firn::did_you_mean(word, names).c_str());
    return true;
}

/// The commands on the command line; a bad command line is exit 2.
int run_command(int argc, char** argv) {
    int status = firn::exit_ok;
    CLI::App app{"firn: snow-loaded plane frames from text models, solved and reported", "firn"};
    app.set_version_flag("--version", fmt::format("firn {}", firn::kFirnVersion));
    app.require_subcommand(1);
    firn::add_run_command(app, status);
    firn::add_fmt_command(app, status);
    firn::add_check_command(app, status);
    firn::add_baseline_command(app, status);
    firn::add_draw_command(app, status);
    firn::add_lsp_command(app, status);
    if (is_unknown_command(app, argc, argv))
        return firn::exit_model_error;
    try {
        app.parse(argc, argv);
    } catch (const CLI::ParseError& e) {
        int code = app.exit(e);
        return code == 0 ? firn::exit_ok : firn::exit_model_error;
    }
    return status;
}

/// A report lost on the way out (a full disk, a closed pipe) is an error the user must
/// see, whatever the command made of it: exit 2 with the reason.
int with_output_checked(int status) {
    errno = 0;
    bool failed = std::fflush(stdout) != 0;
    int cause = firn::stdout_error() != 0 ? firn::stdout_error() : errno;
    failed = std::ferror(stdout) != 0 || failed;
    if (!failed)
        return status;
    std::fprintf(stderr, "firn: error: cannot write standard output: %s\n",
                 std::strerror(cause != 0 ? cause : EIO));
    return firn::exit_model_error;
}

}  // namespace

int main(int argc, char** argv) {
    // Anything that escapes a command is a bug in firn, never the user's: say so, exit 3.
    try {
        return with_output_checked(run_command(argc, argv));
    } catch (const std::exception& e) {
        std::fprintf(stderr, "firn: internal error (please report this): %s\n", e.what());
    } catch (...) {
        std::fprintf(stderr, "firn: internal error (please report this)\n");
    }
    return firn::exit_internal;
}
