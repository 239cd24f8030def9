// The remembered computations give exactly what a fresh computation gives (the expected values
// here are the core functions' own answers: an exact identity), and any change of the input —
// one count, one option, one limit — is computed afresh rather than answered from the cache.
#include <gtest/gtest.h>

#include <algorithm>
#include <string>

#include "assoc/error.hpp"
#include "assoc/exact_test.hpp"
#include "assoc/monte_carlo.hpp"
#include "assoc/report.hpp"
#include "remembered.hpp"
#include "test_support.hpp"

namespace assoc::calc {
namespace {

using test::table;

const ExactLimits limits{5.0, 400'000'000};

CountTable three_by_three() { return table({{3, 1, 0}, {1, 2, 3}, {0, 2, 4}}); }

std::string refusal_of(const std::function<void()>& action) {
    try {
        action();
    } catch (const Error& error) {
        return error.what();
    }
    return "(no refusal)";
}

TEST(RememberedExactTest, GivesTheFreshAnswerFirstAndFromTheCacheAfter) {
    ResultCache cache(1'000'000);
    const double fresh = exact_p_value(three_by_three(), Side::two_sided, limits);
    EXPECT_EQ(remembered_exact_p_value(cache, three_by_three(), Side::two_sided, limits), fresh);
    EXPECT_EQ(remembered_exact_p_value(cache, three_by_three(), Side::two_sided, limits), fresh);
    EXPECT_EQ(cache.statistics().misses, 1u);
    EXPECT_EQ(cache.statistics().hits, 1u);
}

TEST(RememberedExactTest, ComputesAgainWhenOneCountChanges) {
    ResultCache cache(1'000'000);
    remembered_exact_p_value(cache, three_by_three(), Side::two_sided, limits);
    const CountTable changed = table({{3, 1, 0}, {1, 2, 3}, {0, 2, 5}});
    EXPECT_EQ(remembered_exact_p_value(cache, changed, Side::two_sided, limits),
              exact_p_value(changed, Side::two_sided, limits));
    EXPECT_EQ(cache.statistics().misses, 2u);
    EXPECT_EQ(cache.statistics().hits, 0u);
}

TEST(RememberedExactTest, ComputesAgainWhenTheSideChanges) {
    ResultCache cache(1'000'000);
    const CountTable two_by_two = table({{3, 1}, {1, 3}});
    for (Side side : {Side::two_sided, Side::lower, Side::upper})
        EXPECT_EQ(remembered_exact_p_value(cache, two_by_two, side, limits), exact_p_value(two_by_two, side, limits));
    EXPECT_EQ(cache.statistics().misses, 3u);
    EXPECT_EQ(cache.statistics().hits, 0u);
}

TEST(RememberedExactTest, ComputesAgainWhenOneLimitChanges) {
    ResultCache cache(1'000'000);
    remembered_exact_p_value(cache, three_by_three(), Side::two_sided, limits);
    remembered_exact_p_value(cache, three_by_three(), Side::two_sided, ExactLimits{4.0, 400'000'000});
    remembered_exact_p_value(cache, three_by_three(), Side::two_sided, ExactLimits{5.0, 300'000'000});
    remembered_exact_p_value(cache, three_by_three(), Side::two_sided, ExactLimits{5.0, 400'000'000, false});
    EXPECT_EQ(cache.statistics().misses, 4u);
    EXPECT_EQ(cache.statistics().hits, 0u);
}

// A refusal at the limits is remembered like an answer, and said in the same words; with more
// room the same table is computed, not refused from the cache.
TEST(RememberedExactTest, RemembersARefusalWithTheFreshMessageAndComputesWithinOtherLimits) {
    ResultCache cache(1'000'000);
    const CountTable large = table({{6, 4, 8, 8, 5, 5}, {2, 15, 6, 8, 8, 4}, {0, 3, 9, 2, 4, 3}});
    const ExactLimits tight{20.0, 1'000'000};
    const std::string fresh = refusal_of([&] { exact_p_value(large, Side::two_sided, tight); });
    ASSERT_NE(fresh, "(no refusal)");
    for (int call = 0; call < 2; ++call)
        EXPECT_EQ(refusal_of([&] { remembered_exact_p_value(cache, large, Side::two_sided, tight); }), fresh);
    EXPECT_EQ(cache.statistics().hits, 1u);
    EXPECT_EQ(remembered_exact_p_value(cache, large, Side::two_sided, limits),
              exact_p_value(large, Side::two_sided, limits));
}

// The answer depends on the counts only, so tables with other labels but the same counts share it.
TEST(RememberedExactTest, SharesTheAnswerOfTablesWithTheSameCountsAndOtherLabels) {
    ResultCache cache(1'000'000);
    const CountTable labelled = table({{"", "a", "b", "c"}, {"x", 3, 1, 0}, {"y", 1, 2, 3}, {"z", 0, 2, 4}});
    EXPECT_EQ(remembered_exact_p_value(cache, labelled, Side::two_sided, limits),
              remembered_exact_p_value(cache, three_by_three(), Side::two_sided, limits));
    EXPECT_EQ(cache.statistics().hits, 1u);
}

// ASSOC.REPORT's exact line goes through the cache (ReportOptions::exact_test): the report is the
// same line for line, its exact p-value or its refusal included, and the second report is answered
// from the cache.
// Returns the exact line.
Cell expect_same_report_with_the_remembered_exact_line(const CountTable& counts, const ExactLimits& report_limits) {
    ReportOptions fresh_options;
    fresh_options.exact_limits = report_limits;
    const std::vector<ReportLine> fresh = association_report(counts, fresh_options);
    ReportOptions remembered_options = fresh_options;
    remembered_options.exact_test = shared_exact_p_value;
    const auto hits_before = shared_result_cache().statistics().hits;
    for (int call = 0; call < 2; ++call) {
        const std::vector<ReportLine> remembered = association_report(counts, remembered_options);
        EXPECT_EQ(remembered.size(), fresh.size());
        for (std::size_t i = 0; i < std::min(fresh.size(), remembered.size()); ++i) {
            EXPECT_EQ(remembered[i].label, fresh[i].label);
            EXPECT_EQ(remembered[i].value, fresh[i].value) << fresh[i].label;
        }
    }
    EXPECT_EQ(shared_result_cache().statistics().hits, hits_before + 1);
    for (const ReportLine& line : fresh)
        if (line.label == "p-value, exact test") return line.value;
    ADD_FAILURE() << "the report has no exact line";
    return Cell();
}

TEST(RememberedReport, IsTheFreshReportWhenTheExactTestFinishes) {
    const Cell exact = expect_same_report_with_the_remembered_exact_line(three_by_three(), default_report_exact_limits);
    EXPECT_TRUE(exact.is_number());
}

TEST(RememberedReport, IsTheFreshReportWhenTheExactTestIsRefused) {
    // The memory limit refuses this table the same way every time (a time limit could not).
    const Cell exact = expect_same_report_with_the_remembered_exact_line(
        table({{6, 4, 8, 8, 5, 5}, {2, 15, 6, 8, 8, 4}, {0, 3, 9, 2, 4, 3}}), ExactLimits{20.0, 1'000'000});
    ASSERT_TRUE(exact.is_text());
    EXPECT_EQ(exact.as_text().rfind("Not computed: ", 0), 0u) << exact.as_text();
}

SimulationOptions options(std::uint64_t trials, std::uint64_t seed, Method statistic) {
    SimulationOptions o;
    o.trials = trials;
    o.seed = seed;
    o.statistic = statistic;
    return o;
}

void expect_same(const SimulationResult& a, const SimulationResult& b) {
    EXPECT_EQ(a.p_value, b.p_value);
    EXPECT_EQ(a.standard_error, b.standard_error);
    EXPECT_EQ(a.trials, b.trials);
    EXPECT_EQ(a.at_least_as_large, b.at_least_as_large);
    EXPECT_EQ(a.statistic, b.statistic);
    EXPECT_EQ(a.method, b.method);
}

TEST(RememberedSimulation, GivesTheFreshAnswerFirstAndFromTheCacheAfter) {
    ResultCache cache(1'000'000);
    const SimulationOptions o = options(2000, 7, Method::pearson);
    const SimulationResult fresh = monte_carlo_test(three_by_three(), o);
    expect_same(remembered_monte_carlo_test(cache, three_by_three(), o), fresh);
    expect_same(remembered_monte_carlo_test(cache, three_by_three(), o), fresh);
    EXPECT_EQ(cache.statistics().hits, 1u);
}

TEST(RememberedSimulation, ComputesAgainWhenTheSeedTheTrialsTheStatisticOrOneCountChange) {
    ResultCache cache(1'000'000);
    remembered_monte_carlo_test(cache, three_by_three(), options(2000, 7, Method::pearson));
    const CountTable changed = table({{3, 1, 0}, {1, 2, 3}, {0, 3, 4}});
    const std::pair<CountTable, SimulationOptions> variants[] = {
        {three_by_three(), options(2000, 8, Method::pearson)},
        {three_by_three(), options(2001, 7, Method::pearson)},
        {three_by_three(), options(2000, 7, Method::likelihood_ratio)},
        {changed, options(2000, 7, Method::pearson)},
    };
    for (const auto& [counts, o] : variants) expect_same(remembered_monte_carlo_test(cache, counts, o), monte_carlo_test(counts, o));
    EXPECT_EQ(cache.statistics().misses, 5u);
    EXPECT_EQ(cache.statistics().hits, 0u);
}

TEST(RememberedSimulation, ComputesAgainWhenTheOrderOfTablesChanges) {
    ResultCache cache(1'000'000);
    SimulationOptions o = options(2000, 7, Method::pearson);
    remembered_monte_carlo_test(cache, three_by_three(), o);
    o.order = SimulationOrder::probability;  // ASSOC.SIMULATE with "exact"
    expect_same(remembered_monte_carlo_test(cache, three_by_three(), o), monte_carlo_test(three_by_three(), o));
    EXPECT_EQ(cache.statistics().misses, 2u);
}

TEST(RememberedSimulation, ComputesAgainWhenTheWorkCapOrTheTimeCapChanges) {
    ResultCache cache(1'000'000);
    SimulationOptions o = options(2000, 7, Method::pearson);
    remembered_monte_carlo_test(cache, three_by_three(), o);
    o.limits.max_work = 1e8;
    remembered_monte_carlo_test(cache, three_by_three(), o);
    o.limits.max_seconds = 4.0;
    remembered_monte_carlo_test(cache, three_by_three(), o);
    EXPECT_EQ(cache.statistics().misses, 3u);
    EXPECT_EQ(cache.statistics().hits, 0u);
}

}  // namespace
}  // namespace assoc::calc
