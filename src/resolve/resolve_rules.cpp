// resolve_combinations: load combination sets (`combinations`), the sets a model
// is checked for (`combine`), pattern rules (`pattern`) and the load cases they
// arrange (`arrange`). Sets and rules are data, usually from the standard's
// library module; the expansion into combinations happens after the snow stage,
// once every case exists (combinations.cpp, arrange.cpp).
#include <fmt/format.h>
#include <fmt/ranges.h>
#include <algorithm>

#include "resolve/resolve_internal.hpp"

namespace firn::resolve_detail {

std::optional<std::vector<MemberId>> listed_members(Resolver& r,
                                                    const std::vector<syntax::Name>& refs) {
    std::vector<MemberId> members;
    bool found = true;
    for (const syntax::Name& ref : refs) {
        auto ids = r.find_members(ref);
        found = found && ids.has_value();
        for (MemberId id : ids.value_or(std::vector<MemberId>{})) {
            if (std::find(members.begin(), members.end(), id) == members.end())
                members.push_back(id);
        }
    }
    if (!found)
        return std::nullopt;
    return members;
}

namespace {

/// The load symbols of a combination and the case kinds they stand for.
constexpr std::array<std::string_view, 6> kSymbols{"D", "L", "Lr", "S", "R", "W"};

bool known_symbol(Resolver& r, const syntax::Name& symbol) {
    if (std::find(kSymbols.begin(), kSymbols.end(), symbol.text) != kSymbols.end())
        return true;
    r.diagnostics.error(symbol.where,
                        fmt::format("unknown load symbol '{}'; the symbols are D (dead), L "
                                    "(live), Lr (roof live), S (snow), R (rain) and W (wind)",
                                    symbol.text));
    return false;
}

/// The standards' load factors stay below 2 (1.6 at most in the strength and allowable
/// stress combinations); one past this is a slip, and one near the largest double would
/// overflow.
constexpr double kLargestLoadFactor = 100.0;

/// A factor must be a plain positive number, and not an absurd one.
bool positive_factor(Resolver& r, const syntax::Factor& f) {
    if (f.value > kLargestLoadFactor && std::isfinite(f.value)) {
        r.diagnostics.error(f.where, fmt::format("a load factor of {:g} is far beyond any "
                                                 "standard's (they stay below 2); at most {:g}",
                                                 f.value, kLargestLoadFactor));
        return false;
    }
    if (f.value > 0.0 && std::isfinite(f.value))
        return true;
    r.diagnostics.error(f.where, "a load factor is a number greater than zero");
    return false;
}

/// In a set by case, a case named twice in one combination: its factors would be
/// added silently, which is never what was meant.
bool named_once(Resolver& r, const syntax::CombinationLine& line) {
    std::vector<std::string_view> seen;
    bool ok = true;
    for (const syntax::CombinationTerm& term : line.terms) {
        for (const auto& alternative : term.alternatives) {
            const syntax::Name& symbol = alternative.symbol;
            if (std::find(seen.begin(), seen.end(), symbol.text) != seen.end()) {
                r.diagnostics.error(symbol.where,
                                    fmt::format("case '{}' is named twice in combination '{}'; "
                                                "write it once with its whole factor",
                                                symbol.text, line.label.text));
                ok = false;
            }
            seen.push_back(symbol.text);
        }
    }
    return ok;
}

std::optional<CombinationRule> combination_rule(Resolver& r, const syntax::CombinationLine& line,
                                                bool by_case) {
    CombinationRule rule;
    rule.label = line.label.text;
    rule.where = line.label.where;
    // A set by case names cases, which are checked once every case exists (after
    // the snow stage derives its own).
    bool ok = !by_case || named_once(r, line);
    for (const syntax::CombinationTerm& term : line.terms) {
        CombinationRule::Term resolved;
        bool term_factor_ok = term.factor.where.begin.offset == term.factor.where.end.offset ||
                              positive_factor(r, term.factor);
        ok = ok && term_factor_ok;
        for (const auto& alternative : term.alternatives) {
            bool factor_ok =
                alternative.factor.where.begin.offset == alternative.factor.where.end.offset ||
                positive_factor(r, alternative.factor);
            ok = (by_case || known_symbol(r, alternative.symbol)) && factor_ok && ok;
            resolved.alternatives.push_back({term.factor.value * alternative.factor.value,
                                             alternative.symbol.text, alternative.symbol.where});
        }
        rule.terms.push_back(std::move(resolved));
    }
    if (!ok)
        return std::nullopt;
    return rule;
}

void resolve_set(Resolver& r, const syntax::CombinationsDecl& decl, NameTable& names) {
    if (!names.add(decl.name, r.diagnostics))
        return;
    CombinationSet set;
    set.name = decl.name.text;
    set.by_case = decl.by_case;
    set.where = decl.name.where;
    NameTable labels{"combination"};
    for (const syntax::CombinationLine& line : decl.lines) {
        if (!labels.add(line.label, r.diagnostics))
            continue;
        if (auto rule = combination_rule(r, line, decl.by_case))
            set.rules.push_back(std::move(*rule));
    }
    for (const syntax::Name& label : decl.half_live_in) {
        if (decl.by_case) {
            r.diagnostics.error(label.where,
                                "half_live_in is for sets by load symbol; in a set by case, "
                                "write the live case's factor as it is to be taken");
            break;
        }
        auto found = std::find_if(set.rules.begin(), set.rules.end(),
                                  [&](const CombinationRule& c) { return c.label == label.text; });
        if (found != set.rules.end())
            found->half_live = true;
        else if (!labels.find_quietly(label.text))
            labels.find(label, r.diagnostics);  // reports it
    }
    r.model.combination_sets.push_back(std::move(set));
}

/// `half_live = yes because "..."`: the permission to take 0.5 L where the set allows.
bool read_half_live(Resolver& r, const syntax::CombineDecl& decl, CombineChoice& choice) {
    for (const syntax::Setting& s : decl.settings) {
        if (is_second_order_setting(s.key.text))
            continue;  // resolve_second_order.cpp
        if (s.key.text != "half_live") {
            r.diagnostics.error(
                s.key.where,
                fmt::format("unknown setting '{}' of combine; expected half_live, second_order, "
                            "second_order_tolerance, second_order_iterations, notional, "
                            "notional_toward, flexural_stiffness, axial_stiffness or "
                            "critical_factor_warning",
                            s.key.text));
            return false;
        }
        bool word = s.value.kind == syntax::Expr::Kind::constant;
        if (!word || (s.value.literal != "yes" && s.value.literal != "no")) {
            r.diagnostics.error(s.value.where, "half_live is yes or no");
            return false;
        }
        choice.half_live = s.value.literal == "yes";
        if (choice.half_live && !s.reason) {
            r.diagnostics.error(s.value.where,
                                "half_live = yes needs its condition stated, as in: half_live = "
                                "yes because \"offices, Lo = 50 psf <= 100 psf, no assembly\"");
            return false;
        }
        choice.half_live_reason = s.reason.value_or("");
    }
    return true;
}

void resolve_choice(Resolver& r, const std::vector<const syntax::CombineDecl*>& choices,
                    const NameTable& set_names) {
    if (choices.empty())
        return;
    for (std::size_t i = 1; i < choices.size(); ++i) {
        Diagnostic& d = r.diagnostics.error(choices[i]->sets.front().where,
                                            "the combinations are already chosen; list every "
                                            "set in one combine statement");
        d.note(choices[0]->sets.front().where, "first chosen here");
    }
    const syntax::CombineDecl& decl = *choices[0];
    CombineChoice choice;
    choice.where = decl.sets.front().where;
    bool ok = read_half_live(r, decl, choice);
    ok = resolve_second_order_settings(r, decl, choice) && ok;
    for (const syntax::Name& name : decl.sets) {
        auto index = set_names.find(name, r.diagnostics);
        if (!index) {
            ok = false;
            continue;
        }
        if (std::find(choice.sets.begin(), choice.sets.end(), *index) == choice.sets.end())
            choice.sets.push_back(*index);
    }
    if (ok)
        r.model.combine = std::move(choice);
}

std::optional<PatternRule::Selector> selector_of(Resolver& r, const syntax::Name& word) {
    using S = PatternRule::Selector;
    static const std::array<std::pair<std::string_view, S>, 4> known{
        {{"exterior", S::exterior},
         {"adjacent_pair", S::adjacent_pair},
         {"each", S::each},
         {"all", S::all}}};
    for (const auto& [text, selector] : known) {
        if (word.text == text)
            return selector;
    }
    r.diagnostics.error(word.where, fmt::format("unknown span selector '{}'; expected exterior, "
                                                "adjacent_pair, each, all or others",
                                                word.text));
    return std::nullopt;
}

/// One line of a rule: one selector with its factor, and `others` (default 0).
std::optional<PatternRule::Line> pattern_line(Resolver& r, const syntax::PatternDecl::Line& line) {
    PatternRule::Line out;
    out.label = line.label.text;
    out.others = 0.0;
    std::size_t selectors = 0;
    bool ok = true;
    for (const syntax::PatternDecl::Part& part : line.parts) {
        if (!(part.factor.value >= 0.0)) {
            r.diagnostics.error(part.factor.where, "a span's factor is zero or more");
            ok = false;
        }
        if (part.selector.text == "others") {
            out.others = part.factor.value;
            continue;
        }
        auto selector = selector_of(r, part.selector);
        ok = ok && selector.has_value();
        if (selector && ++selectors > 1) {
            r.diagnostics.error(part.selector.where,
                                "one selector per arrangement line; give the rest with others");
            ok = false;
        }
        if (selector) {
            out.selector = *selector;
            out.factor = part.factor.value;
        }
    }
    if (ok && selectors == 0) {
        r.diagnostics.error(line.label.where,
                            "an arrangement line needs a selector: exterior, adjacent_pair, "
                            "each or all");
        ok = false;
    }
    if (!ok)
        return std::nullopt;
    return out;
}

void resolve_pattern(Resolver& r, const syntax::PatternDecl& decl, NameTable& names) {
    if (!names.add(decl.name, r.diagnostics))
        return;
    PatternRule rule;
    rule.name = decl.name.text;
    rule.where = decl.name.where;
    NameTable labels{"arrangement"};
    for (const syntax::PatternDecl::Line& line : decl.lines) {
        if (!labels.add(line.label, r.diagnostics))
            continue;
        if (auto resolved = pattern_line(r, line))
            rule.lines.push_back(std::move(*resolved));
    }
    r.model.patterns.push_back(std::move(rule));
}

void resolve_arrange(Resolver& r, const syntax::ArrangeDecl& decl, const NameTable& pattern_names) {
    auto load_case = r.cases.find(decl.load_case, r.diagnostics);
    auto rule = pattern_names.find(decl.rule, r.diagnostics);
    auto listed = listed_members(r, decl.members);
    if (!load_case || !rule || !listed)
        return;
    std::vector<MemberId> members = std::move(*listed);
    static const RunWords words{"arrange", "the arranged members are one run of spans",
                                "the arranged members are one connected run"};
    auto run = member_run(r, decl.load_case, words, members);
    if (!run)
        return;
    r.model.arrangements.push_back(
        ArrangeRequest{make_id<CaseId>(*load_case), std::move(*run), *rule, decl.load_case.where});
}

}  // namespace

void resolve_deflection_limits(Resolver& r,
                               const std::vector<const syntax::DeflectionDecl*>& decls) {
    for (const syntax::DeflectionDecl* decl : decls) {
        auto members = listed_members(r, decl->members);
        DeflectionLimits limits;
        limits.row = decl->row.text;
        limits.where = decl->row.where;
        // A library module names the table its rows come from (`let MODULE.table = "..."`).
        std::string module = decl->row.text.substr(0, decl->row.text.find('.'));
        std::optional<std::string> table = r.constants.text(module + ".table");
        limits.source = table ? fmt::format("{} (library module {})", *table, module)
                              : fmt::format("the model's row {}", decl->row.text);
        bool any = false;
        for (auto [column, out] :
             {std::pair{"live", &limits.live}, std::pair{"snow_wind", &limits.snow_wind},
              std::pair{"total", &limits.total}}) {
            std::string name = fmt::format("{}.{}", decl->row.text, column);
            if (!r.constants.has(name))
                continue;
            any = true;
            auto q = r.constants.lookup(name, r.diagnostics);
            if (q && q->dimension == dim::number && q->value > 0.0)
                *out = q->value;
            else if (q)
                r.diagnostics.error(decl->row.where,
                                    fmt::format("'{}' should be a plain number greater than zero, "
                                                "the n of a limit l/n",
                                                name));
        }
        if (!any) {
            r.diagnostics.error(decl->row.where,
                                fmt::format("no row of deflection limits '{}' (its values {}.live, "
                                            "{}.snow_wind or {}.total); is 'use {}' missing?",
                                            decl->row.text, decl->row.text, decl->row.text,
                                            decl->row.text, module));
            continue;
        }
        if (!members)
            continue;
        limits.members = std::move(*members);
        r.model.deflection_limits.push_back(std::move(limits));
    }
}

void resolve_combinations(Resolver& r, const std::vector<const syntax::CombinationsDecl*>& sets,
                          const std::vector<const syntax::CombineDecl*>& choices,
                          const std::vector<const syntax::PatternDecl*>& patterns,
                          const std::vector<const syntax::ArrangeDecl*>& arrangements) {
    NameTable set_names{"set of combinations"};
    for (const syntax::CombinationsDecl* decl : sets)
        resolve_set(r, *decl, set_names);
    resolve_choice(r, choices, set_names);
    NameTable pattern_names{"pattern rule"};
    for (const syntax::PatternDecl* decl : patterns)
        resolve_pattern(r, *decl, pattern_names);
    for (const syntax::ArrangeDecl* decl : arrangements)
        resolve_arrange(r, *decl, pattern_names);
    for (const Roof& roof : r.model.roofs) {
        if (!roof.partial.empty() && roof.partial != "none")
            pattern_names.find(syntax::Name{roof.partial, roof.partial_where}, r.diagnostics);
    }
}

}  // namespace firn::resolve_detail
