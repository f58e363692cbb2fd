// combine: combinations by superposition, and their envelopes.
//
// Everything after `solve` is linear in the loads, so a combination's node
// displacements and reactions are the factored sums of its cases'. A member's
// functions under a combination are those of one combined load: every case's
// local loads on it scaled by the case's factor, with the factored sum of its
// end displacements. They are built and summarized by results' own exact
// machinery (results_internal.hpp), so an extreme between two stations or on
// either side of a jump is never missed.
#include "analyse/analyse.hpp"

#include <algorithm>
#include <cassert>
#include <cmath>

#include "analyse/element.hpp"
#include "analyse/results_internal.hpp"
#include "base/parallel.hpp"

namespace firn {
namespace {

/// Runs work(first, last) over [0, count) in `parts` contiguous pieces (0: one
/// per hardware thread). Each piece writes only its own indices, so the output
/// does not depend on how the range is cut.
template <typename Work>
void in_parts(std::size_t count, std::size_t parts, Work work) {
    if (parts == 0) {
        for_each_chunk(count, work);
        return;
    }
    for_each_chunk(parts, [&](std::size_t first_part, std::size_t last_part) {
        for (std::size_t p = first_part; p < last_part; ++p)
            work(count * p / parts, count * (p + 1) / parts);
    });
}

/// A member in one case: its loads, local end displacements and consistent
/// loads. Its end forces under any combination follow from factored sums of
/// these; they are gathered once per case, however many combinations use it.
struct MemberCase {
    std::span<const LocalDistributed> spread;
    std::span<const LocalPoint> points;
    ElementVector displacements{}, consistent{};
};

/// Buffers one worker reuses for every member, so the member loop does not allocate.
struct Buffers {
    std::vector<MemberCase> cases;  ///< per case, of the member at hand (used cases only)
    std::vector<LocalDistributed> spread;
    std::vector<LocalPoint> points;
    Scratch functions;
    std::vector<FunctionExtremes> extremes;  ///< per combination, of the member at hand
};

/// Per case: 1 if some combination uses it.
std::vector<char> used_cases(const LoadSet& loads, std::span<const Combination> combinations) {
    std::vector<char> used(loads.cases.size(), 0);
    for (const Combination& k : combinations) {
        for (const CombinationTerm& term : k.terms) {
            assert(at(term.case_id) < used.size());
            used[at(term.case_id)] = 1;
        }
    }
    return used;
}

/// b.cases for member m.
void member_cases(const MemberInfo& info, const LoadSet& loads, const Solution& solution,
                  MemberId m, const std::vector<char>& used, Buffers& b) {
    b.cases.resize(loads.cases.size());
    for (std::size_t c = 0; c < used.size(); ++c) {
        if (!used[c])
            continue;
        MemberCase& mc = b.cases[c];
        mc.spread = loads.cases[c].distributed_on(m);
        mc.points = loads.cases[c].points_on(m);
        mc.displacements = local_displacements(solution, make_id<CaseId>(c), info);
        mc.consistent = consistent_loads(info.properties, mc.spread, mc.points);
    }
}

/// The member's loads in a combination, each scaled by its term's factor.
void gather_loads(const Combination& k, Buffers& b) {
    b.spread.clear();
    b.points.clear();
    for (const CombinationTerm& term : k.terms) {
        const MemberCase& mc = b.cases[at(term.case_id)];
        double f = term.factor;
        for (LocalDistributed q : mc.spread) {
            q.qx_a *= f;
            q.qx_b *= f;
            q.qy_a *= f;
            q.qy_b *= f;
            b.spread.push_back(q);
        }
        for (LocalPoint p : mc.points) {
            p.px *= f;
            p.py *= f;
            p.mz *= f;
            b.points.push_back(p);
        }
    }
}

/// The exact functions of a member under combination k, into b.functions
/// (b.cases holds the member in each case).
void build_combination(const MemberInfo& info, const Combination& k, Buffers& b) {
    gather_loads(k, b);
    ElementVector d{}, consistent{};
    for (const CombinationTerm& term : k.terms) {
        const MemberCase& e = b.cases[at(term.case_id)];
        for (std::size_t i = 0; i < d.size(); ++i) {
            d[i] += term.factor * e.displacements[i];
            consistent[i] += term.factor * e.consistent[i];
        }
    }
    ElementVector forces = local_end_forces(info.properties, d, consistent);
    build_functions(info, b.spread, b.points, forces, b.functions);
}

/// `sum += factor * add`, component by component.
void add_scaled(std::array<double, 3>& sum, double factor, const std::array<double, 3>& add) {
    for (std::size_t d = 0; d < 3; ++d)
        sum[d] += factor * add[d];
}

/// A combination's displacements, reactions and equilibrium: the factored sums
/// of its cases'. Its members are sized, not filled.
CaseResults node_results(const Model& model, const Results& results, const Combination& k) {
    CaseResults out;
    out.displacements.assign(model.nodes.size(), {0.0, 0.0, 0.0});
    out.reactions.assign(model.supports.size(), {0.0, 0.0, 0.0});
    out.members.resize(model.members.size());
    for (const CombinationTerm& term : k.terms) {
        const CaseResults& c = results.cases[at(term.case_id)];
        for (std::size_t n = 0; n < out.displacements.size(); ++n)
            add_scaled(out.displacements[n], term.factor, c.displacements[n]);
        for (std::size_t s = 0; s < out.reactions.size(); ++s)
            add_scaled(out.reactions[s], term.factor, c.reactions[s]);
        add_scaled(out.equilibrium.applied, term.factor, c.equilibrium.applied);
        add_scaled(out.equilibrium.reactions, term.factor, c.equilibrium.reactions);
        // A sum of balanced cases is balanced: superposition adds only round-off.
        out.equilibrium.relative_residual =
            std::max(out.equilibrium.relative_residual, c.equilibrium.relative_residual);
    }
    return out;
}

/// The combination whose extreme of function f goes furthest from zero in the
/// direction `sign` (+1: the largest, -1: the smallest), with the forces that
/// act with it; the first wins within `tie`.
Governing furthest(std::span<const FunctionExtremes> extremes, double sign, std::size_t f,
                   double tie) {
    Governing g;
    for (std::size_t k = 0; k < extremes.size(); ++k) {
        const FunctionExtremes& x = extremes[k];
        const Extreme& e = sign > 0.0 ? x.max[f] : x.min[f];
        if (sign * e.value > sign * g.value + tie)
            g = Governing{e.value, e.position, k, sign > 0.0 ? x.max_with[f] : x.min_with[f]};
    }
    return g;
}

/// A member's envelope from its extremes under every combination.
MemberEnvelope member_envelope(std::span<const FunctionExtremes> extremes) {
    // Ties are judged against the member's largest value of each function
    // over all combinations, as results does along one member.
    std::array<double, 4> tie{};
    for (const FunctionExtremes& e : extremes) {
        for (std::size_t f = 0; f < tie.size(); ++f) {
            double largest = std::max(std::abs(e.max[f].value), std::abs(e.min[f].value));
            tie[f] = std::max(tie[f], kTie * largest);
        }
    }
    auto up = [&](std::size_t f) { return furthest(extremes, 1.0, f, tie[f]); };
    auto down = [&](std::size_t f) { return furthest(extremes, -1.0, f, tie[f]); };
    return MemberEnvelope{up(f_moment), down(f_moment), up(f_shear),      down(f_shear),
                          up(f_axial),  down(f_axial),  up(f_deflection), down(f_deflection)};
}

/// Fills every combination's summary of members [first, last) and their envelopes.
void envelope_members(const Model& model, const LoadSet& loads, const Solution& solution,
                      std::span<const Combination> combinations, const std::vector<char>& used,
                      std::size_t first, std::size_t last, Envelopes& out) {
    Buffers b;
    b.extremes.resize(combinations.size());
    for (std::size_t m = first; m < last; ++m) {
        MemberId id = make_id<MemberId>(m);
        MemberInfo info = member_info(model, id);
        member_cases(info, loads, solution, id, used, b);
        for (std::size_t k = 0; k < combinations.size(); ++k) {
            build_combination(info, combinations[k], b);
            out.combinations[k].members[m] = summarize(b.functions, b.extremes[k]);
        }
        out.members[m] = member_envelope(b.extremes);
    }
}

}  // namespace

Envelopes compute_envelopes(const Model& model, const LoadSet& loads, const Solution& solution,
                            const Results& results, std::span<const Combination> combinations,
                            std::size_t parts) {
    Envelopes out;
    if (!solution.ok)
        return out;
    assert(results.cases.size() == loads.cases.size());
    out.combinations.resize(combinations.size());
    in_parts(combinations.size(), parts, [&](std::size_t first, std::size_t last) {
        for (std::size_t k = first; k < last; ++k)
            out.combinations[k] = node_results(model, results, combinations[k]);
    });
    out.members.resize(model.members.size());
    std::vector<char> used = used_cases(loads, combinations);
    in_parts(model.members.size(), parts, [&](std::size_t first, std::size_t last) {
        envelope_members(model, loads, solution, combinations, used, first, last, out);
    });
    const std::vector<CaseResults>& combined = out.combinations;
    out.reactions.resize(model.supports.size());
    for (std::size_t s = 0; s < out.reactions.size(); ++s) {
        out.reactions[s] = component_envelope(
            combined.size(), [&](std::size_t k) -> const auto& {
                return combined[k].reactions[s];
            });
    }
    out.displacements.resize(model.nodes.size());
    for (std::size_t n = 0; n < out.displacements.size(); ++n) {
        out.displacements[n] = component_envelope(
            combined.size(), [&](std::size_t k) -> const auto& {
                return combined[k].displacements[n];
            });
    }
    return out;
}

CaseResults combination_results(const Model& model, const LoadSet& loads, const Solution& solution,
                                const Results& results, const Combination& combination) {
    if (!solution.ok)
        return {};
    CaseResults out = node_results(model, results, combination);
    std::vector<char> used = used_cases(loads, {&combination, 1});
    for_each_chunk(model.members.size(), [&](std::size_t first, std::size_t last) {
        Buffers b;
        for (std::size_t m = first; m < last; ++m) {
            MemberId id = make_id<MemberId>(m);
            MemberInfo info = member_info(model, id);
            member_cases(info, loads, solution, id, used, b);
            build_combination(info, combination, b);
            out.members[m] = summarize(b.functions);
        }
    });
    return out;
}

MemberFunctions combination_functions(const Model& model, const LoadSet& loads,
                                      const Solution& solution, const Combination& combination,
                                      MemberId m) {
    MemberInfo info = member_info(model, m);
    Buffers b;
    member_cases(info, loads, solution, m, used_cases(loads, {&combination, 1}), b);
    build_combination(info, combination, b);
    return MemberFunctions{std::move(b.functions.pieces)};
}

}  // namespace firn
