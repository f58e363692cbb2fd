// svg: deterministic SVG text.
#include "draw/svg.hpp"

#include <array>
#include <cmath>
#include <utility>

#include "base/number_format.hpp"

namespace firn::svg {

void append_number(std::string& out, double value) {
    if (!std::isfinite(value))
        value = 0.0;  // never write "nan" into a drawing; callers keep values finite
    std::array<char, kNumberBuffer> buffer;
    std::string_view text = format_fixed(buffer.data(), value, 2);
    // Drop trailing zeros, then a trailing point: 12.50 -> 12.5, 3.00 -> 3.
    while (text.back() == '0')
        text.remove_suffix(1);
    if (text.back() == '.')
        text.remove_suffix(1);
    if (text == "-0" || text.empty())
        text = "0";
    out += text;
}

std::string number(double value) {
    std::string out;
    append_number(out, value);
    return out;
}

std::string escape(std::string_view text) {
    std::string out;
    out.reserve(text.size());
    for (char ch : text) {
        switch (ch) {
            case '&':
                out += "&amp;";
                break;
            case '<':
                out += "&lt;";
                break;
            case '>':
                out += "&gt;";
                break;
            case '"':
                out += "&quot;";
                break;
            case '\'':
                out += "&apos;";
                break;
            default:
                // XML 1.0 forbids most control characters even as references.
                if (static_cast<unsigned char>(ch) >= 0x20 || ch == '\t' || ch == '\n')
                    out += ch;
        }
    }
    return out;
}

std::string document(double width, double height, std::string_view title, std::string_view head,
                     std::string_view body) {
    std::string out;
    out += "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n";
    out += "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"";
    append_number(out, width);
    out += "\" height=\"";
    append_number(out, height);
    out += "\" viewBox=\"0 0 ";
    append_number(out, width);
    out += ' ';
    append_number(out, height);
    out += "\">\n<title>";
    out += escape(title);
    out += "</title>\n";
    out += head;
    out += body;
    out += "</svg>\n";
    return out;
}

void Writer::open_group(std::string_view attributes) {
    out_ += "<g";
    if (!attributes.empty()) {
        out_ += ' ';
        out_ += attributes;
    }
    out_ += ">\n";
}

void Writer::close_group() {
    out_ += "</g>\n";
}

void Writer::line(Point a, Point b, std::string_view attributes) {
    out_ += "<line x1=\"";
    append_number(out_, a.x);
    out_ += "\" y1=\"";
    append_number(out_, a.y);
    out_ += "\" x2=\"";
    append_number(out_, b.x);
    out_ += "\" y2=\"";
    append_number(out_, b.y);
    out_ += "\" ";
    out_ += attributes;
    out_ += "/>\n";
}

void Writer::points_attribute(std::span<const Point> points) {
    out_ += "points=\"";
    for (std::size_t i = 0; i < points.size(); ++i) {
        if (i > 0)
            out_ += ' ';
        append_number(out_, points[i].x);
        out_ += ',';
        append_number(out_, points[i].y);
    }
    out_ += "\" ";
}

void Writer::polyline(std::span<const Point> points, std::string_view attributes) {
    out_ += "<polyline ";
    points_attribute(points);
    out_ += attributes;
    out_ += "/>\n";
}

void Writer::polygon(std::span<const Point> points, std::string_view attributes) {
    out_ += "<polygon ";
    points_attribute(points);
    out_ += attributes;
    out_ += "/>\n";
}

void Writer::circle(Point centre, double radius, std::string_view attributes) {
    out_ += "<circle cx=\"";
    append_number(out_, centre.x);
    out_ += "\" cy=\"";
    append_number(out_, centre.y);
    out_ += "\" r=\"";
    append_number(out_, radius);
    out_ += "\" ";
    out_ += attributes;
    out_ += "/>\n";
}

void Writer::rect(Point corner, double width, double height, std::string_view attributes) {
    out_ += "<rect x=\"";
    append_number(out_, corner.x);
    out_ += "\" y=\"";
    append_number(out_, corner.y);
    out_ += "\" width=\"";
    append_number(out_, width);
    out_ += "\" height=\"";
    append_number(out_, height);
    out_ += "\" ";
    out_ += attributes;
    out_ += "/>\n";
}

void Writer::path(std::string_view d, std::string_view attributes) {
    out_ += "<path d=\"";
    out_ += d;
    out_ += "\" ";
    out_ += attributes;
    out_ += "/>\n";
}

void Writer::text(Point at, std::string_view content, std::string_view attributes) {
    out_ += "<text x=\"";
    append_number(out_, at.x);
    out_ += "\" y=\"";
    append_number(out_, at.y);
    out_ += '"';
    if (!attributes.empty()) {
        out_ += ' ';
        out_ += attributes;
    }
    out_ += '>';
    out_ += escape(content);
    out_ += "</text>\n";
}

std::string Writer::finish() {
    std::string body = std::move(out_);
    out_.clear();
    return body;
}

}  // namespace firn::svg
