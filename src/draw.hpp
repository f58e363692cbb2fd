// draw: SVG sheets of a model, its loads and its force diagrams, from one
// analysis. Knows nothing of files: the command writes the sheets.
#pragma once

#include <string>
#include <vector>

#include "driver.hpp"

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

/// True if `name` matches `pattern`, where `*` stands for any run of characters.
bool name_matches(std::string_view pattern, std::string_view name);

}  // namespace firn
