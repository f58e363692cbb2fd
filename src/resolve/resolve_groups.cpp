// resolve_groups: member groups (`group` statements and `tag` clauses) and the
// member references lists accept: a member, a group, or a pattern with '*'.
#include <fmt/format.h>
#include <algorithm>
#include <map>
#include <set>

#include "base/name_pattern.hpp"
#include "resolve/resolve_internal.hpp"

namespace firn::resolve_detail {
namespace {

/// Groups in groups deeper than this are refused (as deep expressions are).
constexpr std::size_t kMaxGroupNesting = 100;

/// The pattern with each piece between dots that is in no member name
/// replaced by the closest piece that is (`eaves.*` -> `eave.*`), if the result
/// matches some member; otherwise "".
std::string pattern_near_miss(const Resolver& r, const std::string& pattern) {
    std::vector<std::string> pieces;
    for (const Member& m : r.model.members) {
        for (std::size_t at = 0, dot = 0; dot != std::string::npos; at = dot + 1) {
            dot = m.name.find('.', at);
            pieces.push_back(m.name.substr(at, dot == std::string::npos ? dot : dot - at));
        }
    }
    std::sort(pieces.begin(), pieces.end());
    pieces.erase(std::unique(pieces.begin(), pieces.end()), pieces.end());
    std::string fixed;
    for (std::size_t at = 0, dot = 0; dot != std::string::npos; at = dot + 1) {
        dot = pattern.find('.', at);
        std::string piece = pattern.substr(at, dot == std::string::npos ? dot : dot - at);
        bool known = piece.find('*') != std::string::npos ||
                     std::binary_search(pieces.begin(), pieces.end(), piece);
        std::string near = known ? piece : closest_match(piece, pieces);
        if (at > 0)
            fixed += '.';
        fixed += near.empty() ? piece : near;
    }
    for (const Member& m : r.model.members) {
        if (fixed != pattern && name_matches(fixed, m.name))
            return fixed;
    }
    return {};
}

std::optional<std::vector<MemberId>> members_matching(Resolver& r, const syntax::Name& pattern) {
    std::vector<MemberId> ids;
    for (std::size_t i = 0; i < r.model.members.size(); ++i) {
        if (name_matches(pattern.text, r.model.members[i].name))
            ids.push_back(make_id<MemberId>(i));
    }
    if (ids.empty()) {
        if (r.members_missing)
            return std::nullopt;
        std::string near = pattern_near_miss(r, pattern.text);
        r.diagnostics.error(
            pattern.where,
            fmt::format("no member matches '{}'{}", pattern.text,
                        near.empty() ? "" : fmt::format("; did you mean '{}'?", near)));
        return std::nullopt;
    }
    return ids;
}

/// Flags, one per member, of the members in `ids`: a group of every member
/// of a large model is checked for repeats in linear time, not quadratic.
std::vector<char> listed_in(const Resolver& r, const std::vector<MemberId>& ids) {
    std::vector<char> listed(r.model.members.size(), 0);
    for (MemberId id : ids)
        listed[at(id)] = 1;
    return listed;
}

/// Appends `more` to `ids`, leaving out members already `listed` there.
void append_unique(std::vector<MemberId>& ids, const std::vector<MemberId>& more,
                   std::vector<char>& listed) {
    for (MemberId id : more) {
        if (!listed[at(id)]) {
            listed[at(id)] = 1;
            ids.push_back(id);
        }
    }
}

std::optional<std::vector<MemberId>> group_members(Resolver& r, std::size_t g,
                                                   const syntax::Name& ref) {
    Resolver::Group& group = r.group_entries[g];
    using State = Resolver::Group::State;
    if (group.state == State::expanding) {
        auto first = std::find(r.expanding_groups.begin(), r.expanding_groups.end(), ref.text);
        std::vector<std::string> chain(first, r.expanding_groups.end());
        chain.push_back(ref.text);
        r.diagnostics.error(ref.where, fmt::format("group '{}' contains itself: {}", ref.text,
                                                   fmt::join(chain, " -> ")));
        return std::nullopt;
    }
    if (group.state == State::waiting && r.expanding_groups.size() >= kMaxGroupNesting) {
        // Expanding recurses once per level: a long chain would overflow the stack.
        r.diagnostics.error(ref.where, fmt::format("groups nest too deeply (more than {} levels)",
                                                   kMaxGroupNesting));
        return std::nullopt;
    }
    if (group.state == State::waiting) {
        group.state = State::expanding;
        r.expanding_groups.push_back(group.decl->name.text);
        std::vector<char> listed = listed_in(r, group.members);
        for (const syntax::Name& item : group.decl->members) {
            if (auto ids = r.find_members(item))
                append_unique(group.members, *ids, listed);
        }
        r.expanding_groups.pop_back();
        group.state = State::done;
    }
    return group.members;
}

}  // namespace

std::optional<std::vector<MemberId>> Resolver::find_members(const syntax::Name& ref) {
    if (ref.text.find('*') != std::string::npos)
        return members_matching(*this, ref);
    if (auto i = members.find_quietly(ref.text))
        return std::vector<MemberId>{make_id<MemberId>(*i)};
    if (auto g = groups.find_quietly(ref.text))
        return group_members(*this, *g, ref);
    if (members_missing)
        return std::nullopt;  // it may name a member a statement with an error did not make
    std::vector<std::string> known = members.names();
    known.insert(known.end(), groups.names().begin(), groups.names().end());
    diagnostics.error(ref.where, fmt::format("unknown member or group '{}'{}", ref.text,
                                             did_you_mean(ref.text, known)));
    return std::nullopt;
}

void resolve_groups(Resolver& r, const std::vector<const syntax::GroupDecl*>& groups) {
    auto clashes = [&](const syntax::Name& name) {
        if (!r.members.find_quietly(name.text))
            return false;
        r.diagnostics.error(
            name.where,
            fmt::format("'{}' is a member; a group needs a name of its own", name.text));
        return true;
    };
    for (const syntax::GroupDecl* decl : groups) {
        if (!clashes(decl->name) && r.groups.add(decl->name, r.diagnostics))
            r.group_entries.push_back(Resolver::Group{decl, {}, Resolver::Group::State::waiting});
    }
    std::set<std::pair<FileId, std::uint32_t>> refused;   // clashing tags, reported once each
    std::map<std::size_t, std::vector<MemberId>> tagged;  // by group, in the order tagged
    for (const auto& [tag, member] : r.tagged) {
        auto g = r.groups.find_quietly(tag.text);
        if (!g) {
            std::pair place{tag.where.file, tag.where.begin.offset};
            if (refused.contains(place) || clashes(tag)) {
                refused.insert(place);
                continue;
            }
            r.groups.add(tag, r.diagnostics);
            r.group_entries.push_back(Resolver::Group{nullptr, {}, Resolver::Group::State::done});
            g = r.group_entries.size() - 1;
        }
        tagged[*g].push_back(member);
    }
    for (const auto& [g, members] : tagged) {
        std::vector<char> listed = listed_in(r, r.group_entries[g].members);
        append_unique(r.group_entries[g].members, members, listed);
    }
    for (std::size_t g = 0; g < r.group_entries.size(); ++g) {
        if (r.group_entries[g].decl != nullptr)
            group_members(r, g, r.group_entries[g].decl->name);
        if (r.group_entries[g].state == Resolver::Group::State::done)
            r.model.groups.push_back(MemberGroup{r.groups.names()[g], r.group_entries[g].members});
    }
}

}  // namespace firn::resolve_detail
