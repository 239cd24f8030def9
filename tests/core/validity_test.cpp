// The validity check before trusting a chi-squared p-value: expected counts below 5 and 1,
// Cochran's rule (common practice: no E below 1, at most 20% below 5), the exact-test advice,
// blanks, set-aside rows/columns, weighted counts, and the plain-language summary.
#include <gtest/gtest.h>

#include "assoc/validity.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::table;

TEST(ValidityCheck, ReportsTheSmallestExpectedCount) {
    // [[20, 30], [25, 35]]: smallest E = 45·50/110 = 20.4545… (exact arithmetic).
    EXPECT_NEAR_REL(check_validity(table({{20, 30}, {25, 35}})).smallest_expected, 45.0 * 50 / 110, 1e-15);
}

TEST(ValidityCheck, CallsATableWithNoSmallExpectedCountsSound) {
    const ValidityCheck check = check_validity(table({{20, 30}, {25, 35}}));
    EXPECT_EQ(check.cells, 4u);
    EXPECT_EQ(check.cells_below_five, 0u);
    EXPECT_FALSE(check.any_below_one);
    EXPECT_TRUE(check.cochran_rule_met);
    EXPECT_FALSE(check.exact_test_recommended);
    EXPECT_EQ(check.summary(),
              "Sound: the smallest expected count is 20.5 and no cell expects fewer than 5, so the chi-squared "
              "approximation can be trusted.");
}

TEST(ValidityCheck, AcceptsExactlyTwentyPercentOfCellsBelowFive) {
    // Proportional 3×5 table, so E = O: 3 of 15 cells (20%) expect 2, none below 1.
    const ValidityCheck check = check_validity(table({{2, 20, 20, 20, 20}, {2, 20, 20, 20, 20}, {2, 20, 20, 20, 20}}));
    EXPECT_EQ(check.cells_below_five, 3u);
    EXPECT_DOUBLE_EQ(check.share_below_five, 0.2);
    EXPECT_TRUE(check.cochran_rule_met);
    EXPECT_FALSE(check.exact_test_recommended);
    EXPECT_EQ(check.summary(),
              "Sound: the smallest expected count is 2 and 3 of 15 cells expect fewer than 5, within Cochran's rule "
              "(at most 20%, none below 1).");
}

TEST(ValidityCheck, FailsCochransRuleWithMoreThanTwentyPercentBelowFive) {
    // E = O again: 6 of 15 cells (40%) expect 2 or 3.
    const ValidityCheck check = check_validity(table({{2, 3, 20, 20, 20}, {2, 3, 20, 20, 20}, {2, 3, 20, 20, 20}}));
    EXPECT_EQ(check.cells_below_five, 6u);
    EXPECT_FALSE(check.cochran_rule_met);
    EXPECT_TRUE(check.exact_test_recommended);
}

TEST(ValidityCheck, FailsCochransRuleWhenAnyCellExpectsFewerThanOne) {
    // Column 1 totals 2 over n = 242: E = 80·2/242 ≈ 0.66 in the first and last row.
    const ValidityCheck check = check_validity(table({{1, 20, 20, 20, 20}, {0, 20, 20, 20, 20}, {1, 20, 20, 20, 20}}));
    EXPECT_TRUE(check.any_below_one);
    EXPECT_FALSE(check.cochran_rule_met);
    EXPECT_EQ(check.summary(),
              "Doubtful: the smallest expected count is 0.661, and 3 of 15 cells (20%) expect fewer than 5; Cochran's "
              "rule asks for none below 1 and at most 20% below 5 (some cells expect fewer than 1). Use the exact "
              "test (ASSOC.EXACT) or a simulated p-value (ASSOC.SIMULATE) instead.");
}

