// The firn grammar: PEGTL rules only (actions live in src/front/parse_*, messages in
// grammar/errors.hpp). Each rule carries its production as a comment. Only
// src/front/ and the grammar tests include this header.
//
// Statements end at a line break or ';'. A line may break after ',', after an
// operator and inside parentheses. '#' starts a comment that runs to the end of
// the line. See grammar/REFERENCE.md for the language as a user reads it.
#pragma once

#include <cstddef>
#include <string_view>
#include <tao/pegtl.hpp>
#include <tao/pegtl/contrib/analyze_traits.hpp>
#include <type_traits>

#include "base/units.hpp"
#include "grammar/keywords.hpp"

namespace firn::grammar {

using namespace tao::pegtl;  // NOLINT: rules read as the grammar only with it

// clang-format off

// ---------------------------------------------------------------- lexical

// comment   <- '#' (!eol .)*
struct comment : seq<one<'#'>, star<not_one<'\n', '\r'>>> {};
// sp        <- (' ' / '\t' / comment)*          spaces inside a line
struct sp : star<sor<one<' ', '\t'>, comment>> {};
// sp_nl     <- (' ' / '\t' / eol / comment)*    spaces and line breaks
struct sp_nl : star<sor<one<' ', '\t', '\r', '\n'>, comment>> {};

// word_char <- [A-Za-z0-9_]
struct word_char : ranges<'a', 'z', 'A', 'Z', '0', '9', '_'> {};

// ORDER KEYWORDS: one rule per word of grammar/keywords.hpp.
struct kw_along : TAO_PEGTL_KEYWORD("along") {};
struct kw_amend : TAO_PEGTL_KEYWORD("amend") {};
struct kw_at : TAO_PEGTL_KEYWORD("at") {};
struct kw_axial : TAO_PEGTL_KEYWORD("axial") {};
struct kw_because : TAO_PEGTL_KEYWORD("because") {};
struct kw_beams : TAO_PEGTL_KEYWORD("beams") {};
struct kw_case : TAO_PEGTL_KEYWORD("case") {};
struct kw_clockwise : TAO_PEGTL_KEYWORD("clockwise") {};
struct kw_columns : TAO_PEGTL_KEYWORD("columns") {};
struct kw_counterclockwise : TAO_PEGTL_KEYWORD("counterclockwise") {};
struct kw_dead : TAO_PEGTL_KEYWORD("dead") {};
struct kw_displacement : TAO_PEGTL_KEYWORD("displacement") {};
struct kw_down : TAO_PEGTL_KEYWORD("down") {};
struct kw_fixed : TAO_PEGTL_KEYWORD("fixed") {};
struct kw_free : TAO_PEGTL_KEYWORD("free") {};
struct kw_from : TAO_PEGTL_KEYWORD("from") {};
struct kw_grid : TAO_PEGTL_KEYWORD("grid") {};
struct kw_group : TAO_PEGTL_KEYWORD("group") {};
struct kw_hinge : TAO_PEGTL_KEYWORD("hinge") {};
struct kw_ishape : TAO_PEGTL_KEYWORD("ishape") {};
struct kw_let : TAO_PEGTL_KEYWORD("let") {};
struct kw_linear : TAO_PEGTL_KEYWORD("linear") {};
struct kw_live : TAO_PEGTL_KEYWORD("live") {};
struct kw_material : TAO_PEGTL_KEYWORD("material") {};
struct kw_member : TAO_PEGTL_KEYWORD("member") {};
struct kw_model : TAO_PEGTL_KEYWORD("model") {};
struct kw_moment : TAO_PEGTL_KEYWORD("moment") {};
struct kw_node : TAO_PEGTL_KEYWORD("node") {};
struct kw_on : TAO_PEGTL_KEYWORD("on") {};
struct kw_other : TAO_PEGTL_KEYWORD("other") {};
struct kw_outside : TAO_PEGTL_KEYWORD("outside") {};
struct kw_pinned : TAO_PEGTL_KEYWORD("pinned") {};
struct kw_plan : TAO_PEGTL_KEYWORD("plan") {};
struct kw_point : TAO_PEGTL_KEYWORD("point") {};
struct kw_projected : TAO_PEGTL_KEYWORD("projected") {};
struct kw_rafters : TAO_PEGTL_KEYWORD("rafters") {};
struct kw_rectangle : TAO_PEGTL_KEYWORD("rectangle") {};
struct kw_report : TAO_PEGTL_KEYWORD("report") {};
struct kw_roller : TAO_PEGTL_KEYWORD("roller") {};
struct kw_roof : TAO_PEGTL_KEYWORD("roof") {};
struct kw_projection : TAO_PEGTL_KEYWORD("projection") {};
struct kw_combinations : TAO_PEGTL_KEYWORD("combinations") {};
struct kw_combine : TAO_PEGTL_KEYWORD("combine") {};
struct kw_or : TAO_PEGTL_KEYWORD("or") {};
struct kw_half_live_in : TAO_PEGTL_KEYWORD("half_live_in") {};
struct kw_pattern : TAO_PEGTL_KEYWORD("pattern") {};
struct kw_arrange : TAO_PEGTL_KEYWORD("arrange") {};
struct kw_by : TAO_PEGTL_KEYWORD("by") {};
struct kw_deflection : TAO_PEGTL_KEYWORD("deflection") {};
struct kw_limit : TAO_PEGTL_KEYWORD("limit") {};
struct kw_expect : TAO_PEGTL_KEYWORD("expect") {};
struct kw_of : TAO_PEGTL_KEYWORD("of") {};
struct kw_shear : TAO_PEGTL_KEYWORD("shear") {};
struct kw_reaction : TAO_PEGTL_KEYWORD("reaction") {};
struct kw_under : TAO_PEGTL_KEYWORD("under") {};
struct kw_between : TAO_PEGTL_KEYWORD("between") {};
struct kw_and : TAO_PEGTL_KEYWORD("and") {};
struct kw_within : TAO_PEGTL_KEYWORD("within") {};
struct kw_geometry : TAO_PEGTL_KEYWORD("geometry") {};
struct kw_tolerance : TAO_PEGTL_KEYWORD("tolerance") {};
struct kw_unjoined : TAO_PEGTL_KEYWORD("unjoined") {};
struct kw_cover : TAO_PEGTL_KEYWORD("cover") {};
struct kw_rotation : TAO_PEGTL_KEYWORD("rotation") {};
struct kw_section : TAO_PEGTL_KEYWORD("section") {};
struct kw_self : TAO_PEGTL_KEYWORD("self") {};
struct kw_snow : TAO_PEGTL_KEYWORD("snow") {};
struct kw_spacing : TAO_PEGTL_KEYWORD("spacing") {};
struct kw_spring : TAO_PEGTL_KEYWORD("spring") {};
struct kw_support : TAO_PEGTL_KEYWORD("support") {};
struct kw_tag : TAO_PEGTL_KEYWORD("tag") {};
struct kw_to : TAO_PEGTL_KEYWORD("to") {};
struct kw_transverse : TAO_PEGTL_KEYWORD("transverse") {};
struct kw_uniform : TAO_PEGTL_KEYWORD("uniform") {};
struct kw_units : TAO_PEGTL_KEYWORD("units") {};
struct kw_up : TAO_PEGTL_KEYWORD("up") {};
struct kw_use : TAO_PEGTL_KEYWORD("use") {};
struct kw_weight : TAO_PEGTL_KEYWORD("weight") {};
struct kw_wind : TAO_PEGTL_KEYWORD("wind") {};
struct kw_x : TAO_PEGTL_KEYWORD("x") {};
struct kw_y : TAO_PEGTL_KEYWORD("y") {};

/// Every keyword rule, so tests can check the list against keywords.hpp.
template <typename... Words> struct keyword_list : sor<Words...> {
    static constexpr std::size_t size = sizeof...(Words);
};
// reserved  <- any keyword of `keywords` (not the contextual ones)
struct reserved : keyword_list<
    kw_along, kw_amend, kw_at, kw_axial, kw_because, kw_beams, kw_case, kw_clockwise, kw_columns,
    kw_counterclockwise, kw_dead, kw_displacement, kw_down, kw_fixed, kw_free, kw_from, kw_grid,
    kw_group, kw_hinge, kw_ishape, kw_let, kw_linear, kw_live, kw_material, kw_member, kw_model,
    kw_moment, kw_node, kw_on, kw_other, kw_outside, kw_pinned, kw_point, kw_projected,
    kw_rafters, kw_rectangle, kw_report, kw_roller, kw_rotation, kw_section, kw_self,
    kw_snow, kw_spacing, kw_spring, kw_support, kw_tag, kw_to, kw_transverse, kw_uniform,
    kw_units, kw_up, kw_use, kw_weight, kw_wind, kw_x, kw_y> {};
static_assert(reserved::size == keywords.size(), "ORDER KEYWORDS: grammar and keywords.hpp disagree");

// name      <- !(reserved !'.') name_part ('.' name_part)*      A1, eave.AB, 12, N_3
struct name_part : plus<word_char> {};
struct name : seq<not_at<reserved, not_at<one<'.'>>>, name_part, star<one<'.'>, name_part>> {};

// member_ref <- !(reserved !'.') [A-Za-z0-9_.*]+         B1, eave.*, *.base.*, a group
struct member_ref : seq<not_at<reserved, not_at<one<'.'>>>,
                        plus<sor<word_char, one<'.', '*'>>>> {};

// list_sep  <- sp ',' sp_nl
struct list_sep : seq<sp, one<','>, sp_nl> {};
struct equals : one<'='> {};
// end_of_statement <- eol / ';' / &'}' / eof       (after sp)
struct end_of_statement : sor<eol, one<';'>, at<one<'}'>>, eof> {};

// ---------------------------------------------------------------- numbers and units

// number    <- ([0-9]+ ('.' [0-9]*)? / '.' [0-9]+) ([eE] [+-]? [0-9]+)?
struct digits : plus<digit> {};
struct exponent : seq<one<'e', 'E'>, opt<one<'+', '-'>>, digits> {};
struct number : seq<sor<seq<digits, opt<one<'.'>, star<digit>>>, seq<one<'.'>, digits>>,
                    opt<exponent>> {};

/// unit_name <- a run of letters that is a unit of the table in src/units.cpp
struct unit_name {
    using rule_t = unit_name;
    using subs_t = type_list<>;
    template <apply_mode, rewind_mode, template <typename...> class Action,
              template <typename...> class Control, typename ParseInput, typename... States>
    static bool match(ParseInput& in, States&&...) {
        std::size_t n = 0;
        while (n < in.size(n + 1)) {
            char c = in.peek_char(n);
            if (!((c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z'))) break;
            ++n;
        }
        if (n == 0 || firn::find_unit(std::string_view(in.current(), n)) == nullptr) return false;
        in.bump_in_this_line(n);
        return true;
    }
};
// unit_atom <- unit_name ('^' '-'? digits / digits)? !word_char     kip, in4, in^4, ft^-1
struct unit_exponent : sor<seq<one<'^'>, opt<one<'-'>>, digits>, digits> {};
struct unit_atom : seq<unit_name, opt<unit_exponent>, not_at<word_char>> {};
// unit      <- unit_atom (sp '*' sp unit_atom / '-' unit_atom / sp '/' sp unit_atom)*
struct unit_lead : unit_atom {};
struct unit_times : seq<sp, one<'*'>, sp, unit_atom> {};
struct unit_hyphen : seq<one<'-'>, unit_atom> {};  // kip-ft, as engineers write it
struct unit_per : seq<sp, one<'/'>, sp, unit_atom> {};
struct unit : seq<unit_lead, star<sor<unit_times, unit_hyphen, unit_per>>> {};
// bad_unit  <- a word after a number that is neither a unit nor a keyword
// A word that may follow a value in a statement (`between 1 in and 2 in`, `<= 4 ft within
// 1 in`, `expect ... under S`) ends the value; it is no misspelt unit.
struct after_value_word : sor<kw_and, kw_within, kw_under> {};
struct bad_unit : seq<not_at<reserved>, not_at<after_value_word>, ranges<'a', 'z', 'A', 'Z', '_'>,
                      star<word_char>> {};

// ---------------------------------------------------------------- expressions

// quantity  <- number (sp unit / (sp bad_unit)?)
struct quantity : seq<number, sor<seq<sp, unit>, opt<sp, bad_unit>>> {};
struct expr;
struct factor;
// group     <- '(' sp_nl expr sp_nl ')'
struct paren_open : one<'('> {};
struct paren_close : one<')'> {};
struct group : if_must<paren_open, sp_nl, expr, sp_nl, paren_close> {};
// group_unit <- sp unit                                 (1/2) in: the group times the unit
struct group_unit : seq<sp, unit> {};
struct group_with_unit : seq<group, opt<group_unit>> {};
// call      <- name '(' sp_nl expr (list_sep expr)* sp_nl ')'       min, max, abs, sqrt
struct call_head : seq<name, one<'('>> {};
struct call_argument : seq<expr> {};
struct call : if_must<call_head, sp_nl, call_argument, star<if_must<list_sep, call_argument>>,
                      sp_nl, paren_close> {};
// constant  <- name                                     a value named by 'let'
struct constant : name {};
// primary   <- quantity / group group_unit? / call / constant
struct primary : sor<quantity, group_with_unit, call, constant> {};
// power     <- primary (sp '^' sp_nl factor)?          right to left: 2^3^2 = 2^9
struct caret : one<'^'> {};
struct power_tail : if_must<seq<sp, caret>, sp_nl, factor> {};
struct power : seq<primary, opt<power_tail>> {};
// factor    <- '-' sp factor / power
struct minus_sign : one<'-'> {};
struct negation : if_must<minus_sign, sp, factor> {};
struct factor : sor<negation, power> {};
// product   <- factor (sp [*/] sp_nl factor)*
struct product_tail : if_must<seq<sp, one<'*', '/'>>, sp_nl, factor> {};
struct product : seq<factor, star<product_tail>> {};
// expr      <- product (sp [+-] sp_nl product)*
struct sum_tail : if_must<seq<sp, one<'+', '-'>>, sp_nl, product> {};
struct expr : seq<product, star<sum_tail>> {};

// ---------------------------------------------------------------- statements

// text_char   <- '\\' ["\\] / !control [^"\\]     (quoted text: a title, a path, a reason)
// A control byte but a tab (a line break, a NUL, a terminal escape) cannot stand in quoted
// text, so none can reach a file name, a report or a terminal.
struct control_char : sor<range<'\x00', '\x08'>, range<'\x0a', '\x1f'>, one<'\x7f'>> {};
struct text_char : sor<seq<one<'\\'>, one<'"', '\\'>>, seq<not_at<control_char>, not_one<'"', '\\'>>> {};

// model_stmt  <- 'model' sp title
struct title : if_must<one<'"'>, star<text_char>, one<'"'>> {};
struct model_begin : kw_model {};
struct model_stmt : if_must<model_begin, sp, title> {};

// let_stmt    <- 'let' sp name sp '=' sp (quoted / expr)
//                a value, or a text in double quotes (library modules name their
//                edition and clauses so)
struct let_name : name {};
struct let_begin : kw_let {};
struct let_text : if_must<one<'"'>, star<text_char>, one<'"'>> {};
struct let_value : sor<let_text, expr> {};
struct let_stmt : if_must<let_begin, sp, let_name, sp, equals, sp, let_value> {};

// use_stmt    <- 'use' sp ('outside' sp)? (path / name)
struct path : if_must<one<'"'>, star<text_char>, one<'"'>> {};
struct use_outside : kw_outside {};
struct use_module : name {};
struct use_target : sor<path, use_module> {};
struct use_begin : kw_use {};
struct use_stmt : if_must<use_begin, sp, opt<use_outside, sp>, use_target> {};

// report_stmt <- 'report' sp 'units' sp report_item (list_sep report_item)*
// report_item <- ('displacement' sp)? unit
struct displacement_role : kw_displacement {};
struct report_item : seq<opt<displacement_role, sp>, unit> {};
struct report_begin : kw_report {};
struct report_stmt : if_must<report_begin, sp, kw_units, sp, report_item,
                             star<if_must<list_sep, report_item>>> {};

// grid_stmt   <- 'grid' sp ('x' / 'y' / 'plan') sp (grid_run / grid_line (list_sep grid_line)*)
//                `plan`: the building's plan grid, the lines its frames stand on
// grid_line   <- name sp '=' sp expr
// grid_run    <- name '..' name sp 'spacing' sp expr (list_sep expr)* (sp 'from' sp expr)?
struct grid_axis : sor<kw_x, kw_y, kw_plan> {};
struct grid_line_name : name {};
struct grid_line : if_must<grid_line_name, sp, equals, sp, expr> {};
struct dots : string<'.', '.'> {};
struct run_first : name {};
struct run_last : name {};
struct run_spacing : expr {};
struct run_start : expr {};
struct grid_run : if_must<seq<at<name, dots>, run_first, dots>, run_last, sp, kw_spacing, sp,
                          run_spacing, star<if_must<list_sep, run_spacing>>,
                          opt<sp, if_must<kw_from, sp, run_start>>> {};
struct grid_lines : seq<grid_line, star<if_must<list_sep, grid_line>>> {};
struct grid_begin : kw_grid {};
struct grid_stmt : if_must<grid_begin, sp, grid_axis, sp, sor<grid_run, grid_lines>> {};

// node_stmt   <- 'node' sp name sp 'at' sp coordinate (list_sep coordinate)*
// coordinate  <- ('x' / 'y') sp '=' sp expr / name
struct coordinate_axis : sor<kw_x, kw_y> {};
struct axis_coordinate : if_must<coordinate_axis, sp, equals, sp, expr> {};
struct grid_coordinate : name {};
struct coordinate : sor<axis_coordinate, grid_coordinate> {};
struct node_name : name {};
struct node_begin : kw_node {};
struct node_stmt : if_must<node_begin, sp, node_name, sp, kw_at, sp, coordinate,
                           star<if_must<list_sep, coordinate>>> {};

// property    <- name sp '=' sp expr
struct property_key : name {};
struct property : if_must<property_key, sp, equals, sp, expr> {};
struct property_list : seq<property, star<if_must<list_sep, property>>> {};

// material_stmt <- 'material' sp name sp property (list_sep property)*
struct material_name : name {};
struct material_begin : kw_material {};
struct material_stmt : if_must<material_begin, sp, material_name, sp, property_list> {};

// section_stmt <- 'section' sp name sp name sp ',' sp_nl (('rectangle' / 'ishape') sp)? property_list
struct section_name : name {};
struct section_material : name {};
struct section_shape : sor<kw_rectangle, kw_ishape> {};
struct comma : one<','> {};
struct section_begin : kw_section {};
struct section_stmt : if_must<section_begin, sp, section_name, sp, section_material, sp, comma,
                              sp_nl, opt<section_shape, sp>, property_list> {};

// member_options <- 'section' sp name (sp 'hinge' sp 'at' sp name (list_sep name)*)?
//                   (sp 'tag' sp name (list_sep name)*)?
struct member_section : name {};
struct hinge_node : name {};
struct hinges : if_must<kw_hinge, sp, kw_at, sp, hinge_node, star<if_must<list_sep, hinge_node>>> {};
struct tag_name : name {};
struct tags : if_must<kw_tag, sp, tag_name, star<if_must<list_sep, tag_name>>> {};
struct member_options : if_must<kw_section, sp, member_section, opt<sp, hinges>, opt<sp, tags>> {};

// member_stmt <- 'member' sp name sp 'from' sp name sp 'to' sp name sp member_options
struct member_name : name {};
struct member_start : name {};
struct member_end : name {};
struct member_begin : kw_member {};
struct member_stmt : if_must<member_begin, sp, member_name, sp, kw_from, sp, member_start, sp,
                             kw_to, sp, member_end, sp, member_options> {};

// line_range  <- name ('..' name)?                    A, C..F
struct range_first : name {};
struct range_last : name {};
struct line_range : seq<range_first, opt<dots, must<range_last>>> {};
struct line_ranges : seq<line_range, star<if_must<list_sep, line_range>>> {};
// columns_stmt <- 'columns' sp 'on' sp line_range (list_sep line_range)*
//                 sp 'from' sp name sp 'to' sp name sp member_options
struct span_from : name {};
struct span_to : name {};
struct level_span : if_must<kw_from, sp, span_from, sp, kw_to, sp, span_to> {};
struct line_span : if_must<kw_from, sp, span_from, sp, kw_to, sp, span_to> {};
struct columns_begin : kw_columns {};
struct columns_stmt : if_must<columns_begin, sp, kw_on, sp, line_ranges, sp, level_span, sp,
                              member_options> {};
// beams_stmt  <- 'beams' sp 'along' sp line_range (list_sep line_range)*
//                sp 'from' sp name sp 'to' sp name sp member_options
struct beams_begin : kw_beams {};
struct beams_stmt : if_must<beams_begin, sp, kw_along, sp, line_ranges, sp, line_span, sp,
                            member_options> {};
// rafters_stmt <- 'rafters' sp name sp 'from' sp name (sp 'to' sp name)+ sp member_options
struct rafter_run : name {};
struct rafter_point : name {};
struct rafter_next : if_must<kw_to, sp, rafter_point> {};
struct rafters_begin : kw_rafters {};
struct rafters_stmt : if_must<rafters_begin, sp, rafter_run, sp, kw_from, sp, rafter_point, sp,
                              rafter_next, star<sp, rafter_next>, sp, member_options> {};

// group_stmt  <- 'group' sp name sp '=' sp member_ref (list_sep member_ref)*
struct group_name : name {};
struct group_member : member_ref {};
struct group_begin : kw_group {};
struct group_stmt : if_must<group_begin, sp, group_name, sp, equals, sp, group_member,
                            star<if_must<list_sep, group_member>>> {};

// support_stmt <- 'support' sp support_kind sp 'at' sp name (list_sep name)* (sp spring_list)?
// support_kind <- 'fixed' / 'pinned' / 'roller' (sp 'free' sp axis)? / 'spring'
// spring_item  <- ('x' / 'y' / 'rotation') sp '=' sp ('fixed' / expr)
struct support_fixed : kw_fixed {};
struct support_pinned : kw_pinned {};
struct roller_axis : sor<kw_x, kw_y> {};
struct support_roller : seq<kw_roller, opt<sp, if_must<kw_free, sp, roller_axis>>> {};
struct support_spring : kw_spring {};
struct support_kind : sor<support_fixed, support_pinned, support_roller, support_spring> {};
struct support_node : name {};
struct spring_direction : sor<kw_x, kw_y, kw_rotation> {};
struct spring_fixed : kw_fixed {};
struct spring_value : sor<spring_fixed, expr> {};
struct spring_item : if_must<spring_direction, sp, equals, sp, spring_value> {};
struct spring_list : seq<spring_item, star<if_must<list_sep, spring_item>>> {};
struct support_begin : kw_support {};
struct support_stmt : if_must<support_begin, sp, support_kind, sp, kw_at, sp, support_node,
                              star<if_must<list_sep, support_node>>, opt<sp, spring_list>> {};

// ---------------------------------------------------------------- loads (inside a case block)

// direction <- 'x' / 'y' / 'up' / 'down' / 'axial' / 'transverse'
struct direction : sor<kw_x, kw_y, kw_up, kw_down, kw_axial, kw_transverse> {};
struct projected : kw_projected {};
struct load_value : expr {};
struct load_end_value : expr {};
struct load_member : member_ref {};
struct load_node : name {};
struct load_from : expr {};
struct load_to : expr {};
struct load_at : expr {};
struct member_list : seq<load_member, star<if_must<list_sep, load_member>>> {};
struct node_list : seq<load_node, star<if_must<list_sep, load_node>>> {};
// part        <- 'from' sp expr sp 'to' sp expr
struct part : if_must<kw_from, sp, load_from, sp, kw_to, sp, load_to> {};
// on_members  <- 'on' sp member_list (sp part)?
struct on_members : if_must<kw_on, sp, member_list, opt<sp, part>> {};
// on_member_at <- 'on' sp member_list sp 'at' sp expr
struct on_member_at : if_must<kw_on, sp, member_list, sp, kw_at, sp, load_at> {};
// at_nodes    <- 'at' sp node_list
struct at_nodes : if_must<kw_at, sp, node_list> {};
struct point_target : sor<on_member_at, at_nodes> {};
struct spread_target : on_members {};

// uniform     <- 'uniform' sp expr sp direction (sp 'projected')? sp on_members
struct uniform_begin : kw_uniform {};
struct uniform_load : if_must<uniform_begin, sp, load_value, sp, direction, opt<sp, projected>,
                              sp, spread_target> {};
// linear      <- 'linear' sp expr sp 'to' sp expr sp direction (sp 'projected')? sp on_members
struct linear_begin : kw_linear {};
struct linear_load : if_must<linear_begin, sp, load_value, sp, kw_to, sp, load_end_value, sp,
                             direction, opt<sp, projected>, sp, spread_target> {};
// point       <- 'point' sp expr sp direction sp (on_member_at / at_nodes)
struct point_begin : kw_point {};
struct point_load : if_must<point_begin, sp, load_value, sp, direction, sp, point_target> {};
// moment      <- 'moment' sp expr (sp rotation_sense)? sp (on_member_at / at_nodes)
struct rotation_sense : sor<kw_clockwise, kw_counterclockwise> {};
struct moment_begin : kw_moment {};
struct moment_load : if_must<moment_begin, sp, load_value, opt<sp, rotation_sense>, sp,
                             point_target> {};
// self_weight <- 'self' sp 'weight' (sp 'on' sp member_list)?
struct self_weight_begin : kw_self {};
struct self_weight_members : if_must<kw_on, sp, member_list> {};
struct self_weight : if_must<self_weight_begin, sp, kw_weight, opt<sp, self_weight_members>> {};

struct unknown_load : failure {};
struct load_stmt : sor<uniform_load, linear_load, point_load, moment_load, self_weight,
                       raise<unknown_load>> {};
struct load_line : seq<load_stmt, sp, must<end_of_statement>> {};

// ---------------------------------------------------------------- error recovery

/// Skips the rest of a statement after an error inside a block: up to a line
/// break, ';' or '}' (which is left for the block).
struct skip_in_block {
    using rule_t = skip_in_block;
    using subs_t = type_list<>;
    template <apply_mode, rewind_mode, template <typename...> class Action,
              template <typename...> class Control, typename ParseInput, typename... States>
    static bool match(ParseInput& in, States&&...) {
        while (!in.empty() && in.peek_char() != '\n' && in.peek_char() != ';' &&
               in.peek_char() != '}') {
            in.bump_in_this_line(1);
        }
        if (!in.empty() && in.peek_char() != '}') in.bump(1);
        return true;
    }
};

/// Skips the rest of a top-level statement after an error: to the end of the
/// line, and through a whole '{ ... }' block if one opens on it, so that a
/// broken case header does not turn its loads into a cascade of errors.
struct skip_statement {
    using rule_t = skip_statement;
    using subs_t = type_list<>;
    template <apply_mode, rewind_mode, template <typename...> class Action,
              template <typename...> class Control, typename ParseInput, typename... States>
    static bool match(ParseInput& in, States&&...) {
        std::size_t depth = 0;
        while (!in.empty()) {
            char c = in.peek_char();
            in.bump(1);
            if (c == '#') {
                while (!in.empty() && in.peek_char() != '\n') in.bump(1);
            } else if (c == '{') {
                ++depth;
            } else if (c == '}' && depth > 0) {
                --depth;
            } else if (c == '\n' && depth == 0) {
                break;
            }
        }
        return true;
    }
};

/// recover<R, Skip>: matches R; if R raises a parse error, the error is handed
/// to the state's `recover_from` (which records it), the input is moved to the
/// error and Skip consumes the rest of the broken statement. Parsing then goes
/// on, so independent errors in one file are all reported.
template <typename R, typename Skip>
struct recover {
    using rule_t = recover;
    using subs_t = type_list<R, Skip>;
    template <apply_mode A, rewind_mode M, template <typename...> class Action,
              template <typename...> class Control, typename ParseInput, typename State>
    static bool match(ParseInput& in, State& state) {
        const char* start = in.current();
        try {
            return Control<R>::template match<A, M, Action, Control>(in, state);
        } catch (const parse_error& e) {
            const char* error_at = in.begin() + e.positions().front().byte;
            state.recover_from(e, error_at, std::is_same_v<Skip, skip_in_block>);
            in.iterator() = error_at;
            (void)Control<Skip>::template match<apply_mode::nothing, rewind_mode::dontcare, Action,
                                                Control>(in, state);
            if (in.current() == start && !in.empty()) in.bump(1);  // always make progress
            return true;
        }
    }
};

// ---------------------------------------------------------------- blocks and file

// case_stmt   <- 'case' sp name sp case_kind sp '{' sp_nl (load_line sp_nl)* '}'
// case_kind   <- 'dead' / 'live' / 'roof' sp 'live' / 'snow' / 'rain' / 'wind' / 'other'
//                ('rain' is a keyword only here)
struct kind_dead : kw_dead {};
struct kind_live : kw_live {};
struct kind_roof_live : if_must<kw_roof, sp, kw_live> {};
struct kind_snow : kw_snow {};
struct kind_rain : TAO_PEGTL_KEYWORD("rain") {};
struct kind_wind : kw_wind {};
struct kind_other : kw_other {};
struct case_kind
    : sor<kind_dead, kind_live, kind_roof_live, kind_snow, kind_rain, kind_wind, kind_other> {};
struct case_name : name {};
struct block_open : one<'{'> {};
struct block_close : one<'}'> {};
struct block_item : seq<not_at<sor<block_close, eof>>, recover<load_line, skip_in_block>, sp_nl> {};
struct case_begin : kw_case {};
struct case_stmt : if_must<case_begin, sp, case_name, sp, case_kind, sp, block_open, sp_nl,
                           star<block_item>, block_close> {};

// ---------------------------------------------------------------- snow data

// setting     <- name sp '=' sp expr (sp 'because' sp quoted)?
//                a value of the snow site or a roof; an enumerated value is a word
struct setting_key : name {};
struct reason : if_must<one<'"'>, star<text_char>, one<'"'>> {};
struct because : if_must<kw_because, sp, reason> {};
struct setting : if_must<setting_key, sp, equals, sp, expr, opt<sp, because>> {};
struct setting_line : seq<setting, sp, must<end_of_statement>> {};
struct setting_item : seq<not_at<sor<block_close, eof>>, recover<setting_line, skip_in_block>, sp_nl> {};
struct settings_block : if_must<block_open, sp_nl, star<setting_item>, block_close> {};

// snow_stmt   <- 'snow' sp name sp '{' sp_nl (setting sp_nl)* '}'      site data; cases NAME.*
struct snow_name : name {};
struct snow_begin : kw_snow {};
struct snow_stmt : if_must<snow_begin, sp, snow_name, sp, settings_block> {};

// roof_stmt   <- 'roof' sp name sp 'on' sp member_ref (list_sep member_ref)* sp '{' ... '}'
struct roof_name : name {};
struct roof_member : member_ref {};
struct roof_members : seq<roof_member, star<if_must<list_sep, roof_member>>> {};
struct roof_begin : kw_roof {};
struct roof_on : kw_on {};
struct roof_stmt : if_must<roof_begin, sp, roof_name, sp, roof_on, sp, roof_members, sp,
                           settings_block> {};

// projection_stmt <- 'projection' sp name sp 'on' sp name sp '{' ... '}'
//                a rooftop unit or penthouse standing on a roof (drifts of Sec. 7.8)
struct projection_begin : kw_projection {};
struct projection_name : name {};
struct projection_on : kw_on {};
struct projection_roof : name {};
struct projection_stmt : if_must<projection_begin, sp, projection_name, sp, projection_on, sp,
                                 projection_roof, sp, settings_block> {};

// ---------------------------------------------------------------- combinations

// combinations_stmt <- 'combinations' sp name sp ('by' sp 'case' sp)? '{' sp_nl
//                      (combination_item sp_nl)* '}'
//                a named set of load combinations over the load symbols D, L, Lr, S, R, W;
//                with 'by case', over the load cases by name
// combination_line  <- name sp '=' sp combination_term (sp '+' sp_nl combination_term)*
// combination_term  <- (number sp)? (symbol / '(' sp alternative (sp 'or' sp alternative)* sp ')')
// alternative       <- (number sp)? symbol
// half_live_line    <- 'half_live_in' sp '=' sp name (list_sep name)*
//                the combinations whose factor 1.0 on L may be 0.5 (a permission)
struct combination_factor : number {};
struct combination_symbol : name {};
struct combination_alternative : seq<opt<combination_factor, sp>, combination_symbol> {};
struct alternatives_open : one<'('> {};
struct alternatives_close : one<')'> {};
struct alternatives : if_must<alternatives_open, sp, combination_alternative,
                              star<sp, kw_or, sp, must<combination_alternative>>, sp,
                              alternatives_close> {};
struct combination_term_begin : success {};
// Two names in a row are a factor written as a word (`half W`, `1.2 kN D`):
// factors are numbers, so it is an error at the word rather than a puzzle later.
struct combination_factor_word : not_at<name_part, plus<one<' ', '\t'>>, name_part> {};
struct combination_term : seq<combination_term_begin, opt<combination_factor, sp>,
                              must<combination_factor_word>,
                              sor<alternatives, combination_symbol>> {};
struct combination_plus : seq<sp, one<'+'>, sp_nl> {};
struct combination_label : name {};
struct combination_line : if_must<combination_label, sp, equals, sp, combination_term,
                                  star<combination_plus, must<combination_term>>> {};
struct half_live_label : name {};
struct half_live_line : if_must<kw_half_live_in, sp, equals, sp, half_live_label,
                                star<list_sep, half_live_label>> {};
struct combination_body : sor<half_live_line, combination_line> {};
struct combination_entry : seq<combination_body, sp, must<end_of_statement>> {};
struct combination_item : seq<not_at<sor<block_close, eof>>,
                              recover<combination_entry, skip_in_block>, sp_nl> {};
struct combinations_name : name {};
struct combinations_begin : kw_combinations {};
struct combinations_open : block_open {};
struct combinations_by_case : if_must<kw_by, sp, kw_case> {};
struct combinations_stmt : if_must<combinations_begin, sp, combinations_name, sp,
                                   opt<combinations_by_case, sp>, combinations_open, sp_nl,
                                   star<combination_item>, block_close> {};

// combine_stmt <- 'combine' sp name (list_sep name)* (sp settings_block)?
//                the combination sets this model is checked for, with their permissions
struct combine_set : name {};
struct combine_begin : kw_combine {};
struct combine_stmt : if_must<combine_begin, sp, combine_set, star<list_sep, combine_set>,
                              opt<sp, settings_block>> {};

// ---------------------------------------------------------------- arrangements

// pattern_stmt <- 'pattern' sp name sp '{' sp_nl (pattern_line sp_nl)* '}'
//                a rule that gives each span a factor of a load: one or more arrangements
// pattern_line <- name sp ':' sp part (list_sep part)*
// part         <- selector sp '=' sp number
//                selector: exterior, adjacent_pair, each, all or others (checked on resolve)
struct pattern_selector : name {};
struct pattern_factor : number {};
struct pattern_part : seq<pattern_selector, sp, equals, sp, must<pattern_factor>> {};
struct pattern_label : name {};
struct pattern_colon : one<':'> {};
struct pattern_line : if_must<pattern_label, sp, pattern_colon, sp, pattern_part,
                              star<list_sep, must<pattern_part>>> {};
struct pattern_entry : seq<pattern_line, sp, must<end_of_statement>> {};
struct pattern_item : seq<not_at<sor<block_close, eof>>, recover<pattern_entry, skip_in_block>,
                          sp_nl> {};
struct pattern_name : name {};
struct pattern_begin : kw_pattern {};
struct pattern_open : block_open {};
struct pattern_stmt : if_must<pattern_begin, sp, pattern_name, sp, pattern_open, sp_nl,
                              star<pattern_item>, block_close> {};

// arrange_stmt <- 'arrange' sp name sp 'on' sp member_ref (list_sep member_ref)* sp 'by' sp name
//                a load case's arrangements over the spans of a run of members
struct arrange_case : name {};
struct arrange_member : member_ref {};
struct arrange_on : kw_on {};
struct arrange_by : kw_by {};
struct arrange_rule : name {};
struct arrange_begin : kw_arrange {};
struct arrange_stmt : if_must<arrange_begin, sp, arrange_case, sp, arrange_on, sp,
                              arrange_member, star<list_sep, arrange_member>, sp, arrange_by, sp,
                              arrange_rule> {};

// deflection_stmt <- 'deflection' sp member_ref (list_sep member_ref)* sp 'limit' sp name
//                the members' deflection limits, from a row of a limits table
struct deflection_member : member_ref {};
struct deflection_limit : kw_limit {};
struct deflection_row : name {};
struct deflection_begin : kw_deflection {};
struct deflection_stmt : if_must<deflection_begin, sp, deflection_member,
                                 star<list_sep, deflection_member>, sp, deflection_limit, sp,
                                 deflection_row> {};

// ---------------------------------------------------------------- expectations

// expect_stmt <- 'expect' sp subject (sp 'under' sp name)? sp bound
//                (sp 'within' sp tolerance)? (sp because)?
//                a bound on a result, checked by `firn check`
// subject     <- ('moment' / 'shear' / 'axial' / 'deflection') sp 'of' sp member_ref (list_sep member_ref)*
//              / 'reaction' sp ('x' / 'y' / 'moment') sp 'at' sp name (list_sep name)*
//              / 'displacement' sp ('x' / 'y') sp 'at' sp name (list_sep name)*
//              / 'rotation' sp 'at' sp name (list_sep name)*
//              / 'snow' sp name                      a derived snow value: pf, main.ps, ...
// bound       <- ('<=' / '>=' / '=') sp expr / 'between' sp expr sp 'and' sp expr
// tolerance   <- number sp '%' / expr
struct expect_member_quantity : sor<kw_moment, kw_shear, kw_axial, kw_deflection> {};
struct expect_member : member_ref {};
struct expect_of : kw_of {};
struct expect_members : if_must<expect_member_quantity, sp, expect_of, sp, expect_member,
                                star<list_sep, expect_member>> {};
struct expect_node : name {};
struct expect_at : kw_at {};
struct expect_nodes : if_must<expect_at, sp, expect_node, star<list_sep, expect_node>> {};
struct expect_reaction_component : sor<kw_x, kw_y, kw_moment> {};
struct expect_reaction_word : kw_reaction {};
struct expect_reaction : if_must<expect_reaction_word, sp, expect_reaction_component, sp, expect_nodes> {};
struct expect_displacement_component : sor<kw_x, kw_y> {};
struct expect_displacement_word : kw_displacement {};
struct expect_displacement : if_must<expect_displacement_word, sp, expect_displacement_component, sp,
                                     expect_nodes> {};
struct expect_rotation_word : kw_rotation {};
struct expect_rotation : if_must<expect_rotation_word, sp, expect_nodes> {};
struct expect_snow_value : name {};
struct expect_snow_word : kw_snow {};
struct expect_snow : if_must<expect_snow_word, sp, expect_snow_value> {};
struct expect_subject : sor<expect_members, expect_reaction, expect_displacement,
                            expect_rotation, expect_snow> {};
struct expect_source : name {};
struct expect_under : if_must<kw_under, sp, expect_source> {};
struct expect_relation : sor<string<'<', '='>, string<'>', '='>, one<'='>> {};
struct expect_value : expr {};
struct expect_and : kw_and {};
struct expect_high : expr {};
struct expect_compare : if_must<expect_relation, sp, expect_value> {};
struct expect_between_word : kw_between {};
struct expect_between : if_must<expect_between_word, sp, expect_value, sp, expect_and, sp, expect_high> {};
struct expect_bound : sor<expect_compare, expect_between> {};
struct expect_percent : seq<at<number, sp, one<'%'>>, number, sp, one<'%'>> {};
struct expect_tolerance_value : expr {};
struct expect_tolerance : sor<expect_percent, expect_tolerance_value> {};
struct expect_within : if_must<kw_within, sp, expect_tolerance> {};
struct expect_begin : kw_expect {};
struct expect_stmt : if_must<expect_begin, sp, expect_subject, sp, opt<expect_under, sp>,
                             expect_bound, opt<sp, expect_within>, opt<sp, because>> {};

// ---------------------------------------------------------------- geometry

// geometry_stmt <- 'geometry' sp 'tolerance' sp expr
//                the length within which places count as one (nodes on members, near nodes)
struct geometry_tolerance_value : expr {};
struct geometry_begin : kw_geometry {};
struct geometry_stmt : if_must<geometry_begin, sp, kw_tolerance, sp, geometry_tolerance_value> {};

// unjoined_stmt <- 'unjoined' sp name (list_sep name)* sp 'on' sp member_ref (list_sep member_ref)*
//                nodes that lie on the members' length but pass them without a connection
struct unjoined_node : name {};
struct unjoined_on : kw_on {};
struct unjoined_member : member_ref {};
struct unjoined_begin : kw_unjoined {};
struct unjoined_stmt : if_must<unjoined_begin, sp, unjoined_node,
                               star<if_must<list_sep, unjoined_node>>, sp, unjoined_on, sp,
                               unjoined_member, star<if_must<list_sep, unjoined_member>>> {};

// amend_stmt  <- 'amend' sp name sp '=' sp expr sp 'because' sp quoted
//                replaces a value of the library, with the reason
struct amend_name : name {};
struct amend_begin : kw_amend {};
struct amend_stmt : if_must<amend_begin, sp, amend_name, sp, equals, sp, expr, sp, because> {};

// cover_stmt  <- 'cover' sp '{' sp_nl (name sp '=' sp quoted sp_nl)* '}'
//                the calculation package's cover: the project, the structure, who
//                prepared and checked it, the revision and its date, as texts
struct cover_key : name {};
struct cover_text : if_must<one<'"'>, star<text_char>, one<'"'>> {};
struct cover_field : if_must<cover_key, sp, equals, sp, cover_text> {};
struct cover_line : seq<cover_field, sp, must<end_of_statement>> {};
struct cover_item : seq<not_at<sor<block_close, eof>>, recover<cover_line, skip_in_block>, sp_nl> {};
struct cover_begin : kw_cover {};
struct cover_stmt : if_must<cover_begin, sp, block_open, sp_nl, star<cover_item>, block_close> {};

struct unknown_statement : failure {};
struct statement : sor<model_stmt, use_stmt, let_stmt, report_stmt, grid_stmt, node_stmt,
                       material_stmt, section_stmt, member_stmt, columns_stmt, beams_stmt,
                       rafters_stmt, group_stmt, support_stmt, case_stmt, snow_stmt, roof_stmt,
                       projection_stmt, amend_stmt, combinations_stmt, combine_stmt,
                       pattern_stmt, arrange_stmt, deflection_stmt, expect_stmt,
                       geometry_stmt, unjoined_stmt, cover_stmt, raise<unknown_statement>> {};
// statement_start <- the keyword any statement of `statement` begins with
//                taken from the rule itself, so that error recovery's question "does this
//                line open a new statement?" cannot drift from the statements there are
template <typename Parts> struct first_part_of { using type = failure; };  // raise<>: no parts
template <typename First, typename... Rest>
struct first_part_of<type_list<First, Rest...>> { using type = First; };
template <typename Alternatives> struct first_words;
template <typename... Statements>
struct first_words<type_list<Statements...>>
    : sor<typename first_part_of<typename Statements::subs_t>::type...> {};
struct statement_start : first_words<statement::subs_t> {};
struct statement_line : seq<statement, sp, must<end_of_statement>> {};
struct top_item : seq<not_at<eof>, recover<statement_line, skip_statement>, sp_nl> {};
// file        <- sp_nl top_item* eof
struct file : seq<opt<utf8::bom>, sp_nl, star<top_item>, eof> {};

// clang-format on

}  // namespace firn::grammar

namespace tao::pegtl {
template <typename Name>
struct analyze_traits<Name, firn::grammar::unit_name> : analyze_any_traits<> {};
template <typename Name>
struct analyze_traits<Name, firn::grammar::skip_in_block> : analyze_opt_traits<> {};
template <typename Name>
struct analyze_traits<Name, firn::grammar::skip_statement> : analyze_opt_traits<> {};
template <typename Name, typename R, typename Skip>
struct analyze_traits<Name, firn::grammar::recover<R, Skip>> : analyze_seq_traits<R> {};
}  // namespace tao::pegtl
