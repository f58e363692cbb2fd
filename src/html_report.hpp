// html_report: one self-contained HTML page for a reviewer: the text report and
// every drawing inline (no scripts, no links outside the file), printable to
// PDF by a browser with each drawing on a page of its own.
#pragma once

#include <span>
#include <string>
#include <string_view>

#include "draw.hpp"

namespace firn {

/// The page: a cover with the caution and a list of contents, the text report
/// (`text_report`, as `firn run` prints it), then the sheets in their order.
/// Well-formed XML as well as HTML, so the same checker reads it and the SVGs.
std::string html_report(const Model& model, std::string_view text_report,
                        std::span<const Sheet> sheets);

}  // namespace firn
