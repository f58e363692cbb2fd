// name_pattern: matching names against patterns with `*`.
#include "base/name_pattern.hpp"

#include <set>
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

std::vector<std::size_t> matching_names(const std::vector<std::string>& patterns, std::size_t count,
                                        const std::function<std::string(std::size_t)>& name_of,
                                        const char* what, std::vector<std::string>& errors) {
    std::set<std::size_t> chosen;
    for (const std::string& pattern : patterns) {
        bool any = false;
        for (std::size_t i = 0; i < count; ++i) {
            if (name_matches(pattern, name_of(i))) {
                chosen.insert(i);
                any = true;
            }
        }
        if (!any)
            errors.push_back(std::string("no ") + what + " is named '" + pattern + "'");
    }
    return {chosen.begin(), chosen.end()};
}

}  // namespace firn
