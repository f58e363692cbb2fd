// resolve: syntax trees -> Model. Binds names, evaluates quantities to SI,
// checks every rule a model must obey, and reports all problems it finds.
#pragma once

#include <span>

#include "base/diag.hpp"
#include "ir/model.hpp"
#include "ir/syntax.hpp"

namespace firn {

/// Builds the model from the trees of a run (the model file first). Reports
/// every error found; the returned model is only meaningful when no error was
/// reported.
Model resolve(std::span<const syntax::Tree> trees, Diagnostics& diagnostics);

}  // namespace firn
