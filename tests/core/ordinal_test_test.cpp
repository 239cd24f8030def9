// Mantel's linear-by-linear association test (ASSOC.ORDINAL). Expected values: statsmodels 0.13.5
// Table.test_ordinal_association and numpy 1.24.2 (tests/reference/ordered_generate.py); Agresti
// (2007), An Introduction to Categorical Data Analysis, 2nd ed., section 2.5, the alcohol table
// (M² ≈ 6.57; data and section from memory, tests/reference/published_values.md section 4); exact
// identities (rescaled scores, the 2×k relation with the Cochran–Armitage test).
#include <gtest/gtest.h>

#include "assoc/ordinal_test.hpp"
#include "assoc/trend_test.hpp"
#include "array_tables.hpp"
#include "ordered_values.hpp"
#include "published_tables.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;
namespace ref = assoc::reference::ordered_values;
using assoc::test::table_of;

namespace {

template <std::size_t N>
std::vector<double> vector_of(const double (&values)[N]) {
    return std::vector<double>(values, values + N);
}

CountTable tenure() { return table_of(ref::tenure_counts); }

}  // namespace

TEST(OrdinalTest, MatchesStatsmodelsOnTheTenureTableWithDefaultScores) {
    const OrdinalResult result = ordinal_test(tenure());
    EXPECT_NEAR_REL(result.statistic, ref::tenure_ordinal_statistic, 1e-10);
    EXPECT_NEAR_REL(result.p_value, ref::tenure_ordinal_p, 1e-10);
    EXPECT_NEAR_REL(result.correlation, ref::tenure_ordinal_r, 1e-10);
    EXPECT_EQ(result.df, 1.0);
}

TEST(OrdinalTest, FindsTheOrderedAssociationThatPearsonsTestMisses) {
    // scipy: Pearson p = 0.064 on the same table; the ordered test is far below it.
    EXPECT_GT(ref::tenure_pearson_p, 0.05);
    EXPECT_LT(ordinal_test(tenure()).p_value, 1e-5);
}

TEST(OrdinalTest, MatchesStatsmodelsWithGivenScores) {
    const OrdinalResult result =
        ordinal_test(tenure(), vector_of(ref::tenure_row_scores), vector_of(ref::tenure_column_scores));
    EXPECT_NEAR_REL(result.statistic, ref::tenure_scored_statistic, 1e-10);
    EXPECT_NEAR_REL(result.p_value, ref::tenure_scored_p, 1e-10);
    EXPECT_NEAR_REL(result.correlation, ref::tenure_scored_r, 1e-10);
}

TEST(OrdinalTest, ReproducesAgrestisLinearByLinearStatisticForTheAlcoholTable) {
    // published_values.md section 4: M² ≈ 6.57 (Agresti 2007, from memory), 6.569932246 recomputed.
    const OrdinalResult result = ordinal_test(test::published::alcohol(), CellGrid(), test::published::alcohol_scores());
    EXPECT_NEAR(result.statistic, 6.57, 0.005);
    EXPECT_NEAR_REL(result.statistic, ref::alcohol_ordinal_statistic, 1e-10);
    EXPECT_NEAR_REL(result.p_value, ref::alcohol_ordinal_p, 1e-10);
    EXPECT_NEAR_REL(result.correlation, ref::alcohol_ordinal_r, 1e-10);
}

// Exact identity: for a 2×k table with the same column scores, M² = (n − 1)/n · z² of the
// Cochran–Armitage test with the variance based on n (ASSOC.TREND), and r = −z/√n when the row
// scores rise (z follows the share of row 1, r the weight of the later row).
TEST(OrdinalTest, IsTheTrendTestTimesNMinusOneOverNForTwoRows) {
    const CellGrid alcohol = test::published::alcohol();
    const CellGrid scores = test::published::alcohol_scores();
    const OrdinalResult ordinal = ordinal_test(alcohol, CellGrid(), scores);
    const TrendResult trend = trend_test(alcohol, scores);
    const double n = 32574;
    EXPECT_NEAR_REL(ordinal.statistic, trend.statistic * (n - 1) / n, 1e-12);
    EXPECT_NEAR_REL(ordinal.correlation, -trend.z / std::sqrt(n), 1e-12);
}

// Exact identity: M² depends on the scores only through their spacing relative to each other.
TEST(OrdinalTest, IsUnchangedByShiftingAndStretchingTheScores) {
    const OrdinalResult plain =
        ordinal_test(tenure(), vector_of(ref::tenure_row_scores), vector_of(ref::tenure_column_scores));
    const OrdinalResult moved =
        ordinal_test(tenure(), {-100 + 1e6 * 0.5, -100 + 1e6 * 1.5, -100 + 1e6 * 4, -100 + 1e6 * 8, -100 + 1e6 * 15},
                     {0.2, 0.4, 0.6, 0.8, 1.0});
    EXPECT_NEAR_REL(moved.statistic, plain.statistic, 1e-12);
    EXPECT_NEAR_REL(moved.correlation, plain.correlation, 1e-12);
}

