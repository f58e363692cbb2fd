// second_order: what a second-order analysis of one combination is asked to do
// and what it found. Superposition does not hold under second-order effects, so
// each combination is solved on its own: its axial forces give the members'
// stiffness under axial force (P-Delta of the frame's sway and P-delta along
// each member), the frame is solved again, until the axial forces and
// displacements settle to the tolerance.
#pragma once

#include <array>
#include <cstddef>
#include <limits>
#include <vector>

#include "base/polynomial.hpp"
#include "ir/results.hpp"
#include "ir/second_order_options.hpp"

namespace firn {

/// One piece [a, b] of a member under second-order effects; t = s - a. With
/// lambda = -N/EI (N the member's constant axial force for P-delta) and qy =
/// q0 + q1 t: M(t) = m0 C0 + v0 C1 + q0 C2 + q1 C3 and w(t) = w0 + slope0 t +
/// (m0 C2 + v0 C3 + q0 C4 + q1 C5) / EI, the C_n of analyse's stability
/// functions; w is the local transverse displacement, `chord` the chord's.
struct BeamColumnPiece {
    double a = 0.0, b = 0.0;
    double lambda = 0.0, bending_rigidity = 0.0;
    double m0 = 0.0, v0 = 0.0, w0 = 0.0, slope0 = 0.0;
    double q0 = 0.0, q1 = 0.0;
    Polynomial axial;  ///< N along the piece, exact
};

/// A member's second-order functions: the pieces and the chord through its
/// displaced ends (w0 + slope s) from which deflection is measured.
struct BeamColumnFunctions {
    std::vector<BeamColumnPiece> pieces;
    double chord_w0 = 0.0, chord_slope = 0.0;
};

/// What the iteration of one combination did.
struct SecondOrderOutcome {
    bool converged = false;
    /// The combination is beyond the frame's critical load (a member past its
    /// own buckling load or a non-positive pivot): nothing else is valid.
    bool exceeded = false;
    std::size_t iterations = 0;
    double change = 0.0;  ///< the last relative change (see SecondOrderOptions::tolerance)
    /// The factor on the combination's axial forces at which the frame's
    /// stiffness becomes singular; infinity when no member is in compression.
    double critical_factor = std::numeric_limits<double>::infinity();
    /// 1 / (1 - 1 / critical_factor): how much the sway grows over first order.
    double amplification = 1.0;
    std::vector<double> axial;     ///< per member: the axial force used for P-delta, N
    std::vector<double> notional;  ///< per node: the notional load added along global x, N
};

/// The signed largest and smallest value of N, V, M and deflection along a
/// member (in that order), for envelopes.
struct SignedExtremes {
    std::array<Extreme, 4> max, min;
    /// N, V and M where each extreme occurs (what acts with it, for the envelopes).
    std::array<std::array<double, 3>, 4> max_with{}, min_with{};
};

/// A second-order combination: its results as for a case, and the outcome.
struct SecondOrderResults {
    CaseResults results;
    SecondOrderOutcome outcome;
    std::vector<SignedExtremes> extremes;  ///< per member
};

}  // namespace firn
