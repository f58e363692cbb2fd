// parse_statement_actions: the PEGTL actions of the statements, blocks and
// loads, which fill the draft of the statement being read (parse_builder.hpp).
// Most are one of the generic actions of parse_actions.hpp: a name, an
// expression, a factor or a fixed value stored in a field of the draft.
// Private to src/front/; only parse.cpp includes it.
#pragma once

#include <cstdint>
#include <optional>
#include <string_view>
#include <utility>
#include <variant>
#include <vector>

#include "front/parse_actions.hpp"

namespace firn::parsing {

/// Commits the statement draft once the whole statement has matched.
template <>
struct action<g::statement> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        if (!b.statement)
            return;
        b.statement->where = b.range(b.base + b.statement->where.begin.offset, in.end());
        b.tree.statements.push_back(std::move(*b.statement));
        b.statement.reset();
    }
};

// ---------------------------------------------------------------- model, let, use, report

/// Refuses quoted text that is not UTF-8 (a title, a cover text): reports must print it.
template <typename Input>
void reject_invalid_utf8(const Input& in, Builder& b, const char* message) {
    std::size_t bad = invalid_utf8_at(in.string_view());
    if (bad != std::string_view::npos) {
        // recover_from reads only the byte offset of the position.
        std::size_t offset = static_cast<std::size_t>(in.begin() - b.base) + bad;
        throw pegtl::parse_error(message, pegtl::position(offset, 0, 0, ""));
    }
}

FIRN_ACTION(g::model_begin, begin_statement<syntax::ModelTitle>);
template <>
struct action<g::title> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        reject_invalid_utf8(in, b, "a title must be UTF-8 text");
        b.current<syntax::ModelTitle>().title = unquote(in.string_view());
    }
};

FIRN_ACTION(g::let_begin, begin_statement<syntax::LetDecl>);
FIRN_ACTION(g::let_name, store_name<&syntax::LetDecl::name>);

template <>
struct action<g::let_text> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::LetDecl>().text = unquote(in.string_view());
        b.current<syntax::LetDecl>().text_where = b.range(in);
    }
};

template <>
struct action<g::let_stmt> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        if (!b.current<syntax::LetDecl>().text)
            b.current<syntax::LetDecl>().value = b.pop_expr();
    }
};

FIRN_ACTION(g::use_begin, begin_statement<syntax::UseDecl>);
FIRN_ACTION(g::use_outside, store_value<&syntax::UseDecl::outside, true>);
FIRN_ACTION(g::use_module, store_name<&syntax::UseDecl::module>);
template <>
struct action<g::path> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        auto& use = b.current<syntax::UseDecl>();
        use.path = unquote(in.string_view());
        use.path_where = b.range(in);
    }
};

FIRN_ACTION(g::report_begin, begin_statement<syntax::ReportUnits>);
FIRN_ACTION(g::displacement_role, store_name<&Builder::pending_role>);
template <>
struct action<g::report_item> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::ReportUnits>().items.push_back(
            syntax::ReportUnits::Item{std::move(b.pending_role), std::move(b.unit), b.range(in)});
        b.pending_role.reset();
        b.unit.clear();
    }
};

// ---------------------------------------------------------------- grid and nodes

FIRN_ACTION(g::grid_begin, begin_statement<syntax::Grid>);
template <>
struct action<g::grid_axis> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::Grid>().axis = axis_of(in.string_view());
        b.current<syntax::Grid>().plan = in.string_view() == "plan";
    }
};
FIRN_ACTION(g::grid_line_name, store_name<&Builder::pending_name>);
template <>
struct action<g::grid_line> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.current<syntax::Grid>().lines.push_back(
            syntax::Grid::Line{std::move(*b.pending_name), b.pop_expr()});
    }
};
template <>
struct action<g::run_first> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::Grid>().run.emplace().first = b.name(in);
    }
};
FIRN_ACTION(g::run_last, store_name<&syntax::Grid::Run::last>);
FIRN_ACTION(g::run_spacing, append_expr<&syntax::Grid::Run::spacings>);
FIRN_ACTION(g::run_start, store_expr<&syntax::Grid::Run::start>);

