// solution: the node displacements of every solved load case.
#pragma once

#include <cstddef>
#include <vector>

#include "ir/model.hpp"

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

}  // namespace firn
