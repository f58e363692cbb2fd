// report: results as deterministic text or JSON. Knows nothing of how the
// numbers were made; converts SI to the model's display units.
#pragma once

#include <string>

#include "model.hpp"
#include "results.hpp"
#include "stations.hpp"

namespace firn {

/// The caution every report carries.
extern const char* const kCaution;

struct ReportOptions {
    const Stations* stations = nullptr;  ///< member stations to print, if any (--full)
};

/// The text report: model echo, then per case equilibrium, reactions,
/// displacements, member end forces and member extremes.
std::string text_report(const Model& model, const Results& results, const ReportOptions& options);

/// The same results as JSON, in the model's display units (stated in "units").
std::string json_report(const Model& model, const Results& results, const ReportOptions& options);

}  // namespace firn
