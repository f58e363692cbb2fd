// resolve_second_order: the second-order settings of the `combine` statement.
//
//   combine asce7_16.strength {
//     second_order = yes
//     second_order_tolerance = 1e-9      # optional, relative change per iteration
//     second_order_iterations = 50       # optional, the most iterations
//     notional = aisc360_16.notional     # N_i = factor x Y_i (AISC 360-16 C2.2b)
//     notional_toward = right            # or left: the sway the loads are added to
//     flexural_stiffness = aisc360_16.flexural_stiffness  # 0.8 tau_b (C2.3)
//     axial_stiffness = aisc360_16.axial_stiffness        # 0.8 (C2.3)
//     critical_factor_warning = 10       # warn below this critical load factor
//   }
#include <fmt/format.h>
#include <algorithm>
#include <array>
#include <cmath>
#include <string_view>

#include "resolve/resolve_internal.hpp"

namespace firn::resolve_detail {
namespace {

constexpr Expected kPlainNumber{dim::number, "a plain number", "0.8"};

constexpr std::array<std::string_view, 8> kKeys{
    "second_order",    "second_order_tolerance", "second_order_iterations",
    "notional",        "notional_toward",        "flexural_stiffness",
    "axial_stiffness", "critical_factor_warning"};

/// A plain number of the setting, checked by `good`; nullopt after an error.
template <typename Good>
std::optional<double> number(Resolver& r, const syntax::Setting& s, Good good,
                             const char* requirement) {
    auto v = r.value(s.value, kPlainNumber);
    if (!v)
        return std::nullopt;
    if (!std::isfinite(*v) || !good(*v)) {
        r.diagnostics.error(s.value.where, fmt::format("{} {}", s.key.text, requirement));
        return std::nullopt;
    }
    return v;
}

/// A yes/no or a word of `choices`; nullopt after an error.
std::optional<std::string> word(Resolver& r, const syntax::Setting& s,
                                std::initializer_list<std::string_view> choices) {
    if (s.value.kind == syntax::Expr::Kind::constant) {
        for (std::string_view c : choices) {
            if (s.value.literal == c)
                return s.value.literal;
        }
    }
    r.diagnostics.error(s.value.where,
                        fmt::format("{} is {}", s.key.text, fmt::join(choices, " or ")));
    return std::nullopt;
}

bool apply(Resolver& r, const syntax::Setting& s, CombineChoice& choice) {
    SecondOrderOptions& o = choice.second_order_options;
    const std::string& key = s.key.text;
    if (key == "second_order") {
        auto w = word(r, s, {"yes", "no"});
        choice.second_order = w && *w == "yes";
        return w.has_value();
    }
    if (key == "notional_toward") {
        auto w = word(r, s, {"right", "left"});
        o.notional_direction = w && *w == "left" ? -1.0 : 1.0;
        return w.has_value();
    }
    std::optional<double> v;
    if (key == "second_order_tolerance") {
        v = number(
            r, s, [](double x) { return x > 0.0 && x < 1.0; },
            "must be greater than 0 and less than 1");
        o.tolerance = v.value_or(o.tolerance);
    } else if (key == "second_order_iterations") {
        v = number(
            r, s, [](double x) { return x >= 1.0 && x <= 1000.0 && x == std::floor(x); },
            "must be a whole number from 1 to 1000");
        o.max_iterations = static_cast<std::size_t>(v.value_or(50.0));
    } else if (key == "notional") {
        v = number(
            r, s, [](double x) { return x >= 0.0 && x <= 0.1; },
            "must not be negative (and at most 0.1 of the vertical load)");
        o.notional_factor = v.value_or(0.0);
    } else if (key == "flexural_stiffness" || key == "axial_stiffness") {
        v = number(
            r, s, [](double x) { return x > 0.0 && x <= 1.0; },
            "must be greater than 0 and at most 1");
        (key == "axial_stiffness" ? o.axial_factor : o.flexural_factor) = v.value_or(1.0);
    } else {
        v = number(
            r, s, [](double x) { return x >= 0.0; }, "must not be negative");
        choice.critical_factor_warning = v.value_or(0.0);
    }
    return v.has_value();
}

}  // namespace

bool is_second_order_setting(const std::string& key) {
    return std::find(kKeys.begin(), kKeys.end(), key) != kKeys.end();
}

bool resolve_second_order_settings(Resolver& r, const syntax::CombineDecl& decl,
                                   CombineChoice& choice) {
    bool ok = true;
    const syntax::Setting* first = nullptr;
    for (const syntax::Setting& s : decl.settings) {
        if (!is_second_order_setting(s.key.text))
            continue;
        if (s.reason) {
            r.diagnostics.error(s.reason_where, fmt::format("'{}' takes no reason", s.key.text));
            ok = false;
        }
        ok = apply(r, s, choice) && ok;
        if (s.key.text != "second_order" && first == nullptr)
            first = &s;
    }
    if (ok && first != nullptr && !choice.second_order) {
        r.diagnostics.error(first->key.where,
                            fmt::format("'{}' needs second_order = yes in the same combine "
                                        "statement",
                                        first->key.text));
        ok = false;
    }
    return ok;
}

}  // namespace firn::resolve_detail
