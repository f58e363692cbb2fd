// drift_wind: the drift height of an edition whose formula takes the site's
// winter wind parameter W2 (the library's switch drift.winter_wind), beside the
// older form of snow.cpp; the library gives the constant and the exponents.
// hd = c sqrt(pg^a lu^b W2^e / gamma), evaluated in its own units (ft, psf,
// pcf): the constant holds only in those units.
#include <cmath>

#include "derive/snow.hpp"
#include "derive/snow_internal.hpp"

namespace firn {

namespace {
const double kPoundPerCubicFoot = find_unit("pcf")->to_si;
}

double winter_wind_drift_height(const SnowTables& t, double pg, double lu, double W2) {
    using namespace snow_detail;
    double lu_ft = std::max(lu, t.drift_min_lu) / kFoot;
    double pg_psf = pg / kPoundPerSquareFoot;
    double gamma_pcf = snow_density(t, pg) / kPoundPerCubicFoot;
    if (!(W2 > 0.0) || !(gamma_pcf > 0.0))
        return 0.0;
    double inside = std::pow(pg_psf, t.drift_pg_exponent) * std::pow(lu_ft, t.drift_lu_exponent) *
                    std::pow(W2, t.drift_W2_exponent) / gamma_pcf;
    return t.drift_coefficient * std::sqrt(inside) * kFoot;
}

namespace snow_detail {

void SnowDeriver::trace_winter_wind_drift(double lu, double hd, const char* lu_is) {
    double used = std::max(lu, t_.drift_min_lu);
    double gamma = snow_density(t_, site_.pg);
    line(
        "hd = {} sqrt(pg^{} lu^{} W2^{} / gamma) (ft, psf, pcf) with lu = {} = {} (at least {} "
        "ft): {} x sqrt({}^{} x {}^{} x {}^{} / {}) = {} ft{}",
        {number(t_.drift_coefficient), number(t_.drift_pg_exponent), number(t_.drift_lu_exponent),
         number(t_.drift_W2_exponent), text(lu_is), length(lu), number(t_.drift_min_lu / kFoot),
         number(t_.drift_coefficient), number(site_.pg / kPoundPerSquareFoot, 3),
         number(t_.drift_pg_exponent), number(used / kFoot, 3), number(t_.drift_lu_exponent),
         number(site_.W2), number(t_.drift_W2_exponent), number(gamma / kPoundPerCubicFoot, 3),
         number(hd / kFoot, 3),
         TraceValue{TraceValue::Kind::length_unless, hd, dim::length, -1, "ft"}},
        t_.clause.drift_height);
}

double SnowDeriver::drift_height_for(double lu, const char* lu_is, const std::string& what) {
    if (!t_.drift_winter_wind) {
        double hd = drift_height(t_, site_.pg, lu);
        trace_drift(lu, hd, lu_is);
        return hd;
    }
    if (!(site_.W2 > 0.0)) {
        if (!reported_missing_W2_) {
            d_.error(site_.where,
                     fmt::format("the {} needs the drift height of {}, which takes "
                                 "the site's winter wind parameter: write W2 = 0.45 (its value "
                                 "from the hazard data, a fraction; there is no default) in snow "
                                 "data {}",
                                 what, t_.clause.drift_height, site_.name));
            reported_missing_W2_ = true;
        }
        return 0.0;
    }
    double hd = winter_wind_drift_height(t_, site_.pg, lu, site_.W2);
    trace_winter_wind_drift(lu, hd, lu_is);
    return hd;
}

}  // namespace snow_detail
}  // namespace firn
