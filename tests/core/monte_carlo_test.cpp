// The simulated (Monte Carlo) p-value over random tables with the observed margins.
#include <gtest/gtest.h>

#include <cmath>

#include "assoc/monte_carlo.hpp"
#include "assoc/statistics.hpp"
#include "small_sample_values.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::table;
namespace ref = assoc::reference;

// Exact p-values: P(statistic ≥ observed | both margins), by enumerating every table with the
// margins in small_sample_generate.py (exact fractions; the enumeration reproduces R 4.2.2
// fisher.test). A simulated p must lie within 4 standard errors √(p(1 − p)/B) of it.

namespace {
SimulationOptions with(std::uint64_t trials, std::uint64_t seed, Method statistic = Method::pearson) {
    SimulationOptions options;
    options.trials = trials;
    options.seed = seed;
    options.statistic = statistic;
    return options;
}

void expect_close_to_exact(const CountTable& t, double exact_p, Method statistic = Method::pearson) {
    const std::uint64_t trials = 100'000;
    const SimulationResult result = monte_carlo_test(t, with(trials, 20240, statistic));
    const double standard_error = std::sqrt(exact_p * (1 - exact_p) / static_cast<double>(trials));
    EXPECT_NEAR(result.p_value, exact_p, 4 * standard_error);
}

// Invented tables: promotions, shift patterns and training uptake at a fictional firm.
CountTable three_by_three() { return table({{3, 0, 1}, {1, 4, 0}, {0, 2, 5}}); }
CountTable three_by_four() { return table({{2, 0, 3, 1}, {1, 4, 0, 2}, {0, 1, 2, 5}}); }
}  // namespace

TEST(MonteCarloTest, AgreesWithTheExactPValueOfTheTeaTastingTable) {
    // Fisher (1935) via published_values.md section 2: tables with X² ≥ 2 have probability 34/70.
    expect_close_to_exact(table({{3, 1}, {1, 3}}), 34.0 / 70.0);
}

TEST(MonteCarloTest, AgreesWithTheExactPValueOfATwoByThreeTable) {
    expect_close_to_exact(table({{5, 3, 2}, {4, 6, 1}}), ref::exact_two_by_three_pearson_p);
}

TEST(MonteCarloTest, AgreesWithTheExactPValueOfASparseThreeByThreeTable) {
    expect_close_to_exact(three_by_three(), ref::exact_three_by_three_pearson_p);
}

TEST(MonteCarloTest, AgreesWithTheExactPValueOfAThreeByFourTable) {
    expect_close_to_exact(three_by_four(), ref::exact_three_by_four_pearson_p);
}

TEST(MonteCarloTest, AgreesWithTheExactPValueOfAThreeByTwoTable) {
    expect_close_to_exact(table({{6, 1}, {2, 7}, {1, 5}}), ref::exact_three_by_two_pearson_p);
}

TEST(MonteCarloTest, AgreesWithTheExactPValueOfALargerTwoByTwoTable) {
    // n = 2,000: the hypergeometric search runs over many values (exact p also from scipy hypergeom).
    expect_close_to_exact(table({{222, 278}, {578, 922}}), ref::exact_large_two_by_two_pearson_p);
}

TEST(MonteCarloTest, AgreesWithTheExactPValueOfALargerTwoByThreeTable) {
    expect_close_to_exact(table({{41, 75, 84}, {109, 125, 166}}), ref::exact_large_two_by_three_pearson_p);
}

TEST(MonteCarloTest, AgreesWithTheExactPValueOfGSquared) {
    expect_close_to_exact(three_by_four(), ref::exact_three_by_four_g_p, Method::likelihood_ratio);
    expect_close_to_exact(table({{6, 1}, {2, 7}, {1, 5}}), ref::exact_three_by_two_g_p, Method::likelihood_ratio);
}

