// resolve_edition: one edition for the whole model. A combination set or a row
// of deflection limits belongs to the standard whose library module holds it
// (`STD.strength` to the module STD; a deflection module names the snow
// standard it goes with, `let TABLE.snow_standard = "STD"`); each must be of
// the standard the snow data name, since one edition's snow loads under
// another's factors give wrong members (a strength-level pg under 1.6 S).
#include <fmt/format.h>
#include <algorithm>
#include <optional>

#include "resolve/resolve_internal.hpp"

namespace firn::resolve_detail {
namespace {

/// The module a dotted library name comes from.
std::string module_of(const std::string& name) {
    return name.substr(0, name.find('.'));
}

/// A standard's edition as its module names it, or the module's name.
std::string edition_of(const Resolver& r, const std::string& standard) {
    return r.constants.text(standard + ".edition").value_or(standard);
}

/// The standard a combination set's module or a deflection module goes with, if any.
std::optional<std::string> standard_of_module(const Resolver& r, const std::string& module) {
    if (r.constants.text(module + ".snow_chapter"))
        return module;
    return r.constants.text(module + ".snow_standard");
}

/// What chose the model's edition: the snow data, or else its first set or row of a standard.
struct Reference {
    std::string standard;
    std::string what;  ///< "the snow data's standard = STD", "combination set STD.strength"
    SourceRange where;
};

/// `what` is "combination set X" or "deflection row X", and `relation` says how
/// it belongs to its standard ("is of", "goes with").
void check_against(Resolver& r, std::optional<Reference>& reference, const std::string& what,
                   const char* relation, const std::string& module, SourceRange where) {
    auto standard = standard_of_module(r, module);
    if (!standard)
        return;  // a model's own set or row: no edition to mix
    if (!reference) {
        reference = Reference{*standard, what, where};
        return;
    }
    if (*standard == reference->standard)
        return;
    Diagnostic& d = r.diagnostics.error(
        where,
        fmt::format("{} {} {}, but the model's edition is {}, chosen by {}: a model "
                    "takes one edition; use the {} ones (library module {})",
                    what, relation, edition_of(r, *standard), edition_of(r, reference->standard),
                    reference->what, edition_of(r, reference->standard), reference->standard));
    d.note(reference->where, "the edition is chosen here");
}

}  // namespace

void check_one_edition(Resolver& r) {
    std::optional<Reference> reference;
    if (r.model.snow) {
        reference = Reference{r.model.snow->standard,
                              fmt::format("the snow data's standard = {}", r.model.snow->standard),
                              r.model.snow->where};
    }
    if (r.model.combine) {
        for (std::size_t set : r.model.combine->sets) {
            const CombinationSet& s = r.model.combination_sets[set];
            check_against(r, reference, fmt::format("combination set {}", s.name), "is of",
                          module_of(s.name), r.model.combine->where);
        }
    }
    for (const DeflectionLimits& limits : r.model.deflection_limits) {
        check_against(r, reference, fmt::format("deflection row {}", limits.row), "goes with",
                      module_of(limits.row), limits.where);
    }
}

}  // namespace firn::resolve_detail
