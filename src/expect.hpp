// expect: checks a model's expectations (`expect` statements) against its
// results: a member's enveloped moment, shear, axial force or deflection, a
// reaction, a displacement or rotation, or a derived snow value. A stage after
// the envelopes; `firn check` and the report print what it finds.
#pragma once

#include <string>
#include <vector>

#include "combinations.hpp"
#include "diag.hpp"
#include "loads.hpp"
#include "model.hpp"
#include "results.hpp"
#include "solve.hpp"

namespace firn {

/// A value an expectation was checked against: where it is and what gives it.
struct Finding {
    std::string place;      ///< the member or node; empty for a snow value
    double value = 0.0;     ///< SI
    double bound = 0.0;     ///< the bound it was held to (the nearer one of `between`), SI
    double margin = 0.0;    ///< how far inside the bound, tolerance included; < 0: failed
    double position = 0.0;  ///< m from a member's start node
    bool on_member = false;
    std::string governing;  ///< the case or combination that gives the value
};

/// The outcome of one `expect` statement: every place it names is checked.
struct ExpectationOutcome {
    std::size_t expectation = 0;    ///< its index in Model::expectations
    std::vector<Finding> failures;  ///< in the order of the places
    Finding closest;                ///< the place with the least margin
    bool checked = false;           ///< false when the statement had an error (reported)
    bool passed() const { return checked && failures.empty(); }
};

/// What the results of an analysed model need to be checked.
struct CheckInputs {
    const Model& model;
    const LoadSet& loads;
    const Solution& solution;
    const Results& results;
    const CombinationList& combinations;
    const std::vector<Envelopes>& envelopes;
};

/// Checks every expectation of the model in statement order. A source (`under`) or snow
/// value that does not exist is reported to `diagnostics` and its outcome is unchecked.
std::vector<ExpectationOutcome> check_expectations(const CheckInputs& in, Diagnostics& diagnostics);

/// The unit the model reports an expectation's values in; nothing for a plain number.
const DisplayUnit* expectation_unit(const Model& model, const Expectation& x);

/// `value` in the unit the model reports the expectation's quantity in: "45.23 kip*ft".
std::string show_expected_value(const Model& model, const Expectation& x, double value);

/// The bound as the canonical text writes it, in report units: "<= 45.00 kip*ft",
/// "between -60.00 kip*ft and 45.00 kip*ft", with "within ..." when there is a tolerance.
std::string show_bound(const Model& model, const Expectation& x);

/// Where a finding is and what gives it: "eave.BC has 47.100 kip*ft at 12.000 ft under
/// asce7_16.strength.3/2" ("the value is 30.8 psf" for a snow value).
std::string describe_finding(const Model& model, const Expectation& x, const Finding& f);

/// "2.100 kip*ft beyond the bound (4.7 %)" or "margin 1.200 kip*ft (2.6 %)", the percentage
/// of the bound.
std::string describe_margin(const Model& model, const Expectation& x, const Finding& f);

}  // namespace firn
