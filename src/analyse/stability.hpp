// stability: the prismatic member under a constant axial force N (tension
// positive), exactly. With lambda = -N/EI, the bending moment obeys
// M'' + lambda M = qy and EI w'' = M, so every member function is a sum of the
// functions C_n(t) = sum_j (-lambda)^j t^(2j+n) / (2j+n)!: cos and sin under
// compression, cosh and sinh under tension, and the plain powers t^n/n! at
// N = 0. They are evaluated by their series near lambda t^2 = 0 (where the
// closed forms cancel) and in closed form elsewhere, so one code path covers
// compression, tension and no axial force, continuously. The member's
// stiffness (the stability functions s and s*c), its clamped end forces under
// load and its functions along the length all follow from them.
#pragma once

#include <array>
#include <span>

#include "analyse/element.hpp"
#include "ir/load_set.hpp"

namespace firn {

/// C_0(t) .. C_5(t) for one lambda: C_n' = C_(n-1) and C_0' = -lambda C_1.
using BasisValues = std::array<double, 6>;
BasisValues beam_column_basis(double lambda, double t);

/// The stability functions of a member under axial force `axial` (N, tension
/// positive): its end moment per end rotation is s EI/L at the turned end and
/// s c EI/L at the far end (s = 4, s c = 2 at N = 0).
struct StabilityFunctions {
    double s = 4.0, sc = 2.0;
};
StabilityFunctions stability_functions(const ElementProperties& e, double axial);

/// Whether a member under `axial` is below the buckling load of its own
/// clamped length (with its releases): the frame's critical load is never
/// above that, so a member beyond it means the frame has passed its critical
/// load too.
bool below_member_buckling(const ElementProperties& e, double axial);

/// The local stiffness under axial force (with the -N/L chord term of the
/// member's sway), released rotations condensed out as in local_stiffness.
/// Requires below_member_buckling(e, axial).
ElementMatrix second_order_stiffness(const ElementProperties& e, double axial);

/// The nodal loads equivalent to the member loads on the clamped member under
/// axial force: minus the end forces of the clamped member (not condensed).
ElementVector second_order_consistent_loads(const ElementProperties& e, double axial,
                                            std::span<const LocalDistributed> spread,
                                            std::span<const LocalPoint> points);

/// second_order_consistent_loads with the released rotations condensed out.
ElementVector second_order_condensed_loads(const ElementProperties& e, double axial,
                                           const ElementVector& consistent);

/// The local displacements with the released rotations filled in, and the end
/// forces the nodes apply to the member: k(N) d - f(N).
struct SecondOrderEnds {
    ElementVector displacements{}, forces{};
};
SecondOrderEnds second_order_end_forces(const ElementProperties& e, double axial,
                                        const ElementVector& d, const ElementVector& consistent);

}  // namespace firn
