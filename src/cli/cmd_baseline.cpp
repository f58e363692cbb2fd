// cmd_baseline: `firn baseline check|update|show|diff`. Each model's results
// are kept in MODEL.baseline beside it; `check` compares a fresh run with it,
// `update` (and only `update`) writes it, `show` prints what it would hold and
// `diff` compares two versions of one model file (for a git diff driver).
// Models are analysed on several workers but reported in the models' order, so
// the output never depends on --jobs.
#include <fmt/format.h>
#include <CLI/CLI.hpp>
#include <cstdio>
#include <filesystem>
#include <memory>

#include "base/file_io.hpp"
#include "baseline/baseline.hpp"
#include "cli/cmd_batch.hpp"
#include "cli/commands.hpp"
#include "driver/driver.hpp"

namespace firn {
namespace {

struct ToleranceArgs {
    double relative = 1e-4;
    std::vector<std::string> absolute;  ///< pairs: value, unit
    std::size_t top = Listing{}.top;
    double noise_percent = Listing{}.noise * 100.0;
};

struct BaselineArgs {
    BatchArgs batch;
    ToleranceArgs tolerance;
};

struct DiffArgs {
    std::string old_file, new_file, as;
    std::string stdlib;
    ToleranceArgs tolerance;
};

/// What one model gave: its lines for standard output and standard error, and
/// its exit status. Printed in the models' order once every model is done.
struct Outcome {
    int status = exit_ok;
    std::string out, err;
};

void print(const std::vector<Outcome>& outcomes) {
    for (const Outcome& o : outcomes) {
        write_stdout(o.out);
        std::fflush(stdout);
        std::fputs(o.err.c_str(), stderr);
    }
}

std::optional<Tolerances> tolerances_from(const ToleranceArgs& args) {
    Tolerances t = default_tolerances();
    if (!(args.relative >= 0.0)) {
        std::fputs("firn: error: --rel must be zero or more\n", stderr);
        return std::nullopt;
    }
    if (!(args.noise_percent >= 0.0 && args.noise_percent <= 100.0)) {
        std::fputs("firn: error: --noise is a percentage from 0 to 100\n", stderr);
        return std::nullopt;
    }
    t.relative = args.relative;
    for (std::size_t i = 0; i + 1 < args.absolute.size(); i += 2) {
        std::string error;
        if (!set_floor(t, args.absolute[i], args.absolute[i + 1], error)) {
            std::fprintf(stderr, "firn: error: %s\n", error.c_str());
            return std::nullopt;
        }
    }
    return t;
}

/// `MODEL: 3 moved, 1 added (40 values compared)` or `MODEL: unchanged (40 values)`.
std::string heading(const std::string& label, const Comparison& c) {
    std::array<std::size_t, 3> counts{};
    for (const ValueChange& v : c.changes)
        ++counts[static_cast<std::size_t>(v.kind)];
    if (!c.moved())
        return fmt::format("{}: unchanged ({} values)\n", label, c.compared);
    std::vector<std::string> parts;
    static constexpr std::array<const char*, 3> kWords{"moved", "added", "removed"};
    for (std::size_t k = 0; k < counts.size(); ++k) {
        if (counts[k] > 0)
            parts.push_back(fmt::format("{} {}", counts[k], kWords[k]));
    }
    return fmt::format(
        "{}: {} ({} values compared); {} by more than {:g} % of their "
        "kind's largest\n",
        label, fmt::join(parts, ", "), c.compared, c.significant, kSignificantShare * 100.0);
}

/// The analysis of a model, or an outcome holding its errors.
std::optional<Analysis> analysed(const std::string& model, const ImportOptions& imports,
                                 Outcome& outcome) {
    Analysis a = analyse_file(model, nullptr, imports);
    if (!a.ok) {
        outcome.status = exit_model_error;
        outcome.err = render(a.diagnostics, a.sources);
        return std::nullopt;
    }
    return a;
}

Outcome fail(std::string out, std::string err) {
    return {exit_model_error, std::move(out), std::move(err)};
}

/// The stored baseline of `model`, checked to be this model's.
std::optional<Baseline> stored_baseline(const std::string& model, const Baseline& fresh,
                                        std::string& error) {
    std::string path = baseline_path(model), text;
    if (!std::filesystem::exists(path)) {
        error = fmt::format("{}: error: no baseline for {}; create it with `{} {}`\n", path, model,
                            "firn baseline update", model);
        return std::nullopt;
    }
    if (!read_file(path, text, error)) {
        error = fmt::format("firn: error: {}\n", error);
        return std::nullopt;
    }
    std::optional<Baseline> stored = read_baseline(text, path, error);
    if (!stored) {
        error += '\n';
    } else if (stored->source != fresh.source) {
        error = fmt::format("{}: error: baseline is for model file {}, not {}\n", path,
                            stored->source, fresh.source);
        stored.reset();
    } else if (stored->title != fresh.title) {
        error = fmt::format("{}: error: baseline is for model \"{}\", not \"{}\"", path,
                            stored->title, fresh.title);
        error += fmt::format(" (after renaming the model, run `firn baseline update {}`)\n", model);
        stored.reset();
    }
    return stored;
}

Listing listing_from(const ToleranceArgs& args) {
    return Listing{args.top, args.noise_percent / 100.0};
}

Outcome check_model(const std::string& model, const ImportOptions& imports,
                    const Tolerances& tolerances, const Listing& listing) {
    Outcome o;
    std::optional<Analysis> a = analysed(model, imports, o);
    if (!a)
        return fail(fmt::format("{}: not compared (the model has errors)\n", model), o.err);
    Baseline fresh = make_baseline(*a);
    std::string error;
    std::optional<Baseline> stored = stored_baseline(model, fresh, error);
    if (!stored)
        return fail(fmt::format("{}: not compared (no usable baseline)\n", model), error);
    Comparison c = compare_baselines(*stored, fresh, tolerances);
    o.out = heading(model, c) + describe_changes(c, listing);
    o.status = c.moved() ? exit_check_failed : exit_ok;
    return o;
}

/// Why the file at `path` (holding `old`) must not be overwritten by a baseline, if it must not.
std::optional<std::string> refusal(const std::string& path, const std::string& old) {
    std::optional<int> format = baseline_format_of(old);
    if (!format)
        return fmt::format("{}: error: not a firn baseline; not overwritten (move it away first)",
                           path);
    if (*format > kBaselineFormat)
        return fmt::format(
            "{}: error: written by a newer firn (format {}; this firn reads up to "
            "{}); not overwritten",
            path, *format, kBaselineFormat);
    return std::nullopt;
}

Outcome update_model(const std::string& model, const ImportOptions& imports) {
    Outcome o;
    std::optional<Analysis> a = analysed(model, imports, o);
    if (!a)
        return o;
    std::string path = baseline_path(model), text = baseline_text(make_baseline(*a)), old, error;
    if (std::filesystem::exists(path)) {
        if (!read_file(path, old, error))
            return fail("", fmt::format("firn: error: {}\n", error));
        if (old == text)
            return o;  // unchanged: not rewritten, so its time stamp stays
        if (std::optional<std::string> why = refusal(path, old))
            return fail("", *why + "\n");
    }
    if (!write_file_atomically(path, text, error))
        return fail("", fmt::format("firn: error: {}\n", error));
    o.err = fmt::format("updated {}\n", path);
    return o;
}

/// The statuses of every model: 2 when one had errors, else 1 when one moved.
int overall(const std::vector<Outcome>& outcomes) {
    int status = exit_ok;
    for (const Outcome& o : outcomes)
        status = std::max(status, o.status);
    return status;
}

std::string summary(const std::vector<Outcome>& outcomes) {
    std::array<std::size_t, 3> counts{};  // by status: unchanged, moved, errors
    for (const Outcome& o : outcomes)
        ++counts[static_cast<std::size_t>(std::min(o.status, 2))];
    std::string line = fmt::format("{} model{}: {} unchanged, {} moved", outcomes.size(),
                                   outcomes.size() == 1 ? "" : "s", counts[0], counts[1]);
    if (counts[2] > 0)
        line += fmt::format(", {} not compared", counts[2]);
    return line + "\n";
}

template <typename Job>
int run_batch(const BatchArgs& args, bool with_summary, Job job) {
    std::optional<std::vector<std::string>> models = selected_models(args);
    if (!models)
        return exit_model_error;
    std::vector<Outcome> outcomes = run_each<Outcome>(
        models->size(), args.jobs, [&](std::size_t i) { return job((*models)[i]); });
    print(outcomes);
    if (with_summary)
        std::fputs(summary(outcomes).c_str(), stdout);
    return overall(outcomes);
}

int check(const BaselineArgs& args) {
    std::optional<Tolerances> tolerances = tolerances_from(args.tolerance);
    if (!tolerances)
        return exit_model_error;
    ImportOptions imports = import_options(args.batch);
    return run_batch(args.batch, true, [&](const std::string& model) {
        return check_model(model, imports, *tolerances, listing_from(args.tolerance));
    });
}

int update(const BaselineArgs& args) {
    ImportOptions imports = import_options(args.batch);
    return run_batch(args.batch, false,
                     [&](const std::string& model) { return update_model(model, imports); });
}

int show(const DiffArgs& args) {
    ImportOptions imports = imports_from(args.stdlib);
    Outcome o;
    if (std::optional<Analysis> a = analysed(args.new_file, imports, o))
        o.out = baseline_text(make_baseline(*a));
    print({o});
    return o.status;
}

/// One version of the model file, analysed as if it stood at `as`.
std::optional<Analysis> version(const std::string& file, const std::string& as,
                                const ImportOptions& imports, Outcome& o) {
    std::string text, error;
    if (!read_file(file, text, error)) {
        o.status = exit_model_error;
        o.err += fmt::format("firn: error: {}\n", error);
        return std::nullopt;
    }
    Analysis a = analyse_text(as, std::move(text), nullptr, imports);
    if (!a.ok) {
        o.status = exit_model_error;
        o.err += render(a.diagnostics, a.sources);
        return std::nullopt;
    }
    return a;
}

int diff(const DiffArgs& args) {
    std::optional<Tolerances> tolerances = tolerances_from(args.tolerance);
    if (!tolerances)
        return exit_model_error;
    ImportOptions imports = imports_from(args.stdlib);
    std::string as = args.as.empty() ? args.new_file : args.as;
    std::string label = fmt::format("results of {}", as);
    Outcome o;
    std::optional<Analysis> old_version = version(args.old_file, as, imports, o);
    std::optional<Analysis> new_version = version(args.new_file, as, imports, o);
    if (!old_version || !new_version) {
        o.out = fmt::format("{}: not compared (the {} version has errors)\n", label,
                            old_version ? "new" : "old");
    } else {
        Comparison c = compare_baselines(make_baseline(*old_version), make_baseline(*new_version),
                                         *tolerances);
        o.out = heading(label, c) + describe_changes(c, listing_from(args.tolerance));
        o.status = c.moved() ? exit_check_failed : exit_ok;
    }
    print({o});
    return o.status;
}

void add_tolerance_options(CLI::App* cmd, ToleranceArgs& args) {
    cmd->add_option("--rel", args.relative,
                    "Relative tolerance: a value moved when it changed by more than this "
                    "fraction of its old size (and more than its floor)")
        ->capture_default_str();
    cmd->add_option("--abs", args.absolute,
                    "Absolute floor for one kind of value, with its unit (--abs 0.01 kip*ft; "
                    "--abs 0.001 ratio); repeat for other kinds. Defaults: 1 N, 1 N*m, "
                    "0.001 mm, 0.00001 rad or ratio")
        ->expected(2)
        ->multi_option_policy(CLI::MultiOptionPolicy::TakeAll)
        ->type_name("VALUE UNIT");
    cmd->add_option("--top", args.top,
                    "List at most this many moved values, the most significant first (0: all)")
        ->capture_default_str();
    cmd->add_option("--noise", args.noise_percent,
                    "Leave out of the list the values that moved by less than this percentage "
                    "of the largest value of their kind (they still count as moved)")
        ->capture_default_str();
}

void add_check(CLI::App* parent, int& status) {
    auto args = std::make_shared<BaselineArgs>();
    CLI::App* cmd = parent->add_subcommand(
        "check", "Compare each model's results with its baseline (MODEL.baseline)");
    add_batch_options(cmd, args->batch);
    add_tolerance_options(cmd, args->tolerance);
    cmd->callback([args, &status] { status = check(*args); });
}

void add_update(CLI::App* parent, int& status) {
    auto args = std::make_shared<BaselineArgs>();
    CLI::App* cmd = parent->add_subcommand(
        "update", "Write each model's baseline (MODEL.baseline) from its current results");
    add_batch_options(cmd, args->batch);
    cmd->callback([args, &status] { status = update(*args); });
}

void add_show(CLI::App* parent, int& status) {
    auto args = std::make_shared<DiffArgs>();
    CLI::App* cmd = parent->add_subcommand(
        "show", "Print the baseline a model's results give, writing nothing");
    cmd->add_option("model", args->new_file, "The model file (.firn)")->required();
    add_stdlib_option(cmd, args->stdlib);
    cmd->callback([args, &status] { status = show(*args); });
}

void add_diff(CLI::App* parent, int& status) {
    auto args = std::make_shared<DiffArgs>();
    CLI::App* cmd = parent->add_subcommand(
        "diff", "Compare the results of two versions of one model file (for git diff)");
    cmd->add_option("old", args->old_file, "The old version of the model file")->required();
    cmd->add_option("new", args->new_file, "The new version of the model file")->required();
    cmd->add_option("--as", args->as,
                    "The model's path in the work tree: names messages and resolves `use "
                    "\"file\"` (default: NEW)");
    add_tolerance_options(cmd, args->tolerance);
    add_stdlib_option(cmd, args->stdlib);
    cmd->callback([args, &status] { status = diff(*args); });
}

}  // namespace

void add_baseline_command(CLI::App& app, int& status) {
    CLI::App* cmd = app.add_subcommand(
        "baseline", "Keep each model's results in a baseline file beside it and compare with it");
    add_check(cmd, status);
    add_update(cmd, status);
    add_show(cmd, status);
    add_diff(cmd, status);
    // Without a known command, say which there are (CLI11 would only say one is required).
    cmd->require_subcommand(0, 1);
    cmd->allow_extras();
    cmd->callback([cmd, &status] {
        if (!cmd->get_subcommands().empty())
            return;
        std::vector<std::string> extras = cmd->remaining();
        std::vector<std::string> names{"check", "update", "show", "diff"};
        if (extras.empty()) {
            std::fputs(
                "firn: error: `firn baseline` needs a command: check, update, show or diff\n",
                stderr);
        } else {
            std::fprintf(stderr, "firn: error: unknown baseline command '%s'%s\n",
                         extras.front().c_str(), did_you_mean(extras.front(), names).c_str());
        }
        status = exit_model_error;
    });
}

}  // namespace firn
