// expectation_text: an expectation's bounds, findings and margins in the model's
// report units, for the report and for `firn check`.
#include <fmt/format.h>
#include <cmath>

#include "base/number_format.hpp"
#include "report/report.hpp"

namespace firn {

namespace {
using Q = Expectation::Quantity;
using R = Expectation::Relation;
}  // namespace

std::string show_bound(const Model& model, const Expectation& x) {
    // As written: a bound rounded to the report's decimals could read "within 0.0 psf".
    if (!x.bound_written.empty())
        return x.bound_written;
    auto show = [&](double v) { return show_expected_value(model, x, v); };
    static constexpr const char* kRelations[] = {"<=", ">=", "="};
    std::string text = x.relation == R::between
                           ? fmt::format("between {} and {}", show(x.low), show(x.high))
                           : fmt::format("{} {}", kRelations[static_cast<int>(x.relation)],
                                         show(x.relation == R::at_most ? x.high : x.low));
    if (!x.tolerance_written)
        return text;
    if (x.tolerance_relative) {
        text += fmt::format(" within {:g} %", x.tolerance * 100.0);
    } else {
        text += " within " + show(x.tolerance);
    }
    return text;
}

std::string describe_finding(const Model& model, const Expectation& x, const Finding& f) {
    std::string text = fmt::format("{} {}", f.place.empty() ? "the value is" : f.place + " has",
                                   show_expected_value(model, x, f.value));
    if (f.on_member)
        text += fmt::format(" at {:.{}f} {}", model.units.length.from_si(f.position),
                            model.units.length.decimals, model.units.length.name);
    if (!f.governing.empty())
        text += fmt::format(" under {}", f.governing);
    return text;
}

std::string describe_margin(const Model& model, const Expectation& x, const Finding& f) {
    std::string amount = show_expected_value(model, x, std::abs(f.margin));
    std::string percent =
        f.bound != 0.0 ? fmt::format(" ({:.1f} %)", 100.0 * std::abs(f.margin) / std::abs(f.bound))
                       : std::string();
    return f.margin < 0.0 ? fmt::format("{} beyond the bound{}", amount, percent)
                          : fmt::format("margin {}{}", amount, percent);
}

}  // namespace firn
