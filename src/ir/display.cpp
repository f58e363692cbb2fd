// display: an expectation's values in the model's report units.
#include "ir/display.hpp"

#include "base/number_format.hpp"

namespace firn {
namespace {
using Q = Expectation::Quantity;
}  // namespace

const DisplayUnit* expectation_unit(const Model& model, const Expectation& x) {
    const DisplayUnits& u = model.units;
    switch (x.quantity) {
        case Q::moment:
            return &u.moment;
        case Q::shear:
        case Q::axial:
            return &u.force;
        case Q::reaction:
            return x.component == 2 ? &u.moment : &u.force;
        case Q::deflection:
        case Q::displacement:
            return &u.displacement;
        case Q::rotation:
            return &u.rotation;
        case Q::snow:
            break;
    }
    if (x.dimension == dim::pressure)
        return &u.pressure;
    if (x.dimension == dim::length)
        return &u.length;
    return nullptr;
}

std::string show_expected_value(const Model& model, const Expectation& x, double value) {
    std::string out;
    const DisplayUnit* unit = expectation_unit(model, x);
    if (unit == nullptr) {
        append_fixed(out, value, 3);
        return out;
    }
    append_fixed(out, unit->from_si(value), unit->decimals);
    return out + " " + unit->name;
}

}  // namespace firn
