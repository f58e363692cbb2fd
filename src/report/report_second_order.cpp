// report_second_order: the text report's account of a set solved to second
// order: which analysis its values come from, and per combination the
// iterations, convergence, critical load factor, amplification and notional load.
#include <fmt/format.h>
#include <cmath>

#include "report/report_envelopes.hpp"
#include "report/report_table.hpp"

namespace firn {
namespace {

using namespace report_detail;

void write_intro(std::string& out, const CombineChoice& choice) {
    const SecondOrderOptions& o = choice.second_order_options;
    out +=
        "Each combination of this set is solved on its own with second-order effects: P-Delta\n"
        "of the frame's sway and P-delta along each member (exact stability functions of the\n"
        "member under its axial force), iterated on the axial forces. Its envelopes, reactions\n"
        "and displacements below come from these solutions, not from superposition; the load\n"
        "case sections above are first-order. Their equilibrium line checks forces only: the\n"
        "moments balance about the deflected shape, which the check does not rebuild.\n";
    out += fmt::format("Tolerance {:g} (relative change per iteration), at most {} iterations.\n",
                       o.tolerance, o.max_iterations);
    if (o.notional_factor > 0.0) {
        out += fmt::format(
            "Notional loads: {:g} x the vertical load at each node, toward {} "
            "(AISC 360-16 C2.2b).\n",
            o.notional_factor, o.notional_direction < 0.0 ? "-x" : "+x");
    }
    if (o.flexural_factor != 1.0 || o.axial_factor != 1.0) {
        out += fmt::format("Stiffness: {:g} EI and {:g} EA in every member (AISC 360-16 C2.3).\n",
                           o.flexural_factor, o.axial_factor);
    }
    out +=
        "Critical factor: the factor on the combination's axial forces at which the frame\n"
        "buckles elastically (the stiffness with stability functions becomes singular);\n"
        "amplification 1 / (1 - 1 / critical factor).\n\n";
}

std::string critical_text(double factor) {
    return std::isfinite(factor) ? fmt::format("{:.3f}", factor) : std::string("none");
}

}  // namespace

void write_second_order(std::string& out, const Model& model, const CombinationList& list,
                        const std::vector<std::vector<SecondOrderOutcome>>& outcomes) {
    if (!model.combine || !model.combine->second_order)
        return;
    for (std::size_t s = 0; s < list.sets.size() && s < outcomes.size(); ++s) {
        const CombinationList::SetRange& range = list.sets[s];
        out += fmt::format("== Second-order analysis of {} ==\n\n", range.name);
        write_intro(out, *model.combine);
        std::size_t width = std::string_view("combination").size();
        for (std::size_t k = 0; k < range.count; ++k)
            width = std::max(width, list.combinations[range.first + k].name.size());
        Table t(out);
        t.name_column("combination", width)
            .text_column("iterations")
            .text_column("converged")
            .text_column("critical factor")
            .text_column("amplification")
            .number_column("notional", model.units.force)
            .end_row();
        for (std::size_t k = 0; k < range.count && k < outcomes[s].size(); ++k) {
            const SecondOrderOutcome& o = outcomes[s][k];
            double notional = 0.0;
            for (double n : o.notional)
                notional += n;
            t.name(list.combinations[range.first + k].name)
                .text(fmt::format("{}", o.iterations))
                .text(o.converged ? "yes" : (o.exceeded ? "beyond" : "no"))
                .text(critical_text(o.critical_factor))
                .text(o.converged ? fmt::format("{:.3f}", o.amplification) : std::string("-"))
                .number(notional, model.units.force)
                .end_row();
        }
        out += "\n";
    }
}

}  // namespace firn
