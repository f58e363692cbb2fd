// resolve_expect: `expect` statements into Model::expectations. Members, nodes
// and units are checked here; the load case or set a bound is `under` and the
// snow value it names are known only after the later stages, which check them.
#include <fmt/format.h>
#include <algorithm>
#include <cmath>

#include "resolve/resolve_internal.hpp"

namespace firn::resolve_detail {
namespace {

using Q = Expectation::Quantity;

struct QuantityWord {
    const char* word;
    Q quantity;
};
constexpr QuantityWord kQuantities[] = {
    {"moment", Q::moment},         {"shear", Q::shear},       {"axial", Q::axial},
    {"deflection", Q::deflection}, {"reaction", Q::reaction}, {"displacement", Q::displacement},
    {"rotation", Q::rotation},     {"snow", Q::snow},
};

Q quantity_of(const std::string& word) {
    for (const QuantityWord& q : kQuantities) {
        if (word == q.word)
            return q.quantity;
    }
    return Q::snow;  // the grammar admits no other word
}

std::size_t component_of(const std::string& word) {
    return word == "x" ? 0U : word == "y" ? 1U : 2U;
}

/// What the bounds must measure; nullopt for a snow value, whose kind the snow stage knows.
std::optional<Expected> expected_bound(Q q, std::size_t component) {
    switch (q) {
        case Q::moment:
            return expected::moment;
        case Q::shear:
        case Q::axial:
            return expected::force;
        case Q::reaction:
            return component == 2 ? expected::moment : expected::force;
        case Q::deflection:
        case Q::displacement:
            return expected::length;
        case Q::rotation:
            return Expected{dim::number, "a rotation", "0.01 rad"};
        case Q::snow:
            break;
    }
    return std::nullopt;
}

/// What a bound of `dimension` is called in messages.
Expected expected_for(Dimension dimension) {
    for (const Expected& e : {expected::moment, expected::force, expected::length})
        if (e.dimension == dimension)
            return e;
    if (dimension == dim::pressure)
        return Expected{dim::pressure, "a pressure", "30 psf"};
    return Expected{dimension, "a plain number", "0.5"};
}

std::string subject_text(const syntax::ExpectDecl& d) {
    std::vector<std::string> places;
    for (const syntax::Name& p : d.places)
        places.push_back(p.text);
    std::string list = fmt::format("{}", fmt::join(places, ", "));
    if (d.quantity.text == "snow")
        return "snow " + list;
    if (d.quantity.text == "rotation")
        return "rotation at " + list;
    if (!d.component.text.empty())
        return fmt::format("{} {} at {}", d.quantity.text, d.component.text, list);
    return fmt::format("{} of {}", d.quantity.text, list);
}

/// A bound's value in SI, checked against what the quantity measures.
std::optional<Quantity> bound_value(Resolver& r, const syntax::Expr& e,
                                    const std::optional<Expected>& expected) {
    if (expected) {
        auto v = r.value(e, *expected);
        if (!v)
            return std::nullopt;
        return Quantity{*v, expected->dimension};
    }
    return evaluate(e, r.diagnostics, &r.constants);
}

bool read_places(Resolver& r, const syntax::ExpectDecl& d, Expectation& x) {
    if (x.quantity == Q::snow) {
        x.snow_value = d.places.front().text;
        return true;
    }
    if (x.quantity <= Q::deflection) {
        auto members = listed_members(r, d.places);
        x.members = members.value_or(std::vector<MemberId>{});
        return members.has_value();
    }
    bool found = true;
    for (const syntax::Name& name : d.places) {
        std::size_t known = r.model.nodes.size();
        auto node = r.find_node(name);
        if (node && at(*node) >= known) {
            r.diagnostics.error(name.where, fmt::format("no member ends at node '{}'", name.text));
            node.reset();
        }
        found = found && node.has_value();
        if (node)
            x.nodes.push_back(*node);
    }
    return found;
}

/// The half of a unit in the last digit of a plain number (`30.8 psf`: 0.05 psf), in SI:
/// `= 30.8 psf` holds for every value that rounds to what is written. Nothing for an
/// expression, whose precision is not written.
std::optional<double> written_precision(Resolver& r, const syntax::Expr& e) {
    const syntax::Expr* number = &e;
    if (number->kind == syntax::Expr::Kind::negate)
        number = number->rhs.get();
    if (number->kind != syntax::Expr::Kind::number ||
        number->literal.find_first_of("eE") != std::string::npos)
        return std::nullopt;
    std::size_t point = number->literal.find('.');
    int decimals =
        point == std::string::npos ? 0 : static_cast<int>(number->literal.size() - point - 1);
    double unit = 1.0;
    if (!number->unit.empty()) {
        auto u = unit_value(number->unit, r.diagnostics);
        if (!u)
            return std::nullopt;
        unit = u->value;
    }
    return 0.5 * std::pow(10.0, -decimals) * unit;
}

bool read_tolerance(Resolver& r, const syntax::ExpectDecl& d, Expectation& x) {
    if (!d.tolerance) {
        if (x.relation != Expectation::Relation::equal)
            return true;
        auto precision = written_precision(r, d.value);
        if (!precision) {
            r.diagnostics.error(d.value.where,
                                "'=' to a computed value needs a tolerance: add 'within' and a "
                                "value or a percentage, as in: within 1 %");
            return false;
        }
        x.tolerance = *precision;
        return true;
    }
    x.tolerance_written = true;
    if (d.tolerance_percent) {
        auto percent = r.value(*d.tolerance, Expected{dim::number, "a percentage", "2 %"});
        if (!percent)
            return false;
        x.tolerance = *percent / 100.0;
        x.tolerance_relative = true;
    } else {
        auto tolerance = bound_value(r, *d.tolerance, expected_for(x.dimension));
        if (!tolerance)
            return false;
        x.tolerance = tolerance->value;
    }
    if (x.tolerance < 0.0) {
        r.diagnostics.error(d.tolerance->where, "a tolerance cannot be negative");
        return false;
    }
    return true;
}

/// The bound and tolerance as the model writes them, for messages: `<= 4 m / 150 within 1 mm`.
std::string written_bound(const syntax::ExpectDecl& d) {
    std::string text = d.high ? fmt::format("between {} and {}", expression_text(d.value),
                                            expression_text(*d.high))
                              : fmt::format("{} {}", d.relation, expression_text(d.value));
    if (d.tolerance)
        text += fmt::format(" within {}{}", expression_text(*d.tolerance),
                            d.tolerance_percent ? " %" : "");
    return text;
}

bool read_bounds(Resolver& r, const syntax::ExpectDecl& d, Expectation& x) {
    x.bound_written = written_bound(d);
    using R = Expectation::Relation;
    x.relation = d.relation == "<="   ? R::at_most
                 : d.relation == ">=" ? R::at_least
                 : d.relation == "="  ? R::equal
                                      : R::between;
    auto expected = expected_bound(x.quantity, x.component);
    auto value = bound_value(r, d.value, expected);
    if (!value)
        return false;
    x.dimension = value->dimension;
    x.low = x.high = value->value;
    if (d.high) {
        auto high = bound_value(r, *d.high, expected_for(x.dimension));
        if (!high)
            return false;
        x.high = high->value;
        if (x.high < x.low) {
            r.diagnostics.error(d.high->where,
                                "the upper bound is below the lower one; write the lower first");
            return false;
        }
    }
    return read_tolerance(r, d, x);
}

}  // namespace

void resolve_expectations(Resolver& r, const std::vector<const syntax::ExpectDecl*>& decls,
                          const std::vector<SourceRange>& where) {
    for (std::size_t i = 0; i < decls.size(); ++i) {
        const syntax::ExpectDecl& d = *decls[i];
        Expectation x;
        x.quantity = quantity_of(d.quantity.text);
        x.component = component_of(d.component.text);
        x.subject = subject_text(d);
        x.where = where[i];
        if (d.source) {
            x.source = d.source->text;
            x.source_where = d.source->where;
        }
        x.reason = d.reason.value_or("");
        bool places = read_places(r, d, x);
        if (read_bounds(r, d, x) && places)
            r.model.expectations.push_back(std::move(x));
    }
}

}  // namespace firn::resolve_detail
