// deflection: serviceability checks of members against limits l/n (IBC Table
// 1604.3 rows from the library): each load a row's column names, at service
// level, the member's worst case against its limit.
#pragma once

#include <string>
#include <vector>

#include "loads.hpp"
#include "model.hpp"
#include "results.hpp"
#include "solve.hpp"

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

/// Every check the model's `deflection` statements ask for, in statement,
/// member and column order. A column with no case of its loads is left out.
std::vector<DeflectionCheck> check_deflections(const Model& model, const LoadSet& loads,
                                               const Solution& solution, const Results& results);

/// True if member `m` has an end that nothing else holds: no other member, no support.
bool is_cantilever(const Model& model, MemberId m);

}  // namespace firn
