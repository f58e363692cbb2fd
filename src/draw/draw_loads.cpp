// draw_loads: one sheet per load case with its loads as the model gives them
// (distributed, trapezoidal, projected, point loads, moments, nodal loads and
// self weight), all drawn to one scale shared by every loads sheet.
#include <algorithm>
#include <cmath>
#include <string>

#include "draw/draw_internal.hpp"
#include "ir/load_set.hpp"

namespace firn::draw {
namespace {

constexpr double kBand = 34.0;      // px: the deepest distributed load
constexpr double kArrow = 48.0;     // px: the longest point load
constexpr double kShortest = 14.0;  // px: no arrow is drawn shorter than this
constexpr double kMomentRadius = 11.0;
constexpr double kPad = 84.0;

/// The direction a load acts in, in the model (unit vector, y up).
Point model_direction(LoadDirection d, const MemberGeometry& g) {
    switch (d) {
        case LoadDirection::global_x:
            return {1.0, 0.0};
        case LoadDirection::global_y:
            return {0.0, 1.0};
        case LoadDirection::down:
            return {0.0, -1.0};
        case LoadDirection::axial:
            return {g.c, g.s};
        case LoadDirection::transverse:
            return {-g.s, g.c};
    }
    return {0.0, -1.0};
}

Point on_sheet(Point model_dir) {
    return {model_dir.x, -model_dir.y};
}

double self_weight_of(const Model& model, MemberId id) {
    const Section& s = model.sections[at(model.members[at(id)].section)];
    return model.materials[at(s.material)].unit_weight * s.area;
}

std::vector<MemberId> self_weight_members(const Model& model, const SelfWeight& sw) {
    if (!sw.all_members)
        return sw.members;
    std::vector<MemberId> all;
    for (std::size_t m = 0; m < model.members.size(); ++m)
        all.push_back(make_id<MemberId>(m));
    return all;
}

std::string arrow_attributes(const SheetBuilder& sheet) {
    return "class=\"load\" marker-end=\"url(#" + sheet.id("arrow") + ")\"";
}

void load_text(SheetBuilder& sheet, Point anchor, Point direction, const std::string& text) {
    Point centre = sheet.place_label(anchor, direction, text, 10.5);
    sheet.body().text(centre, text, "class=\"load-text\" text-anchor=\"middle\"");
}

/// Draws loads case by case, stacking bands that share a member.
class LoadPainter {
  public:
    LoadPainter(SheetBuilder& sheet, const LoadScales& scales)
        : sheet_(sheet),
          model_(sheet.analysis().model),
          band_scale_(scales.per_length > 0.0 ? kBand / scales.per_length : 0.0),
          arrow_scale_(scales.force > 0.0 ? kArrow / scales.force : 0.0),
          stacked_(model_.members.size(), 0.0) {}

    /// A linearly varying load from s0 to s1 along member m (m), intensity w0..w1.
    void band(MemberId m, LoadDirection direction, double s0, double s1, double w0, double w1,
              const std::string& text) {
        MemberGeometry g = member_geometry(model_, m);
        SheetAxes axes = sheet_axes(sheet_.analysis(), sheet_.view(), m);
        Point d = on_sheet(model_direction(direction, g));
        double sign = w0 + w1 >= 0.0 ? 1.0 : -1.0;
        if (std::abs(d.x * axes.along.x + d.y * axes.along.y) > 0.98) {
            along_member(m, axes, g, {d.x * sign, d.y * sign}, s0, s1, text);
            return;
        }
        Point tail{-d.x * sign, -d.y * sign};  // from the member toward the arrows' tails
        double base = stacked_[at(m)] + 3.0;
        auto at_s = [&](double s, double depth) {
            double f = g.length > 0.0 ? std::clamp(s / g.length, 0.0, 1.0) : 0.0;
            return Point{axes.start.x + (axes.end.x - axes.start.x) * f + tail.x * depth,
                         axes.start.y + (axes.end.y - axes.start.y) * f + tail.y * depth};
        };
        double h0 = std::abs(w0) * band_scale_, h1 = std::abs(w1) * band_scale_;
        Point outline[4] = {at_s(s0, base), at_s(s0, base + h0), at_s(s1, base + h1),
                            at_s(s1, base)};
        sheet_.body().polygon(outline, "class=\"load-band\"");
        double span_px = axes.length_px * (g.length > 0.0 ? (s1 - s0) / g.length : 0.0);
        auto arrows = static_cast<std::size_t>(std::max(1.0, std::round(span_px / 26.0)));
        for (std::size_t i = 0; i <= arrows; ++i) {
            double f = static_cast<double>(i) / static_cast<double>(arrows);
            double h = h0 + (h1 - h0) * f;
            if (h < 4.0)
                continue;  // too short to carry an arrow head
            double s = s0 + (s1 - s0) * f;
            sheet_.body().line(at_s(s, base + h), at_s(s, base), arrow_attributes(sheet_));
        }
        load_text(sheet_, at_s(0.5 * (s0 + s1), base + std::max(h0, h1)), tail, text);
        stacked_[at(m)] = base + std::max(h0, h1) + 16.0;  // room for the next band's text
    }