TEST(MonteCarloTest, GivesTheSamePValueForTheSameSeed) {
    const SimulationResult first = monte_carlo_test(three_by_four(), with(20'000, 7));
    const SimulationResult second = monte_carlo_test(three_by_four(), with(20'000, 7));
    EXPECT_EQ(first.p_value, second.p_value);
    EXPECT_EQ(first.at_least_as_large, second.at_least_as_large);
}

TEST(MonteCarloTest, GivesADifferentPValueForADifferentSeed) {
    const SimulationResult first = monte_carlo_test(three_by_four(), with(20'000, 7));
    const SimulationResult second = monte_carlo_test(three_by_four(), with(20'000, 8));
    EXPECT_NE(first.at_least_as_large, second.at_least_as_large);
}

TEST(MonteCarloTest, GivesTheSameCountOnEveryMachineForAFixedSeed) {
    // Regression value from this implementation (std::mt19937_64, whose output the C++ standard
    // fixes, and no std:: distributions): a change here means results differ between versions.
    const SimulationResult result = monte_carlo_test(three_by_four(), with(10'000, 12345));
    EXPECT_EQ(result.at_least_as_large, 278u) << "update only for an intended change of the sampler";
}

TEST(MonteCarloTest, NeverGivesAPValueOfZero) {
    // [[20, 0], [0, 20]]: the exact p is 2 / C(40, 20) ≈ 1.5e-11, so no simulated table reaches X².
    const SimulationResult result = monte_carlo_test(table({{20, 0}, {0, 20}}), with(1'000, 1));
    EXPECT_EQ(result.at_least_as_large, 0u);
    EXPECT_DOUBLE_EQ(result.p_value, 1.0 / 1'001.0);
}

TEST(MonteCarloTest, CountsTiesWithTheObservedStatistic) {
    // A table exactly at independence: every simulated X² ties or exceeds 0, so p = 1.
    const SimulationResult result = monte_carlo_test(table({{10, 20}, {5, 10}}), with(1'000, 3));
    EXPECT_EQ(result.at_least_as_large, 1'000u);
    EXPECT_EQ(result.p_value, 1.0);
}

TEST(MonteCarloTest, ReportsTheObservedStatisticAndTheStandardError) {
    const SimulationResult result = monte_carlo_test(three_by_four(), with(10'000, 5));
    EXPECT_NEAR_REL(result.statistic, ref::exact_three_by_four_statistic, 1e-13);
    EXPECT_EQ(result.trials, 10'000u);
    EXPECT_DOUBLE_EQ(result.p_value, (1.0 + static_cast<double>(result.at_least_as_large)) / 10'001.0);
    EXPECT_DOUBLE_EQ(result.standard_error, std::sqrt(result.p_value * (1 - result.p_value) / 10'000.0));
}

TEST(MonteCarloTest, ReportsGSquaredWhenAskedForIt) {
    const SimulationResult result = monte_carlo_test(three_by_four(), with(1'000, 5, Method::likelihood_ratio));
    EXPECT_NEAR_REL(result.statistic, likelihood_ratio_statistic(three_by_four()), 1e-15);
    EXPECT_EQ(result.method, Method::likelihood_ratio);
}

TEST(MonteCarloTest, IgnoresEmptyRowsAndColumns) {
    const SimulationResult plain = monte_carlo_test(three_by_three(), with(5'000, 9));
    const SimulationResult padded =
        monte_carlo_test(table({{3, 0, 0, 1}, {0, 0, 0, 0}, {1, 0, 4, 0}, {0, 0, 2, 5}}), with(5'000, 9));
    EXPECT_EQ(plain.at_least_as_large, padded.at_least_as_large);
}

TEST(MonteCarloTest, UsesOneHundredThousandTrialsByDefault) {
    EXPECT_EQ(SimulationOptions().trials, 100'000u);
    EXPECT_EQ(monte_carlo_test(table({{3, 1}, {1, 3}})).trials, 100'000u);
}

TEST(MonteCarloTest, RejectsCountsThatAreNotWhole) {
    expect_error([] { monte_carlo_test(table({{2.5, 1}, {1, 3}})); },
                 "the simulated p-value needs whole counts; some counts in this table have decimals (weighted data)");
}

TEST(MonteCarloTest, RejectsTheYatesStatistic) {
    expect_error([] { monte_carlo_test(table({{3, 1}, {1, 3}}), with(1'000, 1, Method::yates)); },
                 "the simulated p-value uses Pearson's X² or G²; the Yates correction is for the chi-squared "
                 "approximation and has no place in a simulation");
}

TEST(MonteCarloTest, RejectsMoreTrialsThanTheCap) {
    expect_error([] { monte_carlo_test(table({{3, 1}, {1, 3}}), with(10'000'001, 1)); },
                 "the number of trials must be from 100 to 10,000,000, not 10,000,001");
}

TEST(MonteCarloTest, RejectsWorkBeyondTheCapWithAnEstimateOfWhatFits) {
    SimulationOptions options = with(100'000, 1);
    options.limits.max_work = 1e6;
    expect_error([&] { monte_carlo_test(three_by_four(), options); },
                 "simulating 100,000 tables of 21 counts would take too long; use fewer trials (at most about 6,626)");
}

TEST(MonteCarloTest, RejectsATableTooLargeToSimulateAtAll) {
    SimulationOptions options = with(100, 1);
    options.limits.max_work = 1e4;
    expect_error([&] { monte_carlo_test(three_by_four(), options); },
                 "this table is too large to simulate in reasonable time (3 rows, 4 columns, 21 counts); combine "
                 "sparse categories, or use the chi-squared p-value if the validity check allows");
}

// The clock is the cap on any machine: with no time at all the run stops after its first table.
TEST(MonteCarloTest, StopsAtItsTimeLimitAndSaysHowFarItGot) {
    SimulationOptions options = with(100'000, 1);
    options.limits.max_seconds = 0;
    expect_error([&] { monte_carlo_test(three_by_four(), options); },
                 "the simulation was stopped at its time limit of 0 seconds after 1 of 100,000 tables; use fewer trials");
}

TEST(MonteCarloTest, RejectsAHugeTable) {
    expect_error([] { monte_carlo_test(table({{1e9, 1}, {1, 3}})); },
                 "the simulated p-value takes tables of up to 1,000,000,000 counts, and this one has 1,000,000,005; "
                 "with so many counts the chi-squared p-value is reliable");
}

TEST(SimulationOptions, ReadsTheWorksheetArguments) {
    const SimulationOptions options = simulation_options(5000.0, 42.0, std::string(" G "));
    EXPECT_EQ(options.trials, 5000u);
    EXPECT_EQ(options.seed, 42u);
    EXPECT_EQ(options.statistic, Method::likelihood_ratio);
}

TEST(SimulationOptions, KeepsTheDefaultsForAbsentArguments) {
    const SimulationOptions options = simulation_options();
    EXPECT_EQ(options.trials, default_simulation_trials);
    EXPECT_EQ(options.seed, default_simulation_seed);
    EXPECT_EQ(options.statistic, Method::pearson);
}

TEST(SimulationOptions, RejectsAFractionalNumberOfTrials) {
    expect_error([] { simulation_options(1000.5); }, "the number of trials must be a whole number, not 1000.5");
}

TEST(SimulationOptions, RejectsTooFewTrials) {
    expect_error([] { simulation_options(10.0); }, "the number of trials must be from 100 to 10,000,000, not 10");
}

TEST(SimulationOptions, RejectsANegativeSeed) {
    expect_error([] { simulation_options(std::nullopt, -1.0); },
                 "the seed must be from 0 to 4,294,967,295, not -1");
}

TEST(SimulationOptions, RejectsAnUnknownStatistic) {
    expect_error([] { simulation_options(std::nullopt, std::nullopt, std::string("yates")); },
                 "the statistic must be \"pearson\" or \"g\", not \"yates\"");
}

// --- Ordered by probability ("exact"): estimates the exact test's p-value -------------------------
// Expected values: the Fisher (probability-ordering) p-values of small_sample_generate.py's complete
// enumeration, which equal R 4.2.2 fisher.test; a simulated p must lie within 4 standard errors.

namespace {
SimulationOptions by_probability(std::uint64_t trials, std::uint64_t seed) {
    SimulationOptions options = with(trials, seed);
    options.order = SimulationOrder::probability;
    return options;
}

void expect_close_to_fisher(const CountTable& t, double exact_p) {
    const std::uint64_t trials = 100'000;
    const SimulationResult result = monte_carlo_test(t, by_probability(trials, 20240));
    EXPECT_NEAR(result.p_value, exact_p, 4 * std::sqrt(exact_p * (1 - exact_p) / static_cast<double>(trials)));
}
}  // namespace

TEST(MonteCarloTest, ByProbabilityAgreesWithTheExactTestOfTheTeaTastingTable) {
    expect_close_to_fisher(table({{3, 1}, {1, 3}}), 34.0 / 70.0);  // published_values.md section 2
}

TEST(MonteCarloTest, ByProbabilityAgreesWithTheExactTestOfAThreeByFourTable) {
    // The table on which ordering by X² estimates a different p-value (0.030 rather than 0.036).
    expect_close_to_fisher(three_by_four(), ref::exact_three_by_four_fisher_p);
}

TEST(MonteCarloTest, ByProbabilityAgreesWithTheExactTestOfASparseThreeByThreeTable) {
    expect_close_to_fisher(three_by_three(), ref::exact_three_by_three_fisher_p);
}

// Exact identity: the observed table is always at least as extreme as itself, so with B trials the
// p-value is at least 1/(B + 1); a table of the largest probability gives p = 1 in every trial
// that draws a table of no greater probability, which for [[2, 2], [2, 2]] is every table.
TEST(MonteCarloTest, ByProbabilityCountsEveryTableForTheMostProbableTable) {
    const SimulationResult result = monte_carlo_test(table({{2, 2}, {2, 2}}), by_probability(1000, 3));
    EXPECT_EQ(result.at_least_as_large, 1000u);
    EXPECT_EQ(result.p_value, 1.0);
}

TEST(MonteCarloTest, ByProbabilityReportsTheObservedTablesProbability) {
    // Fisher (1935): the tea table [[3, 1], [1, 3]] has probability 16/70 given its margins.
    const SimulationResult result = monte_carlo_test(table({{3, 1}, {1, 3}}), by_probability(100, 1));
    EXPECT_NEAR_REL(result.statistic, 16.0 / 70.0, 1e-12);
}
