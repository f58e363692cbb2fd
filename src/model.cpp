// model: words for the model's enums.
#include "model.hpp"

namespace firn {

const char* case_kind_name(CaseKind kind) {
    switch (kind) {
        case CaseKind::dead:
            return "dead";
        case CaseKind::live:
            return "live";
        case CaseKind::roof_live:
            return "roof live";
        case CaseKind::snow:
            return "snow";
        case CaseKind::wind:
            return "wind";
        case CaseKind::other:
            return "other";
    }
    return "other";
}

const char* support_kind_name(Support::Kind kind) {
    switch (kind) {
        case Support::Kind::fixed:
            return "fixed";
        case Support::Kind::pinned:
            return "pinned";
        case Support::Kind::roller_free_x:
            return "roller, free in x";
        case Support::Kind::roller_free_y:
            return "roller, free in y";
        case Support::Kind::spring:
            return "spring";
    }
    return "fixed";
}

}  // namespace firn
