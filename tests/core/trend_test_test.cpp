// The Cochran–Armitage trend test. Agresti (2007), An Introduction to Categorical Data Analysis, 2nd ed.:
// infant malformation by maternal alcohol consumption (table number and data from memory, see
// tests/reference/published_values.md section 4). Expected values: R 4.2.2 prop.trend.test, and the same
// formula in numpy 1.24.2 / scipy 1.10.1 (tests/reference/workflow_generate.*).
#include <gtest/gtest.h>

#include <cmath>
#include <limits>

#include "assoc/trend_test.hpp"
#include "published_tables.hpp"
#include "test_support.hpp"
#include "workflow_r_values.hpp"
#include "workflow_statsmodels_values.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;
namespace sm = assoc::reference::statsmodels_values;
namespace r = assoc::reference::r_values;

using assoc::test::published::alcohol;
using assoc::test::published::alcohol_scores;

namespace {
// Invented: staff promoted / not promoted (columns) by training sessions attended (rows, 0–3).
CellGrid training() { return grid({{4, 36}, {7, 33}, {11, 29}, {15, 25}}); }
}  // namespace

TEST(TrendTest, MatchesPropTrendTestOnTheAlcoholTable) {
    const TrendResult result = trend_test(alcohol(), alcohol_scores());
    EXPECT_NEAR_REL(result.z, r::alcohol_trend_z, 1e-10);
    EXPECT_NEAR_REL(result.z, sm::alcohol_trend_z, 1e-10);
    EXPECT_NEAR_REL(result.p_value, r::alcohol_trend_p, 1e-10);
    // published_values.md section 4: R prop.trend.test's chi-squared 6.57013394470554.
    EXPECT_NEAR_REL(result.statistic, 6.57013394470554, 1e-12);
}

// Exact identity: Mantel's M² = (N − 1) r² is the N-variance statistic times (N − 1)/N.
TEST(TrendTest, UsesTheVarianceWithNRatherThanNMinusOne) {
    const TrendResult result = trend_test(alcohol(), alcohol_scores());
    const double n = 32574;
    EXPECT_NEAR_REL(result.statistic * (n - 1) / n, 6.569932246, 1e-9);  // M², published_values.md section 4
}

TEST(TrendTest, UsesScoresOneToKByDefaultForCategoriesInRows) {
    const TrendResult result = trend_test(training());
    EXPECT_FALSE(result.categories_in_columns);
    EXPECT_EQ(result.categories, 4u);
    EXPECT_NEAR_REL(result.z, r::training_trend_z, 1e-10);
    EXPECT_NEAR_REL(result.p_value, r::training_trend_p, 1e-10);
    EXPECT_NEAR_REL(result.p_value, sm::training_trend_p, 1e-10);
}

TEST(TrendTest, GivesANegativeZWhenTheShareFalls) {
    const TrendResult rising = trend_test(training());
    const TrendResult falling = trend_test(training(), grid({{4, 3, 2, 1}}));
    EXPECT_NEAR_REL(falling.z, -rising.z, 1e-12);
    EXPECT_NEAR_REL(falling.p_value, rising.p_value, 1e-12);
}

// Exact identity: scores enter only through their spacing, so s and a + b·s (b > 0) give the same z.
TEST(TrendTest, IsUnchangedByShiftingAndStretchingTheScores) {
    const TrendResult plain = trend_test(alcohol(), alcohol_scores());
    const TrendResult moved = trend_test(alcohol(), grid({{10, 11, 13, 18, 24}}));
    EXPECT_NEAR_REL(moved.z, plain.z, 1e-12);
}

// Exact identity: z grows with the square root of the counts, so the table times 2^10 (exact) has
// z times 2^5. With 5.1e301 beside single digits the root's factors are about 1, 1e-300 and 1e-300,
// whose product underflowed (z was infinite; found by the trend fuzz target).
TEST(TrendTest, KeepsZFiniteWithACountNear1e301BesideSingleDigits) {
    const TrendResult huge = trend_test(grid({{5.1e301, 0, 0}, {8, 9, 4}}), grid({{0, 1, 1}}));
    const TrendResult larger = trend_test(grid({{5.1e301 * 1024, 0, 0}, {8 * 1024, 9 * 1024, 4 * 1024}}), grid({{0, 1, 1}}));
    ASSERT_TRUE(std::isfinite(huge.z));
    EXPECT_NEAR_REL(huge.z * 32, larger.z, 1e-12);
}

// Exact identity: on two categories z is (x₁y₂ − x₂y₁)√N / √(X Y n₁ n₂) whatever the two (different)
// scores, up to their order. Expected value: mpmath 1.3.0 at 50 digits, -272165526975908.67758. With
// 1e30 beside single digits the sums the statistic was formed from agreed to 30 digits, and z moved
// by 2e-4 with the scores; (1, 2) was even refused as equal scores (found by the trend fuzz target).
TEST(TrendTest, KeepsZIndependentOfTheScoresBesideACountNear1e30) {
    const CellGrid table = grid({{4, 1e30}, {2, 7}});
    const double expected = -272165526975908.67758;
    EXPECT_NEAR_REL(trend_test(table, grid({{2, 2841e-300}})).z, expected, 1e-14);
    EXPECT_NEAR_REL(trend_test(table, grid({{5, 1}})).z, expected, 1e-14);
    EXPECT_NEAR_REL(trend_test(table, grid({{2, 1}})).z, expected, 1e-14);
    EXPECT_NEAR_REL(trend_test(table).z, -expected, 1e-14);
}

