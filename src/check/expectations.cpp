// expect: each expectation's places over its source (a set's envelope, one case,
// or every case alone), held to its bounds.
#include "check/check.hpp"

#include <algorithm>
#include <cmath>
#include <map>
#include <optional>

#include "analyse/analyse.hpp"
#include "check/check_internal.hpp"

namespace firn {
namespace {

using Q = Expectation::Quantity;
using R = Expectation::Relation;

/// The envelope an expectation is checked over and the names of what it enveloped.
struct Source {
    const Envelopes* shared = nullptr;  ///< a chosen set's, or else `owned`
    std::vector<std::string> names;     ///< per combination of the envelope
    Envelopes owned;                    ///< for one case, or for every case alone
    const Envelopes& envelopes() const { return shared != nullptr ? *shared : owned; }
};

/// The least and greatest value of a place, each with where it occurs.
struct Range {
    Governing low, high;
};

Range member_range(const MemberEnvelope& e, Q q) {
    switch (q) {
        case Q::moment:
            return {e.moment_min, e.moment_max};
        case Q::shear:
            return {e.shear_min, e.shear_max};
        case Q::axial:
            return {e.compression, e.tension};
        default:
            return {e.deflection_min, e.deflection_max};
    }
}

Range component_range(const ComponentEnvelope& e, std::size_t component) {
    return {e.min[component], e.max[component]};
}

double tolerance_at(const Expectation& x, double bound) {
    return x.tolerance_relative ? x.tolerance * std::abs(bound) : x.tolerance;
}

/// The value of `range` an expectation holds to its bound, the bound, and the margin.
Finding judge(const Expectation& x, const Range& range) {
    Finding f;
    auto above = [&](const Governing& g) {
        return Finding{{},         g.value, x.high, x.high + tolerance_at(x, x.high) - g.value,
                       g.position, false,   {}};
    };
    auto below = [&](const Governing& g) {
        return Finding{{},         g.value, x.low, g.value - (x.low - tolerance_at(x, x.low)),
                       g.position, false,   {}};
    };
    switch (x.relation) {
        case R::at_most:
            return above(range.high);
        case R::at_least:
            return below(range.low);
        case R::between: {
            Finding hi = above(range.high), lo = below(range.low);
            return hi.margin <= lo.margin ? hi : lo;
        }
        case R::equal: {
            const Governing& g =
                std::abs(range.high.value) >= std::abs(range.low.value) ? range.high : range.low;
            f = above(g);
            f.margin = tolerance_at(x, x.low) - std::abs(g.value - x.low);
            return f;
        }
    }
    return f;
}

/// The combination of `g` by name, for a finding.
std::string governing_name(const Source& s, const Governing& g) {
    return g.combination < s.names.size() ? s.names[g.combination] : std::string("(none)");
}

class Checker {
  public:
    explicit Checker(const CheckInputs& in) : in_(in) {}

    ExpectationOutcome check(std::size_t index) {
        const Expectation& x = in_.model.expectations[index];
        ExpectationOutcome out;
        out.expectation = index;
        if (x.quantity == Q::snow)
            return check_snow(x, out);
        const Source* source = source_for(x);
        if (source == nullptr)
            return out;
        if (x.quantity <= Q::deflection) {
            for (MemberId m : x.members) {
                Range range = member_range(source->envelopes().members[at(m)], x.quantity);
                record(out, judged(x, range, *source), in_.model.members[at(m)].name, true);
            }
        } else {
            check_nodes(x, *source, out);
        }
        out.checked = true;
        return out;
    }

  private:
    const CheckInputs& in_;
    std::map<std::string, Source> sources_;

    Finding judged(const Expectation& x, const Range& range, const Source& s) {
        Finding f = judge(x, range);
        const Governing& g = f.value == range.high.value ? range.high : range.low;
        f.governing = governing_name(s, g);
        return f;
    }

    static void record(ExpectationOutcome& out, Finding f, std::string place, bool on_member) {
        f.place = std::move(place);
        f.on_member = on_member;
        if (out.closest.place.empty() || f.margin < out.closest.margin)
            out.closest = f;
        if (f.margin < 0.0)
            out.failures.push_back(std::move(f));
    }

    /// Every node of a reaction has a support (check_expectation_names said so).
    void check_nodes(const Expectation& x, const Source& s, ExpectationOutcome& out) {
        for (NodeId n : x.nodes) {
            const std::string& name = in_.model.nodes[at(n)].name;
            if (x.quantity != Q::reaction) {
                std::size_t c = x.quantity == Q::rotation ? 2 : x.component;
                record(out, judged(x, component_range(s.envelopes().displacements[at(n)], c), s),
                       name, false);
                continue;
            }
            std::size_t support = support_at(in_.model, n).value();
            record(out,
                   judged(x, component_range(s.envelopes().reactions[support], x.component), s),
                   name, false);
        }
    }

    ExpectationOutcome& check_snow(const Expectation& x, ExpectationOutcome& out) {
        std::optional<SnowValue> v = find_snow_value(in_.derivation, x.snow_value);
        if (!v || !x.source.empty() || v->dimension != x.dimension)
            return out;  // reported by check_expectation_names
        Governing g{v->value, 0.0, no_combination};
        record(out, judge(x, Range{g, g}), "", false);
        out.checked = true;
        return out;
    }

    /// The source of `x`, or nullptr where check_expectation_names reported it.
    const Source* source_for(const Expectation& x) {
        std::string key = x.source;
        if (key.empty()) {
            if (in_.envelopes.size() > 1)
                return nullptr;
            if (in_.envelopes.size() == 1)
                key = in_.combinations.sets.front().name;
        }
        if (auto it = sources_.find(key); it != sources_.end())
            return &it->second;
        auto source = make_source(key);
        if (!source)
            return nullptr;
        return &sources_.emplace(key, std::move(*source)).first->second;
    }

    std::optional<Source> make_source(const std::string& key) {
        for (std::size_t i = 0; i < in_.combinations.sets.size(); ++i) {
            const auto& set = in_.combinations.sets[i];
            if (set.name != key)
                continue;
            Source s;
            s.shared = &in_.envelopes[i];
            for (std::size_t c = 0; c < set.count; ++c)
                s.names.push_back(in_.combinations.combinations[set.first + c].name);
            return s;
        }
        std::vector<Combination> alone;
        for (std::size_t c = 0; c < in_.model.cases.size(); ++c) {
            if (key.empty() || in_.model.cases[c].name == key)
                alone.push_back(Combination{in_.model.cases[c].name, {{make_id<CaseId>(c), 1.0}}});
        }
        if (alone.empty())
            return std::nullopt;
        return enveloped(std::move(alone));
    }

    Source enveloped(std::vector<Combination> alone) {
        Source s;
        s.owned = compute_envelopes(in_.model, in_.loads, in_.solution, in_.results, alone);
        for (const Combination& c : alone)
            s.names.push_back(c.name);
        return s;
    }
};

}  // namespace

std::vector<ExpectationOutcome> check_expectations(const CheckInputs& in) {
    Checker checker(in);
    std::vector<ExpectationOutcome> outcomes;
    for (std::size_t i = 0; i < in.model.expectations.size(); ++i)
        outcomes.push_back(checker.check(i));
    return outcomes;
}

}  // namespace firn
