// report_envelopes: the combinations a model was checked for, and per member
// group the enveloped forces with the position and the combination that
// governs each; then the reaction and displacement envelopes.
#include "report/report_envelopes.hpp"
#include "base/number_format.hpp"

#include <fmt/format.h>
#include <algorithm>

#include "report/report.hpp"
#include "report/report_table.hpp"

namespace firn {
namespace {

using namespace report_detail;

/// The combinations of one set, whose envelope is being written.
struct SetView {
    const CombinationList& list;
    const CombinationList::SetRange& range;

    std::string name(const Governing& g) const {
        return g.combination == no_combination
                   ? "-"
                   : list.combinations[range.first + g.combination].name;
    }
    std::size_t width() const {
        std::size_t w = std::string_view("combination").size();
        for (std::size_t c = 0; c < range.count; ++c)
            w = std::max(w, list.combinations[range.first + c].name.size());
        return w;
    }
};

/// The member tables' groups: each declared group, then the members in none
/// (all members when the model declares no group).
std::vector<MemberGroup> envelope_groups(const Model& model) {
    std::vector<MemberGroup> groups = model.groups;
    std::vector<char> grouped(model.members.size(), 0);
    for (const MemberGroup& g : groups) {
        for (MemberId m : g.members)
            grouped[at(m)] = 1;
    }
    MemberGroup rest{groups.empty() ? "all members" : "members in no group", {}};
    for (std::size_t m = 0; m < model.members.size(); ++m) {
        if (!grouped[m])
            rest.members.push_back(make_id<MemberId>(m));
    }
    if (!rest.members.empty())
        groups.push_back(std::move(rest));
    return groups;
}

struct EnvelopeColumn {
    const char* label;  ///< followed by its unit
    const Governing MemberEnvelope::*field;
    bool force;  ///< a force (else a moment)
};

constexpr std::array<EnvelopeColumn, 6> kEnvelopeColumns{{
    {"M+", &MemberEnvelope::moment_max, false},
    {"M-", &MemberEnvelope::moment_min, false},
    {"V+", &MemberEnvelope::shear_max, true},
    {"V-", &MemberEnvelope::shear_min, true},
    {"N+ tension", &MemberEnvelope::tension, true},
    {"N- compression", &MemberEnvelope::compression, true},
}};

void write_member_group(std::string& out, const Model& model, const SetView& set,
                        const Envelopes& env, const MemberGroup& group) {
    const DisplayUnits& u = model.units;
    out += fmt::format("{} ({} members)\n", group.name, group.members.size());
    std::size_t width = std::string_view("member").size();
    for (MemberId m : group.members)
        width = std::max(width, model.members[at(m)].name.size());
    Table t(out);
    t.name_column("member", width).name_column("quantity", 22);
    t.text_column("value").number_column("at", u.length);
    t.number_column("N", u.force).number_column("V", u.force).number_column("M", u.moment);
    t.name_column("combination", set.width());
    t.end_row();
    for (MemberId m : group.members) {
        const MemberEnvelope& e = env.members[at(m)];
        bool first = true;
        for (const EnvelopeColumn& q : kEnvelopeColumns) {
            const Governing& g = e.*q.field;
            const DisplayUnit& unit = q.force ? u.force : u.moment;
            t.name(first ? std::string_view(model.members[at(m)].name) : "");
            t.name(fmt::format("{} [{}]", q.label, unit.name));
            t.number(g.value, unit).number(g.position, u.length);
            t.number(g.concurrent[0], u.force).number(g.concurrent[1], u.force);
            t.number(g.concurrent[2], u.moment);
            t.name(set.name(g));
            t.end_row();
            first = false;
        }
    }
    out +=
        "  (N, V, M: the forces acting there under the same combination; 0 and - where no "
        "combination goes that way)\n\n";
}

/// Per support, the largest and least of each component it restrains, each with
/// the other components of the same combination: the sets a footing, a base
/// plate or an anchorage is designed for.
void write_reaction_table(std::string& out, const Model& model, const SetView& set,
                          const Envelopes& env) {
    const DisplayUnits& u = model.units;
    out += "Reaction sets (each extreme with the other components of its combination)\n";
    std::size_t width = std::string_view("node").size();
    for (const Support& s : model.supports)
        width = std::max(width, model.nodes[at(s.node)].name.size());
    Table t(out);
    t.name_column("node", width).name_column("extreme", 6);
    t.number_column("Rx", u.force).number_column("Ry", u.force).number_column("M", u.moment);
    t.name_column("combination", set.width());
    t.end_row();
    static constexpr std::array<const char*, 3> kComponents{"Rx", "Ry", "M"};
    for (std::size_t s = 0; s < model.supports.size(); ++s) {
        const Support& support = model.supports[s];
        bool first = true;
        for (std::size_t d = 0; d < 3; ++d) {
            if (support.restraint[d].kind == Restraint::Kind::free)
                continue;  // always 0: nothing to design for
            const ComponentEnvelope& e = env.reactions[s];
            for (bool largest : {true, false}) {
                const Governing& g = largest ? e.max[d] : e.min[d];
                t.name(first ? std::string_view(model.nodes[at(support.node)].name) : "");
                t.name(fmt::format("{} {}", kComponents[d], largest ? "max" : "min"));
                t.number(g.concurrent[0], u.force).number(g.concurrent[1], u.force);
                t.number(g.concurrent[2], u.moment).name(set.name(g));
                t.end_row();
                first = false;
            }
        }
    }
    out +=
        "  (reactions act on the structure: Ry max is the largest downward force on the "
        "support, Ry min below 0 an uplift)\n\n";
}

}  // namespace

void write_reaction_sets(std::string& out, const Model& model, const CombinationList& list,
                         std::size_t set, const Envelopes& env) {
    write_reaction_table(out, model, SetView{list, list.sets[set]}, env);
}

std::vector<MemberGroup> report_groups(const Model& model) {
    return envelope_groups(model);
}

namespace {

/// The largest displacement of any node in each direction, both ways.
void write_displacement_envelope(std::string& out, const Model& model, const SetView& set,
                                 const Envelopes& env) {
    const DisplayUnits& u = model.units;
    out += "Largest displacements\n";
    Table t(out);
    t.name_column("", 12).name_column("node", name_width(model.nodes, "node"));
    t.name_column("value", 14).name_column("combination", set.width());
    t.end_row();
    static constexpr std::array<const char*, 3> kDirections{"dx", "dy", "rotation"};
    for (std::size_t d = 0; d < 3; ++d) {
        const DisplayUnit& unit = d == dof_rotation ? u.rotation : u.displacement;
        for (bool largest : {true, false}) {
            std::size_t best = 0;
            for (std::size_t n = 1; n < env.displacements.size(); ++n) {
                double v = (largest ? env.displacements[n].max : env.displacements[n].min)[d].value;
                double b =
                    (largest ? env.displacements[best].max : env.displacements[best].min)[d].value;
                if (largest ? v > b : v < b)
                    best = n;
            }
            const Governing& g =
                (largest ? env.displacements[best].max : env.displacements[best].min)[d];
            std::array<char, kNumberBuffer> buffer;
            t.name(fmt::format("{} {}", kDirections[d], largest ? "max" : "min"));
            t.name(model.nodes[best].name);
            t.name(fmt::format("{} {}",
                               format_fixed(buffer.data(), unit.from_si(g.value), unit.decimals),
                               unit.name));
            t.name(set.name(g));
            t.end_row();
        }
    }
    out += "\n";
}

}  // namespace

void write_combinations(std::string& out, const Model& model, const CombinationList& list) {
    if (!model.combine)
        return;
    out += "== Load combinations ==\n\n";
    for (std::size_t s : model.combine->sets)
        out += fmt::format("Set {}\n", model.combination_sets[s].name);
    if (model.combine->half_live) {
        out += fmt::format("0.5 L taken for 1.0 L where the set permits: \"{}\"\n",
                           model.combine->half_live_reason);
    }
    out += '\n';
    std::size_t width = 0;
    for (const Combination& c : list.combinations)
        width = std::max(width, c.name.size());
    for (std::size_t c = 0; c < list.combinations.size(); ++c) {
        out += "  ";
        append_left(out, list.combinations[c].name, width);
        out += fmt::format("  {}\n", list.formulas[c]);
    }
    if (!list.notes.empty()) {
        out += "\nNotes\n";
        for (const std::string& note : list.notes)
            out += fmt::format("  {}\n", note);
    }
    out += '\n';
}

/// The largest residual (applied + reactions) of any combination of a set, component by
/// component: the combinations' equilibrium check, as each case has its own.
namespace {

void write_combination_residual(std::string& out, const Model& model, const Envelopes& e) {
    std::array<double, 3> worst{};
    for (const CaseResults& c : e.combinations) {
        for (std::size_t k = 0; k < 3; ++k) {
            double r = c.equilibrium.applied[k] + c.equilibrium.reactions[k];
            worst[k] = std::max(worst[k], std::abs(r));
        }
    }
    const DisplayUnits& u = model.units;
    std::string fx, fy, m;
    append_fixed(fx, u.force.from_si(worst[0]), u.force.decimals);
    append_fixed(fy, u.force.from_si(worst[1]), u.force.decimals);
    append_fixed(m, u.moment.from_si(worst[2]), u.moment.decimals);
    out += fmt::format(
        "Equilibrium: the largest residual of any combination (applied + reactions) is Fx {} "
        "{}, Fy {} {}, M {} {}.\n\n",
        fx, u.force.name, fy, u.force.name, m, u.moment.name);
}

}  // namespace

void write_envelopes(std::string& out, const Model& model, const CombinationList& list,
                     const std::vector<Envelopes>& envelopes) {
    for (std::size_t s = 0; s < list.sets.size() && s < envelopes.size(); ++s) {
        const CombinationList::SetRange& range = list.sets[s];
        if (range.count == 0)
            continue;
        SetView set{list, range};
        out += fmt::format("== Envelopes of {} ==\n\n", range.name);
        out +=
            "Each value is the extreme over the member's whole length (exact, not sampled), "
            "at its position from the start node, with the combination that gives it.\n\n";
        write_combination_residual(out, model, envelopes[s]);
        for (const MemberGroup& group : envelope_groups(model))
            write_member_group(out, model, set, envelopes[s], group);
        if (!model.supports.empty())
            write_reaction_table(out, model, set, envelopes[s]);
        write_displacement_envelope(out, model, set, envelopes[s]);
    }
}

namespace {

void write_deflection_row(Table& t, const Model& model, const DeflectionCheck& c) {
    const DisplayUnits& u = model.units;
    std::array<char, kNumberBuffer> buffer;
    t.name(model.members[at(c.member)].name).name(c.column).name(c.governing);
    t.number(c.deflection, u.displacement).number(c.span, u.length);
    t.name(fmt::format("l/{:g}", c.n)).number(c.span / c.n, u.displacement);
    t.text(format_fixed(buffer.data(), c.ratio(), 3)).name(c.passes() ? "ok" : "FAILS");
    t.end_row();
}

}  // namespace

void write_deflections(std::string& out, const Model& model,
                       const std::vector<DeflectionCheck>& checks) {
    if (model.deflection_limits.empty())
        return;
    const DisplayUnits& u = model.units;
    out += "== Deflection checks ==\n\n";
    out +=
        "Deflection from the chord through the member's displaced ends, at service level "
        "(each case alone; D + L as one sum); a cantilever's from the tangent at its root, "
        "with l twice its length. A span of several members is checked member by member.\n\n";
    for (std::size_t i = 0; i < model.deflection_limits.size(); ++i) {
        const DeflectionLimits& limits = model.deflection_limits[i];
        out += fmt::format("Row {}   [{}]\n", limits.row, limits.source);
        std::size_t member_w = std::string_view("member").size(), case_w = 10;
        for (const DeflectionCheck& c : checks) {
            member_w = std::max(member_w, model.members[at(c.member)].name.size());
            case_w = std::max(case_w, c.governing.size());
        }
        Table t(out);
        t.name_column("member", member_w).name_column("load", 7).name_column("worst case", case_w);
        t.number_column("deflection", u.displacement).number_column("l", u.length);
        t.name_column("limit", 6).number_column("limit", u.displacement);
        t.text_column("ratio").name_column("check", 5);
        t.end_row();
        for (const DeflectionCheck& c : checks) {
            if (c.limits == i)
                write_deflection_row(t, model, c);
        }
        out += '\n';
    }
}

void write_expectations(std::string& out, const Model& model,
                        const std::vector<ExpectationOutcome>& outcomes) {
    if (outcomes.empty())
        return;
    std::size_t failed = 0;
    for (const ExpectationOutcome& o : outcomes)
        failed += o.passed() ? 0U : 1U;
    out += "== Expectations ==\n\n";
    out += fmt::format(
        "Bounds the model states on its results (expect); `firn check` fails when one does not "
        "hold. {} of {} hold.\n\n",
        outcomes.size() - failed, outcomes.size());
    for (const ExpectationOutcome& o : outcomes) {
        const Expectation& x = model.expectations[o.expectation];
        std::string subject = x.subject + (x.source.empty() ? "" : " under " + x.source);
        out += fmt::format("line {}: {} {}\n", x.where.begin.line, subject, show_bound(model, x));
        if (o.passed()) {
            out += fmt::format("  holds: {}; {}\n", describe_finding(model, x, o.closest),
                               describe_margin(model, x, o.closest));
        }
        for (const Finding& f : o.failures)
            out += fmt::format("  FAILS: {}; {}\n", describe_finding(model, x, f),
                               describe_margin(model, x, f));
        if (!x.reason.empty())
            out += fmt::format("  because \"{}\"\n", x.reason);
    }
    out += '\n';
}

void write_mirror(std::string& out, const Model& model, const Mirror& mirror) {
    out += "== Mirror images ==\n\n";
    if (!mirror.symmetric) {
        out +=
            "The frame is not symmetric about a vertical axis (geometry, sections, hinges "
            "and supports).\n\n";
        return;
    }
    const DisplayUnit& length = model.units.length;
    std::array<char, kNumberBuffer> buffer;
    out += fmt::format("The frame is symmetric about x = {} {}; every case is still analysed.\n",
                       format_fixed(buffer.data(), length.from_si(mirror.axis), length.decimals),
                       length.name);
    std::vector<std::string> pairs, own, none;
    for (std::size_t c = 0; c < model.cases.size(); ++c) {
        const std::string& name = model.cases[c].name;
        const auto& image = mirror.case_mirror[c];
        if (!image)
            none.push_back(name);
        else if (at(*image) == c)
            own.push_back(name);
        else if (at(*image) > c)
            pairs.push_back(fmt::format("{} <-> {}", name, model.cases[at(*image)].name));
    }
    auto list = [&out](const char* title, const std::vector<std::string>& items) {
        if (items.empty())
            return;
        out += fmt::format("\n{}\n", title);
        for (const std::string& item : items)
            out += fmt::format("  {}\n", item);
    };
    list("Cases that mirror each other", pairs);
    list("Cases symmetric in themselves", own);
    list("Cases with no mirror image among the cases", none);
    std::vector<std::string> members;
    for (std::size_t m = 0; m < model.members.size(); ++m) {
        const auto& image = mirror.member[m];
        if (image && at(*image) >= m) {
            members.push_back(at(*image) == m
                                  ? fmt::format("{} (on the axis)", model.members[m].name)
                                  : fmt::format("{} <-> {}", model.members[m].name,
                                                model.members[at(*image)].name));
        }
    }
    list("Members and their images", members);
    out += '\n';
}

}  // namespace firn
