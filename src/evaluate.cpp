// evaluate: arithmetic on quantities with units, checked by dimension.
#include "evaluate.hpp"

#include <fmt/format.h>
#include <cmath>

namespace firn {

std::optional<Quantity> unit_value(const std::vector<syntax::UnitFactor>& unit,
                                   Diagnostics& diagnostics) {
    Quantity q{1.0, dim::number};
    bool ok = true;
    for (const syntax::UnitFactor& f : unit) {
        const Unit* u = find_unit(f.name);
        if (u == nullptr) {
            diagnostics.error(f.where, fmt::format("unknown unit '{}'{}", f.name,
                                                   did_you_mean(f.name, unit_names())));
            ok = false;
            continue;
        }
        int exponent = f.divides ? -f.exponent : f.exponent;
        q.value *= std::pow(u->to_si, exponent);
        q.dimension = q.dimension * power(u->dimension, exponent);
    }
    if (!ok)
        return std::nullopt;
    return q;
}

std::string unit_spelling(const std::vector<syntax::UnitFactor>& unit) {
    std::string out;
    for (std::size_t i = 0; i < unit.size(); ++i) {
        if (i > 0)
            out += unit[i].divides ? "/" : "*";
        out += unit[i].name;
        if (unit[i].exponent != 1)
            out += fmt::format("^{}", unit[i].exponent);
    }
    return out;
}

namespace {

std::optional<Quantity> evaluate_number(const syntax::Expr& e, Diagnostics& diagnostics) {
    if (!std::isfinite(e.value)) {
        diagnostics.error(e.where, fmt::format("the number {} is too large", e.literal));
        return std::nullopt;
    }
    if (e.bad_unit) {
        const std::string& word = e.bad_unit->text;
        diagnostics.error(e.bad_unit->where, fmt::format("unknown unit '{}'{}", word,
                                                         did_you_mean(word, unit_names())));
        return std::nullopt;
    }
    std::optional<Quantity> unit = unit_value(e.unit, diagnostics);
    if (!unit)
        return std::nullopt;
    return Quantity{e.value * unit->value, unit->dimension};
}

const char* operation_verb(syntax::Expr::Kind kind) {
    return kind == syntax::Expr::Kind::add ? "add" : "subtract";
}

std::optional<Quantity> combine(const syntax::Expr& e, Quantity a, Quantity b,
                                Diagnostics& diagnostics) {
    using K = syntax::Expr::Kind;
    switch (e.kind) {
        case K::add:
        case K::subtract:
            if (!(a.dimension == b.dimension)) {
                diagnostics.error(e.where,
                                  fmt::format("cannot {} {} and {}", operation_verb(e.kind),
                                              describe(a.dimension), describe(b.dimension)));
                return std::nullopt;
            }
            return Quantity{e.kind == K::add ? a.value + b.value : a.value - b.value, a.dimension};
        case K::multiply:
            return Quantity{a.value * b.value, a.dimension * b.dimension};
        case K::divide:
            if (b.value == 0.0) {
                diagnostics.error(e.rhs->where, "division by zero");
                return std::nullopt;
            }
            return Quantity{a.value / b.value, a.dimension / b.dimension};
        default:
            return std::nullopt;
    }
}

}  // namespace

std::optional<Quantity> evaluate(const syntax::Expr& e, Diagnostics& diagnostics) {
    using K = syntax::Expr::Kind;
    if (e.kind == K::number)
        return evaluate_number(e, diagnostics);
    if (e.kind == K::group)
        return evaluate(*e.rhs, diagnostics);
    if (e.kind == K::negate) {
        auto v = evaluate(*e.rhs, diagnostics);
        if (v)
            v->value = -v->value;
        return v;
    }
    auto a = evaluate(*e.lhs, diagnostics);
    auto b = evaluate(*e.rhs, diagnostics);
    if (!a || !b)
        return std::nullopt;
    auto result = combine(e, *a, *b, diagnostics);
    if (result && !std::isfinite(result->value)) {
        diagnostics.error(e.where, "this value is too large to be a finite number");
        return std::nullopt;
    }
    return result;
}

namespace {

/// How the user wrote what was found, for "expected ..., found ...".
std::string found_text(const syntax::Expr& e, Dimension found) {
    if (e.kind == syntax::Expr::Kind::number) {
        if (e.unit.empty())
            return e.literal;
        return fmt::format("{} {}, {}", e.literal, unit_spelling(e.unit), describe(found));
    }
    return describe(found);
}

/// '1/2 in' reads as 1 divided by 2 in; say so when that is the likely slip.
std::string fraction_hint(const syntax::Expr& e, const Expected& expected, Dimension found) {
    bool bare_over_quantity = e.kind == syntax::Expr::Kind::divide &&
                              e.lhs->kind == syntax::Expr::Kind::number && e.lhs->unit.empty();
    if (!bare_over_quantity || !(found == power(expected.dimension, -1)))
        return {};
    return " ('1/2 in' means 1 divided by 2 in; write (1/2) in or 0.5 in)";
}

}  // namespace

std::optional<double> evaluate_as(const syntax::Expr& e, const Expected& expected,
                                  Diagnostics& diagnostics) {
    std::optional<Quantity> q = evaluate(e, diagnostics);
    if (!q)
        return std::nullopt;
    if (!(q->dimension == expected.dimension)) {
        diagnostics.error(e.where, fmt::format("expected {} such as {}, found {}{}", expected.noun,
                                               expected.example, found_text(e, q->dimension),
                                               fraction_hint(e, expected, q->dimension)));
        return std::nullopt;
    }
    return q->value;
}

}  // namespace firn
