// baseline_key: the parts of a baseline key, for grouping changes and laying
// out their lines. Private to the baseline stage.
#pragma once

#include <string>
#include <string_view>
#include <vector>

namespace firn::baseline_detail {

/// `member AB`, `moment_min`, `case D`: the key's parts in reading order.
struct KeyParts {
    std::string entity, quantity, scope;
};

inline KeyParts split_key(std::string_view key) {
    // Keys are `SCOPE NAME KIND NAME QUANTITY...`, or `snow SITE NAME` (see baseline_write.cpp).
    std::vector<std::size_t> spaces;
    for (std::size_t i = 0; i < key.size() && spaces.size() < 4; ++i) {
        if (key[i] == ' ')
            spaces.push_back(i);
    }
    if (spaces.size() < 2)
        return {std::string(key), "", ""};
    std::string scope(key.substr(0, spaces[1]));
    if (spaces.size() < 4)
        return {std::string(key.substr(spaces[1] + 1)), "", scope};
    return {std::string(key.substr(spaces[1] + 1, spaces[3] - spaces[1] - 1)),
            std::string(key.substr(spaces[3] + 1)), scope};
}

}  // namespace firn::baseline_detail
