// Pearson's goodness-of-fit test of one row or column of counts against expected shares.
#include <gtest/gtest.h>

#include "assoc/goodness_of_fit.hpp"
#include "small_sample_values.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;
namespace ref = assoc::reference;

TEST(GoodnessOfFit, MatchesMendelsPeasAgainstNineThreeThreeOne) {
    // Mendel (1866), counts from memory (published_values.md section 6): X² = 196/417 exactly, df 3;
    // p from scipy 1.10.1 chisquare (mpmath 0.92542589510361598).
    const GoodnessOfFit fit = goodness_of_fit({315, 108, 101, 32}, {9, 3, 3, 1});
    EXPECT_NEAR_REL(fit.statistic, 196.0 / 417.0, 1e-14);
    EXPECT_NEAR_REL(fit.statistic, ref::mendel_statistic, 1e-14);
    EXPECT_DOUBLE_EQ(fit.df, 3);
    EXPECT_NEAR_REL(fit.p_value, ref::mendel_p_value, 1e-12);
    EXPECT_EQ(fit.categories, 4u);
}

TEST(GoodnessOfFit, RescalesExpectedSharesToTheObservedTotal) {
    const GoodnessOfFit fit = goodness_of_fit({315, 108, 101, 32}, {0.5625, 0.1875, 0.1875, 0.0625});
    EXPECT_NEAR_REL(fit.expected[0], 556 * 9 / 16.0, 1e-15);
    EXPECT_NEAR_REL(fit.expected[3], 556 / 16.0, 1e-15);
    EXPECT_NEAR_REL(fit.statistic, 196.0 / 417.0, 1e-14);
}

TEST(GoodnessOfFit, UsesEqualSharesWhenNoExpectedValuesAreGiven) {
    // Invented sick-leave days by weekday; scipy 1.10.1 chisquare with its default equal shares.
    const GoodnessOfFit fit = goodness_of_fit({44, 25, 21, 18, 32});
    EXPECT_NEAR_REL(fit.statistic, ref::weekday_statistic, 1e-14);
    EXPECT_DOUBLE_EQ(fit.df, 4);
    EXPECT_NEAR_REL(fit.p_value, ref::weekday_p_value, 1e-12);
}

TEST(GoodnessOfFit, LowersTheDegreesOfFreedomForEstimatedParameters) {
    // scipy 1.10.1 chisquare(..., ddof=1): df 4 − 1 − 1 = 2.
    const GoodnessOfFit fit = goodness_of_fit({315, 108, 101, 32}, {9, 3, 3, 1}, 1);
    EXPECT_DOUBLE_EQ(fit.df, 2);
    EXPECT_NEAR_REL(fit.p_value, ref::mendel_p_value_one_estimated, 1e-12);
}

TEST(GoodnessOfFit, LeavesOutACategoryExpectedAndObservedZero) {
    const GoodnessOfFit with_empty = goodness_of_fit({315, 108, 0, 101, 32}, {9, 3, 0, 3, 1});
    EXPECT_EQ(with_empty.categories, 4u);
    EXPECT_DOUBLE_EQ(with_empty.df, 3);
    EXPECT_NEAR_REL(with_empty.statistic, 196.0 / 417.0, 1e-14);
    EXPECT_EQ(with_empty.expected[2], 0.0);
}

TEST(GoodnessOfFit, ReadsAColumnWithAHeaderCell) {
    const GoodnessOfFit fit = goodness_of_fit(grid({{"Peas"}, {315}, {108}, {101}, {32}}), grid({{9}, {3}, {3}, {1}}));
    EXPECT_NEAR_REL(fit.statistic, 196.0 / 417.0, 1e-14);
}

TEST(GoodnessOfFit, ReadsARowWithALabelCellAgainstAColumnOfShares) {
    const GoodnessOfFit fit =
        goodness_of_fit(grid({{"Observed", 315, 108, 101, 32}}), grid({{"Share"}, {9}, {3}, {3}, {1}}));
    EXPECT_NEAR_REL(fit.statistic, 196.0 / 417.0, 1e-14);
}

TEST(GoodnessOfFit, ReadsAColumnOfCountsBesideAColumnOfLabels) {
    const GoodnessOfFit fit = goodness_of_fit(
        grid({{"Kind", "Count"}, {"round yellow", 315}, {"round green", 108}, {"wrinkled yellow", 101}, {"wrinkled green", 32}}),
        grid({{9, 3, 3, 1}}));
    EXPECT_NEAR_REL(fit.statistic, 196.0 / 417.0, 1e-14);
    EXPECT_EQ(fit.observed.size(), 4u);
}