    /// A load along the member's own axis (self weight on a column): a row of
    /// short arrows beside the member, pointing the way the load acts.
    void along_member(MemberId m, const SheetAxes& axes, const MemberGeometry& g, Point acts,
                      double s0, double s1, const std::string& text) {
        double base = stacked_[at(m)] + 8.0;
        Point side = axes.local_y;
        auto at_s = [&](double s, double shift) {
            double f = g.length > 0.0 ? std::clamp(s / g.length, 0.0, 1.0) : 0.0;
            return Point{
                axes.start.x + (axes.end.x - axes.start.x) * f + side.x * base + acts.x * shift,
                axes.start.y + (axes.end.y - axes.start.y) * f + side.y * base + acts.y * shift};
        };
        double span_px = axes.length_px * (g.length > 0.0 ? (s1 - s0) / g.length : 0.0);
        auto arrows = static_cast<std::size_t>(std::max(1.0, std::round(span_px / 30.0)));
        for (std::size_t i = 0; i < arrows; ++i) {
            double s =
                s0 + (s1 - s0) * (static_cast<double>(i) + 0.5) / static_cast<double>(arrows);
            sheet_.body().line(at_s(s, -5.0), at_s(s, 5.0), arrow_attributes(sheet_));
        }
        load_text(sheet_, at_s(0.5 * (s0 + s1), 0.0), side, text);
        stacked_[at(m)] = base + 16.0;
    }

    /// A force of `force` (N) acting in `direction` (sheet) with its head at `head`.
    void force(Point head, Point direction, double force, const std::string& text) {
        double sign = force >= 0.0 ? 1.0 : -1.0;
        double length = std::max(kShortest, std::abs(force) * arrow_scale_);
        Point tail{head.x - direction.x * sign * length, head.y - direction.y * sign * length};
        sheet_.body().line(tail, head, arrow_attributes(sheet_));
        load_text(sheet_, tail, {-direction.x * sign, -direction.y * sign}, text);
    }

    /// A concentrated moment: an arc around `centre`, counterclockwise when positive.
    void moment(Point centre, double value, const std::string& text) {
        const double r = kMomentRadius, k = 0.70710678;
        Point right{centre.x + r * k, centre.y + r * k}, left{centre.x - r * k, centre.y + r * k};
        bool ccw = value >= 0.0;
        Point from = ccw ? right : left, to = ccw ? left : right;
        std::string d = "M";
        svg::append_number(d, from.x);
        d += ',';
        svg::append_number(d, from.y);
        d += " A";
        svg::append_number(d, r);
        d += ',';
        svg::append_number(d, r);
        d += ccw ? " 0 1 0 " : " 0 1 1 ";  // the long way round, visually ccw or cw
        svg::append_number(d, to.x);
        d += ',';
        svg::append_number(d, to.y);
        sheet_.body().path(d, arrow_attributes(sheet_));
        load_text(sheet_, {centre.x, centre.y - r}, {0.0, -1.0}, text);
    }

