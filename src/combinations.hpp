// combinations: the combination sets a model chose (`combine`), expanded into
// sums of factored load cases. A symbol stands for the cases of its kind:
// D for every dead case together, L for every live case together (a case and
// its arrangements being alternatives), and Lr, S, R and W for one case of
// their kind at a time. `(A or B)` takes one alternative at a time, so roof
// live and snow are never added together. A case combined with dead load only
// (an ice dam) leaves the other variable loads of its combination out.
#pragma once

#include <string>
#include <vector>

#include "combine.hpp"
#include "model.hpp"

namespace firn {

struct CombinationList {
    /// The combinations of one chosen set: [first, first + count).
    struct SetRange {
        std::string name;
        std::size_t first = 0, count = 0;
    };
    std::vector<SetRange> sets;
    std::vector<Combination> combinations;
    std::vector<std::string> formulas;  ///< per combination: `1.2 D + 1.6 S.balanced`
    std::vector<std::string> notes;     ///< what was left out and why, for the report
};

/// Every combination of the chosen sets, in set and rule order, each listed
/// once per set (a repeat of an earlier one in its set is left out).
CombinationList expand_combinations(const Model& model);

}  // namespace firn
