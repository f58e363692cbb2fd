// parse_actions: the PEGTL actions of the grammar's lexical rules and
// expressions, and the generic actions that the statements' actions are made
// of (store a name, an expression or a factor in a field of the draft).
// Private to src/front/; only parse.cpp includes it, through
// parse_statement_actions.hpp.
#pragma once

#include <fmt/format.h>
#include <algorithm>
#include <charconv>
#include <iterator>
#include <limits>
#include <memory>
#include <string>
#include <string_view>
#include <type_traits>

#include "front/parse_builder.hpp"
#include "grammar/grammar.hpp"

namespace firn::parsing {

namespace g = grammar;
using syntax::Expr;

/// The action of each rule of the grammar; rules without one do nothing.
template <typename Rule>
struct action : pegtl::nothing<Rule> {};

/// Gives `rule` the action `...`: a generic action below or another rule's. One
/// line a rule, as errors.hpp gives one line a message.
#define FIRN_ACTION(rule, ...) \
    template <>                \
    struct action<rule> : __VA_ARGS__ {}

// ---------------------------------------------------------------- generic actions
//
// Most actions put one thing (a name, an expression, a factor, a fixed value)
// into one field of the draft. They are written once here, over a member
// pointer, so that a statement's action is one line naming its field.

/// Starts the draft of a statement of type T at its keyword.
template <typename T>
struct begin_statement {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.begin<T>(in);
    }
};

/// The struct that a pointer to a data member points into.
template <typename Pointer>
struct owner_of;
template <typename Owner, typename Field>
struct owner_of<Field Owner::*> {
    using type = Owner;
};

/// The part of the draft that holds fields of type Owner: the statement being
/// read, or the load, grid run, member options or pattern line or part inside it,
/// the expression read last, or the builder itself for what waits for the rest
/// of its item (`pending_*`).
template <typename Owner>
Owner& draft(Builder& b) {
    if constexpr (std::is_same_v<Owner, Builder>) {
        return b;
    } else if constexpr (std::is_same_v<Owner, Expr>) {
        return b.exprs.back();
    } else if constexpr (std::is_same_v<Owner, syntax::LoadDecl>) {
        return *b.load;
    } else if constexpr (std::is_same_v<Owner, syntax::Grid::Run>) {
        return *b.current<syntax::Grid>().run;
    } else if constexpr (std::is_same_v<Owner, syntax::MemberOptions>) {
        return options_of(*b.statement);
    } else if constexpr (std::is_same_v<Owner, syntax::PatternDecl::Line>) {
        return b.current<syntax::PatternDecl>().lines.back();
    } else if constexpr (std::is_same_v<Owner, syntax::PatternDecl::Part>) {
        return b.current<syntax::PatternDecl>().lines.back().parts.back();
    } else {
        return b.current<Owner>();
    }
}

/// The field a member pointer names, in its part of the draft.
template <auto Field>
auto& field_of(Builder& b) {
    return draft<typename owner_of<decltype(Field)>::type>(b).*Field;
}

/// What a storing action takes: the matched text as a name.
struct matched_name {
    template <typename Input>
    static syntax::Name take(const Input& in, Builder& b) {
        return b.name(in);
    }
};
/// The expression just read (the match's last operand).
struct last_expr {
    template <typename Input>
    static Expr take(const Input&, Builder& b) {
        return b.pop_expr();
    }
};
/// The matched number as a combination or pattern factor.
struct matched_factor {
    template <typename Input>
    static syntax::Factor take(const Input& in, Builder& b) {
        return syntax::Factor{number_value(in.string_view()), b.range(in)};
    }
};
/// The matched `x` or `y` as an axis.
struct matched_axis {
    template <typename Input>
    static syntax::Axis take(const Input& in, Builder&) {
        return axis_of(in.string_view());
    }
};
/// The source range of the match.
struct matched_range {
    template <typename Input>
    static SourceRange take(const Input& in, Builder& b) {
        return b.range(in);
    }
};
/// A value fixed by the rule (a kind, a flag).
template <auto Value>
struct fixed_value {
    template <typename Input>
    static auto take(const Input&, Builder&) {
        return Value;
    }
};