TEST(GoodnessOfFit, KeepsAZeroCountReadFromTheRange) {
    // read_count_table sets all-zero rows aside; a category observed 0 times must stay a category.
    const GoodnessOfFit fit = goodness_of_fit(grid({{10}, {0}, {nullptr}, {6}}));
    EXPECT_EQ(fit.categories, 4u);
    EXPECT_DOUBLE_EQ(fit.df, 3);
    EXPECT_DOUBLE_EQ(fit.statistic, (36 + 16 + 16 + 4) / 4.0);  // E = 4 each
}

TEST(GoodnessOfFit, RejectsRangesOfDifferentLengths) {
    expect_error([] { goodness_of_fit(grid({{1, 2, 3}}), grid({{1, 1}})); },
                 "the observed range has 3 values but the expected range has 2 values; give one expected count or "
                 "share per category");
}

TEST(GoodnessOfFit, RejectsAnObservedCountWhereNoneIsExpected) {
    expect_error([] { goodness_of_fit({5, 3, 2}, {1, 0, 1}); },
                 "category 2 is expected to have no counts but has 3; give it an expected share above 0");
}

TEST(GoodnessOfFit, RejectsNegativeExpectedValuesNamingTheRange) {
    expect_error([] { goodness_of_fit(grid({{5, 3, 2}}), grid({{1, -1, 1}})); },
                 "in the expected range: row 1, column 2 holds the number -1; counts cannot be negative");
}

TEST(GoodnessOfFit, RejectsNegativeObservedNumbers) {
    expect_error([] { goodness_of_fit({5, -3, 2}); }, "observed count 2 is -3; it must be a number of zero or more");
}

TEST(GoodnessOfFit, RejectsARangeOfSeveralRowsAndColumns) {
    expect_error([] { goodness_of_fit(grid({{1, 2}, {3, 4}})); },
                 "select one row or one column of numbers; this range has 2 rows and 2 columns of numbers");
}

TEST(GoodnessOfFit, RejectsObservedCountsThatAddUpToZero) {
    expect_error([] { goodness_of_fit({0, 0, 0}); }, "the observed counts add up to 0; there is nothing to test");
}

TEST(GoodnessOfFit, RejectsASingleCategory) {
    expect_error([] { goodness_of_fit({7}); }, "the test needs at least 2 categories with an expected count above 0");
}

TEST(GoodnessOfFit, RejectsSoManyEstimatedParametersThatNoDegreeOfFreedomIsLeft) {
    expect_error([] { goodness_of_fit({5, 3, 2}, {}, 2); },
                 "3 categories leave 2 degrees of freedom, and 2 estimated parameters leave none; the test needs at "
                 "least 1");
}

TEST(GoodnessOfFit, RejectsAFractionalNumberOfEstimatedParameters) {
    expect_error([] { goodness_of_fit({5, 3, 2, 4}, {}, 0.5); },
                 "the number of estimated parameters must be a whole number, not 0.5");
}

// Invented: staff by site against the planned shares, typed as percentages that miss a site.
TEST(GoodnessOfFit, RefusesPercentagesThatDoNotAddUpToAHundred) {
    expect_error([] { goodness_of_fit(grid({{"Staff"}, {30}, {20}, {50}}), grid({{"Plan %"}, {30}, {30}, {30}})); },
                 "in the expected range: the percentages under the label \"Plan %\" add up to 90, not 100, so a "
                 "category may be missing or a value mistyped; correct them, or give expected counts under a label "
                 "that does not speak of percentages");
}

TEST(GoodnessOfFit, TakesRoundedPercentagesAndUnlabelledValuesInAnyUnit) {
    // Rounded thirds (99.9) are percentages; 30, 30, 30 without a label are equal shares in any unit.
    const GoodnessOfFit rounded = goodness_of_fit(grid({{"Staff"}, {30}, {20}, {50}}), grid({{"Plan %"}, {33.3}, {33.3}, {33.3}}));
    const GoodnessOfFit plain = goodness_of_fit(grid({{30}, {20}, {50}}), grid({{30}, {30}, {30}}));
    EXPECT_EQ(rounded.p_value, plain.p_value);  // exact identity: equal shares in any unit
}

// Invented: staff by region against a plan typed in another order. Matched by label, the terms are
// (30-30)²/30 + (45-50)²/50 + (25-20)²/20 = 1.75 with 2 degrees of freedom, whose p-value is
// exp(-1.75/2) (exact identity: chi-squared(2) is the exponential with mean 2).
TEST(GoodnessOfFit, MatchesTheExpectedValuesToTheObservedCategoriesByLabel) {
    const GoodnessOfFit fit =
        goodness_of_fit(grid({{"Region", "Staff"}, {"North", 30}, {"South", 45}, {"East", 25}}),
                        grid({{"Region", "Plan"}, {"south ", 50}, {"North", 30}, {"East", 20}}));
    EXPECT_NEAR_REL(fit.statistic, 1.75, 1e-15);
    EXPECT_NEAR_REL(fit.p_value, std::exp(-0.875), 1e-14);
    ASSERT_EQ(fit.remarks.size(), 1u);
    EXPECT_EQ(fit.remarks[0], "The expected values were matched to the observed categories by their labels: the "
                              "expected range lists them in another order.");
}

