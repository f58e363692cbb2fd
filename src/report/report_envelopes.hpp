// report_envelopes: the text report's combinations and envelopes sections.
#pragma once

#include <string>

#include "ir/checks.hpp"
#include "ir/combinations.hpp"
#include "ir/mirror.hpp"
#include "ir/model.hpp"
#include "ir/second_order.hpp"
#include "report/report.hpp"

namespace firn {

/// `== Load combinations ==`: the sets, the permissions taken, every
/// combination with its formula, and what was left out. Nothing without `combine`.
void write_combinations(std::string& out, const Model& model, const CombinationList& list);

/// `== Envelopes of SET ==` for each chosen set: per member group, each member's
/// largest M+, M-, V+, V-, tension and compression with position and governing
/// combination; reactions max and min; the largest displacements.
void write_envelopes(std::string& out, const Model& model, const CombinationList& list,
                     const std::vector<Envelopes>& envelopes);

/// `== Second-order analysis of SET ==` for each chosen set when the model's
/// combinations are solved to second order (report_second_order.cpp).
void write_second_order(std::string& out, const Model& model, const CombinationList& list,
                        const std::vector<std::vector<SecondOrderOutcome>>& outcomes);
/// Per support of the model, the largest and least of each component it restrains,
/// each with the other components of the same combination (of set `set` of `list`).
void write_reaction_sets(std::string& out, const Model& model, const CombinationList& list,
                         std::size_t set, const Envelopes& env);

/// The member groups the envelopes and the summary go by: each declared group, then
/// the members in none (all members when the model declares no group).
std::vector<MemberGroup> report_groups(const Model& model);

/// `== Design summary ==`: the failing checks, then per chosen set each member group's
/// governing forces with position, the forces acting with them and the combination
/// written out, and each support's reaction sets.
void write_design_summary(std::string& out, const Model& model, const ReportOptions& options);

/// `== Deflection checks ==`: per `deflection` statement, each member's worst
/// case under each column of its row, its deflection, the limit and the ratio.
void write_deflections(std::string& out, const Model& model,
                       const std::vector<DeflectionCheck>& checks);

/// `== Expectations ==`: each `expect` statement, whether it holds, its closest place
/// (or every failing one) and the margin. Nothing when the model states none.
void write_expectations(std::string& out, const Model& model,
                        const std::vector<ExpectationOutcome>& outcomes);

/// `== Mirror images ==`: with a frame symmetric about a vertical axis, the load
/// cases that mirror each other, those symmetric in themselves, and each
/// member's image. One line when the frame is not symmetric.
void write_mirror(std::string& out, const Model& model, const Mirror& mirror);

}  // namespace firn
