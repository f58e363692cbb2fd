// snow: the formulas of the snow provisions that the snow stage's files share
// and the tests check directly. Private to the derive stage.
#pragma once

#include "base/diag.hpp"
#include "ir/model.hpp"

namespace firn {

/// Cs of the standard's Fig. 7.4-1 for a roof sloping `slope` (rad) on the curve
/// that the thermal factor `Ct` and the surface select (`slippery`: an
/// unobstructed slippery surface that qualifies for that curve).
double roof_slope_factor(const SnowTables& tables, double Ct, bool slippery, double slope);

/// Snow density for drifts, the standard's Eq. 7.7-1 (N/m^3), for ground snow load `pg` (Pa).
double snow_density(const SnowTables& tables, double pg);

/// Drift height of the standard's Fig. 7.6-1 (m) for an upwind length `lu` (m) and
/// ground snow load `pg` (Pa), evaluated in the formula's own units (ft, psf)
/// with exact conversions; never negative.
/// An edition with the winter wind form (tables.drift_winter_wind) takes the
/// site's winter wind parameter `W2`, a fraction.
double drift_height(const SnowTables& tables, double pg, double lu, double W2 = 0.0);
/// The drift height hd = c sqrt(pg^a lu^b W2^e / gamma) in ft, psf and pcf (the
/// library gives c, a, b, e), with lu at least the library's least length (m).
double winter_wind_drift_height(const SnowTables& tables, double pg, double lu, double W2);

}  // namespace firn
