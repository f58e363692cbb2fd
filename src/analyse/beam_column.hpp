// beam_column: a member's functions along its length under second-order
// effects (BeamColumnPiece of ir/second_order.hpp), their values and their
// extremes. Private to analyse.
#pragma once

#include <span>

#include "analyse/element.hpp"
#include "analyse/results_internal.hpp"
#include "ir/load_set.hpp"
#include "ir/results.hpp"
#include "ir/second_order.hpp"

namespace firn {

/// N, V = dM/dx, M and the local transverse displacement w at t in a piece.
struct BeamColumnValues {
    double n = 0.0, v = 0.0, m = 0.0, w = 0.0, slope = 0.0;
};
BeamColumnValues evaluate(const BeamColumnPiece& p, double t);

/// The member's functions from its end state: `ends` are the local end
/// displacements (released rotations filled in) and the end forces the nodes
/// apply to it; `axial` the constant axial force of its stiffness.
BeamColumnFunctions build_beam_column(const ElementProperties& e, double axial,
                                      std::span<const LocalDistributed> spread,
                                      std::span<const LocalPoint> points,
                                      const ElementVector& displacements,
                                      const ElementVector& forces);

/// The member summary of second-order functions. Extremes are found by
/// sampling each piece's derivative at steps of at most a sixteenth of pi / k
/// (k = sqrt|lambda|; at least 16 steps) and refining every sign change by
/// bisection to round-off; the samples and piece ends are candidates too.
/// With `extremes`, also the signed largest and smallest value of each
/// function, for envelopes.
MemberSummary summarize(const BeamColumnFunctions& f, SignedExtremes* extremes = nullptr);

}  // namespace firn
