// lsp_values: `let` values for hovers, and quantities in the model's units. The
// resolve stage evaluates the same expressions into the Model, which keeps no
// `let`; the few rules of arithmetic on units are repeated here for the editor.
#include <fmt/format.h>
#include <algorithm>
#include <cmath>
#include <map>

#include "base/number_format.hpp"
#include "lsp/lsp_internal.hpp"

namespace firn::lsp {
namespace {

struct Quantity {
    double value = 0.0;
    Dimension dimension;
};

using Scope = std::map<std::string, Quantity, std::less<>>;

std::optional<Quantity> unit_quantity(const std::vector<syntax::UnitFactor>& unit) {
    Quantity q{1.0, dim::number};
    for (const syntax::UnitFactor& f : unit) {
        const Unit* u = find_unit(f.name);
        if (u == nullptr)
            return std::nullopt;
        int e = f.divides ? -f.exponent : f.exponent;
        q.value *= std::pow(u->to_si, e);
        q.dimension = q.dimension * power(u->dimension, e);
    }
    return q;
}

std::optional<Quantity> evaluate(const syntax::Expr& e, const Scope& scope);

std::optional<Quantity> evaluate_call(const syntax::Expr& e, const Scope& scope) {
    std::vector<Quantity> args;
    for (const syntax::Expr& a : e.args) {
        std::optional<Quantity> q = evaluate(a, scope);
        if (!q)
            return std::nullopt;
        args.push_back(*q);
    }
    if (args.empty())
        return std::nullopt;
    if (e.literal == "abs")
        return Quantity{std::fabs(args[0].value), args[0].dimension};
    if (e.literal == "sqrt") {
        Dimension d = args[0].dimension;
        if (d.force % 2 != 0 || d.length % 2 != 0 || args[0].value < 0)
            return std::nullopt;
        Dimension half{static_cast<std::int8_t>(d.force / 2),
                       static_cast<std::int8_t>(d.length / 2)};
        return Quantity{std::sqrt(args[0].value), half};
    }
    auto less = [](const Quantity& a, const Quantity& b) { return a.value < b.value; };
    if (e.literal == "min")
        return *std::min_element(args.begin(), args.end(), less);
    if (e.literal == "max")
        return *std::max_element(args.begin(), args.end(), less);
    return std::nullopt;
}

std::optional<Quantity> evaluate_binary(const syntax::Expr& e, const Scope& scope) {
    if (!e.lhs || !e.rhs)
        return std::nullopt;
    std::optional<Quantity> a = evaluate(*e.lhs, scope), b = evaluate(*e.rhs, scope);
    if (!a || !b)
        return std::nullopt;
    switch (e.kind) {
        case syntax::Expr::Kind::add:
            return Quantity{a->value + b->value, a->dimension};
        case syntax::Expr::Kind::subtract:
            return Quantity{a->value - b->value, a->dimension};
        case syntax::Expr::Kind::multiply:
            return Quantity{a->value * b->value, a->dimension * b->dimension};
        case syntax::Expr::Kind::divide:
            return Quantity{a->value / b->value, a->dimension / b->dimension};
        case syntax::Expr::Kind::power: {
            auto n = static_cast<int>(b->value);
            return Quantity{std::pow(a->value, n), power(a->dimension, n)};
        }
        default:
            return std::nullopt;
    }
}

std::optional<Quantity> evaluate(const syntax::Expr& e, const Scope& scope) {
    using Kind = syntax::Expr::Kind;
    switch (e.kind) {
        case Kind::number: {
            std::optional<Quantity> unit = unit_quantity(e.unit);
            if (!unit || e.bad_unit)
                return std::nullopt;
            return Quantity{e.value * unit->value, unit->dimension};
        }
        case Kind::constant: {
            auto found = scope.find(e.literal);
            return found == scope.end() ? std::nullopt : std::optional(found->second);
        }
        case Kind::call:
            return evaluate_call(e, scope);
        case Kind::negate:
        case Kind::group: {
            const syntax::Expr* inner = e.rhs ? e.rhs.get() : e.lhs.get();
            std::optional<Quantity> q = inner ? evaluate(*inner, scope) : std::nullopt;
            if (q && e.kind == Kind::negate)
                q->value = -q->value;
            return q;
        }
        default:
            return evaluate_binary(e, scope);
    }
}

const DisplayUnit* display_unit(const DisplayUnits& u, Dimension d) {
    const std::array<std::pair<Dimension, const DisplayUnit*>, 8> table{{
        {dim::length, &u.length},
        {dim::force, &u.force},
        {dim::moment, &u.moment},
        {dim::force_per_length, &u.force_per_length},
        {dim::pressure, &u.pressure},
        {dim::area, &u.area},
        {dim::inertia, &u.inertia},
        {dim::unit_weight, &u.unit_weight},
    }};
    for (const auto& [dimension, unit] : table) {
        if (dimension == d)
            return unit;
    }
    return nullptr;
}

/// A dimension no display unit has, in SI: "N^2*m^-1".
std::string si_unit(Dimension d) {
    std::string out;
    auto factor = [&out](const char* base, int e) {
        if (e == 0)
            return;
        if (!out.empty())
            out += '*';
        out += e == 1 ? std::string(base) : fmt::format("{}^{}", base, e);
    };
    factor("N", d.force);
    factor("m", d.length);
    return out;
}

}  // namespace

std::string show_quantity(const DisplayUnits& units, double value, Dimension dimension) {
    std::string out;
    if (const DisplayUnit* unit = display_unit(units, dimension)) {
        append_fixed(out, unit->from_si(value), unit->decimals);
        return out + " " + unit->name;
    }
    if (dimension == dim::number) {
        append_fixed(out, value, 4);
        return out;
    }
    return fmt::format("{:g} {}", value, si_unit(dimension));
}

std::vector<LetValue> let_values(const CheckedModel& checked) {
    Scope scope;
    std::vector<LetValue> out;
    for (const syntax::Tree& tree : checked.trees) {
        for (const syntax::Statement& s : tree.statements) {
            const auto* let = std::get_if<syntax::LetDecl>(&s.node);
            if (let == nullptr || let->text)
                continue;
            std::optional<Quantity> q = evaluate(let->value, scope);
            if (!q || !std::isfinite(q->value))
                continue;
            scope[let->name.text] = *q;
            out.push_back({let->name.text, q->value, q->dimension, let->name.where});
        }
    }
    return out;
}

}  // namespace firn::lsp
