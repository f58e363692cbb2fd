// results: member force functions, member summaries, reactions and the
// equilibrium check of every case (the analyse stage computes them).
//
// Sign conventions (the report states them too):
//  - global x to the right, y up; moments and rotations counterclockwise positive;
//  - member local x from start to end node, local y = x turned 90 deg counterclockwise;
//  - axial force N: tension positive;
//  - bending moment M: positive when the local -y face is in tension (sagging for
//    a member drawn left to right); shear V = dM/dx;
//  - deflection: displacement along local y relative to the chord through the
//    member's displaced ends.
#pragma once

#include <array>
#include <vector>

#include "base/polynomial.hpp"
#include "ir/model.hpp"

namespace firn {

/// Exact internal actions along one piece [a, b] of a member (a, b measured from
/// its start node); t = s - a inside the piece.
struct FunctionPiece {
    double a = 0.0, b = 0.0;
    Polynomial axial, shear, moment, deflection;
};

/// The piecewise polynomial N, V, M and deflection of one member in one case.
/// Pieces break at every load start, end and point; values jump at point loads.
struct MemberFunctions {
    std::vector<FunctionPiece> pieces;
};

/// A value and where along the member (m from the start node) it occurs.
struct Extreme {
    double value = 0.0;
    double position = 0.0;
};

/// Internal actions at a member's ends and its extremes over its length.
struct MemberSummary {
    std::array<double, 3> start{};   ///< N, V, M just inside the start end
    std::array<double, 3> end{};     ///< N, V, M just inside the end
    Extreme moment_max, moment_min;  ///< largest positive and negative M (0 if none)
    Extreme shear_max;               ///< largest |V|, sign kept
    Extreme axial_max, axial_min;    ///< largest tension and compression (0 if none)
    Extreme deflection_max;          ///< largest |deflection|, sign kept
};

/// Sums over the whole structure, for the equilibrium check.
struct Equilibrium {
    std::array<double, 3> applied{};    ///< Fx, Fy, M about the origin of all loads
    std::array<double, 3> reactions{};  ///< the same for all support reactions
    double relative_residual = 0.0;     ///< |applied + reactions| / load scale
};

struct CaseResults {
    std::vector<std::array<double, 3>> displacements;  ///< per node, global dx, dy, rotation
    std::vector<std::array<double, 3>> reactions;      ///< per support, global Rx, Ry, M
    std::vector<MemberSummary> members;                ///< per member
    Equilibrium equilibrium;
};

struct Results {
    std::vector<CaseResults> cases;
    std::vector<char> rotation_free;  ///< per node: rotation undetermined (see Solution)
};

}  // namespace firn