/// Sets `Field` of its part of the draft to what `Take` takes.
template <auto Field, typename Take>
struct store {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        field_of<Field>(b) = Take::take(in, b);
    }
};
/// Appends what `Take` takes to the list `Field` of its part of the draft.
template <auto Field, typename Take>
struct append {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        field_of<Field>(b).push_back(Take::take(in, b));
    }
};

/// Appends a new item to the list `Field` of its part of the draft, with the
/// matched name in the item's `NameField` (a combination's or pattern's line
/// and its label, a pattern part and its selector).
template <auto Field, auto NameField>
struct append_named {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        field_of<Field>(b).emplace_back().*NameField = b.name(in);
    }
};

/// Stores the matched name.
template <auto Field>
using store_name = store<Field, matched_name>;
/// Appends the matched name.
template <auto Field>
using append_name = append<Field, matched_name>;
/// Stores the expression just read.
template <auto Field>
using store_expr = store<Field, last_expr>;
/// Appends the expression just read.
template <auto Field>
using append_expr = append<Field, last_expr>;
/// Stores the matched number as a factor.
template <auto Field>
using store_factor = store<Field, matched_factor>;
/// Stores a value fixed by the rule.
template <auto Field, auto Value>
using store_value = store<Field, fixed_value<Value>>;

// ---------------------------------------------------------------- comments, numbers, units

/// One unit factor from the text of unit_lead/unit_times/unit_hyphen/unit_per.
template <typename Input>
syntax::UnitFactor unit_factor(const Input& in, const Builder& b, bool divides) {
    const char* p = in.begin();
    while (!((*p >= 'a' && *p <= 'z') || (*p >= 'A' && *p <= 'Z')))
        ++p;
    const char* name_end = p;
    while (name_end < in.end() &&
           ((*name_end >= 'a' && *name_end <= 'z') || (*name_end >= 'A' && *name_end <= 'Z'))) {
        ++name_end;
    }
    syntax::UnitFactor f;
    f.name.assign(p, name_end);
    f.divides = divides;
    const char* q = name_end;
    if (q < in.end() && *q == '^')
        ++q;
    if (q < in.end()) {
        int exponent = 1;
        auto [end, ec] = std::from_chars(q, in.end(), exponent);
        // Too large for an int: keep it far beyond any dimension, so that
        // evaluate refuses it instead of reading the unit without its power.
        if (ec == std::errc::result_out_of_range)
            exponent = std::numeric_limits<int>::max();
        (void)end;
        f.exponent = exponent;
    }
    f.where = b.range(p, in.end());
    return f;
}

template <>
struct action<g::comment> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        // Backtracking can read a comment twice; keep each once.
        if (b.offset(in.begin()) < b.next_comment_offset)
            return;
        b.next_comment_offset = b.offset(in.end());
        b.tree.comments.push_back(syntax::Comment{in.string(), b.range(in)});
    }
};

template <>
struct action<g::number> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        Expr e;
        e.literal = in.string();
        e.value = number_value(e.literal);
        e.where = b.range(in);
        b.exprs.push_back(std::move(e));
    }
};

/// Appends the matched factor to the unit being read.
template <bool Divides>
struct append_unit_factor {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.unit.push_back(unit_factor(in, b, Divides));
    }
};
FIRN_ACTION(g::unit_lead, append_unit_factor<false>);
FIRN_ACTION(g::unit_times, append_unit_factor<false>);
FIRN_ACTION(g::unit_hyphen, append_unit_factor<false>);
FIRN_ACTION(g::unit_per, append_unit_factor<true>);

template <>
struct action<g::quantity> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.exprs.back().unit = std::move(b.unit);
        b.unit.clear();
        b.exprs.back().where = b.range(in);
    }
};

FIRN_ACTION(g::bad_unit, store_name<&Expr::bad_unit>);