FIRN_ACTION(g::node_begin, begin_statement<syntax::NodeDecl>);
FIRN_ACTION(g::node_name, store_name<&syntax::NodeDecl::name>);
FIRN_ACTION(g::coordinate_axis, store<&Builder::pending_axis, matched_axis>);
template <>
struct action<g::axis_coordinate> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        syntax::NodeDecl::Coordinate c;
        c.axis = b.pending_axis;
        c.value = b.pop_expr();
        c.where = b.range(in);
        b.current<syntax::NodeDecl>().coordinates.push_back(std::move(c));
    }
};
template <>
struct action<g::grid_coordinate> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        syntax::NodeDecl::Coordinate c;
        c.grid_line = b.name(in);
        c.where = b.range(in);
        b.current<syntax::NodeDecl>().coordinates.push_back(std::move(c));
    }
};

// ---------------------------------------------------------------- materials and sections

FIRN_ACTION(g::material_begin, begin_statement<syntax::MaterialDecl>);
FIRN_ACTION(g::material_name, store_name<&syntax::MaterialDecl::name>);
FIRN_ACTION(g::property_key, store_name<&Builder::pending_name>);
template <>
struct action<g::property> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        syntax::Property p{std::move(*b.pending_name), b.pop_expr()};
        if (auto* m = std::get_if<syntax::MaterialDecl>(&b.statement->node)) {
            m->properties.push_back(std::move(p));
        } else {
            b.current<syntax::SectionDecl>().properties.push_back(std::move(p));
        }
    }
};

FIRN_ACTION(g::section_begin, begin_statement<syntax::SectionDecl>);
FIRN_ACTION(g::section_name, store_name<&syntax::SectionDecl::name>);
FIRN_ACTION(g::section_material, store_name<&syntax::SectionDecl::material>);
template <>
struct action<g::section_shape> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        auto& s = b.current<syntax::SectionDecl>();
        s.shape = in.string_view() == "rectangle" ? syntax::SectionDecl::Shape::rectangle
                                                  : syntax::SectionDecl::Shape::ishape;
        s.shape_where = b.range(in);
    }
};

// ---------------------------------------------------------------- members and generators

FIRN_ACTION(g::member_begin, begin_statement<syntax::MemberDecl>);
FIRN_ACTION(g::member_name, store_name<&syntax::MemberDecl::name>);
FIRN_ACTION(g::member_start, store_name<&syntax::MemberDecl::start>);
FIRN_ACTION(g::member_end, store_name<&syntax::MemberDecl::end>);
FIRN_ACTION(g::member_section, store_name<&syntax::MemberOptions::section>);
FIRN_ACTION(g::hinge_node, append_name<&syntax::MemberOptions::hinges>);
FIRN_ACTION(g::tag_name, append_name<&syntax::MemberOptions::tags>);

FIRN_ACTION(g::columns_begin, begin_statement<syntax::ColumnsDecl>);
FIRN_ACTION(g::beams_begin, begin_statement<syntax::BeamsDecl>);
template <>
struct action<g::range_first> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        ranges_of(*b.statement).push_back(syntax::LineRange{b.name(in), std::nullopt});
    }
};
template <>
struct action<g::range_last> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        ranges_of(*b.statement).back().last = b.name(in);
    }
};

/// Stores the lowest (`To` false) or highest level of `columns`, or the first or
/// last line of `beams`.
template <bool To>
struct store_span_end {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        if (auto* c = std::get_if<syntax::ColumnsDecl>(&b.statement->node)) {
            c->*(To ? &syntax::ColumnsDecl::to : &syntax::ColumnsDecl::from) = b.name(in);
        } else {
            auto& beams = b.current<syntax::BeamsDecl>();
            beams.*(To ? &syntax::BeamsDecl::to : &syntax::BeamsDecl::from) = b.name(in);
        }
    }
};
FIRN_ACTION(g::span_from, store_span_end<false>);
FIRN_ACTION(g::span_to, store_span_end<true>);

