#pragma once
// A small in-memory store of answers that took long to compute (exact tests, simulations), so
// that a recalculation with unchanged input does not compute them again. Calc recalculates
// add-in cells whenever a document loads and on every hard recalculation; without this, a sheet
// with a few exact tests at their limits costs seconds each time.
//
// An answer is a row of numbers, or a refusal: the message of the assoc::Error the computation
// threw, which is thrown again, word for word. It is stored under a key that holds, byte for byte,
// everything the answer depends on (see CacheKey); a lookup compares whole keys, never only their
// hashes, so a cached answer is the one a fresh computation gives for the same input.
//
// Bounded in bytes (keys, numbers, messages and bookkeeping counted): when full, the least
// recently used answers go first. Safe to use from several threads at once (Calc calls add-in
// functions on varying threads); the computation itself runs outside the lock.
#include <cstddef>
#include <cstdint>
#include <functional>
#include <list>
#include <mutex>
#include <optional>
#include <string>
#include <string_view>
#include <unordered_map>
#include <vector>

#include "assoc/count_table.hpp"
#include "assoc/exact_test.hpp"
#include "assoc/matrix.hpp"
#include "assoc/monte_carlo.hpp"

namespace assoc::calc {

// The bytes of a cache key: the name of the computation, then every input in a fixed order and
// width (numbers as their exact bit patterns, sizes before contents), so that two keys are equal
// only when the inputs are.
class CacheKey {
public:
    explicit CacheKey(std::string_view computation);

    CacheKey& add(double value);
    CacheKey& add(std::uint64_t value);
    CacheKey& add(std::string_view text);
    CacheKey& add(const Matrix& values);
    // The counts the statistics use (the kept rows and columns), with their shape.
    CacheKey& add(const CountTable& table);
    CacheKey& add(const ExactLimits& limits);
    CacheKey& add(const SimulationLimits& limits);
    CacheKey& add(const SimulationOptions& options);
    // Option words arrive as enums: keyed by their value.
    template <class Enum, class = std::enable_if_t<std::is_enum_v<Enum>>>
    CacheKey& add(Enum value) {
        return add(static_cast<std::uint64_t>(value));
    }

    const std::string& bytes() const { return bytes_; }

private:
    std::string bytes_;
};

// What a computation gave: numbers, or the refusal message.
struct CachedAnswer {
    std::vector<double> numbers;
    std::optional<std::string> refusal;
};

class ResultCache {
public:
    explicit ResultCache(std::size_t capacity_bytes);
    ResultCache(const ResultCache&) = delete;
    ResultCache& operator=(const ResultCache&) = delete;

    // The stored answer for `key` (then the most recently used), or nothing.
    std::optional<CachedAnswer> find(const CacheKey& key);
    // Stores an answer; older answers make room. An answer larger than the whole capacity is not kept.
    void store(const CacheKey& key, CachedAnswer answer);
    // Runs `compute` unless the answer for `key` is stored: a stored refusal is thrown again as
    // assoc::Error with the same message; a fresh assoc::Error is stored and rethrown. Other
    // exceptions pass through and are not stored.
    std::vector<double> remembered(const CacheKey& key, const std::function<std::vector<double>()>& compute);

    void clear();

    struct Statistics {
        std::uint64_t hits = 0, misses = 0;
        std::size_t entries = 0, bytes = 0;
    };
    Statistics statistics() const;

    // Bytes an entry is counted as: its key, numbers and message, and a fixed share for the list
    // node, the map node and the strings' and vector's headers.
    static std::size_t entry_bytes(const std::string& key, const CachedAnswer& answer);

private:
    struct Entry {
        std::string key;
        CachedAnswer answer;
        std::size_t bytes;
    };
    void evict_until_fits(std::size_t incoming);

    mutable std::mutex mutex_;
    const std::size_t capacity_;
    std::size_t bytes_ = 0;
    std::list<Entry> entries_;  // most recently used first
    std::unordered_map<std::string_view, std::list<Entry>::iterator> index_;  // views into entries_' keys
    std::uint64_t hits_ = 0, misses_ = 0;
};

}  // namespace assoc::calc
