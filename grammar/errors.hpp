// Messages for the grammar's error points. src/front/parse_recovery.cpp adds what was found
// ("found 'x'") and a "did you mean" drawn from the keywords a message names.
#pragma once

#include "grammar/grammar.hpp"

namespace firn::grammar {

struct errors {
    // Only must<> raises; a rule failing inside sor<> or opt<> is not an error.
    template <typename Rule>
    static constexpr bool raise_on_failure = false;

    template <typename Rule>
    static constexpr const char* message = nullptr;
};

// clang-format off
#define FIRN_ERROR(rule, text) \
    template <> inline constexpr const char* errors::message<rule> = text;

FIRN_ERROR(unknown_statement, "expected a statement (model, use, let, report, grid, node, material, section, member, columns, beams, rafters, group, support, case, snow, roof, projection, amend, combinations, combine, pattern, arrange, deflection, expect, geometry, unjoined or cover)")
FIRN_ERROR(end_of_statement, "expected the end of the statement (a new line or ';')")
FIRN_ERROR(title, "expected the model title in double quotes, as in: model \"Frame on line 3\"")
FIRN_ERROR(one<'"'>, "expected '\"' to close the text on this line")
FIRN_ERROR(kw_units, "expected 'units', as in: report units kip, ft")
FIRN_ERROR(report_item, "expected a unit such as kip or ft, or 'displacement' and a unit")
FIRN_ERROR(grid_axis, "expected 'x' (column lines), 'y' (levels) or 'plan' (the plan lines of the frames) after 'grid'")
FIRN_ERROR(grid_line, "expected a grid line such as A = 0 ft")
FIRN_ERROR(equals, "expected '='")
FIRN_ERROR(expr, "expected a value such as 12 ft")
FIRN_ERROR(factor, "expected a number such as 12 ft, or '('")
FIRN_ERROR(product, "expected a number such as 12 ft, or '('")
FIRN_ERROR(paren_close, "expected ')' to close the '('")
FIRN_ERROR(node_name, "expected a node name")
FIRN_ERROR(kw_at, "expected 'at'")
FIRN_ERROR(coordinate, "expected a coordinate (x = 12 ft, y = 0 ft) or a grid line name")
FIRN_ERROR(material_name, "expected a material name")
FIRN_ERROR(property, "expected a property such as E = 29000 ksi")
FIRN_ERROR(property_list, "expected a property such as E = 29000 ksi")
FIRN_ERROR(section_name, "expected a section name")
FIRN_ERROR(section_material, "expected the name of the section's material")
FIRN_ERROR(comma, "expected ',' after the material name")
FIRN_ERROR(member_name, "expected a member name")
FIRN_ERROR(kw_from, "expected 'from' and the member's start node")
FIRN_ERROR(member_start, "expected the name of the member's start node")
FIRN_ERROR(kw_to, "expected 'to'")
FIRN_ERROR(member_end, "expected the name of the member's end node")
FIRN_ERROR(kw_section, "expected 'section' and a section name")
FIRN_ERROR(member_section, "expected a section name")
FIRN_ERROR(hinge_node, "expected the name of a node at an end of this member")
FIRN_ERROR(support_kind, "expected a support type (fixed, pinned, roller or spring)")
FIRN_ERROR(roller_axis, "expected 'x' or 'y', the direction the roller is free to move in")
FIRN_ERROR(support_node, "expected a node name")
FIRN_ERROR(spring_item, "expected a spring such as x = 200 kip/in, y = fixed or rotation = 5000 kip*ft/rad")
FIRN_ERROR(spring_value, "expected a stiffness such as 200 kip/in, or 'fixed'")
FIRN_ERROR(case_name, "expected a load case name")
FIRN_ERROR(case_kind, "expected the kind of load case (dead, live, roof live, snow, wind or other)")
FIRN_ERROR(kw_live, "expected 'live' after 'roof'")
FIRN_ERROR(block_open, "expected '{' to open the case's loads")
FIRN_ERROR(block_close, "expected '}' to close the case block")
FIRN_ERROR(unknown_load, "expected a load (uniform, linear, point, moment or self weight) or '}'")
FIRN_ERROR(load_value, "expected the load's value, such as 0.5 kip/ft or 2 kip")
FIRN_ERROR(load_end_value, "expected the value at the end of the loaded part, such as 0.5 kip/ft")
FIRN_ERROR(direction, "expected a direction (x, y, up, down, axial or transverse)")
FIRN_ERROR(spread_target, "expected 'on' and the members it loads")
FIRN_ERROR(point_target, "expected 'on' and members followed by 'at' and a distance, or 'at' and nodes")
FIRN_ERROR(member_list, "expected a member, a group or a pattern such as eave.*")
FIRN_ERROR(load_member, "expected a member, a group or a pattern such as eave.*")
FIRN_ERROR(node_list, "expected a node name")
FIRN_ERROR(load_node, "expected a node name")
FIRN_ERROR(load_from, "expected a distance along the member such as 4 ft")
FIRN_ERROR(load_to, "expected a distance along the member such as 8 ft")
FIRN_ERROR(load_at, "expected a distance along the member such as 4 ft")
FIRN_ERROR(kw_weight, "expected 'weight' after 'self'")

FIRN_ERROR(let_name, "expected a name for the value, as in: let bay = 24 ft")
FIRN_ERROR(let_value, "expected a value such as 12 ft")
FIRN_ERROR(use_target, "expected a library module such as materials, or a file in double quotes such as \"site.firn\"")
FIRN_ERROR(call_argument, "expected a value such as 12 ft")
FIRN_ERROR(run_last, "expected the last grid line of the run, as in: A..F")
FIRN_ERROR(kw_spacing, "expected 'spacing' and the distance between lines, as in: A..F spacing 24 ft")
FIRN_ERROR(run_spacing, "expected a spacing such as 24 ft")
FIRN_ERROR(run_start, "expected where the first line is, such as 0 ft")
FIRN_ERROR(grid_lines, "expected a grid line such as A = 0 ft, or a run such as A..F spacing 24 ft")
FIRN_ERROR(member_options, "expected 'section' and a section name")
FIRN_ERROR(tag_name, "expected a group name to tag the members with")
FIRN_ERROR(kw_on, "expected 'on' and column lines, as in: columns on A..D from base to roof")
FIRN_ERROR(kw_along, "expected 'along' and levels, as in: beams along roof from A to D")
FIRN_ERROR(line_ranges, "expected a grid line or a run of lines such as A..D")
FIRN_ERROR(line_range, "expected a grid line or a run of lines such as A..D")
FIRN_ERROR(range_last, "expected the last grid line of the run, as in: A..D")
FIRN_ERROR(level_span, "expected 'from' and 'to' with the lowest and highest level, as in: from base to roof")
FIRN_ERROR(line_span, "expected 'from' and 'to' with the first and last column line, as in: from A to D")
FIRN_ERROR(span_from, "expected a grid line name")
FIRN_ERROR(span_to, "expected a grid line name")
FIRN_ERROR(rafter_run, "expected a name for the run of rafters, as in: rafters gable from A.eave to C.ridge")
FIRN_ERROR(rafter_point, "expected a node or a grid intersection such as C.ridge")
FIRN_ERROR(rafter_next, "expected 'to' and the next point of the run, such as C.ridge")
FIRN_ERROR(group_name, "expected a group name")
FIRN_ERROR(group_member, "expected a member, a group or a pattern such as eave.*")

FIRN_ERROR(setting, "expected a setting such as pg = 40 psf")
FIRN_ERROR(reason, "expected the reason in double quotes, as in: because \"county amendment 12\"")
FIRN_ERROR(because, "expected 'because' and the reason in double quotes")
FIRN_ERROR(settings_block, "expected '{' to open the settings")
FIRN_ERROR(snow_name, "expected a name for the snow cases, as in: snow S {")
FIRN_ERROR(roof_name, "expected a roof name, as in: roof main on eave.* {")
FIRN_ERROR(roof_on, "expected 'on' and the roof's members, as in: roof main on eave.* {")
FIRN_ERROR(roof_members, "expected the roof's members, a group or a pattern such as eave.*")
FIRN_ERROR(roof_member, "expected a member, a group or a pattern such as eave.*")
FIRN_ERROR(projection_name, "expected a name for the projection, as in: projection unit on main {")
FIRN_ERROR(projection_on, "expected 'on' and the roof it stands on, as in: projection unit on main {")
FIRN_ERROR(projection_roof, "expected the name of the roof the projection stands on")
FIRN_ERROR(amend_name, "expected the name of the library value to amend")

FIRN_ERROR(combinations_name, "expected a name for the set of combinations, as in: combinations strength {")
FIRN_ERROR(combinations_open, "expected '{' to open the combinations")
FIRN_ERROR(combination_term, "expected a factor and a load symbol, such as 1.6 L, or alternatives such as 0.5 (Lr or S)")
FIRN_ERROR(combination_alternative, "expected a load symbol such as S, optionally with a factor, as in: 0.5 W")
FIRN_ERROR(alternatives_close, "expected 'or' and another load symbol, or ')' to close the alternatives")
FIRN_ERROR(half_live_label, "expected the label of a combination, as in: half_live_in = 3, 4")
FIRN_ERROR(combine_set, "expected the name of a set of combinations, as in: combine asce7_16.strength")
FIRN_ERROR(pattern_name, "expected a name for the rule, as in: pattern alternate {")
FIRN_ERROR(pattern_open, "expected '{' to open the rule's arrangements")
FIRN_ERROR(pattern_colon, "expected ':' after the arrangement's name, as in: ends: exterior = 1.0, others = 0.5")
FIRN_ERROR(pattern_part, "expected a selector and its factor, such as exterior = 1.0")
FIRN_ERROR(pattern_factor, "expected the factor on the load, a number such as 0.5")
FIRN_ERROR(arrange_case, "expected the load case to arrange, as in: arrange L on floor.* by alternate")
FIRN_ERROR(arrange_on, "expected 'on' and the members the arrangements run over")
FIRN_ERROR(arrange_member, "expected a member, a group or a pattern such as floor.*")
FIRN_ERROR(arrange_by, "expected 'by' and the name of a pattern rule")
FIRN_ERROR(arrange_rule, "expected the name of a pattern rule")
FIRN_ERROR(deflection_member, "expected a member, a group or a pattern such as eave.*")
FIRN_ERROR(deflection_limit, "expected 'limit' and a row of limits, as in: deflection eave.* limit ibc2018.roof_no_ceiling")
FIRN_ERROR(deflection_row, "expected a row of deflection limits such as ibc2018.roof_no_ceiling")
FIRN_ERROR(expect_subject, "expected what to check: moment, shear, axial or deflection of members, reaction or displacement at nodes, rotation at nodes, or a snow value, as in: expect moment of eave.BC <= 45 kip*ft")
FIRN_ERROR(expect_of, "expected 'of' and the members, as in: moment of eave.BC")
FIRN_ERROR(expect_member, "expected a member, a group or a pattern such as eave.*")
FIRN_ERROR(expect_at, "expected 'at' and the nodes, as in: reaction y at base.A")
FIRN_ERROR(expect_node, "expected a node's name")
FIRN_ERROR(expect_reaction_component, "expected the reaction's component: x, y or moment")
FIRN_ERROR(expect_displacement_component, "expected the displacement's direction: x or y (or write rotation at NODE)")
FIRN_ERROR(expect_snow_value, "expected a derived snow value such as pf, main.ps or drift.main.step_left.hd")
FIRN_ERROR(expect_source, "expected a load case or a set of combinations after 'under'")
FIRN_ERROR(expect_bound, "expected the bound: <= value, >= value, = value, or between low and high")
FIRN_ERROR(expect_value, "expected a value such as 45 kip*ft")
FIRN_ERROR(expect_and, "expected 'and' and the upper bound, as in: between -60 kip*ft and 45 kip*ft")
FIRN_ERROR(expect_high, "expected the upper bound, a value such as 45 kip*ft")
FIRN_ERROR(expect_tolerance, "expected the tolerance, a value such as 0.5 kip*ft or a percentage such as 2 %")
FIRN_ERROR(kw_tolerance, "expected 'tolerance' and a length, as in: geometry tolerance 2 mm")
FIRN_ERROR(geometry_tolerance_value, "expected the tolerance, a length such as 2 mm")
FIRN_ERROR(unjoined_node, "expected the name of the node that passes the members, as in: unjoined N5 on C1")
FIRN_ERROR(unjoined_on, "expected 'on' and the members the node passes without a connection, as in: unjoined N5 on C1")
FIRN_ERROR(unjoined_member, "expected a member, a group or a pattern such as brace.*")
FIRN_ERROR(cover_text, "expected the text in double quotes, as in: project = \"Seed store\"")

#undef FIRN_ERROR
// clang-format on

template <typename Rule>
using control = must_if<errors, normal, false>::control<Rule>;

}  // namespace firn::grammar
