// draw_frame: the frame itself (members, hinges, supports, names) and its grid,
// and the frame sheet.
#include <algorithm>
#include <cmath>
#include <string>

#include "draw/draw_internal.hpp"

namespace firn::draw {
namespace {

constexpr double kHingeRadius = 4.0;   // px
constexpr double kSupportSize = 16.0;  // px

std::string transform(Point at, int degrees) {
    std::string t = "transform=\"translate(";
    svg::append_number(t, at.x);
    t += ' ';
    svg::append_number(t, at.y);
    t += ") rotate(" + std::to_string(degrees) + ")\"";
    return t;
}

/// Short strokes under a ground line from -half to half at depth y: the usual
/// mark of ground that does not move.
void ground_hatch(svg::Writer& out, double half, double y) {
    out.line({-half, y}, {half, y}, "class=\"ground\"");
    for (double x = -half + 3.0; x <= half + 0.01; x += 4.0)
        out.line({x, y}, {x - 4.0, y + 4.5}, "class=\"ground\"");
}

/// The direction in which a support's ground lies: away from the members that
/// meet at its node, among the turns its kind allows (a roller keeps its
/// rolling surface along the free direction).
int support_turn(const Analysis& analysis, const View& view, const Support& s) {
    Point mean{0.0, 0.0};
    for (std::size_t m = 0; m < analysis.model.members.size(); ++m) {
        const Member& member = analysis.model.members[m];
        if (member.start != s.node && member.end != s.node)
            continue;
        SheetAxes axes = sheet_axes(analysis, view, make_id<MemberId>(m));
        double sign = member.start == s.node ? 1.0 : -1.0;
        mean.x += sign * axes.along.x;
        mean.y += sign * axes.along.y;
    }
    // The ground's direction on the sheet for turns 0, 90, 180, 270 (clockwise).
    static constexpr Point kGround[4] = {{0.0, 1.0}, {-1.0, 0.0}, {0.0, -1.0}, {1.0, 0.0}};
    std::vector<int> allowed{0, 90, 180, 270};
    if (s.kind == Support::Kind::roller_free_x)
        allowed = {0, 180};
    else if (s.kind == Support::Kind::roller_free_y)
        allowed = {90, 270};
    int best = allowed.front();
    double best_dot = 2.0;
    for (int turn : allowed) {
        const Point& g = kGround[turn / 90];
        double dot = g.x * mean.x + g.y * mean.y;
        if (dot < best_dot - 1e-9) {
            best_dot = dot;
            best = turn;
        }
    }
    return best;
}

void draw_hinges(SheetBuilder& sheet, const Analysis& analysis) {
    for (std::size_t m = 0; m < analysis.model.members.size(); ++m) {
        const Member& member = analysis.model.members[m];
        if (!member.hinge_start && !member.hinge_end)
            continue;
        SheetAxes a = sheet_axes(analysis, sheet.view(), make_id<MemberId>(m));
        // The open circle sits just inside the member so that a node where several
        // members meet still shows which of them is released.
        double inset = std::min(kHingeRadius + 1.5, 0.25 * a.length_px);
        if (member.hinge_start)
            sheet.body().circle({a.start.x + a.along.x * inset, a.start.y + a.along.y * inset},
                                kHingeRadius, "class=\"hinge\"");
        if (member.hinge_end)
            sheet.body().circle({a.end.x - a.along.x * inset, a.end.y - a.along.y * inset},
                                kHingeRadius, "class=\"hinge\"");
    }
}

void name_nodes_and_members(SheetBuilder& sheet, const Analysis& analysis) {
    const Model& model = analysis.model;
    for (const Node& n : model.nodes) {
        Point p = sheet.view().at(n.x, n.y);
        Point centre = sheet.place_label(p, {0.7071, -0.7071}, n.name, 10.0, true);
        sheet.body().text(centre, n.name, "class=\"name\" text-anchor=\"middle\"");
    }
    for (std::size_t m = 0; m < model.members.size(); ++m) {
        SheetAxes a = sheet_axes(analysis, sheet.view(), make_id<MemberId>(m));
        Point mid{0.5 * (a.start.x + a.end.x), 0.5 * (a.start.y + a.end.y)};
        const std::string& name = model.members[m].name;
        Point centre = sheet.place_label(mid, a.local_y, name, 10.0);
        sheet.body().text(centre, name, "class=\"member-name\" text-anchor=\"middle\"");
    }
}

/// A grid line's name in a rounded box.
void grid_bubble(svg::Writer& out, Point centre, const std::string& name) {
    double half_w = std::max(9.0, 3.4 * static_cast<double>(name.size()) + 4.0);
    out.rect({centre.x - half_w, centre.y - 9.0}, 2.0 * half_w, 18.0, "rx=\"9\" class=\"bubble\"");
    out.text({centre.x, centre.y + 4.0}, name, "class=\"grid-name\" text-anchor=\"middle\"");
}

void dimension_tick(svg::Writer& out, Point p) {
    out.line({p.x - 4.0, p.y + 4.0}, {p.x + 4.0, p.y - 4.0}, "class=\"dim\"");
}

std::string length_text(const Analysis& analysis, double metres) {
    const DisplayUnit& u = analysis.model.units.length;
    return shown(metres, u) + " " + u.name;
}

}  // namespace

void draw_support_symbol(svg::Writer& out, Point at, int degrees, Support::Kind kind, double size) {
    out.open_group(transform(at, degrees));
    const double h = size, half = 0.6 * size;
    switch (kind) {
        case Support::Kind::fixed:
            ground_hatch(out, 0.9 * size, 0.0);
            break;
        case Support::Kind::pinned: {
            Point tri[3] = {{0.0, 0.0}, {-half, 0.8 * h}, {half, 0.8 * h}};
            out.polygon(tri, "class=\"support\"");
            ground_hatch(out, 0.9 * size, 0.8 * h);
            break;
        }
        case Support::Kind::roller_free_x:
        case Support::Kind::roller_free_y: {
            Point tri[3] = {{0.0, 0.0}, {-half, 0.6 * h}, {half, 0.6 * h}};
            out.polygon(tri, "class=\"support\"");
            double r = 0.12 * h;
            out.circle({-0.3 * h, 0.6 * h + r}, r, "class=\"support\"");
            out.circle({0.3 * h, 0.6 * h + r}, r, "class=\"support\"");
            ground_hatch(out, 0.9 * size, 0.6 * h + 2.0 * r);
            break;
        }
        case Support::Kind::spring: {
            std::string d = "M0,0 L0,";
            svg::append_number(d, 0.15 * h);
            for (int i = 0; i < 4; ++i) {
                d += " L";
                svg::append_number(d, i % 2 == 0 ? -0.3 * h : 0.3 * h);
                d += ',';
                svg::append_number(d, 0.15 * h + 0.15 * h * (i + 0.5));
            }
            d += " L0,";
            svg::append_number(d, 0.75 * h);
            d += " L0,";
            svg::append_number(d, 0.85 * h);
            out.path(d, "class=\"ground\"");
            ground_hatch(out, 0.9 * size, 0.85 * h);
            break;
        }
    }
    out.close_group();
}

void draw_frame(SheetBuilder& sheet, bool faint, bool names) {
    const Analysis& analysis = sheet.analysis();
    const Model& model = analysis.model;
    std::string member_class = faint ? "class=\"member faint\"" : "class=\"member\"";
    sheet.body().open_group("id=\"" + sheet.id("frame") + "\"");
    for (std::size_t m = 0; m < model.members.size(); ++m) {
        SheetAxes a = sheet_axes(analysis, sheet.view(), make_id<MemberId>(m));
        sheet.body().line(a.start, a.end, member_class);
    }
    if (!faint) {
        for (const Node& n : model.nodes)
            sheet.body().circle(sheet.view().at(n.x, n.y), 2.6, "class=\"node\"");
    }
    draw_hinges(sheet, analysis);
    for (const Support& s : model.supports) {
        const Node& n = model.nodes[at(s.node)];
        Point p = sheet.view().at(n.x, n.y);
        int turn = support_turn(analysis, sheet.view(), s);
        draw_support_symbol(sheet.body(), p, turn, s.kind, kSupportSize);
        // The symbol's box, so that values and names are not written over it.
        static constexpr Point kGround[4] = {{0.0, 1.0}, {-1.0, 0.0}, {0.0, -1.0}, {1.0, 0.0}};
        Point g = kGround[turn / 90];
        Point c{p.x + g.x * 0.55 * kSupportSize, p.y + g.y * 0.55 * kSupportSize};
        double half = 0.6 * kSupportSize;
        sheet.reserve({c.x - half, c.y - half, c.x + half, c.y + half});
    }
    sheet.body().close_group();
    if (names)
        name_nodes_and_members(sheet, analysis);
}

void draw_grid(SheetBuilder& sheet) {
    const Analysis& analysis = sheet.analysis();
    const Model& model = analysis.model;
    const Box& area = sheet.drawing();
    const View& v = sheet.view();
    svg::Writer& out = sheet.body();
    std::vector<double> xs, ys;
    for (const GridLine& g : model.grid_x) {
        double x = v.at(g.position, 0.0).x;
        out.line({x, area.y0 + 24.0}, {x, area.y1 - 30.0}, "class=\"grid\"");
        grid_bubble(out, {x, area.y0 + 12.0}, g.name);
        xs.push_back(g.position);
    }
    for (const GridLine& g : model.grid_y) {
        double y = v.at(0.0, g.position).y;
        double left =
            area.x0 + 12.0 + std::max(9.0, 3.4 * static_cast<double>(g.name.size()) + 4.0);
        out.line({left, y}, {area.x1 - 30.0, y}, "class=\"grid\"");
        grid_bubble(out, {left - std::max(9.0, 3.4 * static_cast<double>(g.name.size()) + 4.0), y},
                    g.name);
        ys.push_back(g.position);
    }
    // Dimension chains: along the bottom between column lines, up the right side
    // between levels, each span with its length in the report's length unit.
    std::sort(xs.begin(), xs.end());
    std::sort(ys.begin(), ys.end());
    double dim_y = area.y1 - 14.0;
    if (xs.size() >= 2) {
        out.line({v.at(xs.front(), 0.0).x, dim_y}, {v.at(xs.back(), 0.0).x, dim_y},
                 "class=\"dim\"");
        for (std::size_t i = 0; i < xs.size(); ++i) {
            double x = v.at(xs[i], 0.0).x;
            dimension_tick(out, {x, dim_y});
            if (i > 0 && xs[i] > xs[i - 1]) {
                double mid = 0.5 * (x + v.at(xs[i - 1], 0.0).x);
                out.text({mid, dim_y - 4.0}, length_text(analysis, xs[i] - xs[i - 1]),
                         "class=\"dim-text\" text-anchor=\"middle\"");
            }
        }
    }
    double dim_x = area.x1 - 14.0;
    if (ys.size() >= 2) {
        out.line({dim_x, v.at(0.0, ys.front()).y}, {dim_x, v.at(0.0, ys.back()).y},
                 "class=\"dim\"");
        for (std::size_t i = 0; i < ys.size(); ++i) {
            double y = v.at(0.0, ys[i]).y;
            dimension_tick(out, {dim_x, y});
            if (i > 0 && ys[i] > ys[i - 1]) {
                Point mid{dim_x - 4.0, 0.5 * (y + v.at(0.0, ys[i - 1]).y)};
                std::string rotate = "transform=\"rotate(-90 ";
                svg::append_number(rotate, mid.x);
                rotate += ' ';
                svg::append_number(rotate, mid.y);
                rotate += ")\"";
                out.text(mid, length_text(analysis, ys[i] - ys[i - 1]),
                         "class=\"dim-text\" text-anchor=\"middle\" " + rotate);
            }
        }
    }
}

void support_legend(SheetBuilder& sheet) {
    const Model& model = sheet.analysis().model;
    auto has = [&model](auto pred) {
        return std::any_of(model.supports.begin(), model.supports.end(), pred);
    };
    if (has([](const Support& s) { return s.kind == Support::Kind::fixed; }))
        sheet.legend(Key::support_fixed, "fixed support (hatched ground line)");
    if (has([](const Support& s) { return s.kind == Support::Kind::pinned; }))
        sheet.legend(Key::support_pinned, "pinned support");
    if (has([](const Support& s) {
            return s.kind == Support::Kind::roller_free_x || s.kind == Support::Kind::roller_free_y;
        }))
        sheet.legend(Key::support_roller, "roller (free along its ground line)");
    if (has([](const Support& s) { return s.kind == Support::Kind::spring; }))
        sheet.legend(Key::support_spring, "spring support");
    bool hinges = std::any_of(model.members.begin(), model.members.end(),
                              [](const Member& m) { return m.hinge_start || m.hinge_end; });
    if (hinges)
        sheet.legend(Key::hinge, "hinge: moment released at that end of the member");
}

Sheet frame_sheet(const Analysis& analysis) {
    SheetBuilder sheet(analysis, "frame.svg", "The frame: members, supports and grid", 64.0);
    draw_grid(sheet);
    draw_frame(sheet, false, true);
    sheet.legend(Key::member, "member (name in italics beside it)");
    sheet.legend(Key::node, "node (name beside it)");
    support_legend(sheet);
    if (!analysis.model.grid_x.empty() || !analysis.model.grid_y.empty())
        sheet.legend(Key::grid, "grid line, named in its bubble");
    sheet.note("Dimensions between grid lines in " + analysis.model.units.length.name + ". " +
               std::to_string(analysis.model.nodes.size()) + " nodes, " +
               std::to_string(analysis.model.members.size()) + " members, " +
               std::to_string(analysis.model.supports.size()) + " supports.");
    return sheet.finish();
}

}  // namespace firn::draw
