// The Breslow–Day test of equal odds ratios (Tarone's correction), on the Berkeley admissions of Bickel,
// Hammel & O'Connell (1975), Science 187:398–403 (counts as in R's UCBAdmissions). Expected values:
// statsmodels 0.13.5 StratifiedTable.test_equal_odds, and an R 4.2.2 script written from the formula
// with polyroot (tests/reference/workflow_generate.*); no published figures were read.
#include <gtest/gtest.h>

#include "assoc/breslow_day.hpp"
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

TEST(BreslowDay, MatchesTheTaroneCorrectedStatistic) {
    const HomogeneityResult result = breslow_day_test(admissions());
    EXPECT_NEAR_REL(result.statistic, sm::ucb_breslow_day_tarone_statistic, 1e-10);
    EXPECT_NEAR_REL(result.statistic, r::ucb_breslow_day_tarone_statistic, 1e-10);
    EXPECT_NEAR_REL(result.p_value, r::ucb_breslow_day_tarone_p, 1e-9);
    EXPECT_NEAR_REL(result.p_value, sm::ucb_breslow_day_tarone_p, 1e-9);
}

TEST(BreslowDay, HasOneDegreeOfFreedomFewerThanStrata) {
    EXPECT_EQ(breslow_day_test(admissions()).df, 5.0);
}

TEST(BreslowDay, ReportsTheStatisticWithoutTaronesCorrectionToo) {
    const HomogeneityResult result = breslow_day_test(admissions());
    EXPECT_NEAR_REL(result.uncorrected_statistic, sm::ucb_breslow_day_statistic, 1e-10);
    EXPECT_NEAR_REL(result.uncorrected_statistic, r::ucb_breslow_day_statistic, 1e-10);
}

// Exact identity: strata with the same odds ratio and the same margins pattern fit it exactly.
TEST(BreslowDay, IsZeroWhenEveryStratumHasTheSameOddsRatio) {
    // Odds ratios 2·6/(3·2) = 2 and 4·9/(6·3) = 2.
    const HomogeneityResult result = breslow_day_test(grid({{2, 3, 2, 6}, {4, 6, 3, 9}}));
    EXPECT_NEAR(result.statistic, 0.0, 1e-12);
    EXPECT_NEAR(result.p_value, 1.0, 1e-10);
}

TEST(BreslowDay, LeavesOutAStratumWithAnEmptyColumnFromTheDegreesOfFreedom) {
    const HomogeneityResult result = breslow_day_test(grid({{10, 20, 15, 5}, {0, 6, 0, 3}, {8, 9, 7, 12}}));
    EXPECT_EQ(result.strata_used, 2u);
    EXPECT_EQ(result.df, 1.0);
    EXPECT_EQ(result.remarks.size(), 1u);
}

TEST(BreslowDay, RejectsFewerThanTwoInformativeStrata) {
    expect_error([] { breslow_day_test(grid({{10, 20, 15, 5}, {0, 6, 0, 3}})); },
                 "the test of equal odds ratios needs at least 2 strata with counts in both rows and both columns");
}

TEST(BreslowDay, RejectsAnOddsRatioOfZero) {
    expect_error([] { breslow_day_test(grid({{0, 3, 2, 4}, {5, 2, 1, 0}})); },
                 "the common odds ratio cannot be estimated: every stratum has a 0 in cell a or cell d, so it would "
                 "be 0");
}
