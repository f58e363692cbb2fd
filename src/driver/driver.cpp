// driver: parse -> resolve -> loads -> solve -> results.
#include "driver/driver.hpp"

#include <chrono>

#include "analyse/analyse.hpp"
#include "base/file_io.hpp"
#include "check/check.hpp"
#include "derive/derive.hpp"
#include "front/front.hpp"
#include "resolve/resolve.hpp"

namespace firn {
namespace {

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

    derive_snow(a.model, a.diagnostics);
    arrange_cases(a.model, a.diagnostics);
    if (a.diagnostics.has_errors())
        return a;
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
        a.envelopes.push_back(compute_envelopes(
            a.model, a.loads, a.solution, a.results,
            std::span(a.combinations.combinations).subspan(set.first, set.count)));
    }
    a.deflections = check_deflections(a.model, a.loads, a.solution, a.results);
    t.combinations = clock.lap();
    a.expectations = check_expectations(
        {a.model, a.loads, a.solution, a.results, a.combinations, a.envelopes}, a.diagnostics);
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
