// evaluate: arithmetic on quantities with units, checked by dimension.
#include "resolve/evaluate.hpp"

#include <fmt/format.h>
#include <fmt/ranges.h>
#include <array>
#include <cmath>
#include <cstdlib>

namespace firn {
namespace {

/// The largest power of force or length a value may have. No quantity of a
/// frame needs more, and Dimension keeps its powers in 8 bits, which would wrap.
constexpr long long kMaxPower = 100;

/// How deep evaluation may go before a value names another value. One
/// expression is at most about a thousand levels deep (the parser's limits),
/// but values naming values add their depths: thirty values of a thousand
/// terms each overflowed the stack, and so did 3900 values each naming the
/// next in a sanitizer build. This keeps the whole well inside it.
constexpr int kMaxEvaluationDepth = 2000;

/// The depth of evaluate() calls on this thread, across values naming values.
thread_local int evaluation_depth = 0;

/// Counts one evaluate() call for as long as it runs.
class DepthGuard {
  public:
    DepthGuard() { ++evaluation_depth; }
    ~DepthGuard() { --evaluation_depth; }
    DepthGuard(const DepthGuard&) = delete;
    DepthGuard& operator=(const DepthGuard&) = delete;
};

/// The dimension force^f * length^l, or nullopt if a power is beyond kMaxPower.
std::optional<Dimension> dimension_of(long long force, long long length) {
    if (std::abs(force) > kMaxPower || std::abs(length) > kMaxPower)
        return std::nullopt;
    return Dimension{static_cast<std::int8_t>(force), static_cast<std::int8_t>(length)};
}

}  // namespace

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
        // Wide integers: a written power may be any int, even the most negative.
        long long exponent = f.divides ? -static_cast<long long>(f.exponent) : f.exponent;
        auto d = dimension_of(q.dimension.force + u->dimension.force * exponent,
                              q.dimension.length + u->dimension.length * exponent);
        if (!d) {
            diagnostics.error(f.where, fmt::format("this unit's power is too high (beyond "
                                                   "force or length to the power {})",
                                                   kMaxPower));
            return std::nullopt;
        }
        q.value *= std::pow(u->to_si, static_cast<double>(exponent));
        q.dimension = *d;
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
    using K = syntax::Expr::Kind;
    return kind == K::add        ? "add"
           : kind == K::subtract ? "subtract"
           : kind == K::multiply ? "multiply"
                                 : "divide";
}

/// a * b or a / b, refused when the powers of the result's dimension would go
/// beyond kMaxPower (a dimension check must never pass by wrapping around).
std::optional<Quantity> multiply(const syntax::Expr& e, Quantity a, Quantity b,
                                 Diagnostics& diagnostics) {
    int sign = e.kind == syntax::Expr::Kind::divide ? -1 : 1;
    auto d = dimension_of(a.dimension.force + sign * b.dimension.force,
                          a.dimension.length + sign * b.dimension.length);
    if (!d) {
        diagnostics.error(e.where, fmt::format("cannot {} {} and {}: the result would be "
                                               "beyond force or length to the power {}",
                                               operation_verb(e.kind), describe(a.dimension),
                                               describe(b.dimension), kMaxPower));
        return std::nullopt;
    }
    if (sign < 0 && b.value == 0.0) {
        diagnostics.error(e.rhs->where, "division by zero");
        return std::nullopt;
    }
    return Quantity{sign > 0 ? a.value * b.value : a.value / b.value, *d};
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
        case K::divide:
            return multiply(e, a, b, diagnostics);
        default:
            return std::nullopt;
    }
}

}  // namespace

