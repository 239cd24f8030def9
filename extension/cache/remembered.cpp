#include "remembered.hpp"

#include <vector>

namespace assoc::calc {

ResultCache& shared_result_cache() {
    // A function-local static: created at the first call, destroyed when the library is unloaded.
    static ResultCache cache(shared_result_cache_bytes);
    return cache;
}

double remembered_exact_p_value(ResultCache& cache, const CountTable& table, Side side, const ExactLimits& limits) {
    const CacheKey key = CacheKey("exact_p_value").add(table).add(side).add(limits);
    return cache.remembered(key, [&] { return std::vector<double>{exact_p_value(table, side, limits)}; }).front();
}

double shared_exact_p_value(const CountTable& table, Side side, const ExactLimits& limits) {
    return remembered_exact_p_value(shared_result_cache(), table, side, limits);
}

SimulationResult remembered_monte_carlo_test(ResultCache& cache, const CountTable& table, const SimulationOptions& options) {
    const CacheKey key = CacheKey("monte_carlo_test").add(table).add(options);
    const std::vector<double> numbers = cache.remembered(key, [&] {
        const SimulationResult result = monte_carlo_test(table, options);
        return std::vector<double>{result.p_value, result.standard_error, static_cast<double>(result.trials),
                                   static_cast<double>(result.at_least_as_large), result.statistic};
    });
    // Every field rebuilt (the structured binding names them all: a field added to SimulationResult
    // stops the build here until it is stored too).
    SimulationResult result;
    auto& [p_value, standard_error, trials, at_least_as_large, statistic, method] = result;
    p_value = numbers[0];
    standard_error = numbers[1];
    trials = static_cast<std::uint64_t>(numbers[2]);
    at_least_as_large = static_cast<std::uint64_t>(numbers[3]);
    statistic = numbers[4];
    method = options.statistic;
    return result;
}

}  // namespace assoc::calc
