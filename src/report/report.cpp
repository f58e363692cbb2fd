// report: the text report. Fixed column widths (names as wide as the model's
// longest name, numbers 12 wide) so that a change to one value changes one
// line, and fixed decimals per unit so that output is the same on every run.
#include "report/report.hpp"

#include <fmt/format.h>
#include <algorithm>
#include <array>
#include <cmath>

#include "base/number_format.hpp"
#include "base/version.hpp"
#include "report/report_envelopes.hpp"
#include "report/report_table.hpp"

namespace firn {

const char* const kCaution =
    "These results support, and do not replace, the judgement of a licensed engineer. "
    "Local codes, amendments and the authority having jurisdiction govern.";

namespace {

using namespace report_detail;

// ---------------------------------------------------------------- header

/// The cover's fields, one a line under the title, labels aligned: what a checker signs.
void write_cover(std::string& out, const Model& model) {
    std::size_t width = 0;
    for (const CoverField& f : model.cover)
        width = std::max(width, f.label.size());
    for (const CoverField& f : model.cover)
        out += fmt::format("  {:<{}}  {}\n", f.label + ":", width + 1, f.text);
}

void write_header(std::string& out, const Model& model) {
    bool second_order = model.combine && model.combine->second_order;
    out += fmt::format("firn {} report: plane frame, linear static analysis{}\n", kFirnVersion,
                       second_order ? "; combinations to second order (P-Delta, P-delta)" : "");
    out += fmt::format("Model:  {}\n", model.title.empty() ? "(untitled)" : model.title);
    write_cover(out, model);
    out += fmt::format("Source: {}\n", shown_source(model.source_name));
    if (model.snow)
        out += fmt::format("Snow:   {} (snow data {})\n", model.snow->tables.edition,
                           model.snow->name);
    out += "\n";
    out += "Caution: ";
    out += kCaution;
    out += "\n\n";
    const DisplayUnits& u = model.units;
    out += fmt::format("Units: force {}, length {}, moment {}, displacement {}, rotation {}\n\n",
                       u.force.name, u.length.name, u.moment.name, u.displacement.name,
                       u.rotation.name);
    out +=
        "Sign conventions\n"
        "  Global axes: x to the right, y up; moments and rotations counterclockwise positive.\n"
        "  Member axes: local x runs from the start node to the end node; local y is local x\n"
        "    turned 90 degrees counterclockwise. Positions are measured along local x.\n"
        "  N  axial force, tension positive.\n"
        "  M  bending moment, positive when the member's local -y face is in tension\n"
        "     (sagging, for a member drawn from left to right).\n"
        "  V  shear force, V = dM/dx.\n"
        "  Reactions are the forces the supports apply to the structure, in global axes.\n"
        "  Deflection is the displacement along local y from the chord through the member's\n"
        "    displaced ends.\n\n";
}

// ---------------------------------------------------------------- model echo

const char* shape_name(Section::Shape shape) {
    switch (shape) {
        case Section::Shape::given:
            return "given";
        case Section::Shape::rectangle:
            return "rectangle";
        case Section::Shape::ishape:
            return "ishape";
    }
    return "given";
}

void write_nodes(std::string& out, const Model& model) {
    std::vector<const Support*> support(model.nodes.size(), nullptr);
    for (const Support& s : model.supports)
        support[at(s.node)] = &s;
    out += "Nodes\n";
    Table t(out);
    t.name_column("node", name_width(model.nodes, "node"))
        .number_column("x", model.units.length)
        .number_column("y", model.units.length)
        .name_column("support", 0)
        .end_row();
    for (std::size_t i = 0; i < model.nodes.size(); ++i) {
        const Node& n = model.nodes[i];
        t.name(n.name).number(n.x, model.units.length).number(n.y, model.units.length);
        t.name(support[i] != nullptr ? support_kind_name(support[i]->kind) : "").end_row();
    }
    out += '\n';
}

void write_springs(std::string& out, const Model& model) {
    bool any = std::any_of(model.supports.begin(), model.supports.end(),
                           [](const Support& s) { return s.kind == Support::Kind::spring; });
    if (!any)
        return;
    const DisplayUnits& u = model.units;
    out += "Spring supports (fixed: rigid; blank: free)\n";
    Table t(out);
    t.name_column("node", name_width(model.nodes, "node"))
        .number_column("kx", u.stiffness)
        .number_column("ky", u.stiffness)
        .number_column("kr", u.rotational_stiffness)
        .end_row();
    for (const Support& s : model.supports) {
        if (s.kind != Support::Kind::spring)
            continue;
        t.name(model.nodes[at(s.node)].name);
        for (std::size_t d = 0; d < 3; ++d) {
            const Restraint& r = s.restraint[d];
            if (r.kind == Restraint::Kind::spring) {
                t.number(r.stiffness, d == dof_rotation ? u.rotational_stiffness : u.stiffness);
            } else {
                t.text(r.kind == Restraint::Kind::fixed ? "fixed" : "");
            }
        }
        t.end_row();
    }
    out += '\n';
}

const char* hinge_words(const Member& m) {
    if (m.hinge_start && m.hinge_end)
        return "both ends";
    if (m.hinge_start)
        return "start";
    return m.hinge_end ? "end" : "";
}

void write_members(std::string& out, const Model& model) {
    std::size_t wn = name_width(model.nodes, "start");
    out += "Members\n";
    Table t(out);
    t.name_column("member", name_width(model.members, "member"))
        .name_column("start", wn)
        .name_column("end", wn)
        .name_column("section", name_width(model.sections, "section"))
        .number_column("length", model.units.length)
        .name_column("hinges", 0)
        .end_row();
    for (const Member& m : model.members) {
        const Node& a = model.nodes[at(m.start)];
        const Node& b = model.nodes[at(m.end)];
        t.name(m.name).name(a.name).name(b.name).name(model.sections[at(m.section)].name);
        t.number(std::hypot(b.x - a.x, b.y - a.y), model.units.length)
            .name(hinge_words(m))
            .end_row();
    }
    out += '\n';
}

/// The width of the material column: the materials the sections use (a
/// library may bring many more).
std::size_t used_material_width(const Model& model) {
    std::size_t width = std::string_view("material").size();
    for (const Section& s : model.sections)
        width = std::max(width, model.materials[at(s.material)].name.size());
    return width;
}

void write_sections(std::string& out, const Model& model) {
    const DisplayUnits& u = model.units;
    out += "Sections\n";
    Table t(out);
    t.name_column("section", name_width(model.sections, "section"))
        .name_column("material", used_material_width(model))
        .name_column("shape", 9)
        .number_column("A", u.area)
        .number_column("I", u.inertia)
        .number_column("E", u.modulus)
        .number_column("density", u.unit_weight)
        .end_row();
    for (const Section& s : model.sections) {
        const Material& m = model.materials[at(s.material)];
        t.name(s.name)
            .name(m.name)
            .name(shape_name(s.shape))
            .number(s.area, u.area)
            .number(s.inertia, u.inertia);
        t.number(m.elastic_modulus, u.modulus).number(m.unit_weight, u.unit_weight).end_row();
    }
    out += '\n';
}

/// The snow trace: each derived value with its formula and clause.
void write_trace(std::string& out, const std::vector<TraceStep>& trace, const DisplayUnits& units) {
    for (const TraceStep& t : trace) {
        if (t.heading) {
            out += fmt::format("\n{}\n", trace_text(t, units));
            continue;
        }
        out += fmt::format("  {}", trace_text(t, units));
        if (!t.clause.empty())
            out += fmt::format("   [{}]", trace_clause(t));
        out += '\n';
    }
    out += '\n';
}

void write_traces(std::string& out, const Derivation& derivation, const DisplayUnits& units) {
    if (!derivation.snow_trace.empty()) {
        out += "== Snow loads ==\n";
        write_trace(out, derivation.snow_trace, units);
    }
    if (!derivation.arrangement_trace.empty()) {
        out += "== Load arrangements ==\n";
        write_trace(out, derivation.arrangement_trace, units);
    }
}

void write_case_list(std::string& out, const Model& model) {
    out += "Load cases\n";
    Table t(out);
    t.name_column("case", name_width(model.cases, "case")).name_column("kind", 0).end_row();
    for (const LoadCase& lc : model.cases)
        t.name(lc.name).name(case_kind_name(lc.kind)).end_row();
    out += '\n';
}

// ---------------------------------------------------------------- one case

void write_equilibrium(std::string& out, const Model& model, const Equilibrium& e) {
    const DisplayUnits& u = model.units;
    out += "Equilibrium (sums over the structure; M about the origin)\n";
    Table t(out);
    t.name_column("", 9)
        .number_column("Fx", u.force)
        .number_column("Fy", u.force)
        .number_column("M", u.moment);
    t.end_row();
    auto row = [&](const char* label, const std::array<double, 3>& v) {
        t.name(label).number(v[0], u.force).number(v[1], u.force).number(v[2], u.moment).end_row();
    };
    row("applied", e.applied);
    row("reactions", e.reactions);
    row("residual", {e.applied[0] + e.reactions[0], e.applied[1] + e.reactions[1],
                     e.applied[2] + e.reactions[2]});
    out += '\n';
}

void write_reactions(std::string& out, const Model& model, const CaseResults& r) {
    const DisplayUnits& u = model.units;
    out += "Reactions\n";
    Table t(out);
    t.name_column("node", name_width(model.nodes, "node"))
        .number_column("Rx", u.force)
        .number_column("Ry", u.force)
        .number_column("M", u.moment)
        .end_row();
    for (std::size_t i = 0; i < model.supports.size(); ++i) {
        t.name(model.nodes[at(model.supports[i].node)].name);
        t.number(r.reactions[i][0], u.force)
            .number(r.reactions[i][1], u.force)
            .number(r.reactions[i][2], u.moment);
        t.end_row();
    }
    out += '\n';
}

void write_displacements(std::string& out, const Model& model, const Results& results,
                         const CaseResults& r) {
    const DisplayUnits& u = model.units;
    bool any_free = std::any_of(results.rotation_free.begin(), results.rotation_free.end(),
                                [](char f) { return f != 0; });
    out += any_free ? "Node displacements (rotation 'free': every member is hinged at the node)\n"
                    : "Node displacements\n";
    Table t(out);
    t.name_column("node", name_width(model.nodes, "node"))
        .number_column("dx", u.displacement)
        .number_column("dy", u.displacement)
        .number_column("rotation", u.rotation)
        .end_row();
    for (std::size_t i = 0; i < model.nodes.size(); ++i) {
        t.name(model.nodes[i].name).number(r.displacements[i][0], u.displacement);
        t.number(r.displacements[i][1], u.displacement);
        if (any_free && results.rotation_free[i]) {
            t.text("free");
        } else {
            t.number(r.displacements[i][2], u.rotation);
        }
        t.end_row();
    }
    out += '\n';
}

/// The largest displacement of each kind over all nodes, and where.
void write_largest_displacements(std::string& out, const Model& model, const Results& results,
                                 const CaseResults& r) {
    const DisplayUnits& u = model.units;
    out += "Largest displacements\n";
    Table t(out);
    t.name_column("", 8)
        .name_column("node", name_width(model.nodes, "node"))
        .name_column("value", 0)
        .end_row();
    const char* labels[] = {"dx", "dy", "rotation"};
    for (std::size_t d = 0; d < 3; ++d) {
        const DisplayUnit& unit = d == dof_rotation ? u.rotation : u.displacement;
        // Compared as printed, so that nodes whose values differ only by
        // rounding noise resolve to the first one declared, on any machine.
        std::size_t best = 0;
        double largest = -1.0;
        for (std::size_t i = 0; i < model.nodes.size(); ++i) {
            bool free =
                d == dof_rotation && !results.rotation_free.empty() && results.rotation_free[i];
            double shown = std::abs(round_to(unit.from_si(r.displacements[i][d]), unit.decimals));
            if (!free && shown > largest) {
                largest = shown;
                best = i;
            }
        }
        if (largest < 0.0)
            continue;
        std::array<char, kNumberBuffer> buffer;
        std::string value(
            format_fixed(buffer.data(), unit.from_si(r.displacements[best][d]), unit.decimals));
        t.name(labels[d]).name(model.nodes[best].name).name(value + " " + unit.name).end_row();
    }
    out += '\n';
}

void write_end_forces(std::string& out, const Model& model, const CaseResults& r) {
    const DisplayUnits& u = model.units;
    out += "Member end forces (internal N, V, M just inside each end)\n";
    Table t(out);
    t.name_column("member", name_width(model.members, "member"));
    t.number_column("N start", u.force)
        .number_column("V start", u.force)
        .number_column("M start", u.moment);
    t.number_column("N end", u.force)
        .number_column("V end", u.force)
        .number_column("M end", u.moment);
    t.end_row();
    for (std::size_t i = 0; i < model.members.size(); ++i) {
        const MemberSummary& s = r.members[i];
        t.name(model.members[i].name);
        for (const auto* v : {&s.start, &s.end})
            t.number((*v)[0], u.force).number((*v)[1], u.force).number((*v)[2], u.moment);
        t.end_row();
    }
    out += '\n';
}

void write_extremes(std::string& out, const Model& model, const CaseResults& r) {
    const DisplayUnits& u = model.units;
    out += "Member extremes (each value, then its position from the start node)\n";
    Table t(out);
    t.name_column("member", name_width(model.members, "member"));
    const std::array<std::pair<const char*, const DisplayUnit*>, 6> columns{
        {{"M+", &u.moment},
         {"M-", &u.moment},
         {"V", &u.force},
         {"N+", &u.force},
         {"N-", &u.force},
         {"defl.", &u.displacement}}};
    for (const auto& [title, unit] : columns)
        t.number_column(title, *unit).number_column("at", u.length);
    t.end_row();
    for (std::size_t i = 0; i < model.members.size(); ++i) {
        const MemberSummary& s = r.members[i];
        t.name(model.members[i].name);
        const std::array<const Extreme*, 6> values{&s.moment_max, &s.moment_min, &s.shear_max,
                                                   &s.axial_max,  &s.axial_min,  &s.deflection_max};
        for (std::size_t k = 0; k < values.size(); ++k) {
            t.number(values[k]->value, *columns[k].second).number(values[k]->position, u.length);
        }
        t.end_row();
    }
    out +=
        "  (N+ largest tension, N- largest compression, V largest in size; 0 where there is "
        "none)\n\n";
}

void write_stations(std::string& out, const Model& model, const Stations& stations, std::size_t c) {
    const DisplayUnits& u = model.units;
    out += "Member stations\n";
    Table t(out);
    t.name_column("member", name_width(model.members, "member"))
        .number_column("x", u.length)
        .number_column("N", u.force)
        .number_column("V", u.force)
        .number_column("M", u.moment)
        .number_column("defl.", u.displacement)
        .end_row();
    for (std::size_t m = 0; m < model.members.size(); ++m) {
        const Station* s = stations.of(c, m);
        for (std::size_t k = 0; k < stations.per_member; ++k) {
            t.name(k == 0 ? std::string_view(model.members[m].name) : "")
                .number(s[k].position, u.length);
            t.number(s[k].axial, u.force).number(s[k].shear, u.force).number(s[k].moment, u.moment);
            t.number(s[k].deflection, u.displacement).end_row();
        }
    }
    out += '\n';
}

/// A case's or a combination's results, in the same layout (stations: theirs, at
/// index `c`, or none).
void write_results(std::string& out, const Model& model, const Results& results,
                   const CaseResults& r, const ReportOptions& options, const Stations* stations,
                   std::size_t c) {
    write_equilibrium(out, model, r.equilibrium);
    if (!model.supports.empty())
        write_reactions(out, model, r);
    if (options.full) {
        write_displacements(out, model, results, r);
    } else {
        write_largest_displacements(out, model, results, r);
    }
    if (options.full)
        write_end_forces(out, model, r);
    write_extremes(out, model, r);
    if (stations != nullptr)
        write_stations(out, model, *stations, c);
}

void write_case(std::string& out, const Model& model, const Results& results, std::size_t c,
                const ReportOptions& options) {
    const LoadCase& lc = model.cases[c];
    out += fmt::format("== Load case {} ({}) ==\n\n", lc.name, case_kind_name(lc.kind));
    write_results(out, model, results, results.cases[c], options, options.stations, c);
}

/// The set a combination belongs to.
const CombinationList::SetRange& set_of(const CombinationList& list, std::size_t k) {
    for (const CombinationList::SetRange& set : list.sets) {
        if (k >= set.first && k < set.first + set.count)
            return set;
    }
    return list.sets.front();
}

/// `== Combination NAME ==`: its factors, then its results as a case's (the
/// solved cases superposed, never solved again).
void write_combination(std::string& out, const Model& model, const Results& results,
                       const ReportOptions& options, std::size_t chosen) {
    if (options.combinations == nullptr || options.envelopes == nullptr)
        return;
    const CombinationList& list = *options.combinations;
    std::size_t k = options.chosen_combinations[chosen];
    const CaseResults* r = combination_case(list, *options.envelopes, k);
    if (r == nullptr)
        return;
    out += fmt::format("== Combination {} ==\n\n", list.combinations[k].name);
    out += fmt::format("Factors: {}\n", list.formulas[k]);
    out += fmt::format("Set:     {}\n", set_of(list, k).name);
    out +=
        "The solved load cases, factored and added (superposition; nothing is solved "
        "again).\n\n";
    write_results(out, model, results, *r, options, options.combination_stations, chosen);
}

/// The short forms of the report: the header, the summary when asked, and the
/// chosen combinations.
void write_chosen_parts(const Model& model, const Results& results, const ReportOptions& options,
                        std::string& out, const ReportSink& sink) {
    if (options.summary_only)
        write_design_summary(out, model, options);
    for (std::size_t i = 0; i < options.chosen_combinations.size(); ++i) {
        sink(out);
        out.clear();
        write_combination(out, model, results, options, i);
    }
    sink(out);
}

}  // namespace

std::string shown_source(const std::string& name) {
    if (name.empty() || name.front() != '/')
        return name;
    return name.substr(name.find_last_of('/') + 1);
}

const CaseResults* combination_case(const CombinationList& list,
                                    const std::vector<Envelopes>& envelopes, std::size_t k) {
    for (std::size_t s = 0; s < list.sets.size() && s < envelopes.size(); ++s) {
        const CombinationList::SetRange& set = list.sets[s];
        if (k >= set.first && k < set.first + set.count &&
            k - set.first < envelopes[s].combinations.size())
            return &envelopes[s].combinations[k - set.first];
    }
    return nullptr;
}

void write_text_report(const Model& model, const Results& results, const ReportOptions& options,
                       const ReportSink& sink) {
    std::string out;
    write_header(out, model);
    bool chosen = options.combinations != nullptr && options.envelopes != nullptr &&
                  !options.chosen_combinations.empty();
    if (chosen || options.summary_only) {
        write_chosen_parts(model, results, options, out, sink);
        return;
    }
    write_design_summary(out, model, options);
    out += "== Model ==\n\n";
    write_nodes(out, model);
    write_springs(out, model);
    write_members(out, model);
    write_sections(out, model);
    write_case_list(out, model);
    if (options.derivation != nullptr)
        write_traces(out, *options.derivation, model.units);
    if (options.mirror != nullptr)
        write_mirror(out, model, *options.mirror);
    if (options.combinations != nullptr)
        write_combinations(out, model, *options.combinations);
    for (std::size_t c = 0; c < model.cases.size(); ++c) {
        sink(out);
        out.clear();
        write_case(out, model, results, c, options);
    }
    if (options.combinations != nullptr && options.second_order != nullptr)
        write_second_order(out, model, *options.combinations, *options.second_order);
    if (options.combinations != nullptr && options.envelopes != nullptr)
        write_envelopes(out, model, *options.combinations, *options.envelopes);
    if (options.deflections != nullptr)
        write_deflections(out, model, *options.deflections);
    if (options.expectations != nullptr)
        write_expectations(out, model, *options.expectations);
    sink(out);
}

std::string text_report(const Model& model, const Results& results, const ReportOptions& options) {
    std::string all;
    write_text_report(model, results, options, [&all](std::string_view piece) { all += piece; });
    return all;
}

ReportOptions report_options(const Analysis& a) {
    ReportOptions options;
    options.combinations = &a.combinations;
    options.envelopes = &a.envelopes;
    options.deflections = &a.deflections;
    options.mirror = &a.mirror;
    options.expectations = &a.expectations;
    options.derivation = &a.derivation;
    options.second_order = &a.second_order;
    return options;
}

}  // namespace firn
