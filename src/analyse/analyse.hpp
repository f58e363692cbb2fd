// analyse: linear static analysis of the plane frame by the direct stiffness
// method, and what follows from the solved cases without solving again: exact
// member functions and summaries, combinations by superposition and their
// envelopes, deflection checks, stations, and the frame's mirror map. The
// stiffness is assembled sparse and factored once; every load case is a
// right-hand side of that one factorization. Eigen is used only in this stage.
#pragma once

#include <cstddef>
#include <span>
#include <vector>

#include "ir/checks.hpp"
#include "ir/combinations.hpp"
#include "ir/load_set.hpp"
#include "ir/mirror.hpp"
#include "ir/model.hpp"
#include "ir/results.hpp"
#include "ir/second_order.hpp"
#include "ir/solution.hpp"
#include "ir/stations.hpp"

namespace firn {

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

/// Results for every case (cases are processed in parallel; output is the same).
Results compute_results(const Model& model, const LoadSet& loads, const Solution& solution);

/// The exact functions of one member in one case, for reports and drawings.
MemberFunctions member_functions(const Model& model, const CaseLoads& loads,
                                 const Solution& solution, CaseId c, MemberId m);

/// The results of every combination and their envelopes. Ties go to the first
/// combination. `parts`: how many pieces the work is cut into (0: one per
/// hardware thread); the output is the same for any. Empty if !solution.ok.
Envelopes compute_envelopes(const Model& model, const LoadSet& loads, const Solution& solution,
                            const Results& results, std::span<const Combination> combinations,
                            std::size_t parts = 0);

/// The results of one combination.
CaseResults combination_results(const Model& model, const LoadSet& loads, const Solution& solution,
                                const Results& results, const Combination& combination);

/// The exact functions of one member under one combination, for drawings.
MemberFunctions combination_functions(const Model& model, const LoadSet& loads,
                                      const Solution& solution, const Combination& combination,
                                      MemberId m);

/// compute_stations for combinations: Stations::cases holds each of `combinations`
/// in its order, from its exact functions (the solved cases superposed).
Stations compute_combination_stations(const Model& model, const LoadSet& loads,
                                      const Solution& solution,
                                      std::span<const Combination> combinations,
                                      std::size_t per_member);

/// Every check the model's `deflection` statements ask for, in statement,
/// member and column order. A column with no case of its loads is left out.
std::vector<DeflectionCheck> check_deflections(const Model& model, const LoadSet& loads,
                                               const Solution& solution, const Results& results);

/// Finds the mirror map of `model` and mirrors each case of `loads` (derived
/// from `model`). Time grows with members x cases: cases are first paired by
/// a mirror-invariant fingerprint, then confirmed load by load.
Mirror find_mirror(const Model& model, const LoadSet& loads);

/// Evaluates the exact member functions at `per_member` evenly spaced points.
/// Where a value jumps (a point load), the value just before the point is used.
Stations compute_stations(const Model& model, const LoadSet& loads, const Solution& solution,
                          std::size_t per_member);

/// Solves one combination with second-order effects (P-Delta and P-delta,
/// notional loads and stiffness factors of `options`), iterating on the axial
/// forces. A combination beyond the frame's critical load, or one that does
/// not converge, is an error at `where` naming it; its results are then empty.
SecondOrderResults solve_second_order(const Model& model, const LoadSet& loads,
                                      const Combination& combination,
                                      const SecondOrderOptions& options, const SourceRange& where,
                                      Diagnostics& diagnostics);

/// The envelopes of combinations each solved to second order, and each one's
/// outcome (in `outcomes`). Empty envelopes when any combination fails (its
/// error is reported at `where`).
Envelopes compute_second_order_envelopes(const Model& model, const LoadSet& loads,
                                         std::span<const Combination> combinations,
                                         const SecondOrderOptions& options,
                                         const SourceRange& where, Diagnostics& diagnostics,
                                         std::vector<SecondOrderOutcome>& outcomes);

/// The smallest factor on the members' axial forces `axial` (per member, N,
/// tension positive) at which the frame's stiffness with stability functions
/// is singular; infinity when nothing is in compression or beyond 1e8.
double critical_load_factor(const Model& model, const std::vector<double>& axial,
                            const SecondOrderOptions& options = {});

}  // namespace firn
