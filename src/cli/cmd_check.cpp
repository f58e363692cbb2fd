// cmd_check: `firn check MODEL... [--shard K/N] [--jobs N] [--verbose]`: analyses
// the models (several at once), checks every expectation, prints one line per
// place that fails its bound and ends with `N passed, M failed`.
#include <fmt/format.h>
#include <CLI/CLI.hpp>
#include <cmath>
#include <cstdio>
#include <memory>

#include "cli/cmd_batch.hpp"
#include "cli/commands.hpp"
#include "driver/driver.hpp"
#include "report/report.hpp"

namespace firn {
namespace {

struct CheckArgs {
    BatchArgs batch;
    bool verbose = false;
};

/// What one model's check prints, kept until every model is done so the output
/// keeps the models' order.
struct ModelCheck {
    std::string out, err;
    std::size_t passed = 0, failed = 0;
    bool model_error = false;
};

std::string place_of(const SourceMap& sources, const SourceRange& where) {
    return fmt::format("{}:{}:{}", sources.file(where.file).name, where.begin.line,
                       where.begin.column);
}

std::string outcome_line(const Analysis& a, const Expectation& x, const Finding& f,
                         const char* verdict) {
    std::string subject = x.subject;
    if (!x.source.empty())
        subject += " under " + x.source;
    std::string line = fmt::format("{}: {}: {} {}: {}; {}", place_of(a.sources, x.where), verdict,
                                   subject, show_bound(a.model, x), describe_finding(a.model, x, f),
                                   describe_margin(a.model, x, f));
    if (!x.reason.empty())
        line += fmt::format(" (because \"{}\")", x.reason);
    return line + "\n";
}

ModelCheck check_model(const std::string& path, const CheckArgs& args) {
    ModelCheck result;
    Analysis a = analyse_file(path, nullptr, import_options(args.batch));
    result.err = render(a.diagnostics, a.sources);
    if (!a.ok) {
        result.model_error = true;
        return result;
    }
    for (const ExpectationOutcome& o : a.expectations) {
        const Expectation& x = a.model.expectations[o.expectation];
        if (o.passed()) {
            ++result.passed;
            if (args.verbose)
                result.out += outcome_line(a, x, o.closest, "passed");
            continue;
        }
        ++result.failed;
        for (const Finding& f : o.failures)
            result.out += outcome_line(a, x, f, "failed");
    }
    return result;
}

int check(const CheckArgs& args) {
    auto models = selected_models(args.batch);
    if (!models)
        return exit_model_error;
    std::vector<ModelCheck> results =
        run_each<ModelCheck>(models->size(), args.batch.jobs,
                             [&](std::size_t i) { return check_model((*models)[i], args); });
    std::size_t passed = 0, failed = 0, broken = 0;
    for (const ModelCheck& r : results) {
        std::fputs(r.err.c_str(), stderr);
        std::fputs(r.out.c_str(), stdout);
        passed += r.passed;
        failed += r.failed;
        broken += r.model_error ? 1U : 0U;
    }
    if (broken > 0)
        std::fprintf(stderr,
                     "firn: %zu of %zu models have errors; their expectations were not "
                     "checked\n",
                     broken, results.size());
    std::printf("%zu passed, %zu failed\n", passed, failed);
    if (std::fflush(stdout) != 0)
        return exit_internal;
    return broken > 0 ? exit_model_error : failed > 0 ? exit_check_failed : exit_ok;
}

}  // namespace

void add_check_command(CLI::App& app, int& status) {
    auto args = std::make_shared<CheckArgs>();
    CLI::App* cmd = app.add_subcommand(
        "check", "Analyse models and check their expectations (exit 1 if one fails)");
    add_batch_options(cmd, args->batch);
    cmd->add_flag("-v,--verbose", args->verbose,
                  "Also print each expectation that passes, with its margin");
    cmd->callback([args, &status] { status = check(*args); });
}

}  // namespace firn
