// second_order_options: how a model's second-order combinations are analysed
// (the settings of its `combine` statement). Kept apart from second_order.hpp
// so that the model can hold them.
#pragma once

#include <cstddef>

namespace firn {

/// How second-order combinations are analysed.
struct SecondOrderOptions {
    /// Converged when the largest change of a member's axial force and of a
    /// node displacement between two iterations, each relative to the largest
    /// value of its kind, are both at most this.
    double tolerance = 1e-9;
    std::size_t max_iterations = 50;
    /// Notional load at each node: this times the vertical load there, along
    /// global x times notional_direction (AISC 360-16 C2.2b: 0.002 alpha).
    double notional_factor = 0.0;
    double notional_direction = 1.0;
    /// Factors on every member's E I and E A (AISC 360-16 C2.3: 0.8 tau_b, 0.8).
    double flexural_factor = 1.0;
    double axial_factor = 1.0;
};

}  // namespace firn
