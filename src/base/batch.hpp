// batch: many models in one command (`firn check`, `firn baseline`): a stable
// slice of them for one of several CI jobs (--shard K/N), and their analyses
// spread over worker threads with results kept in the models' order, so the
// output is the same whatever the number of workers.
#pragma once

#include <algorithm>
#include <atomic>
#include <cstddef>
#include <optional>
#include <string>
#include <string_view>
#include <thread>
#include <vector>

namespace firn {

/// The K-th of N slices of a list of models, 1 <= index <= count.
struct Shard {
    std::size_t index = 1;
    std::size_t count = 1;
};

/// Reads `K/N` (1 <= K <= N); on failure returns nothing and says why in `error`.
std::optional<Shard> parse_shard(std::string_view text, std::string& error);

/// The models of one shard: the paths sorted and repeats dropped, then every N-th from the
/// K-th. Sorting makes the slice independent of the order the paths were given in.
std::vector<std::string> models_in_shard(std::vector<std::string> models, Shard shard);

/// The number of workers for `requested` (0: one per hardware thread), at most `jobs`.
std::size_t worker_count(std::size_t requested, std::size_t jobs);

/// Calls job(i) for every i in [0, count) on `workers` threads (0: one per hardware
/// thread) and returns the results by index: each worker takes the next index in turn,
/// so a slow model does not hold up a fixed share of the others.
template <typename Result, typename Job>
std::vector<Result> run_each(std::size_t count, std::size_t workers, Job job) {
    std::vector<Result> results(count);
    std::atomic<std::size_t> next{0};
    auto worker = [&] {
        for (std::size_t i = next++; i < count; i = next++)
            results[i] = job(i);
    };
    std::size_t threads = worker_count(workers, count);
    std::vector<std::thread> pool;
    for (std::size_t t = 1; t < threads; ++t)
        pool.emplace_back(worker);
    worker();
    for (std::thread& th : pool)
        th.join();
    return results;
}

}  // namespace firn
