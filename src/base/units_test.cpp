// Tests of the unit table and display units. Conversion factors follow the
// exact definitions of the international foot and pound:
// 1 ft = 0.3048 m, 1 lb = 0.45359237 kg x 9.80665 m/s^2 = 4.4482216152605 N.
#include <catch2/catch.hpp>

#include "base/units.hpp"

using namespace firn;

TEST_CASE("unit sizes are exact conversions") {
    CHECK(find_unit("ft")->to_si == 0.3048);
    CHECK(find_unit("in")->to_si == 0.0254);
    CHECK(find_unit("lb")->to_si == Approx(4.4482216152605).epsilon(1e-15));
    CHECK(find_unit("kip")->to_si == Approx(4448.2216152605).epsilon(1e-15));
    CHECK(find_unit("psf")->to_si == Approx(47.88025898033584).epsilon(1e-14));  // lb/ft^2
    CHECK(find_unit("psi")->to_si == Approx(6894.757293168361).epsilon(1e-14));  // lb/in^2
    CHECK(find_unit("ksi")->to_si == Approx(6894757.293168361).epsilon(1e-14));
    CHECK(find_unit("pcf")->to_si == Approx(157.08746384624618).epsilon(1e-14));  // lb/ft^3
    CHECK(find_unit("klf")->to_si == Approx(14593.902937206).epsilon(1e-12));     // kip/ft
    CHECK(find_unit("GPa")->to_si == 1e9);
    CHECK(find_unit("kips") == nullptr);
}

TEST_CASE("dimensions multiply and describe themselves") {
    CHECK(dim::force * dim::length == dim::moment);
    CHECK(dim::force / power(dim::length, 2) == dim::pressure);
    CHECK(describe(dim::force_per_length) == "a force per length");
    CHECK(describe(Dimension{2, -1}) == "a quantity of dimension force^2/length");
}

TEST_CASE("display units follow from a force and a length unit") {
    DisplayUnits u;
    REQUIRE(make_display_units("kip", "ft", "", u));
    CHECK(u.moment.name == "kip*ft");
    CHECK(u.moment.to_si == Approx(4448.2216152605 * 0.3048));
    CHECK(u.displacement.name == "in");
    CHECK(u.area.name == "in^2");
    CHECK(u.inertia.to_si == Approx(0.0254 * 0.0254 * 0.0254 * 0.0254));
    REQUIRE(make_display_units("kN", "m", "", u));
    CHECK(u.displacement.name == "mm");
    CHECK(u.modulus.name == "MPa");
    CHECK(u.unit_weight.to_si == Approx(1000.0));
    CHECK_FALSE(make_display_units("psf", "ft", "", u));
}

TEST_CASE("a written unit is read with the factors of the table") {
    double to_si = 0.0;
    Dimension d;
    // ksi is kip/in^2 and pcf is lb/ft^3 by their definitions (tests/SOURCES.md).
    REQUIRE(parse_unit("kip/in^2", to_si, d));
    CHECK(to_si == Approx(find_unit("ksi")->to_si).epsilon(1e-15));
    CHECK(d == dim::pressure);
    REQUIRE(parse_unit("lb/ft^3", to_si, d));
    CHECK(to_si == Approx(find_unit("pcf")->to_si).epsilon(1e-15));
    CHECK(d == dim::unit_weight);
    CHECK_FALSE(parse_unit("ft^5", to_si, d));
    CHECK_FALSE(parse_unit("kip ft", to_si, d));
    CHECK_FALSE(parse_unit("furlong", to_si, d));
}
