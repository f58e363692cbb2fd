// draw: SVG sheets of a model, its loads and its force diagrams, from one
// analysis; the self-contained HTML report that holds them; and the output
// folder they are written to, where firn never loses a file the user made.
#pragma once

#include <span>
#include <string>
#include <string_view>
#include <vector>

#include "ir/analysis.hpp"

namespace firn {

/// The force diagrams a diagram sheet can show.
enum class Diagram { moment, shear, axial, deflection };

/// What to draw. Names may hold `*` (any run of characters).
struct DrawOptions {
    bool loads = true;                      ///< a loads sheet for every load case
    bool envelopes = true;                  ///< diagrams of every envelope set
    std::vector<std::string> cases;         ///< diagrams of these load cases too
    std::vector<std::string> combinations;  ///< diagrams of these combinations too
    std::vector<Diagram> diagrams{Diagram::moment, Diagram::shear, Diagram::axial,
                                  Diagram::deflection};
};

/// One drawing: where it goes (relative to the output folder, '/' separated),
/// its heading, and the SVG text.
struct Sheet {
    std::string path;
    std::string heading;
    std::string svg;
};

/// The sheets of an analysis that succeeded, in a fixed order: the frame, the
/// loads of each case, then diagrams (envelopes, cases, combinations). A name
/// in `options` that matches nothing is reported in `errors`, and nothing is drawn.
/// With no combinations in the model, and no cases asked for, every case's
/// diagrams are drawn instead of envelopes.
std::vector<Sheet> draw_sheets(const Analysis& analysis, const DrawOptions& options,
                               std::vector<std::string>& errors);

/// The page: a cover with the caution and a list of contents, the text report
/// (`text_report`, as `firn run` prints it), then the sheets in their order.
/// Well-formed XML as well as HTML, so the same checker reads it and the SVGs.
std::string html_report(const Model& model, std::string_view text_report,
                        std::span<const Sheet> sheets);

/// A file of the output, its path relative to the folder ('/' separated).
struct OutputFile {
    std::string path;
    std::string content;
};

/// The list of the files firn wrote, kept in the folder.
inline constexpr const char* kDrawingsManifest = "firn-drawings.txt";

/// Writes `files` into `folder` (created if missing), each atomically, then the
/// list. A folder that holds files but no list was not made by `firn draw`: it is
/// refused unless `force` (then only the files named here are replaced). Files
/// of an earlier run that this run does not write are removed. On failure
/// returns false with a sentence in `error`.
bool write_drawings(const std::string& folder, const std::vector<OutputFile>& files, bool force,
                    std::string& error);

}  // namespace firn
