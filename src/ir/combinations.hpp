// combinations: the combination sets a model chose (`combine`), expanded into
// sums of factored load cases. A symbol stands for the cases of its kind:
// D for every dead case together, L for every live case together (a case and
// its arrangements being alternatives), and Lr, S, R and W for one case of
// their kind at a time. `(A or B)` takes one alternative at a time, so roof
// live and snow are never added together. A case combined with dead load only
// (an ice dam) leaves the other variable loads of its combination out. In a set
// written `by case`, each symbol names a case (of any kind, `other` included),
// which stands for itself and its arrangements, one at a time.
//
// Also the shapes of their results: per-set envelopes with the governing combination.
#pragma once

#include <array>
#include <cstddef>
#include <limits>
#include <string>
#include <vector>

#include "ir/model.hpp"
#include "ir/results.hpp"

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
/// nodes and supports), the index of the combination that gives it, and what
/// acts with it there under that combination: a member's N, V, M (on the same
/// side of a jump as the value), a support's Rx, Ry, M, a node's dx, dy,
/// rotation. A member, a footing or a connection is designed for the set, not
/// for extremes that come from different combinations.
struct Governing {
    double value = 0.0;
    double position = 0.0;
    std::size_t combination = no_combination;
    std::array<double, 3> concurrent{};
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

}  // namespace firn
