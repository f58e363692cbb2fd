// solve: linear static analysis of the plane frame by the direct stiffness
// method. The stiffness is assembled sparse and factored once; every load case
// is a right-hand side of that one factorization.
#pragma once

#include <cstddef>
#include <vector>

#include "loads.hpp"
#include "model.hpp"

namespace firn {

/// Node displacements of every case. Rotations of nodes where every member is
/// hinged and nothing restrains rotation are undetermined; they are held at 0
/// and flagged in `rotation_free`.
struct Solution {
    std::size_t node_count = 0;
    std::size_t case_count = 0;
    std::vector<double> displacements;  ///< [case][node][Dof], m and rad, global
    std::vector<char> rotation_free;    ///< per node: 1 if its rotation is undetermined
    bool ok = false;                    ///< false if the structure is unstable

    double displacement(CaseId c, NodeId n, Dof d) const {
        return displacements[(at(c) * node_count + at(n)) * 3 + d];
    }
};

/// Wall-clock seconds of the phases of `solve`, for the bench target.
struct SolveTimings {
    double assemble = 0.0;
    double factor = 0.0;
    double solve = 0.0;
};

/// Solves every case. An unstable structure (a mechanism, a free node, a
/// missing restraint) is reported as an error that names a node and the
/// direction it is free to move in, and the returned Solution has ok == false.
Solution solve(const Model& model, const LoadSet& loads, Diagnostics& diagnostics,
               SolveTimings* timings = nullptr);

}  // namespace firn
