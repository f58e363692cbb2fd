// resolve_internal: the state shared by the parts of the resolve stage
// (resolve.cpp for the structure, resolve_loads.cpp for load cases).
#pragma once

#include <cmath>
#include <map>
#include <optional>
#include <string>
#include <unordered_map>
#include <vector>

#include "base/diag.hpp"
#include "ir/model.hpp"
#include "ir/syntax.hpp"
#include "resolve/evaluate.hpp"

namespace firn::resolve_detail {

/// Names of one kind of entity, with where each was defined.
class NameTable {
  public:
    explicit NameTable(const char* what) : what_(what) {}
    /// Adds `name`; reports a duplicate (with a note at the first definition)
    /// and returns false if the name is taken.
    bool add(const syntax::Name& name, Diagnostics& diagnostics);
    /// The index of `name`, or nullopt after reporting "unknown node 'X'; did you mean ...".
    std::optional<std::size_t> find(const syntax::Name& name, Diagnostics& diagnostics) const;
    std::optional<std::size_t> find_quietly(const std::string& name) const;
    std::size_t size() const { return names_.size(); }
    const std::vector<std::string>& names() const { return names_; }
    SourceRange where(std::size_t i) const { return where_[i]; }

  private:
    const char* what_;
    std::unordered_map<std::string, std::size_t> index_;
    std::vector<std::string> names_;
    std::vector<SourceRange> where_;
};

/// Beyond these sizes a model is surely a typing slip, and arithmetic on it
/// could overflow; refusing them keeps every later number finite.
inline constexpr double kMaxCoordinate = 1e5;  // m: a frame within 100 km of its origin
inline constexpr double kMaxMagnitude = 1e15;  // any other SI value

/// The model's `let` values, evaluated when first used, so their order in the
/// files does not matter; a value defined by itself is reported with its chain.
class Constants : public Scope {
  public:
    void add(const syntax::LetDecl& decl, Diagnostics& diagnostics);
    /// Replaces the value of a `let` (a library value, typically) by an `amend`.
    void amend(const syntax::AmendDecl& decl, Diagnostics& diagnostics);
    std::optional<Quantity> constant(const syntax::Expr& ref, Diagnostics& diagnostics) override;
    /// True if `decl` is the amendment in force for its value.
    bool applies(const syntax::AmendDecl& decl) const {
        auto i = names_.find_quietly(decl.name.text);
        return i && entries_[*i].amended == &decl;
    }
    bool has(const std::string& name) const { return names_.find_quietly(name).has_value(); }
    /// The value named `name`, or nullopt if there is none (or it has an error, or
    /// it is a text, which is reported).
    std::optional<Quantity> lookup(const std::string& name, Diagnostics& diagnostics);
    /// The names of the texts whose name ends with `suffix`, in declaration order.
    std::vector<std::string> texts_ending(std::string_view suffix) const;
    /// The text a `let` gives `name` (`let NAME.edition = "..."`), if it is one.
    std::optional<std::string> text(const std::string& name) const;
    /// Evaluates every value, so an unused value's error is reported too.
    void evaluate_all(Diagnostics& diagnostics);

  private:
    struct Entry {
        const syntax::LetDecl* decl;
        const syntax::AmendDecl* amended = nullptr;
        enum class State { waiting, evaluating, done } state = State::waiting;
        std::optional<Quantity> value;
    };
    std::optional<Quantity> value_of(Entry& entry, Diagnostics& diagnostics);
    std::string siblings(const std::string& name) const;
    std::optional<Quantity> amended_value(const Entry& entry, std::optional<Quantity> original,
                                          Diagnostics& diagnostics);
    NameTable names_{"value"};
    std::vector<Entry> entries_;
    std::vector<std::string> evaluating_;  ///< the chain being evaluated, for cycle messages
};

/// A grid line: which axis and where.
struct GridRef {
    syntax::Axis axis;
    double position;
    bool valid;  ///< false if its position had an error (already reported)
};

struct Resolver {
    explicit Resolver(Diagnostics& d) : diagnostics(d) {}

