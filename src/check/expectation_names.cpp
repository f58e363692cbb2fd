// expectation_names: what an expectation refers to (its `under` source, a snow
// value, the supports of its reactions), checked against the declared and derived
// cases and values before anything is solved, so a misspelt name costs no analysis.
#include <fmt/format.h>
#include <fmt/ranges.h>
#include <algorithm>

#include "check/check.hpp"
#include "check/check_internal.hpp"
#include "ir/display.hpp"

namespace firn {
namespace {

using Q = Expectation::Quantity;

class NameCheck {
  public:
    NameCheck(const Model& model, const Derivation& derivation, Diagnostics& d)
        : model_(model), derivation_(derivation), d_(d) {
        if (model.combine) {
            for (std::size_t s : model.combine->sets)
                sets_.push_back(model.combination_sets[s].name);
        }
        for (const std::vector<LoadCase>* cases : {&model.cases, &derivation.cases}) {
            for (const LoadCase& c : *cases)
                cases_.push_back(c.name);
        }
    }

    /// Reports what `x` names that does not exist; false if anything.
    bool check(const Expectation& x) {
        if (x.quantity == Q::snow)
            return snow_value_fits(x);
        return source_exists(x) && (x.quantity != Q::reaction || supports_exist(x));
    }

  private:
    const Model& model_;
    const Derivation& derivation_;
    Diagnostics& d_;
    std::vector<std::string> sets_;   ///< the chosen sets, as `combine` lists them
    std::vector<std::string> cases_;  ///< declared, then derived

    bool snow_value_fits(const Expectation& x) {
        if (!x.source.empty()) {
            d_.error(x.source_where,
                     "a snow value is derived once, not under a load case or "
                     "a set of combinations; leave 'under' out");
            return false;
        }
        std::optional<SnowValue> v = find_snow_value(derivation_, x.snow_value);
        if (!v) {
            std::vector<std::string> names;
            for (const SnowValue& known : snow_values(derivation_))
                names.push_back(known.name);
            d_.error(x.where,
                     fmt::format("no derived snow value '{}'{}", x.snow_value,
                                 names.empty() ? std::string("; the model has no snow data")
                                               : did_you_mean(x.snow_value, names)));
            return false;
        }
        if (v->dimension != x.dimension) {
            d_.error(x.where, fmt::format("the bound's unit does not fit snow value '{}' ({})",
                                          v->name, show_expected_value(model_, x, v->value)));
            return false;
        }
        return true;
    }

    bool source_exists(const Expectation& x) {
        if (x.source.empty()) {
            if (sets_.size() > 1) {
                d_.error(x.where, fmt::format("the model combines {} sets ({}); say which this "
                                              "bound is for with 'under SET'",
                                              sets_.size(), fmt::join(sets_, ", ")));
                return false;
            }
            if (sets_.empty() && cases_.empty()) {
                d_.error(x.where, "the model has no load cases to check this against");
                return false;
            }
            return true;
        }
        auto named = [&](const std::vector<std::string>& names) {
            return std::find(names.begin(), names.end(), x.source) != names.end();
        };
        if (named(sets_) || named(cases_))
            return true;
        std::vector<std::string> names = sets_;
        names.insert(names.end(), cases_.begin(), cases_.end());
        d_.error(x.source_where, fmt::format("no load case or chosen set of combinations '{}'{}",
                                             x.source, did_you_mean(x.source, names)));
        return false;
    }

    bool supports_exist(const Expectation& x) {
        for (NodeId n : x.nodes) {
            if (!support_at(model_, n)) {
                d_.error(x.where, fmt::format("node '{}' has no support, so no reaction",
                                              model_.nodes[at(n)].name));
                return false;
            }
        }
        return true;
    }
};

}  // namespace

std::optional<SnowValue> find_snow_value(const Derivation& derivation, const std::string& name) {
    for (SnowValue& v : snow_values(derivation)) {
        if (v.name == name)
            return std::move(v);
    }
    return std::nullopt;
}

std::optional<std::size_t> support_at(const Model& model, NodeId n) {
    for (std::size_t i = 0; i < model.supports.size(); ++i) {
        if (model.supports[i].node == n)
            return i;
    }
    return std::nullopt;
}

bool check_expectation_names(const Model& model, const Derivation& derivation,
                             Diagnostics& diagnostics) {
    NameCheck names(model, derivation, diagnostics);
    bool all = true;
    for (const Expectation& x : model.expectations)
        all = names.check(x) && all;
    return all;
}

}  // namespace firn
