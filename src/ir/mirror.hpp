// mirror: the map of whether the frame is its own mirror image about a vertical axis and,
// if so, which node, member and load case is the image of which. The report
// names the arrangements that mirror each other; every case is still analysed.
//
// Sign rules under the reflection x -> 2 axis - x (derived in mirror.cpp):
//  - global: Fx, Rx, dx, moments and rotations flip; Fy, Ry, dy are kept;
//  - a member whose image runs the same way (s -> s): qx, N kept; qy, V, M and
//    deflection flip; one whose image runs the other way (s -> L - s): qx, V
//    flip; qy, N, M and deflection kept. Point moments on members always flip.
#pragma once

#include <optional>
#include <vector>

#include "ir/model.hpp"

namespace firn {

/// Every comparison is relative: positions to 1e-9 of the frame's size (the
/// larger of its width and height), loads to 1e-9 of the case's load scale,
/// section and support properties to 1e-9 of their value.
inline constexpr double mirror_tolerance = 1e-9;

/// The frame's mirror map. When `symmetric` is false every vector is empty.
struct Mirror {
    bool symmetric = false;  ///< geometry, sections, hinges and supports mirror about x = axis
    double axis = 0.0;       ///< m: midway between the least and the greatest node x
    std::vector<std::optional<NodeId>> node;      ///< per node: its image (itself on the axis)
    std::vector<std::optional<MemberId>> member;  ///< per member: its image (itself on the axis)
    std::vector<bool> member_reversed;            ///< the image runs end to start: s maps to L - s
    /// Per load case: the case whose loads are its mirror image (itself when it is
    /// symmetric; else the first such case in declaration order), nullopt if none.
    std::vector<std::optional<CaseId>> case_mirror;
};

}  // namespace firn
