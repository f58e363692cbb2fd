// resolve_loads: load cases and their loads, checked against the members
// and nodes they act on.
#include <fmt/format.h>
#include <algorithm>
#include <cmath>

#include "resolve/resolve_internal.hpp"

namespace firn::resolve_detail {
namespace {

using LoadDecl = syntax::LoadDecl;

CaseKind case_kind(syntax::CaseDecl::Kind kind) {
    switch (kind) {
        case syntax::CaseDecl::Kind::dead:
            return CaseKind::dead;
        case syntax::CaseDecl::Kind::live:
            return CaseKind::live;
        case syntax::CaseDecl::Kind::roof_live:
            return CaseKind::roof_live;
        case syntax::CaseDecl::Kind::snow:
            return CaseKind::snow;
        case syntax::CaseDecl::Kind::rain:
            return CaseKind::rain;
        case syntax::CaseDecl::Kind::wind:
            return CaseKind::wind;
        case syntax::CaseDecl::Kind::other:
            return CaseKind::other;
    }
    return CaseKind::other;
}

/// The part of one member a spread load covers, checked against its length.
struct LoadExtent {
    double start = 0.0;
    double end = 0.0;
};

class LoadResolver {
  public:
    LoadResolver(Resolver& r, LoadCase& lc, const LoadDecl& decl, SourceRange where)
        : r_(r), lc_(lc), decl_(decl), where_(where) {}

    void run() {
        switch (decl_.form) {
            case LoadDecl::Form::uniform:
            case LoadDecl::Form::linear:
                spread();
                break;
            case LoadDecl::Form::point:
                point();
                break;
            case LoadDecl::Form::moment:
                moment();
                break;
            case LoadDecl::Form::self_weight:
                self_weight();
                break;
        }
    }

  private:
    Resolver& r_;
    LoadCase& lc_;
    const LoadDecl& decl_;
    SourceRange where_;

    std::optional<double> checked(const syntax::Expr& e, const Expected& expected) {
        auto v = r_.value(e, expected);
        if (v && !r_.within(e, *v, kMaxMagnitude, "load"))
            v.reset();
        return v;
    }

    std::optional<LoadDirection> member_direction() {
        using D = LoadDecl::Direction;
        switch (decl_.direction) {
            case D::x:
                return LoadDirection::global_x;
            case D::y:
            case D::up:
                return LoadDirection::global_y;
            case D::down:
                return LoadDirection::down;
            case D::axial:
                return LoadDirection::axial;
            case D::transverse:
                return LoadDirection::transverse;
            case D::none:
                break;
        }
        return std::nullopt;
    }

    /// Global (fx, fy) of a unit force at a node, or nullopt after an error.
    std::optional<std::array<double, 2>> node_direction() {
        using D = LoadDecl::Direction;
        switch (decl_.direction) {
            case D::x:
                return std::array{1.0, 0.0};
            case D::y:
            case D::up:
                return std::array{0.0, 1.0};
            case D::down:
                return std::array{0.0, -1.0};
            default:
                r_.diagnostics.error(
                    decl_.direction_where,
                    "a load at a node takes a global direction (x, y, up or down)");
                return std::nullopt;
        }
    }

    /// Length a position on the member is measured along: the member, or
    /// its horizontal projection for projected loads.
    double measured_length(MemberId m) const {
        const Member& member = r_.model.members[at(m)];
        const Node& a = r_.model.nodes[at(member.start)];
        const Node& b = r_.model.nodes[at(member.end)];
        return decl_.projected ? std::abs(b.x - a.x) : std::hypot(b.x - a.x, b.y - a.y);
    }

    bool position_fits(const syntax::Expr& e, double pos, MemberId m) {
        double length = measured_length(m);
        const double slack = 1e-9 * (1.0 + length);
        if (pos >= -slack && pos <= length + slack)
            return true;
        r_.diagnostics.error(
            e.where,
            fmt::format("{} lies outside member '{}', which is {}{}", show_length(r_.model, pos),
                        r_.model.members[at(m)].name, show_length(r_.model, length),
                        decl_.projected ? " long in plan" : " long"));
        return false;
    }

    std::optional<LoadExtent> extent_on(MemberId m, std::optional<double> from,
                                        std::optional<double> to) {
        if (!decl_.from)
            return LoadExtent{0.0, measured_length(m)};
        if (!from || !to)
            return std::nullopt;
        if (!position_fits(*decl_.from, *from, m) || !position_fits(*decl_.to, *to, m))
            return std::nullopt;
        if (!(*from < *to)) {
            r_.diagnostics.error(decl_.to->where, "a loaded part must end after it starts");
            return std::nullopt;
        }
        double length = measured_length(m);
        return LoadExtent{std::clamp(*from, 0.0, length), std::clamp(*to, 0.0, length)};
    }

    /// One warning per list item that repeats members (a group or pattern may
    /// repeat many), naming them.
    void warn_listed_again(const syntax::Name& item, const std::vector<std::string>& again) {
        if (again.size() == 1) {
            r_.diagnostics.warning(
                item.where,
                fmt::format("member '{}' is listed twice; it takes this load once", again[0]));
        } else if (again.size() > 1) {
            std::string last = again.back();
            std::vector<std::string> rest(again.begin(), again.end() - 1);
            r_.diagnostics.warning(item.where,
                                   fmt::format("members '{}' and '{}' are listed twice; each takes "
                                               "this load once",
                                               fmt::join(rest, "', '"), last));
        }
    }