FIRN_ACTION(g::rafters_begin, begin_statement<syntax::RaftersDecl>);
FIRN_ACTION(g::rafter_run, store_name<&syntax::RaftersDecl::run>);
FIRN_ACTION(g::rafter_point, append_name<&syntax::RaftersDecl::points>);

FIRN_ACTION(g::group_begin, begin_statement<syntax::GroupDecl>);
FIRN_ACTION(g::group_name, store_name<&syntax::GroupDecl::name>);
FIRN_ACTION(g::group_member, append_name<&syntax::GroupDecl::members>);

// ---------------------------------------------------------------- supports

using SupportKind = syntax::SupportDecl::Kind;
FIRN_ACTION(g::support_begin, begin_statement<syntax::SupportDecl>);
FIRN_ACTION(g::support_fixed, store_value<&syntax::SupportDecl::kind, SupportKind::fixed>);
FIRN_ACTION(g::support_pinned, store_value<&syntax::SupportDecl::kind, SupportKind::pinned>);
FIRN_ACTION(g::support_roller, store_value<&syntax::SupportDecl::kind, SupportKind::roller>);
FIRN_ACTION(g::support_spring, store_value<&syntax::SupportDecl::kind, SupportKind::spring>);
FIRN_ACTION(g::roller_axis, store<&syntax::SupportDecl::roller_free, matched_axis>);
FIRN_ACTION(g::support_node, append_name<&syntax::SupportDecl::nodes>);
FIRN_ACTION(g::spring_direction, store_name<&Builder::pending_name>);
FIRN_ACTION(g::spring_fixed, store_value<&Builder::pending_spring_fixed, true>);
template <>
struct action<g::spring_item> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        syntax::SupportDecl::Spring spring{std::move(*b.pending_name), std::nullopt};
        if (!b.pending_spring_fixed)
            spring.stiffness = b.pop_expr();
        b.pending_spring_fixed = false;
        b.current<syntax::SupportDecl>().springs.push_back(std::move(spring));
    }
};

// ---------------------------------------------------------------- blocks

template <>
struct action<g::block_open> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.block_line = b.range(in).begin.line;
        b.block_open = in.begin();
        b.block_kind = block_kind_of(b.statement->node);
        b.block_close_reported = false;
    }
};
FIRN_ACTION(g::combinations_open, action<g::block_open>);
FIRN_ACTION(g::pattern_open, action<g::block_open>);
FIRN_ACTION(g::block_close, store_value<&Builder::block_line, std::uint32_t{0}>);

// ---------------------------------------------------------------- load cases and loads

using CaseKind = syntax::CaseDecl::Kind;
FIRN_ACTION(g::case_begin, begin_statement<syntax::CaseDecl>);
FIRN_ACTION(g::case_name, store_name<&syntax::CaseDecl::name>);
FIRN_ACTION(g::kind_dead, store_value<&syntax::CaseDecl::kind, CaseKind::dead>);
FIRN_ACTION(g::kind_live, store_value<&syntax::CaseDecl::kind, CaseKind::live>);
FIRN_ACTION(g::kind_roof_live, store_value<&syntax::CaseDecl::kind, CaseKind::roof_live>);
FIRN_ACTION(g::kind_snow, store_value<&syntax::CaseDecl::kind, CaseKind::snow>);
FIRN_ACTION(g::kind_rain, store_value<&syntax::CaseDecl::kind, CaseKind::rain>);
FIRN_ACTION(g::kind_wind, store_value<&syntax::CaseDecl::kind, CaseKind::wind>);
FIRN_ACTION(g::kind_other, store_value<&syntax::CaseDecl::kind, CaseKind::other>);

