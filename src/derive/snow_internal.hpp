// snow_internal: the parts of the snow stage shared by its files (snow.cpp for
// the site, balanced, minimum, unbalanced and ice-dam loads; snow_drift.cpp for
// drifts and sliding snow). Not part of the stage's interface.
#pragma once

#include <fmt/format.h>
#include <algorithm>
#include <cmath>
#include <limits>
#include <optional>
#include <string>
#include <vector>

#include "base/diag.hpp"
#include "base/units.hpp"
#include "ir/derivation.hpp"
#include "ir/model.hpp"

namespace firn::snow_detail {

/// The units the standard's formulas and the trace's angles are written in, from
/// the unit table (exact definitions).
inline const double kDegree = find_unit("deg")->to_si;
inline const double kFoot = find_unit("ft")->to_si;
inline const double kPoundPerSquareFoot = find_unit("psf")->to_si;
/// Slopes closer than this are one slope (rad): members of one roof plane.
constexpr double kSameSlope = 1e-6;

/// Which curve of Fig. 7.4-1 a thermal factor selects: warm, cold ventilated, cold.
std::size_t curve_of(double Ct);

/// The slope of a member from horizontal (rad) and its horizontal length (m).
struct Geometry {
    double slope;
    double run;
};
Geometry geometry_of(const Model& m, MemberId id);

/// A roof's horizontal extent and its ridge (its highest node strictly between
/// its ends), if it has one.
struct RoofShape {
    double left = std::numeric_limits<double>::infinity(),
           right = -std::numeric_limits<double>::infinity();
    std::optional<double> ridge;
};
RoofShape shape_of(const Model& m, const Roof& roof);

/// W for rain-on-snow: the horizontal distance from an eave to the ridge, or
/// the whole run of a roof without one.
double eave_to_ridge(const RoofShape& shape);

class SnowDeriver {
  public:
    SnowDeriver(const Model& m, Derivation& out, Diagnostics& d)
        : m_(m), out_(out), d_(d), site_(*m.snow), t_(m.snow->tables) {}

    void run() {
        trace_site();
        LoadCase balanced = new_case("balanced");
        LoadCase minimum = new_case("minimum");
        plain_balanced_ = new_case("balanced");
        for (const Roof& roof : m_.roofs)
            derive_roof(roof, balanced, minimum);
        add_case(std::move(balanced));
        if (!minimum.distributed.empty())
            add_case(std::move(minimum));
        for (LoadCase& lc : unbalanced_cases_)
            add_case(std::move(lc));
        for (const Roof& roof : m_.roofs)
            partial_loads(roof);
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
    const Model& m_;
    Derivation& out_;
    Diagnostics& d_;
    const SnowSite& site_;
    const SnowTables& t_;
    double pf_ = 0.0;

    static TraceValue quantity(double si, Dimension dimension) {
        return TraceValue{TraceValue::Kind::quantity, si, dimension, -1, {}};
    }
    static TraceValue pressure(double pa) { return quantity(pa, dim::pressure); }
    static TraceValue length(double m) { return quantity(m, dim::length); }
    static TraceValue line_load(double n_per_m) { return quantity(n_per_m, dim::force_per_length); }
    static TraceValue density(double n_per_m3) { return quantity(n_per_m3, dim::unit_weight); }
    static TraceValue degrees(double rad) {
        return TraceValue{TraceValue::Kind::angle, rad, dim::number, 2, {}};
    }
    /// A plain number with `decimals`, or in its shortest form (-1).
    static TraceValue number(double v, int decimals = -1) {
        return TraceValue{TraceValue::Kind::number, v, dim::number, decimals, {}};
    }
    static TraceValue factor(double v) { return number(v, 2); }
    static TraceValue text(std::string words) {
        return TraceValue{TraceValue::Kind::text, 0.0, dim::number, -1, std::move(words)};
    }

    /// A step of the trace: its formula with a `{}` for each value, and its clause.
    void line(std::string formula, std::vector<TraceValue> values = {}, std::string clause = "") {
        out_.snow_trace.push_back(
            TraceStep{std::move(formula), std::move(values), {}, std::move(clause), {}, false});
    }
    void line(std::string formula, std::string_view clause) {
        line(std::move(formula), {}, std::string(clause));
    }
    /// Names value `index` of the last step for expectations (`expect snow NAME ...`).
    void name_last(std::string name, std::size_t index) {
        out_.snow_trace.back().names.push_back(TraceStep::Name{std::move(name), index});
    }
    void heading(std::string formula, std::vector<TraceValue> values = {}) {
        out_.snow_trace.push_back(
            TraceStep{std::move(formula), std::move(values), {}, "", {}, true});
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
    void partial_loads(const Roof& roof);
    void drift_at(const Roof& roof, double ps, bool left_end);
    void adjacent_drift(const Roof& roof, double ps, bool left_end);
    void projection_drifts(const Projection& p, const std::vector<double>& ps);
    double ps_at(const Roof& roof, const std::vector<double>& ps, double x, bool before) const;
    /// A drift's height and width.
    struct Triangle {
        double hd;
        double w;
    };
    bool clear_height(const std::string& where, double ps, double wall, double& hc,
                      const std::string& clause);
    Triangle capped_triangle(double hd, double hc, const std::string& clause);
    void place_drift(const Roof& roof, const std::string& case_name, double wall_x, double toward,
                     Triangle drift, double room, double breadth, const std::string& clause);
    void sliding_onto(const Roof& roof, bool left_end);
    void ice_dam(const Roof& roof);
    std::vector<MemberId> overhangs(const Roof& roof) const;
    void drift_load(const Roof& roof, double wall_x, double toward, double w, double pd,
                    LoadCase& lc) const;
    double slope_factor(const Roof& roof, double slope, const std::string& members);
    double rain_on_snow(double slope, double W);
    /// pm, naming it `name` where it applies.
    double minimum_load(double slope, const std::string& name);
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
    void trace_winter_wind_drift(double lu, double hd, const char* lu_is);
    /// hd for an upwind length `lu`, traced; 0 with an error when the edition's
    /// formula needs W2 and the snow data lack it (`what`: the drift that needs it).
    double drift_height_for(double lu, const char* lu_is, const std::string& what);
    bool reported_missing_W2_ = false;
    double capped_minimum_load(const std::string& name);
    /// A wall's leeward and windward drifts as two cases (the edition's switch).
    void separate_drifts(const Roof& roof, const std::string& case_name, double wall_x,
                         double toward, Triangle leeward, Triangle windward, double room,
                         const std::string& clause);
    void mark_unverified();
};

}  // namespace firn::snow_detail
