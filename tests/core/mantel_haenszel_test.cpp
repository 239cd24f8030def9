// The Mantel–Haenszel test across strata, checked on the Berkeley admissions data of Bickel, Hammel &
// O'Connell (1975), Science 187:398–403 (counts as in R's UCBAdmissions, whose help page cites them).
// No published MH figures were read; the expected values come from two independent libraries:
// statsmodels 0.13.5 StratifiedTable and R 4.2.2 mantelhaen.test (tests/reference/workflow_generate.*).
#include <gtest/gtest.h>

#include "assoc/mantel_haenszel.hpp"
#include "published_tables.hpp"
#include "test_support.hpp"
#include "workflow_r_values.hpp"
#include "workflow_statsmodels_values.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;
namespace sm = assoc::reference::statsmodels_values;
namespace r = assoc::reference::r_values;

using assoc::test::published::admissions;
using assoc::test::published::admissions_stacked;

TEST(MantelHaenszel, MatchesTheCorrectedStatisticOfStatsmodelsAndR) {
    const MantelHaenszelResult result = mantel_haenszel_test(admissions());
    EXPECT_NEAR_REL(result.statistic, sm::ucb_mh_statistic_corrected, 1e-10);
    EXPECT_NEAR_REL(result.statistic, r::ucb_mh_statistic_corrected, 1e-10);
    EXPECT_NEAR_REL(result.p_value, r::ucb_mh_p_corrected, 1e-10);
    EXPECT_NEAR_REL(result.p_value, sm::ucb_mh_p_corrected, 1e-10);
}

TEST(MantelHaenszel, MatchesTheUncorrectedStatisticWhenAsked) {
    const MantelHaenszelResult result = mantel_haenszel_test(admissions(), Continuity::uncorrected);
    EXPECT_NEAR_REL(result.statistic, sm::ucb_mh_statistic_uncorrected, 1e-10);
    EXPECT_NEAR_REL(result.statistic, r::ucb_mh_statistic_uncorrected, 1e-10);
    EXPECT_NEAR_REL(result.p_value, r::ucb_mh_p_uncorrected, 1e-10);
}

TEST(MantelHaenszel, EstimatesTheCommonOddsRatio) {
    const MantelHaenszelResult result = mantel_haenszel_test(admissions());
    EXPECT_NEAR_REL(result.common_odds_ratio, sm::ucb_mh_odds_ratio, 1e-12);
    EXPECT_NEAR_REL(result.common_odds_ratio, r::ucb_mh_odds_ratio, 1e-12);
}

TEST(MantelHaenszel, GivesTheRobinsBreslowGreenlandInterval) {
    const MantelHaenszelResult result = mantel_haenszel_test(admissions());
    EXPECT_NEAR_REL(result.lower, sm::ucb_mh_lower_95, 1e-10);
    EXPECT_NEAR_REL(result.upper, sm::ucb_mh_upper_95, 1e-10);
    EXPECT_NEAR_REL(result.lower, r::ucb_mh_lower_95, 1e-10);
    EXPECT_NEAR_REL(result.upper, r::ucb_mh_upper_95, 1e-10);
}

TEST(MantelHaenszel, GivesAnIntervalAtAnotherConfidenceLevel) {
    const MantelHaenszelResult result = mantel_haenszel_test(admissions(), Continuity::corrected, 0.90);
    EXPECT_NEAR_REL(result.lower, r::ucb_mh_lower_90, 1e-10);
    EXPECT_NEAR_REL(result.upper, r::ucb_mh_upper_90, 1e-10);
}

TEST(MantelHaenszel, GivesTheSameResultForStackedTables) {
    const MantelHaenszelResult rows = mantel_haenszel_test(admissions());
    const MantelHaenszelResult stacked = mantel_haenszel_test(admissions_stacked());
    EXPECT_DOUBLE_EQ(stacked.statistic, rows.statistic);
    EXPECT_DOUBLE_EQ(stacked.common_odds_ratio, rows.common_odds_ratio);
    EXPECT_DOUBLE_EQ(stacked.upper, rows.upper);
}

// Exact identity: a stratum with an empty row adds 0 to every Mantel–Haenszel sum.
TEST(MantelHaenszel, LeavesOutAStratumWithAnEmptyRowAndSaysSo) {
    const MantelHaenszelResult with_empty =
        mantel_haenszel_test(grid({{"", "a", "b", "c", "d"}, {"North", 10, 20, 15, 5}, {"Depot", 0, 0, 4, 3},
                                   {"South", 8, 9, 7, 12}}));
    const MantelHaenszelResult without =
        mantel_haenszel_test(grid({{10, 20, 15, 5}, {8, 9, 7, 12}}));
    EXPECT_DOUBLE_EQ(with_empty.statistic, without.statistic);
    EXPECT_DOUBLE_EQ(with_empty.lower, without.lower);
    EXPECT_EQ(with_empty.strata_used, 2u);
    EXPECT_EQ(with_empty.remarks,
              (std::vector<std::string>{"The stratum 2 (Depot) has an empty row or column and adds nothing to the test."}));
}

// Exact identity: the correction is capped at the difference, so a difference below ½ gives 0
// (R's mantelhaen.test leaves such a difference uncorrected instead).
TEST(MantelHaenszel, NeverLetsTheCorrectionExceedTheDifference) {
    // Σa − ΣE(a) = (1 − 9/7) + (2 − 2) = −2/7.
    const MantelHaenszelResult corrected = mantel_haenszel_test(grid({{1, 2, 2, 2}, {2, 2, 2, 2}}));
    EXPECT_EQ(corrected.statistic, 0.0);
    EXPECT_EQ(corrected.p_value, 1.0);
    const MantelHaenszelResult uncorrected =
        mantel_haenszel_test(grid({{1, 2, 2, 2}, {2, 2, 2, 2}}), Continuity::uncorrected);
    EXPECT_GT(uncorrected.statistic, 0.0);
}

TEST(MantelHaenszel, ReadsTheCorrectionWordInAnyCase) {
    EXPECT_EQ(parse_continuity(""), Continuity::corrected);
    EXPECT_EQ(parse_continuity("Uncorrected"), Continuity::uncorrected);
    expect_error([] { parse_continuity("yates"); },
                 "the correction must be \"corrected\" or \"uncorrected\", not \"yates\"");
}

TEST(MantelHaenszel, RejectsStrataWithNoInformation) {
    expect_error([] { mantel_haenszel_test(grid({{0, 0, 3, 4}, {5, 0, 7, 0}})); },
                 "no stratum has counts in both rows and both columns, so there is nothing to test");
}

TEST(MantelHaenszel, RejectsAnInfiniteCommonOddsRatio) {
    expect_error([] { mantel_haenszel_test(grid({{3, 0, 2, 4}, {5, 2, 0, 6}})); },
                 "the common odds ratio cannot be estimated: every stratum has a 0 in cell b or cell c, so it would "
                 "be infinite");
}

TEST(MantelHaenszel, RejectsAConfidenceLevelOutsideZeroToOne) {
    expect_error([] { mantel_haenszel_test(admissions(), Continuity::corrected, 95); },
                 "the confidence level must lie between 0 and 1, not 95");
}
