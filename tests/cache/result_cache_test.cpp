// The cache's own behaviour: keys match byte for byte, refusals come back word for word, the
// least recently used answers make room, the byte bound holds, threads may share it.
#include <gtest/gtest.h>

#include <atomic>
#include <cmath>
#include <stdexcept>
#include <string>
#include <thread>
#include <vector>

#include "assoc/error.hpp"
#include "result_cache.hpp"
#include "test_support.hpp"

namespace assoc::calc {
namespace {

CachedAnswer numbers(std::vector<double> values) { return CachedAnswer{std::move(values), std::nullopt}; }

TEST(ResultCache, FindsAStoredAnswerUnderTheSameKey) {
    ResultCache cache(100'000);
    cache.store(CacheKey("f").add(1.0), numbers({0.25, 3}));
    const auto found = cache.find(CacheKey("f").add(1.0));
    ASSERT_TRUE(found.has_value());
    EXPECT_EQ(found->numbers, (std::vector<double>{0.25, 3}));
    EXPECT_FALSE(found->refusal.has_value());
}

TEST(ResultCache, KeysThatDifferInTheLastBitOfANumberAreDifferentEntries) {
    ResultCache cache(100'000);
    cache.store(CacheKey("f").add(1.0), numbers({1}));
    EXPECT_FALSE(cache.find(CacheKey("f").add(std::nextafter(1.0, 2.0))).has_value());
    EXPECT_FALSE(cache.find(CacheKey("g").add(1.0)).has_value());
}

TEST(ResultCache, TextsInAKeyDoNotRunTogether) {
    EXPECT_NE(CacheKey("f").add("ab").add("c").bytes(), CacheKey("f").add("a").add("bc").bytes());
}

TEST(ResultCache, MatricesOfTheSameValuesButAnotherShapeAreDifferentKeys) {
    EXPECT_NE(CacheKey("f").add(Matrix(2, 3, 1.0)).bytes(), CacheKey("f").add(Matrix(3, 2, 1.0)).bytes());
}

TEST(ResultCache, RemembersAnAnswerSoThatTheSecondCallDoesNotCompute) {
    ResultCache cache(100'000);
    int computed = 0;
    const auto compute = [&] {
        ++computed;
        return std::vector<double>{0.5};
    };
    EXPECT_EQ(cache.remembered(CacheKey("f").add(2.0), compute), std::vector<double>{0.5});
    EXPECT_EQ(cache.remembered(CacheKey("f").add(2.0), compute), std::vector<double>{0.5});
    EXPECT_EQ(computed, 1);
    EXPECT_EQ(cache.statistics().hits, 1u);
    EXPECT_EQ(cache.statistics().misses, 1u);
}

TEST(ResultCache, ThrowsARememberedRefusalAgainWithTheSameMessage) {
    ResultCache cache(100'000);
    int computed = 0;
    const auto refuse = [&]() -> std::vector<double> {
        ++computed;
        throw Error("the exact test for this table needs more time than allowed");
    };
    for (int call = 0; call < 2; ++call)
        test::expect_error([&] { cache.remembered(CacheKey("f"), refuse); },
                           "the exact test for this table needs more time than allowed");
    EXPECT_EQ(computed, 1);
}

TEST(ResultCache, DoesNotRememberFailuresOtherThanRefusals) {
    ResultCache cache(100'000);
    int computed = 0;
    const auto fail = [&]() -> std::vector<double> {
        ++computed;
        throw std::runtime_error("out of something");
    };
    EXPECT_THROW(cache.remembered(CacheKey("f"), fail), std::runtime_error);
    EXPECT_THROW(cache.remembered(CacheKey("f"), fail), std::runtime_error);
    EXPECT_EQ(computed, 2);
    EXPECT_EQ(cache.statistics().entries, 0u);
}

TEST(ResultCache, LetsTheLeastRecentlyUsedAnswerGoFirstWhenFull) {
    const std::size_t one = ResultCache::entry_bytes(CacheKey("f").add(1.0).bytes(), numbers({1}));
    ResultCache cache(3 * one);
    for (double k : {1.0, 2.0, 3.0}) cache.store(CacheKey("f").add(k), numbers({k}));
    ASSERT_TRUE(cache.find(CacheKey("f").add(1.0)).has_value());  // 1 is now the most recently used
    cache.store(CacheKey("f").add(4.0), numbers({4}));
    EXPECT_TRUE(cache.find(CacheKey("f").add(1.0)).has_value());
    EXPECT_FALSE(cache.find(CacheKey("f").add(2.0)).has_value());
    EXPECT_TRUE(cache.find(CacheKey("f").add(3.0)).has_value());
    EXPECT_TRUE(cache.find(CacheKey("f").add(4.0)).has_value());
}

TEST(ResultCache, NeverCountsMoreBytesThanItsCapacity) {
    ResultCache cache(20'000);
    for (int k = 0; k < 1000; ++k) {
        cache.store(CacheKey("f").add(static_cast<double>(k)), numbers(std::vector<double>(k % 40, 1.0)));
        ASSERT_LE(cache.statistics().bytes, 20'000u);
    }
    EXPECT_GT(cache.statistics().entries, 10u);
}

TEST(ResultCache, DoesNotKeepAnAnswerLargerThanItsWholeCapacity) {
    ResultCache cache(1'000);
    cache.store(CacheKey("f"), numbers(std::vector<double>(1000, 1.0)));
    EXPECT_EQ(cache.statistics().entries, 0u);
    EXPECT_EQ(cache.statistics().bytes, 0u);
}

TEST(ResultCache, ClearLeavesItEmpty) {
    ResultCache cache(100'000);
    cache.store(CacheKey("f"), numbers({1}));
    cache.clear();
    EXPECT_FALSE(cache.find(CacheKey("f")).has_value());
    EXPECT_EQ(cache.statistics().bytes, 0u);
}

// Calc calls add-in functions on varying threads: many threads storing, finding and evicting at
// once must each get the answer of their own key.
TEST(ResultCache, GivesEveryThreadTheAnswerOfItsOwnKey) {
    ResultCache cache(30'000);  // small, so that threads evict each other's answers too
    std::atomic<int> wrong{0};
    std::vector<std::thread> threads;
    for (int t = 0; t < 8; ++t)
        threads.emplace_back([&, t] {
            for (int i = 0; i < 2000; ++i) {
                const double k = static_cast<double>((i * 7 + t) % 97);
                const std::vector<double> answer =
                    cache.remembered(CacheKey("f").add(k), [&] { return std::vector<double>{k, k * k}; });
                if (answer != std::vector<double>{k, k * k}) ++wrong;
            }
        });
    for (std::thread& thread : threads) thread.join();
    EXPECT_EQ(wrong.load(), 0);
    EXPECT_LE(cache.statistics().bytes, 30'000u);
}

}  // namespace
}  // namespace assoc::calc
