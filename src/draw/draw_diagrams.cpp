// draw_diagrams: moment, shear and axial force diagrams drawn on the members,
// and the deflected shape, for a load case, a combination or an envelope.
// Curves are sampled from the exact member functions; the labelled extremes
// are the very values the text report prints (MemberSummary, MemberEnvelope).
#include <algorithm>
#include <cmath>
#include <optional>
#include <string>

#include "analyse/analyse.hpp"
#include "draw/draw_internal.hpp"

namespace firn::draw {
namespace {

constexpr double kOrdinate = 46.0;      // px: the largest ordinate of a diagram
constexpr double kDeflection = 44.0;    // px: about the largest drawn displacement
constexpr std::size_t kIntervals = 24;  // even samples along each member
constexpr double kPad = 72.0;           // px around the frame

/// A place along a member; at a jump (a point load) the value just before it
/// and just after it are both drawn.
struct Place {
    double s = 0.0;
    bool before = false;
};

/// One member's diagram: values at each place, the greatest and least over
/// the combinations of an envelope (one curve for a case or combination).
struct Curve {
    std::vector<Place> places;
    std::vector<double> upper, lower;
};

double piece_value(const FunctionPiece& p, Diagram d, double t) {
    switch (d) {
        case Diagram::moment:
            return p.moment(t);
        case Diagram::shear:
            return p.shear(t);
        case Diagram::axial:
            return p.axial(t);
        case Diagram::deflection:
            return p.deflection(t);
    }
    return 0.0;
}

double value_at(const MemberFunctions& f, Diagram d, const Place& place, double tolerance) {
    if (f.pieces.empty())
        return 0.0;
    const FunctionPiece* piece = &f.pieces.back();
    if (place.before) {
        for (const FunctionPiece& p : f.pieces) {
            if (place.s <= p.b + tolerance) {
                piece = &p;
                break;
            }
        }
    } else {
        piece = &f.pieces.front();
        for (const FunctionPiece& p : f.pieces) {
            if (place.s >= p.a - tolerance)
                piece = &p;
        }
    }
    return piece_value(*piece, d, place.s - piece->a);
}

/// Even places, every piece boundary of every function (both sides), and the
/// positions of the labelled extremes, so the curve passes through them.
std::vector<Place> places_along(double length, std::span<const MemberFunctions> functions,
                                std::span<const double> extra) {
    std::vector<double> breaks;
    for (const MemberFunctions& f : functions) {
        for (std::size_t i = 1; i < f.pieces.size(); ++i)
            breaks.push_back(f.pieces[i].a);
    }
    std::vector<double> all(breaks);
    for (std::size_t i = 0; i <= kIntervals; ++i)
        all.push_back(length * static_cast<double>(i) / static_cast<double>(kIntervals));
    for (double s : extra)
        all.push_back(std::clamp(s, 0.0, length));
    std::sort(all.begin(), all.end());
    std::sort(breaks.begin(), breaks.end());
    double tolerance = 1e-9 * std::max(length, 1.0);
    std::vector<Place> places;
    for (double s : all) {
        if (!places.empty() && s - places.back().s <= tolerance)
            continue;
        auto near = std::lower_bound(breaks.begin(), breaks.end(), s - tolerance);
        if (near != breaks.end() && *near <= s + tolerance)
            places.push_back({s, true});
        places.push_back({s, false});
    }
    return places;
}

Curve curve_of(std::span<const MemberFunctions> functions, Diagram d, double length,
               std::span<const double> extra, bool envelope) {
    Curve c;
    c.places = places_along(length, functions, extra);
    double tolerance = 1e-9 * std::max(length, 1.0);
    for (const Place& p : c.places) {
        double hi = -HUGE_VAL, lo = HUGE_VAL;
        for (const MemberFunctions& f : functions) {
            double v = value_at(f, d, p, tolerance);
            hi = std::max(hi, v);
            lo = std::min(lo, v);
        }
        if (functions.empty())
            hi = lo = 0.0;
        c.upper.push_back(hi);
        if (envelope)
            c.lower.push_back(lo);
    }
    return c;
}

/// A labelled extreme: its tag as the report names it, value and position.
struct Extreme {
    std::string tag;
    double value = 0.0;
    double position = 0.0;
};

std::vector<Extreme> summary_extremes(const MemberSummary& s, Diagram d) {
    switch (d) {
        case Diagram::moment:
            return {{"M+", s.moment_max.value, s.moment_max.position},
                    {"M-", s.moment_min.value, s.moment_min.position}};
        case Diagram::shear:
            return {{"V", s.shear_max.value, s.shear_max.position}};
        case Diagram::axial:
            return {{"N+", s.axial_max.value, s.axial_max.position},
                    {"N-", s.axial_min.value, s.axial_min.position}};
        case Diagram::deflection:
            return {};
    }
    return {};
}

std::vector<Extreme> envelope_extremes(const MemberEnvelope& e, Diagram d) {
    std::vector<Extreme> out;
    auto add = [&out](const char* tag, const Governing& g) {
        if (g.combination != no_combination)
            out.push_back({tag, g.value, g.position});
    };
    switch (d) {
        case Diagram::moment:
            add("M+", e.moment_max);
            add("M-", e.moment_min);
            break;
        case Diagram::shear:
            add("V+", e.shear_max);
            add("V-", e.shear_min);
            break;
        case Diagram::axial:
            add("N+", e.tension);
            add("N-", e.compression);
            break;
        case Diagram::deflection:
            break;
    }
    return out;
}

const char* diagram_word(Diagram d) {
    switch (d) {
        case Diagram::moment:
            return "moment";
        case Diagram::shear:
            return "shear";
        case Diagram::axial:
            return "axial";
        case Diagram::deflection:
            return "deflected";
    }
    return "";
}

const char* diagram_title(Diagram d) {
    switch (d) {
        case Diagram::moment:
            return "Bending moment";
        case Diagram::shear:
            return "Shear force";
        case Diagram::axial:
            return "Axial force";
        case Diagram::deflection:
            return "Deflected shape";
    }
    return "";
}

/// What the sheets of one subject share: its name, functions and results.
struct SubjectData {
    std::string kind_word;  ///< "case", "combination", "envelope"
    std::string name;
    std::string description;
    bool envelope = false;
    const CaseResults* results = nullptr;   ///< a case or a combination
    const Envelopes* envelopes = nullptr;   ///< an envelope set
    std::vector<Combination> combinations;  ///< to build member functions from
    std::size_t case_index = 0;
    bool is_case = false;
};

SubjectData subject_data(const Analysis& a, const Subject& subject) {
    SubjectData d;
    switch (subject.kind) {
        case Subject::Kind::load_case: {
            const LoadCase& lc = a.model.cases[subject.index];
            d.kind_word = "case";
            d.name = lc.name;
            d.description = "load case " + lc.name + " (" + case_kind_name(lc.kind) + ")";
            d.results = &a.results.cases[subject.index];
            d.is_case = true;
            d.case_index = subject.index;
            break;
        }
        case Subject::Kind::combination: {
            const CombinationList& list = a.combinations;
            d.kind_word = "combination";
            d.name = list.combinations[subject.index].name;
            d.description = "combination " + d.name + " = " + list.formulas[subject.index];
            for (std::size_t s = 0; s < list.sets.size(); ++s) {
                const auto& set = list.sets[s];
                if (subject.index >= set.first && subject.index < set.first + set.count)
                    d.results = &a.envelopes[s].combinations[subject.index - set.first];
            }
            d.combinations.push_back(list.combinations[subject.index]);
            break;
        }
        case Subject::Kind::envelope: {
            const auto& set = a.combinations.sets[subject.index];
            d.kind_word = "envelope";
            d.name = set.name;
            d.description =
                "envelope of " + set.name + " (" + std::to_string(set.count) + " combinations)";
            d.envelope = true;
            d.envelopes = &a.envelopes[subject.index];
            for (std::size_t i = 0; i < set.count; ++i)
                d.combinations.push_back(a.combinations.combinations[set.first + i]);
            break;
        }
    }
    return d;
}

std::vector<MemberFunctions> functions_of(const Analysis& a, const SubjectData& d, MemberId m) {
    std::vector<MemberFunctions> out;
    if (d.is_case) {
        CaseId c = make_id<CaseId>(d.case_index);
        out.push_back(member_functions(a.model, a.loads.cases[d.case_index], a.solution, c, m));
    } else {
        for (const Combination& comb : d.combinations)
            out.push_back(combination_functions(a.model, a.loads, a.solution, comb, m));
    }
    return out;
}

std::vector<Extreme> extremes_of(const SubjectData& d, std::size_t m, Diagram diagram) {
    return d.envelope ? envelope_extremes(d.envelopes->members[m], diagram)
                      : summary_extremes(d.results->members[m], diagram);
}

const DisplayUnit& unit_of(const Model& model, Diagram d) {
    switch (d) {
        case Diagram::moment:
            return model.units.moment;
        case Diagram::deflection:
            return model.units.displacement;
        default:
            return model.units.force;
    }
}

/// +1 where a positive value is drawn on the member's local +y side; moments
/// are drawn on the tension side, which for M > 0 is local -y.
double drawn_side(Diagram d) {
    return d == Diagram::moment ? -1.0 : 1.0;
}

Point offset(const SheetAxes& axes, double s_fraction, double ordinate_px) {
    return {axes.start.x + (axes.end.x - axes.start.x) * s_fraction + axes.local_y.x * ordinate_px,
            axes.start.y + (axes.end.y - axes.start.y) * s_fraction + axes.local_y.y * ordinate_px};
}

/// Draws one curve of a member: each run of one sign filled with its hatching
/// down to the member, and its outline in the line style of its sign.
void draw_curve(svg::Writer& out, const SheetAxes& axes, double length,
                const std::vector<Place>& places, const std::vector<double>& values,
                double px_per_unit, double threshold) {
    struct Run {
        bool positive;
        std::vector<std::pair<double, double>> points;  // (s, value)
    };
    std::vector<Run> runs;
    for (std::size_t i = 0; i < places.size(); ++i) {
        double s = places[i].s;
        double v = std::abs(values[i]) < threshold ? 0.0 : values[i];  // prints as zero
        bool positive = v >= 0.0;
        if (!runs.empty() && runs.back().positive != positive) {
            // Close the run where the line between the two samples crosses zero.
            auto [s0, v0] = runs.back().points.back();
            double cross = v0 == v ? s : s0 + (s - s0) * v0 / (v0 - v);
            runs.back().points.push_back({cross, 0.0});
            runs.push_back({positive, {{cross, 0.0}}});
        } else if (runs.empty()) {
            runs.push_back({positive, {}});
        }
        runs.back().points.push_back({s, v});
    }
    double inv_length = length > 0.0 ? 1.0 / length : 0.0;
    for (const Run& run : runs) {
        std::vector<Point> curve;
        for (auto [s, v] : run.points)
            curve.push_back(offset(axes, s * inv_length, v * px_per_unit));
        bool all_zero = std::all_of(run.points.begin(), run.points.end(),
                                    [](const auto& p) { return p.second == 0.0; });
        if (all_zero || curve.size() < 2)
            continue;
        std::vector<Point> area;
        area.push_back(offset(axes, run.points.front().first * inv_length, 0.0));
        area.insert(area.end(), curve.begin(), curve.end());
        area.push_back(offset(axes, run.points.back().first * inv_length, 0.0));
        out.polygon(area, run.positive ? "class=\"pos\"" : "class=\"neg\"");
        out.polyline(curve, run.positive ? "class=\"pos-line\"" : "class=\"neg-line\"");
    }
}

std::string subject_path(const SubjectData& d, Diagram diagram) {
    return "diagrams/" + d.kind_word + "-" + file_stem(d.name) + "-" + diagram_word(diagram) +
           ".svg";
}

std::string attribute(std::string_view name, std::string_view value) {
    return std::string(name) + "=\"" + svg::escape(value) + "\"";
}

/// The largest ordinate: kOrdinate, or less on a dense frame so that the
/// diagrams of neighbouring members stay apart (0.4 of the median member).
double ordinate_px(const Analysis& a, const View& view) {
    std::vector<double> lengths;
    for (std::size_t m = 0; m < a.model.members.size(); ++m)
        lengths.push_back(sheet_axes(a, view, make_id<MemberId>(m)).length_px);
    if (lengths.empty())
        return kOrdinate;
    auto middle = lengths.begin() + static_cast<std::ptrdiff_t>(lengths.size() / 2);
    std::nth_element(lengths.begin(), middle, lengths.end());
    return std::clamp(0.4 * *middle, 12.0, kOrdinate);
}

void force_notes(SheetBuilder& sheet, Diagram diagram, const DisplayUnit& unit, double largest,
                 double ordinate, const SubjectData& d) {
    const char* symbol = diagram == Diagram::moment ? "M" : diagram == Diagram::shear ? "V" : "N";
    sheet.legend(Key::frame_faint, "member");
    sheet.legend(Key::positive, std::string(symbol) + " > 0: hatched /, solid outline");
    sheet.legend(Key::negative, std::string(symbol) + " < 0: hatched \\, dashed outline");
    if (diagram == Diagram::moment) {
        sheet.note(
            "Moment is drawn on the tension side: M > 0 means the member's local -y face is "
            "in tension and is drawn on that side (local x runs from the start node to the "
            "end node; local y is local x turned 90 degrees counterclockwise; for a member "
            "drawn left to right, M > 0 is sagging and hangs below it).");
    } else if (diagram == Diagram::shear) {
        sheet.note(
            "Shear V = dM/dx; V > 0 is drawn on the member's local +y side (local y is "
            "local x, start to end node, turned 90 degrees counterclockwise).");
    } else {
        sheet.note(
            "Axial force N, tension positive; N > 0 is drawn on the member's local +y side "
            "(local y is local x, start to end node, turned 90 degrees counterclockwise).");
    }
    if (d.envelope) {
        sheet.note("Envelope: at each point the greatest and the least value over the " +
                   std::to_string(d.combinations.size()) +
                   " combinations of the set. Each member's labelled values are its extremes (" +
                   symbol + "+ and " + symbol +
                   "-) as the report's envelope table gives them, at their positions.");
    } else {
        sheet.note(std::string("Each member's labelled values are its extremes as the report "
                               "gives them (") +
                   (diagram == Diagram::moment  ? "largest positive and negative M"
                    : diagram == Diagram::shear ? "largest V in size"
                                                : "largest tension and compression") +
                   "), at their positions.");
    }
    if (largest > 0.0) {
        sheet.note("Ordinate scale: 10 px = " + shown(largest * 10.0 / ordinate, unit) + " " +
                   unit.name + "; values in " + unit.name + ".");
    } else {
        sheet.note("Every value of this diagram is zero.");
    }
}

Sheet force_sheet(const Analysis& a, const SubjectData& d, Diagram diagram,
                  const std::vector<Curve>& curves) {
    const Model& model = a.model;
    std::string subject =
        std::string(diagram_title(diagram)) + (d.envelope ? " envelope: " : ": ") + d.description;
    SheetBuilder sheet(a, subject_path(d, diagram), subject, kPad);
    draw_frame(sheet, true, false);
    double largest = 0.0;
    for (const Curve& c : curves) {
        for (double v : c.upper)
            largest = std::max(largest, std::abs(v));
        for (double v : c.lower)
            largest = std::max(largest, std::abs(v));
    }
    const DisplayUnit& unit = unit_of(model, diagram);
    // Values that print as zero are not drawn: they would be noise on the member.
    double threshold = 0.5 * std::pow(10.0, -unit.decimals) * unit.to_si;
    double ordinate = ordinate_px(a, sheet.view());
    double px_per_unit = largest > threshold ? drawn_side(diagram) * ordinate / largest : 0.0;
    if (px_per_unit == 0.0)
        largest = 0.0;
    sheet.body().open_group("id=\"" + sheet.id("diagram") + "\"");
    for (std::size_t m = 0; m < curves.size() && px_per_unit != 0.0; ++m) {
        SheetAxes axes = sheet_axes(a, sheet.view(), make_id<MemberId>(m));
        double length = member_geometry(model, make_id<MemberId>(m)).length;
        draw_curve(sheet.body(), axes, length, curves[m].places, curves[m].upper, px_per_unit,
                   threshold);
        if (!curves[m].lower.empty())
            draw_curve(sheet.body(), axes, length, curves[m].places, curves[m].lower, px_per_unit,
                       threshold);
    }
    sheet.body().close_group();
    sheet.body().open_group("id=\"" + sheet.id("values") + "\"");
    std::size_t crowded = 0;  // values left unlabelled for want of room
    for (std::size_t m = 0; m < curves.size() && px_per_unit != 0.0; ++m) {
        SheetAxes axes = sheet_axes(a, sheet.view(), make_id<MemberId>(m));
        double length = member_geometry(model, make_id<MemberId>(m)).length;
        for (const Extreme& e : extremes_of(d, m, diagram)) {
            std::string text = shown(e.value, unit);
            if (std::abs(e.value) < threshold)
                continue;
            double drawn = e.value * px_per_unit;
            Point tip = offset(axes, length > 0.0 ? e.position / length : 0.0, drawn);
            double side = drawn >= 0.0 ? 1.0 : -1.0;
            std::optional<Point> centre = sheet.try_place_label(
                tip, {axes.local_y.x * side, axes.local_y.y * side}, text, 10.5);
            if (!centre) {
                ++crowded;
                continue;
            }
            sheet.body().text(*centre, text,
                              "class=\"value\" text-anchor=\"middle\" " +
                                  attribute("data-member", model.members[m].name) + " " +
                                  attribute("data-quantity", e.tag));
        }
    }
    sheet.body().close_group();
    force_notes(sheet, diagram, unit, largest, ordinate, d);
    if (crowded > 0)
        sheet.note(std::to_string(crowded) +
                   " extreme values are not labelled for want of room on the sheet; the "
                   "report's tables give every one.");
    return sheet.finish();
}

/// 1, 2 or 5 times a power of ten, not above `x` (x > 0).
double round_down_125(double x) {
    double decade = std::pow(10.0, std::floor(std::log10(x)));
    for (double step : {5.0, 2.0, 1.0}) {
        if (step * decade <= x * (1.0 + 1e-12))
            return step * decade;
    }
    return decade;
}

/// The member with the largest deflection from its chord, labelled where it
/// occurs, with the value the report gives for that member.
void label_largest_deflection(SheetBuilder& sheet, const SubjectData& d,
                              const std::vector<Curve>& curves,
                              const std::vector<std::vector<std::pair<double, double>>>& moved,
                              double magnification) {
    const Model& model = sheet.analysis().model;
    const DisplayUnit& unit = model.units.displacement;
    if (curves.empty())
        return;
    std::size_t best = 0;
    for (std::size_t m = 1; m < curves.size(); ++m) {
        if (std::abs(d.results->members[m].deflection_max.value) >
            std::abs(d.results->members[best].deflection_max.value))
            best = m;
    }
    const firn::Extreme& e = d.results->members[best].deflection_max;
    if (shown(std::abs(e.value), unit) == shown(0.0, unit))
        return;
    // The displaced place nearest the extreme's position.
    const Curve& c = curves[best];
    std::size_t nearest = 0;
    for (std::size_t i = 1; i < c.places.size(); ++i) {
        if (std::abs(c.places[i].s - e.position) < std::abs(c.places[nearest].s - e.position))
            nearest = i;
    }
    const Member& member = model.members[best];
    const Node& n0 = model.nodes[at(member.start)];
    MemberGeometry g = member_geometry(model, make_id<MemberId>(best));
    double s = c.places[nearest].s;
    Point p = sheet.view().at(n0.x + g.c * s + magnification * moved[best][nearest].first,
                              n0.y + g.s * s + magnification * moved[best][nearest].second);
    SheetAxes axes = sheet_axes(sheet.analysis(), sheet.view(), make_id<MemberId>(best));
    double side = e.value >= 0.0 ? 1.0 : -1.0;
    std::string text =
        "deflection " + shown(e.value, unit) + " " + unit.name + " (" + member.name + ")";
    Point centre = sheet.place_label(p, {axes.local_y.x * side, axes.local_y.y * side}, text, 10.5);
    sheet.body().text(centre, text,
                      "class=\"value\" text-anchor=\"middle\" " +
                          attribute("data-member", member.name) + " " +
                          attribute("data-quantity", "deflection"));
}

Sheet deflected_sheet(const Analysis& a, const SubjectData& d, const std::vector<Curve>& curves) {
    const Model& model = a.model;
    SheetBuilder sheet(a, subject_path(d, Diagram::deflection),
                       std::string("Deflected shape: ") + d.description, kPad);
    draw_frame(sheet, true, false);
    const auto& disp = d.results->displacements;
    // The displaced position of each sample, in the model (m): the chord between the
    // displaced ends plus the deflection along local y.
    std::vector<std::vector<std::pair<double, double>>> moved(curves.size());
    double largest = 0.0;
    for (std::size_t m = 0; m < curves.size(); ++m) {
        const Member& member = model.members[m];
        MemberGeometry g = member_geometry(model, make_id<MemberId>(m));
        const auto& u0 = disp[at(member.start)];
        const auto& u1 = disp[at(member.end)];
        for (std::size_t i = 0; i < curves[m].places.size(); ++i) {
            double f = g.length > 0.0 ? curves[m].places[i].s / g.length : 0.0;
            double w = curves[m].upper[i];
            double dx = u0[0] + (u1[0] - u0[0]) * f - g.s * w;
            double dy = u0[1] + (u1[1] - u0[1]) * f + g.c * w;
            moved[m].push_back({dx, dy});
            largest = std::max(largest, std::hypot(dx, dy));
        }
    }
    double magnification = 1.0;
    if (largest > 0.0)
        magnification = round_down_125(kDeflection / (largest * sheet.view().scale));
    sheet.body().open_group("id=\"" + sheet.id("deflected") + "\"");
    for (std::size_t m = 0; m < curves.size(); ++m) {
        const Member& member = model.members[m];
        const Node& n0 = model.nodes[at(member.start)];
        MemberGeometry g = member_geometry(model, make_id<MemberId>(m));
        std::vector<Point> line;
        for (std::size_t i = 0; i < moved[m].size(); ++i) {
            double s = curves[m].places[i].s;
            line.push_back(sheet.view().at(n0.x + g.c * s + magnification * moved[m][i].first,
                                           n0.y + g.s * s + magnification * moved[m][i].second));
        }
        sheet.body().polyline(line, "class=\"deflected\"");
    }
    sheet.body().close_group();
    // The largest horizontal and vertical node displacements, as the report lists them.
    const DisplayUnit& unit = model.units.displacement;
    sheet.body().open_group("id=\"" + sheet.id("values") + "\"");
    for (std::size_t dof : {std::size_t{0}, std::size_t{1}}) {
        std::size_t best = 0;
        for (std::size_t n = 1; n < disp.size(); ++n) {
            if (std::abs(disp[n][dof]) > std::abs(disp[best][dof]))
                best = n;
        }
        if (disp.empty() || shown(std::abs(disp[best][dof]), unit) == shown(0.0, unit))
            continue;
        const Node& n = model.nodes[best];
        Point p = sheet.view().at(n.x + magnification * disp[best][0],
                                  n.y + magnification * disp[best][1]);
        std::string text = (dof == 0 ? "dx " : "dy ") + shown(disp[best][dof], unit) + " " +
                           unit.name + " at " + n.name;
        Point centre = sheet.place_label(p, {0.0, -1.0}, text, 10.5);
        sheet.body().text(centre, text,
                          "class=\"value\" text-anchor=\"middle\" " +
                              attribute("data-node", n.name) +
                              attribute(" data-quantity", dof == 0 ? "dx" : "dy"));
    }
    label_largest_deflection(sheet, d, curves, moved, magnification);
    sheet.body().close_group();
    sheet.legend(Key::frame_faint, "the frame as built");
    sheet.legend(Key::deflected, "the frame displaced (magnified)");
    std::string factor;
    svg::append_number(factor, magnification);
    sheet.note("Displacements are drawn " + factor +
               " times their size; the frame's own dimensions are to the sheet's scale. "
               "Labelled: the largest horizontal (dx) and vertical (dy) node displacement, in " +
               unit.name +
               ", global axes (x right, y up), and the largest deflection of a member from the "
               "chord through its displaced ends, along its local y, as the report gives it.");
    return sheet.finish();
}

}  // namespace

std::vector<Sheet> diagram_sheets(const Analysis& a, const Subject& subject,
                                  std::span<const Diagram> diagrams) {
    SubjectData d = subject_data(a, subject);
    std::vector<Diagram> wanted;
    for (Diagram diagram : diagrams) {
        if (!(d.envelope && diagram == Diagram::deflection))
            wanted.push_back(diagram);
    }
    // Every diagram of one member comes from the same functions: build them once.
    std::vector<std::vector<Curve>> curves(wanted.size());
    for (std::size_t m = 0; m < a.model.members.size(); ++m) {
        MemberId id = make_id<MemberId>(m);
        std::vector<MemberFunctions> functions = functions_of(a, d, id);
        double length = member_geometry(a.model, id).length;
        for (std::size_t k = 0; k < wanted.size(); ++k) {
            std::vector<double> extra;
            for (const Extreme& e : extremes_of(d, m, wanted[k]))
                extra.push_back(e.position);
            curves[k].push_back(curve_of(functions, wanted[k], length, extra, d.envelope));
        }
    }
    std::vector<Sheet> sheets;
    for (std::size_t k = 0; k < wanted.size(); ++k) {
        if (wanted[k] == Diagram::deflection)
            sheets.push_back(deflected_sheet(a, d, curves[k]));
        else
            sheets.push_back(force_sheet(a, d, wanted[k], curves[k]));
    }
    return sheets;
}

}  // namespace firn::draw
