// report_summary: the design summary at the top of the text report. What an
// engineer sizes members and footings from, on the first page: the checks that
// fail, then per chosen set each member group's governing forces with the forces
// that act with them and the governing combination's factors written out, then
// each support's reaction sets. The per-case detail follows it.
#include <fmt/format.h>
#include <algorithm>
#include <optional>
#include <set>

#include "base/number_format.hpp"
#include "report/report.hpp"
#include "report/report_envelopes.hpp"
#include "report/report_table.hpp"

namespace firn {
namespace {

using namespace report_detail;

/// A governing quantity of a member group: which envelope value, and which way is "furthest".
struct SummaryQuantity {
    const char* label;
    const Governing MemberEnvelope::*field;
    bool force;     ///< a force (else a moment)
    double toward;  ///< +1: the largest governs, -1: the smallest
};

constexpr std::array<SummaryQuantity, 6> kQuantities{{
    {"M+", &MemberEnvelope::moment_max, false, 1.0},
    {"M-", &MemberEnvelope::moment_min, false, -1.0},
    {"V+", &MemberEnvelope::shear_max, true, 1.0},
    {"V-", &MemberEnvelope::shear_min, true, -1.0},
    {"N+ tension", &MemberEnvelope::tension, true, 1.0},
    {"N- compression", &MemberEnvelope::compression, true, -1.0},
}};

/// The member of the group whose value of q goes furthest (the first on ties, as
/// printed), or none when no combination goes that way in any member.
std::optional<MemberId> governing_member(const Model& model, const Envelopes& env,
                                         const MemberGroup& group, const SummaryQuantity& q) {
    const DisplayUnit& unit = q.force ? model.units.force : model.units.moment;
    std::optional<MemberId> best;
    double best_shown = 0.0;
    for (MemberId m : group.members) {
        const Governing& g = env.members[at(m)].*q.field;
        if (g.combination == no_combination)
            continue;
        // Compared as printed, so that members equal up to round-off resolve to
        // the first one declared, on any machine.
        double shown = q.toward * round_to(unit.from_si(g.value), unit.decimals);
        if (!best || shown > best_shown) {
            best = m;
            best_shown = shown;
        }
    }
    return best;
}

/// The combinations a table names, each once, with their factors written out.
void write_formulas(std::string& out, const CombinationList& list, std::size_t first,
                    const std::set<std::size_t>& used) {
    if (used.empty())
        return;
    std::size_t width = 0;
    for (std::size_t k : used)
        width = std::max(width, list.combinations[first + k].name.size());
    for (std::size_t k : used) {
        out += "    ";
        append_left(out, list.combinations[first + k].name, width);
        out += fmt::format("  = {}\n", list.formulas[first + k]);
    }
}

void write_group_summary(std::string& out, const Model& model, const CombinationList& list,
                         std::size_t set, const Envelopes& env, const MemberGroup& group) {
    const DisplayUnits& u = model.units;
    const CombinationList::SetRange& range = list.sets[set];
    std::size_t name_w = std::string_view("member").size(), comb_w = 11;
    for (MemberId m : group.members)
        name_w = std::max(name_w, model.members[at(m)].name.size());
    for (std::size_t k = 0; k < range.count; ++k)
        comb_w = std::max(comb_w, list.combinations[range.first + k].name.size());
    out += fmt::format("{} ({} members)\n", group.name, group.members.size());
    Table t(out);
    t.name_column("quantity", 22).text_column("value").name_column("member", name_w);
    t.number_column("at", u.length);
    t.number_column("N", u.force).number_column("V", u.force).number_column("M", u.moment);
    t.name_column("combination", comb_w).end_row();
    std::set<std::size_t> used;
    for (const SummaryQuantity& q : kQuantities) {
        const DisplayUnit& unit = q.force ? u.force : u.moment;
        std::optional<MemberId> m = governing_member(model, env, group, q);
        if (!m)
            continue;
        const Governing& g = env.members[at(*m)].*q.field;
        t.name(fmt::format("{} [{}]", q.label, unit.name)).number(g.value, unit);
        t.name(model.members[at(*m)].name).number(g.position, u.length);
        t.number(g.concurrent[0], u.force).number(g.concurrent[1], u.force);
        t.number(g.concurrent[2], u.moment);
        t.name(list.combinations[range.first + g.combination].name).end_row();
        used.insert(g.combination);
    }
    write_formulas(out, list, range.first, used);
    out += '\n';
}

/// The combinations the reaction sets name, with their factors.
std::set<std::size_t> reaction_combinations(const Model& model, const Envelopes& env) {
    std::set<std::size_t> used;
    for (std::size_t s = 0; s < model.supports.size(); ++s) {
        for (std::size_t d = 0; d < 3; ++d) {
            if (model.supports[s].restraint[d].kind == Restraint::Kind::free)
                continue;
            for (const Governing* g : {&env.reactions[s].max[d], &env.reactions[s].min[d]}) {
                if (g->combination != no_combination)
                    used.insert(g->combination);
            }
        }
    }
    return used;
}

void write_set_summary(std::string& out, const Model& model, const CombinationList& list,
                       std::size_t set, const Envelopes& env) {
    const CombinationList::SetRange& range = list.sets[set];
    out += fmt::format("Set {} ({} combinations)\n\n", range.name, range.count);
    for (const MemberGroup& group : report_groups(model))
        write_group_summary(out, model, list, set, env, group);
    if (model.supports.empty())
        return;
    write_reaction_sets(out, model, list, set, env);
    out.pop_back();  // the table's blank line: the formulas belong to it
    write_formulas(out, list, range.first, reaction_combinations(model, env));
    out += '\n';
}

/// The failing expectations and deflection checks, or one line each that all hold.
void write_failing_checks(std::string& out, const Model& model, const ReportOptions& options) {
    if (options.expectations != nullptr && !options.expectations->empty()) {
        std::size_t failed = 0;
        for (const ExpectationOutcome& o : *options.expectations) {
            if (o.passed())
                continue;
            ++failed;
            const Expectation& x = model.expectations[o.expectation];
            std::string subject = x.subject + (x.source.empty() ? "" : " under " + x.source);
            out += fmt::format("FAILS  line {}: {} {}\n", x.where.begin.line, subject,
                               show_bound(model, x));
            for (const Finding& f : o.failures)
                out += fmt::format("       {}; {}\n", describe_finding(model, x, f),
                                   describe_margin(model, x, f));
        }
        out += fmt::format("Expectations: {} of {} hold.\n", options.expectations->size() - failed,
                           options.expectations->size());
    }
    if (options.deflections != nullptr && !model.deflection_limits.empty()) {
        std::size_t failed = 0;
        std::array<char, kNumberBuffer> buffer;
        for (const DeflectionCheck& c : *options.deflections) {
            if (c.passes())
                continue;
            ++failed;
            out += fmt::format("FAILS  deflection of {} ({}) under {}: ratio {} of l/{:g}\n",
                               model.members[at(c.member)].name, c.column, c.governing,
                               format_fixed(buffer.data(), c.ratio(), 3), c.n);
        }
        out += fmt::format("Deflection limits: {} of {} pass.\n",
                           options.deflections->size() - failed, options.deflections->size());
    }
}

}  // namespace

void write_design_summary(std::string& out, const Model& model, const ReportOptions& options) {
    out += "== Design summary ==\n\n";
    out +=
        "What governs, before the detail: the checks that fail, then per set of combinations "
        "each member group's largest forces (exact extremes over each member's length) with "
        "the member, the position from its start node, the forces N, V, M acting there under "
        "the same combination, and that combination's factors; then each support's reaction "
        "sets.\n\n";
    std::size_t before = out.size();
    write_failing_checks(out, model, options);
    if (out.size() != before)
        out += '\n';
    bool combined = options.combinations != nullptr && options.envelopes != nullptr &&
                    !options.combinations->sets.empty();
    if (!combined) {
        out += "No set of combinations is chosen (combine): each load case's results follow.\n\n";
        return;
    }
    const CombinationList& list = *options.combinations;
    for (std::size_t s = 0; s < list.sets.size() && s < options.envelopes->size(); ++s) {
        if (list.sets[s].count > 0)
            write_set_summary(out, model, list, s, (*options.envelopes)[s]);
    }
}

}  // namespace firn
