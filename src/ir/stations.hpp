// stations: member results at evenly spaced points, for the full report.
#pragma once

#include <cstddef>
#include <vector>

#include "ir/model.hpp"

namespace firn {

/// Internal actions and deflection at one point along a member.
struct Station {
    double position = 0.0;  ///< m from the start node
    double axial = 0.0, shear = 0.0, moment = 0.0, deflection = 0.0;
};

/// Stations of every member in every case: `per_member` points from the start
/// node to the end node (the ends included), member-major within a case.
struct Stations {
    std::size_t per_member = 0;
    std::vector<std::vector<Station>> cases;

    const Station* of(std::size_t c, std::size_t member) const {
        return cases[c].data() + member * per_member;
    }
};

}  // namespace firn
