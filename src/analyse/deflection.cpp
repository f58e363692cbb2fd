// deflection: the checks of `deflection MEMBERS limit ROW`.
//
// A member's deflection is measured from the chord through its displaced ends
// (the results' deflection). A cantilever's is its free end's displacement
// across the member from the tangent at its root, from the node displacements:
// with v the displacement along local y and theta the rotation,
// delta = v_tip - v_root - theta_root * L (taken toward the tip). Its span is
// twice its length (IBC Table 1604.3 footnote i, from memory).
#include "ir/checks.hpp"

#include <algorithm>
#include <cmath>

#include "analyse/analyse.hpp"
#include "ir/load_set.hpp"

namespace firn {
namespace {

/// A load the columns check: cases taken alone, or dead plus live as one sum.
struct Loading {
    std::string name;
    const CaseResults* results = nullptr;
    CaseKind kind = CaseKind::dead;
};

/// The factor a row's footnotes put on a loading of the S or W column (1 elsewhere).
double footnote_factor(const DeflectionLimits& limits, const Loading& l) {
    return l.kind == CaseKind::snow   ? limits.snow_factor
           : l.kind == CaseKind::wind ? limits.wind_factor
                                      : 1.0;
}

double cantilever_deflection(const Model& model, const CaseResults& r, MemberId id) {
    const Member& m = model.members[at(id)];
    MemberGeometry g = member_geometry(model, id);
    auto across = [&](NodeId n) {
        const auto& d = r.displacements[at(n)];
        return -g.s * d[0] + g.c * d[1];
    };
    bool tip_at_end = is_free_end(model, m.end);
    NodeId root = tip_at_end ? m.start : m.end, tip = tip_at_end ? m.end : m.start;
    double toward_tip = tip_at_end ? 1.0 : -1.0;
    return across(tip) - across(root) - toward_tip * r.displacements[at(root)][2] * g.length;
}

double deflection_of(const Model& model, const CaseResults& r, MemberId id, bool cantilever) {
    return cantilever ? cantilever_deflection(model, r, id)
                      : r.members[at(id)].deflection_max.value;
}

std::vector<Loading> cases_of(const Model& model, const Results& results,
                              std::initializer_list<CaseKind> kinds) {
    std::vector<Loading> out;
    for (std::size_t c = 0; c < model.cases.size(); ++c) {
        for (CaseKind k : kinds) {
            if (model.cases[c].kind == k)
                out.push_back(Loading{model.cases[c].name, &results.cases[c], k});
        }
    }
    return out;
}

/// D + L: every dead case and every live case that is not an arrangement.
Combination dead_plus_live(const Model& model) {
    Combination sum{"D + L", {}};
    for (std::size_t c = 0; c < model.cases.size(); ++c) {
        const LoadCase& lc = model.cases[c];
        bool live = lc.kind == CaseKind::live && lc.arrangement_of.empty();
        if (lc.kind == CaseKind::dead || live)
            sum.terms.push_back({make_id<CaseId>(c), 1.0});
    }
    return sum;
}

void check_column(const Model& model, std::size_t limits, const char* column, double n,
                  const std::vector<Loading>& loadings, std::vector<DeflectionCheck>& out) {
    if (n <= 0.0 || loadings.empty())
        return;
    for (MemberId id : model.deflection_limits[limits].members) {
        DeflectionCheck check;
        check.limits = limits;
        check.member = id;
        check.column = column;
        check.n = n;
        check.cantilever = is_cantilever(model, id);
        double length = member_geometry(model, id).length;
        check.span = check.cantilever ? 2.0 * length : length;
        for (const Loading& l : loadings) {
            double d = footnote_factor(model.deflection_limits[limits], l) *
                       deflection_of(model, *l.results, id, check.cantilever);
            if (check.governing.empty() || std::abs(d) > std::abs(check.deflection)) {
                check.deflection = d;
                check.governing = l.name;
            }
        }
        out.push_back(std::move(check));
    }
}

}  // namespace

std::vector<DeflectionCheck> check_deflections(const Model& model, const LoadSet& loads,
                                               const Solution& solution, const Results& results) {
    std::vector<DeflectionCheck> out;
    if (model.deflection_limits.empty())
        return out;
    std::vector<Loading> live = cases_of(model, results, {CaseKind::live, CaseKind::roof_live});
    std::vector<Loading> snow_wind = cases_of(model, results, {CaseKind::snow, CaseKind::wind});
    // D + L is one more combination to build: only when some row limits it.
    bool any_total = std::any_of(model.deflection_limits.begin(), model.deflection_limits.end(),
                                 [](const DeflectionLimits& l) { return l.total > 0.0; });
    Combination sum = dead_plus_live(model);
    CaseResults total;
    if (any_total && !sum.terms.empty())
        total = combination_results(model, loads, solution, results, sum);
    std::vector<Loading> totals{Loading{sum.name, &total, CaseKind::dead}};
    for (std::size_t i = 0; i < model.deflection_limits.size(); ++i) {
        const DeflectionLimits& limits = model.deflection_limits[i];
        check_column(model, i, "L or Lr", limits.live, live, out);
        check_column(model, i, "S or W", limits.snow_wind, snow_wind, out);
        check_column(model, i, "D + L", limits.total,
                     sum.terms.empty() ? std::vector<Loading>{} : totals, out);
    }
    return out;
}

}  // namespace firn
