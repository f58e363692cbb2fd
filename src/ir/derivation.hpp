// derivation: what the derive stage finds from the resolved model before
// anything is solved: the load cases the snow provisions and `arrange`
// requests make, and the record of how (the traces, the named snow values).
// The Model itself stays as resolve left it; the driver joins the cases to it.
#pragma once

#include <string>
#include <vector>

#include "base/units.hpp"
#include "ir/model.hpp"

namespace firn {

/// One line of a trace: a derived value with its formula, the values put in, the
/// result and the clause; or a sentence saying why a provision does not apply.
struct TraceLine {
    std::string text;
    std::string clause;
    bool heading = false;  ///< starts a part: the site's data, or a roof
};

/// A derived snow value by name (`pf`, `main.ps`, `drift.main.step_left.hd`), SI, for
/// the expectations a model states about them.
struct SnowValue {
    std::string name;
    double value = 0.0;
    Dimension dimension;
};

/// The derive stage's record of one model.
struct Derivation {
    /// The derived load cases in order (the snow cases, then the arranged ones); the
    /// driver moves them to the end of `Model::cases` before anything is solved.
    std::vector<LoadCase> cases;
    std::vector<TraceLine> snow_trace;
    std::vector<SnowValue> snow_values;
    std::vector<TraceLine> arrangement_trace;
};

}  // namespace firn
