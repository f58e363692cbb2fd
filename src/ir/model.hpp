// model: the resolved structure. Names are bound, units are gone (SI: N, m,
// rad), and every entity keeps the source range it came from, so later
// stages can still point at the line that caused a problem.
#pragma once

#include <array>
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "base/diag.hpp"
#include "base/units.hpp"
#include "ir/second_order_options.hpp"

namespace firn {

/// Typed indices into the Model's vectors; entities keep declaration order.
enum class NodeId : std::uint32_t {};
enum class MaterialId : std::uint32_t {};
enum class SectionId : std::uint32_t {};
enum class MemberId : std::uint32_t {};
enum class CaseId : std::uint32_t {};

template <typename Id>
constexpr std::size_t at(Id id) {
    return static_cast<std::size_t>(id);
}
template <typename Id>
constexpr Id make_id(std::size_t index) {
    return static_cast<Id>(static_cast<std::uint32_t>(index));
}

/// A named grid line: a column line (x = position) or a level (y = position).
struct GridLine {
    std::string name;
    double position = 0.0;
    SourceRange where;
};

struct Node {
    std::string name;
    double x = 0.0;
    double y = 0.0;
    SourceRange where;
};

struct Material {
    std::string name;
    double elastic_modulus = 0.0;  ///< E, Pa
    double unit_weight = 0.0;      ///< weight per volume, N/m^3 (0 when not given)
    SourceRange where;
};

struct Section {
    enum class Shape { given, rectangle, ishape };
    std::string name;
    MaterialId material{};
    Shape shape = Shape::given;
    double area = 0.0;     ///< A, m^2
    double inertia = 0.0;  ///< I about the bending axis, m^4
    SourceRange where;
};

struct Member {
    std::string name;
    NodeId start{};
    NodeId end{};
    SectionId section{};
    bool hinge_start = false;  ///< moment released where the member meets its start node
    bool hinge_end = false;
    SourceRange where;
};

/// Node degrees of freedom, in this order everywhere (ORDER DOF).
enum Dof : std::size_t { dof_x = 0, dof_y = 1, dof_rotation = 2 };

struct Restraint {
    enum class Kind { free, fixed, spring };
    Kind kind = Kind::free;
    double stiffness = 0.0;  ///< N/m for x and y, N*m/rad for rotation (springs only)
};

struct Support {
    enum class Kind { fixed, pinned, roller_free_x, roller_free_y, spring };
    NodeId node{};
    Kind kind = Kind::fixed;
    std::array<Restraint, 3> restraint;  ///< indexed by Dof
    SourceRange where;
};

/// Load directions. Global x and y are the model axes (y up); `down` is -y.
/// Local axial runs from start to end node; local transverse is axial turned
/// 90 degrees counterclockwise.
enum class LoadDirection { global_x, global_y, down, axial, transverse };

struct NodalLoad {
    NodeId node{};
    double fx = 0.0;  ///< N, global
    double fy = 0.0;
    double moment = 0.0;  ///< N*m, counterclockwise positive
    SourceRange where;
};

/// A distributed load varying linearly from w_start at `start` to w_end at `end`.
/// Positions are distances from the member's start node along the member,
/// except for projected loads, where positions and intensities refer to the
/// horizontal projection (as roof snow and roof live loads are given).
struct DistributedLoad {
    MemberId member{};
    LoadDirection direction = LoadDirection::down;
    bool projected = false;
    double start = 0.0;    ///< m
    double end = 0.0;      ///< m
    double w_start = 0.0;  ///< N/m
    double w_end = 0.0;
    SourceRange where;
};

/// A concentrated force on a member at `position` (m from the start node, along the member).
struct PointLoad {
    MemberId member{};
    LoadDirection direction = LoadDirection::down;
    double position = 0.0;
    double force = 0.0;  ///< N
    SourceRange where;
};

/// A concentrated moment on a member, counterclockwise positive.
struct PointMoment {
    MemberId member{};
    double position = 0.0;
    double moment = 0.0;  ///< N*m
    SourceRange where;
};

/// Self weight (unit weight x area, acting down) on the listed members, or on all.
struct SelfWeight {
    std::vector<MemberId> members;  ///< empty: every member
    bool all_members = true;
    SourceRange where;
};

enum class CaseKind { dead, live, roof_live, snow, rain, wind, other };

struct LoadCase {
    std::string name;
    CaseKind kind = CaseKind::other;
    /// The case this one is an arrangement of (its name), or empty: in a
    /// combination, a case and its arrangements are alternatives.
    std::string arrangement_of;
    /// Combined with dead load only (an ice dam): a combination that takes this
    /// case leaves its other variable loads out.
    bool with_dead_only = false;
    std::string description;  ///< what an arrangement loads, for the report
    std::vector<NodalLoad> nodal;
    std::vector<DistributedLoad> distributed;
    std::vector<PointLoad> points;
    std::vector<PointMoment> moments;
    std::vector<SelfWeight> self_weight;
    SourceRange where;
};

/// The values of a snow standard that its library module gives (stdlib/NAME.firn), in
/// SI, angles in radians, and the texts its trace cites. C++ holds the formulas.
struct SnowTables {
    double pf_factor = 0.0;                     ///< 0.7 of Eq. 7.3-1
    double pm_pg_limit = 0.0;                   ///< pg up to which pm = Is pg
    double pm_max_slope = 0.0;                  ///< pm applies to roofs flatter than this
    double Cs_knee[3][2] = {};                  ///< [warm, cold ventilated, cold][slippery, other]
    double Cs_zero_slope = 0.0;                 ///< Cs = 0 from this slope on
    double warm_slippery_R_unventilated = 0.0;  ///< insulation for the warm slippery curve
    double warm_slippery_R_ventilated = 0.0;
    double rain_pg_limit = 0.0;      ///< rain-on-snow applies for 0 < pg <= this
    double rain_surcharge = 0.0;     ///< Pa
    double rain_W_per_degree = 0.0;  ///< slope limit in degrees = W / this (m)
    double density_per_pg = 0.0;     ///< gamma = this x pg + base (1/m), at most max
    double density_base = 0.0;       ///< N/m^3
    double density_max = 0.0;
    double drift_coefficient =
        0.0;  ///< hd = c lu^(1/3) (pg + pg_offset)^(1/4) - offset, in ft and psf
    double drift_pg_offset = 0.0;  ///< Pa
    double drift_offset = 0.0;     ///< m
    double drift_min_lu = 0.0;     ///< m
    /// The module's switches, each choosing a kind of formula (the module says which).
    bool pg_per_risk_category = false;      ///< pg is given per risk category (pg_I .. pg_IV)
    bool importance_applies = true;         ///< pf = 0.7 Ce Ct Is pg (else no Is)
    bool pm_cap_per_risk_category = false;  ///< pm = pg, at most the category's cap (pm_pg_limit)
    bool Cs_curve_by_thermal = false;       ///< the Cs curve follows the thermal condition, not Ct
    bool drift_winter_wind = false;         ///< hd = c sqrt(pg^a lu^b W2^e / gamma) (ft, psf, pcf)
    double drift_pg_exponent = 0.0, drift_lu_exponent = 0.0, drift_W2_exponent = 0.0;
    bool drift_separate_windward = false;    ///< leeward and windward drifts are cases of their own
    double partial_gable_exempt_rise = 0.0;  ///< gable members this steep need no partial load
    double adjacent_max_gap = 0.0;     ///< m: a drift from an adjacent structure below this gap
    double projection_min_face = 0.0;  ///< m: no drift on a shorter side of a projection
    double unbalanced_min_rise = 0.0;  ///< rise per run from which unbalanced loads apply
    double unbalanced_max_rise = 0.0;
    double unbalanced_windward = 0.0;  ///< windward load / ps
    double unbalanced_narrow_W = 0.0;  ///< m: the simply supported rafter rule applies up to this
    double ice_dam_factor = 0.0;       ///< x pf on eave overhangs
    double ice_dam_R_unventilated = 0.0;
    double ice_dam_R_ventilated = 0.0;
    double sliding_factor = 0.0;  ///< sliding load per length of eave = this x pf x W
    double sliding_width = 0.0;   ///< m, over which it spreads on the lower roof
    double sliding_min_rise_slippery = 0.0;
    double sliding_min_rise_other = 0.0;
    /// The edition's name and chapter, as the trace cites them ("Snow data S: EDITION, CHAPTER").
    std::string edition, chapter;
    /// The clauses the trace cites, each with the edition's name before it.
    struct Clauses {
        std::string pg, pf, pm, slippery, ps, rain, ice_dam, partial, unbalanced, unbalanced_load,
            drift_height, density, step, adjacent, parapet, sliding;
        std::string pm_cap, Cs_curve;   ///< cited only by the kinds of formula that use them
        std::array<std::string, 3> Cs;  ///< per curve of the slope factor
    } clause;
    /// Clauses whose values were entered from memory: a citation that ends with one is
    /// marked for verification.
    std::vector<std::string> from_memory;
};

/// A factor of the snow provisions: its value and, when the user gave it
/// instead of the table, the reason they stated.
struct SnowFactor {
    double value = 0.0;
    std::string table;   ///< where the value comes from, as the library names it
    std::string reason;  ///< non-empty when overridden
    /// Read by the model from `table`, which the library names but does not hold.
    bool read_by_model = false;
};

/// The site's snow data (a `snow` statement): its cases are named NAME.balanced, ...
struct SnowSite {
    std::string name;
    std::string standard;  ///< the library module that gives the standard's tables
    double pg = 0.0;       ///< ground snow load, Pa
    std::string terrain, exposure, thermal, risk;
    SnowFactor Ce, Ct, Is;     ///< Is is 1 where the edition has no importance factor
    double W2 = 0.0;           ///< winter wind parameter, a fraction (0: not given)
    std::size_t Cs_curve = 0;  ///< the slope factor's curve: warm, cold ventilated, cold
    SnowTables tables;
    SourceRange where;
};

/// A roof surface (a `roof` statement): members in order along the roof.
struct Roof {
    std::string name;
    std::vector<MemberId> members;
    double tributary = 0.0;     ///< m: width of roof each member carries
    bool slippery = false;      ///< an unobstructed slippery surface
    double insulation_R = 0.0;  ///< thermal resistance, ft^2*h*F/Btu (0: not given)
    bool ventilated = false;
    bool simple_rafters = false;  ///< rafters are simply supported prismatic, ridge to eave
    std::string partial;          ///< the partial-loading rule (empty: the standard's; "none")
    SourceRange partial_where;
    /// What stands at one end of the roof: a higher roof (a step) or a parapet.
    struct Edge {
        double step = 0.0;          ///< m: the upper roof's edge above this roof (0: none)
        double upper_length = 0.0;  ///< m: the upper roof's length upwind of the step
        double parapet = 0.0;       ///< m: the parapet's height above this roof (0: none)
        std::string sliding_from;   ///< a higher roof whose snow may slide onto this end
        SourceRange sliding_where;
        /// A separate, higher structure beyond a gap (Sec. 7.7.2); 0: none.
        double adjacent = 0.0;         ///< m: its roof edge above this roof (h)
        double adjacent_gap = 0.0;     ///< m: the horizontal gap between the two (s)
        double adjacent_length = 0.0;  ///< m: its roof's length, upwind of the gap
    };
    Edge left, right;
    /// How the tributary width was found: given, or from the plan grid.
    struct Tributary {
        std::string frame;       ///< the plan line of this frame (empty: given)
        double left_bay = 0.0;   ///< m, 0 at an end frame
        double right_bay = 0.0;  ///< m
        double overhang = 0.0;   ///< m, beyond an end frame
    } tributary_from;
    SourceRange where;
};

/// A rooftop unit or penthouse standing on a roof (a `projection` statement),
/// seen in the frame's plane: where it stands, how wide and high it is, and
/// the length of its faces across the frame.
struct Projection {
    std::string name;
    std::size_t roof = 0;      ///< index into Model::roofs
    double left_face = 0.0;    ///< m: horizontally from the roof's left end to its left face
    double width = 0.0;        ///< m: in the frame's plane
    double face_length = 0.0;  ///< m: its faces' length across the frame
    double height = 0.0;       ///< m: above the roof
    SourceRange where;
};

/// A load combination rule of a set, as the standard lists it:
/// `3 = 1.2 D + 1.6 (Lr or S or R) + (L or 0.5 W)`.
struct CombinationRule {
    std::string label;
    struct Alternative {
        double factor = 1.0;
        std::string symbol;  ///< D, L, Lr, S, R or W; in a set by case, a case's name
        SourceRange where;   ///< the symbol as written
    };
    struct Term {
        std::vector<Alternative> alternatives;  ///< factors include the term's own
    };
    std::vector<Term> terms;
    bool half_live = false;  ///< L's factor 1.0 may be 0.5 here (where permitted)
    SourceRange where;
};

/// A named set of combination rules (`combinations NAME { ... }`).
struct CombinationSet {
    std::string name;
    /// `by case`: each symbol names a load case (declared or derived), which stands
    /// for itself and its arrangements, one at a time.
    bool by_case = false;
    std::vector<CombinationRule> rules;
    SourceRange where;
};

/// The sets a model is combined for (`combine ...`), and the 0.5 L permission.
struct CombineChoice {
    std::vector<std::size_t> sets;  ///< into Model::combination_sets
    bool half_live = false;
    std::string half_live_reason;
    /// `second_order = yes`: every combination of the chosen sets is solved on
    /// its own with second-order effects (see ir/second_order.hpp).
    bool second_order = false;
    SecondOrderOptions second_order_options;
    /// Warn when a combination's critical load factor is below this (0: never).
    double critical_factor_warning = 0.0;
    SourceRange where;
};

/// A rule of arrangements: each line gives the spans it selects one factor and
/// the others another (`ends: exterior = 1.0, others = 0.5`).
struct PatternRule {
    enum class Selector { exterior, adjacent_pair, each, all };
    struct Line {
        std::string label;
        Selector selector = Selector::all;
        double factor = 1.0;
        double others = 1.0;
    };
    std::string name;
    std::vector<Line> lines;
    SourceRange where;
};

/// `arrange CASE on MEMBERS by RULE`: the case's arrangements over the spans of a
/// run of members.
struct ArrangeRequest {
    CaseId load_case{};
    std::vector<MemberId> members;  ///< in order along the run
    std::size_t rule = 0;           ///< into Model::patterns
    SourceRange where;
};

/// A named set of members (`group`, `tag`), for the report's envelope tables.
struct MemberGroup {
    std::string name;
    std::vector<MemberId> members;
};

/// Deflection limits on members (`deflection MEMBERS limit ROW`): the ratios n
/// of the limits l/n a row gives for each kind of load; 0 where it gives none.
struct DeflectionLimits {
    std::string row;
    std::string source;  ///< where its numbers come from: the library's table, or the model
    std::vector<MemberId> members;
    double live = 0.0;       ///< L or Lr, each case alone
    double snow_wind = 0.0;  ///< S or W, each case alone
    double total = 0.0;      ///< D + L
    /// The table's footnotes: each snow or wind case of the S or W column is
    /// taken times these (the library's `TABLE.footnote.snow_factor`, ...).
    double snow_factor = 1.0, wind_factor = 1.0;
    SourceRange where;
};

/// A library value replaced by `amend`, for the trace.
struct Amendment {
    std::string name;
    double value = 0.0;  ///< SI
    Dimension dimension;
    std::string reason;
    SourceRange where;
};

/// A bound on a result (`expect`), checked by `firn check`.
struct Expectation {
    enum class Quantity {
        moment,
        shear,
        axial,
        deflection,
        reaction,
        displacement,
        rotation,
        snow
    };
    enum class Relation { at_most, at_least, equal, between };
    Quantity quantity = Quantity::moment;
    std::size_t component = 0;      ///< reaction, displacement: 0 x, 1 y, 2 moment (rotation)
    std::vector<MemberId> members;  ///< moment, shear, axial, deflection
    std::vector<NodeId> nodes;      ///< reaction, displacement, rotation
    std::string snow_value;         ///< snow: the value's name
    std::string source;             ///< `under`: a load case or a set; empty: the default
    SourceRange source_where;
    Relation relation = Relation::at_most;
    double low = 0.0, high = 0.0;  ///< SI; equal: both the value
    Dimension dimension;           ///< of the bounds
    double tolerance = 0.0;        ///< SI, or a fraction of the bound when relative
    bool tolerance_relative = false;
    bool tolerance_written = false;  ///< false: 0, or for `=` half the last digit written
    std::string subject;             ///< as the canonical text writes it: "moment of eave.BC"
    std::string bound_written;       ///< the bound and tolerance as written: "<= 4 m / 150"
    std::string reason;
    SourceRange where;  ///< the statement
};

/// The whole resolved model. Vectors keep declaration order.
/// A node that lies on a member's length and passes it without a connection
/// (`unjoined N5 on C1`), so the geometry checks let it be.
struct Unjoined {
    NodeId node{};
    MemberId member{};
    SourceRange where;  ///< the node's name in the statement
};

/// One line of the calculation package's cover (`cover { prepared_by = "..." }`).
struct CoverField {
    std::string key;    ///< as written: prepared_by
    std::string label;  ///< as printed: Prepared by
    std::string text;
};

struct Model {
    std::string title;
    std::vector<CoverField> cover;  ///< those given, in the order the report prints them
    std::string source_name;        ///< the model file as named on the command line
    DisplayUnits units;
    std::vector<GridLine> grid_x;      ///< column lines
    std::vector<GridLine> grid_y;      ///< levels
    std::vector<GridLine> plan_lines;  ///< the plan grid: the lines the frames stand on
    std::vector<Node> nodes;
    std::vector<Material> materials;
    std::vector<Section> sections;
    std::vector<Member> members;
    std::vector<Support> supports;
    /// m: places closer than this are one place to the geometry checks (a node on a
    /// member, two nodes, a member's length); `geometry tolerance` or the default.
    double geometry_tolerance = 0.0;
    std::vector<Unjoined> unjoined;
    std::vector<MemberGroup> groups;
    std::vector<LoadCase> cases;
    std::optional<SnowSite> snow;
    std::vector<Roof> roofs;
    std::vector<Projection> projections;
    std::vector<Amendment> amendments;
    std::vector<Expectation> expectations;
    std::vector<CombinationSet> combination_sets;
    std::optional<CombineChoice> combine;
    std::vector<PatternRule> patterns;
    std::vector<ArrangeRequest> arrangements;
    std::vector<DeflectionLimits> deflection_limits;
};

/// Length and direction cosines of a member (local x from start to end node).
struct MemberGeometry {
    double length = 0.0;
    double c = 1.0;  ///< cos of the angle from global x to local x
    double s = 0.0;  ///< sin of that angle
};
MemberGeometry member_geometry(const Model& model, MemberId member);

/// True if one member alone reaches node `n` and no support holds it: the free
/// end of a cantilever or an overhang.
bool is_free_end(const Model& model, NodeId n);

/// True if member `m` has an end that nothing else holds: no other member, no support.
bool is_cantilever(const Model& model, MemberId m);

/// Human words for enums, used by the report and in messages.
const char* case_kind_name(CaseKind kind);
const char* support_kind_name(Support::Kind kind);

}  // namespace firn
