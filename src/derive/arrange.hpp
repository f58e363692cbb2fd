// arrange: load arrangements over the spans of a run of members. A pattern
// rule (PatternRule, written in the language) gives each span a factor of a
// load; this stage finds the spans and makes one load case per arrangement.
// The snow stage uses it for partial loading (the standard's Sec. 7.5.1); models
// use it through `arrange CASE on MEMBERS by RULE` (pattern live load, say).
#pragma once

#include <string>
#include <vector>

#include "base/diag.hpp"
#include "ir/model.hpp"

namespace firn {

/// A span: the members of a run between two supporting nodes, or between a
/// supporting node and a free end (a cantilever, which counts as a span).
struct Span {
    std::size_t first = 0, last = 0;  ///< indices into the run, inclusive
    std::string name;                 ///< from its end nodes: `A-B`
    bool cantilever = false;
};

/// The spans of `run` (members in order). A node of the run supports it when a
/// support holds it or a member outside the run meets it there.
std::vector<Span> spans_of(const Model& model, const std::vector<MemberId>& run);

/// One arrangement: a factor per span, its name and what it loads.
struct Arrangement {
    std::string name;  ///< `case3.B_D`: the rule's line and the spans it selects
    std::vector<double> factors;
    std::string description;  ///< `1.0 on B-C, C-D; 0.5 on A-B, D-E`
};

/// Every arrangement the rule makes on these spans, in the rule's order; an
/// arrangement equal to an earlier one, or with every factor 1 (the load as
/// written), is left out.
std::vector<Arrangement> arrangements_of(const PatternRule& rule, const std::vector<Span>& spans);

/// A copy of `base` named `name` whose loads on the run's members are scaled
/// by their span's factor; loads elsewhere are kept as they are.
LoadCase arranged_case(const Model& model, const LoadCase& base, const std::vector<MemberId>& run,
                       const std::vector<Span>& spans, const Arrangement& arrangement,
                       std::string name);

}  // namespace firn
