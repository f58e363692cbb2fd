// snow: ASCE 7-16 Chapter 7, the formulas. The standard's numbers come from
// its library module (model.snow->tables); every value derived here is
// written to the trace with its formula, the values put in and its clause.
#include "snow.hpp"

#include <fmt/format.h>
#include <algorithm>
#include <cmath>
#include <numbers>

namespace firn {
namespace {

constexpr double kDegree = std::numbers::pi / 180.0;
constexpr double kFoot = 0.3048;                                           // m, exact
constexpr double kPoundPerSquareFoot = 4.4482216152605 / (kFoot * kFoot);  // Pa, exact
/// Slopes closer than this are one slope (rad): members of one roof plane.
constexpr double kSameSlope = 1e-6;

/// Clauses whose values were entered from memory (see stdlib/asce7_16.firn);
/// the trace marks them so a reviewer verifies them against the printed standard.
bool from_memory(std::string_view clause) {
    for (std::string_view c :
         {"Table 7.3-1", "Table 1.5-2", "Sec. 7.3.4", "Sec. 7.10", "Fig. 7.4-1a", "Fig. 7.4-1b",
          "Fig. 7.4-1c", "Sec. 7.4.1", "Sec. 7.6.1", "Fig. 7.6-2", "Fig. 7.6-1", "Sec. 7.7.1",
          "Sec. 7.8", "Sec. 7.4.5", "Sec. 7.9"}) {
        if (clause.ends_with(c))
            return true;
    }
    return false;
}

/// Which curve of Fig. 7.4-1 a thermal factor selects: warm, cold ventilated, cold.
std::size_t curve_of(double Ct) {
    return Ct <= 1.0 + 1e-9 ? 0 : (Ct < 1.2 - 1e-9 ? 1 : 2);
}

/// Cs on a curve that is 1 up to its knee and falls linearly to 0 at `zero`.
double on_curve(double knee, double zero, double slope) {
    if (slope <= knee)
        return 1.0;
    if (slope >= zero)
        return 0.0;
    return 1.0 - (slope - knee) / (zero - knee);
}

/// The slope of a member from horizontal (rad) and its horizontal length (m).
struct Geometry {
    double slope;
    double run;
};

Geometry geometry_of(const Model& m, MemberId id) {
    const Member& member = m.members[at(id)];
    const Node& a = m.nodes[at(member.start)];
    const Node& b = m.nodes[at(member.end)];
    double run = std::abs(b.x - a.x);
    return Geometry{std::atan2(std::abs(b.y - a.y), run), run};
}

/// A roof's horizontal extent and its ridge (its highest node strictly between
/// its ends), if it has one.
struct RoofShape {
    double left = INFINITY, right = -INFINITY;
    std::optional<double> ridge;
};

RoofShape shape_of(const Model& m, const Roof& roof) {
    RoofShape shape;
    double top = -INFINITY, top_x = 0.0;
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

/// W for rain-on-snow: the horizontal distance from an eave to the ridge, or
/// the whole run of a roof without one.
double eave_to_ridge(const RoofShape& shape) {
    if (!shape.ridge)
        return shape.right - shape.left;
    return std::max(*shape.ridge - shape.left, shape.right - *shape.ridge);
}

class SnowDeriver {
  public:
    SnowDeriver(Model& m, Diagnostics& d)
        : m_(m), d_(d), site_(*m.snow), t_(m.snow->tables), u_(m.units) {}

    void run() {
        trace_site();
        LoadCase balanced = new_case("balanced");
        LoadCase minimum = new_case("minimum");
        for (const Roof& roof : m_.roofs)
            derive_roof(roof, balanced, minimum);
        add_case(std::move(balanced));
        if (!minimum.distributed.empty())
            add_case(std::move(minimum));
        for (LoadCase& lc : unbalanced_cases_)
            add_case(std::move(lc));
        if (!ice_dam_.distributed.empty())
            add_case(std::move(ice_dam_));
        for (LoadCase& lc : drift_cases_) {
            // A drift rides on the balanced load of every roof (without rain-on-snow).
            lc.distributed.insert(lc.distributed.begin(), plain_balanced_.distributed.begin(),
                                  plain_balanced_.distributed.end());
            add_case(std::move(lc));
        }
        mark_unverified();
    }

  private:
    Model& m_;
    Diagnostics& d_;
    const SnowSite& site_;
    const SnowTables& t_;
    const DisplayUnits& u_;
    double pf_ = 0.0;

    std::string pressure(double pa) const {
        return fmt::format("{:.{}f} {}", u_.pressure.from_si(pa), u_.pressure.decimals,
                           u_.pressure.name);
    }
    std::string length(double m) const {
        return fmt::format("{:.{}f} {}", u_.length.from_si(m), u_.length.decimals, u_.length.name);
    }
    std::string line_load(double n_per_m) const {
        return fmt::format("{:.{}f} {}", u_.force_per_length.from_si(n_per_m),
                           u_.force_per_length.decimals, u_.force_per_length.name);
    }
    static std::string degrees(double rad) { return fmt::format("{:.2f} deg", rad / kDegree); }
    static std::string factor(double v) { return fmt::format("{:.2f}", v); }

    void line(std::string text, std::string clause = "") {
        m_.snow_trace.push_back(TraceLine{std::move(text), std::move(clause), false});
    }
    void heading(std::string text) {
        m_.snow_trace.push_back(TraceLine{std::move(text), "", true});
    }

    void trace_site();
    void trace_factor(const char* symbol, const SnowFactor& f, const std::string& basis);
    void derive_roof(const Roof& roof, LoadCase& balanced, LoadCase& minimum);
    void unbalanced(const Roof& roof, const std::vector<double>& ps, double steepest);
    void unbalanced_case(const Roof& roof, const std::vector<double>& ps, bool wind_from_left,
                         const RoofShape& shape);
    std::vector<LoadCase> unbalanced_cases_;
    std::vector<LoadCase> drift_cases_;
    LoadCase plain_balanced_;  ///< ps on every roof, for the drift cases
    LoadCase ice_dam_;         ///< 2 pf on eave overhangs (combined with dead load only)
    void drift_at(const Roof& roof, double ps, bool left_end);
    void sliding_onto(const Roof& roof, bool left_end);
    void ice_dam(const Roof& roof);
    std::vector<MemberId> overhangs(const Roof& roof) const;
    void drift_load(const Roof& roof, double wall_x, double toward, double w, double pd,
                    LoadCase& lc) const;
    double slope_factor(const Roof& roof, double slope, const std::string& members);
    double rain_on_snow(double slope, double W);
    double minimum_load(double slope);
    LoadCase new_case(const char* what) const;
    void add_case(LoadCase lc);
    void load_members(const Roof& roof, const std::vector<MemberId>& members, double pressure,
                      LoadCase& lc) const;
    void load_member(const Roof& roof, MemberId id, double pressure, LoadCase& lc) const;
    /// A pressure `pressure_at(x)`, linear in x, over the part of a member between two
    /// x on the horizontal projection, cut where the part crosses the member's ends.
    template <typename Pressure>
    void load_between(const Roof& roof, MemberId id, double x_from, double x_to,
                      Pressure pressure_at, LoadCase& lc) const {
        const Member& mem = m_.members[at(id)];
        double xs = m_.nodes[at(mem.start)].x, xe = m_.nodes[at(mem.end)].x;
        double lo = std::max(std::min(xs, xe), x_from), hi = std::min(std::max(xs, xe), x_to);
        double pa = pressure_at(lo), pb = pressure_at(hi);
        if (!(hi - lo > 1e-9) || (pa == 0.0 && pb == 0.0))
            return;
        // Positions are measured from the start node, which may be the right end.
        double a = std::abs(lo - xs), b = std::abs(hi - xs);
        if (a > b) {
            std::swap(a, b);
            std::swap(pa, pb);
        }
        DistributedLoad load;
        load.member = id;
        load.direction = LoadDirection::down;
        load.projected = true;
        load.start = a;
        load.end = b;
        load.w_start = pa * roof.tributary;
        load.w_end = pb * roof.tributary;
        load.where = roof.where;
        lc.distributed.push_back(load);
    }
    void load_part(const Roof& roof, MemberId id, double x_from, double x_to, double pressure,
                   LoadCase& lc) const;
    LoadCase& case_named(const char* what);
    void trace_density(double gamma);
    void trace_drift(double lu, double hd, const char* lu_is);
    std::string density(double n_per_m3) const {
        return fmt::format("{:.{}f} {}", u_.unit_weight.from_si(n_per_m3), u_.unit_weight.decimals,
                           u_.unit_weight.name);
    }
    void mark_unverified();
};

void SnowDeriver::trace_site() {
    heading(fmt::format("Snow data {}: {}, Chapter 7", site_.name, "ASCE 7-16"));
    for (const Amendment& a : m_.amendments) {
        std::string value = a.dimension == dim::pressure ? pressure(a.value)
                            : a.dimension == dim::length ? length(a.value)
                                                         : fmt::format("{:g}", a.value);
        line(fmt::format("amended: {} = {} because \"{}\"", a.name, value, a.reason));
    }
    line(fmt::format("pg = {}, the ground snow load (given)", pressure(site_.pg)),
         "ASCE 7-16 Sec. 7.2");
    trace_factor("Ce", site_.Ce,
                 fmt::format("terrain {}, {} exposed", site_.terrain, site_.exposure));
    trace_factor("Ct", site_.Ct, fmt::format("thermal condition {}", site_.thermal));
    trace_factor("Is", site_.Is, fmt::format("risk category {}", site_.risk));
    pf_ = t_.pf_factor * site_.Ce.value * site_.Ct.value * site_.Is.value * site_.pg;
    line(fmt::format("pf = {:g} Ce Ct Is pg = {:g} x {} x {} x {} x {} = {}", t_.pf_factor,
                     t_.pf_factor, factor(site_.Ce.value), factor(site_.Ct.value),
                     factor(site_.Is.value), pressure(site_.pg), pressure(pf_)),
         "ASCE 7-16 Eq. 7.3-1");
}

void SnowDeriver::trace_factor(const char* symbol, const SnowFactor& f, const std::string& basis) {
    if (f.reason.empty()) {
        line(fmt::format("{} = {}, {}", symbol, factor(f.value), basis),
             fmt::format("ASCE 7-16 {}", f.table));
    } else {
        line(fmt::format("{} = {}, given instead of {}: \"{}\"", symbol, factor(f.value), f.table,
                         f.reason),
             "override");
    }
}

/// Cs from the curve of Fig. 7.4-1 that the thermal factor and surface select.
double SnowDeriver::slope_factor(const Roof& roof, double slope, const std::string& members) {
    std::size_t curve = curve_of(site_.Ct.value);
    static const char* const figures[] = {"Fig. 7.4-1a", "Fig. 7.4-1b", "Fig. 7.4-1c"};
    static const char* const roofs[] = {"warm roof", "cold ventilated roof", "cold roof"};
    bool slippery = roof.slippery;
    if (slippery && curve == 0) {
        double needed =
            roof.ventilated ? t_.warm_slippery_R_ventilated : t_.warm_slippery_R_unventilated;
        if (roof.insulation_R < needed) {
            line(fmt::format("a warm slippery roof takes the slippery curve only with insulation "
                             "R >= {:g} ({}); roof {} has R {:g}: the curve for other surfaces",
                             needed, roof.ventilated ? "ventilated" : "unventilated", roof.name,
                             roof.insulation_R),
                 "ASCE 7-16 Sec. 7.4.1");
            slippery = false;
        }
    }
    double knee = t_.Cs_knee[curve][slippery ? 0 : 1];
    double zero = t_.Cs_zero_slope;
    std::string which =
        fmt::format("{}, {} surface", roofs[curve], slippery ? "unobstructed slippery" : "other");
    std::string clause = fmt::format("ASCE 7-16 {}", figures[curve]);
    if (slope <= knee) {
        line(fmt::format("Cs = 1.00 for {}: slope {} is not above the knee {} ({})", members,
                         degrees(slope), degrees(knee), which),
             clause);
        return 1.0;
    }
    if (slope >= zero) {
        line(fmt::format("Cs = 0.00 for {}: slope {} is not below {} ({})", members, degrees(slope),
                         degrees(zero), which),
             clause);
        return 0.0;
    }
    double cs = 1.0 - (slope - knee) / (zero - knee);
    line(fmt::format("Cs = 1 - (slope - knee)/({} - knee) = 1 - ({} - {})/({} - {}) = {:.3f} for "
                     "{} ({})",
                     degrees(zero), degrees(slope), degrees(knee), degrees(zero), degrees(knee), cs,
                     members, which),
         clause);
    return cs;
}

/// The rain-on-snow surcharge for the balanced case (0 where it does not apply).
double SnowDeriver::rain_on_snow(double slope, double W) {
    const char* clause = "ASCE 7-16 Sec. 7.10";
    double limit_deg = W / t_.rain_W_per_degree;
    if (!(site_.pg > 0.0)) {
        line("rain-on-snow surcharge not required: pg is zero", clause);
        return 0.0;
    }
    if (site_.pg > t_.rain_pg_limit) {
        line(fmt::format("rain-on-snow surcharge not required: pg = {} is above {}",
                         pressure(site_.pg), pressure(t_.rain_pg_limit)),
             clause);
        return 0.0;
    }
    std::string limit = fmt::format("W/{} = {} / {} = {:.2f} deg", length(t_.rain_W_per_degree),
                                    length(W), length(t_.rain_W_per_degree), limit_deg);
    if (!(slope / kDegree < limit_deg)) {
        line(fmt::format("rain-on-snow surcharge not required: slope {} is not below {}",
                         degrees(slope), limit),
             clause);
        return 0.0;
    }
    line(fmt::format("rain-on-snow surcharge {} on the balanced load: 0 < pg = {} <= {} and "
                     "slope {} < {}",
                     pressure(t_.rain_surcharge), pressure(site_.pg), pressure(t_.rain_pg_limit),
                     degrees(slope), limit),
         clause);
    return t_.rain_surcharge;
}

/// pm for a low-slope roof (0 where it does not apply): its own case, never a floor on pf.
double SnowDeriver::minimum_load(double slope) {
    const char* clause = "ASCE 7-16 Sec. 7.3.4";
    if (!(slope < t_.pm_max_slope)) {
        line(fmt::format("minimum load pm not required: slope {} is not below {}", degrees(slope),
                         degrees(t_.pm_max_slope)),
             clause);
        return 0.0;
    }
    double is = site_.Is.value;
    if (site_.pg <= t_.pm_pg_limit) {
        double pm = is * site_.pg;
        line(fmt::format("pm = Is pg = {} x {} = {} (pg <= {}), a case of its own", factor(is),
                         pressure(site_.pg), pressure(pm), pressure(t_.pm_pg_limit)),
             clause);
        return pm;
    }
    double pm = is * t_.pm_pg_limit;
    line(fmt::format("pm = Is x {} = {} x {} = {} (pg > {}), a case of its own",
                     pressure(t_.pm_pg_limit), factor(is), pressure(t_.pm_pg_limit), pressure(pm),
                     pressure(t_.pm_pg_limit)),
         clause);
    return pm;
}

void SnowDeriver::derive_roof(const Roof& roof, LoadCase& balanced, LoadCase& minimum) {
    std::vector<std::string> names;
    double steepest = 0.0;
    for (MemberId id : roof.members) {
        names.push_back(m_.members[at(id)].name);
        steepest = std::max(steepest, geometry_of(m_, id).slope);
    }
    heading(fmt::format("Roof {}: members {}; tributary width {}; {} surface", roof.name,
                        fmt::join(names, ", "), length(roof.tributary),
                        roof.slippery ? "unobstructed slippery" : "other"));
    const Roof::Tributary& t = roof.tributary_from;
    if (!t.frame.empty()) {
        line(fmt::format("tributary width of the frame on plan line {} = half of each bay beside "
                         "it{} = ({} + {}) / 2{} = {}",
                         t.frame, t.overhang > 0.0 ? ", plus the overhang" : "", length(t.left_bay),
                         length(t.right_bay),
                         t.overhang > 0.0 ? fmt::format(" + {}", length(t.overhang)) : "",
                         length(roof.tributary)),
             "common practice");
    }
    double W = eave_to_ridge(shape_of(m_, roof));
    double rain = rain_on_snow(steepest, W);
    // One Cs per roof plane: members of equal slope share it.
    std::vector<char> done(roof.members.size(), 0);
    std::vector<double> ps_of(roof.members.size(), 0.0);
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
        for (std::size_t j : same_plane)
            ps_of[j] = ps;
        line(fmt::format("ps = Cs pf = {:.3f} x {} = {}", cs, pressure(pf_), pressure(ps)),
             "ASCE 7-16 Eq. 7.4-1");
        double p = ps + rain;
        if (rain > 0.0) {
            line(fmt::format("balanced load = ps + rain-on-snow = {} + {} = {}", pressure(ps),
                             pressure(rain), pressure(p)),
                 "ASCE 7-16 Sec. 7.10");
        }
        line(fmt::format("on the members: {} x {} = {} down, on the horizontal projection",
                         pressure(p), length(roof.tributary), line_load(p * roof.tributary)));
        load_members(roof, plane, p, balanced);
        load_members(roof, plane, ps, plain_balanced_);
    }
    unbalanced(roof, ps_of, steepest);
    drift_at(roof, ps_of.front(), true);
    drift_at(roof, ps_of.back(), false);
    sliding_onto(roof, true);
    sliding_onto(roof, false);
    ice_dam(roof);
    double pm = minimum_load(steepest);
    if (pm > 0.0) {
        line(fmt::format(
            "on the members (case {}.minimum): {} x {} = {} down, on the horizontal "
            "projection",
            site_.name, pressure(pm), length(roof.tributary), line_load(pm * roof.tributary)));
        load_members(roof, roof.members, pm, minimum);
    }
}

/// Unbalanced loads on a gable (Sec. 7.6.1): one case for wind from each side.
void SnowDeriver::unbalanced(const Roof& roof, const std::vector<double>& ps, double steepest) {
    const char* clause = "ASCE 7-16 Sec. 7.6.1";
    RoofShape shape = shape_of(m_, roof);
    if (!shape.ridge) {
        line(fmt::format("unbalanced load not required: roof {} is not a hip or gable roof (no "
                         "ridge between its eaves)",
                         roof.name),
             clause);
        return;
    }
    double rise = std::tan(steepest);
    if (rise < t_.unbalanced_min_rise - 1e-12 || rise > t_.unbalanced_max_rise + 1e-12) {
        line(fmt::format("unbalanced load not required: slope {} is outside {} to {}",
                         degrees(steepest), degrees(std::atan(t_.unbalanced_min_rise)),
                         degrees(std::atan(t_.unbalanced_max_rise))),
             clause);
        return;
    }
    line(fmt::format("unbalanced loads, wind from each side: slope {} is within {} to {}",
                     degrees(steepest), degrees(std::atan(t_.unbalanced_min_rise)),
                     degrees(std::atan(t_.unbalanced_max_rise))),
         clause);
    unbalanced_case(roof, ps, true, shape);
    unbalanced_case(roof, ps, false, shape);
}

void SnowDeriver::unbalanced_case(const Roof& roof, const std::vector<double>& ps,
                                  bool wind_from_left, const RoofShape& shape) {
    double ridge_x = *shape.ridge;
    const char* clause = "ASCE 7-16 Sec. 7.6.1, Fig. 7.6-2";
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
        line(fmt::format("{}: W = {} <= {} with simply supported rafters: windward 0, leeward "
                         "Is pg = {} x {} = {}",
                         side, length(W), length(t_.unbalanced_narrow_W), factor(site_.Is.value),
                         pressure(site_.pg), pressure(p)),
             clause);
        for (std::size_t i = 0; i < roof.members.size(); ++i) {
            if (!windward(roof.members[i]))
                load_member(roof, roof.members[i], p, lc);
        }
        return;
    }
    double gamma = snow_density(t_, site_.pg);
    double hd = drift_height(t_, site_.pg, W);
    double S = 1.0 / std::tan(leeward_slope);
    double surcharge = hd * gamma / std::sqrt(S);
    double extent = 8.0 * hd * std::sqrt(S) / 3.0;
    line(fmt::format("{}: W = {}; S = 1/tan(slope) = {:.2f}", side, length(W), S), clause);
    trace_density(gamma);
    trace_drift(W, hd, "W");
    line(fmt::format("windward: {:g} ps; leeward: ps + hd gamma / sqrt(S) = ps + {} x {} / "
                     "sqrt({:.2f}) = ps + {} over 8 hd sqrt(S) / 3 = {} from the ridge",
                     t_.unbalanced_windward, length(hd), density(gamma), S, pressure(surcharge),
                     length(extent)),
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
        roof, id, -INFINITY, INFINITY, [p](double) { return p; }, lc);
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

void SnowDeriver::trace_density(double gamma) {
    line(fmt::format("gamma = {:g} pg + {} = {:g} x {} + {} = {} (at most {})",
                     t_.density_per_pg * kFoot, density(t_.density_base), t_.density_per_pg * kFoot,
                     pressure(site_.pg), density(t_.density_base), density(gamma),
                     density(t_.density_max)),
         "ASCE 7-16 Eq. 7.7-1");
}

/// The drift height line, with the formula in its own units (ft and psf).
void SnowDeriver::trace_drift(double lu, double hd, const char* lu_is) {
    double used = std::max(lu, t_.drift_min_lu);
    line(fmt::format("hd = {:g} lu^(1/3) (pg + {:g})^(1/4) - {:g} (ft, psf) with lu = {} = {} "
                     "(at least {:g} ft): {:g} x {:.3f}^(1/3) x {:.3f}^(1/4) - {:g} = {:.3f} ft",
                     t_.drift_coefficient, t_.drift_pg_offset / kPoundPerSquareFoot,
                     t_.drift_offset / kFoot, lu_is, length(lu), t_.drift_min_lu / kFoot,
                     t_.drift_coefficient, used / kFoot,
                     (site_.pg + t_.drift_pg_offset) / kPoundPerSquareFoot, t_.drift_offset / kFoot,
                     hd / kFoot),
         "ASCE 7-16 Fig. 7.6-1");
}

/// A drift at a step or parapet at one end of a roof (Sec. 7.7.1, 7.8): the
/// larger of the leeward and windward heights at a step, 0.75 hd at a parapet;
/// width 4 hd, or 4 hd^2/hc with the height cut to hc; at most 8 hc; a triangle
/// from the wall, cut at the roof's far end when it is wider than the roof.
void SnowDeriver::drift_at(const Roof& roof, double ps, bool left_end) {
    const Roof::Edge& edge = left_end ? roof.left : roof.right;
    if (edge.step == 0.0 && edge.parapet == 0.0)
        return;
    const char* end = left_end ? "left" : "right";
    bool step = edge.step > 0.0;
    std::string where = fmt::format("{} at the {} end", step ? "roof step" : "parapet", end);
    std::string clause = step ? "ASCE 7-16 Sec. 7.7.1" : "ASCE 7-16 Sec. 7.8";
    RoofShape shape = shape_of(m_, roof);
    double left = shape.left, right = shape.right;
    double length_of_roof = right - left;
    double gamma = snow_density(t_, site_.pg);
    double hb = ps / gamma;
    double hc = (step ? edge.step : edge.parapet) - hb;
    line(fmt::format("{}: hb = ps / gamma = {} / {} = {}; hc = {} - hb = {}", where, pressure(ps),
                     density(gamma), length(hb), length(step ? edge.step : edge.parapet),
                     length(hc)),
         clause);
    if (hb > 0.0 && hc < 0.2 * hb) {
        line(fmt::format("drift not required at the {}: hc / hb = {:.2f} is below 0.2", where,
                         hc / hb),
             clause);
        return;
    }
    double hd;
    if (step) {
        double leeward = drift_height(t_, site_.pg, edge.upper_length);
        double windward = 0.75 * drift_height(t_, site_.pg, length_of_roof);
        trace_drift(edge.upper_length, leeward, "the upper roof's length");
        trace_drift(length_of_roof, windward / 0.75, "this roof's length");
        hd = std::max(leeward, windward);
        line(fmt::format("leeward hd = {}, windward 0.75 hd = {}: the {} governs", length(leeward),
                         length(windward), leeward >= windward ? "leeward" : "windward"),
             clause);
    } else {
        hd = 0.75 * drift_height(t_, site_.pg, length_of_roof);
        trace_drift(length_of_roof, hd / 0.75, "this roof's length");
        line(fmt::format("parapet drift: 0.75 hd = {}", length(hd)), clause);
    }
    double w = 4.0 * hd;
    if (hd > hc) {
        w = 4.0 * hd * hd / hc;
        line(fmt::format("hd = {} > hc = {}: w = 4 hd^2 / hc = {}, height cut to hc", length(hd),
                         length(hc), length(w)),
             clause);
        hd = hc;
    } else {
        line(fmt::format("hd = {} <= hc = {}: w = 4 hd = {}", length(hd), length(hc), length(w)),
             clause);
    }
    if (w > 8.0 * hc) {
        line(fmt::format("w is at most 8 hc = {}", length(8.0 * hc)), clause);
        w = 8.0 * hc;
    }
    double pd = hd * gamma;
    line(fmt::format("pd = hd gamma = {} x {} = {}, a triangle from the wall over w = {}",
                     length(hd), density(gamma), pressure(pd), length(w)),
         clause);
    if (w > length_of_roof) {
        line(fmt::format("the drift is cut at the roof's far end: w = {} is wider than the roof "
                         "({}); the triangle is not rescaled",
                         length(w), length(length_of_roof)),
             clause);
    }
    drift_cases_.push_back(
        new_case(fmt::format("drift.{}.{}_{}", roof.name, step ? "step" : "parapet", end).c_str()));
    drift_load(roof, left_end ? left : right, left_end ? 1.0 : -1.0, w, pd, drift_cases_.back());
}

/// Sliding snow from a higher roof onto one end of this one (Sec. 7.9): 0.4 pf W
/// per length of eave over 15 ft from the upper eave, on the balanced load.
void SnowDeriver::sliding_onto(const Roof& roof, bool left_end) {
    const Roof::Edge& edge = left_end ? roof.left : roof.right;
    if (edge.sliding_from.empty())
        return;
    const char* clause = "ASCE 7-16 Sec. 7.9";
    const char* end = left_end ? "left" : "right";
    auto upper = std::find_if(m_.roofs.begin(), m_.roofs.end(),
                              [&](const Roof& u) { return u.name == edge.sliding_from; });
    if (upper == m_.roofs.end())
        return;  // reported by resolve
    double slope = 0.0;
    for (MemberId id : upper->members)
        slope = std::max(slope, geometry_of(m_, id).slope);
    double needed = upper->slippery ? t_.sliding_min_rise_slippery : t_.sliding_min_rise_other;
    if (!(std::tan(slope) > needed + 1e-12)) {
        line(fmt::format("sliding snow from roof {} onto the {} end not required: its slope {} "
                         "is not above {} ({} surface)",
                         upper->name, end, degrees(slope), degrees(std::atan(needed)),
                         upper->slippery ? "slippery" : "other"),
             clause);
        return;
    }
    RoofShape up = shape_of(m_, *upper), low = shape_of(m_, roof);
    double W = eave_to_ridge(up);
    double total = t_.sliding_factor * pf_ * W;  // N/m of eave
    double q = total / t_.sliding_width;
    double width = std::min(t_.sliding_width, low.right - low.left);
    line(fmt::format(
             "sliding snow from roof {} onto the {} end: {:g} pf W = {:g} x {} x {} = {} "
             "per length of eave, over {}: {} on {}{}",
             upper->name, end, t_.sliding_factor, t_.sliding_factor, pressure(pf_), length(W),
             line_load(total), length(t_.sliding_width), pressure(q), length(width),
             width < t_.sliding_width ? " (the lower roof is narrower: cut, not raised)" : ""),
         clause);
    drift_cases_.push_back(new_case(fmt::format("sliding.{}.{}", roof.name, end).c_str()));
    double from = left_end ? low.left : low.right - width;
    double to = left_end ? low.left + width : low.right;
    for (MemberId id : roof.members)
        load_part(roof, id, from, to, q, drift_cases_.back());
}

/// Members at a roof's ends that overhang: their outer node carries no other
/// member and no support.
std::vector<MemberId> SnowDeriver::overhangs(const Roof& roof) const {
    std::vector<MemberId> found;
    auto free_end = [&](NodeId n) {
        std::size_t count = 0;
        for (const Member& m : m_.members)
            count += static_cast<std::size_t>(m.start == n) + static_cast<std::size_t>(m.end == n);
        bool supported = std::any_of(m_.supports.begin(), m_.supports.end(),
                                     [&](const Support& s) { return s.node == n; });
        return count == 1 && !supported;
    };
    for (MemberId id : {roof.members.front(), roof.members.back()}) {
        const Member& m = m_.members[at(id)];
        bool outer = free_end(m.start) || free_end(m.end);
        if (outer && std::find(found.begin(), found.end(), id) == found.end())
            found.push_back(id);
    }
    return found;
}

/// Ice dams along eaves (Sec. 7.4.5): 2 pf on the overhangs of a warm roof
/// without enough insulation, a case combined with dead load only.
void SnowDeriver::ice_dam(const Roof& roof) {
    const char* clause = "ASCE 7-16 Sec. 7.4.5";
    std::vector<MemberId> eaves = overhangs(roof);
    if (eaves.empty()) {
        line(fmt::format("ice dam load not required: roof {} has no eave overhang", roof.name),
             clause);
        return;
    }
    if (curve_of(site_.Ct.value) != 0) {
        line(fmt::format("ice dam load not required: not a warm roof (Ct = {})",
                         factor(site_.Ct.value)),
             clause);
        return;
    }
    double needed = roof.ventilated ? t_.ice_dam_R_ventilated : t_.ice_dam_R_unventilated;
    if (roof.insulation_R >= needed) {
        line(
            fmt::format("ice dam load not required: insulation R {:g} is at least {:g} ({})",
                        roof.insulation_R, needed, roof.ventilated ? "ventilated" : "unventilated"),
            clause);
        return;
    }
    double p = t_.ice_dam_factor * pf_;
    std::vector<std::string> names;
    for (MemberId id : eaves)
        names.push_back(m_.members[at(id)].name);
    line(fmt::format("ice dam load {:g} pf = {:g} x {} = {} on the eave overhangs {} (insulation "
                     "R {:g} below {:g}); case {}.ice_dam, combined with dead load only",
                     t_.ice_dam_factor, t_.ice_dam_factor, pressure(pf_), pressure(p),
                     fmt::join(names, ", "), roof.insulation_R, needed, site_.name),
         clause);
    if (ice_dam_.name.empty())
        ice_dam_ = new_case("ice_dam");
    load_members(roof, eaves, p, ice_dam_);
}

/// The drift triangle's member loads: peak pd at `wall_x`, zero at w toward the
/// roof, cut where it crosses member ends and at the roof's end.
void SnowDeriver::drift_load(const Roof& roof, double wall_x, double toward, double w, double pd,
                             LoadCase& lc) const {
    auto intensity = [&](double x) { return pd * std::max(0.0, 1.0 - std::abs(x - wall_x) / w); };
    double far = wall_x + toward * w;
    double lo_drift = std::min(wall_x, far), hi_drift = std::max(wall_x, far);
    for (MemberId id : roof.members)
        load_between(roof, id, lo_drift, hi_drift, intensity, lc);
}

LoadCase SnowDeriver::new_case(const char* what) const {
    LoadCase lc;
    lc.name = fmt::format("{}.{}", site_.name, what);
    lc.kind = CaseKind::snow;
    lc.where = site_.where;
    return lc;
}

void SnowDeriver::add_case(LoadCase lc) {
    for (const LoadCase& other : m_.cases) {
        if (other.name == lc.name) {
            Diagnostic& d =
                d_.error(other.where, fmt::format("load case '{}' has the name of a snow case "
                                                  "that snow data {} make",
                                                  lc.name, site_.name));
            d.note(site_.where, "the snow data are here");
            return;
        }
    }
    m_.cases.push_back(std::move(lc));
}

void SnowDeriver::mark_unverified() {
    bool any = false;
    for (TraceLine& t : m_.snow_trace) {
        if (from_memory(t.clause)) {
            t.clause += " *";
            any = true;
        }
    }
    if (any) {
        heading(
            "* values of this clause were entered from memory: verify them against the printed "
            "standard");
    }
}

}  // namespace

double snow_density(const SnowTables& t, double pg) {
    return std::min(t.density_per_pg * pg + t.density_base, t.density_max);
}

double drift_height(const SnowTables& t, double pg, double lu) {
    double lu_ft = std::max(lu, t.drift_min_lu) / kFoot;
    double pg_psf = (pg + t.drift_pg_offset) / kPoundPerSquareFoot;
    double hd_ft =
        t.drift_coefficient * std::cbrt(lu_ft) * std::pow(pg_psf, 0.25) - t.drift_offset / kFoot;
    return std::max(hd_ft, 0.0) * kFoot;
}

double roof_slope_factor(const SnowTables& tables, double Ct, bool slippery, double slope) {
    return on_curve(tables.Cs_knee[curve_of(Ct)][slippery ? 0 : 1], tables.Cs_zero_slope, slope);
}

void derive_snow(Model& model, Diagnostics& diagnostics) {
    if (!model.snow)
        return;
    SnowDeriver(model, diagnostics).run();
}

}  // namespace firn
