// batch: shards and worker counts (the thread pool itself is in the header).
#include "base/batch.hpp"

#include <charconv>

namespace firn {
namespace {

bool read_count(std::string_view text, std::size_t& value) {
    if (text.empty())
        return false;
    auto [end, ec] = std::from_chars(text.data(), text.data() + text.size(), value);
    return ec == std::errc{} && end == text.data() + text.size();
}

}  // namespace

std::optional<Shard> parse_shard(std::string_view text, std::string& error) {
    std::size_t slash = text.find('/');
    Shard shard;
    if (slash == std::string_view::npos || !read_count(text.substr(0, slash), shard.index) ||
        !read_count(text.substr(slash + 1), shard.count)) {
        error = "a shard is written K/N, e.g. 2/4 for the second of four slices";
        return std::nullopt;
    }
    if (shard.count == 0 || shard.index == 0 || shard.index > shard.count) {
        error = "shard K/N needs 1 <= K <= N";
        return std::nullopt;
    }
    return shard;
}

std::vector<std::string> models_in_shard(std::vector<std::string> models, Shard shard) {
    std::sort(models.begin(), models.end());
    models.erase(std::unique(models.begin(), models.end()), models.end());
    std::vector<std::string> slice;
    for (std::size_t i = shard.index - 1; i < models.size(); i += shard.count)
        slice.push_back(std::move(models[i]));
    return slice;
}

std::size_t worker_count(std::size_t requested, std::size_t jobs) {
    std::size_t workers = requested;
    if (workers == 0)
        workers = std::max<std::size_t>(1, std::thread::hardware_concurrency());
    return std::max<std::size_t>(1, std::min(workers, jobs));
}

}  // namespace firn