/// Starts the draft of a load of the form `Form` at its keyword.
template <syntax::LoadDecl::Form Form>
struct begin_load {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.load = syntax::LoadDecl{};
        b.load->form = Form;
        b.load_begin = in.begin();
    }
};
using Form = syntax::LoadDecl::Form;
FIRN_ACTION(g::uniform_begin, begin_load<Form::uniform>);
FIRN_ACTION(g::linear_begin, begin_load<Form::linear>);
FIRN_ACTION(g::point_begin, begin_load<Form::point>);
FIRN_ACTION(g::moment_begin, begin_load<Form::moment>);
FIRN_ACTION(g::self_weight_begin, begin_load<Form::self_weight>);

FIRN_ACTION(g::load_value, store_expr<&syntax::LoadDecl::value>);
FIRN_ACTION(g::load_end_value, store_expr<&syntax::LoadDecl::end_value>);
FIRN_ACTION(g::load_from, store_expr<&syntax::LoadDecl::from>);
FIRN_ACTION(g::load_to, store_expr<&syntax::LoadDecl::to>);
FIRN_ACTION(g::load_at, store_expr<&syntax::LoadDecl::at>);
FIRN_ACTION(g::projected, store_value<&syntax::LoadDecl::projected, true>);
FIRN_ACTION(g::at_nodes, store_value<&syntax::LoadDecl::on_members, false>);
FIRN_ACTION(g::load_member, append_name<&syntax::LoadDecl::targets>);
FIRN_ACTION(g::load_node, append_name<&syntax::LoadDecl::targets>);

template <>
struct action<g::direction> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        using D = syntax::LoadDecl::Direction;
        std::string_view w = in.string_view();
        b.load->direction = w == "x"       ? D::x
                            : w == "y"     ? D::y
                            : w == "up"    ? D::up
                            : w == "down"  ? D::down
                            : w == "axial" ? D::axial
                                           : D::transverse;
        b.load->direction_where = b.range(in);
    }
};

template <>
struct action<g::rotation_sense> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.load->clockwise = in.string_view() == "clockwise";
    }
};

template <>
struct action<g::load_stmt> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        auto& c = b.current<syntax::CaseDecl>();
        c.loads.push_back(std::move(*b.load));
        c.load_where.push_back(b.range(b.load_begin, in.end()));
        b.load.reset();
    }
};

// ---------------------------------------------------------------- snow data

FIRN_ACTION(g::snow_begin, begin_statement<syntax::SnowDecl>);
FIRN_ACTION(g::snow_name, store_name<&syntax::SnowDecl::name>);
FIRN_ACTION(g::roof_begin, begin_statement<syntax::RoofDecl>);
template <>
struct action<g::projection_begin> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        action<g::roof_begin>::apply(in, b);
        b.current<syntax::RoofDecl>().projection = true;
    }
};
FIRN_ACTION(g::roof_name, store_name<&syntax::RoofDecl::name>);
FIRN_ACTION(g::projection_name, store_name<&syntax::RoofDecl::name>);
FIRN_ACTION(g::roof_member, append_name<&syntax::RoofDecl::members>);
FIRN_ACTION(g::projection_roof, append_name<&syntax::RoofDecl::members>);

FIRN_ACTION(g::setting_key, store_name<&Builder::pending_name>);
template <>
struct action<g::reason> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.pending_reason = std::pair{unquote(in.string_view()), b.range(in)};
    }
};

/// Moves the `because "..."` just read, if there is one, into `target`'s reason.
template <typename T>
void take_reason(Builder& b, T& target) {
    if (b.pending_reason) {
        target.reason = std::move(b.pending_reason->first);
        target.reason_where = b.pending_reason->second;
    }
    b.pending_reason.reset();
}

/// The settings list of the snow, roof or combine statement being read.
inline std::vector<syntax::Setting>& settings_of(Builder& b) {
    if (auto* snow = std::get_if<syntax::SnowDecl>(&b.statement->node))
        return snow->settings;
    if (auto* combine = std::get_if<syntax::CombineDecl>(&b.statement->node))
        return combine->settings;
    return b.current<syntax::RoofDecl>().settings;
}

