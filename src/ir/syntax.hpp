// syntax: the tree `parse` builds, a faithful record of what the user wrote.
// Names are unresolved and numbers carry their unit spelling; `resolve` gives
// them meaning. Every node keeps its source range.
#pragma once

#include <array>
#include <cstdint>
#include <memory>
#include <optional>
#include <string>
#include <variant>
#include <vector>

#include "base/diag.hpp"

namespace firn::syntax {

/// The functions an expression may call, for messages and editor support.
inline constexpr std::array<const char*, 4> functions{"abs", "max", "min", "sqrt"};

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

/// An arithmetic expression whose leaves are numbers with optional units and
/// names of constants.
struct Expr {
    enum class Kind {
        number,
        constant,  ///< a named constant (`let`); `literal` holds the name
        call,      ///< min, max, abs, sqrt; `literal` holds the function, `args` the arguments
        negate,
        add,
        subtract,
        multiply,
        divide,
        power,
        group
    };
    Kind kind = Kind::number;
    std::string literal;             ///< the number, constant or function as written
    double value = 0.0;              ///< the literal's value (kind == number)
    std::vector<UnitFactor> unit;    ///< the unit written after the number, if any
    std::optional<Name> bad_unit;    ///< a word after the number that is no unit
    std::unique_ptr<Expr> lhs, rhs;  ///< operands (rhs only for negate and group)
    std::vector<Expr> args;          ///< arguments of a call
    std::uint32_t depth = 1;         ///< levels of the tree below and including this one
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

/// `grid x A = 0 ft, B = 24 ft`, or a run of lines named in sequence:
/// `grid x A..F spacing 24 ft` (`from 10 ft` sets the first line's place).
struct Grid {
    struct Line {
        Name name;
        Expr at;
    };
    struct Run {
        Name first;
        Name last;
        std::vector<Expr> spacings;  ///< one for every bay, or one for all
        std::optional<Expr> start;   ///< where the first line is; 0 when not given
    };
    Axis axis = Axis::x;
    bool plan = false;  ///< `grid plan`: the plan lines the frames stand on (axis unused)
    std::vector<Line> lines;
    std::optional<Run> run;
};

/// `let bay = 24 ft`, or a text: `let NAME.edition = "..."`
struct LetDecl {
    Name name;
    Expr value;                       ///< unless the value is a text
    std::optional<std::string> text;  ///< the text, unquoted
    SourceRange text_where;           ///< the text as written, quotes included
};

/// `use materials` (a module of the standard library) or `use "site.firn"`
/// (a file, relative to the file that uses it); `use outside "../x.firn"`
/// allows a file outside the model's folder.
struct UseDecl {
    std::optional<Name> module;
    std::string path;  ///< the file, when no module is named
    SourceRange path_where;
    bool outside = false;
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

/// What every member statement ends with: `section girder hinge at N2 tag roof`.
struct MemberOptions {
    Name section;
    std::vector<Name> hinges;
    std::vector<Name> tags;  ///< groups the members join
};

/// `member B1 from N2 to N3 section girder hinge at N2`
struct MemberDecl {
    Name name;
    Name start;
    Name end;
    MemberOptions options;
};

/// A grid line, or a run of lines in position order: `A`, `A..D`.
struct LineRange {
    Name first;
    std::optional<Name> last;
};

/// `columns on A, C..E from base to roof section post`: one member between each
/// pair of adjacent levels on every line, named `A.base.floor`.
struct ColumnsDecl {
    std::vector<LineRange> lines;
    Name from;  ///< lowest level
    Name to;    ///< highest level
    MemberOptions options;
};

/// `beams along floor, roof from A to D section girder`: one member between each
/// pair of adjacent column lines on every level, named `floor.A.B`.
struct BeamsDecl {
    std::vector<LineRange> levels;
    Name from;
    Name to;
    MemberOptions options;
};

/// `rafters gable from A.eave to C.ridge to E.eave section rafter`: a sloped run
/// through the points, split at every column line it crosses; members are named
/// `gable.A.B`, and the nodes where it crosses a line `B.gable`.
struct RaftersDecl {
    Name run;
    std::vector<Name> points;
    MemberOptions options;
};

/// `group roof = eave.*, R1`
struct GroupDecl {
    Name name;
    std::vector<Name> members;  ///< names, group names and patterns with '*'
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
    bool on_members = true;        ///< `on MEMBERS` (true) or `at NODES` (false)
    std::vector<Name> targets;     ///< nodes, or members, groups and patterns with '*'
    std::optional<Expr> from, to;  ///< part of a member
    std::optional<Expr> at;        ///< point and moment on a member
};

/// `case D dead { ... }`
struct CaseDecl {
    enum class Kind { dead, live, roof_live, snow, rain, wind, other };
    Name name;
    Kind kind = Kind::other;
    std::vector<LoadDecl> loads;
    std::vector<SourceRange> load_where;  ///< parallel to `loads`
};

/// `key = value` in a snow or roof block, optionally `because "reason"`: a
/// quantity, or a word for an enumerated choice (`terrain = C`).
struct Setting {
    Name key;
    Expr value;
    std::optional<std::string> reason;
    SourceRange reason_where;
};

/// `snow S { pg = 40 psf ... }`: the site's snow data; its cases are named S.*.
struct SnowDecl {
    Name name;
    std::vector<Setting> settings;
};

/// `roof main on eave.* { tributary = 20 ft ... }`, or a projection standing on
/// a roof, `projection unit on main { left_face = 30 ft ... }` (its one member
/// name is the roof's name).
struct RoofDecl {
    bool projection = false;
    Name name;
    std::vector<Name> members;
    std::vector<Setting> settings;
};

/// `amend lib.pm.cap = 30 psf because "county amendment 4"`
struct AmendDecl {
    Name name;
    Expr value;
    std::string reason;
    SourceRange reason_where;
};

/// A factor as written (`1.6`): its value, and its text for the formatter.
struct Factor {
    double value = 1.0;
    SourceRange where;  ///< empty (begin == end) where no factor is written
};

/// `1.6 (Lr or S or R)`: a factor on one load symbol, or on one of several.
struct CombinationTerm {
    Factor factor;
    struct Alternative {
        Factor factor;
        Name symbol;
    };
    std::vector<Alternative> alternatives;  ///< one for a plain `1.6 L`
};

/// `3 = 1.2 D + 1.6 (Lr or S or R) + (L or 0.5 W)`
struct CombinationLine {
    Name label;
    std::vector<CombinationTerm> terms;
    SourceRange where;
};

/// `combinations lib.strength { ... }`: a set of load combinations.
struct CombinationsDecl {
    Name name;
    bool by_case = false;  ///< `by case`: the symbols name load cases
    std::vector<CombinationLine> lines;
    std::vector<Name> half_live_in;       ///< labels where L's 1.0 may be 0.5
    std::vector<SourceRange> line_where;  ///< every line of the block, for the formatter
};

/// `combine lib.strength { half_live = yes because "..." }`
struct CombineDecl {
    std::vector<Name> sets;
    std::vector<Setting> settings;
};

/// `pattern alternate { odd: each = 1.0, others = 0 }`: arrangements of a load over spans.
struct PatternDecl {
    Name name;
    struct Part {
        Name selector;
        Factor factor;
    };
    struct Line {
        Name label;
        std::vector<Part> parts;
        SourceRange where;
    };
    std::vector<Line> lines;
};

/// `arrange L on floor.* by alternate`
struct ArrangeDecl {
    Name load_case;
    std::vector<Name> members;
    Name rule;
};

/// `deflection eave.* limit MODULE.ROW` (a row of l/n ratios from a library module)
struct DeflectionDecl {
    std::vector<Name> members;
    Name row;
};

/// `expect moment of eave.BC under lib.strength between -60 kip*ft and 45 kip*ft`:
/// a bound on a result, checked by `firn check`.
struct ExpectDecl {
    Name quantity;               ///< moment, shear, axial, deflection, reaction, displacement,
                                 ///< rotation or snow
    Name component;              ///< x, y or moment for a reaction; x or y for a displacement
    std::vector<Name> places;    ///< the members or nodes; for snow, the value's name
    std::optional<Name> source;  ///< `under CASE-OR-SET`
    std::string relation;        ///< "<=", ">=", "=" or "between"
    SourceRange relation_where;
    Expr value;                ///< the bound (the lower one of `between`)
    std::optional<Expr> high;  ///< the upper bound of `between`
    std::optional<Expr> tolerance;
    bool tolerance_percent = false;  ///< `within 2 %`: `tolerance` is the number of percent
    std::optional<std::string> reason;
    SourceRange reason_where;
};

/// `geometry tolerance 2 mm`: how close two places must be to count as one
/// (a node on a member, two nodes, a member's length).
struct GeometryTolerance {
    Expr value;
};

/// `unjoined N5 on C1, C2`: nodes that lie on the members' length but pass
/// them without a connection (a brace crossing a column in another plane).
struct UnjoinedDecl {
    std::vector<Name> nodes;
    std::vector<Name> members;  ///< names, group names and patterns with '*'
};

/// `cover { project = "..." ... }`: the texts of the calculation package's cover.
struct CoverDecl {
    Name keyword;  ///< `cover` itself: the formatter lays the block out after it
    struct Field {
        Name key;
        std::string text;
        SourceRange text_where;
    };
    std::vector<Field> fields;
};

/// One statement of a model file and the source range it covers.
struct Statement {
    std::variant<ModelTitle, ReportUnits, Grid, LetDecl, UseDecl, NodeDecl, MaterialDecl,
                 SectionDecl, MemberDecl, ColumnsDecl, BeamsDecl, RaftersDecl, GroupDecl,
                 SupportDecl, CaseDecl, SnowDecl, RoofDecl, AmendDecl, CombinationsDecl,
                 CombineDecl, PatternDecl, ArrangeDecl, DeflectionDecl, ExpectDecl,
                 GeometryTolerance, UnjoinedDecl, CoverDecl>
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
