// trace_text: a step of the snow or arrangement trace in words, each of its SI
// values written in the model's display units. The derive stage records the
// steps as data; only here do they become text.
#include <fmt/format.h>

#include "report/report.hpp"

namespace firn {
namespace {

/// The display unit of a quantity the trace shows.
const DisplayUnit& unit_for(const DisplayUnits& u, Dimension d) {
    if (d == dim::pressure)
        return u.pressure;
    if (d == dim::force_per_length)
        return u.force_per_length;
    if (d == dim::unit_weight)
        return u.unit_weight;
    return u.length;
}

std::string in_unit(double si, const DisplayUnit& unit) {
    return fmt::format("{:.{}f} {}", unit.from_si(si), unit.decimals, unit.name);
}

std::string value_text(const TraceValue& v, const DisplayUnits& u) {
    using K = TraceValue::Kind;
    switch (v.kind) {
        case K::quantity:
            return in_unit(v.value, unit_for(u, v.dimension));
        case K::angle:
            return fmt::format("{:.{}f} deg", v.value / find_unit("deg")->to_si, v.decimals);
        case K::number:
            return v.decimals < 0 ? fmt::format("{:g}", v.value)
                                  : fmt::format("{:.{}f}", v.value, v.decimals);
        case K::text:
            return v.text;
        case K::length_unless:
            return u.length.name == v.text ? std::string() : " = " + in_unit(v.value, u.length);
    }
    return {};
}

}  // namespace

std::string trace_text(const TraceStep& step, const DisplayUnits& units) {
    std::string out;
    std::size_t from = 0;
    for (const TraceValue& v : step.values) {
        std::size_t at = step.formula.find("{}", from);
        if (at == std::string::npos)
            break;
        out.append(step.formula, from, at - from);
        out += value_text(v, units);
        from = at + 2;
    }
    out.append(step.formula, from);
    return out;
}

std::string trace_clause(const TraceStep& step) {
    if (step.provenance == Provenance::from_memory)
        return step.clause + " *";
    return step.clause;
}

}  // namespace firn