template <>
struct action<g::setting> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        syntax::Setting setting{std::move(*b.pending_name), b.pop_expr(), std::nullopt, {}};
        take_reason(b, setting);
        settings_of(b).push_back(std::move(setting));
    }
};

FIRN_ACTION(g::amend_begin, begin_statement<syntax::AmendDecl>);
FIRN_ACTION(g::amend_name, store_name<&syntax::AmendDecl::name>);
template <>
struct action<g::amend_stmt> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        auto& amend = b.current<syntax::AmendDecl>();
        amend.value = b.pop_expr();
        take_reason(b, amend);
    }
};

// ---------------------------------------------------------------- combinations

FIRN_ACTION(g::combinations_begin, begin_statement<syntax::CombinationsDecl>);
FIRN_ACTION(g::combinations_name, store_name<&syntax::CombinationsDecl::name>);

template <>
struct action<g::combinations_by_case> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.current<syntax::CombinationsDecl>().by_case = true;
    }
};
FIRN_ACTION(g::combination_label,
            append_named<&syntax::CombinationsDecl::lines, &syntax::CombinationLine::label>);

/// The term of the combination line being read.
inline syntax::CombinationTerm& current_term(Builder& b) {
    return b.current<syntax::CombinationsDecl>().lines.back().terms.back();
}

template <>
struct action<g::combination_term_begin> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        b.current<syntax::CombinationsDecl>().lines.back().terms.emplace_back();
        b.pending_factor.reset();
    }
};
FIRN_ACTION(g::combination_factor, store_factor<&Builder::pending_factor>);

/// A factor before '(' multiplies every alternative inside.
template <>
struct action<g::alternatives_open> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        if (b.pending_factor)
            current_term(b).factor = *b.pending_factor;
        b.pending_factor.reset();
    }
};

template <>
struct action<g::combination_symbol> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        syntax::CombinationTerm::Alternative alternative;
        if (b.pending_factor)
            alternative.factor = *b.pending_factor;
        alternative.symbol = b.name(in);
        current_term(b).alternatives.push_back(std::move(alternative));
        b.pending_factor.reset();
    }
};

FIRN_ACTION(g::half_live_label, append_name<&syntax::CombinationsDecl::half_live_in>);

template <>
struct action<g::combination_body> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        auto& set = b.current<syntax::CombinationsDecl>();
        SourceRange where = b.range(in.begin(), in.end());
        set.line_where.push_back(where);
        if (!set.lines.empty() && set.lines.back().where.begin.line == 0)
            set.lines.back().where = where;
    }
};

FIRN_ACTION(g::combine_begin, begin_statement<syntax::CombineDecl>);
FIRN_ACTION(g::combine_set, append_name<&syntax::CombineDecl::sets>);

// ---------------------------------------------------------------- arrangements

FIRN_ACTION(g::pattern_begin, begin_statement<syntax::PatternDecl>);
FIRN_ACTION(g::pattern_name, store_name<&syntax::PatternDecl::name>);
FIRN_ACTION(g::pattern_label,
            append_named<&syntax::PatternDecl::lines, &syntax::PatternDecl::Line::label>);
FIRN_ACTION(g::pattern_selector,
            append_named<&syntax::PatternDecl::Line::parts, &syntax::PatternDecl::Part::selector>);
FIRN_ACTION(g::pattern_factor, store_factor<&syntax::PatternDecl::Part::factor>);
FIRN_ACTION(g::pattern_line, store<&syntax::PatternDecl::Line::where, matched_range>);

FIRN_ACTION(g::arrange_begin, begin_statement<syntax::ArrangeDecl>);
FIRN_ACTION(g::arrange_case, store_name<&syntax::ArrangeDecl::load_case>);
FIRN_ACTION(g::arrange_rule, store_name<&syntax::ArrangeDecl::rule>);
FIRN_ACTION(g::arrange_member, append_name<&syntax::ArrangeDecl::members>);

