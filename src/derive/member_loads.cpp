// loads: global, projected and self-weight loads turned into member local loads.
#include "derive/derive.hpp"

#include <fmt/format.h>
#include <cassert>
#include <cmath>

namespace firn {

namespace {

/// Local (axial, transverse) components of a unit action in `direction`.
std::array<double, 2> local_components(LoadDirection direction, const MemberGeometry& g) {
    // Local x = (c, s), local y = (-s, c); a global vector (gx, gy) has local
    // components (gx c + gy s, -gx s + gy c).
    switch (direction) {
        case LoadDirection::global_x:
            return {g.c, -g.s};
        case LoadDirection::global_y:
            return {g.s, g.c};
        case LoadDirection::down:
            return {-g.s, -g.c};
        case LoadDirection::axial:
            return {1.0, 0.0};
        case LoadDirection::transverse:
            return {0.0, 1.0};
    }
    return {0.0, 0.0};
}

struct PendingDistributed {
    MemberId member;
    LocalDistributed load;
};
struct PendingPoint {
    MemberId member;
    LocalPoint load;
};

struct CaseBuilder {
    const Model& model;
    Diagnostics& diagnostics;
    std::vector<PendingDistributed> distributed;
    std::vector<PendingPoint> points;

    void add_distributed(const DistributedLoad& d) {
        MemberGeometry g = member_geometry(model, d.member);
        double per_length = 1.0;  // intensity per member length / intensity as given
        double position_scale = 1.0;
        if (d.projected) {
            // w per horizontal length acts on |c| x length of horizontal projection
            // per unit member length; horizontal distances stretch by 1/|c| along it.
            double cos_abs = std::abs(g.c);
            if (cos_abs < 1e-12) {
                diagnostics.warning(d.where, fmt::format("member '{}' is vertical: a load per "
                                                         "horizontal projection adds nothing to it",
                                                         model.members[at(d.member)].name));
                return;
            }
            per_length = cos_abs;
            position_scale = 1.0 / cos_abs;
        }
        auto [ux, uy] = local_components(d.direction, g);
        LocalDistributed l;
        l.a = d.start * position_scale;
        l.b = std::min(d.end * position_scale, g.length);
        l.qx_a = ux * d.w_start * per_length;
        l.qx_b = ux * d.w_end * per_length;
        l.qy_a = uy * d.w_start * per_length;
        l.qy_b = uy * d.w_end * per_length;
        distributed.push_back({d.member, l});
    }

    void add_point(const PointLoad& p) {
        MemberGeometry g = member_geometry(model, p.member);
        auto [ux, uy] = local_components(p.direction, g);
        points.push_back({p.member, LocalPoint{p.position, ux * p.force, uy * p.force, 0.0}});
    }

    void add_self_weight(const SelfWeight& sw) {
        auto add = [&](MemberId id) {
            const Member& m = model.members[at(id)];
            const Section& s = model.sections[at(m.section)];
            double w = model.materials[at(s.material)].unit_weight * s.area;
            if (w == 0.0)
                return;
            MemberGeometry g = member_geometry(model, id);
            add_distributed(
                DistributedLoad{id, LoadDirection::down, false, 0.0, g.length, w, w, sw.where});
        };
        if (sw.all_members) {
            for (std::size_t i = 0; i < model.members.size(); ++i)
                add(make_id<MemberId>(i));
        } else {
            for (MemberId id : sw.members)
                add(id);
        }
    }
};

/// Groups pending loads by member into compressed rows, keeping input order
/// within a member so results do not depend on sorting details.
template <typename Pending, typename Local>
void group_by_member(std::vector<Pending>& pending, std::size_t member_count,
                     std::vector<std::uint32_t>& first, std::vector<Local>& out) {
    first.assign(member_count + 1, 0);
    for (const Pending& p : pending)
        ++first[at(p.member) + 1];
    for (std::size_t i = 0; i < member_count; ++i)
        first[i + 1] += first[i];
    out.resize(pending.size());
    std::vector<std::uint32_t> next(first.begin(), first.end() - 1);
    for (const Pending& p : pending)
        out[next[at(p.member)]++] = p.load;
}

CaseLoads derive_case(const Model& model, const LoadCase& lc, Diagnostics& diagnostics) {
    CaseLoads out;
    out.nodal.assign(model.nodes.size() * 3, 0.0);
    for (const NodalLoad& n : lc.nodal) {
        out.nodal[at(n.node) * 3 + dof_x] += n.fx;
        out.nodal[at(n.node) * 3 + dof_y] += n.fy;
        out.nodal[at(n.node) * 3 + dof_rotation] += n.moment;
    }
    CaseBuilder b{model, diagnostics, {}, {}};
    for (const DistributedLoad& d : lc.distributed)
        b.add_distributed(d);
    for (const SelfWeight& sw : lc.self_weight)
        b.add_self_weight(sw);
    for (const PointLoad& p : lc.points)
        b.add_point(p);
    for (const PointMoment& m : lc.moments) {
        b.points.push_back({m.member, LocalPoint{m.position, 0.0, 0.0, m.moment}});
    }
    group_by_member(b.distributed, model.members.size(), out.first_distributed, out.distributed);
    group_by_member(b.points, model.members.size(), out.first_point, out.points);
    return out;
}

}  // namespace

LoadSet derive_loads(const Model& model, Diagnostics& diagnostics) {
    LoadSet set;
    set.cases.reserve(model.cases.size());
    for (const LoadCase& lc : model.cases)
        set.cases.push_back(derive_case(model, lc, diagnostics));
    return set;
}

}  // namespace firn
