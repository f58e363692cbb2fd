// cmd_common: what the commands share once a model is analysed: where `use`
// finds the library, and the report sections an analysis fills.
#pragma once

#include <fmt/format.h>
#include <CLI/CLI.hpp>
#include <cstdio>
#include <optional>
#include <string>

#include "driver/driver.hpp"

namespace firn {

/// Import options for `--stdlib DIR`; empty: the built-in library.
inline ImportOptions imports_from(const std::string& stdlib) {
    ImportOptions imports;
    if (!stdlib.empty())
        imports.stdlib_dir = stdlib;
    return imports;
}

/// `--stdlib DIR` (or FIRN_STDLIB): where `use NAME` finds the library.
inline void add_stdlib_option(CLI::App* cmd, std::string& stdlib) {
    cmd->add_option("--stdlib", stdlib,
                    "Read library modules (use NAME) from this folder instead of the built-in "
                    "library; for library development")
        ->envname("FIRN_STDLIB");
}

/// `--warnings-as-errors`: for CI, a model with warnings fails as one with errors does.
inline void add_strict_option(CLI::App* cmd, bool& strict) {
    cmd->add_flag("--warnings-as-errors", strict,
                  "Treat the model's warnings as errors (exit 2), as a CI check would");
}

/// With `strict`, the sentence that fails a model for its warnings; empty otherwise.
inline std::string strict_failure(const Analysis& a, bool strict) {
    if (!strict)
        return "";
    std::size_t warnings = 0;
    for (const Diagnostic& d : a.diagnostics.all())
        warnings += d.severity == Severity::warning ? 1U : 0U;
    if (warnings == 0)
        return "";
    return fmt::format("firn: error: {}: {} warning{} and --warnings-as-errors is set\n",
                       a.model.source_name, warnings, warnings == 1 ? "" : "s");
}

/// The analysis of one model for `run` and `draw`, with its rendered diagnostics in
/// `messages` (printed by the command after its output, which they qualify); nothing,
/// after printing them, when the model has errors (or warnings, with `strict`).
inline std::optional<Analysis> analyse_for_command(const std::string& model,
                                                   const std::string& stdlib, bool strict,
                                                   std::string& messages) {
    Analysis a = analyse_file(model, nullptr, imports_from(stdlib));
    messages = render(a.diagnostics, a.sources);
    std::string failure = strict_failure(a, strict);
    if (a.ok && failure.empty())
        return a;
    std::fputs((messages + failure).c_str(), stderr);
    return std::nullopt;
}

}  // namespace firn
