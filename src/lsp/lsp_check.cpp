// lsp_check: one check of a model as the editor holds it, and its diagnostics in
// the protocol's form. The stages run as in the driver up to the loads; the frame
// is not solved, so a check stays cheap on every keystroke (DEVELOPERS.md).
#include <fmt/format.h>
#include <iterator>

#include "check/check.hpp"
#include "derive/derive.hpp"
#include "front/front.hpp"
#include "lsp/lsp_internal.hpp"
#include "resolve/resolve.hpp"

namespace firn::lsp {
namespace {

/// After resolve: the snow derivation, the expectations' names and the loads, each
/// only while no error has been reported (as the driver does).
void derive_model(CheckedModel& c) {
    c.derivation = derive_snow(c.model, c.diagnostics);
    arrange_cases(c.model, c.derivation, c.diagnostics);
    if (c.diagnostics.has_errors())
        return;
    c.derived = true;
    if (!check_expectation_names(c.model, c.derivation, c.diagnostics))
        return;
    // The loads are derived on a copy that holds the derived cases too, so that the
    // messages about loads are the compiler's; the model keeps its own cases for hovers.
    Model with_derived = c.model;
    std::copy(c.derivation.cases.begin(), c.derivation.cases.end(),
              std::back_inserter(with_derived.cases));
    derive_loads(with_derived, c.diagnostics);
}

int severity_code(Severity s) {
    switch (s) {
        case Severity::error:
            return 1;
        case Severity::warning:
            return 2;
        case Severity::note:
            return 3;
    }
    return 1;
}

/// The built-in library has no file an editor could open.
bool has_file(const SourceFile& file) {
    return !file.name.starts_with("<");
}

std::string place_text(const CheckedModel& c, const SourceRange& where) {
    return fmt::format("{}:{}:{}", c.sources.file(where.file).name, where.begin.line,
                       where.begin.column);
}

/// The line index of each file, made when first needed: a model with thousands of
/// messages must not index its text once per message.
class LineIndexes {
  public:
    explicit LineIndexes(const CheckedModel& c) : c_(c), indexes_(c.sources.count()) {}
    const LineIndex& of(FileId f) {
        if (!indexes_.at(f))
            indexes_[f].emplace(c_.sources.file(f).text);
        return *indexes_[f];
    }

  private:
    const CheckedModel& c_;
    std::vector<std::optional<LineIndex>> indexes_;
};

Json range_in_file(LineIndexes& lines, const SourceRange& where) {
    return range_json(lines.of(where.file), where.begin.offset, where.end.offset);
}

Json related_information(const CheckedModel& c, LineIndexes& lines, const Diagnostic& d,
                         std::string& message) {
    Json related = Json::array();
    for (const Diagnostic& note : d.notes) {
        const SourceFile& file = c.sources.file(note.where.file);
        if (!has_file(file)) {
            message += fmt::format("\nnote ({}): {}", place_text(c, note.where), note.message);
            continue;
        }
        related.push_back(
            {{"location",
              {{"uri", uri_of_path(file.name)}, {"range", range_in_file(lines, note.where)}}},
             {"message", note.message}});
    }
    return related;
}

Json diagnostic_json(const CheckedModel& c, LineIndexes& lines, const Diagnostic& d) {
    std::string message = d.message;
    Json range;
    if (d.where.file == c.main) {
        range = range_in_file(lines, d.where);
    } else {
        // A message about a used file is shown at the top of the model that uses it.
        message = fmt::format("in {}: {}", place_text(c, d.where), d.message);
        range = range_json(LineIndex(""), 0, 0);
    }
    Json related = related_information(c, lines, d, message);
    Json out{{"range", range},
             {"severity", severity_code(d.severity)},
             {"source", "firn"},
             {"message", message}};
    if (!related.empty())
        out["relatedInformation"] = related;
    return out;
}

}  // namespace

std::unique_ptr<CheckedModel> check_model(std::string path, std::string text,
                                          const ImportOptions& options,
                                          const CheckedModel* previous) {
    auto c = std::make_unique<CheckedModel>();
    if (previous != nullptr)
        c->units = previous->units;
    else
        make_display_units("kN", "m", "", c->units);
    c->main = c->sources.add(path, std::move(text));
    c->trees = load_model(c->sources, c->main, c->diagnostics, options);
    if (c->diagnostics.has_errors())
        return c;
    c->model = resolve(c->trees, c->diagnostics);
    c->model.source_name = std::move(path);
    c->resolved = true;
    c->units = c->model.units;
    if (c->diagnostics.has_errors())
        return c;
    c->complete = true;
    derive_model(*c);
    return c;
}

Json diagnostics_json(const CheckedModel& checked) {
    Json items = Json::array();
    LineIndexes lines(checked);
    for (const Diagnostic& d : checked.diagnostics.all())
        items.push_back(diagnostic_json(checked, lines, d));
    for (const std::string& message : checked.diagnostics.unplaced()) {
        items.push_back({{"range", range_json(LineIndex(""), 0, 0)},
                         {"severity", 1},
                         {"source", "firn"},
                         {"message", message}});
    }
    return items;
}

}  // namespace firn::lsp
