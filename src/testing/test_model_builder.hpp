// test_model_builder: builds Models in code for the analysis tests (no parser)
// and runs loads -> solve -> results on them.
#pragma once

#include <fmt/format.h>
#include <catch2/catch.hpp>
#include <cmath>
#include <string>

#include "analyse/analyse.hpp"
#include "base/diag.hpp"
#include "derive/derive.hpp"
#include "ir/model.hpp"
#include "ir/results.hpp"

namespace firn::testing {

/// Adds entities to a Model; every entity gets its own source line, so a
/// diagnostic can be traced back to the entity it names.
struct ModelBuilder {
    Model model;
    std::uint32_t next_line = 1;

    SourceRange place() {
        SourceRange r;
        r.begin.line = r.end.line = next_line++;
        r.begin.column = 1;
        r.end.column = 2;
        return r;
    }
    MaterialId material(double elastic_modulus, double unit_weight = 0.0) {
        model.materials.push_back(
            {fmt::format("mat{}", model.materials.size()), elastic_modulus, unit_weight, place()});
        return make_id<MaterialId>(model.materials.size() - 1);
    }
    SectionId section(MaterialId m, double area, double inertia) {
        Section s;
        s.name = fmt::format("sec{}", model.sections.size());
        s.material = m;
        s.area = area;
        s.inertia = inertia;
        s.where = place();
        model.sections.push_back(s);
        return make_id<SectionId>(model.sections.size() - 1);
    }
    NodeId node(const std::string& name, double x, double y) {
        model.nodes.push_back({name, x, y, place()});
        return make_id<NodeId>(model.nodes.size() - 1);
    }
    MemberId member(const std::string& name, NodeId a, NodeId b, SectionId s,
                    bool hinge_start = false, bool hinge_end = false) {
        model.members.push_back({name, a, b, s, hinge_start, hinge_end, place()});
        return make_id<MemberId>(model.members.size() - 1);
    }
    /// A support of a standard kind (its restraints follow from the kind).
    void support(NodeId n, Support::Kind kind) {
        using K = Restraint::Kind;
        Support s;
        s.node = n;
        s.kind = kind;
        s.where = place();
        bool fix_x = kind != Support::Kind::roller_free_x;
        bool fix_y = kind != Support::Kind::roller_free_y;
        s.restraint[dof_x].kind = fix_x ? K::fixed : K::free;
        s.restraint[dof_y].kind = fix_y ? K::fixed : K::free;
        s.restraint[dof_rotation].kind = kind == Support::Kind::fixed ? K::fixed : K::free;
        model.supports.push_back(s);
    }
    /// Springs in x, y and rotation; a stiffness of 0 leaves that direction free,
    /// a negative one makes it fixed.
    void springs(NodeId n, double kx, double ky, double kr) {
        Support s;
        s.node = n;
        s.kind = Support::Kind::spring;
        s.where = place();
        std::array<double, 3> k{kx, ky, kr};
        for (std::size_t d = 0; d < 3; ++d) {
            if (k[d] > 0.0)
                s.restraint[d] = {Restraint::Kind::spring, k[d]};
            if (k[d] < 0.0)
                s.restraint[d] = {Restraint::Kind::fixed, 0.0};
        }
        model.supports.push_back(s);
    }
    CaseId load_case(const std::string& name) {
        LoadCase lc;
        lc.name = name;
        lc.where = place();
        model.cases.push_back(lc);
        return make_id<CaseId>(model.cases.size() - 1);
    }
    LoadCase& loads(CaseId c) { return model.cases[at(c)]; }
    void nodal(CaseId c, NodeId n, double fx, double fy, double moment) {
        loads(c).nodal.push_back({n, fx, fy, moment, place()});
    }
    /// A linearly varying load on [start, end] of a member.
    void spread(CaseId c, MemberId m, LoadDirection d, double start, double end, double w_start,
                double w_end, bool projected = false) {
        loads(c).distributed.push_back({m, d, projected, start, end, w_start, w_end, place()});
    }
    /// A uniform load over the whole member (its horizontal projection if projected).
    void uniform(CaseId c, MemberId m, LoadDirection d, double w, bool projected = false) {
        const Member& mm = model.members[at(m)];
        const Node& a = model.nodes[at(mm.start)];
        const Node& b = model.nodes[at(mm.end)];
        double extent = projected ? std::abs(b.x - a.x) : std::hypot(b.x - a.x, b.y - a.y);
        spread(c, m, d, 0.0, extent, w, w, projected);
    }
    void point(CaseId c, MemberId m, LoadDirection d, double position, double force) {
        loads(c).points.push_back({m, d, position, force, place()});
    }
    void moment(CaseId c, MemberId m, double position, double value) {
        loads(c).moments.push_back({m, position, value, place()});
    }
};

/// Everything the analysis stages produce for one model.
struct Analysis {
    Diagnostics diagnostics;
    LoadSet loads;
    Solution solution;
    Results results;

    const MemberSummary& member(CaseId c, MemberId m) const {
        return results.cases[at(c)].members[at(m)];
    }
    const std::array<double, 3>& reaction(CaseId c, std::size_t support) const {
        return results.cases[at(c)].reactions[support];
    }
    double displacement(CaseId c, NodeId n, Dof d) const { return solution.displacement(c, n, d); }
};

inline Analysis analyse(const Model& model) {
    Analysis a;
    a.loads = derive_loads(model, a.diagnostics);
    a.solution = solve(model, a.loads, a.diagnostics);
    if (a.solution.ok)
        a.results = compute_results(model, a.loads, a.solution);
    return a;
}

/// The largest equilibrium residual over all cases (every test keeps it below 1e-9).
inline double worst_residual(const Analysis& a) {
    double worst = 0.0;
    for (const CaseResults& c : a.results.cases)
        worst = std::max(worst, c.equilibrium.relative_residual);
    return worst;
}

/// A clean solve, and every case in equilibrium: the applied loads and the
/// reactions balance to round-off (statics, common practice).
inline void require_solved(const Analysis& a) {
    REQUIRE(a.diagnostics.error_count() == 0);
    REQUIRE(a.solution.ok);
    REQUIRE(a.results.cases.size() == a.solution.case_count);
    CHECK(worst_residual(a) < 1e-9);
}

/// Approx with a relative tolerance of 1e-9, for results that are exact up to
/// round-off; `scale` sets the margin around an expected zero.
inline Approx exactly(double v, double scale = 0.0) {
    return Approx(v).epsilon(1e-9).margin(1e-9 * scale);
}

}  // namespace firn::testing
