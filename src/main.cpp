// firn: compile a frame model, analyse it, print deterministic results.
// A thin driver: each subcommand lives in its own cmd_*.cpp.
#include <CLI/CLI.hpp>
#include <cstdio>
#include <exception>

#include "commands.hpp"

int main(int argc, char** argv) {
    int status = firn::exit_ok;
    CLI::App app{"firn: snow-loaded plane frames from text models, solved and reported"};
    app.set_version_flag("--version", "firn 0.1.0");
    app.require_subcommand(1);
    firn::add_run_command(app, status);
    try {
        app.parse(argc, argv);
    } catch (const CLI::ParseError& e) {
        int code = app.exit(e);
        return code == 0 ? firn::exit_ok : firn::exit_model_error;
    } catch (const std::exception& e) {
        std::fprintf(stderr, "firn: internal error (please report this): %s\n", e.what());
        return firn::exit_internal;
    }
    return status;
}