namespace {

/// Exponents of a dimension raised to `exponent`, if they stay whole numbers.
std::optional<Dimension> raise_dimension(Dimension d, double exponent) {
    double force = d.force * exponent, length = d.length * exponent;
    if (force != std::round(force) || length != std::round(length) || std::abs(force) > 100 ||
        std::abs(length) > 100) {
        return std::nullopt;
    }
    return Dimension{static_cast<std::int8_t>(force), static_cast<std::int8_t>(length)};
}

std::optional<Quantity> evaluate_power(const syntax::Expr& e, Quantity base, Quantity exponent,
                                       Diagnostics& diagnostics) {
    if (!(exponent.dimension == dim::number)) {
        diagnostics.error(e.rhs->where, fmt::format("a power must be a plain number, found {}",
                                                    describe(exponent.dimension)));
        return std::nullopt;
    }
    auto d = raise_dimension(base.dimension, exponent.value);
    if (!d) {
        diagnostics.error(e.where, fmt::format("{} to the power {:g} has no unit",
                                               describe(base.dimension), exponent.value));
        return std::nullopt;
    }
    return Quantity{std::pow(base.value, exponent.value), *d};
}

/// `(a)`, or `(a) unit`: the group times its unit, as `(1/2) in` is half an inch.
std::optional<Quantity> evaluate_group(const syntax::Expr& e, Diagnostics& diagnostics,
                                       Scope* scope) {
    std::optional<Quantity> inside = evaluate(*e.rhs, diagnostics, scope);
    if (!inside || e.unit.empty())
        return inside;
    std::optional<Quantity> unit = unit_value(e.unit, diagnostics);
    if (!unit)
        return std::nullopt;
    return multiply(e, *inside, *unit, diagnostics);
}

std::optional<Quantity> evaluate_call(const syntax::Expr& e, Diagnostics& diagnostics,
                                      Scope* scope) {
    const std::string& f = e.literal;
    bool known = f == "min" || f == "max" || f == "abs" || f == "sqrt";
    if (!known) {
        // A near miss is named alone; the whole list only helps when nothing is close.
        std::string best = closest_match(
            f, std::vector<std::string>(syntax::functions.begin(), syntax::functions.end()));
        SourceRange name = e.where;
        name.end = name.begin;
        name.end.offset += static_cast<std::uint32_t>(f.size());
        name.end.column += static_cast<std::uint32_t>(f.size());
        diagnostics.error(name, best.empty() ? fmt::format("unknown function '{}'; the functions "
                                                           "are min, max, abs and sqrt",
                                                           f)
                                             : fmt::format("unknown function '{}'; did you mean "
                                                           "'{}'?",
                                                           f, best));
        return std::nullopt;
    }
    bool one_argument = f == "abs" || f == "sqrt";
    if (one_argument ? e.args.size() != 1 : e.args.size() < 2) {
        diagnostics.error(e.where, fmt::format("{}() takes {}", f,
                                               one_argument ? "one value" : "two or more values"));
        return std::nullopt;
    }
    std::vector<Quantity> args;
    for (const syntax::Expr& a : e.args) {
        auto v = evaluate(a, diagnostics, scope);
        if (!v)
            return std::nullopt;
        args.push_back(*v);
    }
    if (f == "abs")
        return Quantity{std::abs(args[0].value), args[0].dimension};
    if (f == "sqrt") {
        auto d = raise_dimension(args[0].dimension, 0.5);
        if (!d) {
            diagnostics.error(e.where, fmt::format("the square root of {} has no unit",
                                                   describe(args[0].dimension)));
            return std::nullopt;
        }
        if (args[0].value < 0.0) {
            diagnostics.error(e.args[0].where, "the square root of a negative value");
            return std::nullopt;
        }
        return Quantity{std::sqrt(args[0].value), *d};
    }
    Quantity best = args[0];
    for (std::size_t i = 1; i < args.size(); ++i) {
        if (!(args[i].dimension == best.dimension)) {
            diagnostics.error(e.args[i].where,
                              fmt::format("{}() compares values of one kind: {} and {}", f,
                                          describe(best.dimension), describe(args[i].dimension)));
            return std::nullopt;
        }
        if (f == "min" ? args[i].value < best.value : args[i].value > best.value)
            best = args[i];
    }
    return best;
}

std::optional<Quantity> evaluate_leaf(const syntax::Expr& e, Diagnostics& diagnostics,
                                      Scope* scope) {
    using K = syntax::Expr::Kind;
    switch (e.kind) {
        case K::number:
            return evaluate_number(e, diagnostics);
        case K::constant:
            if (scope == nullptr) {
                diagnostics.error(e.where, fmt::format("unknown value '{}'", e.literal));
                return std::nullopt;
            }
            if (evaluation_depth >= kMaxEvaluationDepth) {
                diagnostics.error(e.where, fmt::format("'{}' is too deep in a chain of values "
                                                       "(more than {} levels of values and "
                                                       "operations)",
                                                       e.literal, kMaxEvaluationDepth));
                return std::nullopt;
            }
            return scope->constant(e, diagnostics);
        case K::call:
            return evaluate_call(e, diagnostics, scope);
        case K::group:
            return evaluate_group(e, diagnostics, scope);
        default: {
            auto v = evaluate(*e.rhs, diagnostics, scope);  // negate
            if (v)
                v->value = -v->value;
            return v;
        }
    }
}

}  // namespace