    Diagnostics& diagnostics;
    Constants constants;
    std::vector<GridRef> grid;  ///< parallel to the grid_lines table
    Model model;
    NameTable grid_lines{"grid line"};
    NameTable nodes{"node"};
    NameTable materials{"material"};
    NameTable sections{"section"};
    NameTable members{"member"};
    NameTable cases{"load case"};
    NameTable groups{"group"};
    NameTable plan_lines{"plan line"};
    /// A group: its statement (none for a group made only by tags) and members.
    struct Group {
        const syntax::GroupDecl* decl = nullptr;
        std::vector<MemberId> members;
        enum class State { waiting, expanding, done } state = State::waiting;
    };
    std::vector<Group> group_entries;                           ///< parallel to `groups`
    std::vector<std::pair<syntax::Name, MemberId>> tagged;      ///< `tag` clauses, for groups
    std::unordered_map<std::string, NodeId> node_aliases;       ///< intersections at declared nodes
    std::map<std::pair<long long, long long>, NodeId> node_at;  ///< nodes by place (micrometres)
    /// What resolving found of each node, member and section, one entry per entity in
    /// step with the model's vectors (pushed where the entity is), so later statements skip
    /// the entities whose errors were already reported.
    struct NodeStatus {
        bool placed = false;  ///< both coordinates known (no error)
        bool used = false;    ///< some member ends there
    };
    struct MemberStatus {
        bool valid = false;          ///< nodes, section and length all good
        bool section_known = false;  ///< its section resolved
    };
    struct SectionStatus {
        bool material_known = false;  ///< its material resolved
    };
    std::vector<NodeStatus> node_status;
    std::vector<MemberStatus> member_status;
    std::vector<SectionStatus> section_status;

    /// A member statement made fewer members than it asked for because of an
    /// error (an unknown line, say); references that then name no member are not
    /// reported, as they may name the members that are missing.
    bool members_missing = false;
    /// The groups being expanded, outermost first, for "contains itself" messages.
    std::vector<std::string> expanding_groups;

