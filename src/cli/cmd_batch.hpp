// cmd_batch: the command-line options that `firn check` and `firn baseline` share:
// the model files, --shard K/N, --jobs N and --stdlib.
#pragma once

#include <CLI/CLI.hpp>
#include <cstdio>
#include <optional>
#include <string>
#include <vector>

#include "base/batch.hpp"
#include "cli/cmd_common.hpp"

namespace firn {

struct BatchArgs {
    std::vector<std::string> models;
    std::string shard;
    std::size_t jobs = 0;
    std::string stdlib;
    bool strict = false;  ///< --warnings-as-errors (firn check)
};

inline void add_batch_options(CLI::App* cmd, BatchArgs& args) {
    cmd->add_option("models", args.models, "The model files (.firn)")->required();
    cmd->add_option("--shard", args.shard,
                    "Run only the K-th of N slices of the models (K/N), for CI jobs in parallel");
    cmd->add_option("-j,--jobs", args.jobs,
                    "Models analysed at once (default: one per core); the output does not "
                    "depend on it");
    add_stdlib_option(cmd, args.stdlib);
}

/// The models of the chosen shard, or nothing after printing why the shard is wrong.
inline std::optional<std::vector<std::string>> selected_models(const BatchArgs& args) {
    Shard shard;
    if (!args.shard.empty()) {
        std::string error;
        std::optional<Shard> parsed = parse_shard(args.shard, error);
        if (!parsed) {
            std::fprintf(stderr, "firn: error: --shard %s: %s\n", args.shard.c_str(),
                         error.c_str());
            return std::nullopt;
        }
        shard = *parsed;
    }
    return models_in_shard(args.models, shard);
}

inline ImportOptions import_options(const BatchArgs& args) {
    return imports_from(args.stdlib);
}

}  // namespace firn
