// load_set: the loads of every case in member local axes, per unit length, as the
// derive stage leaves them for the solver and the result functions.
#pragma once

#include <cstdint>
#include <span>
#include <vector>

#include "ir/model.hpp"

namespace firn {

/// A distributed load in member local axes, per unit length of the member,
/// varying linearly from (qx_a, qy_a) at `a` to (qx_b, qy_b) at `b`
/// (distances along the member from its start node, 0 <= a < b <= length).
/// qx acts along local x (start to end), qy along local y (x turned 90 degrees
/// counterclockwise).
struct LocalDistributed {
    double a = 0.0, b = 0.0;
    double qx_a = 0.0, qx_b = 0.0;
    double qy_a = 0.0, qy_b = 0.0;
};

/// A concentrated action on a member at `a` along it: local forces px, py and a
/// counterclockwise moment mz.
struct LocalPoint {
    double a = 0.0;
    double px = 0.0, py = 0.0, mz = 0.0;
};

/// The loads of one case. Member loads are grouped by member (compressed rows:
/// the loads on member m are [first_x[m], first_x[m + 1])).
struct CaseLoads {
    std::vector<double> nodal;  ///< 3 per node (Dof order), global, N and N*m
    std::vector<std::uint32_t> first_distributed;
    std::vector<LocalDistributed> distributed;
    std::vector<std::uint32_t> first_point;
    std::vector<LocalPoint> points;

    std::span<const LocalDistributed> distributed_on(MemberId m) const {
        return {distributed.data() + first_distributed[at(m)],
                distributed.data() + first_distributed[at(m) + 1]};
    }
    std::span<const LocalPoint> points_on(MemberId m) const {
        return {points.data() + first_point[at(m)], points.data() + first_point[at(m) + 1]};
    }
};

/// Loads for every case of the model, in the model's case order.
struct LoadSet {
    std::vector<CaseLoads> cases;
};

}  // namespace firn