TEST(ValidityCheck, RecommendsTheExactTestForATwoByTwoTableWithAnExpectedCountBelowFive) {
    // Fisher's tea-tasting table (published_values.md section 2): every E = 2.
    const ValidityCheck check = check_validity(table({{3, 1}, {1, 3}}));
    EXPECT_TRUE(check.exact_test_recommended);
    EXPECT_EQ(check.smallest_expected, 2.0);
    EXPECT_EQ(check.summary(),
              "Doubtful: the smallest expected count is 2, and 4 of 4 cells (100%) expect fewer than 5; Cochran's "
              "rule asks for none below 1 and at most 20% below 5. Use the exact test (ASSOC.EXACT) or a simulated "
              "p-value (ASSOC.SIMULATE) instead.");
}

TEST(ValidityCheck, AdvisesCombiningCategoriesWhenCountsAreWeighted) {
    const ValidityCheck check = check_validity(table({{3.5, 1}, {1, 3}}));
    EXPECT_FALSE(check.whole_counts);
    EXPECT_EQ(check.summary(),
              "Doubtful: Some counts are not whole numbers (weighted data): the chi-squared p-value treats them as "
              "counts of independent people or items, so it is right only for frequency weights (each weight the "
              "number of people a record stands for), never for amounts such as pay or invoice values, nor for "
              "survey weights; exact tests need whole counts. The smallest expected count is 1.88, and 4 of 4 cells "
              "(100%) expect fewer than 5; Cochran's rule asks for none below 1 and at most 20% below 5. Combine "
              "sparse categories or collect more data.");
}

// Weighted counts are never "Sound", however large: the p-value is only right for frequency weights.
TEST(ValidityCheck, NeverCallsCountsThatAreNotWholeSound) {
    const std::string summary = check_validity(table({{120.5, 80}, {90, 130.25}})).summary();
    EXPECT_EQ(summary.rfind("Doubtful: Some counts are not whole numbers (weighted data)", 0), 0u) << summary;
    // Smallest E: 200.5 · 210.25 / 420.75 = 100.19 (exact arithmetic).
    EXPECT_NE(summary.find("The smallest expected count is 100 and no cell expects fewer than 5."), std::string::npos)
        << summary;
}

TEST(ValidityCheck, ReportsBlanksAndSetAsideRowsAndColumnsByTheirLabels) {
    const ValidityCheck check = check_validity(table({{"", "A", "B", "C"},
                                                      {"Sales", 20, nullptr, 30},
                                                      {"Legal", 0, 0, 0},
                                                      {"HR", 25, 0, 35},
                                                      {"IT", 0, 0, nullptr}}));
    EXPECT_EQ(check.blank_cells, 2u);
    ASSERT_EQ(check.set_aside_rows.size(), 2u);
    ASSERT_EQ(check.set_aside_columns.size(), 1u);
    EXPECT_EQ(check.summary(),
              "Sound: the smallest expected count is 20.5 and no cell expects fewer than 5, so the chi-squared "
              "approximation can be trusted. 2 blank cells were read as 0. The rows \"Legal\" and \"IT\" have no "
              "counts and were set aside. The column \"B\" has no counts and was set aside.");
}

TEST(ValidityCheck, NamesSetAsideRowsByNumberWhenTheyHaveNoLabel) {
    const ValidityCheck check = check_validity(table({{20, 30}, {0, 0}, {25, 35}}));
    EXPECT_EQ(check.summary(),
              "Sound: the smallest expected count is 20.5 and no cell expects fewer than 5, so the chi-squared "
              "approximation can be trusted. Row 2 has no counts and was set aside.");
    EXPECT_EQ(check_validity(table({{20, 0, 30, 0}, {25, 0, 35, 0}})).summary(),
              "Sound: the smallest expected count is 20.5 and no cell expects fewer than 5, so the chi-squared "
              "approximation can be trusted. Columns 2 and 4 have no counts and were set aside.");
}

TEST(ValidityCheck, AppendsRemarksFromOtherRoutines) {
    ValidityCheck check = check_validity(table({{20, 30}, {25, 35}}));
    check.remarks.push_back("Yates' correction was applied.");
    EXPECT_EQ(check.summary(),
              "Sound: the smallest expected count is 20.5 and no cell expects fewer than 5, so the chi-squared "
              "approximation can be trusted. Yates' correction was applied.");
}

