// draw_internal: what the sheet builders share: the page layout, the view from
// model to sheet, the look (style, legend), labels that avoid each other, and
// the frame drawn under every sheet.
#pragma once

#include <optional>
#include <span>
#include <string>
#include <string_view>
#include <vector>

#include "draw/draw.hpp"
#include "draw/svg.hpp"

namespace firn::draw {

/// A rectangle: on the sheet (px, y down) or in the model (m, y up).
struct Box {
    double x0 = 0.0, y0 = 0.0, x1 = 0.0, y1 = 0.0;
    double width() const { return x1 - x0; }
    double height() const { return y1 - y0; }
    bool overlaps(const Box& o) const { return x0 < o.x1 && o.x0 < x1 && y0 < o.y1 && o.y0 < y1; }
};

/// Maps model coordinates (m, y up) to the sheet (px, y down).
struct View {
    double scale = 1.0;  ///< px per m
    double ox = 0.0, oy = 0.0;
    Point at(double x, double y) const { return {ox + x * scale, oy - y * scale}; }
};

/// The extent of the nodes and grid lines; never thinner than a metre.
Box model_extent(const Model& model);

/// Entries a legend can show; each draws its own sample (ORDER LEGEND).
enum class Key {
    member,
    node,
    grid,
    support_fixed,
    support_pinned,
    support_roller,
    support_spring,
    hinge,
    frame_faint,
    load,
    positive,
    negative,
    envelope_max,
    envelope_min,
    deflected,
};

struct LegendEntry {
    Key key;
    std::string text;
};

/// One sheet under construction: a heading, the model drawn in the middle,
/// a legend and notes under it, and a footer with the source and the caution.
class SheetBuilder {
  public:
    /// `pad`: px kept free around the model for supports, loads and diagrams.
    SheetBuilder(const Analysis& analysis, std::string path, std::string subject, double pad);

    const Analysis& analysis() const { return analysis_; }
    const View& view() const { return view_; }
    const Box& drawing() const { return drawing_; }
    svg::Writer& body() { return body_; }
    /// The id of a pattern or marker of this sheet (unique when sheets share a page).
    std::string id(std::string_view name) const { return id_prefix_ + std::string(name); }
    std::string fill_url(std::string_view name) const { return "url(#" + id(name) + ")"; }

    void legend(Key key, std::string text) { legend_.push_back({key, std::move(text)}); }
    void note(std::string text) { notes_.push_back(std::move(text)); }
    /// Pushes a label clear of the labels already placed: tries further out along
    /// `direction`, then sideways. Returns where its centre goes.
    /// The same, but nothing when every place tried is taken (a value that can be
    /// left to the report on a crowded sheet).
    std::optional<Point> try_place_label(Point anchor, Point direction, std::string_view text,
                                         double font_size, bool clear_both = false);
    /// With `clear_both`, the box clears both the horizontal and the vertical line
    /// through the anchor (a node's name beside the members that meet there).
    Point place_label(Point anchor, Point direction, std::string_view text, double font_size,
                      bool clear_both = false);
    /// Keeps labels off a part of the drawing (a support symbol).
    void reserve(const Box& box) { labels_.push_back(box); }

    Sheet finish();

  private:
    std::string style() const;
    std::string legend_and_footer(double top, double& bottom) const;

    const Analysis& analysis_;
    std::string path_, subject_, id_prefix_;
    Box drawing_;
    View view_;
    svg::Writer body_;
    std::vector<LegendEntry> legend_;
    std::vector<std::string> notes_;
    std::vector<Box> labels_;
};

/// A value in a display unit with its fixed decimals, as the text report prints it.
std::string shown(double si_value, const DisplayUnit& unit);

/// Unit vector of a member on the sheet (start to end) and its local +y on the sheet.
struct SheetAxes {
    Point along, local_y;
    Point start, end;
    double length_px = 0.0;
};
SheetAxes sheet_axes(const Analysis& analysis, const View& view, MemberId m);

/// The frame: members, hinges and supports (`faint`: thin and grey, under loads
/// or diagrams), with node and member names when `names`.
void draw_frame(SheetBuilder& sheet, bool faint, bool names);
/// Grid lines with their names and the dimensions between them.
void draw_grid(SheetBuilder& sheet);
/// Legend entries for the kinds of support and the hinges the model has.
void support_legend(SheetBuilder& sheet);

Sheet frame_sheet(const Analysis& analysis);
/// The largest distributed load and the largest force of every case: one scale
/// for all loads sheets, so sheets compare at a glance.
struct LoadScales {
    double per_length = 0.0;  ///< N/m
    double force = 0.0;       ///< N
};
LoadScales load_scales(const Model& model);
Sheet loads_sheet(const Analysis& analysis, CaseId c, const LoadScales& scales);

/// What a diagram sheet shows the results of.
struct Subject {
    enum class Kind { load_case, combination, envelope } kind = Kind::load_case;
    std::size_t index = 0;  ///< case, combination or envelope set
};
/// The sheets of one subject, one per diagram asked for (a deflected shape is
/// drawn for cases and combinations, not for envelopes).
std::vector<Sheet> diagram_sheets(const Analysis& analysis, const Subject& subject,
                                  std::span<const Diagram> diagrams);

/// A file name from a case or combination name: letters, digits, '.', '_' and
/// '-' are kept, anything else becomes '_'.
std::string file_stem(std::string_view name);

}  // namespace firn::draw

namespace firn::draw {

/// A support's symbol with its node at `at`, turned `degrees` clockwise from
/// "ground below the node"; `size` is the symbol's height in px.
void draw_support_symbol(svg::Writer& out, Point at, int degrees, Support::Kind kind, double size);

/// The colours of the sheets: chosen so that the two signs stay apart for the
/// common forms of colour blindness (a blue and an orange of different
/// lightness), and apart in grey print by hatching and line style as well.
namespace colour {
inline constexpr std::string_view ink = "#1d232b";
inline constexpr std::string_view faint = "#a3a9b1";
inline constexpr std::string_view grid = "#7d848e";
inline constexpr std::string_view positive = "#1f5fa8";
inline constexpr std::string_view negative = "#c8671a";
inline constexpr std::string_view load = "#6f2f86";
}  // namespace colour

}  // namespace firn::draw