TEST(GoodnessOfFit, TakesTheExpectedValuesInPlaceWhenOnlyOneRangeNamesTheCategories) {
    const GoodnessOfFit fit =
        goodness_of_fit(grid({{"Region", "Staff"}, {"North", 30}, {"South", 45}, {"East", 25}}), grid({{"Plan"}, {50}, {30}, {20}}));
    // (30-50)²/50 + (45-30)²/30 + (25-20)²/20 = 8 + 7.5 + 1.25.
    EXPECT_NEAR_REL(fit.statistic, 16.75, 1e-15);
    EXPECT_TRUE(fit.remarks.empty());
}

TEST(GoodnessOfFit, RefusesRangesThatNameDifferentCategories) {
    expect_error([] {
        goodness_of_fit(grid({{"Region", "Staff"}, {"North", 30}, {"South", 45}, {"East", 25}}),
                        grid({{"Region", "Plan"}, {"North", 30}, {"South", 50}, {"West", 20}}));
    },
                 "the two ranges name different categories; only in the observed range: \"East\"; only in the expected "
                 "range: \"West\". Give both the same labels (spaces at the ends and capitals aside), or leave the labels "
                 "out of the expected range to take its values in the observed range's order");
}

// Invented: staff by site against planned shares that miss a site (0.25 + 0.35 + 0.3 = 0.9); rounded
// to two decimals they could add up to 0.9 ± 0.015 at most, so no rounding explains it.
TEST(GoodnessOfFit, RefusesSharesThatDoNotAddUpToOne) {
    expect_error([] { goodness_of_fit(grid({{30}, {20}, {50}}), grid({{0.25}, {0.35}, {0.3}})); },
                 "in the expected range: the values are shares (all between 0 and 1) but add up to 0.9, not 1, even "
                 "allowing for their rounding, so a category may be missing or a value mistyped; correct them so that "
                 "they add up to 1, or give expected counts");
}

TEST(GoodnessOfFit, TakesSharesThatAddUpToOneOnceRounded) {
    // Thirds rounded to one decimal (0.3 each, 0.9 in all) are within 3 × 0.05 of 1: equal shares, as
    // equal shares in any unit are (exact identity).
    const GoodnessOfFit rounded = goodness_of_fit(grid({{30}, {20}, {50}}), grid({{0.3}, {0.3}, {0.3}}));
    const GoodnessOfFit plain = goodness_of_fit(grid({{30}, {20}, {50}}), grid({{1}, {1}, {1}}));
    EXPECT_EQ(rounded.p_value, plain.p_value);
}

TEST(GoodnessOfFit, TakesPercentageCellsThatHoldShares) {
    // A cell formatted as a percentage holds its share (30% is 0.3), under a label that speaks of percent.
    const GoodnessOfFit shares = goodness_of_fit(grid({{"Staff"}, {30}, {20}, {50}}), grid({{"Plan %"}, {0.3}, {0.2}, {0.5}}));
    // The counts are the plan's shares of 100: X² is 0 but for the binary rounding of 0.3 and 0.2.
    EXPECT_LT(shares.statistic, 1e-25);
}

// Invented: staff by region with the sheet's "Total" row inside the observed range.
TEST(GoodnessOfFit, SaysThatATotalRowWasSetAside) {
    const GoodnessOfFit fit = goodness_of_fit(grid({{"Region", "Staff"}, {"North", 40}, {"South", 35}, {"East", 25},
                                                    {"Total", 100}}),
                                              CellGrid());
    // (40-100/3)² + (35-100/3)² + (25-100/3)² over 100/3: 350/3 / (100/3) = 3.5 (exact identity).
    EXPECT_NEAR_REL(fit.statistic, 3.5, 1e-14);
    ASSERT_EQ(fit.remarks.size(), 1u);
    EXPECT_EQ(fit.remarks[0], "The row \"Total\" is a total and was set aside.");
}

TEST(GoodnessOfFit, SaysWhatWasSetAsideInTheExpectedRange) {
    const GoodnessOfFit fit = goodness_of_fit(grid({{"Staff"}, {30}, {20}, {50}}),
                                              grid({{"Region", "Plan"}, {"North", 3}, {"South", 2}, {"East", 5}, {"Total", 10}}));
    EXPECT_EQ(fit.statistic, 0.0);
    ASSERT_EQ(fit.remarks.size(), 1u);
    EXPECT_EQ(fit.remarks[0], "In the expected range: the row \"Total\" is a total and was set aside.");
}
