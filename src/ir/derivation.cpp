// derivation: the named snow values, read from the steps of the trace that name them.
#include "ir/derivation.hpp"

namespace firn {

std::vector<SnowValue> snow_values(const Derivation& derivation) {
    std::vector<SnowValue> out;
    for (const TraceStep& step : derivation.snow_trace) {
        for (const TraceStep::Name& n : step.names) {
            const TraceValue& v = step.values[n.value];
            out.push_back(SnowValue{n.name, v.value, v.dimension});
        }
    }
    return out;
}

}  // namespace firn
