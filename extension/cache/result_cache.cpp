#include "result_cache.hpp"

#include <cstring>
#include <type_traits>
#include <utility>

#include "assoc/error.hpp"

namespace assoc::calc {

CacheKey::CacheKey(std::string_view computation) { add(computation); }

namespace {

// The exact bytes of a number (a double's bit pattern: 0.0 and -0.0, or two NaNs, are different keys).
template <class Number>
void append_bytes(std::string& bytes, Number value) {
    char raw[sizeof value];
    std::memcpy(raw, &value, sizeof value);
    bytes.append(raw, sizeof raw);
}

}  // namespace

CacheKey& CacheKey::add(double value) {
    append_bytes(bytes_, value);
    return *this;
}

CacheKey& CacheKey::add(std::uint64_t value) {
    append_bytes(bytes_, value);
    return *this;
}

CacheKey& CacheKey::add(std::string_view text) {
    add(static_cast<std::uint64_t>(text.size()));
    bytes_.append(text.data(), text.size());
    return *this;
}

CacheKey& CacheKey::add(const Matrix& values) {
    add(static_cast<std::uint64_t>(values.rows()));
    add(static_cast<std::uint64_t>(values.columns()));
    const std::size_t size = values.values().size() * sizeof(double);
    const std::size_t at = bytes_.size();
    bytes_.resize(at + size);
    if (size > 0) std::memcpy(&bytes_[at], values.values().data(), size);
    return *this;
}

CacheKey& CacheKey::add(const CountTable& table) { return add(table.counts()); }

// The key must hold every field the answer depends on: the structured bindings below name every
// field of the structs, so that a field added to them stops the build here until it is keyed too.
CacheKey& CacheKey::add(const ExactLimits& limits) {
    const auto& [max_seconds, max_memory_bytes, forecast] = limits;
    return add(max_seconds).add(static_cast<std::uint64_t>(max_memory_bytes)).add(static_cast<std::uint64_t>(forecast));
}

CacheKey& CacheKey::add(const SimulationLimits& limits) {
    const auto& [max_seconds, max_work] = limits;
    return add(max_seconds).add(max_work);
}

CacheKey& CacheKey::add(const SimulationOptions& options) {
    const auto& [trials, seed, statistic, order, limits] = options;
    return add(trials).add(seed).add(statistic).add(order).add(limits);
}

ResultCache::ResultCache(std::size_t capacity_bytes) : capacity_(capacity_bytes) {}

std::size_t ResultCache::entry_bytes(const std::string& key, const CachedAnswer& answer) {
    constexpr std::size_t bookkeeping = sizeof(Entry) + 4 * sizeof(void*)          // list node
                                        + sizeof(std::string_view) + 4 * sizeof(void*);  // map node, bucket
    return bookkeeping + key.capacity() + answer.numbers.capacity() * sizeof(double) +
           (answer.refusal ? answer.refusal->capacity() : 0);
}

std::optional<CachedAnswer> ResultCache::find(const CacheKey& key) {
    const std::lock_guard<std::mutex> lock(mutex_);
    const auto found = index_.find(std::string_view(key.bytes()));
    if (found == index_.end()) {
        ++misses_;
        return std::nullopt;
    }
    ++hits_;
    entries_.splice(entries_.begin(), entries_, found->second);
    return found->second->answer;
}

void ResultCache::store(const CacheKey& key, CachedAnswer answer) {
    Entry entry{key.bytes(), std::move(answer), 0};
    entry.bytes = entry_bytes(entry.key, entry.answer);
    if (entry.bytes > capacity_) return;
    const std::lock_guard<std::mutex> lock(mutex_);
    // Another thread may have stored the same answer meanwhile: keep one.
    if (const auto found = index_.find(std::string_view(entry.key)); found != index_.end()) {
        entries_.splice(entries_.begin(), entries_, found->second);
        return;
    }
    evict_until_fits(entry.bytes);
    bytes_ += entry.bytes;
    entries_.push_front(std::move(entry));
    index_.emplace(std::string_view(entries_.front().key), entries_.begin());
}

void ResultCache::evict_until_fits(std::size_t incoming) {
    while (!entries_.empty() && bytes_ + incoming > capacity_) {
        const Entry& oldest = entries_.back();
        bytes_ -= oldest.bytes;
        index_.erase(std::string_view(oldest.key));
        entries_.pop_back();
    }
}

std::vector<double> ResultCache::remembered(const CacheKey& key, const std::function<std::vector<double>()>& compute) {
    if (std::optional<CachedAnswer> answer = find(key)) {
        if (answer->refusal) throw Error(*answer->refusal);
        return std::move(answer->numbers);
    }
    CachedAnswer fresh;
    try {
        fresh.numbers = compute();
    } catch (const Error& error) {
        store(key, CachedAnswer{{}, std::string(error.what())});
        throw;
    }
    store(key, fresh);
    return fresh.numbers;
}

void ResultCache::clear() {
    const std::lock_guard<std::mutex> lock(mutex_);
    index_.clear();
    entries_.clear();
    bytes_ = 0;
}

ResultCache::Statistics ResultCache::statistics() const {
    const std::lock_guard<std::mutex> lock(mutex_);
    return {hits_, misses_, entries_.size(), bytes_};
}

}  // namespace assoc::calc
