// baseline_write: an analysed model's results as baseline lines. The order is
// the report's (cases, then envelopes, then deflection checks; entities in
// declaration order), so a change to one member changes its own lines only.
#include <fmt/format.h>
#include <algorithm>
#include <array>
#include <charconv>
#include <cmath>
#include <filesystem>
#include <set>

#include "base/number_format.hpp"
#include "baseline/baseline.hpp"
#include "report/report.hpp"

namespace firn {
namespace {

/// Significant digits of every value: far finer than any design decision,
/// coarse enough that round-off of the last bits never shows.
constexpr int kSignificantDigits = 6;

/// A ratio (deflection over its limit, a snow factor) has no unit.
const DisplayUnit kRatio{"", 1.0, 3};

/// `si_value` in `unit` with six significant digits, but never more than three
/// decimals finer than the text report, so a value that is zero up to
/// round-off is written 0 on every machine.
std::string significant(double si_value, const DisplayUnit& unit) {
    double shown = unit.from_si(si_value);
    int finest = unit.decimals + 3;
    int decimals = finest;
    if (shown != 0.0 && std::isfinite(shown)) {
        int magnitude = static_cast<int>(std::floor(std::log10(std::fabs(shown))));
        decimals = std::clamp(kSignificantDigits - 1 - magnitude, 0, finest);
    }
    std::array<char, kNumberBuffer> buffer;
    std::string text(format_fixed(buffer.data(), shown, decimals));
    if (text.find_first_not_of("0.") == std::string::npos)
        return "0";
    return text;
}

double read_back(const std::string& text) {
    double v = 0.0;
    std::from_chars(text.data(), text.data() + text.size(), v);
    return v;
}

/// Collects the lines of one baseline.
struct Writer {
    Baseline& out;

