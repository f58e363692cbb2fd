// driver: runs the stages in order and stops after a stage that reported
// errors. The subcommands and the tests call this; it knows nothing of argv.
#pragma once

#include <string>

#include "combinations.hpp"
#include "deflection.hpp"
#include "diag.hpp"
#include "expect.hpp"
#include "imports.hpp"
#include "loads.hpp"
#include "mirror.hpp"
#include "model.hpp"
#include "results.hpp"
#include "solve.hpp"

namespace firn {

/// Wall-clock seconds per phase, for the bench target (never in reports).
struct PhaseTimes {
    double parse = 0.0, resolve = 0.0, loads = 0.0;
    double assemble = 0.0, factor = 0.0, solve = 0.0;
    double results = 0.0;
    double combinations = 0.0;  ///< expanding them, their results and envelopes
};

/// Everything one run of the pipeline produced. `ok` is false when a stage
/// reported errors; the stages after it did not run.
struct Analysis {
    SourceMap sources;
    Diagnostics diagnostics;
    Model model;
    LoadSet loads;
    Mirror mirror;
    Solution solution;
    Results results;
    CombinationList combinations;
    std::vector<Envelopes> envelopes;  ///< per chosen set of combinations
    std::vector<DeflectionCheck> deflections;
    std::vector<ExpectationOutcome> expectations;  ///< per `expect`, in statement order
    bool ok = false;
};

/// Parses, resolves and analyses a model held in memory, named `name` in messages.
/// `options` say where `use` finds the standard library.
Analysis analyse_text(std::string name, std::string text, PhaseTimes* times = nullptr,
                      const ImportOptions& options = {});

/// The same for a model file; a file that cannot be read is reported as an error.
Analysis analyse_file(const std::string& path, PhaseTimes* times = nullptr,
                      const ImportOptions& options = {});

}  // namespace firn