// Exact identity: a table with each outcome in its own category has z² = N (r = ±1); with N the
// largest double, z² once rounded past it to infinity (found by the trend fuzz target).
TEST(TrendTest, KeepsTheStatisticFiniteWhenItEqualsATotalNearTheLargestDouble) {
    const double largest = std::numeric_limits<double>::max();
    const TrendResult result = trend_test(grid({{largest, 0}, {0, 4}}));
    ASSERT_TRUE(std::isfinite(result.statistic));
    EXPECT_NEAR_REL(std::fabs(result.z), std::sqrt(largest), 1e-15);
    EXPECT_NEAR_REL(result.statistic, largest, 1e-15);
    EXPECT_EQ(result.p_value, 0.0);
}

TEST(TrendTest, ReadsATwoByTwoTheSameWayRoundEitherWay) {
    const TrendResult across = trend_test(grid({{12, 30}, {20, 18}}));
    const TrendResult down = trend_test(grid({{12, 20}, {30, 18}}));
    EXPECT_NEAR_REL(across.z, down.z, 1e-14);
}

TEST(TrendTest, RejectsATableWithoutTwoRowsOrTwoColumns) {
    expect_error([] { trend_test(grid({{1, 2, 3}, {4, 5, 6}, {7, 8, 9}})); },
                 "the trend test needs a table with 2 rows (outcomes) and a column per ordered category, or 2 columns "
                 "and a row per category; this one has 3 rows and 3 columns of counts");
}

TEST(TrendTest, RejectsScoresOfTheWrongNumber) {
    expect_error([] { trend_test(training(), grid({{1, 2, 3}})); },
                 "there are 3 scores for 4 categories; give one score per category");
}

TEST(TrendTest, RejectsATextScore) {
    expect_error([] { trend_test(training(), grid({{1, 2, "high", 4}})); },
                 "score 3 holds the text \"high\"; scores must be numbers");
}

TEST(TrendTest, RejectsEqualScores) {
    expect_error([] { trend_test(training(), grid({{2, 2, 2, 2}})); },
                 "the categories that hold counts all have the same score, so there is no order to test");
}

TEST(TrendTest, RejectsATableWithOnlyOneOutcome) {
    expect_error([] { trend_test(grid({{4, 0}, {7, 0}, {2, 0}})); },
                 "every count is in the first outcome, so there is no share that could change");
}

// Invented: promotions by length of service, the bands typed out of order. Scored 1, 2, 3, 4 in the
// table's order, the test would follow "5-10, 0-2, 2-5, 10+ years".
TEST(TrendTest, RefusesBandsWhoseNumbersNameAnotherOrderThanTheTables) {
    expect_error([] {
        trend_test(grid({{"Service", "5-10 years", "0-2 years", "2-5 years", "10+ years"},
                         {"Promoted", 12, 3, 5, 8},
                         {"Not promoted", 10, 30, 25, 20}}));
    },
                 "the columns' labels name an order (\"0-2 years\", \"2-5 years\", \"5-10 years\" and \"10+ years\") "
                 "but the table has them in another (\"5-10 years\", \"0-2 years\", \"2-5 years\" and \"10+ years\"), "
                 "and without scores the columns are scored 1, 2, 3, … in the table's order, so the test would follow "
                 "an order nobody meant; put the columns in the order of their labels, or give scores (one per "
                 "column, in the table's order)");
}

TEST(TrendTest, TakesBandsInTheirOrderOrItsReverseAndOutOfOrderWithScores) {
    const TrendResult rising = trend_test(grid({{"Age", "Under 30", "30-39", "40-49", "50+"},
                                               {"Yes", 3, 5, 8, 12},
                                               {"No", 30, 25, 20, 10}}));
    const TrendResult falling = trend_test(grid({{"Age", "50+", "40-49", "30-39", "Under 30"},
                                                {"Yes", 12, 8, 5, 3},
                                                {"No", 10, 20, 25, 30}}));
    // Exact identity: reversing the categories and their counts reverses the order, so z changes sign.
    EXPECT_DOUBLE_EQ(rising.z, -falling.z);
    const TrendResult scored = trend_test(grid({{"Age", "40-49", "Under 30", "30-39", "50+"},
                                               {"Yes", 8, 3, 5, 12},
                                               {"No", 20, 30, 25, 10}}),
                                          grid({{45, 25, 35, 55}}));
    EXPECT_GT(scored.z, 0);
}

TEST(TrendTest, ReadsYearsBeforeQuartersAndCodesAsNoOrder) {
    // "Q4 2025" comes before "Q1 2026"; "A1, B2, C1" are codes whose numbers name no order.
    EXPECT_NO_THROW(trend_test(grid({{"", "Q3 2025", "Q4 2025", "Q1 2026"}, {"Late", 4, 6, 9}, {"On time", 40, 38, 30}})));
    EXPECT_NO_THROW(trend_test(grid({{"", "A1", "B2", "C1"}, {"Late", 4, 6, 9}, {"On time", 40, 38, 30}})));
}
