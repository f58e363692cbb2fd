// combine: load combinations and their envelopes, by superposition of the
// solved cases; a combination is never solved again. Member results are the
// exact functions of the combined member loads and end displacements, so an
// envelope's extremes are exact too, never samples at stations.
#pragma once

#include <array>
#include <cstddef>
#include <limits>
#include <span>
#include <string>
#include <vector>

#include "loads.hpp"
#include "model.hpp"
#include "results.hpp"
#include "solve.hpp"

namespace firn {

/// One factored case of a combination.
struct CombinationTerm {
    CaseId case_id{};
    double factor = 0.0;
};

/// A named sum of factored cases.
struct Combination {
    std::string name;
    std::vector<CombinationTerm> terms;
};

/// The combination index of an enveloped value that no combination reached.
inline constexpr std::size_t no_combination = std::numeric_limits<std::size_t>::max();

/// An enveloped value, where it occurs (m from the member's start node; 0 at
/// nodes and supports) and the index of the combination that gives it.
struct Governing {
    double value = 0.0;
    double position = 0.0;
    std::size_t combination = no_combination;
};

/// The extremes of one member over every combination and its whole length.
/// Each is the largest positive (or negative) value; 0 and no_combination
/// when no combination goes that way.
struct MemberEnvelope {
    Governing moment_max, moment_min;
    Governing shear_max, shear_min;  ///< largest +V, largest -V
    Governing tension, compression;  ///< largest +N, largest -N
    Governing deflection_max, deflection_min;
};

/// The greatest and least value of each component over every combination.
struct ComponentEnvelope {
    std::array<Governing, 3> max, min;
};
using ReactionEnvelope = ComponentEnvelope;      ///< per support: global Rx, Ry, M
using DisplacementEnvelope = ComponentEnvelope;  ///< per node: global dx, dy, rotation

struct Envelopes {
    std::vector<CaseResults> combinations;  ///< per combination, as for a case
    std::vector<MemberEnvelope> members;
    std::vector<ReactionEnvelope> reactions;
    std::vector<DisplacementEnvelope> displacements;
};

/// The results of every combination and their envelopes. Ties go to the first
/// combination. `parts`: how many pieces the work is cut into (0: one per
/// hardware thread); the output is the same for any. Empty if !solution.ok.
Envelopes compute_envelopes(const Model& model, const LoadSet& loads, const Solution& solution,
                            const Results& results, std::span<const Combination> combinations,
                            std::size_t parts = 0);

/// The results of one combination.
CaseResults combination_results(const Model& model, const LoadSet& loads, const Solution& solution,
                                const Results& results, const Combination& combination);

/// The exact functions of one member under one combination, for drawings.
MemberFunctions combination_functions(const Model& model, const LoadSet& loads,
                                      const Solution& solution, const Combination& combination,
                                      MemberId m);

}  // namespace firn