TEST(OrdinalTest, IsUnchangedByScoresNearTheLargestNumber) {
    const OrdinalResult plain = ordinal_test(tenure());
    const OrdinalResult huge = ordinal_test(tenure(), {1e307, 2e307, 3e307, 4e307, 5e307});
    EXPECT_NEAR_REL(huge.statistic, plain.statistic, 1e-12);
}

TEST(OrdinalTest, TurnsTheSignOfRButNotMSquaredWhenTheScoresFall) {
    const OrdinalResult rising = ordinal_test(tenure());
    const OrdinalResult falling = ordinal_test(tenure(), {5, 4, 3, 2, 1});
    EXPECT_NEAR_REL(falling.correlation, -rising.correlation, 1e-12);
    EXPECT_NEAR_REL(falling.statistic, rising.statistic, 1e-12);
}

TEST(OrdinalTest, KeepsTheScoreOfARowOfZerosInItsPlace) {
    // The table with an empty row between bands 2 and 3: given one score per body row, the empty
    // row's score is skipped over, so the result is that of the table without it.
    const CellGrid with_gap = grid({{4, 9, 15, 24, 14}, {6, 11, 17, 25, 12}, {0, 0, 0, 0, 0}, {8, 13, 20, 21, 9},
                                    {12, 15, 19, 16, 8}, {15, 17, 14, 13, 4}});
    const OrdinalResult result = ordinal_test(with_gap, grid({{0.5, 1.5, 3, 4, 8, 15}}));
    EXPECT_NEAR_REL(result.statistic, ref::tenure_scored_statistic, 1e-10);
}

TEST(OrdinalTest, ReadsHeadersAndScoresFromCells) {
    const CellGrid labelled = grid({{"Tenure / Satisfaction", "1", "2", "3", "4", "5"},
                                    {"Under 1", 4, 9, 15, 24, 14},
                                    {"1-2", 6, 11, 17, 25, 12},
                                    {"3-5", 8, 13, 20, 21, 9},
                                    {"6-10", 12, 15, 19, 16, 8},
                                    {"Over 10", 15, 17, 14, 13, 4}});
    const OrdinalResult result = ordinal_test(labelled, grid({{0.5}, {1.5}, {4}, {8}, {15}}), grid({{1, 2, 3, 4, 5}}));
    EXPECT_NEAR_REL(result.statistic, ref::tenure_scored_statistic, 1e-10);
}

TEST(OrdinalTest, RejectsScoresOfTheWrongNumber) {
    expect_error([] { ordinal_test(tenure(), {1, 2, 3}); },
                 "there are 3 row scores for 5 rows; give one score per row (rows of zeros included, in the order of "
                 "the table)");
}

TEST(OrdinalTest, RejectsTiedScores) {
    expect_error([] { ordinal_test(tenure(), {}, {1, 2, 2, 3, 4}); },
                 "column scores 2 and 3 are both 2; each column needs a score of its own, rising (or falling) with the "
                 "order of the columns");
}

TEST(OrdinalTest, RejectsScoresThatAreNotInOrder) {
    expect_error([] { ordinal_test(tenure(), {1, 2, 5, 4, 6}); },
                 "the row scores rise and then fall (row score 3 is 5, row score 4 is 4); scores must rise, or fall, "
                 "steadily with the order of the rows");
}

TEST(OrdinalTest, RejectsAScoreThatIsText) {
    expect_error([] { ordinal_test(grid({{1, 2}, {3, 4}}), grid({{1, "high"}})); },
                 "row score 2 holds the text \"high\"; scores must be numbers");
}

TEST(OrdinalTest, RejectsScoresInABlock) {
    expect_error([] { ordinal_test(grid({{1, 2}, {3, 4}}), CellGrid(), grid({{1, 2}, {3, 4}})); },
                 "the column scores must be a single row or a single column; the range has 2 rows and 2 columns");
}

// Invented: ratings by office, the answer scale typed out of order.
TEST(OrdinalTest, RefusesAnAnswerScaleOutOfItsOrderWithoutScores) {
    const CellGrid ratings = grid({{"", "Poor", "Good", "Fair", "Excellent"}, {"North", 5, 20, 10, 8}, {"South", 9, 12, 15, 3}});
    expect_error([&] { ordinal_test(ratings); },
                 "the columns' labels name an order (\"Poor\", \"Fair\", \"Good\" and \"Excellent\") but the table "
                 "has them in another (\"Poor\", \"Good\", \"Fair\" and \"Excellent\"), and the test follows the "
                 "table's order, so it would follow an order nobody meant; put the columns in the order of their labels");
    // Scores must rise or fall with the table's order, so they cannot mend it.
    EXPECT_THROW(ordinal_test(ratings, CellGrid{}, grid({{1, 2, 3, 4}})), Error);
}

TEST(OrdinalTest, TakesAnAnswerScaleInItsOrder) {
    EXPECT_NO_THROW(ordinal_test(grid({{"", "Never", "Sometimes", "Often", "Always"},
                                       {"North", 5, 20, 10, 8},
                                       {"South", 9, 12, 15, 3}})));
}
