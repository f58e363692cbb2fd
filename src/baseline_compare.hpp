// baseline_compare: which values of a fresh run moved away from a baseline, by
// more than a relative tolerance and an absolute floor for each kind of value.
#pragma once

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "baseline.hpp"
#include "units.hpp"

namespace firn {

/// A value moved when |new - old| > max(floor of its kind, relative * |old|).
struct Tolerances {
    double relative = 1e-4;  ///< 0.01 %
    struct Floor {
        Dimension dimension;
        double si = 0.0;   ///< in SI units of `dimension`
        std::string text;  ///< as given, for messages
    };
    std::vector<Floor> floors;  ///< the defaults, replaced kind by kind with --abs

    /// The floor of values of `dimension` (0 when no floor is set for it).
    double floor(Dimension dimension) const;
};

/// The defaults: force 1 N, moment 1 N*m, length and displacement 0.001 mm,
/// rotation and ratio 0.000001 (both plain numbers), pressure 1 Pa, force per
/// length 1 N/m.
Tolerances default_tolerances();

/// Sets the floor of one kind from `value` and `unit` ("0.01", "kip*ft"; the unit
/// `ratio` for ratios). False, with `error` set, if either is not understood.
bool set_floor(Tolerances& tolerances, std::string_view value, std::string_view unit,
               std::string& error);

/// One value that moved, appeared or went away.
struct ValueChange {
    enum class Kind { moved, added, removed };
    Kind kind = Kind::moved;
    std::string key;
    std::optional<BaselineValue> old_value, new_value;
    double old_in_new_unit = 0.0;  ///< the old value converted to the new value's unit
    /// (new - old) / old x 100: positive when the value grew in its own direction
    /// (-50 -> -62 is +24 %), negative when it shrank or changed sign; infinite when old is 0.
    double percent = 0.0;
};

struct Comparison {
    std::size_t compared = 0;  ///< values in both
    std::vector<ValueChange> changes;
    bool moved() const { return !changes.empty(); }
};

/// Compares a fresh baseline with a stored one: moved values sorted by the size
/// of their change in percent (largest first; ties in the fresh baseline's order),
/// then the values added, then the values removed.
Comparison compare_baselines(const Baseline& old, const Baseline& fresh,
                             const Tolerances& tolerances);

/// The changes as aligned lines, two spaces in:
/// `member AB  moment_min  case D  -50.0000 -> -62.0000 kip*ft  +24.00 %`.
std::string describe_changes(const Comparison& comparison);

}  // namespace firn
