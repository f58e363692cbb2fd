// model: pure queries on the resolved model, and words for its enums.
#include "ir/model.hpp"

#include <algorithm>
#include <cassert>
#include <cmath>

namespace firn {

const char* case_kind_name(CaseKind kind) {
    switch (kind) {
        case CaseKind::dead:
            return "dead";
        case CaseKind::live:
            return "live";
        case CaseKind::roof_live:
            return "roof live";
        case CaseKind::snow:
            return "snow";
        case CaseKind::rain:
            return "rain";
        case CaseKind::wind:
            return "wind";
        case CaseKind::other:
            return "other";
    }
    return "other";
}

const char* support_kind_name(Support::Kind kind) {
    switch (kind) {
        case Support::Kind::fixed:
            return "fixed";
        case Support::Kind::pinned:
            return "pinned";
        case Support::Kind::roller_free_x:
            return "roller, free in x";
        case Support::Kind::roller_free_y:
            return "roller, free in y";
        case Support::Kind::spring:
            return "spring";
    }
    return "fixed";
}

bool is_free_end(const Model& model, NodeId n) {
    std::size_t count = 0;
    for (const Member& m : model.members)
        count += (m.start == n ? 1U : 0U) + (m.end == n ? 1U : 0U);
    bool supported = std::any_of(model.supports.begin(), model.supports.end(),
                                 [n](const Support& s) { return s.node == n; });
    return count == 1 && !supported;
}

MemberGeometry member_geometry(const Model& model, MemberId member) {
    const Member& m = model.members[at(member)];
    const Node& a = model.nodes[at(m.start)];
    const Node& b = model.nodes[at(m.end)];
    double dx = b.x - a.x, dy = b.y - a.y;
    double length = std::hypot(dx, dy);
    assert(length > 0.0);
    return MemberGeometry{length, dx / length, dy / length};
}

bool is_cantilever(const Model& model, MemberId id) {
    const Member& m = model.members[at(id)];
    return is_free_end(model, m.start) || is_free_end(model, m.end);
}

}  // namespace firn
