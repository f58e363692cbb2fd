// name_pattern: matching names against patterns with `*`.
#include "base/name_pattern.hpp"

#include <string_view>

namespace firn {

bool name_matches(std::string_view pattern, std::string_view name) {
    // Greedy matching with backtracking to the last '*': linear in practice.
    std::size_t p = 0, n = 0, star = std::string_view::npos, mark = 0;
    while (n < name.size()) {
        if (p < pattern.size() && pattern[p] == '*') {
            star = p++;
            mark = n;
        } else if (p < pattern.size() && pattern[p] == name[n]) {
            ++p;
            ++n;
        } else if (star != std::string_view::npos) {
            p = star + 1;
            n = ++mark;
        } else {
            return false;
        }
    }
    while (p < pattern.size() && pattern[p] == '*')
        ++p;
    return p == pattern.size();
}

}  // namespace firn
