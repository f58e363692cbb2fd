// evaluate: expressions with units -> SI values, with dimension checks.
// Part of the resolve stage.
#pragma once

#include <array>
#include <optional>
#include <string>
#include <vector>

#include "base/diag.hpp"
#include "base/units.hpp"
#include "ir/syntax.hpp"

namespace firn {

/// A value in SI with its dimension.
struct Quantity {
    double value = 0.0;
    Dimension dimension;
};

/// What a place in the language expects: a dimension, and words for messages
/// ("a length", "12 ft").
struct Expected {
    Dimension dimension;
    const char* noun;
    const char* example;
};

namespace expected {
inline constexpr Expected length{dim::length, "a length", "12 ft"};
inline constexpr Expected force{dim::force, "a force", "2 kip"};
inline constexpr Expected moment{dim::moment, "a moment", "10 kip*ft"};
inline constexpr Expected line_load{dim::force_per_length, "a force per length", "0.5 kip/ft"};
inline constexpr Expected modulus{dim::pressure, "a modulus", "29000 ksi"};
inline constexpr Expected area{dim::area, "an area", "9.12 in^2"};
inline constexpr Expected inertia{dim::inertia, "a second moment of area", "110 in^4"};
inline constexpr Expected unit_weight{dim::unit_weight, "a unit weight", "490 pcf"};
inline constexpr Expected stiffness{dim::force_per_length, "a spring stiffness", "200 kip/in"};
inline constexpr Expected rotational_stiffness{dim::moment, "a rotational stiffness",
                                               "5000 kip*ft/rad"};
}  // namespace expected

/// The named values an expression may use (the model's `let` constants).
class Scope {
  public:
    virtual ~Scope() = default;
    /// The value of the constant `ref` names (an Expr of kind constant), or
    /// nullopt after reporting why not (unknown, defined by itself, in error).
    virtual std::optional<Quantity> constant(const syntax::Expr& ref, Diagnostics& diagnostics) = 0;
};

/// The size in SI and the dimension of a written unit; nullopt after reporting
/// an unknown unit.
std::optional<Quantity> unit_value(const std::vector<syntax::UnitFactor>& unit,
                                   Diagnostics& diagnostics);

/// The unit as the user should write it: `kip*ft/in^2`.
std::string unit_spelling(const std::vector<syntax::UnitFactor>& unit);

/// An expression as the model writes it, spaced canonically: `4 m / 150`, `(1/2) in`
/// prints `(1 / 2) in`. Groups are nodes of the tree, so no parenthesis is added.
std::string expression_text(const syntax::Expr& e);

/// Evaluates `expr`; nullopt after reporting an error (an unknown unit or
/// constant, a dimension mismatch, a number that is not finite). Without a
/// scope, no constant is known.
std::optional<Quantity> evaluate(const syntax::Expr& expr, Diagnostics& diagnostics,
                                 Scope* scope = nullptr);

/// Evaluates `expr` and checks it has the expected dimension, reporting
/// "expected a length such as 12 ft, found 12" otherwise.
std::optional<double> evaluate_as(const syntax::Expr& expr, const Expected& expected,
                                  Diagnostics& diagnostics, Scope* scope = nullptr);

}  // namespace firn
