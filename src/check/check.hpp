// check: holds a model's expectations (`expect` statements) to its results: a
// member's enveloped moment, shear, axial force or deflection, a reaction, a
// displacement or rotation, or a derived snow value. A stage after the
// envelopes; `firn check` and the report print what it finds.
#pragma once

#include <vector>

#include "base/diag.hpp"
#include "ir/checks.hpp"
#include "ir/combinations.hpp"
#include "ir/derivation.hpp"
#include "ir/load_set.hpp"
#include "ir/model.hpp"
#include "ir/results.hpp"
#include "ir/solution.hpp"

namespace firn {

/// What the results of an analysed model need to be checked.
struct CheckInputs {
    const Model& model;
    const LoadSet& loads;
    const Solution& solution;
    const Results& results;
    const CombinationList& combinations;
    const std::vector<Envelopes>& envelopes;
    const Derivation& derivation;  ///< the named snow values
};

/// Before anything is solved: reports every name an expectation uses that the model
/// and its derivation lack (an `under` source that is no case and no chosen set, a
/// snow value, a reaction at a node without support) and a bound that does not fit its
/// snow value. `model.cases` are the declared cases, `derivation.cases` the derived
/// ones. True when every expectation can be checked.
bool check_expectation_names(const Model& model, const Derivation& derivation,
                             Diagnostics& diagnostics);

/// Checks every expectation of the model in statement order, once
/// `check_expectation_names` has passed and the derived cases are the model's.
std::vector<ExpectationOutcome> check_expectations(const CheckInputs& in);

}  // namespace firn
