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

/// A value a trace step puts in or finds: SI, with what the report needs to show it
/// in the model's units.
struct TraceValue {
    enum class Kind {
        quantity,  ///< in the model's display unit for `dimension` (pressure, length,
                   ///< force per length, unit weight)
        angle,     ///< `value` in rad, shown in degrees with two decimals: "4.76 deg"
        number,    ///< a plain number with `decimals`, or the shortest form when -1
        text,      ///< a word or a name, `text`
        /// " = VALUE" in the model's length unit, or nothing when that unit is `text`
        /// (a formula written in that unit has shown the value already)
        length_unless
    };
    Kind kind = Kind::number;
    double value = 0.0;
    Dimension dimension = dim::number;
    int decimals = -1;
    std::string text;
};

/// Where a step's values come from.
enum class Provenance {
    derived,     ///< worked out from the values put in
    table,       ///< read from a table of the standard
    given,       ///< given by the user instead, with a reason
    from_memory  ///< of a clause whose values were entered from memory: verify them
};

/// One step of a trace: a derived value with its formula, the values put in, the
/// result and the clause; a sentence saying why a provision does not apply; or a
/// heading that starts a part (the site's data, a roof). The report writes it.
struct TraceStep {
    std::string formula;  ///< the text, with `{}` where each of `values` goes, in order
    std::vector<TraceValue> values;
    /// Values of this step named for expectations (`expect snow NAME`), in naming order.
    struct Name {
        std::string name;       ///< `pf`, `main.ps`, `drift.main.step_left.hd`
        std::size_t value = 0;  ///< into `values`
    };
    std::vector<Name> names;
    std::string clause;  ///< the standard's clause, or "override", or empty
    Provenance provenance = Provenance::derived;
    bool heading = false;
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
    std::vector<TraceStep> snow_trace;
    std::vector<TraceStep> arrangement_trace;  ///< text only: spans and arrangements
};

/// The named values of the snow trace, in the order the steps name them.
std::vector<SnowValue> snow_values(const Derivation& derivation);

}  // namespace firn
