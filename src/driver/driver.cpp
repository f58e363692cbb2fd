// driver: parse -> resolve -> derive -> names -> loads -> solve -> results -> checks.
#include "driver/driver.hpp"

#include <fmt/format.h>
#include <algorithm>
#include <chrono>
#include <iterator>

#include "analyse/analyse.hpp"
#include "base/file_io.hpp"
#include "check/check.hpp"
#include "derive/derive.hpp"
#include "front/front.hpp"
#include "resolve/resolve.hpp"

namespace firn {
namespace {

/// The cases that get solved: the model's own, then the derived ones in the order
/// the derive stage made them. The derivation keeps its traces and values.
void join_derived_cases(Model& model, Derivation& derivation) {
    std::move(derivation.cases.begin(), derivation.cases.end(), std::back_inserter(model.cases));
    derivation.cases.clear();
}

class Stopwatch {
  public:
    double lap() {
        auto now = std::chrono::steady_clock::now();
        double seconds = std::chrono::duration<double>(now - last_).count();
        last_ = now;
        return seconds;
    }

  private:
    std::chrono::steady_clock::time_point last_ = std::chrono::steady_clock::now();
};

/// The warning the combine statement asks for (critical_factor_warning): a
/// combination that the frame carries, but with little margin to buckling.
void warn_low_critical_factors(const Model& model, std::span<const Combination> combinations,
                               const std::vector<SecondOrderOutcome>& outcomes,
                               Diagnostics& diagnostics) {
    double limit = model.combine->critical_factor_warning;
    for (std::size_t k = 0; k < outcomes.size() && k < combinations.size(); ++k) {
        const SecondOrderOutcome& o = outcomes[k];
        if (!o.converged || !(o.critical_factor < limit))
            continue;
        diagnostics.warning(
            model.combine->where,
            fmt::format("combination '{}' has a critical load factor of {:.2f}, "
                        "below the {:g} stated; second-order effects amplify its "
                        "sway about {:.2f} times",
                        combinations[k].name, o.critical_factor, limit, o.amplification));
    }
}

}  // namespace

Analysis analyse_text(std::string name, std::string text, PhaseTimes* times,
                      const ImportOptions& options) {
    PhaseTimes local;
    PhaseTimes& t = times != nullptr ? *times : local;
    Analysis a;
    Stopwatch clock;
    a.model.source_name = name;
    FileId file = a.sources.add(std::move(name), std::move(text));
    std::vector<syntax::Tree> trees = load_model(a.sources, file, a.diagnostics, options);
    t.parse = clock.lap();
    if (a.diagnostics.has_errors())
        return a;

    std::string source_name = std::move(a.model.source_name);
    a.model = resolve(trees, a.diagnostics);
    a.model.source_name = std::move(source_name);
    t.resolve = clock.lap();
    if (a.diagnostics.has_errors())
        return a;

    a.derivation = derive_snow(a.model, a.diagnostics);
    arrange_cases(a.model, a.derivation, a.diagnostics);
    if (a.diagnostics.has_errors())
        return a;
    // Every case and value exists now: a name an expectation misspells stops the run
    // before anything is solved.
    bool expectations_named = check_expectation_names(a.model, a.derivation, a.diagnostics);
    bool combinations_named = check_combination_cases(a.model, a.derivation, a.diagnostics);
    if (!expectations_named || !combinations_named)
        return a;
    join_derived_cases(a.model, a.derivation);
    a.loads = derive_loads(a.model, a.diagnostics);
    a.mirror = find_mirror(a.model, a.loads);
    t.loads = clock.lap();
    if (a.diagnostics.has_errors())
        return a;

    SolveTimings st;
    a.solution = solve(a.model, a.loads, a.diagnostics, &st);
    t.assemble = st.assemble;
    t.factor = st.factor;
    t.solve = st.solve;
    clock.lap();
    if (a.diagnostics.has_errors() || !a.solution.ok)
        return a;

    a.results = compute_results(a.model, a.loads, a.solution);
    t.results = clock.lap();
    a.combinations = expand_combinations(a.model);
    for (const CombinationList::SetRange& set : a.combinations.sets) {
        auto combinations = std::span(a.combinations.combinations).subspan(set.first, set.count);
        a.second_order.emplace_back();
        if (a.model.combine && a.model.combine->second_order) {
            a.envelopes.push_back(compute_second_order_envelopes(
                a.model, a.loads, combinations, a.model.combine->second_order_options,
                a.model.combine->where, a.diagnostics, a.second_order.back()));
            warn_low_critical_factors(a.model, combinations, a.second_order.back(), a.diagnostics);
        } else {
            a.envelopes.push_back(
                compute_envelopes(a.model, a.loads, a.solution, a.results, combinations));
        }
    }
    if (a.diagnostics.has_errors())
        return a;
    a.deflections = check_deflections(a.model, a.loads, a.solution, a.results);
    t.combinations = clock.lap();
    a.expectations = check_expectations(
        {a.model, a.loads, a.solution, a.results, a.combinations, a.envelopes, a.derivation});
    a.ok = !a.diagnostics.has_errors();
    return a;
}

Analysis analyse_file(const std::string& path, PhaseTimes* times, const ImportOptions& options) {
    std::string text, error;
    if (!read_file(path, text, error)) {
        Analysis a;
        a.diagnostics.error_without_place(error);
        return a;
    }
    return analyse_text(path, std::move(text), times, options);
}

}  // namespace firn
