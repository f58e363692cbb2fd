// cmd_fmt: `firn fmt [--check] [--stdout] FILE...` rewrites model files in the
// canonical layout (src/format/format.hpp); `-` formats standard input to standard output.
#include <fmt/format.h>
#include <sys/stat.h>
#include <unistd.h>
#include <CLI/CLI.hpp>
#include <cstdio>
#include <filesystem>
#include <memory>
#include <optional>

#include "base/diag.hpp"
#include "base/file_io.hpp"
#include "cli/commands.hpp"
#include "format/format.hpp"

namespace firn {
namespace {

struct FmtArgs {
    std::vector<std::string> files;
    bool check = false;
    bool to_stdout = false;
};

/// What happened to the files of one run; the exit status follows from it.
struct Outcome {
    bool not_formatted = false;
    bool model_error = false;
    bool internal_error = false;

    int status() const {
        return internal_error  ? exit_internal
               : model_error   ? exit_model_error
               : not_formatted ? exit_check_failed
                               : exit_ok;
    }
};

void error(const std::string& message) {
    std::fprintf(stderr, "firn: error: %s\n", message.c_str());
}

/// Rewrites `path` in place, atomically, keeping its permissions; a link is
/// followed so that the file it names is rewritten, not the link replaced.
bool rewrite(const std::string& path, const std::string& text) {
    std::error_code ec;
    std::string target = path;
    if (std::filesystem::is_symlink(path, ec))
        target = std::filesystem::canonical(path, ec).string();
    struct stat info {};
    bool had_mode = ::stat(target.c_str(), &info) == 0;
    // As editors do, a file its owner made read-only is not rewritten.
    if (::access(target.c_str(), W_OK) != 0 || (had_mode && (info.st_mode & 0222) == 0)) {
        error(
            fmt::format("'{}' is read-only; it was left as it is (make it writable to "
                        "format it, or use --stdout)",
                        path));
        return false;
    }
    std::string message;
    if (!write_file_atomically(target, text, message)) {
        error(message);
        return false;
    }
    if (had_mode)
        ::chmod(target.c_str(), info.st_mode & 07777);
    return true;
}

/// The canonical text of one file, or none when it could not be read or formatted.
std::optional<std::string> formatted(const std::string& name, const std::string& text,
                                     Outcome& outcome) {
    SourceMap sources;
    FileId id = sources.add(name, text);
    Diagnostics diagnostics;
    try {
        std::optional<std::string> result = format_source(sources, id, diagnostics);
        if (!result) {
            std::fputs(render(diagnostics, sources).c_str(), stderr);
            outcome.model_error = true;
        }
        return result;
    } catch (const FormatterError& e) {
        std::fprintf(stderr, "firn: internal error (please report this): %s\n", e.what());
        outcome.internal_error = true;
        return std::nullopt;
    }
}

void format_one(const FmtArgs& args, const std::string& path, Outcome& outcome) {
    bool from_stdin = path == "-";
    std::string name = from_stdin ? "<stdin>" : path;
    std::string text, message;
    if (from_stdin ? !read_standard_input(text, message) : !read_file(path, text, message)) {
        error(message);
        outcome.model_error = true;
        return;
    }
    std::optional<std::string> result = formatted(name, text, outcome);
    if (!result)
        return;
    if (args.check) {
        if (*result != text) {
            std::printf("%s: not formatted\n", name.c_str());
            outcome.not_formatted = true;
        }
    } else if (args.to_stdout || from_stdin) {
        write_stdout(*result);
    } else if (*result != text) {
        if (rewrite(path, *result))
            std::fprintf(stderr, "formatted %s\n", path.c_str());
        else
            outcome.model_error = true;
    }
}

int run_fmt(const FmtArgs& args) {
    bool reads_stdin = std::find(args.files.begin(), args.files.end(), "-") != args.files.end();
    if (reads_stdin && args.files.size() > 1) {
        error("'-' (standard input) must be the only file");
        return exit_model_error;
    }
    if (args.to_stdout && args.files.size() > 1) {
        error("--stdout takes a single file");
        return exit_model_error;
    }
    Outcome outcome;
    for (const std::string& path : args.files)
        format_one(args, path, outcome);
    return outcome.status();
}

}  // namespace

void add_fmt_command(CLI::App& app, int& status) {
    auto args = std::make_shared<FmtArgs>();
    CLI::App* cmd = app.add_subcommand("fmt", "Rewrite model files in the canonical layout");
    cmd->add_option("files", args->files, "Model files (.firn); '-' reads standard input")
        ->required();
    CLI::Option* check = cmd->add_flag(
        "--check", args->check,
        "Write nothing; list the files that are not formatted and exit 1 if there are any");
    cmd->add_flag("--stdout", args->to_stdout,
                  "Print the formatted text of the file instead of rewriting it")
        ->excludes(check);
    cmd->callback([args, &status] { status = run_fmt(*args); });
}

}  // namespace firn
