// html_report: the text report and the drawings on one page.
#include "draw/draw.hpp"

#include "draw/svg.hpp"
#include "report/report.hpp"

namespace firn {
namespace {

// Screen: a readable column; print: landscape pages, each drawing on its own page.
constexpr std::string_view kStyle =
    R"(body{font-family:sans-serif;color:#1d232b;margin:24px auto;max-width:1060px;padding:0 16px}
h1{font-size:22px;margin:0 0 6px}
h2{font-size:17px;margin:18px 0 8px}
.caution{border:1.5px solid #1d232b;padding:8px 12px;background:#f4f5f7}
.source{font-size:13px}
nav ol{font-size:13px;columns:2}
pre{font-family:monospace;font-size:11px;line-height:1.3;overflow-x:auto;border-top:1px solid #a3a9b1;padding-top:8px}
section.sheet svg{width:100%;height:auto;border:1px solid #a3a9b1}
@media print{
@page{size:landscape;margin:10mm}
body{margin:0;max-width:none;padding:0}
nav{break-after:page;page-break-after:always}
pre{font-size:7.5px;overflow:visible;white-space:pre-wrap}
section.sheet{break-before:page;page-break-before:always;break-inside:avoid;page-break-inside:avoid}
section.sheet h2{margin-top:0}
section.sheet svg{border:none;max-height:175mm}
}
)";

/// An SVG document without its XML declaration, for inlining.
std::string_view svg_element(std::string_view document) {
    std::size_t start = document.find("<svg");
    return start == std::string_view::npos ? document : document.substr(start);
}

/// The sheet's own path: unique, and an HTML id may hold any character but space.
std::string anchor(const Sheet& sheet) {
    return "sheet:" + svg::escape(sheet.path);
}

}  // namespace

std::string html_report(const Model& model, std::string_view text_report,
                        std::span<const Sheet> sheets) {
    std::string title = model.title.empty() ? std::string("(untitled model)") : model.title;
    std::string out;
    out += "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\"/>\n<title>";
    out += svg::escape(title) + " - firn report</title>\n<style>\n";
    out += kStyle;
    out += "</style>\n</head>\n<body>\n<header>\n<h1>" + svg::escape(title) + "</h1>\n";
    out += "<p class=\"source\">Results and drawings by firn from " +
           svg::escape(shown_source(model.source_name)) + ".</p>\n";
    out += "<p class=\"caution\"><strong>Caution.</strong> " + svg::escape(kCaution) + "</p>\n";
    out += "</header>\n<nav>\n<h2>Contents</h2>\n<ol>\n";
    out += "<li><a href=\"#report\">Results (the text report)</a></li>\n";
    for (const Sheet& s : sheets)
        out += "<li><a href=\"#" + anchor(s) + "\">" + svg::escape(s.heading) + "</a></li>\n";
    out += "</ol>\n</nav>\n";
    out += "<section class=\"report\" id=\"report\">\n<h2>Results (the text report)</h2>\n<pre>";
    out += svg::escape(text_report);
    out += "</pre>\n</section>\n";
    for (const Sheet& s : sheets) {
        out += "<section class=\"sheet\" id=\"" + anchor(s) + "\">\n<h2>" + svg::escape(s.heading) +
               "</h2>\n";
        out += svg_element(s.svg);
        out += "</section>\n";
    }
    out += "</body>\n</html>\n";
    return out;
}

}  // namespace firn
