// draw: which sheets an analysis gets, in a fixed order.
#include "draw/draw.hpp"

#include <set>

#include "base/name_pattern.hpp"
#include "draw/draw_internal.hpp"

namespace firn {

std::vector<Sheet> draw_sheets(const Analysis& a, const DrawOptions& options,
                               std::vector<std::string>& errors) {
    const Model& model = a.model;
    std::vector<std::size_t> cases = matching_names(
        options.cases, model.cases.size(), [&](std::size_t i) { return model.cases[i].name; },
        "load case", errors);
    const auto& list = a.combinations.combinations;
    std::vector<std::size_t> combinations = matching_names(
        options.combinations, list.size(), [&](std::size_t i) { return list[i].name; },
        "combination", errors);
    // The diagrams are drawn from first-order member functions; a set solved to
    // second order would be drawn with the wrong curves, so it is not drawn at
    // all (its values are in the report) until the diagrams learn its functions.
    bool second_order = model.combine && model.combine->second_order;
    if (second_order && !options.combinations.empty())
        errors.push_back(
            "combinations solved to second order have no diagrams yet; their "
            "values are in the report");
    if (!errors.empty())
        return {};
    bool envelopes = options.envelopes && !a.combinations.sets.empty() && !second_order;
    // Without combinations there is no envelope: show each case instead, as long as
    // the user did not pick some.
    if (a.combinations.sets.empty() && options.cases.empty() && options.combinations.empty()) {
        for (std::size_t i = 0; i < model.cases.size(); ++i)
            cases.push_back(i);
    }

    std::vector<Sheet> sheets;
    sheets.push_back(draw::frame_sheet(a));
    if (options.loads) {
        draw::LoadScales scales = draw::load_scales(model);
        for (std::size_t c = 0; c < model.cases.size(); ++c)
            sheets.push_back(draw::loads_sheet(a, make_id<CaseId>(c), scales));
    }
    auto add = [&](draw::Subject::Kind kind, std::size_t index) {
        for (Sheet& s : draw::diagram_sheets(a, {kind, index}, options.diagrams))
            sheets.push_back(std::move(s));
    };
    if (envelopes) {
        for (std::size_t s = 0; s < a.combinations.sets.size(); ++s)
            add(draw::Subject::Kind::envelope, s);
    }
    for (std::size_t c : cases)
        add(draw::Subject::Kind::load_case, c);
    for (std::size_t c : combinations)
        add(draw::Subject::Kind::combination, c);

    // Two names that differ only in characters a file name cannot hold would give
    // one path: number the later ones.
    std::set<std::string> used;
    for (Sheet& s : sheets) {
        std::string path = s.path;
        for (int n = 2; !used.insert(path).second; ++n)
            path = s.path.substr(0, s.path.size() - 4) + "~" + std::to_string(n) + ".svg";
        s.path = path;
    }
    return sheets;
}

}  // namespace firn