    std::optional<double> value(const syntax::Expr& e, const Expected& expected) {
        return evaluate_as(e, expected, diagnostics, &constants);
    }
    /// A node by name: a declared node, or the intersection of a column line and
    /// a level (`A.eave`), which is created when first named. Reports unknown names.
    std::optional<NodeId> find_node(const syntax::Name& name);
    /// The node at (x, y), adding one named `name` if there is none there.
    NodeId node_at_place(const std::string& name, double x, double y, SourceRange where);
    /// The members a reference names: a member, a group, or a pattern with '*'.
    /// Reports a reference that names nothing.
    std::optional<std::vector<MemberId>> find_members(const syntax::Name& ref);
    /// True if |v| <= limit; reports "... is out of range" otherwise.
    bool within(const syntax::Expr& e, double v, double limit, const char* what);
    template <typename Id>
    std::optional<Id> lookup(NameTable& table, const syntax::Name& name) {
        auto i = table.find(name, diagnostics);
        if (!i)
            return std::nullopt;
        return make_id<Id>(*i);
    }
};

/// "column line" or "level", for messages.
const char* axis_noun(syntax::Axis axis);

/// The names of the grid lines along one axis, for "did you mean".
std::vector<std::string> line_names(const Resolver& r, syntax::Axis axis);

/// m: a point this close to a grid line lies on it.
inline constexpr double kOnLine = 1e-6;

/// Key of a place in the node_at map.
inline std::pair<long long, long long> place_key(double x, double y) {
    // Coordinates are bounded, so rounding to micrometres cannot overflow.
    return {std::llround(x * 1e6), std::llround(y * 1e6)};
}

/// Reads the grid statements into r.model.grid_x, grid_y and r.grid.
void resolve_grids(Resolver& r, const std::vector<const syntax::Grid*>& grids);

/// Creates the members of member, columns, beams and rafters statements, in order.
void resolve_member_statements(Resolver& r, const std::vector<const syntax::Statement*>& stmts);

/// Reads group statements (after every member exists).
void resolve_groups(Resolver& r, const std::vector<const syntax::GroupDecl*>& groups);

/// Reads the `snow`, `roof` and `amend` statements into r.model.
/// How messages about a run of members name its owner and its rule.
struct RunWords {
    const char* owner;      ///< "roof"
    const char* one_run;    ///< "a roof is one run of members from eave to eave"
    const char* connected;  ///< "a roof is one connected surface"
};

/// `members` in order along one connected, unbranched run from its leftmost
/// free end; nullopt after an error located at `owner`, or quietly when a
/// member has an error of its own.
std::optional<std::vector<MemberId>> member_run(Resolver& r, const syntax::Name& owner,
                                                const RunWords& words,
                                                const std::vector<MemberId>& members);

/// Combination sets, the sets chosen, pattern rules and arrange requests.
void resolve_combinations(Resolver& r, const std::vector<const syntax::CombinationsDecl*>& sets,
                          const std::vector<const syntax::CombineDecl*>& choices,
                          const std::vector<const syntax::PatternDecl*>& patterns,
                          const std::vector<const syntax::ArrangeDecl*>& arrangements);

/// `deflection MEMBERS limit ROW`: the row's limits from the library.
/// The footnote factors of each deflection row's table (snow and wind in the S or W column).
void read_deflection_footnotes(Resolver& r);
/// Refuses a combination set or deflection row of another edition than the snow data's.
void check_one_edition(Resolver& r);

/// Whether `key` is a second-order setting of `combine` (resolve_second_order.cpp).
bool is_second_order_setting(const std::string& key);
/// Reads the second-order settings of the combine statement into `choice`;
/// false after an error (reported).
bool resolve_second_order_settings(Resolver& r, const syntax::CombineDecl& decl,
                                   CombineChoice& choice);

void resolve_deflection_limits(Resolver& r,
                               const std::vector<const syntax::DeflectionDecl*>& decls);

/// The members a statement lists, each once, in order; nullopt if one is unknown (reported).
std::optional<std::vector<MemberId>> listed_members(Resolver& r,
                                                    const std::vector<syntax::Name>& refs);

/// `expect` statements (`where`: each one's statement).
void resolve_expectations(Resolver& r, const std::vector<const syntax::ExpectDecl*>& decls,
                          const std::vector<SourceRange>& where);

void resolve_snow(Resolver& r, const std::vector<const syntax::SnowDecl*>& snow,
                  const std::vector<const syntax::RoofDecl*>& roofs,
                  const std::vector<const syntax::RoofDecl*>& projections,
                  const std::vector<const syntax::AmendDecl*>& amends,
                  const std::vector<const syntax::Statement*>& snow_statements);

/// Warns of a ground snow load (Pa) beyond any site's: a unit slip (resolve_snow_checks.cpp).
void warn_implausible_ground_snow(Resolver& r, const SourceRange& where, double pg);

/// Refuses a roof member so steep that the roof rules give it no snow: a wall.
void check_roof_slopes(Resolver& r, const syntax::RoofDecl& decl, const Roof& roof);

/// Registers the `amend` statements with the values they replace.
void resolve_amendments(Resolver& r, const std::vector<const syntax::AmendDecl*>& amends);

/// Resolves the `case` statements of the trees into model.cases.
void resolve_cases(Resolver& r, const std::vector<const syntax::CaseDecl*>& cases);

/// The library modules in use that give snow provisions: those that name their
/// snow chapter (`let NAME.snow_chapter = "..."`), in the order they were declared.
std::vector<std::string> loaded_standards(const Resolver& r);

/// A standard's name for the examples in messages: the first in use, or a placeholder.
std::string example_standard(const Resolver& r);

/// The geometry checks, once every member and support exists: the tolerance
/// (`geometry tolerance`, or the default), nodes on members' lengths (unless
/// `unjoined`), repeated and overlapping members, near nodes, members within the
/// tolerance, and parts of the frame that share no node (resolve_geometry.cpp).
void check_geometry(Resolver& r, const syntax::GeometryTolerance* tolerance,
                    const std::vector<const syntax::UnjoinedDecl*>& unjoined);

/// The `cover` statements, of any file the model uses, as one cover: each field once
/// (resolve_cover.cpp).
void resolve_cover(Resolver& r, const std::vector<const syntax::CoverDecl*>& covers);

/// "12 ft" style text of a length in the model's display units, for messages.
std::string show_length(const Model& model, double metres);

}  // namespace firn::resolve_detail
