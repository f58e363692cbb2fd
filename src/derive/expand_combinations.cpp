// combinations: expands combination rules into sums of factored cases.
#include "ir/combinations.hpp"

#include <fmt/format.h>
#include <fmt/ranges.h>
#include <algorithm>
#include <map>

#include "derive/derive.hpp"

namespace firn {
namespace {

/// One way to fill a term: factored cases, and the symbol they stand for.
struct Option {
    std::vector<CombinationTerm> cases;
    std::string symbol;
};

bool sums_its_kind(const std::string& symbol) {
    return symbol == "D" || symbol == "L";
}

bool symbol_takes(const std::string& symbol, CaseKind kind) {
    static const std::map<std::string, CaseKind> kinds{
        {"D", CaseKind::dead}, {"L", CaseKind::live}, {"Lr", CaseKind::roof_live},
        {"S", CaseKind::snow}, {"R", CaseKind::rain}, {"W", CaseKind::wind}};
    auto it = kinds.find(symbol);
    return it != kinds.end() && it->second == kind;
}

/// The cases of a summing kind, grouped into families: a case and its arrangements.
std::vector<std::vector<CaseId>> families(const Model& model, const std::string& symbol) {
    std::vector<std::vector<CaseId>> out;
    std::map<std::string, std::size_t> family_of;
    for (std::size_t c = 0; c < model.cases.size(); ++c) {
        const LoadCase& lc = model.cases[c];
        if (!symbol_takes(symbol, lc.kind))
            continue;
        const std::string& family = lc.arrangement_of.empty() ? lc.name : lc.arrangement_of;
        auto [it, fresh] = family_of.emplace(family, out.size());
        if (fresh)
            out.emplace_back();
        out[it->second].push_back(make_id<CaseId>(c));
    }
    return out;
}

/// The ways one symbol can be filled: every family's member in turn for D and L
/// (all families at once), one case at a time for the others.
std::vector<Option> options_of(const Model& model, const std::string& symbol, double factor) {
    std::vector<Option> out;
    if (!sums_its_kind(symbol)) {
        for (std::size_t c = 0; c < model.cases.size(); ++c) {
            if (symbol_takes(symbol, model.cases[c].kind))
                out.push_back(Option{{{make_id<CaseId>(c), factor}}, symbol});
        }
        return out;
    }
    std::vector<std::vector<CaseId>> groups = families(model, symbol);
    if (groups.empty())
        return out;
    out.push_back(Option{{}, symbol});
    for (const std::vector<CaseId>& family : groups) {
        std::vector<Option> grown;
        for (const Option& partial : out) {
            for (CaseId c : family) {
                Option next = partial;
                next.cases.push_back({c, factor});
                grown.push_back(std::move(next));
            }
        }
        out = std::move(grown);
    }
    return out;
}

/// In a set by case: the named case and each of its arrangements, one at a time.
std::vector<Option> named_options(const Model& model, const std::string& name, double factor) {
    std::vector<Option> out;
    for (std::size_t c = 0; c < model.cases.size(); ++c) {
        const LoadCase& lc = model.cases[c];
        if (lc.name == name || lc.arrangement_of == name)
            out.push_back(Option{{{make_id<CaseId>(c), factor}}, name});
    }
    return out;
}

/// The factor of a symbol in a rule, after the 0.5 L permission.
double factor_for(const CombinationRule& rule, const CombineChoice& choice,
                  const CombinationRule::Alternative& a) {
    if (a.symbol == "L" && rule.half_live && choice.half_live && a.factor == 1.0)
        return 0.5;
    return a.factor;
}

/// The terms of a rule as lists of options; a term none of whose symbols has a
/// case is left out.
std::vector<std::vector<Option>> slots_of(const Model& model, const CombinationSet& set,
                                          const CombinationRule& rule,
                                          const CombineChoice& choice) {
    std::vector<std::vector<Option>> slots;
    for (const CombinationRule::Term& term : rule.terms) {
        std::vector<Option> options;
        for (const CombinationRule::Alternative& a : term.alternatives) {
            std::vector<Option> more =
                set.by_case ? named_options(model, a.symbol, a.factor)
                            : options_of(model, a.symbol, factor_for(rule, choice, a));
            options.insert(options.end(), more.begin(), more.end());
        }
        if (!options.empty())
            slots.push_back(std::move(options));
    }
    return slots;
}

/// Sums the chosen options into one combination, in the rule's order; an
/// ice-dam case keeps only itself and the dead load. A case named twice has
/// its factors added.
std::vector<CombinationTerm> assemble(const Model& model,
                                      const std::vector<const Option*>& chosen) {
    bool dead_only = false;
    for (const Option* o : chosen) {
        for (const CombinationTerm& t : o->cases)
            dead_only = dead_only || model.cases[at(t.case_id)].with_dead_only;
    }
    std::vector<CombinationTerm> terms;
    for (const Option* o : chosen) {
        for (const CombinationTerm& t : o->cases) {
            const LoadCase& lc = model.cases[at(t.case_id)];
            if (dead_only && lc.kind != CaseKind::dead && !lc.with_dead_only)
                continue;
            auto same = std::find_if(terms.begin(), terms.end(), [&](const CombinationTerm& x) {
                return x.case_id == t.case_id;
            });
            if (same == terms.end())
                terms.push_back(t);
            else
                same->factor += t.factor;
        }
    }
    return terms;
}

/// A factor as the standard prints it: 1.0, 1.2, 0.45.
std::string factor_text(double f) {
    std::string text = fmt::format("{:.3f}", f);
    while (text.back() == '0' && text[text.size() - 2] != '.')
        text.pop_back();
    return text;
}

std::string formula_of(const Model& model, const std::vector<CombinationTerm>& terms) {
    std::vector<std::string> parts;
    parts.reserve(terms.size());
    for (const CombinationTerm& t : terms)
        parts.push_back(
            fmt::format("{} {}", factor_text(t.factor), model.cases[at(t.case_id)].name));
    return fmt::format("{}", fmt::join(parts, " + "));
}

/// Every pick of one option per slot, in order (the last slot varies fastest).
template <typename Visit>
void for_each_pick(const std::vector<std::vector<Option>>& slots, Visit visit) {
    std::vector<std::size_t> pick(slots.size(), 0);
    std::vector<const Option*> chosen(slots.size());
    while (true) {
        for (std::size_t s = 0; s < slots.size(); ++s)
            chosen[s] = &slots[s][pick[s]];
        visit(chosen);
        std::size_t s = slots.size();
        while (s > 0 && ++pick[s - 1] == slots[s - 1].size())
            pick[--s] = 0;
        if (s == 0)
            return;
    }
}

void expand_rule(const Model& model, const CombinationSet& set, const CombinationRule& rule,
                 const CombineChoice& choice, std::vector<std::vector<CombinationTerm>>& seen,
                 CombinationList& out) {
    std::vector<std::vector<Option>> slots = slots_of(model, set, rule, choice);
    if (slots.empty()) {
        out.notes.push_back(
            fmt::format("{}.{} left out: no load case of its symbols", set.name, rule.label));
        return;
    }
    std::size_t variant = 0;
    for_each_pick(slots, [&](const std::vector<const Option*>& chosen) {
        std::vector<CombinationTerm> terms = assemble(model, chosen);
        std::vector<CombinationTerm> key = terms;
        std::sort(key.begin(), key.end(), [](const CombinationTerm& a, const CombinationTerm& b) {
            return a.case_id < b.case_id;
        });
        auto same = [&](const std::vector<CombinationTerm>& other) {
            return std::equal(key.begin(), key.end(), other.begin(), other.end(),
                              [](const CombinationTerm& a, const CombinationTerm& b) {
                                  return a.case_id == b.case_id && a.factor == b.factor;
                              });
        };
        if (std::any_of(seen.begin(), seen.end(), same))
            return;
        seen.push_back(std::move(key));
        ++variant;
        out.formulas.push_back(formula_of(model, terms));
        out.combinations.push_back(
            Combination{fmt::format("{}.{}/{}", set.name, rule.label, variant), std::move(terms)});
    });
}

}  // namespace

CombinationList expand_combinations(const Model& model) {
    CombinationList out;
    if (!model.combine)
        return out;
    const CombineChoice& choice = *model.combine;
    for (std::size_t s : choice.sets) {
        const CombinationSet& set = model.combination_sets[s];
        std::vector<std::vector<CombinationTerm>> seen;
        std::size_t first = out.combinations.size();
        for (const CombinationRule& rule : set.rules)
            expand_rule(model, set, rule, choice, seen, out);
        out.sets.push_back({set.name, first, out.combinations.size() - first});
    }
    for (const char* symbol : {"L", "Lr", "S", "R", "W"}) {
        bool any = std::any_of(model.cases.begin(), model.cases.end(),
                               [&](const LoadCase& lc) { return symbol_takes(symbol, lc.kind); });
        if (!any)
            out.notes.push_back(fmt::format("{}: no load case of this kind", symbol));
    }
    std::vector<char> combined(model.cases.size(), 0);
    for (const Combination& k : out.combinations) {
        for (const CombinationTerm& t : k.terms)
            combined[at(t.case_id)] = 1;
    }
    for (std::size_t c = 0; c < model.cases.size(); ++c) {
        if (model.cases[c].kind == CaseKind::other && !combined[c])
            out.notes.push_back(
                fmt::format("{}: a case of kind other, in no combination", model.cases[c].name));
    }
    return out;
}

bool check_combination_cases(const Model& model, const Derivation& derivation,
                             Diagnostics& diagnostics) {
    std::vector<std::string> names;
    for (const std::vector<LoadCase>* cases : {&model.cases, &derivation.cases}) {
        for (const LoadCase& lc : *cases)
            names.push_back(lc.name);
    }
    bool ok = true;
    for (const CombinationSet& set : model.combination_sets) {
        if (!set.by_case)
            continue;
        for (const CombinationRule& rule : set.rules) {
            for (const CombinationRule::Term& term : rule.terms) {
                for (const CombinationRule::Alternative& a : term.alternatives) {
                    if (std::find(names.begin(), names.end(), a.symbol) != names.end())
                        continue;
                    diagnostics.error(
                        a.where, fmt::format("no load case '{}' (combination {}.{}){}", a.symbol,
                                             set.name, rule.label, did_you_mean(a.symbol, names)));
                    ok = false;
                }
            }
        }
    }
    return ok;
}

}  // namespace firn
