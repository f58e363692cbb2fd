// lsp_features: what the editor asks about a model: hovers, definitions, the
// outline and completions. Names are looked up in the resolved model where it
// exists, and in the syntax trees (values, groups, `use`) otherwise.
#include <fmt/format.h>
#include <filesystem>
#include <set>

#include "grammar/keywords.hpp"
#include "lsp/lsp_internal.hpp"
#include "report/report.hpp"

namespace firn::lsp {
namespace {

/// A name the model defines, where, and what kind of thing it names.
struct NamedPlace {
    std::string name;
    SourceRange where;
    const char* kind;
};

/// Calls `f(name, where)` for every group and tag the trees name, first place first.
template <typename F>
void for_each_group(const CheckedModel& c, F f) {
    for (const syntax::Tree& tree : c.trees) {
        for (const syntax::Statement& s : tree.statements) {
            if (const auto* g = std::get_if<syntax::GroupDecl>(&s.node))
                f(g->name);
            auto tags = [&f](const syntax::MemberOptions& o) {
                for (const syntax::Name& t : o.tags)
                    f(t);
            };
            if (const auto* m = std::get_if<syntax::MemberDecl>(&s.node))
                tags(m->options);
            else if (const auto* cols = std::get_if<syntax::ColumnsDecl>(&s.node))
                tags(cols->options);
            else if (const auto* beams = std::get_if<syntax::BeamsDecl>(&s.node))
                tags(beams->options);
            else if (const auto* rafters = std::get_if<syntax::RaftersDecl>(&s.node))
                tags(rafters->options);
        }
    }
}

template <typename T>
void add_places(std::vector<NamedPlace>& out, const std::vector<T>& items, const char* kind) {
    for (const T& item : items)
        out.push_back({item.name, item.where, kind});
}

/// Every name with a place: the model's entities, then values and groups from the trees.
std::vector<NamedPlace> named_places(const CheckedModel& c) {
    std::vector<NamedPlace> out;
    if (c.resolved) {
        const Model& m = c.model;
        add_places(out, m.nodes, "node");
        add_places(out, m.members, "member");
        add_places(out, m.sections, "section");
        add_places(out, m.materials, "material");
        add_places(out, m.grid_x, "grid line");
        add_places(out, m.grid_y, "level");
        add_places(out, m.plan_lines, "plan line");
        add_places(out, m.cases, "case");
        add_places(out, c.derivation.cases, "case");
        add_places(out, m.roofs, "roof");
        add_places(out, m.projections, "projection");
        add_places(out, m.combination_sets, "combinations");
        add_places(out, m.patterns, "pattern");
    }
    for (const syntax::Tree& tree : c.trees) {
        for (const syntax::Statement& s : tree.statements) {
            if (const auto* let = std::get_if<syntax::LetDecl>(&s.node))
                out.push_back({let->name.text, let->name.where, "value"});
        }
    }
    std::set<std::string, std::less<>> groups;
    for_each_group(c, [&](const syntax::Name& n) {
        if (groups.insert(n.text).second)
            out.push_back({n.text, n.where, "group"});
    });
    return out;
}

const NamedPlace* find_place(const std::vector<NamedPlace>& places, std::string_view name) {
    for (const NamedPlace& p : places) {
        if (p.name == name)
            return &p;
    }
    return nullptr;
}

/// The name at `offset`, whole ("eave.A.B") or, when the whole is no name, the part
/// between dots under the cursor ("A" of "A.eave").
template <typename Known>
std::optional<std::string> name_under(const CheckedModel& c, std::uint32_t offset, Known known) {
    std::string_view text = c.sources.file(c.main).text;
    std::uint32_t begin = 0;
    std::string_view whole = name_at(text, offset, begin);
    if (whole.empty())
        return std::nullopt;
    if (known(whole))
        return std::string(whole);
    std::size_t at = offset - begin;
    std::size_t start = whole.rfind('.', at == 0 ? 0 : at - 1);
    start = start == std::string_view::npos || start >= at ? 0 : start + 1;
    std::size_t end = std::min(whole.find('.', at), whole.size());
    std::string_view part = whole.substr(start, end - start);
    if (!part.empty() && known(part))
        return std::string(part);
    return std::nullopt;
}

// ---- hovers ----

std::string show_length(const Model& m, double v) {
    return show_quantity(m.units, v, dim::length);
}

std::string member_hover(const Model& m, MemberId id) {
    const Member& member = m.members.at(at(id));
    const Section& section = m.sections.at(at(member.section));
    std::string text =
        fmt::format("member {}: section {}, length {}, from node {} to node {}", member.name,
                    section.name, show_length(m, member_geometry(m, id).length),
                    m.nodes.at(at(member.start)).name, m.nodes.at(at(member.end)).name);
    if (member.hinge_start || member.hinge_end)
        text += fmt::format(" (hinged at {})", member.hinge_start && member.hinge_end ? "both ends"
                                               : member.hinge_start                   ? "its start"
                                                                                      : "its end");
    return text;
}

std::string section_hover(const Model& m, const Section& s) {
    return fmt::format(
        "section {}: material {}, A = {}, I = {}", s.name, m.materials.at(at(s.material)).name,
        show_quantity(m.units, s.area, dim::area), show_quantity(m.units, s.inertia, dim::inertia));
}

std::string case_hover(const LoadCase& c) {
    std::size_t loads = c.nodal.size() + c.distributed.size() + c.points.size() + c.moments.size() +
                        c.self_weight.size();
    return fmt::format("load case {} ({}): {} load{}", c.name, case_kind_name(c.kind), loads,
                       loads == 1 ? "" : "s");
}

std::optional<std::string> snow_value_hover(const CheckedModel& c, std::string_view name) {
    for (const TraceStep& step : c.derivation.snow_trace) {
        for (const TraceStep::Name& n : step.names) {
            if (n.name != name || n.value >= step.values.size())
                continue;
            const TraceValue& v = step.values[n.value];
            std::string text = fmt::format("snow value {} = {}", n.name,
                                           show_quantity(c.model.units, v.value, v.dimension));
            if (v.kind != TraceValue::Kind::quantity)
                text = fmt::format("snow value {}", n.name);
            text += fmt::format("\n{}", trace_text(step, c.model.units));
            std::string clause = trace_clause(step);
            if (!clause.empty())
                text += fmt::format("\n{}", clause);
            if (step.provenance == Provenance::from_memory)
                text += "\n(* the values of this clause were entered from memory: verify them)";
            return text;
        }
    }
    return std::nullopt;
}

std::string roof_hover(const CheckedModel& c, const Roof& roof) {
    std::string text =
        fmt::format("roof {}: {} member{}, tributary width {}", roof.name, roof.members.size(),
                    roof.members.size() == 1 ? "" : "s", show_length(c.model, roof.tributary));
    std::string prefix = roof.name + ".";
    for (const SnowValue& v : snow_values(c.derivation)) {
        if (v.name.starts_with(prefix))
            text += fmt::format("\n{} = {}", v.name,
                                show_quantity(c.model.units, v.value, v.dimension));
    }
    return text;
}

std::string group_hover(const Model& m, const MemberGroup& g) {
    std::string text = fmt::format("group {}: {} member{}", g.name, g.members.size(),
                                   g.members.size() == 1 ? "" : "s");
    constexpr std::size_t kShown = 12;
    for (std::size_t i = 0; i < g.members.size() && i < kShown; ++i)
        text += fmt::format("{}{}", i == 0 ? ": " : ", ", m.members.at(at(g.members[i])).name);
    if (g.members.size() > kShown)
        text += ", ...";
    return text;
}

template <typename T>
const T* by_name(const std::vector<T>& items, std::string_view name) {
    for (const T& item : items) {
        if (item.name == name)
            return &item;
    }
    return nullptr;
}

std::optional<std::string> grid_hover(const Model& m, std::string_view name) {
    if (const GridLine* g = by_name(m.grid_x, name))
        return fmt::format("column line {} at x = {}", g->name, show_length(m, g->position));
    if (const GridLine* g = by_name(m.grid_y, name))
        return fmt::format("level {} at y = {}", g->name, show_length(m, g->position));
    if (const GridLine* g = by_name(m.plan_lines, name))
        return fmt::format("plan line {} at {}", g->name, show_length(m, g->position));
    return std::nullopt;
}

std::optional<std::string> model_hover(const CheckedModel& c, std::string_view name) {
    const Model& m = c.model;
    if (const Member* member = by_name(m.members, name))
        return member_hover(m,
                            make_id<MemberId>(static_cast<std::size_t>(member - m.members.data())));
    if (const Node* n = by_name(m.nodes, name))
        return fmt::format("node {} at x = {}, y = {}", n->name, show_length(m, n->x),
                           show_length(m, n->y));
    if (std::optional<std::string> g = grid_hover(m, name))
        return g;
    if (const Section* s = by_name(m.sections, name))
        return section_hover(m, *s);
    if (const Material* mat = by_name(m.materials, name))
        return fmt::format("material {}: E = {}, unit weight {}", mat->name,
                           show_quantity(m.units, mat->elastic_modulus, dim::pressure),
                           show_quantity(m.units, mat->unit_weight, dim::unit_weight));
    if (const LoadCase* lc = by_name(m.cases, name))
        return case_hover(*lc);
    if (const Roof* r = by_name(m.roofs, name))
        return roof_hover(c, *r);
    if (const MemberGroup* g = by_name(m.groups, name))
        return group_hover(m, *g);
    return snow_value_hover(c, name);
}

std::optional<std::string> hover_of(const CheckedModel& c, const std::vector<LetValue>& lets,
                                    std::string_view name) {
    if (c.complete) {
        if (std::optional<std::string> text = model_hover(c, name))
            return text;
    }
    for (const LetValue& v : lets) {
        if (v.name == name) {
            return fmt::format("value {} = {}", v.name,
                               show_quantity(c.units, v.value, v.dimension));
        }
    }
    return std::nullopt;
}

// ---- definitions of `use` ----

/// The file a `use` at `offset` loads, or none when `offset` is on no `use`.
std::optional<FileId> used_file(const CheckedModel& c, std::uint32_t offset) {
    namespace fs = std::filesystem;
    for (const syntax::Statement& s : c.trees.back().statements) {
        const auto* use = std::get_if<syntax::UseDecl>(&s.node);
        if (use == nullptr || offset < s.where.begin.offset || offset > s.where.end.offset)
            continue;
        std::string target = use->module
                                 ? "/" + use->module->text + ".firn"
                                 : (fs::path(c.sources.file(c.main).name).parent_path() / use->path)
                                       .lexically_normal()
                                       .string();
        for (FileId f = 0; f < c.sources.count(); ++f) {
            const std::string& name = c.sources.file(f).name;
            if (f != c.main && (use->module ? name.ends_with(target) : name == target))
                return f;
        }
    }
    return std::nullopt;
}

}  // namespace

std::optional<std::string> hover_text(const CheckedModel& checked, std::uint32_t offset) {
    std::vector<LetValue> lets = let_values(checked);
    std::optional<std::string> found;
    auto known = [&](std::string_view name) {
        found = hover_of(checked, lets, name);
        return found.has_value();
    };
    if (!name_under(checked, offset, known))
        return std::nullopt;
    return found;
}

std::optional<Definition> definition_at(const CheckedModel& checked, std::uint32_t offset) {
    if (checked.trees.empty() || checked.trees.back().file != checked.main)
        return std::nullopt;
    if (std::optional<FileId> f = used_file(checked, offset))
        return Definition{*f, SourceRange{*f, {}, {}}};
    std::vector<NamedPlace> places = named_places(checked);
    auto known = [&](std::string_view name) { return find_place(places, name) != nullptr; };
    std::optional<std::string> name = name_under(checked, offset, known);
    if (!name)
        return std::nullopt;
    const NamedPlace* p = find_place(places, *name);
    return Definition{p->where.file, p->where};
}

// ---- the outline ----

namespace {

/// The protocol's SymbolKind numbers for the four kinds the outline shows.
int symbol_kind(std::string_view kind) {
    if (kind == "case")
        return 24;  // Event
    if (kind == "member")
        return 8;  // Field
    if (kind == "group")
        return 18;  // Array
    return 23;      // Struct: a roof
}

}  // namespace

Json document_symbols(const CheckedModel& checked) {
    LineIndex lines(checked.sources.file(checked.main).text);
    Json out = Json::array();
    for (const NamedPlace& p : named_places(checked)) {
        std::string_view kind = p.kind;
        bool shown = kind == "case" || kind == "member" || kind == "group" || kind == "roof";
        if (!shown || p.where.file != checked.main)
            continue;
        Json range = range_json(lines, p.where.begin.offset, p.where.end.offset);
        out.push_back({{"name", p.name},
                       {"detail", p.kind},
                       {"kind", symbol_kind(kind)},
                       {"range", range},
                       {"selectionRange", range}});
    }
    return out;
}

// ---- completion ----

namespace {

/// The protocol's CompletionItemKind numbers.
enum ItemKind { item_function = 3, item_variable = 6, item_unit = 11, item_keyword = 14 };

/// Items offered at once at most; the editor asks again as the word grows.
constexpr std::size_t kMaxItems = 1000;

struct Items {
    std::string_view prefix;
    Json list = Json::array();
    std::set<std::string, std::less<>> seen;
    bool truncated = false;
};

void add_item(Items& items, std::string_view label, int kind, std::string_view detail) {
    if (!label.starts_with(items.prefix) || !items.seen.insert(std::string(label)).second)
        return;
    if (items.list.size() >= kMaxItems) {
        items.truncated = true;
        return;
    }
    items.list.push_back({{"label", label}, {"kind", kind}, {"detail", detail}});
}

}  // namespace

Json completion_items(const CheckedModel* checked, std::string_view prefix) {
    Items items;
    items.prefix = prefix;
    for (std::string_view k : grammar::keywords)
        add_item(items, k, item_keyword, "keyword");
    for (std::string_view k : grammar::contextual_keywords)
        add_item(items, k, item_keyword, "keyword");
    for (const char* f : syntax::functions)
        add_item(items, f, item_function, "function");
    if (checked != nullptr) {
        for (const NamedPlace& p : named_places(*checked))
            add_item(items, p.name, item_variable, p.kind);
        for (const SnowValue& v : snow_values(checked->derivation))
            add_item(items, v.name, item_variable, "snow value");
    }
    for (const std::string& u : unit_names())
        add_item(items, u, item_unit, "unit");
    return Json{{"isIncomplete", items.truncated}, {"items", items.list}};
}

}  // namespace firn::lsp