    void add(std::string key, double si_value, const DisplayUnit& unit, std::string note = {}) {
        BaselineValue v;
        v.key = std::move(key);
        v.text = significant(si_value, unit);
        v.value = read_back(v.text);
        v.unit = unit.name;
        v.note = std::move(note);
        out.values.push_back(std::move(v));
    }
};

const std::array<const char*, 3> kReactionNames{"Rx", "Ry", "M"};
const std::array<const char*, 3> kDisplacementNames{"dx", "dy", "rotation"};

void add_case(Writer& w, const Analysis& a, std::size_t c) {
    const Model& model = a.model;
    const DisplayUnits& u = model.units;
    const CaseResults& r = a.results.cases[c];
    std::string scope = fmt::format("case {}", model.cases[c].name);
    for (std::size_t s = 0; s < model.supports.size(); ++s) {
        const Support& support = model.supports[s];
        const std::string& node = model.nodes[at(support.node)].name;
        for (std::size_t d = 0; d < 3; ++d) {
            if (support.restraint[d].kind == Restraint::Kind::free)
                continue;  // always 0: a roller's Rx, a pin's M
            w.add(fmt::format("{} reaction {} {}", scope, node, kReactionNames[d]),
                  r.reactions[s][d], d == dof_rotation ? u.moment : u.force);
        }
    }
    for (std::size_t n = 0; n < model.nodes.size(); ++n) {
        bool rotation_free = !a.results.rotation_free.empty() && a.results.rotation_free[n];
        for (std::size_t d = 0; d < (rotation_free ? 2u : 3u); ++d) {
            w.add(fmt::format("{} node {} {}", scope, model.nodes[n].name, kDisplacementNames[d]),
                  r.displacements[n][d], d == dof_rotation ? u.rotation : u.displacement);
        }
    }
    for (std::size_t m = 0; m < model.members.size(); ++m) {
        const MemberSummary& s = r.members[m];
        std::string member = fmt::format("{} member {}", scope, model.members[m].name);
        w.add(member + " moment_max", s.moment_max.value, u.moment);
        w.add(member + " moment_min", s.moment_min.value, u.moment);
        w.add(member + " shear_max", s.shear_max.value, u.force);
        w.add(member + " tension_max", s.axial_max.value, u.force);
        w.add(member + " compression_max", s.axial_min.value, u.force);
        w.add(member + " deflection_max", s.deflection_max.value, u.displacement);
    }
}

struct EnvelopeQuantity {
    const char* name;
    const Governing MemberEnvelope::*field;
    DisplayUnit DisplayUnits::*unit;
};

constexpr std::array<EnvelopeQuantity, 8> kEnvelopeQuantities{{
    {"moment_max", &MemberEnvelope::moment_max, &DisplayUnits::moment},
    {"moment_min", &MemberEnvelope::moment_min, &DisplayUnits::moment},
    {"shear_max", &MemberEnvelope::shear_max, &DisplayUnits::force},
    {"shear_min", &MemberEnvelope::shear_min, &DisplayUnits::force},
    {"tension", &MemberEnvelope::tension, &DisplayUnits::force},
    {"compression", &MemberEnvelope::compression, &DisplayUnits::force},
    {"deflection_max", &MemberEnvelope::deflection_max, &DisplayUnits::displacement},
    {"deflection_min", &MemberEnvelope::deflection_min, &DisplayUnits::displacement},
}};

void add_components(Writer& w, const std::string& prefix, const ComponentEnvelope& e,
                    const std::array<const char*, 3>& names,
                    const std::array<const DisplayUnit*, 3>& units, const auto& governing,
                    std::array<bool, 3> included = {true, true, true}) {
    for (std::size_t d = 0; d < 3; ++d) {
        if (!included[d])
            continue;
        w.add(fmt::format("{} {}_max", prefix, names[d]), e.max[d].value, *units[d],
              governing(e.max[d]));
        w.add(fmt::format("{} {}_min", prefix, names[d]), e.min[d].value, *units[d],
              governing(e.min[d]));
    }
}

void add_envelope(Writer& w, const Analysis& a, std::size_t set) {
    const Model& model = a.model;
    const DisplayUnits& u = model.units;
    const CombinationList::SetRange& range = a.combinations.sets[set];
    const Envelopes& env = a.envelopes[set];
    std::string scope = fmt::format("envelope {}", range.name);
    auto governing = [&](const Governing& g) {
        return g.combination == no_combination
                   ? std::string()
                   : a.combinations.combinations[range.first + g.combination].name;
    };
    for (std::size_t m = 0; m < env.members.size(); ++m) {
        std::string member = fmt::format("{} member {}", scope, model.members[m].name);
        for (const EnvelopeQuantity& q : kEnvelopeQuantities) {
            const Governing& g = env.members[m].*q.field;
            w.add(fmt::format("{} {}", member, q.name), g.value, u.*q.unit, governing(g));
        }
    }
    for (std::size_t s = 0; s < env.reactions.size(); ++s) {
        const Support& support = model.supports[s];
        std::string prefix =
            fmt::format("{} reaction {}", scope, model.nodes[at(support.node)].name);
        std::array<bool, 3> restrained{};
        for (std::size_t d = 0; d < 3; ++d)
            restrained[d] = support.restraint[d].kind != Restraint::Kind::free;
        add_components(w, prefix, env.reactions[s], kReactionNames, {&u.force, &u.force, &u.moment},
                       governing, restrained);
    }
    for (std::size_t n = 0; n < env.displacements.size(); ++n) {
        std::string prefix = fmt::format("{} node {}", scope, model.nodes[n].name);
        add_components(w, prefix, env.displacements[n], kDisplacementNames,
                       {&u.displacement, &u.displacement, &u.rotation}, governing);
    }
}

/// A deflection column's name as one word of a key: `L or Lr` -> `L_or_Lr`, `D + L` -> `D+L`.
std::string column_word(std::string_view column) {
    std::string word;
    for (std::size_t i = 0; i < column.size(); ++i) {
        if (column.substr(i, 3) == " + ") {
            word += '+';
            i += 2;
        } else {
            word += column[i] == ' ' ? '_' : column[i];
        }
    }
    return word;
}

void add_deflections(Writer& w, const Analysis& a) {
    const Model& model = a.model;
    // A member held to one row by two statements is checked twice to the same numbers;
    // its key is written once, so the baseline reads back (a fuzz finding).
    std::set<std::string> written;
    for (const DeflectionCheck& c : a.deflections) {
        std::string key =
            fmt::format("deflection {} member {} {}", model.deflection_limits[c.limits].row,
                        model.members[at(c.member)].name, column_word(c.column));
        if (!written.insert(key).second)
            continue;
        w.add(key + " deflection", c.deflection, model.units.displacement, c.governing);
        w.add(key + " ratio", c.ratio() * kRatio.to_si, kRatio, c.governing);
    }
}

/// The derived snow values a model names (`pf`, `main.ps`, a drift's `hd`), as
/// `snow SITE NAME`, each noted with the edition it comes from (a model takes
/// one, and a baseline kept across a change of edition says so line by line).
/// A value of a kind with no display unit is left out.
void add_snow_values(Writer& w, const Model& model, const Derivation& derivation) {
    std::string site = model.snow ? model.snow->name : "snow";
    std::string edition = model.snow ? model.snow->tables.edition : "";
    for (const SnowValue& v : snow_values(derivation)) {
        const DisplayUnit* unit = v.dimension == dim::pressure ? &model.units.pressure
                                  : v.dimension == dim::length ? &model.units.length
                                  : v.dimension == dim::number ? &kRatio
                                                               : nullptr;
        if (unit != nullptr)
            w.add(fmt::format("snow {} {}", site, v.name), v.value, *unit, edition);
    }
}

/// A title as a quoted string, with `"` and `\` escaped.
std::string quoted(const std::string& text) {
    std::string out = "\"";
    for (char ch : text) {
        if (ch == '"' || ch == '\\')
            out += '\\';
        out += ch == '\n' ? ' ' : ch;
    }
    return out + '"';
}

}  // namespace

Baseline make_baseline(const Analysis& a) {
    Baseline b;
    const Model& model = a.model;
    const DisplayUnits& u = model.units;
    b.title = model.title;
    b.source = model_file_name(model.source_name);
    b.units =
        fmt::format("force {}, length {}, moment {}, displacement {}, rotation {}", u.force.name,
                    u.length.name, u.moment.name, u.displacement.name, u.rotation.name);
    Writer w{b};
    add_snow_values(w, model, a.derivation);
    for (std::size_t c = 0; c < model.cases.size() && c < a.results.cases.size(); ++c)
        add_case(w, a, c);
    for (std::size_t s = 0; s < a.combinations.sets.size() && s < a.envelopes.size(); ++s) {
        if (a.combinations.sets[s].count > 0)
            add_envelope(w, a, s);
    }
    add_deflections(w, a);
    return b;
}

std::string baseline_text(const Baseline& b) {
    std::string out = fmt::format(
        "# firn baseline of {} ({}): its results, kept beside it in version control.\n"
        "# Written by `firn baseline update`, compared by `firn baseline check`; not for editing.\n"
        "# Caution: {}\n"
        "firn baseline {}\n"
        "model {}\n"
        "source {}\n"
        "units {}\n",
        quoted(b.title), b.source, kCaution, b.format, quoted(b.title), b.source, b.units);
    std::string_view previous_scope;
    for (const BaselineValue& v : b.values) {
        // A blank line before each case, envelope and deflection row, for readers.
        std::string_view key = v.key;
        std::size_t second_space = key.find(' ', key.find(' ') + 1);
        std::string_view scope = key.substr(0, second_space);
        if (scope != previous_scope)
            out += '\n';
        previous_scope = scope;
        out += fmt::format("{} = {}", v.key, v.text);
        if (!v.unit.empty())
            out += fmt::format(" {}", v.unit);
        if (!v.note.empty())
            out += fmt::format(" [{}]", v.note);
        out += '\n';
    }
    return out;
}

std::string baseline_path(const std::string& model_path) {
    std::string_view ext = ".firn";
    std::string_view path = model_path;
    if (path.size() > ext.size() && path.substr(path.size() - ext.size()) == ext)
        path.remove_suffix(ext.size());
    return std::string(path) + ".baseline";
}

std::string model_file_name(const std::string& model_path) {
    return std::filesystem::path(model_path).filename().string();
}

}  // namespace firn
