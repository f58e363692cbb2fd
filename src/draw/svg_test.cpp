// Tests of the SVG writer's number formatting and escaping, and of the XML
// checker the drawing tests rely on.
#include <catch2/catch.hpp>

#include "draw/svg.hpp"
#include "testing/svg_xml_check.hpp"

namespace firn {
namespace {

using testing::XmlChecker;

TEST_CASE("svg numbers: two decimals at most, no trailing zeros, never -0", "[svg]") {
    CHECK(svg::number(12.5) == "12.5");
    CHECK(svg::number(3.0) == "3");
    CHECK(svg::number(1234.5678) == "1234.57");
    CHECK(svg::number(-0.001) == "0");
    CHECK(svg::number(-0.0) == "0");
    CHECK(svg::number(-2.25) == "-2.25");
    CHECK(svg::number(0.1) == "0.1");
    CHECK(svg::number(100.0) == "100");
}

TEST_CASE("svg text is escaped for XML", "[svg]") {
    CHECK(svg::escape("a < b & \"c\" > 'd'") == "a &lt; b &amp; &quot;c&quot; &gt; &apos;d&apos;");
    CHECK(svg::escape(std::string("x\x01y")) == "xy");
}

TEST_CASE("a written document is well-formed XML", "[svg]") {
    svg::Writer w;
    w.open_group("class=\"a\"");
    w.line({0, 0}, {10.25, -3}, "class=\"member\"");
    Point pts[3] = {{0, 0}, {1, 1}, {2, 0}};
    w.polyline(pts, "class=\"pos-line\"");
    w.text({5, 5}, "M+ <max> & \"more\"", "class=\"value\"");
    w.close_group();
    std::string doc = svg::document(100, 50, "title & more", "<style>text{}</style>\n", w.finish());
    CHECK(XmlChecker::check(doc).empty());
    CHECK(doc.find("x2=\"10.25\" y2=\"-3\"") != std::string::npos);
}

TEST_CASE("the XML checker rejects what is not well-formed", "[svg]") {
    CHECK(XmlChecker::check("<a><b></b></a>").empty());
    CHECK(XmlChecker::check("<?xml version=\"1.0\"?>\n<a x='1' y=\"2\"/>\n").empty());
    CHECK(XmlChecker::check("<!DOCTYPE html>\n<html><p>&amp;&#38;&#x26;</p></html>").empty());
    CHECK_FALSE(XmlChecker::check("<a><b></a></b>").empty());
    CHECK_FALSE(XmlChecker::check("<a>").empty());
    CHECK_FALSE(XmlChecker::check("<a x=1/>").empty());
    CHECK_FALSE(XmlChecker::check("<a x=\"1\" x=\"2\"/>").empty());
    CHECK_FALSE(XmlChecker::check("<a>&nbsp;</a>").empty());
    CHECK_FALSE(XmlChecker::check("<a>1 < 2</a>").empty());
    CHECK_FALSE(XmlChecker::check("<a/><b/>").empty());
    CHECK_FALSE(XmlChecker::check("<a y=\"<\"/>").empty());
}

}  // namespace
}  // namespace firn
