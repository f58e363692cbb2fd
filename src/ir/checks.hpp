// checks: the outcomes of the checks on the results: deflection limits (IBC Table
// 1604.3 rows from the library) and the expectations a model states.
#pragma once

#include <cmath>
#include <cstddef>
#include <string>
#include <vector>

#include "ir/model.hpp"

namespace firn {

/// One member under one column of its row: the worst case and how it compares.
struct DeflectionCheck {
    std::size_t limits = 0;  ///< into Model::deflection_limits
    MemberId member{};
    const char* column = "";  ///< "L or Lr", "S or W", "D + L"
    std::string governing;    ///< the case (or `D + L` sum) with the largest deflection
    double deflection =
        0.0;            ///< m, signed, relative to the chord (a cantilever: to its root's tangent)
    double span = 0.0;  ///< m: the member's length, twice it for a cantilever
    double n = 0.0;     ///< the limit is span / n
    bool cantilever = false;
    double ratio() const { return std::abs(deflection) / (span / n); }
    bool passes() const { return ratio() <= 1.0 + 1e-12; }
};

/// A value an expectation was checked against: where it is and what gives it.
struct Finding {
    std::string place;      ///< the member or node; empty for a snow value
    double value = 0.0;     ///< SI
    double bound = 0.0;     ///< the bound it was held to (the nearer one of `between`), SI
    double margin = 0.0;    ///< how far inside the bound, tolerance included; < 0: failed
    double position = 0.0;  ///< m from a member's start node
    bool on_member = false;
    std::string governing;  ///< the case or combination that gives the value
};

/// The outcome of one `expect` statement: every place it names is checked.
struct ExpectationOutcome {
    std::size_t expectation = 0;    ///< its index in Model::expectations
    std::vector<Finding> failures;  ///< in the order of the places
    Finding closest;                ///< the place with the least margin
    bool checked = false;           ///< false when the statement had an error (reported)
    bool passed() const { return checked && failures.empty(); }
};

}  // namespace firn
