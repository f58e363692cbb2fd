// snow: the snow provisions' formulas. The standard's numbers and clauses come from
// its library module (model.snow->tables); every value derived here is
// written to the trace with its formula, the values put in and its clause.
// Drifts and sliding snow are in snow_drift.cpp.
#include "derive/snow.hpp"

#include "derive/arrange.hpp"
#include "derive/derive.hpp"
#include "derive/snow_internal.hpp"

namespace firn {
namespace snow_detail {

std::size_t curve_of(double Ct) {
    return Ct <= 1.0 + 1e-9 ? 0 : (Ct < 1.2 - 1e-9 ? 1 : 2);
}

Geometry geometry_of(const Model& m, MemberId id) {
    const Member& member = m.members[at(id)];
    const Node& a = m.nodes[at(member.start)];
    const Node& b = m.nodes[at(member.end)];
    double run = std::abs(b.x - a.x);
    return Geometry{std::atan2(std::abs(b.y - a.y), run), run};
}

RoofShape shape_of(const Model& m, const Roof& roof) {
    RoofShape shape;
    double top = -std::numeric_limits<double>::infinity(), top_x = 0.0;
    for (MemberId id : roof.members) {
        for (NodeId n : {m.members[at(id)].start, m.members[at(id)].end}) {
            const Node& node = m.nodes[at(n)];
            shape.left = std::min(shape.left, node.x);
            shape.right = std::max(shape.right, node.x);
            if (node.y > top + 1e-9) {
                top = node.y;
                top_x = node.x;
            }
        }
    }
    if (top_x > shape.left + 1e-6 && top_x < shape.right - 1e-6)
        shape.ridge = top_x;
    return shape;
}

double eave_to_ridge(const RoofShape& shape) {
    if (!shape.ridge)
        return shape.right - shape.left;
    return std::max(*shape.ridge - shape.left, shape.right - *shape.ridge);
}

namespace {

/// Cs on a curve that is 1 up to its knee and falls linearly to 0 at `zero`.
double on_curve(double knee, double zero, double slope) {
    if (slope <= knee)
        return 1.0;
    if (slope >= zero)
        return 0.0;
    return 1.0 - (slope - knee) / (zero - knee);
}

/// Whether a citation is of a clause whose values were entered from memory (the
/// library lists them); the trace marks them so a reviewer verifies them against
/// the printed standard.
bool from_memory(const SnowTables& t, std::string_view clause) {
    return std::any_of(t.from_memory.begin(), t.from_memory.end(),
                       [&](const std::string& c) { return clause.ends_with(c); });
}

}  // namespace

void SnowDeriver::trace_site() {
    heading("Snow data {}: {}, {}", {text(site_.name), text(t_.edition), text(t_.chapter)});
    for (const Amendment& a : m_.amendments) {
        TraceValue value = a.dimension == dim::pressure ? pressure(a.value)
                           : a.dimension == dim::length ? length(a.value)
                                                        : number(a.value);
        line("amended: {} = {} because \"{}\"", {text(a.name), value, text(a.reason)});
        out_.snow_trace.back().provenance = Provenance::given;
    }
    if (t_.pg_per_risk_category) {
        line(
            "pg = {}, the ground snow load of risk category {} (given, from the site's hazard "
            "data)",
            {pressure(site_.pg), text(site_.risk)}, t_.clause.pg);
    } else {
        line("pg = {}, the ground snow load (given)", {pressure(site_.pg)}, t_.clause.pg);
    }
    name_last("pg", 0);
    trace_factor("Ce", site_.Ce,
                 fmt::format("terrain {}, {} exposed", site_.terrain, site_.exposure));
    trace_factor("Ct", site_.Ct, fmt::format("thermal condition {}", site_.thermal));
    if (t_.drift_winter_wind && site_.W2 > 0.0) {
        line("W2 = {}, the winter wind parameter (given, from the site's hazard data)",
             {number(site_.W2)}, t_.clause.drift_height);
        name_last("W2", 0);
    }
    if (!t_.importance_applies) {
        pf_ = t_.pf_factor * site_.Ce.value * site_.Ct.value * site_.pg;
        line("pf = {} Ce Ct pg = {} x {} x {} x {} = {} (no importance factor: risk is in pg)",
             {number(t_.pf_factor), number(t_.pf_factor), factor(site_.Ce.value),
              factor(site_.Ct.value), pressure(site_.pg), pressure(pf_)},
             t_.clause.pf);
        name_last("pf", 5);
    } else {
        trace_factor("Is", site_.Is, fmt::format("risk category {}", site_.risk));
        pf_ = t_.pf_factor * site_.Ce.value * site_.Ct.value * site_.Is.value * site_.pg;
        line("pf = {} Ce Ct Is pg = {} x {} x {} x {} x {} = {}",
             {number(t_.pf_factor), number(t_.pf_factor), factor(site_.Ce.value),
              factor(site_.Ct.value), factor(site_.Is.value), pressure(site_.pg), pressure(pf_)},
             t_.clause.pf);
        name_last("pf", 6);
    }
    if (t_.Cs_curve_by_thermal) {
        static const char* const curves[] = {"warm roof", "cold ventilated roof", "cold roof"};
        line("slope factor curve: {}, chosen by thermal condition {} (not by the Ct value)",
             {text(curves[site_.Cs_curve]), text(site_.thermal)}, t_.clause.Cs_curve);
    }
}

void SnowDeriver::trace_factor(const char* symbol, const SnowFactor& f, const std::string& basis) {
    if (f.read_by_model) {
        line("{} = {}, {}, read by the model from {}: \"{}\"",
             {text(symbol), factor(f.value), text(basis), text(f.table), text(f.reason)},
             fmt::format("{} {}", t_.edition, f.table));
        out_.snow_trace.back().provenance = Provenance::given;
    } else if (f.reason.empty()) {
        line("{} = {}, {}", {text(symbol), factor(f.value), text(basis)},
             fmt::format("{} {}", t_.edition, f.table));
        out_.snow_trace.back().provenance = Provenance::table;
    } else {
        line("{} = {}, given instead of {}: \"{}\"",
             {text(symbol), factor(f.value), text(f.table), text(f.reason)}, "override");
        out_.snow_trace.back().provenance = Provenance::given;
    }
    name_last(symbol, 1);
}

/// Cs from the curve of Fig. 7.4-1 that the thermal factor and surface select.
double SnowDeriver::slope_factor(const Roof& roof, double slope, const std::string& members) {
    std::size_t curve = site_.Cs_curve;
    static const char* const roofs[] = {"warm roof", "cold ventilated roof", "cold roof"};
    bool slippery = roof.slippery;
    if (slippery && curve == 0) {
        double needed =
            roof.ventilated ? t_.warm_slippery_R_ventilated : t_.warm_slippery_R_unventilated;
        if (roof.insulation_R < needed) {
            line(
                "a warm slippery roof takes the slippery curve only with insulation R >= {} ({}); "
                "roof {} has R {}: the curve for other surfaces",
                {number(needed), text(roof.ventilated ? "ventilated" : "unventilated"),
                 text(roof.name), number(roof.insulation_R)},
                t_.clause.slippery);
            slippery = false;
        }
    }
    double knee = t_.Cs_knee[curve][slippery ? 0 : 1];
    double zero = t_.Cs_zero_slope;
    std::string which =
        fmt::format("{}, {} surface", roofs[curve], slippery ? "unobstructed slippery" : "other");
    const std::string& clause = t_.clause.Cs[curve];
    if (slope <= knee) {
        line("Cs = 1.00 for {}: slope {} is not above the knee {} ({})",
             {text(members), degrees(slope), degrees(knee), text(which)}, clause);
        return 1.0;
    }
    if (slope >= zero) {
        line("Cs = 0.00 for {}: slope {} is not below {} ({})",
             {text(members), degrees(slope), degrees(zero), text(which)}, clause);
        return 0.0;
    }
    double cs = 1.0 - (slope - knee) / (zero - knee);
    line("Cs = 1 - (slope - knee)/({} - knee) = 1 - ({} - {})/({} - {}) = {} for {} ({})",
         {degrees(zero), degrees(slope), degrees(knee), degrees(zero), degrees(knee), number(cs, 3),
          text(members), text(which)},
         clause);
    return cs;
}

/// The rain-on-snow surcharge for the balanced case (0 where it does not apply).
double SnowDeriver::rain_on_snow(double slope, double W) {
    const std::string& clause = t_.clause.rain;
    double limit_deg = W / t_.rain_W_per_degree;
    if (!(site_.pg > 0.0)) {
        line("rain-on-snow surcharge not required: pg is zero", clause);
        return 0.0;
    }
    if (site_.pg > t_.rain_pg_limit) {
        line("rain-on-snow surcharge not required: pg = {} is above {}",
             {pressure(site_.pg), pressure(t_.rain_pg_limit)}, clause);
        return 0.0;
    }
    // The slope limit W/50 ft in degrees, as the end of both lines below.
    std::string limit = "W/{} = {} / {} = {} deg";
    std::vector<TraceValue> limit_values{length(t_.rain_W_per_degree), length(W),
                                         length(t_.rain_W_per_degree), number(limit_deg, 2)};
    if (!(slope / kDegree < limit_deg)) {
        std::vector<TraceValue> values{degrees(slope)};
        values.insert(values.end(), limit_values.begin(), limit_values.end());
        line("rain-on-snow surcharge not required: slope {} is not below " + limit,
             std::move(values), clause);
        return 0.0;
    }
    std::vector<TraceValue> values{pressure(t_.rain_surcharge), pressure(site_.pg),
                                   pressure(t_.rain_pg_limit), degrees(slope)};
    values.insert(values.end(), limit_values.begin(), limit_values.end());
    line(
        "rain-on-snow surcharge {} on the balanced load: 0 < pg = {} <= {} and slope {} < " + limit,
        std::move(values), clause);
    return t_.rain_surcharge;
}

/// pm for a low-slope roof (0 where it does not apply): its own case, never a floor on pf.
double SnowDeriver::minimum_load(double slope, const std::string& name) {
    const std::string& clause = t_.clause.pm;
    if (!(slope < t_.pm_max_slope)) {
        line("minimum load pm not required: slope {} is not below {}",
             {degrees(slope), degrees(t_.pm_max_slope)}, clause);
        return 0.0;
    }
    if (t_.pm_cap_per_risk_category)
        return capped_minimum_load(name);
    double is = site_.Is.value;
    if (site_.pg <= t_.pm_pg_limit) {
        double pm = is * site_.pg;
        line("pm = Is pg = {} x {} = {} (pg <= {}), a case of its own",
             {factor(is), pressure(site_.pg), pressure(pm), pressure(t_.pm_pg_limit)}, clause);
        if (pm > 0.0)
            name_last(name, 2);
        return pm;
    }
    double pm = is * t_.pm_pg_limit;
    line("pm = Is x {} = {} x {} = {} (pg > {}), a case of its own",
         {pressure(t_.pm_pg_limit), factor(is), pressure(t_.pm_pg_limit), pressure(pm),
          pressure(t_.pm_pg_limit)},
         clause);
    if (pm > 0.0)
        name_last(name, 3);
    return pm;
}

/// pm = pg of the risk category, at most that category's cap (the library's table).
double SnowDeriver::capped_minimum_load(const std::string& name) {
    double cap = t_.pm_pg_limit;
    if (site_.pg <= cap) {
        line("pm = pg = {}, not above pm,max = {} for risk category {}, a case of its own",
             {pressure(site_.pg), pressure(cap), text(site_.risk)}, t_.clause.pm);
        if (site_.pg > 0.0)
            name_last(name, 0);
        return site_.pg;
    }
    line("pm = pm,max = {} for risk category {} (pg = {} is above it), a case of its own",
         {pressure(cap), text(site_.risk), pressure(site_.pg)}, t_.clause.pm_cap);
    name_last(name, 0);
    return cap;
}

void SnowDeriver::derive_roof(const Roof& roof, LoadCase& balanced, LoadCase& minimum) {
    std::vector<std::string> names;
    double steepest = 0.0;
    for (MemberId id : roof.members) {
        names.push_back(m_.members[at(id)].name);
        steepest = std::max(steepest, geometry_of(m_, id).slope);
    }
    heading("Roof {}: members {}; tributary width {}; {} surface",
            {text(roof.name), text(fmt::format("{}", fmt::join(names, ", "))),
             length(roof.tributary), text(roof.slippery ? "unobstructed slippery" : "other")});
    const Roof::Tributary& t = roof.tributary_from;
    if (!t.frame.empty()) {
        bool overhang = t.overhang > 0.0;
        std::vector<TraceValue> values{text(t.frame), length(t.left_bay), length(t.right_bay)};
        if (overhang)
            values.push_back(length(t.overhang));
        values.push_back(length(roof.tributary));
        line(fmt::format("tributary width of the frame on plan line {{}} = half of each bay beside "
                         "it{} = ({{}} + {{}}) / 2{} = {{}}",
                         overhang ? ", plus the overhang" : "", overhang ? " + {}" : ""),
             std::move(values), "common practice");
    }
    double W = eave_to_ridge(shape_of(m_, roof));
    double rain = rain_on_snow(steepest, W);
    // One Cs per roof plane: members of equal slope share it.
    std::vector<char> done(roof.members.size(), 0);
    std::vector<double> ps_of(roof.members.size(), 0.0);
    std::vector<std::size_t> ps_step(roof.members.size(), 0);  // the trace step of each ps
    for (std::size_t i = 0; i < roof.members.size(); ++i) {
        if (done[i])
            continue;
        double slope = geometry_of(m_, roof.members[i]).slope;
        std::vector<MemberId> plane;
        std::vector<std::string> plane_names;
        std::vector<std::size_t> same_plane;
        for (std::size_t j = i; j < roof.members.size(); ++j) {
            if (!done[j] && std::abs(geometry_of(m_, roof.members[j]).slope - slope) < kSameSlope) {
                done[j] = 1;
                same_plane.push_back(j);
                plane.push_back(roof.members[j]);
                plane_names.push_back(m_.members[at(roof.members[j])].name);
            }
        }
        double cs = slope_factor(roof, slope, fmt::format("{}", fmt::join(plane_names, ", ")));
        double ps = cs * pf_;
        for (std::size_t j : same_plane) {
            ps_of[j] = ps;
            ps_step[j] = out_.snow_trace.size();
        }
        line("ps = Cs pf = {} x {} = {}", {number(cs, 3), pressure(pf_), pressure(ps)},
             t_.clause.ps);
        double p = ps + rain;
        if (rain > 0.0) {
            line("balanced load = ps + rain-on-snow = {} + {} = {}",
                 {pressure(ps), pressure(rain), pressure(p)}, t_.clause.rain);
        }
        line("on the members: {} x {} = {} down, on the horizontal projection",
             {pressure(p), length(roof.tributary), line_load(p * roof.tributary)});
        load_members(roof, plane, p, balanced);
        load_members(roof, plane, ps, plain_balanced_);
    }
    // The roof's ps is the largest of its planes'.
    std::size_t largest =
        static_cast<std::size_t>(std::max_element(ps_of.begin(), ps_of.end()) - ps_of.begin());
    out_.snow_trace[ps_step[largest]].names.push_back({roof.name + ".ps", 2});
    unbalanced(roof, ps_of, steepest);
    drift_at(roof, ps_of.front(), true);
    drift_at(roof, ps_of.back(), false);
    adjacent_drift(roof, ps_of.front(), true);
    adjacent_drift(roof, ps_of.back(), false);
    sliding_onto(roof, true);
    sliding_onto(roof, false);
    ice_dam(roof);
    double pm = minimum_load(steepest, roof.name + ".pm");
    if (pm > 0.0) {
        line("on the members (case {}.minimum): {} x {} = {} down, on the horizontal projection",
             {text(site_.name), pressure(pm), length(roof.tributary),
              line_load(pm * roof.tributary)});
        load_members(roof, roof.members, pm, minimum);
    }
    // Last: each projection opens a part of the trace of its own.
    for (const Projection& p : m_.projections) {
        if (&m_.roofs[p.roof] == &roof)
            projection_drifts(p, ps_of);
    }
}

/// Partial loading (Sec. 7.5.1): the balanced load ps (without rain-on-snow) on
/// some spans of the roof and a fraction of it on the others, by the library's
/// rule (or the roof's own); the other roofs keep their balanced load.
void SnowDeriver::partial_loads(const Roof& roof) {
    const std::string& clause = t_.clause.partial;
    std::string rule_name = roof.partial.empty() ? site_.standard + ".partial" : roof.partial;
    heading("Partial loads on roof {}", {text(roof.name)});
    if (rule_name == "none") {
        line("partial loading not applied: the roof says partial = none", {}, clause);
        return;
    }
    auto rule = std::find_if(m_.patterns.begin(), m_.patterns.end(),
                             [&](const PatternRule& p) { return p.name == rule_name; });
    if (rule == m_.patterns.end()) {
        line("partial loading not applied: no pattern rule {} (is 'use {}' missing?)",
             {text(rule_name), text(site_.standard)}, clause);
        return;
    }
    double steepest = 0.0;
    for (MemberId id : roof.members)
        steepest = std::max(steepest, geometry_of(m_, id).slope);
    if (shape_of(m_, roof).ridge && std::tan(steepest) >= t_.partial_gable_exempt_rise - 1e-12) {
        line(
            "partial loading not required: the members span perpendicular to the ridge of a gable "
            "roof sloped {}, not below {}",
            {degrees(steepest), degrees(std::atan(t_.partial_gable_exempt_rise))}, clause);
        return;
    }
    std::vector<Span> spans = spans_of(m_, roof.members);
    std::vector<std::string> names;
    names.reserve(spans.size());
    for (const Span& span : spans)
        names.push_back(span.cantilever ? span.name + " (cantilever)" : span.name);
    if (spans.size() < 2) {
        line("partial loading not required: roof {} has one span, {}",
             {text(roof.name), text(fmt::format("{}", fmt::join(names, ", ")))}, clause);
        return;
    }
    line("spans {}, arranged by rule {}; the other roofs carry their balanced load",
         {text(fmt::format("{}", fmt::join(names, ", "))), text(rule->name)}, clause);
    for (const Arrangement& a : arrangements_of(*rule, spans)) {
        LoadCase lc = arranged_case(m_, plain_balanced_, roof.members, spans, a,
                                    fmt::format("{}.partial.{}.{}", site_.name, roof.name, a.name));
        lc.arrangement_of.clear();
        line("case {}: ps x {}", {text(lc.name), text(a.description)}, clause);
        add_case(std::move(lc));
    }
}

/// Unbalanced loads on a gable (Sec. 7.6.1): one case for wind from each side.
void SnowDeriver::unbalanced(const Roof& roof, const std::vector<double>& ps, double steepest) {
    const std::string& clause = t_.clause.unbalanced;
    RoofShape shape = shape_of(m_, roof);
    if (!shape.ridge) {
        line(
            "unbalanced load not required: roof {} is not a hip or gable roof (no ridge between "
            "its eaves)",
            {text(roof.name)}, clause);
        return;
    }
    double rise = std::tan(steepest);
    if (rise < t_.unbalanced_min_rise - 1e-12 || rise > t_.unbalanced_max_rise + 1e-12) {
        line("unbalanced load not required: slope {} is outside {} to {}",
             {degrees(steepest), degrees(std::atan(t_.unbalanced_min_rise)),
              degrees(std::atan(t_.unbalanced_max_rise))},
             clause);
        return;
    }
    line("unbalanced loads, wind from each side: slope {} is within {} to {}",
         {degrees(steepest), degrees(std::atan(t_.unbalanced_min_rise)),
          degrees(std::atan(t_.unbalanced_max_rise))},
         clause);
    unbalanced_case(roof, ps, true, shape);
    unbalanced_case(roof, ps, false, shape);
}

void SnowDeriver::unbalanced_case(const Roof& roof, const std::vector<double>& ps,
                                  bool wind_from_left, const RoofShape& shape) {
    double ridge_x = *shape.ridge;
    const std::string& clause = t_.clause.unbalanced_load;
    LoadCase& lc =
        case_named(wind_from_left ? "unbalanced.wind_from_left" : "unbalanced.wind_from_right");
    // Members on the windward side lie upwind of the ridge.
    auto windward = [&](MemberId id) {
        const Member& mem = m_.members[at(id)];
        double mid = 0.5 * (m_.nodes[at(mem.start)].x + m_.nodes[at(mem.end)].x);
        return wind_from_left ? mid < ridge_x : mid > ridge_x;
    };
    double leeward_slope = 0.0;
    for (std::size_t i = 0; i < roof.members.size(); ++i) {
        if (!windward(roof.members[i]))
            leeward_slope = std::max(leeward_slope, geometry_of(m_, roof.members[i]).slope);
    }
    double W = wind_from_left ? ridge_x - shape.left : shape.right - ridge_x;
    std::string side = wind_from_left ? "wind from the left" : "wind from the right";
    if (roof.simple_rafters && W <= t_.unbalanced_narrow_W) {
        double p = site_.Is.value * site_.pg;
        if (t_.importance_applies) {
            line(
                "{}: W = {} <= {} with simply supported rafters: windward 0, leeward Is pg = {} x "
                "{} = {}",
                {text(side), length(W), length(t_.unbalanced_narrow_W), factor(site_.Is.value),
                 pressure(site_.pg), pressure(p)},
                clause);
        } else {
            line("{}: W = {} <= {} with simply supported rafters: windward 0, leeward pg = {}",
                 {text(side), length(W), length(t_.unbalanced_narrow_W), pressure(p)}, clause);
        }
        for (std::size_t i = 0; i < roof.members.size(); ++i) {
            if (!windward(roof.members[i]))
                load_member(roof, roof.members[i], p, lc);
        }
        return;
    }
    double gamma = snow_density(t_, site_.pg);
    double S = 1.0 / std::tan(leeward_slope);
    line("{}: W = {}; S = 1/tan(slope) = {}", {text(side), length(W), number(S, 2)}, clause);
    trace_density(gamma);
    double hd = drift_height_for(W, "W", fmt::format("unbalanced load of roof {}", roof.name));
    double surcharge = hd * gamma / std::sqrt(S);
    double extent = 8.0 * hd * std::sqrt(S) / 3.0;
    line(
        "windward: {} ps; leeward: ps + hd gamma / sqrt(S) = ps + {} x {} / sqrt({}) = ps + {} "
        "over 8 hd sqrt(S) / 3 = {} from the ridge",
        {number(t_.unbalanced_windward), length(hd), density(gamma), number(S, 2),
         pressure(surcharge), length(extent)},
        clause);
    double from = wind_from_left ? ridge_x : ridge_x - extent;
    double to = wind_from_left ? ridge_x + extent : ridge_x;
    for (std::size_t i = 0; i < roof.members.size(); ++i) {
        MemberId id = roof.members[i];
        if (windward(id)) {
            load_member(roof, id, t_.unbalanced_windward * ps[i], lc);
            continue;
        }
        load_member(roof, id, ps[i], lc);
        load_part(roof, id, from, to, surcharge, lc);
    }
}

void SnowDeriver::load_members(const Roof& roof, const std::vector<MemberId>& members, double p,
                               LoadCase& lc) const {
    for (MemberId id : members)
        load_member(roof, id, p, lc);
}

void SnowDeriver::load_member(const Roof& roof, MemberId id, double p, LoadCase& lc) const {
    load_between(
        roof, id, -std::numeric_limits<double>::infinity(), std::numeric_limits<double>::infinity(),
        [p](double) { return p; }, lc);
}

void SnowDeriver::load_part(const Roof& roof, MemberId id, double x_from, double x_to, double p,
                            LoadCase& lc) const {
    load_between(
        roof, id, x_from, x_to, [p](double) { return p; }, lc);
}

LoadCase& SnowDeriver::case_named(const char* what) {
    std::string name = fmt::format("{}.{}", site_.name, what);
    for (LoadCase& lc : unbalanced_cases_) {
        if (lc.name == name)
            return lc;
    }
    unbalanced_cases_.push_back(new_case(what));
    return unbalanced_cases_.back();
}

/// Members at a roof's ends that overhang: their outer node carries no other
/// member and no support.
std::vector<MemberId> SnowDeriver::overhangs(const Roof& roof) const {
    std::vector<MemberId> found;
    for (MemberId id : {roof.members.front(), roof.members.back()}) {
        const Member& m = m_.members[at(id)];
        bool outer = is_free_end(m_, m.start) || is_free_end(m_, m.end);
        if (outer && std::find(found.begin(), found.end(), id) == found.end())
            found.push_back(id);
    }
    return found;
}

/// Ice dams along eaves (Sec. 7.4.5): 2 pf on the overhangs of a warm roof
/// without enough insulation, a case combined with dead load only.
void SnowDeriver::ice_dam(const Roof& roof) {
    const std::string& clause = t_.clause.ice_dam;
    std::vector<MemberId> eaves = overhangs(roof);
    if (eaves.empty()) {
        line("ice dam load not required: roof {} has no eave overhang", {text(roof.name)}, clause);
        return;
    }
    if (site_.Cs_curve != 0) {
        line("ice dam load not required: not a warm roof (Ct = {}, thermal condition {})",
             {factor(site_.Ct.value), text(site_.thermal)}, clause);
        return;
    }
    double needed = roof.ventilated ? t_.ice_dam_R_ventilated : t_.ice_dam_R_unventilated;
    if (roof.insulation_R >= needed) {
        line("ice dam load not required: insulation R {} is at least {} ({})",
             {number(roof.insulation_R), number(needed),
              text(roof.ventilated ? "ventilated" : "unventilated")},
             clause);
        return;
    }
    double p = t_.ice_dam_factor * pf_;
    std::vector<std::string> names;
    names.reserve(eaves.size());
    for (MemberId id : eaves)
        names.push_back(m_.members[at(id)].name);
    line(
        "ice dam load {} pf = {} x {} = {} on the eave overhangs {} (insulation R {} below {}); "
        "case {}.ice_dam, combined with dead load only",
        {number(t_.ice_dam_factor), number(t_.ice_dam_factor), pressure(pf_), pressure(p),
         text(fmt::format("{}", fmt::join(names, ", "))), number(roof.insulation_R), number(needed),
         text(site_.name)},
        clause);
    if (ice_dam_.name.empty()) {
        ice_dam_ = new_case("ice_dam");
        ice_dam_.with_dead_only = true;
    }
    load_members(roof, eaves, p, ice_dam_);
}

LoadCase SnowDeriver::new_case(const char* what) const {
    LoadCase lc;
    lc.name = fmt::format("{}.{}", site_.name, what);
    lc.kind = CaseKind::snow;
    lc.where = site_.where;
    return lc;
}

void SnowDeriver::add_case(LoadCase lc) {
    const std::vector<LoadCase>& derived = out_.cases;
    for (const std::vector<LoadCase>* cases : {&m_.cases, &derived}) {
        for (const LoadCase& other : *cases) {
            if (other.name == lc.name) {
                Diagnostic& d =
                    d_.error(other.where, fmt::format("load case '{}' has the name of a snow case "
                                                      "that snow data {} make",
                                                      lc.name, site_.name));
                d.note(site_.where, "the snow data are here");
                return;
            }
        }
    }
    out_.cases.push_back(std::move(lc));
}

void SnowDeriver::mark_unverified() {
    bool any = false;
    for (TraceStep& t : out_.snow_trace) {
        if (from_memory(t_, t.clause)) {
            t.provenance = Provenance::from_memory;
            any = true;
        }
    }
    if (any) {
        heading(
            "* values of this clause were entered from memory: verify them against the printed "
            "standard");
    }
}

}  // namespace snow_detail

using namespace snow_detail;

double snow_density(const SnowTables& t, double pg) {
    return std::min(t.density_per_pg * pg + t.density_base, t.density_max);
}

double drift_height(const SnowTables& t, double pg, double lu, double W2) {
    if (t.drift_winter_wind)
        return winter_wind_drift_height(t, pg, lu, W2);
    double lu_ft = std::max(lu, t.drift_min_lu) / kFoot;
    double pg_psf = (pg + t.drift_pg_offset) / kPoundPerSquareFoot;
    double hd_ft =
        t.drift_coefficient * std::cbrt(lu_ft) * std::pow(pg_psf, 0.25) - t.drift_offset / kFoot;
    return std::max(hd_ft, 0.0) * kFoot;
}

double roof_slope_factor(const SnowTables& tables, double Ct, bool slippery, double slope) {
    // An edition that chooses the curve by thermal condition is resolved per site
    // (SnowSite::Cs_curve); this reads the curve a Ct value selects.
    return on_curve(tables.Cs_knee[curve_of(Ct)][slippery ? 0 : 1], tables.Cs_zero_slope, slope);
}

Derivation derive_snow(const Model& model, Diagnostics& diagnostics) {
    Derivation out;
    if (model.snow)
        SnowDeriver(model, out, diagnostics).run();
    return out;
}

}  // namespace firn