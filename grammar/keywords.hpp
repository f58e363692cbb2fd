// The reserved words of the firn language, in one list (ORDER KEYWORDS).
// A keyword cannot name a node, member, grid line or anything else the user
// names. grammar.hpp defines one rule per word; a test checks that the two
// agree, and issue-tracked editor highlighters are checked against this list.
#pragma once

#include <array>
#include <string_view>

namespace firn::grammar {

// ORDER KEYWORDS
inline constexpr std::array<std::string_view, 56> keywords{
    "along",     "amend",        "at",         "axial",     "because",
    "beams",     "case",         "clockwise",  "columns",   "counterclockwise",
    "dead",      "displacement", "down",       "fixed",     "free",
    "from",      "grid",         "group",      "hinge",     "ishape",
    "let",       "linear",       "live",       "material",  "member",
    "model",     "moment",       "node",       "on",        "other",
    "outside",   "pinned",       "point",      "projected", "rafters",
    "rectangle", "report",       "roller",     "rotation",  "section",
    "self",      "snow",         "spacing",    "spring",    "support",
    "tag",       "to",           "transverse", "uniform",   "units",
    "up",        "use",          "weight",     "wind",      "x",
    "y",
};

/// Words that are keywords only where the grammar expects them, and otherwise
/// free for names: `roof` starts `roof live`, but engineers name levels "roof";
/// `plan` follows `grid` only; `projection`, `combinations`, `combine`, `pattern` and
/// `arrange`, `deflection` and `expect` start a statement only; `limit` follows its members;
/// `or`, `half_live_in` and `by` have meaning inside them, as `of`, `shear`, `reaction`,
/// `under`, `between`, `and` and `within` have inside `expect`; `geometry` and `unjoined`
/// start a statement only, and `tolerance` follows `geometry`; `cover` starts a statement only;
/// `rain` is a case's kind only.
inline constexpr std::array<std::string_view, 25> contextual_keywords{
    "and",        "arrange", "between",    "by",           "combinations", "combine", "cover",
    "deflection", "expect",  "geometry",   "half_live_in", "limit",        "of",      "or",
    "pattern",    "plan",    "projection", "rain",         "reaction",     "roof",    "shear",
    "tolerance",  "under",   "unjoined",   "within"};

}  // namespace firn::grammar
