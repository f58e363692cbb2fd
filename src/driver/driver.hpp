// driver: runs the stages in order and stops after a stage that reported
// errors. The subcommands and the tests call this; it knows nothing of argv.
#pragma once

#include <string>

#include "ir/analysis.hpp"
#include "ir/import_options.hpp"

namespace firn {

/// Parses, resolves and analyses a model held in memory, named `name` in messages.
/// `options` say where `use` finds the standard library.
Analysis analyse_text(std::string name, std::string text, PhaseTimes* times = nullptr,
                      const ImportOptions& options = {});

/// The same for a model file; a file that cannot be read is reported as an error.
Analysis analyse_file(const std::string& path, PhaseTimes* times = nullptr,
                      const ImportOptions& options = {});

}  // namespace firn
