// element: the Euler-Bernoulli plane frame member. Stiffness, moment releases
// (hinges) and the nodal equivalents of member loads, in local axes, and the
// rotation between local and global axes.
#pragma once

#include <array>
#include <span>

#include "ir/load_set.hpp"
#include "ir/model.hpp"

namespace firn {

/// Six end values of one member, in the order u1, v1, theta1, u2, v2, theta2
/// (ORDER ELEMENT DOF): start node then end node, each in Dof order.
using ElementVector = std::array<double, 6>;
/// A 6x6 element matrix in the same order, row-major.
using ElementMatrix = std::array<ElementVector, 6>;

/// What the element needs to know about one member.
struct ElementProperties {
    double length = 0.0;
    double axial_rigidity = 0.0;    ///< E*A, N
    double bending_rigidity = 0.0;  ///< E*I, N*m^2
    bool hinge_start = false;       ///< the end rotation theta1 is released
    bool hinge_end = false;         ///< the end rotation theta2 is released
};
ElementProperties element_properties(const Model& model, MemberId member);

/// Local stiffness with the released end rotations condensed out: their rows
/// and columns are zero. Both ends released leaves an axial bar.
ElementMatrix local_stiffness(const ElementProperties& e);

/// Condenses the released end rotations out of k (and f, if given) by static
/// condensation: each takes whatever value makes its moment vanish.
void condense_released(const ElementProperties& e, ElementMatrix& k, ElementVector* f);

/// The local nodal loads doing the same work as the member loads on the
/// clamped (unreleased) member: the integrals of the loads against the
/// element's shape functions, exact for linear distributed loads.
ElementVector consistent_loads(const ElementProperties& e, std::span<const LocalDistributed> spread,
                               std::span<const LocalPoint> points);

/// `consistent_loads` with the released rotations condensed out, matching
/// `local_stiffness`: this is what the member adds to the structure's load vector.
ElementVector condensed_loads(const ElementProperties& e, const ElementVector& consistent);

/// The local end displacements `d` with the rotations of released ends filled
/// in: the rotations at which the released end moments vanish under the loads.
ElementVector with_released_rotations(const ElementProperties& e, const ElementVector& d,
                                      const ElementVector& consistent);

/// The forces and moments the nodes apply to the member's ends, local axes:
/// k d - f with the full stiffness, after filling in the released rotations.
ElementVector local_end_forces(const ElementProperties& e, const ElementVector& d,
                               const ElementVector& consistent);

/// Rotations between global and local axes of the member's end values.
ElementVector to_local(const ElementVector& global, const MemberGeometry& g);
ElementVector to_global(const ElementVector& local, const MemberGeometry& g);
/// T^T k T: a local element matrix in global axes.
ElementMatrix to_global(const ElementMatrix& local, const MemberGeometry& g);

}  // namespace firn