FIRN_ACTION(g::deflection_begin, begin_statement<syntax::DeflectionDecl>);
FIRN_ACTION(g::deflection_row, store_name<&syntax::DeflectionDecl::row>);
FIRN_ACTION(g::deflection_member, append_name<&syntax::DeflectionDecl::members>);

// ---------------------------------------------------------------- geometry

FIRN_ACTION(g::geometry_begin, begin_statement<syntax::GeometryTolerance>);
FIRN_ACTION(g::geometry_tolerance_value, store_expr<&syntax::GeometryTolerance::value>);
FIRN_ACTION(g::unjoined_begin, begin_statement<syntax::UnjoinedDecl>);
template <>
struct action<g::cover_begin> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.begin<syntax::CoverDecl>(in);
        b.current<syntax::CoverDecl>().keyword = {in.string(), b.range(in)};
    }
};
template <>
struct action<g::cover_key> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.current<syntax::CoverDecl>().fields.push_back({{in.string(), b.range(in)}, "", {}});
    }
};
template <>
struct action<g::cover_text> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        reject_invalid_utf8(in, b, "a cover text must be UTF-8 text");
        syntax::CoverDecl::Field& field = b.current<syntax::CoverDecl>().fields.back();
        field.text = unquote(in.string_view());
        field.text_where = b.range(in);
    }
};
FIRN_ACTION(g::unjoined_node, append_name<&syntax::UnjoinedDecl::nodes>);
FIRN_ACTION(g::unjoined_member, append_name<&syntax::UnjoinedDecl::members>);

// ---------------------------------------------------------------- expectations

using syntax::ExpectDecl;
FIRN_ACTION(g::expect_begin, begin_statement<ExpectDecl>);
FIRN_ACTION(g::expect_member_quantity, store_name<&ExpectDecl::quantity>);
FIRN_ACTION(g::expect_reaction_word, store_name<&ExpectDecl::quantity>);
FIRN_ACTION(g::expect_displacement_word, store_name<&ExpectDecl::quantity>);
FIRN_ACTION(g::expect_rotation_word, store_name<&ExpectDecl::quantity>);
FIRN_ACTION(g::expect_snow_word, store_name<&ExpectDecl::quantity>);
FIRN_ACTION(g::expect_reaction_component, store_name<&ExpectDecl::component>);
FIRN_ACTION(g::expect_displacement_component, store_name<&ExpectDecl::component>);
FIRN_ACTION(g::expect_member, append_name<&ExpectDecl::places>);
FIRN_ACTION(g::expect_node, append_name<&ExpectDecl::places>);
FIRN_ACTION(g::expect_snow_value, append_name<&ExpectDecl::places>);
FIRN_ACTION(g::expect_source, store_name<&ExpectDecl::source>);
FIRN_ACTION(g::expect_value, store_expr<&ExpectDecl::value>);
FIRN_ACTION(g::expect_high, store_expr<&ExpectDecl::high>);
FIRN_ACTION(g::expect_tolerance_value, store_expr<&ExpectDecl::tolerance>);

/// Stores the relation as written (`<=`, `>=`, `=`), or `between` for its word.
template <>
struct action<g::expect_relation> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        auto& expect = b.current<ExpectDecl>();
        expect.relation = in.string();
        expect.relation_where = b.range(in);
    }
};
FIRN_ACTION(g::expect_between_word, action<g::expect_relation>);

template <>
struct action<g::expect_percent> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        auto& expect = b.current<ExpectDecl>();
        expect.tolerance = b.pop_expr();
        expect.tolerance_percent = true;
    }
};
template <>
struct action<g::expect_stmt> {
    template <typename Input>
    static void apply(const Input&, Builder& b) {
        take_reason(b, b.current<ExpectDecl>());
    }
};

}  // namespace firn::parsing
