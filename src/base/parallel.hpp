// parallel: splits a range of independent jobs over the machine's cores.
#pragma once

#include <algorithm>
#include <cstddef>
#include <thread>
#include <vector>

namespace firn {

/// Calls work(begin, end) on contiguous chunks covering [0, count), one chunk
/// per hardware thread, and waits for all. The chunks never share an index,
/// so results written per index do not depend on the number of threads.
template <typename Work>
void for_each_chunk(std::size_t count, Work work) {
    std::size_t threads = std::max<std::size_t>(1, std::thread::hardware_concurrency());
    threads = std::min(threads, count);
    if (threads <= 1) {
        if (count > 0)
            work(std::size_t{0}, count);
        return;
    }
    std::vector<std::thread> pool;
    pool.reserve(threads - 1);
    for (std::size_t t = 1; t < threads; ++t) {
        pool.emplace_back(work, count * t / threads, count * (t + 1) / threads);
    }
    work(std::size_t{0}, count / threads);
    for (std::thread& th : pool)
        th.join();
}

}  // namespace firn