std::optional<Quantity> evaluate(const syntax::Expr& e, Diagnostics& diagnostics, Scope* scope) {
    using K = syntax::Expr::Kind;
    DepthGuard depth;
    std::optional<Quantity> result;
    if (e.lhs == nullptr) {
        result = evaluate_leaf(e, diagnostics, scope);
    } else {
        auto a = evaluate(*e.lhs, diagnostics, scope);
        auto b = evaluate(*e.rhs, diagnostics, scope);
        if (!a || !b)
            return std::nullopt;
        result = e.kind == K::power ? evaluate_power(e, *a, *b, diagnostics)
                                    : combine(e, *a, *b, diagnostics);
    }
    if (result && !std::isfinite(result->value)) {
        diagnostics.error(e.where, std::isnan(result->value)
                                       ? "this value is not a number (a negative value to a "
                                         "fractional power?)"
                                       : "this value is too large to be a finite number");
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
    if (e.kind == syntax::Expr::Kind::constant)  // the name leads back to its `let`
        return fmt::format("'{}', {}", e.literal, describe(found));
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
                                  Diagnostics& diagnostics, Scope* scope) {
    std::optional<Quantity> q = evaluate(e, diagnostics, scope);
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

std::string expression_text(const syntax::Expr& e) {
    using K = syntax::Expr::Kind;
    // fmt::format, not string +: g++ 12 warns falsely (-Wrestrict) on chains of +.
    std::string unit = e.unit.empty() ? std::string() : fmt::format(" {}", unit_spelling(e.unit));
    switch (e.kind) {
        case K::number:
            return fmt::format("{}{}", e.literal, unit);
        case K::constant:
            return e.literal;
        case K::call: {
            std::vector<std::string> args;
            for (const syntax::Expr& a : e.args)
                args.push_back(expression_text(a));
            return fmt::format("{}({})", e.literal, fmt::join(args, ", "));
        }
        case K::negate:
            return fmt::format("-{}", expression_text(*e.rhs));
        case K::group:
            return fmt::format("({}){}", expression_text(*e.rhs), unit);
        case K::power:
            return fmt::format("{}^{}", expression_text(*e.lhs), expression_text(*e.rhs));
        default:
            break;
    }
    static constexpr std::array<std::pair<K, const char*>, 4> kOperators{
        {{K::add, " + "}, {K::subtract, " - "}, {K::multiply, " * "}, {K::divide, " / "}}};
    // + - * / nest to the left without limit: walked with a loop, never recursion.
    std::vector<const syntax::Expr*> chain;
    const syntax::Expr* first = &e;
    while (first->kind == K::add || first->kind == K::subtract || first->kind == K::multiply ||
           first->kind == K::divide) {
        chain.push_back(first);
        first = first->lhs.get();
    }
    std::string text = expression_text(*first);
    for (auto it = chain.rbegin(); it != chain.rend(); ++it) {
        for (const auto& [kind, op] : kOperators) {
            if ((*it)->kind == kind)
                text.append(op);
        }
        text.append(expression_text(*(*it)->rhs));
    }
    return text;
}

}  // namespace firn
