// svg: a small writer of SVG text with fixed number formatting, so the same
// drawing always gives the same bytes (no locale, no "-0", no exponents).
#pragma once

#include <span>
#include <string>
#include <string_view>

namespace firn {

/// A point on a sheet, in SVG user units (px), y down.
struct Point {
    double x = 0.0;
    double y = 0.0;
};

namespace svg {

/// Appends a coordinate with at most two decimals, trailing zeros dropped
/// ("12.5", "3", never "-0").
void append_number(std::string& out, double value);
std::string number(double value);

/// `text` with &, <, >, " and ' replaced by entities, and control characters
/// other than tab and newline dropped: safe in XML text and attribute values.
std::string escape(std::string_view text);

/// A whole SVG document: the XML declaration, the root element sized
/// `width` x `height` px, its title, then `head` (style, defs) and `body`.
std::string document(double width, double height, std::string_view title, std::string_view head,
                     std::string_view body);

/// Builds the body of an SVG document element by element. `attributes`
/// arguments are written as given (already escaped), e.g. `class="member"`.
class Writer {
  public:
    void raw(std::string_view text) { out_ += text; }
    void open_group(std::string_view attributes);
    void close_group();
    void line(Point a, Point b, std::string_view attributes);
    void polyline(std::span<const Point> points, std::string_view attributes);
    void polygon(std::span<const Point> points, std::string_view attributes);
    void circle(Point centre, double radius, std::string_view attributes);
    void rect(Point corner, double width, double height, std::string_view attributes);
    void path(std::string_view d, std::string_view attributes);
    /// Text at `at`; `content` is escaped here.
    void text(Point at, std::string_view content, std::string_view attributes);

    /// The elements written so far; the writer is empty afterwards.
    std::string finish();

  private:
    void points_attribute(std::span<const Point> points);
    std::string out_;
};

}  // namespace svg
}  // namespace firn