// Common practice: years typed as numbers above a table are labels, not counts. Reading them as
// counts changes the result without an error, so the check says so.
TEST(ValidityCheck, WarnsWhenTheFirstRowLooksLikeYearsReadAsCounts) {
    const CountTable table = assoc::test::table({{2023, 2024, 2025}, {12, 15, 9}, {30, 28, 33}});
    const std::string summary = check_validity(table).summary();
    EXPECT_NE(summary.find("Row 1 holds whole numbers that look like years, and they were read as counts"),
              std::string::npos)
        << summary;
}

// Issue 9: a date arrives from a spreadsheet as its day count since 30 December 1899 (45292 is
// 1 January 2024, 45323 is 1 February 2024: common practice of spreadsheets), so a header row of
// dates is read as counts unless the check says so.
TEST(ValidityCheck, WarnsWhenTheFirstRowLooksLikeDatesReadAsCountsAndNamesTheFirstDate) {
    const CountTable table = assoc::test::table({{45292, 45323, 45352}, {4, 5, 6}, {7, 8, 9}});
    const std::string summary = check_validity(table).summary();
    EXPECT_NE(summary.find("Row 1 holds whole numbers that look like dates (a spreadsheet stores a date as its day "
                           "count: 45,292 is 1 January 2024), and they were read as counts; if they are labels, enter "
                           "them as text or add a text header."),
              std::string::npos)
        << summary;
}

TEST(ValidityCheck, NamesLeapDaysAndTheEndsOfTheDateRangeRight) {
    // The first day, a leap day and the last two days of the range as day counts (Python's datetime
    // gives the same dates); the first of the two rising numbers is named.
    for (const auto& [serial, day] : {std::pair<double, const char*>{32874, "is 1 January 1990"},
                                      {45351, "is 29 February 2024"}, {73049, "is 30 December 2099"}}) {
        const CountTable table = assoc::test::table({{serial, 5}, {serial + 1, 4}});
        const std::string summary = check_validity(table).summary();
        EXPECT_NE(summary.find(day), std::string::npos) << summary;
    }
}

TEST(ValidityCheck, IsDoubtfulNotSoundWhenYearsMayHaveBeenReadAsCounts) {
    const CountTable table = assoc::test::table({{"Dept", 2023, 2024, 2025}, {"Sales", 12, 15, 9}, {"Legal", 30, 28, 33}});
    EXPECT_EQ(check_validity(table).summary().rfind("Doubtful: Row 1 holds whole numbers that look like years", 0), 0u);
}

// Invented: promotions by the number of courses taken, the numbers typed as numbers.
TEST(ValidityCheck, IsDoubtfulWhenTheFirstRowCountsUpByOneAsCategoryNumbersDo) {
    const CountTable table =
        assoc::test::table({{"Courses", 0, 1, 2, 3}, {"Promoted", 5, 9, 14, 20}, {"Not promoted", 20, 16, 11, 5}});
    EXPECT_EQ(check_validity(table).summary().rfind(
                  "Doubtful: Row 1 holds the whole numbers 0, 1, 2, …, which look like the numbers of ordered categories",
                  0),
              0u)
        << check_validity(table).summary();
}

// Invented: promotions by department, the departments' codes typed as numbers under a header row.
TEST(ValidityCheck, IsDoubtfulWhenTheFirstColumnCountsUpByOneAsCodesDo) {
    const CountTable table =
        assoc::test::table({{"Unit", "Promoted", "Not promoted"}, {101, 30, 45}, {102, 10, 80}, {103, 22, 41}});
    EXPECT_EQ(check_validity(table).summary().rfind(
                  "Doubtful: Column 1 holds the whole numbers 101, 102, 103, which count up by one as codes of "
                  "departments or numbered categories do, and they were read as counts; if they are labels, enter them "
                  "as text (type an apostrophe first: '101) so that they are read as labels.",
                  0),
              0u)
        << check_validity(table).summary();
}

