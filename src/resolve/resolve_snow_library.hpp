// resolve_snow_library: what the snow data's files share (resolve_snow.cpp,
// resolve_snow_site.cpp): the settings of a block by key, and the library
// module's values read by name. Private to the resolve stage.
#pragma once

#include <fmt/format.h>
#include <algorithm>
#include <map>
#include <optional>
#include <string>
#include <vector>

#include "resolve/resolve_internal.hpp"

namespace firn::resolve_detail {

/// The settings of one block by key, each given once, keys checked against a list.
class Settings {
  public:
    Settings(Resolver& r, const std::vector<syntax::Setting>& settings,
             std::vector<std::string> keys, const char* owner)
        : r_(r) {
        for (const syntax::Setting& s : settings) {
            if (std::find(keys.begin(), keys.end(), s.key.text) == keys.end()) {
                r.diagnostics.error(
                    s.key.where,
                    fmt::format("unknown setting '{}' of {}; expected {}{}", s.key.text, owner,
                                fmt::join(keys, ", "), did_you_mean(s.key.text, keys)));
                continue;
            }
            auto [it, fresh] = by_key_.emplace(s.key.text, &s);
            if (!fresh) {
                Diagnostic& d = r.diagnostics.error(s.key.where,
                                                    fmt::format("'{}' is given twice", s.key.text));
                d.note(it->second->key.where, "first given here");
            }
        }
    }

    const syntax::Setting* find(const std::string& key) const {
        auto it = by_key_.find(key);
        return it == by_key_.end() ? nullptr : it->second;
    }

    /// A word among `choices` (an enumerated setting), or nullopt after an error.
    std::optional<std::string> word(const std::string& key,
                                    const std::vector<std::string>& choices) {
        const syntax::Setting* s = find(key);
        if (s == nullptr)
            return std::nullopt;
        no_reason(*s);
        bool is_word = s->value.kind == syntax::Expr::Kind::constant;
        if (is_word && std::find(choices.begin(), choices.end(), s->value.literal) != choices.end())
            return s->value.literal;
        std::string found = is_word ? fmt::format("'{}'", s->value.literal) : "a value";
        r_.diagnostics.error(
            s->value.where,
            fmt::format("{} is one of {}; found {}{}", key, fmt::join(choices, ", "), found,
                        is_word ? did_you_mean(s->value.literal, choices) : ""));
        return std::nullopt;
    }

    /// Sets `out` to a quantity of the expected dimension and returns true; false
    /// when the setting is missing or has an error (reported).
    bool value(const std::string& key, const Expected& expected, double& out,
               bool reason_allowed = false) {
        const syntax::Setting* s = find(key);
        if (s == nullptr)
            return false;
        if (!reason_allowed)
            no_reason(*s);
        auto v = r_.value(s->value, expected);
        if (!v || !r_.within(s->value, *v, kMaxMagnitude, "value"))
            return false;
        out = *v;
        return true;
    }

  private:
    void no_reason(const syntax::Setting& s) {
        if (s.reason) {
            r_.diagnostics.error(s.reason_where,
                                 fmt::format("'because' gives the reason for overriding a factor "
                                             "(Ce, Ct or Is); '{}' is not one",
                                             s.key.text));
        }
    }

    Resolver& r_;
    std::map<std::string, const syntax::Setting*> by_key_;
};

inline constexpr Expected kPressure{dim::pressure, "a pressure", "40 psf"};
inline constexpr Expected kNumber{dim::number, "a plain number", "1.1"};

/// Reads library values of the standard, reporting each one it lacks once.
class Library {
  public:
    Library(Resolver& r, std::string standard, SourceRange where)
        : r_(r), standard_(std::move(standard)), where_(where) {}

    std::optional<double> get(const std::string& name, Dimension dimension) {
        std::string full = fmt::format("{}.{}", standard_, name);
        auto q = r_.constants.lookup(full, r_.diagnostics);
        if (!q && r_.constants.has(full)) {
            ok_ = false;  // the value has an error of its own, reported where it is
            return std::nullopt;
        }
        if (!q) {
            r_.diagnostics.error(where_, fmt::format("the library lacks the value '{}' (is "
                                                     "'use {}' missing?)",
                                                     full, standard_));
            ok_ = false;
            return std::nullopt;
        }
        if (!(q->dimension == dimension)) {
            r_.diagnostics.error(where_, fmt::format("the library value '{}' should be {}", full,
                                                     describe(dimension)));
            ok_ = false;
            return std::nullopt;
        }
        return q->value;
    }
    double need(const std::string& name, Dimension dimension) {
        return get(name, dimension).value_or(0.0);
    }
    /// A text of the standard: its edition, a clause.
    std::string text(const std::string& name) {
        std::string full = fmt::format("{}.{}", standard_, name);
        if (auto t = r_.constants.text(full))
            return *t;
        r_.diagnostics.error(where_, r_.constants.has(full)
                                         ? fmt::format("the library value '{}' should be a text "
                                                       "in double quotes",
                                                       full)
                                         : fmt::format("the library lacks the text '{}' (is "
                                                       "'use {}' missing?)",
                                                       full, standard_));
        ok_ = false;
        return {};
    }
    bool has(const std::string& name) {
        return r_.constants.lookup(fmt::format("{}.{}", standard_, name), r_.diagnostics)
            .has_value();
    }
    bool has_text(const std::string& name) const {
        return r_.constants.text(fmt::format("{}.{}", standard_, name)).has_value();
    }
    /// A switch of the module (1 or 0) that chooses a kind of formula.
    bool flag(const std::string& name) { return need(name, dim::number) != 0.0; }
    const std::string& standard() const { return standard_; }
    bool ok() const { return ok_; }

  private:
    Resolver& r_;
    std::string standard_;
    SourceRange where_;
    bool ok_ = true;
};

/// The snow data's settings that depend on the edition the library module
/// describes: the ground snow load (one value, or one per risk category), the
/// importance factor's absence, Ct given from a table the module does not hold,
/// the slope factor's curve, and the winter wind parameter. False after an error.
bool resolve_edition_site(Resolver& r, Settings& s, Library& lib, SnowSite& site);
/// The ground snow load the edition asks for, into site.pg (and its setting's
/// place into `where`); false after an error (reported).
bool ground_snow_load(Resolver& r, Settings& s, const SnowTables& t, const std::string& risk,
                      SourceRange owner, double& pg, SourceRange& where);
/// Whether the model reads the site's Ct from a table the module names but does not hold.
bool thermal_factor_from_model(Library& lib, const SnowSite& site);
/// The module's switches that choose a kind of formula, and that kind's numbers.
void read_edition_switches(Library& lib, SnowTables& t);
/// The clauses only some kinds of formula cite (after read_citations).
void read_edition_clauses(Library& lib, SnowTables& t);
/// The curve of the slope factor: by the thermal condition where the module
/// says so, else by the Ct value.
bool choose_slope_curve(Resolver& r, Library& lib, SnowSite& site);
/// The settings an edition may read beyond the common ones.
std::vector<std::string> edition_setting_keys();

}  // namespace firn::resolve_detail
