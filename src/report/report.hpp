// report: results as deterministic text or JSON. Knows nothing of how the
// numbers were made; converts SI to the model's display units.
#pragma once

#include <functional>
#include <string>
#include <string_view>

#include "ir/analysis.hpp"
#include "ir/checks.hpp"
#include "ir/combinations.hpp"
#include "ir/derivation.hpp"
#include "ir/display.hpp"
#include "ir/mirror.hpp"
#include "ir/model.hpp"
#include "ir/results.hpp"
#include "ir/stations.hpp"

namespace firn {

/// The caution every report carries.
extern const char* const kCaution;

struct ReportOptions {
    bool full = false;  ///< every node's displacements and every member's end forces
    const Stations* stations = nullptr;                 ///< member stations to print, if any
    const CombinationList* combinations = nullptr;      ///< with `envelopes`: their sections
    const std::vector<Envelopes>* envelopes = nullptr;  ///< per set of combinations
    const std::vector<DeflectionCheck>* deflections = nullptr;
    const Mirror* mirror = nullptr;  ///< which cases and members mirror which
    const std::vector<ExpectationOutcome>* expectations = nullptr;  ///< per `expect`
    /// JSON: every number unrounded, as the shortest text that reads back to the same
    /// double, so other tools can check firn to round-off (the default rounds two
    /// decimals finer than the text report).
    bool exact_numbers = false;
    const Derivation* derivation = nullptr;  ///< the snow and arrangement traces
    /// Per set, each combination's second-order outcome (empty when first-order).
    const std::vector<std::vector<SecondOrderOutcome>>* second_order = nullptr;
    /// Combinations (indices into `combinations->combinations`) whose own results are
    /// printed in a case's layout. Text: with any, the report is the header, the summary
    /// when `summary_only`, and these; JSON: they are added as "combination_results".
    std::vector<std::size_t> chosen_combinations;
    /// Stations of the chosen combinations, in their order, with `full`.
    const Stations* combination_stations = nullptr;
    bool summary_only = false;  ///< text: the header and the design summary only
};

/// Receives a report piece by piece (a piece per load case at most), so a
/// large report never has to sit in memory whole.
using ReportSink = std::function<void(std::string_view)>;

/// The text report: the header, the design summary, the model echo, then per case
/// the equilibrium check, reactions, largest displacements and member extremes (and
/// with `full`, all displacements, end forces and stations), the combinations and
/// their envelopes, the checks. See ReportOptions for the shorter forms.
void write_text_report(const Model& model, const Results& results, const ReportOptions& options,
                       const ReportSink& sink);

/// The same results as JSON, in the model's display units (stated in "units").
void write_json_report(const Model& model, const Results& results, const ReportOptions& options,
                       const ReportSink& sink);

/// The whole report as one string, for tests and small models.
std::string text_report(const Model& model, const Results& results, const ReportOptions& options);
std::string json_report(const Model& model, const Results& results, const ReportOptions& options);

/// The bound as the canonical text writes it, in report units: "<= 45.00 kip*ft",
/// "between -60.00 kip*ft and 45.00 kip*ft", with "within ..." when there is a tolerance.
std::string show_bound(const Model& model, const Expectation& x);

/// Where a finding is and what gives it: "eave.BC has 47.100 kip*ft at 12.000 ft under
/// SET.3/2" ("the value is 30.8 psf" for a snow value).
std::string describe_finding(const Model& model, const Expectation& x, const Finding& f);

/// "2.100 kip*ft beyond the bound (4.7 %)" or "margin 1.200 kip*ft (2.6 %)", the percentage
/// of the bound.
std::string describe_margin(const Model& model, const Expectation& x, const Finding& f);

/// A step of a trace in words, its values in the model's display units.
std::string trace_text(const TraceStep& step, const DisplayUnits& units);

/// A step's clause as the report writes it: marked " *" when its values were
/// entered from memory.
std::string trace_clause(const TraceStep& step);

/// Report options with every section the analysis holds (no stations).
ReportOptions report_options(const Analysis& a);

/// The results of combination `k` (an index into list.combinations), as the envelopes
/// of its set hold them; nullptr when they were not computed.
const CaseResults* combination_case(const CombinationList& list,
                                    const std::vector<Envelopes>& envelopes, std::size_t k);

/// The model file as reports show it: as given, but never an absolute path.
std::string shown_source(const std::string& name);

}  // namespace firn
