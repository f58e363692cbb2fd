// derive: what follows from the resolved model before anything is solved: the
// snow provisions' load cases (each value traced to its clause), the
// arrangements of `arrange` requests, the combinations of the chosen sets, and
// every case's loads in member local axes. Directions, projections and self
// weight are settled here, once, so the solver and the result functions only
// ever see local, per-length loads.
#pragma once

#include "base/diag.hpp"
#include "ir/combinations.hpp"
#include "ir/derivation.hpp"
#include "ir/load_set.hpp"
#include "ir/model.hpp"

namespace firn {

/// The snow cases (NAME.balanced, NAME.minimum where it applies, ...), the trace of
/// every derived value and the values by name. Empty without snow data.
Derivation derive_snow(const Model& model, Diagnostics& diagnostics);

/// Adds the cases of every `arrange` request to `derivation` (after the cases it
/// holds), with a trace of the spans and arrangements.
void arrange_cases(const Model& model, Derivation& derivation, Diagnostics& diagnostics);

/// Every combination of the chosen sets, in set and rule order, each listed
/// once per set (a repeat of an earlier one in its set is left out).
CombinationList expand_combinations(const Model& model);

/// Reports each case a set by case names that is neither declared nor derived
/// (located at the name, with a suggestion); false if any. Run before solving.
bool check_combination_cases(const Model& model, const Derivation& derivation,
                             Diagnostics& diagnostics);

/// Derives local member loads for every case. The model is already checked by
/// `resolve`; problems found here (a projected load on a vertical member) are
/// reported as warnings.
LoadSet derive_loads(const Model& model, Diagnostics& diagnostics);

}  // namespace firn