// Invented: survey answers by branch over age bands whose lower bounds were typed as numbers.
TEST(ValidityCheck, IsDoubtfulWhenTheFirstRowRisesInEqualStepsAsBoundsOfBandsDo) {
    const CountTable table =
        assoc::test::table({{"Branch", 20, 30, 40, 50}, {"North", 10, 12, 4, 3}, {"South", 30, 25, 20, 9}});
    EXPECT_EQ(check_validity(table).summary().rfind(
                  "Doubtful: Row 1 holds the whole numbers 20, 30, 40, …, which rise in equal steps as the bounds of "
                  "bands (ages, pay) or the points of a scale do, and they were read as counts; if they are labels, "
                  "enter them as text (type an apostrophe first: '20) so that they are read as labels.",
                  0),
              0u)
        << check_validity(table).summary();
}

// Counts that happen to rise in equal steps stay Sound: three that are not all round, and any in a
// range of numbers alone (common practice: counts seldom form such a run beside a label).
TEST(ValidityCheck, StaysSoundWhenThreeCountsRiseInEqualStepsThatAreNotRound) {
    const CountTable table =
        assoc::test::table({{"Dept", "Promoted", "Not promoted"}, {"Sales", 14, 30}, {"Legal", 10, 24}, {"HR", 12, 27}});
    EXPECT_EQ(check_validity(table).summary().rfind("Sound:", 0), 0u) << check_validity(table).summary();
    const CountTable rising =
        assoc::test::table({{"Group", 6, 9, 12}, {"Promoted", 14, 30, 22}, {"Not promoted", 10, 24, 27}});
    EXPECT_EQ(check_validity(rising).summary().rfind("Sound:", 0), 0u) << check_validity(rising).summary();
    // Numbers alone, without labels: counts selected without them, however round.
    const CountTable numbers = assoc::test::table({{10, 20, 30}, {30, 20, 10}, {20, 20, 20}});
    EXPECT_EQ(check_validity(numbers).summary().rfind("Sound:", 0), 0u) << check_validity(numbers).summary();
}

TEST(ValidityCheck, IsDoubtfulWhenTheFirstColumnsLabelNamesCodes) {
    for (const char* label : {"Code", "Dept no.", "Cost centre ID", "Grade", "Age band"}) {
        const CountTable table =
            assoc::test::table({{label, "Promoted", "Not promoted"}, {4711, 30, 45}, {4730, 10, 80}, {4802, 22, 41}});
        EXPECT_EQ(check_validity(table).summary().rfind(
                      std::string("Doubtful: Column 1 (\"") + label +
                          "\") holds whole numbers under a label that names codes or numbered categories, and they were "
                          "read as counts; if they are labels, enter them as text (type an apostrophe first: '4711) so "
                          "that they are read as labels.",
                      0),
                  0u)
            << check_validity(table).summary();
    }
}

// "No" names an answer, not a number: a first column of counts under it is no code. Nor is one under
// the name of a category ("Grade A"), or under a word that every label of the header shares.
TEST(ValidityCheck, SaysNothingAboutCodesUnderAnAnswerOrACategory) {
    for (const char* label : {"No", "Not promoted", "Staff", "Grade A", "Level 1"}) {
        const CountTable table = assoc::test::table({{label, "Yes"}, {45, 30}, {80, 10}, {41, 22}});
        EXPECT_EQ(check_validity(table).summary().rfind("Sound", 0), 0u) << label << ": " << check_validity(table).summary();
    }
    const CountTable bands = assoc::test::table({{"Pay band", "Band", "Top band"}, {45, 30, 12}, {80, 10, 14}, {41, 22, 9}});
    EXPECT_EQ(check_validity(bands).summary().rfind("Sound", 0), 0u) << check_validity(bands).summary();
}

TEST(ValidityCheck, SaysNothingAboutYearsWhenTheyAreTextLabels) {
    const CountTable table = assoc::test::table({{"2023", "2024", "2025"}, {12, 15, 9}, {30, 28, 33}});
    EXPECT_EQ(check_validity(table).summary().find("look like years"), std::string::npos);
}
