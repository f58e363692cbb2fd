// resolve_cover: the calculation package's cover. Its fields may come from more
// than one file (a project's shared file gives the project and who prepared it,
// each frame's model its structure and revision), but each field only once, so
// that no file silently replaces what another says.
#include <fmt/format.h>
#include <algorithm>
#include <array>
#include <map>

#include "resolve/resolve_internal.hpp"

namespace firn::resolve_detail {
namespace {

struct CoverKey {
    const char* key;
    const char* label;
};

/// The fields a cover may give, in the order the report prints them.
constexpr std::array<CoverKey, 6> kCoverKeys{{
    {"project", "Project"},
    {"structure", "Structure"},
    {"prepared_by", "Prepared by"},
    {"checked_by", "Checked by"},
    {"revision", "Revision"},
    {"dated", "Dated"},
}};

const CoverKey* find_key(const std::string& key) {
    auto it = std::find_if(kCoverKeys.begin(), kCoverKeys.end(),
                           [&](const CoverKey& k) { return key == k.key; });
    return it == kCoverKeys.end() ? nullptr : &*it;
}

std::string key_list() {
    std::string out;
    for (std::size_t i = 0; i < kCoverKeys.size(); ++i)
        out += fmt::format("{}{}", i == 0 ? "" : (i + 1 == kCoverKeys.size() ? " or " : ", "),
                           kCoverKeys[i].key);
    return out;
}

}  // namespace

void resolve_cover(Resolver& r, const std::vector<const syntax::CoverDecl*>& covers) {
    std::map<std::string, const syntax::CoverDecl::Field*> given;
    for (const syntax::CoverDecl* cover : covers) {
        for (const syntax::CoverDecl::Field& field : cover->fields) {
            if (find_key(field.key.text) == nullptr) {
                r.diagnostics.error(field.key.where,
                                    fmt::format("a cover has no field '{}'; it gives {}",
                                                field.key.text, key_list()));
                continue;
            }
            auto [it, fresh] = given.emplace(field.key.text, &field);
            if (!fresh) {
                Diagnostic& d = r.diagnostics.error(
                    field.key.where,
                    fmt::format("the cover's {} is already given", field.key.text));
                d.note(it->second->key.where, "first given here");
            }
        }
    }
    for (const CoverKey& k : kCoverKeys) {
        auto it = given.find(k.key);
        if (it != given.end())
            r.model.cover.push_back(CoverField{k.key, k.label, it->second->text});
    }
}

}  // namespace firn::resolve_detail
