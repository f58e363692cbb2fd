// units: the unit table (exact conversion factors) and display unit choices.
#include "base/units.hpp"

#include <fmt/format.h>
#include <array>
#include <charconv>
#include <cmath>
#include <numbers>

namespace firn {

Dimension operator*(Dimension a, Dimension b) {
    return Dimension{static_cast<std::int8_t>(a.force + b.force),
                     static_cast<std::int8_t>(a.length + b.length)};
}

Dimension operator/(Dimension a, Dimension b) {
    return Dimension{static_cast<std::int8_t>(a.force - b.force),
                     static_cast<std::int8_t>(a.length - b.length)};
}

Dimension power(Dimension a, int exponent) {
    return Dimension{static_cast<std::int8_t>(a.force * exponent),
                     static_cast<std::int8_t>(a.length * exponent)};
}

std::string describe(Dimension d) {
    struct Named {
        Dimension dimension;
        const char* phrase;
    };
    static constexpr std::array<Named, 9> names{{
        {dim::number, "a plain number"},
        {dim::length, "a length"},
        {dim::force, "a force"},
        {dim::moment, "a moment"},
        {dim::force_per_length, "a force per length"},
        {dim::pressure, "a pressure"},
        {dim::area, "an area"},
        {dim::inertia, "a second moment of area"},
        {dim::unit_weight, "a unit weight"},
    }};
    for (const Named& n : names) {
        if (n.dimension == d)
            return n.phrase;
    }
    // "force^2*length" for positive exponents, the same for negative ones below the bar.
    auto side = [](int force, int length) {
        auto part = [](const char* base, int e) {
            return e <= 0   ? std::string()
                   : e == 1 ? std::string(base)
                            : fmt::format("{}^{}", base, e);
        };
        return fmt::format("{}{}{}", part("force", force), force > 0 && length > 0 ? "*" : "",
                           part("length", length));
    };
    std::string top = side(d.force, d.length);
    std::string bottom = side(-d.force, -d.length);
    return fmt::format("a quantity of dimension {}{}{}", top.empty() ? std::string("1") : top,
                       bottom.empty() ? "" : "/", bottom);
}

namespace {

// Exact definitions: 1 ft = 0.3048 m and 1 lb = 0.45359237 kg x 9.80665 m/s^2
// (the international foot and pound, and standard gravity).
constexpr double kFoot = 0.3048;
constexpr double kInch = 0.0254;
constexpr double kPound = 0.45359237 * 9.80665;
constexpr double kKip = 1000.0 * kPound;

// ORDER UNITS: editor-support highlighters take their unit lists from unit_names().
constexpr std::array<Unit, 25> kUnits{{
    {"m", 1.0, dim::length},
    {"mm", 1e-3, dim::length},
    {"cm", 1e-2, dim::length},
    {"ft", kFoot, dim::length},
    {"in", kInch, dim::length},
    {"N", 1.0, dim::force},
    {"kN", 1e3, dim::force},
    {"MN", 1e6, dim::force},
    {"lb", kPound, dim::force},
    {"lbf", kPound, dim::force},
    {"kip", kKip, dim::force},
    {"Pa", 1.0, dim::pressure},
    {"kPa", 1e3, dim::pressure},
    {"MPa", 1e6, dim::pressure},
    {"GPa", 1e9, dim::pressure},
    {"psf", kPound / (kFoot * kFoot), dim::pressure},
    {"ksf", kKip / (kFoot * kFoot), dim::pressure},
    {"psi", kPound / (kInch * kInch), dim::pressure},
    {"ksi", kKip / (kInch * kInch), dim::pressure},
    {"pcf", kPound / (kFoot * kFoot * kFoot), dim::unit_weight},
    {"kcf", kKip / (kFoot * kFoot * kFoot), dim::unit_weight},
    {"plf", kPound / kFoot, dim::force_per_length},
    {"klf", kKip / kFoot, dim::force_per_length},
    {"rad", 1.0, dim::number},
    {"deg", std::numbers::pi / 180.0, dim::number},
}};

/// One `NAME` or `NAME^N` factor of a written unit.
bool unit_factor(std::string_view text, double& to_si, Dimension& dimension) {
    int exponent = 1;
    std::size_t caret = text.find('^');
    if (caret != std::string_view::npos) {
        std::string_view digits = text.substr(caret + 1);
        auto [ptr, ec] = std::from_chars(digits.data(), digits.data() + digits.size(), exponent);
        if (ec != std::errc() || ptr != digits.data() + digits.size() || exponent < 1 ||
            exponent > 4)
            return false;
        text = text.substr(0, caret);
    }
    const Unit* unit = find_unit(text);
    if (unit == nullptr)
        return false;
    to_si = std::pow(unit->to_si, exponent);
    dimension = power(unit->dimension, exponent);
    return true;
}

/// The size of a unit of the table (the caller knows it is there).
double unit_size(std::string_view name) {
    return find_unit(name)->to_si;
}

int decimals_for_moment(std::string_view force, std::string_view length) {
    bool big_force = force == "kip" || force == "kN";
    bool big_length = length == "ft" || length == "m";
    if (big_force)
        return big_length ? 3 : 1;
    return big_length ? 1 : 0;
}

int decimals_for_displacement(std::string_view name) {
    if (name == "in")
        return 4;
    if (name == "mm")
        return 2;
    if (name == "cm")
        return 3;
    return 5;  // ft, m
}

}  // namespace

bool make_display_units(std::string_view force, std::string_view length,
                        std::string_view displacement, DisplayUnits& out) {
    int force_decimals =
        force == "kip" || force == "kN" ? 3 : (force == "lb" || force == "N" ? 1 : -1);
    int length_decimals =
        length == "mm" ? 1 : (length == "ft" || length == "in" || length == "m" ? 3 : -1);
    if (force_decimals < 0 || length_decimals < 0)
        return false;
    bool customary = length == "ft" || length == "in";
    if (displacement.empty())
        displacement = customary ? "in" : "mm";
    const Unit* d = find_unit(displacement);
    if (d == nullptr || !(d->dimension == dim::length))
        return false;
    std::string f(force), l(length);
    double F = unit_size(f), L = unit_size(l);
    const char* small = customary ? "in" : "mm";  // section and spring units
    double S = unit_size(small);
    out.force = DisplayUnit{f, F, force_decimals};
    out.length = DisplayUnit{l, L, length_decimals};
    out.moment = DisplayUnit{fmt::format("{}*{}", f, l), F * L, decimals_for_moment(f, l)};
    out.displacement =
        DisplayUnit{std::string(displacement), d->to_si, decimals_for_displacement(displacement)};
    out.rotation = DisplayUnit{"rad", 1.0, 6};
    out.force_per_length = DisplayUnit{fmt::format("{}/{}", f, l), F / L, force_decimals + 1};
    out.area = DisplayUnit{fmt::format("{}^2", small), S * S, customary ? 3 : 0};
    out.inertia = DisplayUnit{fmt::format("{}^4", small), S * S * S * S, customary ? 2 : 0};
    out.modulus = customary ? DisplayUnit{"ksi", unit_size("ksi"), 0}
                            : DisplayUnit{"MPa", unit_size("MPa"), 0};
    out.unit_weight =
        customary ? DisplayUnit{"pcf", unit_size("pcf"), 1} : DisplayUnit{"kN/m^3", 1e3, 2};
    out.stiffness = DisplayUnit{fmt::format("{}/{}", f, small), F / S, 3};
    out.rotational_stiffness = DisplayUnit{fmt::format("{}*{}/rad", f, l), F * L, 1};
    out.pressure = customary ? DisplayUnit{"psf", unit_size("psf"), 1}
                             : DisplayUnit{"kPa", unit_size("kPa"), 3};
    return true;
}

const Unit* find_unit(std::string_view name) {
    for (const Unit& u : kUnits) {
        if (u.name == name)
            return &u;
    }
    return nullptr;
}

bool parse_unit(std::string_view text, double& to_si, Dimension& dimension) {
    to_si = 1.0;
    dimension = dim::number;
    if (text.empty())
        return true;
    bool divide = false;
    while (true) {
        std::size_t op = text.find_first_of("*/");
        double size = 0.0;
        Dimension d;
        if (!unit_factor(text.substr(0, op), size, d))
            return false;
        to_si = divide ? to_si / size : to_si * size;
        dimension = divide ? dimension / d : dimension * d;
        if (op == std::string_view::npos)
            return true;
        divide = text[op] == '/';
        text = text.substr(op + 1);
    }
}

std::vector<std::string> unit_names() {
    std::vector<std::string> names;
    names.reserve(std::size(kUnits));
    for (const Unit& u : kUnits)
        names.emplace_back(u.name);
    return names;
}

}  // namespace firn
