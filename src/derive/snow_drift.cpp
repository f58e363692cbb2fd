// snow_drift: drifts at roof steps, parapets, adjacent structures and roof
// projections (the standard's Sec. 7.7, 7.8) and sliding snow (Sec. 7.9), each a
// snow case of its own riding on the balanced load.
#include "derive/snow.hpp"

#include "derive/snow_internal.hpp"

namespace firn::snow_detail {
namespace {

/// "roof step at the left end of roof lower", for a message.
std::string on_roof(const std::string& where, const Roof& roof) {
    return fmt::format("{} of roof {}", where, roof.name);
}

}  // namespace

void SnowDeriver::trace_density(double gamma) {
    line("gamma = {} pg + {} = {} x {} + {} = {} (at most {})",
         {number(t_.density_per_pg * kFoot), density(t_.density_base),
          number(t_.density_per_pg * kFoot), pressure(site_.pg), density(t_.density_base),
          density(gamma), density(t_.density_max)},
         t_.clause.density);
}

/// The drift height line, with the formula in its own units (ft and psf).
void SnowDeriver::trace_drift(double lu, double hd, const char* lu_is) {
    double used = std::max(lu, t_.drift_min_lu);
    line(
        "hd = {} lu^(1/3) (pg + {})^(1/4) - {} (ft, psf) with lu = {} = {} (at least {} ft): {} x "
        "{}^(1/3) x {}^(1/4) - {} = {} ft{}",
        {number(t_.drift_coefficient), number(t_.drift_pg_offset / kPoundPerSquareFoot),
         number(t_.drift_offset / kFoot), text(lu_is), length(lu), number(t_.drift_min_lu / kFoot),
         number(t_.drift_coefficient), number(used / kFoot, 3),
         number((site_.pg + t_.drift_pg_offset) / kPoundPerSquareFoot, 3),
         number(t_.drift_offset / kFoot), number(hd / kFoot, 3),
         TraceValue{TraceValue::Kind::length_unless, hd, dim::length, -1, "ft"}},
        t_.clause.drift_height);
}

/// hb, the balanced snow's height, and hc, the clear height above it to the top
/// of `wall`; false (with a line saying why) where hc / hb < 0.2 needs no drift.
bool SnowDeriver::clear_height(const std::string& where, double ps, double wall, double& hc,
                               const std::string& clause) {
    double gamma = snow_density(t_, site_.pg);
    double hb = ps / gamma;
    hc = wall - hb;
    line("{}: hb = ps / gamma = {} / {} = {}; hc = {} - hb = {}",
         {text(where), pressure(ps), density(gamma), length(hb), length(wall), length(hc)}, clause);
    if (hb > 0.0 && hc < 0.2 * hb) {
        line("drift not required at the {}: hc / hb = {} is below 0.2",
             {text(where), number(hc / hb, 2)}, clause);
        return false;
    }
    return true;
}

/// The triangle of Sec. 7.7.1 for a drift height hd below a clear height hc:
/// width 4 hd, or 4 hd^2 / hc with the height cut to hc; at most 8 hc.
SnowDeriver::Triangle SnowDeriver::capped_triangle(double hd, double hc,
                                                   const std::string& clause) {
    double w = 4.0 * hd;
    if (hd > hc) {
        w = 4.0 * hd * hd / hc;
        line("hd = {} > hc = {}: w = 4 hd^2 / hc = {}, height cut to hc",
             {length(hd), length(hc), length(w)}, clause);
        hd = hc;
    } else {
        line("hd = {} <= hc = {}: w = 4 hd = {}", {length(hd), length(hc), length(w)}, clause);
    }
    if (w > 8.0 * hc) {
        line("w is at most 8 hc = {}", {length(8.0 * hc)}, clause);
        w = 8.0 * hc;
    }
    return Triangle{hd, w};
}

/// The drift triangle as a case of its own: peak hd gamma at `wall_x`, falling
/// to zero over w toward the roof (`toward` +1 or -1), cut where the roof ends
/// `room` from the wall; `breadth` is the drift's length across the frame (the
/// roof's tributary width unless the wall is shorter).
void SnowDeriver::place_drift(const Roof& roof, const std::string& case_name, double wall_x,
                              double toward, Triangle drift, double room, double breadth,
                              const std::string& clause) {
    double gamma = snow_density(t_, site_.pg);
    double pd = drift.hd * gamma;
    line("pd = hd gamma = {} x {} = {}, a triangle from the wall over w = {}",
         {length(drift.hd), density(gamma), pressure(pd), length(drift.w)}, clause);
    name_last(case_name + ".hd", 0);
    name_last(case_name + ".w", 3);
    name_last(case_name + ".pd", 2);
    if (drift.w > room + 1e-9) {
        line(
            "the drift is cut at the roof's end: w = {} is wider than the {} of roof beside the "
            "wall; the triangle is not rescaled",
            {length(drift.w), length(room)}, clause);
    }
    drift_cases_.push_back(new_case(case_name.c_str()));
    // load_between spreads over the roof's tributary width; a shorter drift is scaled to it.
    drift_load(roof, wall_x, toward, drift.w, pd * breadth / roof.tributary, drift_cases_.back());
}

/// A drift at a step or parapet at one end of a roof (Sec. 7.7.1, 7.8): the
/// larger of the leeward and windward heights at a step, 0.75 hd at a parapet;
/// a triangle from the wall, cut at the roof's far end when it is wider than the roof.
void SnowDeriver::drift_at(const Roof& roof, double ps, bool left_end) {
    const Roof::Edge& edge = left_end ? roof.left : roof.right;
    if (edge.step == 0.0 && edge.parapet == 0.0)
        return;
    const char* end = left_end ? "left" : "right";
    bool step = edge.step > 0.0;
    std::string where = fmt::format("{} at the {} end", step ? "roof step" : "parapet", end);
    std::string clause = step ? t_.clause.step : t_.clause.parapet;
    RoofShape shape = shape_of(m_, roof);
    double length_of_roof = shape.right - shape.left;
    double hc = 0.0;
    if (!clear_height(where, ps, step ? edge.step : edge.parapet, hc, clause))
        return;
    std::string case_name =
        fmt::format("drift.{}.{}_{}", roof.name, step ? "step" : "parapet", end);
    double wall_x = left_end ? shape.left : shape.right, toward = left_end ? 1.0 : -1.0;
    if (step) {
        double leeward =
            drift_height_for(edge.upper_length, "the upper roof's length", on_roof(where, roof));
        double windward =
            0.75 * drift_height_for(length_of_roof, "this roof's length", on_roof(where, roof));
        if (t_.drift_separate_windward) {
            line("leeward hd = {}, windward 0.75 hd = {}", {length(leeward), length(windward)},
                 clause);
            Triangle lee = capped_triangle(leeward, hc, clause);
            separate_drifts(roof, case_name, wall_x, toward, lee,
                            capped_triangle(windward, hc, clause), length_of_roof, clause);
            return;
        }
        double hd = std::max(leeward, windward);
        line(
            "leeward hd = {}, windward 0.75 hd = {}: the {} governs",
            {length(leeward), length(windward), text(leeward >= windward ? "leeward" : "windward")},
            clause);
        place_drift(roof, case_name, wall_x, toward, capped_triangle(hd, hc, clause),
                    length_of_roof, roof.tributary, clause);
        return;
    }
    double hd = 0.75 * drift_height_for(length_of_roof, "this roof's length", on_roof(where, roof));
    line("parapet drift: 0.75 hd = {}", {length(hd)}, clause);
    Triangle drift = capped_triangle(hd, hc, clause);
    place_drift(roof, case_name, wall_x, toward, drift, length_of_roof, roof.tributary, clause);
}

/// The leeward and windward drifts at a wall as separate cases (CASE.leeward,
/// CASE.windward), where the edition makes them so.
void SnowDeriver::separate_drifts(const Roof& roof, const std::string& case_name, double wall_x,
                                  double toward, Triangle leeward, Triangle windward, double room,
                                  const std::string& clause) {
    line("leeward and windward drifts are separate cases: {}.leeward and {}.windward",
         {text(case_name), text(case_name)}, clause);
    place_drift(roof, case_name + ".leeward", wall_x, toward, leeward, room, roof.tributary,
                clause);
    place_drift(roof, case_name + ".windward", wall_x, toward, windward, room, roof.tributary,
                clause);
}

/// A drift from a separate higher structure beyond a gap s at one end (Sec.
/// 7.7.2): leeward only where s < 20 ft and s < 6h, its height the smaller of
/// hd (from the higher roof's length) and (6h - s)/6, its width the smaller of
/// 6 hd and 6h - s; windward as at a step (Sec. 7.7.1); the larger governs.
void SnowDeriver::adjacent_drift(const Roof& roof, double ps, bool left_end) {
    const Roof::Edge& edge = left_end ? roof.left : roof.right;
    if (edge.adjacent == 0.0)
        return;
    const std::string& clause = t_.clause.adjacent;
    const char* end = left_end ? "left" : "right";
    std::string where = fmt::format("adjacent structure at the {} end", end);
    double h = edge.adjacent, s = edge.adjacent_gap;
    if (!(s < t_.adjacent_max_gap && s < 6.0 * h)) {
        line("drift from the {} not required: the gap s = {} is not below both {} and 6h = {}",
             {text(where), length(s), length(t_.adjacent_max_gap), length(6.0 * h)}, clause);
        return;
    }
    double hc = 0.0;
    if (!clear_height(where, ps, h, hc, clause))
        return;
    RoofShape shape = shape_of(m_, roof);
    double length_of_roof = shape.right - shape.left;
    double hd_upper =
        drift_height_for(edge.adjacent_length, "the higher roof's length", on_roof(where, roof));
    Triangle leeward{std::min(hd_upper, (6.0 * h - s) / 6.0),
                     std::min(6.0 * hd_upper, 6.0 * h - s)};
    line(
        "leeward: height min(hd, (6h - s)/6) = min({}, {}) = {}; width min(6 hd, 6h - s) = min({}, "
        "{}) = {}",
        {length(hd_upper), length((6.0 * h - s) / 6.0), length(leeward.hd), length(6.0 * hd_upper),
         length(6.0 * h - s), length(leeward.w)},
        clause);
    double windward_hd =
        0.75 * drift_height_for(length_of_roof, "this roof's length", on_roof(where, roof));
    line(
        "windward: 0.75 hd = {}, as at a roof step (the truncation the clause permits is not "
        "taken)",
        {length(windward_hd)}, t_.clause.step);
    Triangle windward = capped_triangle(windward_hd, hc, t_.clause.step);
    std::string case_name = fmt::format("drift.{}.adjacent_{}", roof.name, end);
    double wall_x = left_end ? shape.left : shape.right, toward = left_end ? 1.0 : -1.0;
    if (t_.drift_separate_windward) {
        separate_drifts(roof, case_name, wall_x, toward, leeward, windward, length_of_roof, clause);
        return;
    }
    bool leeward_governs = leeward.hd >= windward.hd;
    line("leeward drift {} high, windward {}: the {} governs",
         {length(leeward.hd), length(windward.hd), text(leeward_governs ? "leeward" : "windward")},
         clause);
    place_drift(roof, case_name, wall_x, toward, leeward_governs ? leeward : windward,
                length_of_roof, roof.tributary, clause);
}

/// Drifts against the two faces of a projection on a roof (Sec. 7.8): 0.75 hd
/// with lu the longer of the roof lengths beside it, none on a face shorter
/// than 15 ft; each face a case of its own, the drift as long across the frame
/// as the face (at most the tributary width).
void SnowDeriver::projection_drifts(const Projection& p, const std::vector<double>& ps) {
    const Roof& roof = m_.roofs[p.roof];
    const std::string& clause = t_.clause.parapet;
    RoofShape shape = shape_of(m_, roof);
    double left_face = shape.left + p.left_face, right_face = left_face + p.width;
    heading(
        "Projection {} on roof {}: faces at {} and {} from the roof's left end, {} high, {} long "
        "across the frame",
        {text(p.name), text(roof.name), length(p.left_face), length(p.left_face + p.width),
         length(p.height), length(p.face_length)});
    if (p.face_length < t_.projection_min_face - 1e-9) {
        line("drift not required at projection {}: its faces are {} long, shorter than {}",
             {text(p.name), length(p.face_length), length(t_.projection_min_face)}, clause);
        return;
    }
    double lu = std::max(left_face - shape.left, shape.right - right_face);
    double hd = 0.75 * drift_height_for(lu, "the longer roof length beside the projection",
                                        fmt::format("projection {}", p.name));
    double breadth = std::min(p.face_length, roof.tributary);
    line(
        "0.75 hd = {}, on each face; across the frame the drift is min(face length, tributary "
        "width) = {} long, taken by this frame",
        {length(hd), length(breadth)}, clause);
    for (bool left : {true, false}) {
        double x = left ? left_face : right_face;
        std::string where =
            fmt::format("{} face of projection {}", left ? "left" : "right", p.name);
        double hc = 0.0;
        if (!clear_height(where, ps_at(roof, ps, x, left), p.height, hc, clause))
            continue;
        Triangle drift = capped_triangle(hd, hc, clause);
        place_drift(roof, fmt::format("drift.{}.{}", p.name, left ? "left" : "right"), x,
                    left ? -1.0 : 1.0, drift, left ? x - shape.left : shape.right - x, breadth,
                    clause);
    }
}

/// The balanced load ps on the member of `roof` beside `x`, on the side the
/// drift lies (`before`: the member left of x).
double SnowDeriver::ps_at(const Roof& roof, const std::vector<double>& ps, double x,
                          bool before) const {
    for (std::size_t i = 0; i < roof.members.size(); ++i) {
        const Member& mem = m_.members[at(roof.members[i])];
        double a = m_.nodes[at(mem.start)].x, b = m_.nodes[at(mem.end)].x;
        double lo = std::min(a, b), hi = std::max(a, b);
        if (before ? (lo < x - 1e-9 && x <= hi + 1e-9) : (lo - 1e-9 <= x && x < hi - 1e-9))
            return ps[i];
    }
    return ps.empty() ? 0.0 : (before ? ps.front() : ps.back());
}

/// Sliding snow from a higher roof onto one end of this one (Sec. 7.9): 0.4 pf W
/// per length of eave over 15 ft from the upper eave, on the balanced load.
void SnowDeriver::sliding_onto(const Roof& roof, bool left_end) {
    const Roof::Edge& edge = left_end ? roof.left : roof.right;
    if (edge.sliding_from.empty())
        return;
    const std::string& clause = t_.clause.sliding;
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
        line(
            "sliding snow from roof {} onto the {} end not required: its slope {} is not above {} "
            "({} surface)",
            {text(upper->name), text(end), degrees(slope), degrees(std::atan(needed)),
             text(upper->slippery ? "slippery" : "other")},
            clause);
        return;
    }
    RoofShape up = shape_of(m_, *upper), low = shape_of(m_, roof);
    double W = eave_to_ridge(up);
    double total = t_.sliding_factor * pf_ * W;  // N/m of eave
    double q = total / t_.sliding_width;
    double width = std::min(t_.sliding_width, low.right - low.left);
    line(
        "sliding snow from roof {} onto the {} end: {} pf W = {} x {} x {} = {} per length of "
        "eave, over {}: {} on {}{}",
        {text(upper->name), text(end), number(t_.sliding_factor), number(t_.sliding_factor),
         pressure(pf_), length(W), line_load(total), length(t_.sliding_width), pressure(q),
         length(width),
         text(width < t_.sliding_width ? " (the lower roof is narrower: cut, not raised)" : "")},
        clause);
    drift_cases_.push_back(new_case(fmt::format("sliding.{}.{}", roof.name, end).c_str()));
    double from = left_end ? low.left : low.right - width;
    double to = left_end ? low.left + width : low.right;
    for (MemberId id : roof.members)
        load_part(roof, id, from, to, q, drift_cases_.back());
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

}  // namespace firn::snow_detail
