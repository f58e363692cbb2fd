// draw_sheet: the page every drawing is laid out on, its look and its legend.
#include <algorithm>
#include <cmath>
#include <optional>

#include "base/number_format.hpp"
#include "draw/draw_internal.hpp"
#include "report/report.hpp"

namespace firn::draw {
namespace {

constexpr double kWidth = 1000.0;      // px; a landscape page at about 96 px per inch
constexpr double kMargin = 48.0;       // px left and right of everything
constexpr double kTop = 78.0;          // px: the heading above the drawing
constexpr double kMaxDrawing = 560.0;  // px: the tallest a model is drawn
constexpr double kLegendRow = 20.0;
constexpr double kNoteRow = 15.0;
constexpr std::size_t kNoteWidth = 150;  // characters a note line holds at 11 px

/// Splits `text` into lines of at most `width` characters at spaces.
std::vector<std::string> wrap(const std::string& text, std::size_t width) {
    std::vector<std::string> lines;
    std::string line;
    std::size_t start = 0;
    while (start < text.size()) {
        std::size_t end = text.find(' ', start);
        if (end == std::string::npos)
            end = text.size();
        std::string word = text.substr(start, end - start);
        if (!line.empty() && line.size() + 1 + word.size() > width) {
            lines.push_back(line);
            line.clear();
        }
        if (!line.empty())
            line += ' ';
        line += word;
        start = end + 1;
    }
    if (!line.empty())
        lines.push_back(line);
    return lines;
}

std::string id_prefix(std::string_view path) {
    std::string out = "f-";
    for (char ch : path)
        out += std::isalnum(static_cast<unsigned char>(ch)) ? ch : '-';
    out += '-';
    return out;
}

void draw_sample(svg::Writer& out, const SheetBuilder& sheet, Key key, Point at) {
    const double x0 = at.x, x1 = at.x + 36.0, y = at.y - 4.0;
    switch (key) {
        case Key::member:
            out.line({x0, y}, {x1, y}, "class=\"member\"");
            break;
        case Key::node:
            out.circle({x0 + 18.0, y}, 2.6, "class=\"node\"");
            break;
        case Key::grid:
            out.line({x0, y}, {x1, y}, "class=\"grid\"");
            break;
        case Key::support_fixed:
            draw_support_symbol(out, {x0 + 18.0, y - 5.0}, 0, Support::Kind::fixed, 12.0);
            break;
        case Key::support_pinned:
            draw_support_symbol(out, {x0 + 18.0, y - 6.0}, 0, Support::Kind::pinned, 12.0);
            break;
        case Key::support_roller:
            draw_support_symbol(out, {x0 + 18.0, y - 6.0}, 0, Support::Kind::roller_free_x, 12.0);
            break;
        case Key::support_spring:
            draw_support_symbol(out, {x0 + 18.0, y - 6.0}, 0, Support::Kind::spring, 12.0);
            break;
        case Key::hinge:
            out.line({x0, y}, {x1, y}, "class=\"member\"");
            out.circle({x0 + 18.0, y}, 4.0, "class=\"hinge\"");
            break;
        case Key::frame_faint:
            out.line({x0, y}, {x1, y}, "class=\"member faint\"");
            break;
        case Key::load: {
            out.line({x0, y}, {x1, y}, "class=\"member faint\"");
            out.line({x0 + 18.0, y - 12.0}, {x0 + 18.0, y - 1.5},
                     "class=\"load\" marker-end=\"url(#" + sheet.id("arrow") + ")\"");
            break;
        }
        case Key::positive:
            out.rect({x0, y - 7.0}, 36.0, 12.0, "class=\"pos\"");
            out.line({x0, y - 7.0}, {x1, y - 7.0}, "class=\"pos-line\"");
            break;
        case Key::negative:
            out.rect({x0, y - 7.0}, 36.0, 12.0, "class=\"neg\"");
            out.line({x0, y + 5.0}, {x1, y + 5.0}, "class=\"neg-line\"");
            break;
        case Key::envelope_max:
            out.line({x0, y}, {x1, y}, "class=\"pos-line\"");
            break;
        case Key::envelope_min:
            out.line({x0, y}, {x1, y}, "class=\"neg-line\"");
            break;
        case Key::deflected:
            out.line({x0, y}, {x1, y}, "class=\"deflected\"");
            break;
    }
}

}  // namespace

Box model_extent(const Model& model) {
    Box b{0.0, 0.0, 0.0, 0.0};
    bool first = true;
    auto add = [&](double x, double y) {
        if (first) {
            b = {x, y, x, y};
            first = false;
        }
        b.x0 = std::min(b.x0, x);
        b.x1 = std::max(b.x1, x);
        b.y0 = std::min(b.y0, y);
        b.y1 = std::max(b.y1, y);
    };
    for (const Node& n : model.nodes)
        add(n.x, n.y);
    if (!first) {  // grid lines widen the extent only along their own axis
        for (const GridLine& g : model.grid_x)
            add(g.position, b.y0);
        for (const GridLine& g : model.grid_y)
            add(b.x0, g.position);
    }
    // A frame that is one line still needs a drawing area on both axes.
    double least = std::max({1.0, 0.1 * b.width(), 0.1 * b.height()});
    if (b.width() < least) {
        double mid = 0.5 * (b.x0 + b.x1);
        b.x0 = mid - 0.5 * least;
        b.x1 = mid + 0.5 * least;
    }
    if (b.height() < least) {
        double mid = 0.5 * (b.y0 + b.y1);
        b.y0 = mid - 0.5 * least;
        b.y1 = mid + 0.5 * least;
    }
    return b;
}

std::string shown(double si_value, const DisplayUnit& unit) {
    std::string out;
    append_fixed(out, unit.from_si(si_value), unit.decimals);
    return out;
}

SheetAxes sheet_axes(const Analysis& analysis, const View& view, MemberId m) {
    const Member& member = analysis.model.members[at(m)];
    const Node& a = analysis.model.nodes[at(member.start)];
    const Node& b = analysis.model.nodes[at(member.end)];
    SheetAxes axes;
    axes.start = view.at(a.x, a.y);
    axes.end = view.at(b.x, b.y);
    double dx = axes.end.x - axes.start.x, dy = axes.end.y - axes.start.y;
    axes.length_px = std::hypot(dx, dy);
    double inv = axes.length_px > 0.0 ? 1.0 / axes.length_px : 0.0;
    axes.along = {dx * inv, dy * inv};
    // Local y is local x turned 90 degrees counterclockwise in the model; the
    // sheet's y runs down, so on the sheet that is (along.y, -along.x).
    axes.local_y = {axes.along.y, -axes.along.x};
    return axes;
}

std::string file_stem(std::string_view name) {
    std::string out;
    for (char ch : name) {
        bool keep =
            std::isalnum(static_cast<unsigned char>(ch)) || ch == '.' || ch == '_' || ch == '-';
        out += keep ? ch : '_';
    }
    if (out.empty() || out.front() == '.')
        out.insert(out.begin(), '_');  // never a hidden file, never "." or ".."
    return out;
}

SheetBuilder::SheetBuilder(const Analysis& analysis, std::string path, std::string subject,
                           double pad)
    : analysis_(analysis),
      path_(std::move(path)),
      subject_(std::move(subject)),
      id_prefix_(id_prefix(path_)) {
    Box world = model_extent(analysis.model);
    double inner_width = kWidth - 2.0 * kMargin - 2.0 * pad;
    double inner_height_max = kMaxDrawing - 2.0 * pad;
    double scale = std::min(inner_width / world.width(), inner_height_max / world.height());
    double inner_height = world.height() * scale;
    drawing_ = {kMargin, kTop, kWidth - kMargin, kTop + inner_height + 2.0 * pad};
    // Centre the model horizontally in the drawing area.
    double left = kMargin + pad + 0.5 * (inner_width - world.width() * scale);
    view_.scale = scale;
    view_.ox = left - world.x0 * scale;
    view_.oy = kTop + pad + world.y1 * scale;
}

std::optional<Point> SheetBuilder::try_place_label(Point anchor, Point direction,
                                                   std::string_view text, double font_size,
                                                   bool clear_both) {
    double half_w = 0.31 * font_size * static_cast<double>(text.size()) + 1.5;
    double half_h = 0.5 * font_size + 1.0;
    // The centre sits far enough along `direction` that the box clears the anchor.
    double reach = std::abs(direction.x) * half_w + std::abs(direction.y) * half_h + 3.0;
    if (clear_both && std::abs(direction.x) > 0.1 && std::abs(direction.y) > 0.1)
        reach = std::max(half_w / std::abs(direction.x), half_h / std::abs(direction.y)) + 2.0;
    Point side{-direction.y, direction.x};
    // Outward in three steps, each straight out and to either side.
    for (int attempt = 0; attempt < 9; ++attempt) {
        double out = reach + 1.2 * font_size * (attempt / 3);
        double shift = (attempt % 3 == 0 ? 0.0 : attempt % 3 == 1 ? 1.0 : -1.0) * 2.2 * half_h;
        Point centre{anchor.x + direction.x * out + side.x * shift,
                     anchor.y + direction.y * out + side.y * shift};
        Box box{centre.x - half_w, centre.y - half_h, centre.x + half_w, centre.y + half_h};
        bool free = std::none_of(labels_.begin(), labels_.end(),
                                 [&box](const Box& other) { return box.overlaps(other); });
        if (free) {
            labels_.push_back(box);
            // Text is placed by its baseline; move it down a third of its size to centre it.
            return Point{centre.x, centre.y + 0.35 * font_size};
        }
    }
    return std::nullopt;
}

Point SheetBuilder::place_label(Point anchor, Point direction, std::string_view text,
                                double font_size, bool clear_both) {
    if (auto centre = try_place_label(anchor, direction, text, font_size, clear_both))
        return *centre;
    // No room: straight out, over whatever is there (a name must be shown).
    double half_w = 0.31 * font_size * static_cast<double>(text.size()) + 1.5;
    double half_h = 0.5 * font_size + 1.0;
    double reach = std::abs(direction.x) * half_w + std::abs(direction.y) * half_h + 3.0;
    Point centre{anchor.x + direction.x * reach, anchor.y + direction.y * reach};
    labels_.push_back({centre.x - half_w, centre.y - half_h, centre.x + half_w, centre.y + half_h});
    return {centre.x, centre.y + 0.35 * font_size};
}

std::string SheetBuilder::style() const {
    std::string s = "<style>\n";
    s += "text{font-family:sans-serif;fill:" + std::string(colour::ink) + "}\n";
    s += ".heading{font-size:18px;font-weight:bold}.subject{font-size:13px}\n";
    s += ".name{font-size:10px}.member-name{font-size:10px;font-style:italic}\n";
    s += ".value{font-size:10.5px;font-weight:bold}.small{font-size:9.5px}.note{font-size:11px}\n";
    s += ".grid-name{font-size:11px;font-weight:bold}.dim-text{font-size:10px}\n";
    s += ".member{stroke:" + std::string(colour::ink) +
         ";stroke-width:2.6;fill:none;stroke-linecap:round}\n";
    s += ".member.faint{stroke:" + std::string(colour::faint) + ";stroke-width:1.6}\n";
    s += ".node{fill:" + std::string(colour::ink) + "}\n";
    s += ".hinge{fill:#ffffff;stroke:" + std::string(colour::ink) + ";stroke-width:1.4}\n";
    s += ".support{fill:#ffffff;stroke:" + std::string(colour::ink) + ";stroke-width:1.3}\n";
    s += ".ground{stroke:" + std::string(colour::ink) + ";stroke-width:1.3;fill:none}\n";
    s += ".grid{stroke:" + std::string(colour::grid) +
         ";stroke-width:0.8;stroke-dasharray:12 3 2 3;fill:none}\n";
    s += ".bubble{fill:#ffffff;stroke:" + std::string(colour::grid) + ";stroke-width:1}\n";
    s += ".dim{stroke:" + std::string(colour::grid) + ";stroke-width:0.8;fill:none}\n";
    s += ".load{stroke:" + std::string(colour::load) + ";stroke-width:1.2;fill:none}\n";
    s += ".load-band{stroke:" + std::string(colour::load) +
         ";stroke-width:1.2;fill:" + std::string(colour::load) + ";fill-opacity:0.08}\n";
    s += ".load-text{fill:" + std::string(colour::load) + ";font-size:10.5px;font-weight:bold}\n";
    s += ".pos{fill:" + fill_url("hatch-pos") + ";stroke:none}\n";
    s += ".neg{fill:" + fill_url("hatch-neg") + ";stroke:none}\n";
    s += ".pos-line{stroke:" + std::string(colour::positive) + ";stroke-width:1.8;fill:none}\n";
    s += ".neg-line{stroke:" + std::string(colour::negative) +
         ";stroke-width:1.8;fill:none;stroke-dasharray:5 2.5}\n";
    s += ".deflected{stroke:" + std::string(colour::positive) +
         ";stroke-width:2.4;fill:none;stroke-linecap:round}\n";
    s += ".frame-box{fill:none;stroke:" + std::string(colour::grid) + ";stroke-width:0.8}\n";
    s += "</style>\n";
    return s;
}

Sheet SheetBuilder::finish() {
    double bottom = 0.0;
    std::string tail = legend_and_footer(drawing_.y1 + 14.0, bottom);
    double height = bottom + 14.0;

    std::string head = style();
    // Hatching: positive values with lines rising to the right, negative ones with
    // lines falling to the right and sparser, so the two differ without colour.
    head += "<defs>\n";
    head += "<pattern id=\"" + id("hatch-pos") +
            "\" width=\"6\" height=\"6\" patternUnits=\"userSpaceOnUse\" "
            "patternTransform=\"rotate(45)\"><line x1=\"0\" y1=\"0\" x2=\"0\" y2=\"6\" "
            "stroke=\"" +
            std::string(colour::positive) + "\" stroke-width=\"1.2\"/></pattern>\n";
    head += "<pattern id=\"" + id("hatch-neg") +
            "\" width=\"9\" height=\"9\" patternUnits=\"userSpaceOnUse\" "
            "patternTransform=\"rotate(-45)\"><line x1=\"0\" y1=\"0\" x2=\"0\" y2=\"9\" "
            "stroke=\"" +
            std::string(colour::negative) + "\" stroke-width=\"1\"/></pattern>\n";
    head += "<marker id=\"" + id("arrow") +
            "\" viewBox=\"0 0 10 10\" refX=\"10\" refY=\"5\" markerWidth=\"7\" "
            "markerHeight=\"7\" orient=\"auto-start-reverse\" markerUnits=\"userSpaceOnUse\">"
            "<path d=\"M0,1 L10,5 L0,9 Z\" fill=\"" +
            std::string(colour::load) + "\"/></marker>\n";
    head += "</defs>\n";

    svg::Writer top;
    top.rect({0.0, 0.0}, kWidth, height, "fill=\"#ffffff\"");
    const std::string& title =
        analysis_.model.title.empty() ? std::string("(untitled model)") : analysis_.model.title;
    top.text({kMargin, 32.0}, title, "class=\"heading\"");
    top.text({kMargin, 54.0}, subject_, "class=\"subject\"");
    top.line({kMargin, 64.0}, {kWidth - kMargin, 64.0}, "class=\"dim\"");

    std::string body = top.finish() + body_.finish() + tail;
    std::string heading = title + " - " + subject_;
    return Sheet{path_, subject_, svg::document(kWidth, height, heading, head, body)};
}

std::string SheetBuilder::legend_and_footer(double top, double& bottom) const {
    svg::Writer out;
    double y = top;
    out.line({kMargin, y}, {kWidth - kMargin, y}, "class=\"dim\"");
    y += 18.0;
    out.text({kMargin, y}, "Legend", "class=\"grid-name\"");
    // Two columns of entries.
    const double column = 0.5 * (kWidth - 2.0 * kMargin);
    for (std::size_t i = 0; i < legend_.size(); ++i) {
        double x = kMargin + (i % 2 == 0 ? 0.0 : column);
        double row_y = y + kLegendRow * static_cast<double>(i / 2 + 1);
        draw_sample(out, *this, legend_[i].key, {x, row_y});
        out.text({x + 46.0, row_y}, legend_[i].text, "class=\"note\"");
    }
    y += kLegendRow * static_cast<double>((legend_.size() + 1) / 2) + 8.0;
    for (const std::string& note : notes_) {
        for (const std::string& line : wrap(note, kNoteWidth)) {
            y += kNoteRow;
            out.text({kMargin, y}, line, "class=\"note\"");
        }
    }
    y += 12.0;
    out.line({kMargin, y}, {kWidth - kMargin, y}, "class=\"dim\"");
    y += 14.0;
    out.text({kMargin, y},
             "Drawn by firn from " + shown_source(analysis_.model.source_name) + "; sheet " + path_,
             "class=\"small\"");
    for (const std::string& line : wrap(std::string("Caution: ") + kCaution, 170)) {
        y += 13.0;
        out.text({kMargin, y}, line, "class=\"small\"");
    }
    bottom = y;
    return out.finish();
}

}  // namespace firn::draw
