// analysis: everything one run of the pipeline produced, as the commands, the
// reports and the drawings read it.
#pragma once

#include <vector>

#include "base/diag.hpp"
#include "ir/checks.hpp"
#include "ir/combinations.hpp"
#include "ir/derivation.hpp"
#include "ir/load_set.hpp"
#include "ir/mirror.hpp"
#include "ir/model.hpp"
#include "ir/results.hpp"
#include "ir/second_order.hpp"
#include "ir/solution.hpp"

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
    Model model;            ///< as resolved; the driver adds the derived cases before solving
    Derivation derivation;  ///< its traces and snow values (its cases are in `model`)
    LoadSet loads;
    Mirror mirror;
    Solution solution;
    Results results;
    CombinationList combinations;
    std::vector<Envelopes> envelopes;  ///< per chosen set of combinations
    /// Per chosen set, each combination's second-order outcome; empty sets when
    /// the model's combinations are first-order (superposed).
    std::vector<std::vector<SecondOrderOutcome>> second_order;
    std::vector<DeflectionCheck> deflections;
    std::vector<ExpectationOutcome> expectations;  ///< per `expect`, in statement order
    bool ok = false;
};

}  // namespace firn