// ---------------------------------------------------------------- expressions

template <>
struct action<g::paren_open> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.enter_nesting(in);
    }
};
FIRN_ACTION(g::minus_sign, action<g::paren_open>);

/// Refuses an expression whose tree has grown too deep.
template <typename Input>
void check_depth(const Expr& e, const Input& in) {
    if (e.depth > kMaxDepth) {
        throw pegtl::parse_error(
            fmt::format("this expression is too long (more than {} operations)", kMaxDepth), in);
    }
}

/// Wraps the expression read last in a unary expression (a group, a negation)
/// that covers the match.
template <Expr::Kind Kind>
struct fold_unary {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        Expr e;
        e.kind = Kind;
        e.rhs = std::make_unique<Expr>(b.pop_expr());
        e.depth = e.rhs->depth + 1;
        e.where = b.range(in);
        check_depth(e, in);
        b.exprs.push_back(std::move(e));
        --b.nesting;
    }
};
FIRN_ACTION(g::group, fold_unary<Expr::Kind::group>);
FIRN_ACTION(g::negation, fold_unary<Expr::Kind::negate>);

template <>
struct action<g::group_unit> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        Expr& group = b.exprs.back();
        group.unit = std::move(b.unit);
        b.unit.clear();
        group.where.end = b.range(in).end;
    }
};

/// Folds the two topmost expressions into one binary expression.
template <typename Input>
void fold_binary(const Input& in, Builder& b) {
    std::string_view text(in.begin(), in.size());
    char op = text[text.find_first_not_of(" \t")];
    Expr rhs = b.pop_expr();
    Expr lhs = b.pop_expr();
    Expr e;
    e.kind = op == '*'   ? Expr::Kind::multiply
             : op == '/' ? Expr::Kind::divide
             : op == '+' ? Expr::Kind::add
             : op == '^' ? Expr::Kind::power
                         : Expr::Kind::subtract;
    e.where = SourceRange{lhs.where.file, lhs.where.begin, rhs.where.end};
    e.depth = std::max(lhs.depth, rhs.depth) + 1;
    check_depth(e, in);
    e.lhs = std::make_unique<Expr>(std::move(lhs));
    e.rhs = std::make_unique<Expr>(std::move(rhs));
    b.exprs.push_back(std::move(e));
}

template <>
struct action<g::product_tail> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        fold_binary(in, b);
    }
};
FIRN_ACTION(g::sum_tail, action<g::product_tail>);
FIRN_ACTION(g::caret, action<g::paren_open>);  // powers nest to the right
template <>
struct action<g::power_tail> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        fold_binary(in, b);
        --b.nesting;
    }
};

template <>
struct action<g::constant> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        Expr e;
        e.kind = Expr::Kind::constant;
        e.literal = in.string();
        e.where = b.range(in);
        b.exprs.push_back(std::move(e));
    }
};

template <>
struct action<g::call_head> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        b.enter_nesting(in);
        syntax::Name function{std::string(in.begin(), in.size() - 1),
                              b.range(in.begin(), in.end() - 1)};
        b.calls.push_back(Builder::OpenCall{std::move(function), b.exprs.size()});
    }
};

template <>
struct action<g::call> {
    template <typename Input>
    static void apply(const Input& in, Builder& b) {
        Builder::OpenCall open = std::move(b.calls.back());
        b.calls.pop_back();
        Expr e;
        e.kind = Expr::Kind::call;
        e.literal = std::move(open.function.text);
        e.where = b.range(in);
        auto first = b.exprs.begin() + static_cast<std::ptrdiff_t>(open.first_argument);
        e.args.assign(std::make_move_iterator(first), std::make_move_iterator(b.exprs.end()));
        b.exprs.erase(first, b.exprs.end());
        for (const Expr& a : e.args)
            e.depth = std::max(e.depth, a.depth + 1);
        check_depth(e, in);
        b.exprs.push_back(std::move(e));
        --b.nesting;
    }
};

}  // namespace firn::parsing
