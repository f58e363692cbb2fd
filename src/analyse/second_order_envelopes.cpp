// second_order_envelopes: the envelopes of a set whose combinations are each
// solved to second order (superposition does not hold, so each combination is
// its own solve). The rules of the first-order envelopes hold: the furthest
// value from zero, the first combination on a tie judged against the largest
// value of its kind.
#include <algorithm>
#include <cmath>

#include "analyse/analyse.hpp"
#include "analyse/results_internal.hpp"
#include "base/parallel.hpp"

namespace firn {
namespace {

/// The combination whose extreme of function f goes furthest in direction sign.
Governing furthest(std::span<const SecondOrderResults> solved, std::size_t m, std::size_t f,
                   double sign, double tie) {
    Governing g;
    for (std::size_t k = 0; k < solved.size(); ++k) {
        if (solved[k].extremes.empty())
            continue;
        const SignedExtremes& e = solved[k].extremes[m];
        const Extreme& x = sign > 0.0 ? e.max[f] : e.min[f];
        if (sign * x.value > sign * g.value + tie)
            g = Governing{x.value, x.position, k, sign > 0.0 ? e.max_with[f] : e.min_with[f]};
    }
    return g;
}

MemberEnvelope member_envelope(std::span<const SecondOrderResults> solved, std::size_t m) {
    std::array<double, 4> tie{};
    for (const SecondOrderResults& s : solved) {
        if (s.extremes.empty())
            continue;
        for (std::size_t f = 0; f < tie.size(); ++f) {
            double largest = std::max(std::abs(s.extremes[m].max[f].value),
                                      std::abs(s.extremes[m].min[f].value));
            tie[f] = std::max(tie[f], kTie * largest);
        }
    }
    auto up = [&](std::size_t f) { return furthest(solved, m, f, 1.0, tie[f]); };
    auto down = [&](std::size_t f) { return furthest(solved, m, f, -1.0, tie[f]); };
    return MemberEnvelope{up(f_moment), down(f_moment), up(f_shear),      down(f_shear),
                          up(f_axial),  down(f_axial),  up(f_deflection), down(f_deflection)};
}

}  // namespace

Envelopes compute_second_order_envelopes(const Model& model, const LoadSet& loads,
                                         std::span<const Combination> combinations,
                                         const SecondOrderOptions& options,
                                         const SourceRange& where, Diagnostics& diagnostics,
                                         std::vector<SecondOrderOutcome>& outcomes) {
    std::vector<SecondOrderResults> solved(combinations.size());
    std::vector<Diagnostics> found(combinations.size());  // one per combination: workers share none
    for_each_chunk(combinations.size(), [&](std::size_t first, std::size_t last) {
        for (std::size_t k = first; k < last; ++k)
            solved[k] = solve_second_order(model, loads, combinations[k], options, where, found[k]);
    });
    for (const Diagnostics& d : found) {
        for (const Diagnostic& item : d.all())
            diagnostics.error(item.where, item.message);
    }
    Envelopes out;
    outcomes.clear();
    for (SecondOrderResults& s : solved)
        outcomes.push_back(s.outcome);
    if (std::any_of(found.begin(), found.end(),
                    [](const Diagnostics& d) { return d.has_errors(); }))
        return out;
    for (SecondOrderResults& s : solved)
        out.combinations.push_back(s.results);
    out.members.resize(model.members.size());
    for (std::size_t m = 0; m < out.members.size(); ++m)
        out.members[m] = member_envelope(solved, m);
    const std::vector<CaseResults>& c = out.combinations;
    out.reactions.resize(model.supports.size());
    for (std::size_t s = 0; s < out.reactions.size(); ++s) {
        out.reactions[s] = component_envelope(
            c.size(), [&](std::size_t k) -> const auto& { return c[k].reactions[s]; });
    }
    out.displacements.resize(model.nodes.size());
    for (std::size_t n = 0; n < out.displacements.size(); ++n) {
        out.displacements[n] = component_envelope(
            c.size(), [&](std::size_t k) -> const auto& { return c[k].displacements[n]; });
    }
    return out;
}

}  // namespace firn
