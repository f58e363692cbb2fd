// Tests of batch: shards and the worker pool.
#include <catch2/catch.hpp>
#include <string>
#include <vector>

#include "base/batch.hpp"

namespace firn {

TEST_CASE("a shard is K/N with 1 <= K <= N", "[batch]") {
    std::string error;
    auto shard = parse_shard("2/3", error);
    REQUIRE(shard);
    CHECK(shard->index == 2);
    CHECK(shard->count == 3);
    for (const char* bad : {"0/3", "4/3", "3", "a/b", "1/0", "1/", "/2", "1/2/3", "-1/2"}) {
        INFO(bad);
        CHECK_FALSE(parse_shard(bad, error));
        CHECK_FALSE(error.empty());
    }
}

TEST_CASE("shards split sorted models without overlap, whatever the order given", "[batch]") {
    std::vector<std::string> models{"e.firn", "a.firn", "d.firn", "b.firn", "c.firn", "a.firn"};
    std::vector<std::string> all;
    for (std::size_t k = 1; k <= 3; ++k) {
        std::vector<std::string> slice = models_in_shard(models, Shard{k, 3});
        all.insert(all.end(), slice.begin(), slice.end());
    }
    std::sort(all.begin(), all.end());
    CHECK(all == std::vector<std::string>{"a.firn", "b.firn", "c.firn", "d.firn", "e.firn"});
    CHECK(models_in_shard(models, Shard{1, 3}) == std::vector<std::string>{"a.firn", "d.firn"});
    std::vector<std::string> reversed(models.rbegin(), models.rend());
    CHECK(models_in_shard(reversed, Shard{2, 3}) == models_in_shard(models, Shard{2, 3}));
    CHECK(models_in_shard(models, Shard{1, 1}).size() == 5);
}

TEST_CASE("run_each keeps results in order for any number of workers", "[batch]") {
    for (std::size_t workers : {1U, 2U, 5U, 64U}) {
        std::vector<std::size_t> squares =
            run_each<std::size_t>(100, workers, [](std::size_t i) { return i * i; });
        REQUIRE(squares.size() == 100);
        for (std::size_t i = 0; i < squares.size(); ++i)
            CHECK(squares[i] == i * i);
    }
    CHECK(run_each<int>(0, 4, [](std::size_t) { return 1; }).empty());
    CHECK(worker_count(0, 3) >= 1);
    CHECK(worker_count(8, 3) == 3);
    CHECK(worker_count(8, 0) == 1);
}

}  // namespace firn
