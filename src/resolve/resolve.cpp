// resolve: names, units and rules of the structure (grids, nodes, materials,
// sections, members, supports). Load cases are in resolve_loads.cpp.
#include "resolve/resolve.hpp"

#include <fmt/format.h>
#include <algorithm>
#include <cmath>
#include <map>

#include "resolve/resolve_internal.hpp"

namespace firn {
namespace resolve_detail {

bool NameTable::add(const syntax::Name& name, Diagnostics& diagnostics) {
    auto [it, inserted] = index_.emplace(name.text, names_.size());
    if (!inserted) {
        Diagnostic& d = diagnostics.error(
            name.where, fmt::format("{} '{}' is already defined", what_, name.text));
        d.note(where_[it->second], "first defined here");
        return false;
    }
    names_.push_back(name.text);
    where_.push_back(name.where);
    return true;
}

std::optional<std::size_t> NameTable::find_quietly(const std::string& name) const {
    auto it = index_.find(name);
    if (it == index_.end())
        return std::nullopt;
    return it->second;
}

std::optional<std::size_t> NameTable::find(const syntax::Name& name,
                                           Diagnostics& diagnostics) const {
    if (auto i = find_quietly(name.text))
        return i;
    diagnostics.error(name.where, fmt::format("unknown {} '{}'{}", what_, name.text,
                                              did_you_mean(name.text, names_)));
    return std::nullopt;
}

bool Resolver::within(const syntax::Expr& e, double v, double limit, const char* what) {
    if (std::abs(v) <= limit)
        return true;
    diagnostics.error(
        e.where, fmt::format("this {} is out of range (beyond {:g} in SI units)", what, limit));
    return false;
}

std::string show_length(const Model& model, double metres) {
    const DisplayUnit& u = model.units.length;
    return fmt::format("{:.{}f} {}", u.from_si(metres), u.decimals, u.name);
}

void Constants::add(const syntax::LetDecl& decl, Diagnostics& diagnostics) {
    if (find_unit(decl.name.text) != nullptr) {
        diagnostics.error(decl.name.where,
                          fmt::format("'{}' is a unit; choose another name", decl.name.text));
        return;
    }
    if (names_.add(decl.name, diagnostics))
        entries_.push_back(Entry{&decl, nullptr, Entry::State::waiting, std::nullopt});
}

std::optional<Quantity> Constants::constant(const syntax::Expr& ref, Diagnostics& diagnostics) {
    auto i = names_.find_quietly(ref.literal);
    if (!i) {
        diagnostics.error(ref.where, fmt::format("unknown value '{}'{}", ref.literal,
                                                 did_you_mean(ref.literal, names_.names())));
        return std::nullopt;
    }
    Entry& entry = entries_[*i];
    if (entry.decl->text) {
        diagnostics.error(ref.where, fmt::format("'{}' is a text, not a number", ref.literal));
        return std::nullopt;
    }
    if (entry.state == Entry::State::evaluating) {
        auto first = std::find(evaluating_.begin(), evaluating_.end(), ref.literal);
        std::vector<std::string> chain(first, evaluating_.end());
        chain.push_back(ref.literal);
        diagnostics.error(ref.where, fmt::format("value '{}' depends on itself: {}", ref.literal,
                                                 fmt::join(chain, " -> ")));
        return std::nullopt;
    }
    return value_of(entry, diagnostics);
}

/// "; the values of 'a.b' are a.b.c, a.b.d" for a dotted name whose group
/// exists (library tables are named so), or a did-you-mean otherwise.
std::string Constants::siblings(const std::string& name) const {
    std::string prefix = name.substr(0, name.rfind('.') + 1);
    std::vector<std::string> found;
    for (const std::string& n : names_.names()) {
        if (!prefix.empty() && n.starts_with(prefix))
            found.push_back(n);
    }
    if (found.empty())
        return did_you_mean(name, names_.names());
    return fmt::format("; the values of '{}' are {}", prefix.substr(0, prefix.size() - 1),
                       fmt::join(found, ", "));
}

void Constants::amend(const syntax::AmendDecl& decl, Diagnostics& diagnostics) {
    auto i = names_.find_quietly(decl.name.text);
    if (!i) {
        diagnostics.error(decl.name.where, fmt::format("there is no value '{}' to amend{}",
                                                       decl.name.text, siblings(decl.name.text)));
        return;
    }
    Entry& entry = entries_[*i];
    if (entry.decl->text) {
        diagnostics.error(
            decl.name.where,
            fmt::format("'{}' is a text; 'amend' replaces numbers only", decl.name.text));
        return;
    }
    if (entry.amended != nullptr) {
        Diagnostic& d = diagnostics.error(
            decl.name.where, fmt::format("value '{}' is already amended", decl.name.text));
        d.note(entry.amended->name.where, "first amended here");
        return;
    }
    entry.amended = &decl;
}

/// The amendment's value, which must be of the same kind as the value it replaces.
std::optional<Quantity> Constants::amended_value(const Entry& entry,
                                                 std::optional<Quantity> original,
                                                 Diagnostics& diagnostics) {
    const syntax::AmendDecl& decl = *entry.amended;
    auto amended = evaluate(decl.value, diagnostics, this);
    if (original && amended && !(original->dimension == amended->dimension)) {
        diagnostics.error(
            decl.value.where,
            fmt::format("'{}' is {}; its amendment must be too, found {}", decl.name.text,
                        describe(original->dimension), describe(amended->dimension)));
        return std::nullopt;
    }
    return amended;
}

std::optional<Quantity> Constants::lookup(const std::string& name, Diagnostics& diagnostics) {
    auto i = names_.find_quietly(name);
    if (!i)
        return std::nullopt;
    if (entries_[*i].decl->text) {
        diagnostics.error(entries_[*i].decl->text_where,
                          fmt::format("'{}' is a text, not a number", name));
        return std::nullopt;
    }
    return value_of(entries_[*i], diagnostics);
}

std::vector<std::string> Constants::texts_ending(std::string_view suffix) const {
    std::vector<std::string> out;
    for (const Entry& entry : entries_) {
        if (entry.decl->text && entry.decl->name.text.ends_with(suffix))
            out.push_back(entry.decl->name.text);
    }
    return out;
}

std::optional<std::string> Constants::text(const std::string& name) const {
    auto i = names_.find_quietly(name);
    if (!i)
        return std::nullopt;
    return entries_[*i].decl->text;
}

/// The library modules in use that give snow provisions: those that name their
/// snow chapter (`let NAME.snow_chapter = "..."`), in the order they were declared.
std::vector<std::string> loaded_standards(const Resolver& r) {
    static constexpr std::string_view kMark = ".snow_chapter";
    std::vector<std::string> out;
    for (const std::string& name : r.constants.texts_ending(kMark))
        out.push_back(name.substr(0, name.size() - kMark.size()));
    return out;
}

/// A standard's name for the examples in messages: the first in use, or a placeholder.
std::string example_standard(const Resolver& r) {
    std::vector<std::string> standards = loaded_standards(r);
    return standards.empty() ? std::string("MODULE") : standards.front();
}

std::optional<Quantity> Constants::value_of(Entry& entry, Diagnostics& diagnostics) {
    if (entry.state == Entry::State::waiting) {
        entry.state = Entry::State::evaluating;
        evaluating_.push_back(entry.decl->name.text);
        entry.value = evaluate(entry.decl->value, diagnostics, this);
        if (entry.amended != nullptr)
            entry.value = amended_value(entry, entry.value, diagnostics);
        evaluating_.pop_back();
        entry.state = Entry::State::done;
    }
    return entry.value;
}

void Constants::evaluate_all(Diagnostics& diagnostics) {
    for (Entry& entry : entries_) {
        if (!entry.decl->text)
            value_of(entry, diagnostics);
    }
}

namespace {

/// The statements of all trees, grouped by kind, in source order.
struct Collected {
    std::vector<const syntax::Statement*> titles, report_units;
    std::vector<const syntax::Grid*> grids;
    std::vector<const syntax::LetDecl*> lets;
    std::vector<const syntax::NodeDecl*> nodes;
    std::vector<const syntax::MaterialDecl*> materials;
    std::vector<const syntax::SectionDecl*> sections;
    std::vector<const syntax::Statement*> members;  ///< member, columns, beams and rafters
    std::vector<const syntax::GroupDecl*> groups;
    std::vector<const syntax::SnowDecl*> snow;
    std::vector<const syntax::RoofDecl*> roofs;
    std::vector<const syntax::RoofDecl*> projections;
    std::vector<const syntax::CombinationsDecl*> combination_sets;
    std::vector<const syntax::CombineDecl*> combine;
    std::vector<const syntax::PatternDecl*> patterns;
    std::vector<const syntax::ArrangeDecl*> arrangements;
    std::vector<const syntax::DeflectionDecl*> deflections;
    std::vector<const syntax::ExpectDecl*> expectations;
    std::vector<SourceRange> expectation_where;
    std::vector<const syntax::AmendDecl*> amends;
    std::vector<const syntax::Statement*> snow_statements;
    std::vector<const syntax::SupportDecl*> supports;
    std::vector<const syntax::CaseDecl*> cases;
    std::vector<const syntax::Statement*> tolerances;
    std::vector<const syntax::UnjoinedDecl*> unjoined;
    std::vector<const syntax::CoverDecl*> covers;
    SourceRange file_start;
};

Collected collect(std::span<const syntax::Tree> trees) {
    Collected c;
    // The model file is the last tree: every file comes after the files it uses.
    if (!trees.empty())
        c.file_start = SourceRange{trees.back().file, {0, 1, 1}, {0, 1, 1}};
    for (const syntax::Tree& tree : trees) {
        for (const syntax::Statement& s : tree.statements) {
            std::visit(
                [&](const auto& node) {
                    using T = std::decay_t<decltype(node)>;
                    if constexpr (std::is_same_v<T, syntax::ModelTitle>)
                        c.titles.push_back(&s);
                    if constexpr (std::is_same_v<T, syntax::ReportUnits>)
                        c.report_units.push_back(&s);
                    if constexpr (std::is_same_v<T, syntax::Grid>)
                        c.grids.push_back(&node);
                    if constexpr (std::is_same_v<T, syntax::NodeDecl>)
                        c.nodes.push_back(&node);
                    if constexpr (std::is_same_v<T, syntax::MaterialDecl>)
                        c.materials.push_back(&node);
                    if constexpr (std::is_same_v<T, syntax::SectionDecl>)
                        c.sections.push_back(&node);
                    if constexpr (std::is_same_v<T, syntax::LetDecl>)
                        c.lets.push_back(&node);
                    if constexpr (requires { node.options; })
                        c.members.push_back(&s);
                    if constexpr (std::is_same_v<T, syntax::GroupDecl>)
                        c.groups.push_back(&node);
                    if constexpr (std::is_same_v<T, syntax::SnowDecl>) {
                        c.snow.push_back(&node);
                        c.snow_statements.push_back(&s);
                    }
                    if constexpr (std::is_same_v<T, syntax::RoofDecl>)
                        (node.projection ? c.projections : c.roofs).push_back(&node);
                    if constexpr (std::is_same_v<T, syntax::AmendDecl>)
                        c.amends.push_back(&node);
                    if constexpr (std::is_same_v<T, syntax::CombinationsDecl>)
                        c.combination_sets.push_back(&node);
                    if constexpr (std::is_same_v<T, syntax::CombineDecl>)
                        c.combine.push_back(&node);
                    if constexpr (std::is_same_v<T, syntax::PatternDecl>)
                        c.patterns.push_back(&node);
                    if constexpr (std::is_same_v<T, syntax::ArrangeDecl>)
                        c.arrangements.push_back(&node);
                    if constexpr (std::is_same_v<T, syntax::DeflectionDecl>)
                        c.deflections.push_back(&node);
                    if constexpr (std::is_same_v<T, syntax::ExpectDecl>) {
                        c.expectations.push_back(&node);
                        c.expectation_where.push_back(s.where);
                    }
                    if constexpr (std::is_same_v<T, syntax::SupportDecl>)
                        c.supports.push_back(&node);
                    if constexpr (std::is_same_v<T, syntax::CaseDecl>)
                        c.cases.push_back(&node);
                    if constexpr (std::is_same_v<T, syntax::GeometryTolerance>)
                        c.tolerances.push_back(&s);
                    if constexpr (std::is_same_v<T, syntax::UnjoinedDecl>)
                        c.unjoined.push_back(&node);
                    if constexpr (std::is_same_v<T, syntax::CoverDecl>)
                        c.covers.push_back(&node);
                },
                s.node);
        }
    }
    return c;
}

/// Reports a second statement of a kind that may appear once.
void only_once(Resolver& r, const std::vector<const syntax::Statement*>& found, const char* what) {
    for (std::size_t i = 1; i < found.size(); ++i) {
        Diagnostic& d =
            r.diagnostics.error(found[i]->where, fmt::format("{} is already given", what));
        d.note(found[0]->where, "first given here");
    }
}

void resolve_title(Resolver& r, const Collected& c) {
    only_once(r, c.titles, "the model title");
    if (!c.titles.empty())
        r.model.title = std::get<syntax::ModelTitle>(c.titles[0]->node).title;
    resolve_cover(r, c.covers);
}

void resolve_report_units(Resolver& r, const Collected& c) {
    only_once(r, c.report_units, "'report units'");
    std::string force, length, displacement;
    std::optional<std::pair<std::string, double>> moment;
    if (!c.report_units.empty()) {
        for (const auto& item : std::get<syntax::ReportUnits>(c.report_units[0]->node).items) {
            auto q = unit_value(item.unit, r.diagnostics);
            if (!q)
                continue;
            std::string spelling = unit_spelling(item.unit);
            if (item.role && q->dimension == dim::length) {
                displacement = spelling;
            } else if (!item.role && q->dimension == dim::force && item.unit.size() == 1) {
                force = spelling;
            } else if (!item.role && q->dimension == dim::length && item.unit.size() == 1) {
                length = spelling;
            } else if (!item.role && q->dimension == dim::moment) {
                moment = std::pair{spelling, q->value};
            } else {
                r.diagnostics.error(item.where,
                                    "a report unit is a force (kip), a length (ft), a moment "
                                    "(kip*ft), or 'displacement' and a length (displacement in)");
            }
        }
    }
    // A unit left out follows the family of the one given: kip goes with ft,
    // kN with m; with neither, reports are in kN and m.
    bool customary = force == "kip" || force == "lb" || length == "ft" || length == "in";
    if (force.empty())
        force = customary ? "kip" : "kN";
    if (length.empty())
        length = customary ? "ft" : "m";
    if (!make_display_units(force, length, displacement, r.model.units)) {
        r.diagnostics.error(c.report_units.empty() ? c.file_start : c.report_units[0]->where,
                            "reports are given in force kip, lb, kN or N, length ft, in, m or mm, "
                            "and displacement in, mm, cm, ft or m");
    }
    if (moment)
        r.model.units.moment = DisplayUnit{moment->first, moment->second, 3};
}

/// One coordinate of a node: `x = 12 ft` or a grid line name. Returns false
/// if the coordinate is not known because of an error (reported once, where it is).
bool resolve_coordinate(Resolver& r, const syntax::NodeDecl& decl,
                        const syntax::NodeDecl::Coordinate& c,
                        std::array<std::optional<double>, 2>& xy) {
    const std::vector<GridRef>& grid = r.grid;
    syntax::Axis axis;
    std::optional<double> v;
    if (c.grid_line) {
        auto i = r.grid_lines.find(*c.grid_line, r.diagnostics);
        if (!i)
            return false;
        axis = grid[*i].axis;
        if (grid[*i].valid)
            v = grid[*i].position;
    } else {
        axis = *c.axis;
        v = r.value(*c.value, expected::length);
        if (v && !r.within(*c.value, *v, kMaxCoordinate, "coordinate"))
            v.reset();
    }
    auto& slot = xy[axis == syntax::Axis::x ? 0 : 1];
    if (slot) {
        r.diagnostics.error(c.where,
                            fmt::format("node '{}' is given two {} coordinates", decl.name.text,
                                        axis == syntax::Axis::x ? "x" : "y"));
        return false;
    }
    slot = v.value_or(0.0);
    return v.has_value();
}

void resolve_nodes(Resolver& r, const Collected& c) {
    for (const syntax::NodeDecl* decl : c.nodes) {
        std::array<std::optional<double>, 2> xy;
        bool placed = true;
        for (const auto& coordinate : decl->coordinates) {
            placed = resolve_coordinate(r, *decl, coordinate, xy) && placed;
        }
        if (!r.nodes.add(decl->name, r.diagnostics))
            continue;
        bool complete = xy[0] && xy[1];
        if (placed && !complete) {
            r.diagnostics.error(
                decl->name.where,
                fmt::format("node '{}' needs an x and a y (a column line and a level)",
                            decl->name.text));
        }
        placed = placed && complete;
        r.node_status.push_back(Resolver::NodeStatus{placed, false});
        Node n{decl->name.text, xy[0].value_or(0.0), xy[1].value_or(0.0), decl->name.where};
        auto [it, fresh] =
            r.node_at.emplace(place_key(n.x, n.y), make_id<NodeId>(r.model.nodes.size()));
        if (!fresh && placed) {
            const Node& other = r.model.nodes[at(it->second)];
            Diagnostic& d = r.diagnostics.warning(
                decl->name.where,
                fmt::format("node '{}' is at the same place as node '{}'; they are not connected",
                            n.name, other.name));
            d.note(other.where, "that node is here");
        }
        r.model.nodes.push_back(std::move(n));
    }
}

void resolve_constants(Resolver& r, const Collected& c) {
    for (const syntax::LetDecl* decl : c.lets)
        r.constants.add(*decl, r.diagnostics);
    resolve_amendments(r, c.amends);
    r.constants.evaluate_all(r.diagnostics);
}

/// Reads `key = value` properties against a list of what is allowed.
struct PropertySpec {
    const char* key;
    const Expected* expected;
    bool required;
    bool positive;  ///< must be > 0 (otherwise >= 0)
};

std::vector<std::optional<double>> read_properties(Resolver& r,
                                                   const std::vector<syntax::Property>& props,
                                                   const std::vector<PropertySpec>& spec,
                                                   const syntax::Name& owner,
                                                   const char* owner_kind) {
    std::vector<std::optional<double>> values(spec.size());
    std::vector<const syntax::Property*> seen(spec.size(), nullptr);
    std::vector<std::string> keys;
    keys.reserve(spec.size());
    for (const PropertySpec& s : spec)
        keys.emplace_back(s.key);
    for (const syntax::Property& p : props) {
        auto slot = std::find(keys.begin(), keys.end(), p.key.text) - keys.begin();
        if (static_cast<std::size_t>(slot) == keys.size()) {
            r.diagnostics.error(
                p.key.where, fmt::format("unknown property '{}' of {} '{}'; expected {}{}",
                                         p.key.text, owner_kind, owner.text, fmt::join(keys, ", "),
                                         did_you_mean(p.key.text, keys)));
            continue;
        }
        auto i = static_cast<std::size_t>(slot);
        if (seen[i] != nullptr) {
            r.diagnostics.error(p.key.where,
                                fmt::format("property '{}' is given twice", p.key.text));
            continue;
        }
        seen[i] = &p;
        values[i] = r.value(p.value, *spec[i].expected);
        if (!values[i])
            continue;
        bool bad_sign = spec[i].positive ? !(*values[i] > 0.0) : *values[i] < 0.0;
        if (bad_sign) {
            r.diagnostics.error(p.value.where, fmt::format("'{}' must be {}", p.key.text,
                                                           spec[i].positive ? "greater than zero"
                                                                            : "zero or more"));
            values[i].reset();
        } else if (!r.within(p.value, *values[i], kMaxMagnitude, "value")) {
            values[i].reset();
        }
    }
    for (std::size_t i = 0; i < spec.size(); ++i) {
        if (spec[i].required && seen[i] == nullptr) {
            r.diagnostics.error(owner.where,
                                fmt::format("{} '{}' needs '{}', {}", owner_kind, owner.text,
                                            spec[i].key, spec[i].expected->noun));
        }
    }
    return values;
}

/// Structural materials have E between about 7 GPa (timber across its grain aside) and
/// 210 GPa (steel) (common practice); a value outside 0.1 GPa to 1000 GPa is almost
/// surely a unit slip, so it is said, though the model still runs.
constexpr double kPlausibleModulusLow = 1e8, kPlausibleModulusHigh = 1e12;  // Pa

void warn_implausible_modulus(Resolver& r, const syntax::MaterialDecl& decl, double e) {
    if (e <= 0.0 || (e >= kPlausibleModulusLow && e <= kPlausibleModulusHigh))
        return;
    r.diagnostics.warning(decl.name.where,
                          fmt::format("material '{}' has E = {:.3g} Pa, outside the 0.1 to 1000 "
                                      "GPa of structural materials; check its unit",
                                      decl.name.text, e));
}

void resolve_materials(Resolver& r, const Collected& c) {
    static const std::vector<PropertySpec> spec{{"E", &expected::modulus, true, true},
                                                {"density", &expected::unit_weight, false, false}};
    for (const syntax::MaterialDecl* decl : c.materials) {
        auto v = read_properties(r, decl->properties, spec, decl->name, "material");
        if (!r.materials.add(decl->name, r.diagnostics))
            continue;
        warn_implausible_modulus(r, *decl, v[0].value_or(0.0));
        r.model.materials.push_back(
            Material{decl->name.text, v[0].value_or(0.0), v[1].value_or(0.0), decl->name.where});
    }
}

/// Area and inertia of a section from what its statement gives.
std::optional<std::pair<double, double>> section_properties(Resolver& r,
                                                            const syntax::SectionDecl& decl) {
    using Shape = syntax::SectionDecl::Shape;
    static const std::vector<PropertySpec> given{{"A", &expected::area, true, true},
                                                 {"I", &expected::inertia, true, true}};
    static const std::vector<PropertySpec> rectangle{{"b", &expected::length, true, true},
                                                     {"d", &expected::length, true, true}};
    static const std::vector<PropertySpec> ishape{{"d", &expected::length, true, true},
                                                  {"bf", &expected::length, true, true},
                                                  {"tf", &expected::length, true, true},
                                                  {"tw", &expected::length, true, true}};
    const auto& spec = decl.shape == Shape::given       ? given
                       : decl.shape == Shape::rectangle ? rectangle
                                                        : ishape;
    auto v = read_properties(r, decl.properties, spec, decl.name, "section");
    for (const auto& x : v) {
        if (!x)
            return std::nullopt;
    }
    if (decl.shape == Shape::given)
        return std::pair{*v[0], *v[1]};
    if (decl.shape == Shape::rectangle) {
        // Solid rectangle b x d bending about its axis parallel to b.
        double b = *v[0], d = *v[1];
        return std::pair{b * d, b * d * d * d / 12.0};
    }
    double d = *v[0], bf = *v[1], tf = *v[2], tw = *v[3];
    if (!(2.0 * tf < d) || !(tw <= bf)) {
        r.diagnostics.error(decl.name.where,
                            fmt::format("section '{}': an I-shape needs two flanges thinner than "
                                        "half its depth (2 tf < d) and a web "
                                        "no wider than its flanges (tw <= bf)",
                                        decl.name.text));
        return std::nullopt;
    }
    // Doubly-symmetric I-shape of plates, fillets ignored: the full d x bf
    // rectangle less the two voids beside the web.
    double hw = d - 2.0 * tf;
    return std::pair{2.0 * bf * tf + hw * tw, (bf * d * d * d - (bf - tw) * hw * hw * hw) / 12.0};
}

void resolve_sections(Resolver& r, const Collected& c) {
    for (const syntax::SectionDecl* decl : c.sections) {
        auto material = r.lookup<MaterialId>(r.materials, decl->material);
        auto props = section_properties(r, *decl);
        if (!r.sections.add(decl->name, r.diagnostics))
            continue;
        Section s{decl->name.text, material.value_or(MaterialId{}), Section::Shape::given, 0.0, 0.0,
                  decl->name.where};
        s.shape = decl->shape == syntax::SectionDecl::Shape::given       ? Section::Shape::given
                  : decl->shape == syntax::SectionDecl::Shape::rectangle ? Section::Shape::rectangle
                                                                         : Section::Shape::ishape;
        if (props)
            std::tie(s.area, s.inertia) = *props;
        r.model.sections.push_back(std::move(s));
        r.section_status.push_back(Resolver::SectionStatus{material.has_value()});
    }
}

}  // namespace
}  // namespace resolve_detail

namespace {
using namespace resolve_detail;

std::array<Restraint, 3> restraints_of(syntax::SupportDecl::Kind kind, syntax::Axis roller_free) {
    using K = Restraint::Kind;
    Restraint fixed{K::fixed, 0.0}, free{K::free, 0.0};
    switch (kind) {
        case syntax::SupportDecl::Kind::fixed:
            return {fixed, fixed, fixed};
        case syntax::SupportDecl::Kind::pinned:
            return {fixed, fixed, free};
        case syntax::SupportDecl::Kind::roller:
            return roller_free == syntax::Axis::x ? std::array{free, fixed, free}
                                                  : std::array{fixed, free, free};
        case syntax::SupportDecl::Kind::spring:
            return {free, free, free};
    }
    return {fixed, fixed, fixed};
}

void resolve_springs(Resolver& r, const syntax::SupportDecl& decl,
                     std::array<Restraint, 3>& restraint) {
    if (decl.kind != syntax::SupportDecl::Kind::spring) {
        if (!decl.springs.empty()) {
            r.diagnostics.error(decl.springs[0].direction.where,
                                "springs are given only for 'support spring'");
        }
        return;
    }
    if (decl.springs.empty()) {
        r.diagnostics.error(decl.nodes.back().where,
                            "a spring support needs at least one spring, such as x = 200 kip/in");
    }
    std::array<bool, 3> given{};
    for (const auto& spring : decl.springs) {
        std::size_t dof = spring.direction.text == "x"   ? dof_x
                          : spring.direction.text == "y" ? dof_y
                                                         : dof_rotation;
        if (given[dof]) {
            r.diagnostics.error(spring.direction.where,
                                fmt::format("the {} spring is given twice", spring.direction.text));
            continue;
        }
        given[dof] = true;
        if (!spring.stiffness) {
            restraint[dof] = Restraint{Restraint::Kind::fixed, 0.0};
            continue;
        }
        auto k = r.value(*spring.stiffness, dof == dof_rotation ? expected::rotational_stiffness
                                                                : expected::stiffness);
        if (k && !(*k > 0.0)) {
            r.diagnostics.error(spring.stiffness->where,
                                "a spring stiffness must be greater than zero");
        } else if (k && r.within(*spring.stiffness, *k, kMaxMagnitude, "stiffness")) {
            restraint[dof] = Restraint{Restraint::Kind::spring, *k};
        }
    }
}

Support::Kind support_kind(const syntax::SupportDecl& decl) {
    switch (decl.kind) {
        case syntax::SupportDecl::Kind::fixed:
            return Support::Kind::fixed;
        case syntax::SupportDecl::Kind::pinned:
            return Support::Kind::pinned;
        case syntax::SupportDecl::Kind::roller:
            return decl.roller_free == syntax::Axis::x ? Support::Kind::roller_free_x
                                                       : Support::Kind::roller_free_y;
        case syntax::SupportDecl::Kind::spring:
            return Support::Kind::spring;
    }
    return Support::Kind::fixed;
}

/// True if `name` is a node or may be an intersection (which find_node checks).
bool is_node_name(const Resolver& r, const std::string& name) {
    return r.nodes.find_quietly(name) || name.find('.') != std::string::npos;
}

/// A support may name a node or a grid line, so a plain unknown name is
/// matched against both.
void report_unknown_support_place(Resolver& r, const syntax::Name& name) {
    std::vector<std::string> known = r.nodes.names();
    known.insert(known.end(), r.grid_lines.names().begin(), r.grid_lines.names().end());
    r.diagnostics.error(name.where, fmt::format("unknown node or grid line '{}'{}", name.text,
                                                did_you_mean(name.text, known)));
}

/// The nodes a support names: nodes, intersections, or grid lines (every
/// node of a member on the line).
std::vector<std::pair<NodeId, syntax::Name>> support_nodes(Resolver& r,
                                                           const std::vector<syntax::Name>& names) {
    std::vector<std::pair<NodeId, syntax::Name>> found;
    for (const syntax::Name& name : names) {
        auto line = r.grid_lines.find_quietly(name.text);
        if (!line && !is_node_name(r, name.text)) {
            report_unknown_support_place(r, name);
            continue;
        }
        if (!line || r.nodes.find_quietly(name.text)) {
            if (auto node = r.find_node(name))
                found.emplace_back(*node, name);
            continue;
        }
        const GridRef& g = r.grid[*line];
        std::size_t before = found.size();
        for (std::size_t i = 0; i < r.model.nodes.size(); ++i) {
            const Node& n = r.model.nodes[i];
            double place = g.axis == syntax::Axis::x ? n.x : n.y;
            if (g.valid && r.node_status[i].used && std::abs(place - g.position) <= 1e-6)
                found.emplace_back(make_id<NodeId>(i), name);
        }
        if (g.valid && found.size() == before && !r.members_missing) {
            r.diagnostics.error(name.where,
                                fmt::format("no member has a node on grid line '{}'", name.text));
        }
    }
    return found;
}

/// A node given a second support; `name` is the node or the grid line it is on.
void report_second_support(Resolver& r, const syntax::Name& name, NodeId node,
                           const Support& first) {
    const std::string& node_name = r.model.nodes[at(node)].name;
    std::string message = name.text == node_name
                              ? fmt::format("node '{}' already has a support", node_name)
                              : fmt::format("'{}' names node '{}', which already has a support",
                                            name.text, node_name);
    r.diagnostics.error(name.where, std::move(message)).note(first.where, "that support is here");
}

void resolve_supports(Resolver& r, const Collected& c) {
    std::vector<std::size_t> support_of;
    for (const syntax::SupportDecl* decl : c.supports) {
        auto restraint = restraints_of(decl->kind, decl->roller_free);
        resolve_springs(r, *decl, restraint);
        std::optional<Position> reported;  // a grid line's nodes: one error for the line
        for (const auto& [node, name] : support_nodes(r, decl->nodes)) {
            support_of.resize(r.model.nodes.size(), SIZE_MAX);  // supports may add intersections
            std::size_t& existing = support_of[at(node)];
            if (existing != SIZE_MAX &&
                (!reported || reported->offset != name.where.begin.offset)) {
                report_second_support(r, name, node, r.model.supports[existing]);
                reported = name.where.begin;
            }
            if (existing != SIZE_MAX)
                continue;
            existing = r.model.supports.size();
            r.model.supports.push_back(Support{node, support_kind(*decl), restraint, name.where});
        }
    }
}

void resolve_geometry(Resolver& r, const Collected& c) {
    only_once(r, c.tolerances, "the geometry tolerance");
    const syntax::GeometryTolerance* tolerance = nullptr;
    if (!c.tolerances.empty())
        tolerance = &std::get<syntax::GeometryTolerance>(c.tolerances[0]->node);
    check_geometry(r, tolerance, c.unjoined);
}

void check_whole_model(Resolver& r, const Collected& c) {
    if (r.diagnostics.has_errors())
        return;  // the checks below would only echo earlier errors
    if (r.model.members.empty()) {
        r.diagnostics.error(c.file_start, "the model has no members");
    } else if (r.model.supports.empty()) {
        r.diagnostics.error(c.file_start,
                            "the model has no supports, so nothing holds the structure up");
    }
    for (std::size_t i = 0; i < r.model.nodes.size(); ++i) {
        if (!r.node_status[i].used) {
            r.diagnostics.error(
                r.model.nodes[i].where,
                fmt::format("node '{}' is not connected to any member", r.model.nodes[i].name));
        }
    }
}

}  // namespace

Model resolve(std::span<const syntax::Tree> trees, Diagnostics& diagnostics) {
    Resolver r(diagnostics);
    Collected c = collect(trees);
    resolve_title(r, c);
    resolve_report_units(r, c);
    resolve_constants(r, c);
    resolve_grids(r, c.grids);
    resolve_nodes(r, c);
    resolve_materials(r, c);
    resolve_sections(r, c);
    resolve_member_statements(r, c.members);
    resolve_groups(r, c.groups);
    resolve_supports(r, c);
    resolve_geometry(r, c);
    resolve_cases(r, c.cases);
    resolve_snow(r, c.snow, c.roofs, c.projections, c.amends, c.snow_statements);
    resolve_combinations(r, c.combination_sets, c.combine, c.patterns, c.arrangements);
    resolve_deflection_limits(r, c.deflections);
    read_deflection_footnotes(r);
    check_one_edition(r);
    resolve_expectations(r, c.expectations, c.expectation_where);
    check_whole_model(r, c);
    return std::move(r.model);
}

}  // namespace firn
