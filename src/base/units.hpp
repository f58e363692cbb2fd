// units: physical dimensions, the unit table and display units.
// Everything after `resolve` works in SI (N, m, rad); only `resolve` reads
// unit names and only `report` writes them.
#pragma once

#include <cstdint>
#include <string>
#include <string_view>
#include <vector>

namespace firn {

/// Exponents of force and length: the two base dimensions of statics.
/// Angles are dimensionless.
struct Dimension {
    std::int8_t force = 0;
    std::int8_t length = 0;
    friend bool operator==(const Dimension&, const Dimension&) = default;
};

namespace dim {
inline constexpr Dimension number{0, 0};
inline constexpr Dimension length{0, 1};
inline constexpr Dimension force{1, 0};
inline constexpr Dimension moment{1, 1};
inline constexpr Dimension force_per_length{1, -1};
inline constexpr Dimension pressure{1, -2};  ///< also modulus and stress
inline constexpr Dimension area{0, 2};
inline constexpr Dimension inertia{0, 4};       ///< second moment of area
inline constexpr Dimension unit_weight{1, -3};  ///< weight per volume ("density")
}  // namespace dim

Dimension operator*(Dimension a, Dimension b);
Dimension operator/(Dimension a, Dimension b);
Dimension power(Dimension a, int exponent);

/// "a length", "a force per length", ... or a formula such as "force^2/length".
std::string describe(Dimension d);

/// A unit the language knows: its spelling, its size in SI and its dimension.
struct Unit {
    std::string_view name;
    double to_si;
    Dimension dimension;
};

/// The unit spelled `name`, or nullptr.
const Unit* find_unit(std::string_view name);
/// Every unit name, for "did you mean" and for the editor highlighters.
std::vector<std::string> unit_names();
/// A unit as a report writes it (`kip*ft`, `kN/m^3`, `in^4`): factors of the table
/// joined by '*' or '/', each with an optional power `^1` to `^4`, no spaces; "" is a
/// plain number. Sets its size in SI and its dimension; false if a part is not a
/// unit of the table. (Model text is read by the grammar, which knows more forms.)
bool parse_unit(std::string_view text, double& to_si, Dimension& dimension);

/// A unit chosen for display: a spelling, its size in SI, and the fixed number of
/// decimals every value in it is printed with.
struct DisplayUnit {
    std::string name;
    double to_si = 1.0;
    int decimals = 3;
    double from_si(double v) const { return v / to_si; }
};

/// The display units of a report, one per kind of quantity it prints.
struct DisplayUnits {
    DisplayUnit force, length, moment, displacement, rotation, force_per_length, area, inertia,
        modulus, unit_weight, stiffness, rotational_stiffness;
    DisplayUnit pressure;  ///< snow loads: psf, or kPa with SI lengths
};

/// Display units that follow from a force and a length unit, as an engineer would
/// expect them (ft gives displacements in in and sections in in^2, in^4, ksi; m gives
/// mm, mm^2, mm^4, MPa). `displacement` may be empty to take that default.
/// Returns false if a name is not a force or length unit this table supports.
bool make_display_units(std::string_view force, std::string_view length,
                        std::string_view displacement, DisplayUnits& out);

}  // namespace firn
