// baseline: a model's results as a text file committed beside the model, so a
// change to the model shows in review as values that moved (`firn baseline`).
// Writing (baseline_write.cpp) and reading (baseline_read.cpp) live here; the
// comparison (baseline_compare.cpp) with tolerances per kind of value.
#pragma once

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "base/units.hpp"
#include "ir/analysis.hpp"

namespace firn {

/// The newest baseline format this firn writes and reads; bumped when a line
/// changes meaning.
inline constexpr int kBaselineFormat = 1;

/// One result: a stable key (`case D member AB moment_max`), its value as
/// written, its unit (empty for a ratio) and a note (an envelope's governing
/// combination), which is shown but never compared.
struct BaselineValue {
    std::string key;
    std::string text;    ///< the value as written
    double value = 0.0;  ///< `text` read back, in `unit`
    std::string unit;
    std::string note;
    std::size_t line = 0;  ///< in the file it was read from (0: made here)
};

/// The results of one model, in a stable order.
struct Baseline {
    int format = kBaselineFormat;
    std::string title;
    std::string source;  ///< the model file's name, without its folder
    std::string units;   ///< the report units, for readers
    std::vector<BaselineValue> values;
};

/// The baseline of an analysed model: every case's reactions, node
/// displacements and member extremes; every set's envelopes; every deflection
/// check. Values have six significant digits in the model's report units.
Baseline make_baseline(const Analysis& analysis);

/// The text of a baseline file: a header of comments (the caution among them),
/// the format, model, source and units lines, then one `KEY = VALUE UNIT` line each.
std::string baseline_text(const Baseline& baseline);

/// Where a model's baseline lives: MODEL.firn -> MODEL.baseline beside it.
std::string baseline_path(const std::string& model_path);

/// The model file's name without its folder, as a baseline's `source` line holds it.
std::string model_file_name(const std::string& model_path);

/// Reads a baseline file's text (`file` names it in messages). On failure
/// returns nothing and sets `error` to `FILE[:LINE]: error: message`.
std::optional<Baseline> read_baseline(std::string_view text, const std::string& file,
                                      std::string& error);

/// The format number on a baseline's `firn baseline N` line, or nothing when the
/// text is not a baseline at all (so that `update` never overwrites another file).
std::optional<int> baseline_format_of(std::string_view text);

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
    /// What the value is compared with: "moment", "force", "displacement", "rotation"...
    std::string quantity_kind;
    /// |new - old| over the largest |value| of its kind in either baseline: how much the
    /// change matters to a design (a moment against the largest moment), 0 to 2.
    double significance = 0.0;
};

/// A change that moves a value by more than this share of its kind's largest is
/// significant (chosen here: about the precision a design reads forces to).
inline constexpr double kSignificantShare = 0.01;

struct Comparison {
    std::size_t compared = 0;     ///< values in both
    std::size_t significant = 0;  ///< moved values with significance > kSignificantShare
    std::vector<ValueChange> changes;
    bool moved() const { return !changes.empty(); }
};

/// Compares a fresh baseline with a stored one: the moved values first, grouped by
/// what they belong to (a member, a node, a support) and the groups ordered by their
/// most significant change; in a group its moments and forces first, then the other
/// values, each by significance (ties in the fresh baseline's order); then the values
/// added, then the values removed.
Comparison compare_baselines(const Baseline& old, const Baseline& fresh,
                             const Tolerances& tolerances);

/// How many of the moved values a listing shows.
struct Listing {
    std::size_t top = 20;  ///< at most this many moved values (0: all)
    double noise = 0.001;  ///< moved values below this share of their kind's largest are
                           ///< counted but not listed (0: list them all)
};

/// The changes as aligned lines, two spaces in:
/// `member AB  moment_min  case D  -50.0000 -> -62.0000 kip*ft  +24.00 %  24.0 % of largest
/// moment`, then a line for the moved values left out by `listing`, if any.
std::string describe_changes(const Comparison& comparison, const Listing& listing = {});

}  // namespace firn