  private:
    SheetBuilder& sheet_;
    const Model& model_;
    double band_scale_, arrow_scale_;
    std::vector<double> stacked_;  ///< px of bands already drawn beside each member
};

std::string with_unit(double si, const DisplayUnit& unit) {
    return shown(si, unit) + " " + unit.name;
}

std::string intensity_text(const DistributedLoad& d, const DisplayUnit& unit) {
    std::string text = d.w_start == d.w_end
                           ? with_unit(d.w_start, unit)
                           : shown(d.w_start, unit) + " to " + with_unit(d.w_end, unit);
    if (d.projected)
        text += " proj.";
    return text;
}

void draw_case_loads(LoadPainter& paint, SheetBuilder& sheet, const LoadCase& lc) {
    const Analysis& a = sheet.analysis();
    const Model& model = a.model;
    const DisplayUnits& u = model.units;
    for (const DistributedLoad& d : lc.distributed) {
        MemberGeometry g = member_geometry(model, d.member);
        double stretch = d.projected && std::abs(g.c) > 1e-12 ? 1.0 / std::abs(g.c) : 1.0;
        if (d.projected && std::abs(g.c) <= 1e-12)
            continue;  // adds nothing to a vertical member (the analysis warns)
        paint.band(d.member, d.direction, d.start * stretch, std::min(d.end * stretch, g.length),
                   d.w_start, d.w_end, intensity_text(d, u.force_per_length));
    }
    for (const SelfWeight& sw : lc.self_weight) {
        for (MemberId m : self_weight_members(model, sw)) {
            double w = self_weight_of(model, m);
            if (w != 0.0)
                paint.band(m, LoadDirection::down, 0.0, member_geometry(model, m).length, w, w,
                           "self weight " + with_unit(w, u.force_per_length));
        }
    }
    auto point_on = [&](MemberId m, double s) {
        SheetAxes axes = sheet_axes(a, sheet.view(), m);
        double length = member_geometry(model, m).length;
        double f = length > 0.0 ? std::clamp(s / length, 0.0, 1.0) : 0.0;
        return Point{axes.start.x + (axes.end.x - axes.start.x) * f,
                     axes.start.y + (axes.end.y - axes.start.y) * f};
    };
    for (const PointLoad& p : lc.points) {
        Point d = on_sheet(model_direction(p.direction, member_geometry(model, p.member)));
        paint.force(point_on(p.member, p.position), d, p.force, with_unit(p.force, u.force));
    }
    for (const PointMoment& pm : lc.moments)
        paint.moment(point_on(pm.member, pm.position), pm.moment, with_unit(pm.moment, u.moment));
    for (const NodalLoad& n : lc.nodal) {
        const Node& node = model.nodes[at(n.node)];
        Point p = sheet.view().at(node.x, node.y);
        if (n.fx != 0.0)
            paint.force(p, {1.0, 0.0}, n.fx, with_unit(n.fx, u.force));
        if (n.fy != 0.0)
            paint.force(p, {0.0, -1.0}, n.fy, with_unit(n.fy, u.force));
        if (n.moment != 0.0)
            paint.moment(p, n.moment, with_unit(n.moment, u.moment));
    }
}

}  // namespace

LoadScales load_scales(const Model& model) {
    LoadScales s;
    for (const LoadCase& lc : model.cases) {
        for (const DistributedLoad& d : lc.distributed)
            s.per_length = std::max({s.per_length, std::abs(d.w_start), std::abs(d.w_end)});
        for (const SelfWeight& sw : lc.self_weight) {
            for (MemberId m : self_weight_members(model, sw))
                s.per_length = std::max(s.per_length, std::abs(self_weight_of(model, m)));
        }
        for (const PointLoad& p : lc.points)
            s.force = std::max(s.force, std::abs(p.force));
        for (const NodalLoad& n : lc.nodal)
            s.force = std::max({s.force, std::abs(n.fx), std::abs(n.fy)});
    }
    return s;
}

Sheet loads_sheet(const Analysis& a, CaseId c, const LoadScales& scales) {
    const Model& model = a.model;
    const LoadCase& lc = model.cases[at(c)];
    std::string subject = "Loads: load case " + lc.name + " (" + case_kind_name(lc.kind) + ")";
    if (!lc.description.empty())
        subject += ", " + lc.description;
    SheetBuilder sheet(a, "loads/" + file_stem(lc.name) + ".svg", subject, kPad);
    draw_frame(sheet, true, false);
    sheet.body().open_group("id=\"" + sheet.id("loads") + "\"");
    LoadPainter paint(sheet, scales);
    draw_case_loads(paint, sheet, lc);
    sheet.body().close_group();
    const DisplayUnits& u = model.units;
    sheet.legend(Key::frame_faint, "member");
    sheet.legend(Key::load, "load, arrows in the direction it acts");
    std::vector<std::string> scales_text;
    if (scales.per_length > 0.0)
        scales_text.push_back("distributed loads 10 px = " +
                              with_unit(scales.per_length * 10.0 / kBand, u.force_per_length));
    if (scales.force > 0.0)
        scales_text.push_back("forces 10 px = " + with_unit(scales.force * 10.0 / kArrow, u.force) +
                              " (no arrow shorter than " + svg::number(kShortest) + " px)");
    std::string scale = "One scale on every loads sheet";
    for (std::size_t i = 0; i < scales_text.size(); ++i) {
        scale += i == 0 ? ": " : "; ";
        scale += scales_text[i];
    }
    sheet.note(scale + ". Moments are drawn as arcs, counterclockwise when positive.");
    sheet.note(
        "Loads marked proj. act per unit of horizontal projection (roof snow and roof "
        "live loads); bands beside one member are stacked outward in the order given.");
    return sheet.finish();
}

}  // namespace firn::draw
