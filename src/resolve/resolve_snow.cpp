// resolve_snow: the site's snow data (`snow`), roof surfaces (`roof`) and
// amendments of library values (`amend`). The standard's numbers are read from
// its library module's values (stdlib/NAME.firn); the formulas that use
// them are in snow.cpp.
#include <fmt/format.h>
#include <algorithm>
#include <array>
#include <cmath>
#include <limits>
#include <map>

#include "resolve/resolve_internal.hpp"
#include "resolve/resolve_snow_library.hpp"

namespace firn::resolve_detail {
namespace {

/// `items` split at each "; ".
std::vector<std::string> split_list(const std::string& items) {
    std::vector<std::string> out;
    for (std::size_t from = 0; from < items.size();) {
        std::size_t end = std::min(items.find("; ", from), items.size());
        out.push_back(items.substr(from, end - from));
        from = end + 2;
    }
    return out;
}

/// The edition's name and the clauses the trace cites, from the library's texts.
void read_citations(Library& lib, SnowTables& t) {
    t.edition = lib.text("edition");
    t.chapter = lib.text("snow_chapter");
    using C = SnowTables::Clauses;
    static const std::array<std::pair<std::string C::*, const char*>, 16> kClauses{
        {{&C::pg, "pg"},
         {&C::pf, "pf"},
         {&C::pm, "pm"},
         {&C::slippery, "slippery"},
         {&C::ps, "ps"},
         {&C::rain, "rain"},
         {&C::ice_dam, "ice_dam"},
         {&C::partial, "partial"},
         {&C::unbalanced, "unbalanced"},
         {&C::unbalanced_load, "unbalanced_load"},
         {&C::drift_height, "drift_height"},
         {&C::density, "density"},
         {&C::step, "step"},
         {&C::adjacent, "adjacent"},
         {&C::parapet, "parapet"},
         {&C::sliding, "sliding"}}};
    auto cite = [&](const std::string& name) {
        return fmt::format("{} {}", t.edition, lib.text("clause." + name));
    };
    for (const auto& [field, name] : kClauses)
        t.clause.*field = cite(name);
    static const std::array<const char*, 3> curves{"warm", "cold_ventilated", "cold"};
    for (std::size_t k = 0; k < curves.size(); ++k)
        t.clause.Cs[k] = cite(fmt::format("Cs_{}", curves[k]));
    t.from_memory = split_list(lib.text("from_memory"));
}

SnowTables read_tables(Library& lib) {
    SnowTables t;
    t.pf_factor = lib.need("pf.factor", dim::number);
    read_edition_switches(lib, t);
    if (!t.pm_cap_per_risk_category)
        t.pm_pg_limit = lib.need("pm.pg_limit", dim::pressure);
    t.pm_max_slope = lib.need("pm.max_slope", dim::number);
    static const std::array<const char*, 3> curves{"warm", "cold_ventilated", "cold"};
    for (std::size_t c = 0; c < curves.size(); ++c) {
        t.Cs_knee[c][0] = lib.need(fmt::format("Cs.{}.slippery.knee", curves[c]), dim::number);
        t.Cs_knee[c][1] = lib.need(fmt::format("Cs.{}.other.knee", curves[c]), dim::number);
    }
    t.Cs_zero_slope = lib.need("Cs.zero_slope", dim::number);
    t.warm_slippery_R_unventilated = lib.need("Cs.warm_slippery.R_unventilated", dim::number);
    t.warm_slippery_R_ventilated = lib.need("Cs.warm_slippery.R_ventilated", dim::number);
    t.rain_pg_limit = lib.need("rain_on_snow.pg_limit", dim::pressure);
    t.rain_surcharge = lib.need("rain_on_snow.surcharge", dim::pressure);
    t.rain_W_per_degree = lib.need("rain_on_snow.W_per_degree", dim::length);
    t.density_per_pg = lib.need("density.per_pg", power(dim::length, -1));
    t.density_base = lib.need("density.base", dim::unit_weight);
    t.density_max = lib.need("density.max", dim::unit_weight);
    t.drift_coefficient = lib.need("drift.coefficient", dim::number);
    if (!t.drift_winter_wind) {
        t.drift_pg_offset = lib.need("drift.pg_offset", dim::pressure);
        t.drift_offset = lib.need("drift.offset", dim::length);
    }
    t.drift_min_lu = lib.need("drift.min_lu", dim::length);
    t.partial_gable_exempt_rise = lib.need("partial.gable_exempt_rise", dim::number);
    t.adjacent_max_gap = lib.need("adjacent.max_gap", dim::length);
    t.projection_min_face = lib.need("projection.min_face", dim::length);
    t.unbalanced_min_rise = lib.need("unbalanced.min_rise", dim::number);
    t.unbalanced_max_rise = lib.need("unbalanced.max_rise", dim::number);
    t.unbalanced_windward = lib.need("unbalanced.windward", dim::number);
    t.unbalanced_narrow_W = lib.need("unbalanced.narrow_W", dim::length);
    t.ice_dam_factor = lib.need("ice_dam.factor", dim::number);
    t.ice_dam_R_unventilated = lib.need("ice_dam.R_unventilated", dim::number);
    t.ice_dam_R_ventilated = lib.need("ice_dam.R_ventilated", dim::number);
    t.sliding_factor = lib.need("sliding.factor", dim::number);
    t.sliding_width = lib.need("sliding.width", dim::length);
    t.sliding_min_rise_slippery = lib.need("sliding.min_rise_slippery", dim::number);
    t.sliding_min_rise_other = lib.need("sliding.min_rise_other", dim::number);
    read_citations(lib, t);
    read_edition_clauses(lib, t);
    return t;
}

/// A factor from its table, or the user's override with its reason.
std::optional<SnowFactor> factor(Resolver& r, Settings& settings, Library& lib,
                                 const std::string& symbol, const std::string& table,
                                 const std::vector<std::pair<std::string, std::string>>& keys,
                                 const std::string& entry, SourceRange owner) {
    if (const syntax::Setting* s = settings.find(symbol)) {
        double value = 0.0;
        bool ok = settings.value(symbol, kNumber, value, true);
        if (!s->reason) {
            r.diagnostics.error(s->key.where,
                                fmt::format("an overridden {} needs its reason: {} = ... because "
                                            "\"the local amendment or ruling\"",
                                            symbol, symbol));
        }
        if (ok && !(value > 0.0)) {
            r.diagnostics.error(s->value.where,
                                fmt::format("{} must be greater than zero", symbol));
            ok = false;
        }
        if (!ok || !s->reason)
            return std::nullopt;
        return SnowFactor{value, table, *s->reason};
    }
    for (const auto& [key, what] : keys) {
        if (settings.find(key) == nullptr) {
            r.diagnostics.error(owner, fmt::format("the snow data need '{}' ({}), or {} given "
                                                   "with a reason",
                                                   key, what, symbol));
            return std::nullopt;
        }
    }
    if (entry.empty())
        return std::nullopt;  // a word was wrong: reported already
    auto v = lib.get(fmt::format("{}.{}", symbol, entry), dim::number);
    if (!v)
        return std::nullopt;
    return SnowFactor{*v, table, ""};
}

const std::vector<std::string> kTerrains{"B", "C", "D", "above_tree_line", "alaska_treeless"};
const std::vector<std::string> kExposures{"fully", "partially", "sheltered"};
const std::vector<std::string> kThermal{"heated", "cold_ventilated", "unheated", "freezer",
                                        "greenhouse"};
const std::vector<std::string> kRisk{"I", "II", "III", "IV"};
/// The standard the snow data name, which must be a library module in use.
std::optional<std::string> standard_of(Resolver& r, Settings& s) {
    std::vector<std::string> standards = loaded_standards(r);
    const syntax::Setting* setting = s.find("standard");
    if (setting != nullptr && standards.empty()) {
        r.diagnostics.error(setting->value.where,
                            "no library module in use gives snow provisions (is the 'use' of "
                            "the standard's module missing?)");
        return std::nullopt;
    }
    return s.word("standard", standards);
}

/// Ce by terrain and exposure; a combination the table leaves out is an error.
std::optional<SnowFactor> exposure_factor(Resolver& r, Settings& s, Library& lib,
                                          const SnowSite& site, SourceRange owner) {
    std::string entry;
    if (!site.terrain.empty() && !site.exposure.empty()) {
        entry = fmt::format("{}.{}", site.terrain, site.exposure);
        if (s.find("Ce") == nullptr && !lib.has(fmt::format("Ce.{}", entry))) {
            r.diagnostics.error(s.find("exposure")->value.where,
                                fmt::format("exposure '{}' is not allowed for terrain '{}' "
                                            "({} {})",
                                            site.exposure, site.terrain, site.tables.edition,
                                            lib.text("clause.Ce")));
            return std::nullopt;
        }
    }
    return factor(r, s, lib, "Ce", lib.text("clause.Ce"),
                  {{"terrain", "B, C, D, above_tree_line or alaska_treeless"},
                   {"exposure", "fully, partially or sheltered"}},
                  entry, owner);
}

void resolve_site(Resolver& r, const syntax::SnowDecl& decl) {
    std::vector<std::string> keys{"standard", "pg", "terrain", "exposure", "thermal",
                                  "risk",     "Ce", "Ct",      "Is"};
    for (std::string& key : edition_setting_keys())
        keys.push_back(std::move(key));
    Settings s(r, decl.settings, keys, "the snow data");
    SnowSite site;
    site.name = decl.name.text;
    site.where = decl.name.where;
    auto standard = standard_of(r, s);
    if (s.find("standard") == nullptr) {
        r.diagnostics.error(decl.name.where,
                            fmt::format("the snow data need their standard, as in: standard = {}",
                                        example_standard(r)));
    }
    site.terrain = s.word("terrain", kTerrains).value_or("");
    site.exposure = s.word("exposure", kExposures).value_or("");
    site.thermal = s.word("thermal", kThermal).value_or("");
    site.risk = s.word("risk", kRisk).value_or("");
    if (!standard)
        return;
    site.standard = *standard;
    SourceRange lib_where = s.find("standard")->value.where;
    Library lib(r, site.standard, lib_where);
    site.tables = read_tables(lib);
    if (!lib.ok())
        return;
    SourceRange pg_where;
    if (!ground_snow_load(r, s, site.tables, site.risk, decl.name.where, site.pg, pg_where))
        return;
    warn_implausible_ground_snow(r, pg_where, site.pg);
    auto Ce = exposure_factor(r, s, lib, site, decl.name.where);
    bool edition_ok = resolve_edition_site(r, s, lib, site);
    auto Ct =
        thermal_factor_from_model(lib, site)
            ? (site.Ct.value > 0.0 ? std::optional<SnowFactor>(site.Ct) : std::nullopt)
            : factor(r, s, lib, "Ct", lib.text("clause.Ct"),
                     {{"thermal", "heated, cold_ventilated, unheated, freezer or greenhouse"}},
                     site.thermal, decl.name.where);
    auto Is = site.tables.importance_applies
                  ? factor(r, s, lib, "Is", lib.text("clause.Is"), {{"risk", "I, II, III or IV"}},
                           site.risk, decl.name.where)
                  : std::optional<SnowFactor>(SnowFactor{1.0, "", ""});
    if (!Ce || !Ct || !Is || !edition_ok || !lib.ok())
        return;
    site.Ce = *Ce;
    site.Ct = *Ct;
    site.Is = *Is;
    if (choose_slope_curve(r, lib, site))
        r.model.snow = std::move(site);
}

/// The roof's members ordered along the surface from its left end, or nullopt
/// after reporting members that do not form one connected, unbranched surface.
}  // namespace

std::optional<std::vector<MemberId>> member_run(Resolver& r, const syntax::Name& owner,
                                                const RunWords& words,
                                                const std::vector<MemberId>& members) {
    for (MemberId m : members) {
        if (!r.member_status[at(m)].valid)
            return std::nullopt;  // its own error is reported
    }
    std::map<NodeId, std::vector<MemberId>> at_node;
    for (MemberId m : members) {
        at_node[r.model.members[at(m)].start].push_back(m);
        at_node[r.model.members[at(m)].end].push_back(m);
    }
    auto fail = [&](std::string message) {
        r.diagnostics.error(owner.where,
                            fmt::format("{} '{}': {}", words.owner, owner.text, message));
        return std::nullopt;
    };
    std::optional<NodeId> left;
    for (const auto& [node, touching] : at_node) {
        if (touching.size() > 2) {
            return fail(fmt::format("its members branch at node '{}'; {}",
                                    r.model.nodes[at(node)].name, words.one_run));
        }
        if (touching.size() == 1 &&
            (!left || r.model.nodes[at(node)].x < r.model.nodes[at(*left)].x)) {
            left = node;
        }
    }
    if (!left)
        return fail(fmt::format("its members close a loop; {}", words.one_run));
    std::vector<MemberId> chain;
    std::vector<char> taken(r.model.members.size(), 0);
    for (NodeId n = *left;;) {
        const auto& touching = at_node[n];
        auto next = std::find_if(touching.begin(), touching.end(),
                                 [&](MemberId m) { return !taken[at(m)]; });
        if (next == touching.end())
            break;
        taken[at(*next)] = 1;
        chain.push_back(*next);
        const Member& m = r.model.members[at(*next)];
        n = m.start == n ? m.end : m.start;
    }
    if (chain.size() != members.size()) {
        auto loose =
            std::find_if(members.begin(), members.end(), [&](MemberId m) { return !taken[at(m)]; });
        return fail(fmt::format("member '{}' does not touch the others; {}",
                                r.model.members[at(*loose)].name, words.connected));
    }
    return chain;
}

namespace {

/// "; did you mean 'x'?", or "; the plan lines are 1, 2, 3" when nothing is near.
std::string near_or_all(const std::string& word, const std::vector<std::string>& names) {
    std::string near = did_you_mean(word, names);
    if (!near.empty() || names.size() > 12)
        return near;
    return fmt::format("; the plan lines are {}", fmt::join(names, ", "));
}

/// The frame's plan line and the bays beside it (an end frame has one), or
/// false after an error.
bool plan_bays(Resolver& r, const syntax::Setting& frame, Roof::Tributary& t) {
    // A plan line is named like any grid line, and a bare number such as 3 names one.
    const syntax::Expr& e = frame.value;
    bool named = e.kind == syntax::Expr::Kind::constant ||
                 (e.kind == syntax::Expr::Kind::number && e.unit.empty() && !e.bad_unit);
    const auto& lines = r.model.plan_lines;
    auto it = std::find_if(lines.begin(), lines.end(),
                           [&](const GridLine& g) { return named && g.name == e.literal; });
    if (it == lines.end()) {
        std::vector<std::string> names;
        names.reserve(lines.size());
        for (const GridLine& g : lines)
            names.push_back(g.name);
        r.diagnostics.error(e.where, lines.empty()
                                         ? std::string("'frame' names a plan line, and the model "
                                                       "has no plan grid (grid plan 1..6 spacing "
                                                       "25 ft)")
                                         : fmt::format("unknown plan line '{}'{}", e.literal,
                                                       near_or_all(e.literal, names)));
        return false;
    }
    t.frame = it->name;
    for (const GridLine& g : lines) {
        double d = g.position - it->position;
        if (d < -1e-9 && (t.left_bay == 0.0 || -d < t.left_bay))
            t.left_bay = -d;
        if (d > 1e-9 && (t.right_bay == 0.0 || d < t.right_bay))
            t.right_bay = d;
    }
    return true;
}

/// The tributary width: given, or half of each bay beside the frame's plan line,
/// plus the overhang beyond an end frame.
bool tributary_width(Resolver& r, Settings& s, const syntax::RoofDecl& decl, Roof& roof,
                     double& out) {
    const syntax::Setting* given = s.find("tributary");
    const syntax::Setting* frame = s.find("frame");
    if (given != nullptr && frame != nullptr) {
        r.diagnostics.error(frame->key.where,
                            "give the tributary width or the frame's plan line, not both");
        return false;
    }
    if (frame != nullptr) {
        Roof::Tributary& t = roof.tributary_from;
        if (!plan_bays(r, *frame, t))
            return false;
        if (s.find("overhang") != nullptr && !s.value("overhang", expected::length, t.overhang))
            return false;
        bool end_frame = t.left_bay == 0.0 || t.right_bay == 0.0;
        if (!end_frame && t.overhang > 0.0) {
            r.diagnostics.error(s.find("overhang")->key.where,
                                fmt::format("plan line '{}' is not an end frame; an overhang "
                                            "beyond the end frames does not reach it",
                                            t.frame));
            return false;
        }
        out = 0.5 * (t.left_bay + t.right_bay) + t.overhang;
        return out > 0.0;
    }
    if (given == nullptr) {
        r.diagnostics.error(decl.name.where,
                            fmt::format("roof '{}' needs its tributary width, as in: tributary = "
                                        "20 ft, or its frame's plan line, as in: frame = 3",
                                        decl.name.text));
        return false;
    }
    if (!s.value("tributary", expected::length, out))
        return false;
    if (out > 0.0)
        return true;
    r.diagnostics.error(given->value.where, "a tributary width must be greater than zero");
    return false;
}

/// A positive length setting; false after an error (reported).
bool positive_length(Resolver& r, Settings& s, const std::string& key, double& out) {
    if (s.find(key) == nullptr)
        return true;
    if (!s.value(key, expected::length, out))
        return false;
    if (out > 0.0)
        return true;
    r.diagnostics.error(s.find(key)->value.where, fmt::format("{} must be greater than zero", key));
    return false;
}

/// Settings that describe one thing together: all given or none. False after an error.
bool all_or_none(Resolver& r, Settings& s, const std::vector<std::string>& keys, const char* what) {
    std::size_t given = 0;
    for (const std::string& key : keys)
        given += s.find(key) != nullptr ? 1U : 0U;
    if (given == 0 || given == keys.size())
        return true;
    auto first = std::find_if(keys.begin(), keys.end(),
                              [&](const std::string& k) { return s.find(k) != nullptr; });
    r.diagnostics.error(s.find(*first)->key.where,
                        fmt::format("{} needs all of {}", what, fmt::join(keys, ", ")));
    return false;
}

/// At most one of the things that can stand at one end of a roof.
bool one_at_an_end(Resolver& r, Settings& s, const char* side,
                   const std::vector<std::string>& keys) {
    const syntax::Setting* first = nullptr;
    for (const std::string& key : keys) {
        const syntax::Setting* given = s.find(key);
        if (given == nullptr)
            continue;
        if (first == nullptr) {
            first = given;
            continue;
        }
        Diagnostic& d = r.diagnostics.error(
            given->key.where, fmt::format("the {} end already has {}; one of {} at an end", side,
                                          first->key.text, fmt::join(keys, ", ")));
        d.note(first->key.where, "given here");
        return false;
    }
    return true;
}

/// The roof snow slides onto this end from, if any; false after an error.
bool read_sliding(Resolver& r, Settings& s, const char* side, Roof::Edge& edge) {
    const syntax::Setting* from = s.find(fmt::format("sliding_from_{}", side));
    if (from == nullptr)
        return true;
    if (from->value.kind != syntax::Expr::Kind::constant) {
        r.diagnostics.error(from->value.where,
                            "sliding_from names the roof the snow slides "
                            "from, as in: sliding_from_left = upper");
        return false;
    }
    edge.sliding_from = from->value.literal;
    edge.sliding_where = from->value.where;
    return true;
}

/// What stands at one end of the roof: a step up to a higher roof (`step_left = 8 ft`
/// with `step_left_upper_length`), a parapet, or a separate higher structure beyond a
/// gap (`adjacent_left = 12 ft` with `_gap` and `_length`).
bool read_edge(Resolver& r, Settings& s, const char* side, Roof::Edge& edge) {
    std::string step = fmt::format("step_{}", side);
    std::string upper = fmt::format("step_{}_upper_length", side);
    std::string parapet = fmt::format("parapet_{}", side);
    std::string adjacent = fmt::format("adjacent_{}", side);
    std::string gap = fmt::format("adjacent_{}_gap", side);
    std::string adjacent_length = fmt::format("adjacent_{}_length", side);
    bool ok = read_sliding(r, s, side, edge) & positive_length(r, s, step, edge.step) &
              positive_length(r, s, upper, edge.upper_length) &
              positive_length(r, s, parapet, edge.parapet) &
              positive_length(r, s, adjacent, edge.adjacent) &
              positive_length(r, s, gap, edge.adjacent_gap) &
              positive_length(r, s, adjacent_length, edge.adjacent_length);
    return ok && all_or_none(r, s, {step, upper}, "a roof step") &&
           all_or_none(r, s, {adjacent, gap, adjacent_length}, "an adjacent structure") &&
           one_at_an_end(r, s, side, {step, parapet, adjacent});
}

void resolve_roof(Resolver& r, const syntax::RoofDecl& decl, NameTable& names) {
    std::vector<MemberId> members;
    bool found = true;
    for (const syntax::Name& ref : decl.members) {
        auto ids = r.find_members(ref);
        found = found && ids.has_value();
        if (ids) {
            for (MemberId id : *ids) {
                if (std::find(members.begin(), members.end(), id) == members.end())
                    members.push_back(id);
            }
        }
    }
    Settings s(r, decl.settings,
               {"tributary",
                "frame",
                "overhang",
                "surface",
                "insulation",
                "ventilated",
                "rafter_spans",
                "step_left",
                "step_left_upper_length",
                "step_right",
                "step_right_upper_length",
                "parapet_left",
                "parapet_right",
                "sliding_from_left",
                "sliding_from_right",
                "adjacent_left",
                "adjacent_left_gap",
                "adjacent_left_length",
                "adjacent_right",
                "adjacent_right_gap",
                "adjacent_right_length",
                "partial"},
               fmt::format("roof '{}'", decl.name.text).c_str());
    Roof roof;
    roof.name = decl.name.text;
    roof.where = decl.name.where;
    double tributary = 0.0;
    bool tributary_ok = tributary_width(r, s, decl, roof, tributary);
    roof.slippery =
        s.word("surface", {"slippery", "nonslippery"}).value_or("nonslippery") == "slippery";
    s.value("insulation", kNumber, roof.insulation_R);
    roof.ventilated = s.word("ventilated", {"yes", "no"}).value_or("no") == "yes";
    roof.simple_rafters =
        s.word("rafter_spans", {"simple", "continuous"}).value_or("continuous") == "simple";
    if (const syntax::Setting* partial = s.find("partial")) {
        if (partial->value.kind == syntax::Expr::Kind::constant) {
            roof.partial = partial->value.literal;
            roof.partial_where = partial->value.where;
        } else
            r.diagnostics.error(partial->value.where,
                                fmt::format("partial names a pattern rule, or none, as in: "
                                            "partial = {}.partial",
                                            example_standard(r)));
    }
    bool edges_ok = read_edge(r, s, "left", roof.left) & read_edge(r, s, "right", roof.right);
    if (!names.add(decl.name, r.diagnostics) || !found || !tributary_ok || !edges_ok)
        return;
    static const RunWords roof_words{"roof", "a roof is one run of members from eave to eave",
                                     "a roof is one connected surface"};
    auto chain = member_run(r, decl.name, roof_words, members);
    if (!chain)
        return;
    roof.members = std::move(*chain);
    roof.tributary = tributary;
    check_roof_slopes(r, decl, roof);
    r.model.roofs.push_back(std::move(roof));
}

}  // namespace

namespace {

/// The horizontal extent of a resolved roof (m).
std::pair<double, double> roof_extent(const Model& m, const Roof& roof) {
    double lo = std::numeric_limits<double>::infinity(),
           hi = -std::numeric_limits<double>::infinity();
    for (MemberId id : roof.members) {
        for (NodeId n : {m.members[at(id)].start, m.members[at(id)].end}) {
            lo = std::min(lo, m.nodes[at(n)].x);
            hi = std::max(hi, m.nodes[at(n)].x);
        }
    }
    return {lo, hi};
}

/// `projection unit on main { left_face = ..., width = ..., face_length = ..., height = ... }`
void resolve_projection(Resolver& r, const syntax::RoofDecl& decl, const NameTable& roof_names,
                        NameTable& names) {
    Settings s(r, decl.settings, {"left_face", "width", "face_length", "height"},
               fmt::format("projection '{}'", decl.name.text).c_str());
    Projection p;
    p.name = decl.name.text;
    p.where = decl.name.where;
    bool ok = names.add(decl.name, r.diagnostics);
    for (const char* key : {"left_face", "width", "face_length", "height"}) {
        if (s.find(key) == nullptr) {
            r.diagnostics.error(decl.name.where,
                                fmt::format("projection '{}' needs its {}", p.name, key));
            ok = false;
        }
    }
    bool values_ok = s.value("left_face", expected::length, p.left_face) &
                     positive_length(r, s, "width", p.width) &
                     positive_length(r, s, "face_length", p.face_length) &
                     positive_length(r, s, "height", p.height);
    ok = ok && values_ok;
    const syntax::Name& roof_name = decl.members.front();
    auto roof = std::find_if(r.model.roofs.begin(), r.model.roofs.end(),
                             [&](const Roof& x) { return x.name == roof_name.text; });
    if (roof == r.model.roofs.end()) {
        if (!roof_names.find_quietly(roof_name.text))
            roof_names.find(roof_name, r.diagnostics);  // reports the unknown roof
        return;                                         // a roof that failed has its own error
    }
    auto [lo, hi] = roof_extent(r.model, *roof);
    if (ok && (p.left_face < 0.0 || p.left_face + p.width > hi - lo + 1e-9)) {
        r.diagnostics.error(
            s.find("left_face")->value.where,
            fmt::format("projection '{}' does not stand on roof '{}': it must "
                        "lie within the roof's horizontal length, {}",
                        p.name, roof->name,
                        fmt::format("{:g} {}", r.model.units.length.from_si(hi - lo),
                                    r.model.units.length.name)));
        ok = false;
    }
    if (!ok)
        return;
    p.roof = static_cast<std::size_t>(roof - r.model.roofs.begin());
    r.model.projections.push_back(std::move(p));
}

/// A roof that snow slides from must be another roof of the model.
void check_sliding_sources(Resolver& r, const NameTable& names) {
    for (const Roof& roof : r.model.roofs) {
        for (const Roof::Edge* edge : {&roof.left, &roof.right}) {
            if (edge->sliding_from.empty())
                continue;
            if (edge->sliding_from == roof.name) {
                r.diagnostics.error(edge->sliding_where,
                                    "snow slides onto a roof from another, higher roof");
            } else if (!names.find_quietly(edge->sliding_from)) {
                r.diagnostics.error(edge->sliding_where,
                                    fmt::format("unknown roof '{}'{}", edge->sliding_from,
                                                did_you_mean(edge->sliding_from, names.names())));
            }
        }
    }
}

}  // namespace

void resolve_amendments(Resolver& r, const std::vector<const syntax::AmendDecl*>& amends) {
    for (const syntax::AmendDecl* decl : amends)
        r.constants.amend(*decl, r.diagnostics);
}

namespace {

/// The amendments in force, with their values, for the report.
void record_amendments(Resolver& r, const std::vector<const syntax::AmendDecl*>& amends) {
    for (const syntax::AmendDecl* decl : amends) {
        if (!r.constants.applies(*decl))
            continue;
        if (auto q = r.constants.lookup(decl->name.text, r.diagnostics)) {
            r.model.amendments.push_back(
                Amendment{decl->name.text, q->value, q->dimension, decl->reason, decl->name.where});
        }
    }
}

}  // namespace

void resolve_snow(Resolver& r, const std::vector<const syntax::SnowDecl*>& snow,
                  const std::vector<const syntax::RoofDecl*>& roofs,
                  const std::vector<const syntax::RoofDecl*>& projections,
                  const std::vector<const syntax::AmendDecl*>& amends,
                  const std::vector<const syntax::Statement*>& snow_statements) {
    record_amendments(r, amends);
    for (std::size_t i = 1; i < snow_statements.size(); ++i) {
        Diagnostic& d = r.diagnostics.error(
            snow_statements[i]->where,
            "the snow data are already given; a model has one site and one standard");
        d.note(snow_statements[0]->where, "first given here");
    }
    if (!snow.empty())
        resolve_site(r, *snow[0]);
    NameTable names{"roof"};
    for (const syntax::RoofDecl* decl : roofs) {
        resolve_roof(r, *decl, names);
        if (snow.empty()) {
            r.diagnostics.error(decl->name.where,
                                fmt::format("roof '{}' needs the site's snow data: add a snow "
                                            "block such as  snow S {{ standard = {} ... }}",
                                            decl->name.text, example_standard(r)));
        }
    }
    check_sliding_sources(r, names);
    NameTable projection_names{"projection"};
    for (const syntax::RoofDecl* decl : projections)
        resolve_projection(r, *decl, names, projection_names);
}

}  // namespace firn::resolve_detail