    /// The members a load names. A member that has an error of its own is
    /// left out, so its error is not echoed by every load on it.
    std::vector<MemberId> members() {
        std::vector<MemberId> ids;
        std::vector<char> listed(r_.model.members.size(), 0);
        for (const syntax::Name& name : decl_.targets) {
            auto found = r_.find_members(name);
            if (!found)
                continue;
            std::vector<std::string> again;
            for (MemberId id : *found) {
                if (listed[at(id)]) {
                    again.push_back(r_.model.members[at(id)].name);
                    continue;
                }
                listed[at(id)] = 1;
                if (r_.member_status[at(id)].valid)
                    ids.push_back(id);
            }
            warn_listed_again(name, again);
        }
        return ids;
    }

    std::vector<NodeId> nodes() {
        std::vector<NodeId> ids;
        for (const syntax::Name& name : decl_.targets) {
            if (auto id = r_.find_node(name))
                ids.push_back(*id);
        }
        return ids;
    }

    bool projected_allowed() {
        using D = LoadDecl::Direction;
        bool vertical =
            decl_.direction == D::down || decl_.direction == D::up || decl_.direction == D::y;
        if (!decl_.projected || vertical)
            return true;
        r_.diagnostics.error(
            decl_.direction_where,
            "'projected' is for vertical loads (down, up or y) given per horizontal length");
        return false;
    }

    void spread() {
        auto w_start = checked(*decl_.value, expected::line_load);
        auto w_end = decl_.end_value ? checked(*decl_.end_value, expected::line_load) : w_start;
        auto direction = member_direction();
        std::optional<double> from, to;
        if (decl_.from) {
            from = r_.value(*decl_.from, expected::length);
            to = r_.value(*decl_.to, expected::length);
        }
        bool ok = projected_allowed() && w_start && w_end && direction;
        for (MemberId m : members()) {
            auto span = extent_on(m, from, to);
            if (!ok || !span)
                continue;
            lc_.distributed.push_back(DistributedLoad{m, *direction, decl_.projected, span->start,
                                                      span->end, *w_start, *w_end, where_});
        }
    }

    void point() {
        auto force = checked(*decl_.value, expected::force);
        if (!decl_.on_members) {
            auto d = node_direction();
            for (NodeId n : nodes()) {
                if (force && d)
                    lc_.nodal.push_back(
                        NodalLoad{n, (*d)[0] * *force, (*d)[1] * *force, 0.0, where_});
            }
            return;
        }
        auto direction = member_direction();
        auto pos = r_.value(*decl_.at, expected::length);
        for (MemberId m : members()) {
            if (!force || !direction || !pos || !position_fits(*decl_.at, *pos, m))
                continue;
            double p = std::clamp(*pos, 0.0, measured_length(m));
            lc_.points.push_back(PointLoad{m, *direction, p, *force, where_});
        }
    }

    void moment() {
        auto value = checked(*decl_.value, expected::moment);
        if (value && decl_.clockwise)
            *value = -*value;
        if (!decl_.on_members) {
            for (NodeId n : nodes()) {
                if (value)
                    lc_.nodal.push_back(NodalLoad{n, 0.0, 0.0, *value, where_});
            }
            return;
        }
        auto pos = r_.value(*decl_.at, expected::length);
        for (MemberId m : members()) {
            if (!value || !pos || !position_fits(*decl_.at, *pos, m))
                continue;
            lc_.moments.push_back(
                PointMoment{m, std::clamp(*pos, 0.0, measured_length(m)), *value, where_});
        }
    }

    /// Self weight needs the density of every material it touches.
    void self_weight() {
        SelfWeight sw;
        sw.all_members = decl_.targets.empty();
        sw.members = members();
        sw.where = where_;
        std::vector<char> reported(r_.model.materials.size(), 0);
        auto check = [&](MemberId id) {
            if (!r_.member_status[at(id)].section_known)
                return;  // the unknown section is reported already
            SectionId section = r_.model.members[at(id)].section;
            if (!r_.section_status[at(section)].material_known)
                return;  // the unknown material is reported already
            const Section& s = r_.model.sections[at(section)];
            const Material& mat = r_.model.materials[at(s.material)];
            if (mat.unit_weight > 0.0 || reported[at(s.material)])
                return;
            reported[at(s.material)] = 1;
            Diagnostic& d = r_.diagnostics.error(
                where_, fmt::format("self weight needs the density of material '{}'", mat.name));
            d.note(mat.where, "give it here, as in density = 490 pcf");
        };
        if (sw.all_members) {
            for (std::size_t i = 0; i < r_.model.members.size(); ++i)
                check(make_id<MemberId>(i));
        } else {
            for (MemberId id : sw.members)
                check(id);
        }
        lc_.self_weight.push_back(std::move(sw));
    }
};

}  // namespace

void resolve_cases(Resolver& r, const std::vector<const syntax::CaseDecl*>& cases) {
    for (const syntax::CaseDecl* decl : cases) {
        LoadCase lc;
        lc.name = decl->name.text;
        lc.kind = case_kind(decl->kind);
        lc.where = decl->name.where;
        for (std::size_t i = 0; i < decl->loads.size(); ++i) {
            LoadResolver(r, lc, decl->loads[i], decl->load_where[i]).run();
        }
        if (!r.cases.add(decl->name, r.diagnostics))
            continue;
        if (decl->loads.empty()) {
            r.diagnostics.warning(decl->name.where,
                                  fmt::format("load case '{}' has no loads", lc.name));
        }
        r.model.cases.push_back(std::move(lc));
    }
}

}  // namespace firn::resolve_detail
