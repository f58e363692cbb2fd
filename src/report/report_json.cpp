// report_json: the machine-readable twin of the text report. Values are in the
// display units named under "units", rounded two decimals finer than the text
// report so that output is stable across machines yet loses nothing a reader needs.
#include <fmt/format.h>
#include <nlohmann/json.hpp>

#include "base/number_format.hpp"
#include "base/version.hpp"
#include "report/report.hpp"

namespace firn {
namespace {

using Json = nlohmann::ordered_json;

/// Bumped whenever a key changes meaning or goes away.
constexpr int kJsonFormat = 1;

/// Set for the length of one write_json_report that asked for exact numbers. A flag
/// rather than a parameter of every writer below: the choice is the same for every
/// number of one report, and each thread writes its own report.
thread_local bool exact_numbers = false;

double shown(double si_value, const DisplayUnit& unit) {
    double value = unit.from_si(si_value);
    if (exact_numbers)
        return value == 0.0 ? 0.0 : value;  // never -0
    return round_to(value, unit.decimals + 2);
}

/// Sets exact_numbers for its lifetime.
struct ExactNumbers {
    bool before = exact_numbers;
    explicit ExactNumbers(bool on) { exact_numbers = on; }
    ExactNumbers(const ExactNumbers&) = delete;
    ExactNumbers& operator=(const ExactNumbers&) = delete;
    ~ExactNumbers() { exact_numbers = before; }
};

Json units_json(const DisplayUnits& u) {
    return Json{{"force", u.force.name},
                {"length", u.length.name},
                {"moment", u.moment.name},
                {"displacement", u.displacement.name},
                {"rotation", u.rotation.name},
                {"area", u.area.name},
                {"inertia", u.inertia.name},
                {"modulus", u.modulus.name},
                {"unit_weight", u.unit_weight.name}};
}

Json model_json(const Model& model) {
    const DisplayUnits& u = model.units;
    Json nodes = Json::array(), members = Json::array(), sections = Json::array(),
         supports = Json::array();
    for (const Node& n : model.nodes) {
        nodes.push_back(
            {{"name", n.name}, {"x", shown(n.x, u.length)}, {"y", shown(n.y, u.length)}});
    }
    for (const Section& s : model.sections) {
        const Material& m = model.materials[at(s.material)];
        sections.push_back({{"name", s.name},
                            {"material", m.name},
                            {"A", shown(s.area, u.area)},
                            {"I", shown(s.inertia, u.inertia)},
                            {"E", shown(m.elastic_modulus, u.modulus)},
                            {"density", shown(m.unit_weight, u.unit_weight)}});
    }
    for (const Member& m : model.members) {
        members.push_back({{"name", m.name},
                           {"start", model.nodes[at(m.start)].name},
                           {"end", model.nodes[at(m.end)].name},
                           {"section", model.sections[at(m.section)].name},
                           {"hinge_start", m.hinge_start},
                           {"hinge_end", m.hinge_end}});
    }
    for (const Support& s : model.supports) {
        supports.push_back(
            {{"node", model.nodes[at(s.node)].name}, {"kind", support_kind_name(s.kind)}});
    }
    return Json{
        {"nodes", nodes}, {"sections", sections}, {"members", members}, {"supports", supports}};
}

Json triple(const std::array<double, 3>& v, const DisplayUnit& force, const DisplayUnit& moment,
            const char* a, const char* b, const char* c) {
    return Json{{a, shown(v[0], force)}, {b, shown(v[1], force)}, {c, shown(v[2], moment)}};
}

Json extreme(const Extreme& e, const DisplayUnit& unit, const DisplayUnit& length) {
    return Json{{"value", shown(e.value, unit)}, {"at", shown(e.position, length)}};
}

Json member_json(const Model& model, std::size_t i, const MemberSummary& s) {
    const DisplayUnits& u = model.units;
    return Json{{"member", model.members[i].name},
                {"start", triple(s.start, u.force, u.moment, "N", "V", "M")},
                {"end", triple(s.end, u.force, u.moment, "N", "V", "M")},
                {"moment_max", extreme(s.moment_max, u.moment, u.length)},
                {"moment_min", extreme(s.moment_min, u.moment, u.length)},
                {"shear_max", extreme(s.shear_max, u.force, u.length)},
                {"tension_max", extreme(s.axial_max, u.force, u.length)},
                {"compression_max", extreme(s.axial_min, u.force, u.length)},
                {"deflection_max", extreme(s.deflection_max, u.displacement, u.length)}};
}

Json stations_json(const Model& model, const Stations& stations, std::size_t c, std::size_t m) {
    const DisplayUnits& u = model.units;
    Json out = Json::array();
    const Station* s = stations.of(c, m);
    for (std::size_t k = 0; k < stations.per_member; ++k) {
        out.push_back({{"x", shown(s[k].position, u.length)},
                       {"N", shown(s[k].axial, u.force)},
                       {"V", shown(s[k].shear, u.force)},
                       {"M", shown(s[k].moment, u.moment)},
                       {"deflection", shown(s[k].deflection, u.displacement)}});
    }
    return out;
}

/// What the loads and the reactions leave unbalanced, as the text report's residual row.
std::array<double, 3> residual_of(const Equilibrium& e) {
    return {e.applied[0] + e.reactions[0], e.applied[1] + e.reactions[1],
            e.applied[2] + e.reactions[2]};
}

/// A case's or a combination's results (stations: theirs, at index c, or none).
Json results_json(const Model& model, const Results& results, const CaseResults& r,
                  const Stations* stations, std::size_t c) {
    const DisplayUnits& u = model.units;
    Json reactions = Json::array(), displacements = Json::array(), members = Json::array();
    for (std::size_t i = 0; i < model.supports.size(); ++i) {
        Json row{{"node", model.nodes[at(model.supports[i].node)].name}};
        row.update(triple(r.reactions[i], u.force, u.moment, "Rx", "Ry", "M"));
        reactions.push_back(std::move(row));
    }
    for (std::size_t i = 0; i < model.nodes.size(); ++i) {
        bool free = !results.rotation_free.empty() && results.rotation_free[i];
        displacements.push_back(
            {{"node", model.nodes[i].name},
             {"dx", shown(r.displacements[i][0], u.displacement)},
             {"dy", shown(r.displacements[i][1], u.displacement)},
             {"rotation", free ? Json(nullptr) : Json(shown(r.displacements[i][2], u.rotation))}});
    }
    for (std::size_t i = 0; i < model.members.size(); ++i) {
        Json m = member_json(model, i, r.members[i]);
        if (stations != nullptr)
            m["stations"] = stations_json(model, *stations, c, i);
        members.push_back(std::move(m));
    }
    const Equilibrium& e = r.equilibrium;
    return Json{{"equilibrium",
                 {{"applied", triple(e.applied, u.force, u.moment, "Fx", "Fy", "M")},
                  {"reactions", triple(e.reactions, u.force, u.moment, "Fx", "Fy", "M")},
                  {"residual", triple(residual_of(e), u.force, u.moment, "Fx", "Fy", "M")}}},
                {"reactions", reactions},
                {"displacements", displacements},
                {"members", members}};
}

Json case_json(const Model& model, const Results& results, std::size_t c,
               const ReportOptions& options) {
    Json out{{"name", model.cases[c].name}, {"kind", case_kind_name(model.cases[c].kind)}};
    out.update(results_json(model, results, results.cases[c], options.stations, c));
    return out;
}

/// The chosen combinations' own results, as a case's, with their factors.
Json combination_results_json(const Model& model, const Results& results,
                              const ReportOptions& options) {
    Json out = Json::array();
    const CombinationList& list = *options.combinations;
    for (std::size_t i = 0; i < options.chosen_combinations.size(); ++i) {
        std::size_t k = options.chosen_combinations[i];
        const CaseResults* r = combination_case(list, *options.envelopes, k);
        if (r == nullptr)
            continue;
        Json one{{"name", list.combinations[k].name}, {"factors", list.formulas[k]}};
        one.update(results_json(model, results, *r, options.combination_stations, i));
        out.push_back(std::move(one));
    }
    return out;
}

/// The snow trace: each line's text, its clause and whether it starts a part.
Json snow_trace_json(const Derivation& derivation, const DisplayUnits& units) {
    Json lines = Json::array();
    for (const TraceStep& t : derivation.snow_trace) {
        Json line{{"text", trace_text(t, units)}};
        if (!t.clause.empty())
            line["clause"] = trace_clause(t);
        if (t.heading)
            line["heading"] = true;
        lines.push_back(std::move(line));
    }
    return lines;
}

/// The names and units of what acts with an enveloped value (Governing::concurrent).
struct ConcurrentNames {
    std::array<const char*, 3> names;
    std::array<const DisplayUnit*, 3> units;
};

ConcurrentNames member_actions(const DisplayUnits& u) {
    return {{"N", "V", "M"}, {&u.force, &u.force, &u.moment}};
}
ConcurrentNames reaction_components(const DisplayUnits& u) {
    return {{"Rx", "Ry", "M"}, {&u.force, &u.force, &u.moment}};
}
ConcurrentNames displacement_components(const DisplayUnits& u) {
    return {{"dx", "dy", "rotation"}, {&u.displacement, &u.displacement, &u.rotation}};
}

Json governing_json(const Governing& g, const DisplayUnit& unit, const DisplayUnit& length,
                    const CombinationList& list, std::size_t first, const ConcurrentNames& with) {
    Json out{{"value", shown(g.value, unit)},
             {"at", shown(g.position, length)},
             {"combination", g.combination == no_combination
                                 ? Json(nullptr)
                                 : Json(list.combinations[first + g.combination].name)}};
    Json concurrent = Json::object();
    for (std::size_t d = 0; d < 3; ++d)
        concurrent[with.names[d]] = shown(g.concurrent[d], *with.units[d]);
    out["with"] = std::move(concurrent);
    return out;
}

Json combinations_json(const Model& model, const CombinationList& list) {
    Json out = Json::array();
    for (std::size_t c = 0; c < list.combinations.size(); ++c) {
        Json terms = Json::array();
        for (const CombinationTerm& t : list.combinations[c].terms)
            terms.push_back({{"case", model.cases[at(t.case_id)].name}, {"factor", t.factor}});
        out.push_back({{"name", list.combinations[c].name}, {"terms", std::move(terms)}});
    }
    return out;
}

Json component_json(const ComponentEnvelope& e, const ConcurrentNames& components,
                    const DisplayUnit& length, const CombinationList& list, std::size_t first) {
    Json out;
    for (std::size_t d = 0; d < 3; ++d) {
        const DisplayUnit& unit = *components.units[d];
        out[components.names[d]] = {
            {"max", governing_json(e.max[d], unit, length, list, first, components)},
            {"min", governing_json(e.min[d], unit, length, list, first, components)}};
    }
    return out;
}

Json envelope_json(const Model& model, const CombinationList& list, std::size_t set,
                   const Envelopes& env) {
    const DisplayUnits& u = model.units;
    std::size_t first = list.sets[set].first;
    auto g = [&](const Governing& v, const DisplayUnit& unit) {
        return governing_json(v, unit, u.length, list, first, member_actions(u));
    };
    Json members = Json::array(), reactions = Json::array(), displacements = Json::array();
    for (std::size_t m = 0; m < env.members.size(); ++m) {
        const MemberEnvelope& e = env.members[m];
        members.push_back({{"member", model.members[m].name},
                           {"moment_max", g(e.moment_max, u.moment)},
                           {"moment_min", g(e.moment_min, u.moment)},
                           {"shear_max", g(e.shear_max, u.force)},
                           {"shear_min", g(e.shear_min, u.force)},
                           {"tension", g(e.tension, u.force)},
                           {"compression", g(e.compression, u.force)},
                           {"deflection_max", g(e.deflection_max, u.displacement)},
                           {"deflection_min", g(e.deflection_min, u.displacement)}});
    }
    for (std::size_t s = 0; s < env.reactions.size(); ++s) {
        Json r = component_json(env.reactions[s], reaction_components(u), u.length, list, first);
        r["node"] = model.nodes[at(model.supports[s].node)].name;
        reactions.push_back(std::move(r));
    }
    for (std::size_t n = 0; n < env.displacements.size(); ++n) {
        Json d =
            component_json(env.displacements[n], displacement_components(u), u.length, list, first);
        d["node"] = model.nodes[n].name;
        displacements.push_back(std::move(d));
    }
    return Json{{"set", list.sets[set].name},
                {"members", std::move(members)},
                {"reactions", std::move(reactions)},
                {"displacements", std::move(displacements)}};
}

Json deflections_json(const Model& model, const std::vector<DeflectionCheck>& checks) {
    const DisplayUnits& u = model.units;
    Json out = Json::array();
    for (const DeflectionCheck& c : checks) {
        out.push_back({{"member", model.members[at(c.member)].name},
                       {"row", model.deflection_limits[c.limits].row},
                       {"load", c.column},
                       {"case", c.governing},
                       {"deflection", shown(c.deflection, u.displacement)},
                       {"span", shown(c.span, u.length)},
                       {"n", c.n},
                       {"limit", shown(c.span / c.n, u.displacement)},
                       {"ratio", round_to(c.ratio(), 5)},
                       {"passes", c.passes()}});
    }
    return out;
}

Json finding_json(const Model& model, const Expectation& x, const Finding& f) {
    const DisplayUnit* unit = expectation_unit(model, x);
    auto value = [&](double v) { return unit != nullptr ? shown(v, *unit) : round_to(v, 6); };
    Json out{{"value", value(f.value)}, {"bound", value(f.bound)}, {"margin", value(f.margin)}};
    if (!f.place.empty())
        out["place"] = f.place;
    if (f.on_member)
        out["at"] = shown(f.position, model.units.length);
    if (!f.governing.empty())
        out["under"] = f.governing;
    return out;
}

Json expectations_json(const Model& model, const std::vector<ExpectationOutcome>& outcomes) {
    Json out = Json::array();
    for (const ExpectationOutcome& o : outcomes) {
        const Expectation& x = model.expectations[o.expectation];
        const DisplayUnit* unit = expectation_unit(model, x);
        Json failures = Json::array();
        for (const Finding& f : o.failures)
            failures.push_back(finding_json(model, x, f));
        out.push_back({{"line", x.where.begin.line},
                       {"subject", x.subject},
                       {"under", x.source},
                       {"bound", show_bound(model, x)},
                       {"unit", unit != nullptr ? unit->name : ""},
                       {"holds", o.passed()},
                       {"closest", finding_json(model, x, o.closest)},
                       {"failures", failures},
                       {"because", x.reason}});
    }
    return out;
}

Json mirror_json(const Model& model, const Mirror& mirror) {
    Json out{{"symmetric", mirror.symmetric}};
    if (!mirror.symmetric)
        return out;
    out["axis"] = shown(mirror.axis, model.units.length);
    Json cases = Json::array(), members = Json::array();
    for (std::size_t c = 0; c < model.cases.size(); ++c) {
        const auto& image = mirror.case_mirror[c];
        cases.push_back({{"case", model.cases[c].name},
                         {"mirror", image ? Json(model.cases[at(*image)].name) : Json(nullptr)}});
    }
    for (std::size_t m = 0; m < model.members.size(); ++m) {
        const auto& image = mirror.member[m];
        members.push_back(
            {{"member", model.members[m].name},
             {"mirror", image ? Json(model.members[at(*image)].name) : Json(nullptr)}});
    }
    out["cases"] = std::move(cases);
    out["members"] = std::move(members);
    return out;
}

/// Per combination of a set solved to second order: iterations, convergence,
/// critical load factor (null: none), amplification and the notional load in
/// total. Null for a set of superposed (first-order) combinations.
Json second_order_json(const Model& model, const CombinationList& list, std::size_t set,
                       const ReportOptions& options) {
    if (options.second_order == nullptr || set >= options.second_order->size() || !model.combine ||
        !model.combine->second_order)
        return Json(nullptr);
    Json out = Json::array();
    const auto& outcomes = (*options.second_order)[set];
    for (std::size_t k = 0; k < outcomes.size(); ++k) {
        const SecondOrderOutcome& o = outcomes[k];
        double notional = 0.0;
        for (double n : o.notional)
            notional += n;
        out.push_back({{"combination", list.combinations[list.sets[set].first + k].name},
                       {"iterations", o.iterations},
                       {"converged", o.converged},
                       {"critical_factor",
                        std::isfinite(o.critical_factor) ? Json(o.critical_factor) : Json(nullptr)},
                       {"amplification", o.amplification},
                       {"notional", shown(notional, model.units.force)}});
    }
    return out;
}

/// The parts after the cases: mirror images, combinations, envelopes, the chosen
/// combinations' results, deflection checks.
Json checks_json(const Model& model, const Results& results, const ReportOptions& options) {
    Json out = Json::object();
    if (options.mirror != nullptr)
        out["mirror"] = mirror_json(model, *options.mirror);
    if (options.combinations != nullptr && model.combine) {
        out["combinations"] = combinations_json(model, *options.combinations);
        Json envelopes = Json::array();
        for (std::size_t s = 0; options.envelopes != nullptr && s < options.envelopes->size();
             ++s) {
            Json e = envelope_json(model, *options.combinations, s, (*options.envelopes)[s]);
            Json second = second_order_json(model, *options.combinations, s, options);
            e["analysis"] = second.is_null() ? "first-order" : "second-order";
            e["second_order"] = std::move(second);
            envelopes.push_back(std::move(e));
        }
        out["envelopes"] = std::move(envelopes);
    }
    if (options.combinations != nullptr && options.envelopes != nullptr &&
        !options.chosen_combinations.empty())
        out["combination_results"] = combination_results_json(model, results, options);
    if (options.deflections != nullptr && !model.deflection_limits.empty())
        out["deflection_checks"] = deflections_json(model, *options.deflections);
    if (options.expectations != nullptr && !options.expectations->empty())
        out["expectations"] = expectations_json(model, *options.expectations);
    return out;
}

}  // namespace

void write_json_report(const Model& model, const Results& results, const ReportOptions& options,
                       const ReportSink& sink) {
    ExactNumbers precision(options.exact_numbers);
    // The root object is written by hand around the cases, so that each case
    // is built, written and freed in turn: a DOM of a large run would not fit
    // in memory. The layout is the one Json::dump(1) would give.
    Json cover = Json::object();
    for (const CoverField& f : model.cover)
        cover[f.key] = f.text;
    Json head{{"format", kJsonFormat},
              {"firn", kFirnVersion},
              {"title", model.title},
              {"cover", cover},
              {"source", shown_source(model.source_name)},
              {"caution", kCaution},
              {"units", units_json(model.units)},
              {"model", model_json(model)}};
    if (options.exact_numbers)
        head["numbers"] = "exact: unrounded, the shortest text that reads back to the same double";
    if (options.derivation != nullptr && !options.derivation->snow_trace.empty())
        head["snow_trace"] = snow_trace_json(*options.derivation, model.units);
    std::string text = head.dump(1, ' ', false, Json::error_handler_t::replace);
    text.resize(text.size() - 2);  // the final "\n}": the cases follow
    text += ",\n \"cases\": [";
    for (std::size_t c = 0; c < model.cases.size(); ++c) {
        text += c == 0 ? "\n" : ",\n";
        std::string one = case_json(model, results, c, options)
                              .dump(1, ' ', false, Json::error_handler_t::replace);
        text += "  ";
        for (char ch : one) {
            text += ch;
            if (ch == '\n')
                text += "  ";
        }
        sink(text);
        text.clear();
    }
    text += model.cases.empty() ? "]" : "\n ]";
    Json tail = checks_json(model, results, options);
    for (auto it = tail.begin(); it != tail.end(); ++it) {
        std::string one = it.value().dump(1, ' ', false, Json::error_handler_t::replace);
        text += fmt::format(",\n \"{}\": ", it.key());
        for (char ch : one) {
            text += ch;
            if (ch == '\n')
                text += ' ';
        }
    }
    text += "\n}\n";
    sink(text);
}

std::string json_report(const Model& model, const Results& results, const ReportOptions& options) {
    std::string all;
    write_json_report(model, results, options, [&all](std::string_view piece) { all += piece; });
    return all;
}

}  // namespace firn
