// syntax: the tree `parse` builds, a faithful record of what the user wrote.
// Names are unresolved and numbers carry their unit spelling; `resolve` gives
// them meaning. Every node keeps its source range.
#pragma once

#include <memory>
#include <optional>
#include <string>
#include <variant>
#include <vector>

#include "diag.hpp"

namespace firn::syntax {

/// A name as written (a node, member, grid line, property key, ...).
struct Name {
    std::string text;
    SourceRange where;
};

/// One factor of a unit: `kip`, `in^4` (written `in4` too), `ft^-1`.
struct UnitFactor {
    std::string name;
    int exponent = 1;
    bool divides = false;  ///< written after '/'
    SourceRange where;
};

/// An arithmetic expression whose leaves are numbers with optional units.
struct Expr {
    enum class Kind { number, negate, add, subtract, multiply, divide, group };
    Kind kind = Kind::number;
    std::string literal;             ///< the number as written (kind == number)
    double value = 0.0;              ///< the literal's value (kind == number)
    std::vector<UnitFactor> unit;    ///< the unit written after the number, if any
    std::optional<Name> bad_unit;    ///< a word after the number that is no unit
    std::unique_ptr<Expr> lhs, rhs;  ///< operands (rhs only for negate and group)
    SourceRange where;
};

/// `key = value`, as in `E = 29000 ksi`.
struct Property {
    Name key;
    Expr value;
};

/// `model "title"`
struct ModelTitle {
    std::string title;
};

/// `report units kip, ft, displacement in`
struct ReportUnits {
    struct Item {
        std::optional<Name> role;  ///< "displacement", or none: the unit's dimension says
        std::vector<UnitFactor> unit;
        SourceRange where;
    };
    std::vector<Item> items;
};

enum class Axis { x, y };

/// `grid x A = 0 ft, B = 24 ft`
struct Grid {
    struct Line {
        Name name;
        Expr at;
    };
    Axis axis = Axis::x;
    std::vector<Line> lines;
};

/// `node N1 at x = 0 ft, y = 12 ft` or `node N2 at A, eave`
struct NodeDecl {
    struct Coordinate {
        std::optional<Axis> axis;  ///< set for `x = expr` / `y = expr`
        std::optional<Expr> value;
        std::optional<Name> grid_line;  ///< set for a bare grid line name
        SourceRange where;
    };
    Name name;
    std::vector<Coordinate> coordinates;
};

/// `material steel E = 29000 ksi, density = 490 pcf`
struct MaterialDecl {
    Name name;
    std::vector<Property> properties;
};

/// `section post steel, A = 9.12 in2, I = 110 in4` (or `rectangle ...`, `ishape ...`)
struct SectionDecl {
    enum class Shape { given, rectangle, ishape };
    Name name;
    Name material;
    Shape shape = Shape::given;
    SourceRange shape_where;
    std::vector<Property> properties;
};

/// `member B1 from N2 to N3 section girder hinge at N2`
struct MemberDecl {
    Name name;
    Name start;
    Name end;
    Name section;
    std::vector<Name> hinges;
};

/// `support fixed at N1, N4`, `support roller free y at N3`,
/// `support spring at N5 x = fixed, y = 120 kip/in`
struct SupportDecl {
    enum class Kind { fixed, pinned, roller, spring };
    Kind kind = Kind::fixed;
    Axis roller_free = Axis::x;
    std::vector<Name> nodes;
    struct Spring {
        Name direction;                 ///< x, y or rotation
        std::optional<Expr> stiffness;  ///< none when written `= fixed`
    };
    std::vector<Spring> springs;
};

/// Where a load acts and how it is written; see grammar/REFERENCE.md.
struct LoadDecl {
    enum class Form { uniform, linear, point, moment, self_weight };
    enum class Direction { none, x, y, up, down, axial, transverse };
    Form form = Form::uniform;
    std::optional<Expr> value;      ///< intensity, force or moment (start value for linear)
    std::optional<Expr> end_value;  ///< linear: the value at the end of the loaded part
    Direction direction = Direction::none;
    SourceRange direction_where;
    bool projected = false;
    bool clockwise = false;
    bool on_members = true;  ///< `on MEMBERS` (true) or `at NODES` (false)
    std::vector<Name> targets;
    std::optional<Expr> from, to;  ///< part of a member
    std::optional<Expr> at;        ///< point and moment on a member
};

/// `case D dead { ... }`
struct CaseDecl {
    enum class Kind { dead, live, roof_live, snow, wind, other };
    Name name;
    Kind kind = Kind::other;
    std::vector<LoadDecl> loads;
    std::vector<SourceRange> load_where;  ///< parallel to `loads`
};

/// One statement of a model file and the source range it covers.
struct Statement {
    std::variant<ModelTitle, ReportUnits, Grid, NodeDecl, MaterialDecl, SectionDecl, MemberDecl,
                 SupportDecl, CaseDecl>
        node;
    SourceRange where;
};

/// A comment (`# ...`), kept for the formatter.
struct Comment {
    std::string text;
    SourceRange where;
};

/// The parse of one file: its statements in source order, and its comments.
struct Tree {
    FileId file = 0;
    std::vector<Statement> statements;
    std::vector<Comment> comments;
};

}  // namespace firn::syntax
