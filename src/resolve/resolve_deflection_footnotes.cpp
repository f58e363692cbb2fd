// resolve_deflection_footnotes: the footnotes of a deflection table that scale
// the loads of its S or W column (`let TABLE.footnote.snow_factor = 0.7`, and
// `wind_factor`), read for each row of that table and named in the row's
// source, so the report says which snow and wind loads a check took. A model
// changes one with `amend`, which the report lists with its reason.
#include <fmt/format.h>

#include "resolve/resolve_internal.hpp"

namespace firn::resolve_detail {
namespace {

/// A footnote factor of the table, if the module gives it; false after an error.
bool footnote(Resolver& r, const DeflectionLimits& limits, const std::string& name, double& out) {
    if (!r.constants.has(name))
        return true;
    auto q = r.constants.lookup(name, r.diagnostics);
    if (!q)
        return false;
    if (q->dimension == dim::number && q->value > 0.0) {
        out = q->value;
        return true;
    }
    r.diagnostics.error(limits.where,
                        fmt::format("'{}' should be a plain number greater than zero, a factor "
                                    "on the loads of the S or W column",
                                    name));
    return false;
}

}  // namespace

void read_deflection_footnotes(Resolver& r) {
    for (DeflectionLimits& limits : r.model.deflection_limits) {
        std::string module = limits.row.substr(0, limits.row.find('.'));
        std::string snow = module + ".footnote.snow_factor";
        std::string wind = module + ".footnote.wind_factor";
        if (!r.constants.has(snow) && !r.constants.has(wind))
            continue;
        if (!footnote(r, limits, snow, limits.snow_factor) ||
            !footnote(r, limits, wind, limits.wind_factor))
            continue;
        std::string mark = r.constants.text(module + ".footnote.from_memory").value_or("");
        limits.source += fmt::format(
            "; S or W column: each snow case x {:g}, each wind case x "
            "{:g}, by the table's footnotes{}",
            limits.snow_factor, limits.wind_factor, mark.empty() ? "" : " (" + mark + ")");
    }
}

}  // namespace firn::resolve_detail
