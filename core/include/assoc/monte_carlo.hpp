#pragma once
// A simulated (Monte Carlo) p-value for the test of independence: the share of random tables
// with the observed row and column totals whose statistic is at least the observed one.
// Unlike the chi-squared approximation it stays valid for small and sparse tables.
#include <cstdint>
#include <optional>
#include <string>

#include "assoc/count_table.hpp"
#include "assoc/statistics.hpp"
#include "assoc/work_limits.hpp"

namespace assoc {

inline constexpr std::uint64_t default_simulation_trials = 100'000;
inline constexpr std::uint64_t max_simulation_trials = 10'000'000;
inline constexpr std::uint64_t min_simulation_trials = 100;
// The seed used when none is given, so that a recalculated sheet shows the same p-value.
inline constexpr std::uint64_t default_simulation_seed = 1;
// Tables above this total are refused: the chi-squared p-value is reliable long before.
inline constexpr double max_simulation_total = 1e9;

// What makes a random table at least as extreme as the observed one.
enum class SimulationOrder {
    statistic,    // its statistic (SimulationOptions::statistic) is at least the observed one
    probability,  // it is no more probable than the observed table (within ASSOC.EXACT's tie margin,
                  // exact_tie_tolerance), as the exact test orders tables: the p-value estimates ASSOC.EXACT's
};

struct SimulationOptions {
    std::uint64_t trials = default_simulation_trials;
    std::uint64_t seed = default_simulation_seed;
    Method statistic = Method::pearson;  // pearson or likelihood_ratio (G²); yates is refused
    SimulationOrder order = SimulationOrder::statistic;
    SimulationLimits limits;  // time, and the work estimated before it starts (work_limits.hpp)
};

struct SimulationResult {
    double p_value = 1.0;           // (1 + k) / (trials + 1), never 0
    double standard_error = 0.0;    // √(p (1 − p) / trials), the Monte Carlo error of p
    std::uint64_t trials = 0;
    std::uint64_t at_least_as_large = 0;  // k: simulated statistics ≥ the observed one
    double statistic = 0.0;         // the observed statistic; by probability: the observed table's probability
    Method method = Method::pearson;
};

// Draws `trials` random tables with the table's row and column totals (each table as likely as
// under independence given the totals) and counts those whose statistic is at least the observed
// one, less a relative tolerance of 1e-7 so that ties by rounding count as ties. By probability,
// it counts those whose probability ∏R! ∏C! / (n! ∏x!) is at most the observed table's times
// (1 + exact_tie_tolerance), the tables the two-sided exact test adds up.
// Needs whole counts. The tables are drawn row by row, cell by cell, each cell from its conditional
// hypergeometric distribution (an exact sampler, equivalent to Patefield's AS 159) driven by
// std::mt19937_64, whose output the C++ standard fixes: the same seed gives the same p-value on
// every machine with IEEE-754 doubles (the last-bit rounding of exp/log could only matter for a
// draw that falls within about 1e-16 of a boundary).
SimulationResult monte_carlo_test(const CountTable& table, const SimulationOptions& options = {});

// Reads the worksheet arguments; an absent one keeps its default. trials: whole, from 100 to
// 10,000,000; seed: whole, from 0 to 2^32 − 1; statistic: "pearson" or "g" (any case).
SimulationOptions simulation_options(std::optional<double> trials = std::nullopt,
                                     std::optional<double> seed = std::nullopt,
                                     const std::optional<std::string>& statistic = std::nullopt);

}  // namespace assoc
