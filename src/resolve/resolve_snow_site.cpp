// resolve_snow_site: the snow data's settings that depend on the kind of
// formula the standard's library module chooses (its switches, such as
// `NAME.pg.per_risk_category = 1`): the ground snow load given once or per risk
// category, an importance factor the edition may not have, a thermal factor
// read by the model from a table the module does not hold, the slope factor's
// curve, and the winter wind parameter of the drift height. No edition is named
// here: every word a message gives comes from the module.
#include <fmt/format.h>
#include <array>

#include "resolve/resolve_snow_library.hpp"

namespace firn::resolve_detail {
namespace {

inline constexpr Expected kPressureExample{dim::pressure, "a pressure", "40 psf"};
const std::array<const char*, 4> kRiskCategories{"I", "II", "III", "IV"};
const std::array<const char*, 3> kCurves{"warm", "cold_ventilated", "cold"};

std::string pg_key(const std::string& risk) {
    return "pg_" + risk;
}

/// A ground snow load setting that is a pressure and not negative; false after an error.
bool read_pg(Resolver& r, Settings& s, const std::string& key, double& pg) {
    if (!s.value(key, kPressureExample, pg))
        return false;
    if (pg >= 0.0)
        return true;
    r.diagnostics.error(s.find(key)->value.where, "the ground snow load pg cannot be negative");
    return false;
}

/// The one ground snow load of an edition that gives a single value.
bool single_pg(Resolver& r, Settings& s, const SnowTables& t, SourceRange owner, double& pg,
               SourceRange& where) {
    for (const char* risk : kRiskCategories) {
        if (const syntax::Setting* per = s.find(pg_key(risk))) {
            r.diagnostics.error(per->key.where,
                                fmt::format("{} gives one ground snow load for every risk "
                                            "category ({}): write pg = ..., not {}",
                                            t.edition, t.clause.pg, per->key.text));
            return false;
        }
    }
    const syntax::Setting* given = s.find("pg");
    if (given == nullptr) {
        r.diagnostics.error(owner, "the snow data need the ground snow load, as in: pg = 40 psf");
        return false;
    }
    where = given->value.where;
    return read_pg(r, s, "pg", pg);
}

/// The ground snow load of the model's risk category, among the values the
/// site's hazard data give for each category.
bool per_category_pg(Resolver& r, Settings& s, const SnowTables& t, const std::string& risk,
                     SourceRange owner, double& pg, SourceRange& where) {
    if (const syntax::Setting* one = s.find("pg")) {
        r.diagnostics.error(one->key.where,
                            fmt::format("{} gives the ground snow load per risk category ({}): "
                                        "write the site's value for the model's risk category, as "
                                        "in: pg_{} = 40 psf",
                                        t.edition, t.clause.pg, risk.empty() ? "II" : risk));
        return false;
    }
    const syntax::Setting* category = s.find("risk");
    if (category == nullptr) {
        r.diagnostics.error(owner, fmt::format("the snow data need 'risk' (I, II, III or IV): {} "
                                               "takes the ground snow load of the risk category",
                                               t.edition));
        return false;
    }
    if (risk.empty())
        return false;  // a wrong word: reported already
    const syntax::Setting* given = s.find(pg_key(risk));
    if (given == nullptr) {
        r.diagnostics.error(category->value.where,
                            fmt::format("risk category {} has no ground snow load: write {} = ... "
                                        "psf, the site's {} value for risk category {} ({})",
                                        risk, pg_key(risk), t.edition, risk, t.clause.pg));
        return false;
    }
    where = given->value.where;
    bool ok = true;
    for (const char* other : kRiskCategories) {
        double unused = 0.0;
        if (s.find(pg_key(other)) != nullptr && other != risk)
            ok = read_pg(r, s, pg_key(other), unused) && ok;
    }
    return read_pg(r, s, pg_key(risk), pg) && ok;
}

/// The thermal factor of a condition whose table the module does not hold: the
/// model reads it (`Ct = 1.17 because "..."`), within the module's range.
bool thermal_factor_read_by_model(Resolver& r, Settings& s, Library& lib, SnowSite& site) {
    std::string base = fmt::format("Ct.{}", site.thermal);
    std::string table = lib.text(base + ".given_from");
    double lo = lib.need(base + ".min", dim::number), hi = lib.need(base + ".max", dim::number);
    const syntax::Setting* given = s.find("Ct");
    if (given == nullptr || !given->reason) {
        r.diagnostics.error(
            given == nullptr ? site.where : given->key.where,
            fmt::format("{} {} gives Ct for thermal condition {} from the roof's thermal "
                        "resistance and pg; read it there and write it with the row used, as in: "
                        "Ct = {:g} because \"{}, R-30 roof, pg 30 psf\"",
                        site.tables.edition, table, site.thermal, hi, table));
        return false;
    }
    double value = 0.0;
    if (!s.value("Ct", Expected{dim::number, "a plain number", "1.1"}, value, true))
        return false;
    if (value < lo - 1e-12 || value > hi + 1e-12) {
        r.diagnostics.error(given->value.where,
                            fmt::format("{} {} gives Ct between {:g} and {:g}; found {:g}",
                                        site.tables.edition, table, lo, hi, value));
        return false;
    }
    site.Ct = SnowFactor{value, table, *given->reason, true};
    return true;
}

bool importance_absent(Resolver& r, Settings& s, const SnowSite& site) {
    const syntax::Setting* is = s.find("Is");
    if (is == nullptr || site.tables.importance_applies)
        return true;
    r.diagnostics.error(
        is->key.where,
        fmt::format("{} has no snow importance factor (pf by {} has no Is): risk enters through "
                    "the ground snow load of the risk category; remove Is and give pg_{} for "
                    "risk = {}",
                    site.tables.edition, site.tables.clause.pf,
                    site.risk.empty() ? "II" : site.risk, site.risk.empty() ? "II" : site.risk));
    return false;
}

/// W2, a fraction of winter time, where the edition's drift height uses it.
bool winter_wind(Resolver& r, Settings& s, SnowSite& site) {
    const syntax::Setting* given = s.find("W2");
    if (given == nullptr)
        return true;
    if (!site.tables.drift_winter_wind) {
        r.diagnostics.error(given->key.where,
                            fmt::format("{}'s drift height ({}) does not use the winter wind "
                                        "parameter; remove W2",
                                        site.tables.edition, site.tables.clause.drift_height));
        return false;
    }
    if (!s.value("W2", Expected{dim::number, "a plain number", "0.45"}, site.W2))
        return false;
    if (site.W2 > 0.0 && site.W2 < 1.0)
        return true;
    r.diagnostics.error(given->value.where,
                        fmt::format("W2 is the share of winter time with wind above 10 mph, a "
                                    "fraction between 0 and 1 (write 0.45 for 45 %); found {:g}",
                                    site.W2));
    site.W2 = 0.0;
    return false;
}

}  // namespace

std::vector<std::string> edition_setting_keys() {
    std::vector<std::string> keys;
    keys.reserve(std::size(kRiskCategories) + 1);
    for (const char* risk : kRiskCategories)
        keys.push_back(pg_key(risk));
    keys.emplace_back("W2");
    return keys;
}

bool ground_snow_load(Resolver& r, Settings& s, const SnowTables& t, const std::string& risk,
                      SourceRange owner, double& pg, SourceRange& where) {
    return t.pg_per_risk_category ? per_category_pg(r, s, t, risk, owner, pg, where)
                                  : single_pg(r, s, t, owner, pg, where);
}

void read_edition_switches(Library& lib, SnowTables& t) {
    t.pg_per_risk_category = lib.flag("pg.per_risk_category");
    t.importance_applies = lib.flag("Is.applies");
    t.pm_cap_per_risk_category = lib.flag("pm.cap_per_risk_category");
    t.Cs_curve_by_thermal = lib.flag("Cs.curve_by_thermal");
    t.drift_winter_wind = lib.flag("drift.winter_wind");
    t.drift_separate_windward = lib.flag("drift.separate_windward");
    if (t.drift_winter_wind) {
        t.drift_pg_exponent = lib.need("drift.pg_exponent", dim::number);
        t.drift_lu_exponent = lib.need("drift.lu_exponent", dim::number);
        t.drift_W2_exponent = lib.need("drift.W2_exponent", dim::number);
    }
}

void read_edition_clauses(Library& lib, SnowTables& t) {
    auto cite = [&](const char* name) {
        return fmt::format("{} {}", t.edition, lib.text(fmt::format("clause.{}", name)));
    };
    if (t.pm_cap_per_risk_category)
        t.clause.pm_cap = cite("pm_cap");
    if (t.Cs_curve_by_thermal)
        t.clause.Cs_curve = cite("Cs_curve");
}

bool thermal_factor_from_model(Library& lib, const SnowSite& site) {
    return !site.thermal.empty() && lib.has_text(fmt::format("Ct.{}.given_from", site.thermal));
}

bool resolve_edition_site(Resolver& r, Settings& s, Library& lib, SnowSite& site) {
    bool ok = importance_absent(r, s, site) & winter_wind(r, s, site);
    if (thermal_factor_from_model(lib, site))
        ok = thermal_factor_read_by_model(r, s, lib, site) && ok;
    if (site.tables.pm_cap_per_risk_category) {
        if (site.risk.empty()) {
            r.diagnostics.error(site.where,
                                fmt::format("the snow data need 'risk' (I, II, III or IV): {} "
                                            "caps the minimum load by risk category ({})",
                                            site.tables.edition, site.tables.clause.pm_cap));
            return false;
        }
        site.tables.pm_pg_limit = lib.need(fmt::format("pm.cap.{}", site.risk), dim::pressure);
    }
    return ok;
}

bool choose_slope_curve(Resolver& r, Library& lib, SnowSite& site) {
    if (!site.tables.Cs_curve_by_thermal) {
        double Ct = site.Ct.value;
        site.Cs_curve = Ct <= 1.0 + 1e-9 ? 0 : (Ct < 1.2 - 1e-9 ? 1 : 2);
        return true;
    }
    std::string curve = lib.text(fmt::format("Cs.curve.{}", site.thermal));
    for (std::size_t k = 0; k < kCurves.size(); ++k) {
        if (curve == kCurves[k]) {
            site.Cs_curve = k;
            return true;
        }
    }
    r.diagnostics.error(site.where,
                        fmt::format("the library value '{}.Cs.curve.{}' names a slope factor "
                                    "curve: warm, cold_ventilated or cold; found '{}'",
                                    lib.standard(), site.thermal, curve));
    return false;
}

}  // namespace firn::resolve_detail
