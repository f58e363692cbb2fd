// resolve_internal: the state shared by the parts of the resolve stage
// (resolve.cpp for the structure, resolve_loads.cpp for load cases).
#pragma once

#include <optional>
#include <string>
#include <unordered_map>
#include <vector>

#include "diag.hpp"
#include "evaluate.hpp"
#include "model.hpp"
#include "syntax.hpp"

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

struct Resolver {
    explicit Resolver(Diagnostics& d) : diagnostics(d) {}

    Diagnostics& diagnostics;
    Model model;
    NameTable grid_lines{"grid line"};
    NameTable nodes{"node"};
    NameTable materials{"material"};
    NameTable sections{"section"};
    NameTable members{"member"};
    NameTable cases{"load case"};
    std::vector<char> node_used;               ///< per node: some member ends there
    std::vector<char> node_placed;             ///< per node: both coordinates known (no error)
    std::vector<char> member_valid;            ///< per member: nodes, section and length all good
    std::vector<char> member_section_known;    ///< per member: its section resolved
    std::vector<char> section_material_known;  ///< per section: its material resolved

    std::optional<double> value(const syntax::Expr& e, const Expected& expected) {
        return evaluate_as(e, expected, diagnostics);
    }
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

/// Resolves the `case` statements of the trees into model.cases.
void resolve_cases(Resolver& r, const std::vector<const syntax::CaseDecl*>& cases);

/// "12 ft" style text of a length in the model's display units, for messages.
std::string show_length(const Model& model, double metres);

}  // namespace firn::resolve_detail
