// resolve_snow_checks: what makes snow data or a roof suspicious although it
// resolves: a ground snow load no site has (a unit slip), and a "roof" member
// so steep that the roof rules give it no snow at all (a wall listed as roof,
// which would then get the parapet and step drifts of a roof).
#include <fmt/format.h>
#include <algorithm>
#include <cmath>
#include <numbers>

#include "resolve/resolve_internal.hpp"

namespace firn::resolve_detail {
namespace {

constexpr double kPascalPerPsf = 47.880258980336;  // 1 lbf/ft^2 (exact by definition of lbf, ft)
/// Above this a typed unit slip (kPa for psf, psf for kN/m^2 x 1000) is likelier than a
/// real site; a warning only (common practice: mapped and case-study ground snow loads
/// stay far below it).
constexpr double kPlausibleGroundSnowMax = 1000.0 * kPascalPerPsf;

/// The reference of `decl` that brought `member` into the roof (the roof's name if none).
SourceRange where_listed(Resolver& r, const syntax::RoofDecl& decl, MemberId member) {
    for (const syntax::Name& ref : decl.members) {
        auto ids = r.find_members(ref);
        if (ids && std::find(ids->begin(), ids->end(), member) != ids->end())
            return ref.where;
    }
    return decl.name.where;
}

/// The member's angle from the horizontal, 0 to 90 degrees, in radians.
double slope_of(const Model& m, MemberId member) {
    MemberGeometry g = member_geometry(m, member);
    return std::atan2(std::abs(g.s), std::abs(g.c));
}

}  // namespace

void warn_implausible_ground_snow(Resolver& r, const SourceRange& where, double pg) {
    if (!(pg > kPlausibleGroundSnowMax))
        return;
    r.diagnostics.warning(where, fmt::format("the ground snow load pg = {:.4g} psf ({:.4g} kPa) is "
                                             "above 1000 psf, more than a site has; check its unit",
                                             pg / kPascalPerPsf, pg / 1000.0));
}

void check_roof_slopes(Resolver& r, const syntax::RoofDecl& decl, const Roof& roof) {
    if (!r.model.snow)
        return;
    const SnowTables& t = r.model.snow->tables;
    constexpr double degree = std::numbers::pi / 180.0;
    for (MemberId member : roof.members) {
        double slope = slope_of(r.model, member);
        // Round-off must not make a 70 degree rafter computed from a rise and run a wall.
        if (slope < t.Cs_zero_slope - 1e-9)
            continue;
        r.diagnostics.error(
            where_listed(r, decl, member),
            fmt::format("member '{}' of roof '{}' slopes {:.1f} deg: from {:.0f} deg on a surface "
                        "holds no snow ({}: Cs = 0), so it is a wall, not a roof; list only the "
                        "roof's sloped and flat members",
                        r.model.members[at(member)].name, roof.name, slope / degree,
                        t.Cs_zero_slope / degree, t.clause.Cs[0]));
    }
}

}  // namespace firn::resolve_detail
