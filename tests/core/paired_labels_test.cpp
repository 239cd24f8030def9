// Paired tables read by their labels: columns matched to the rows, mismatches refused, totals left out.
#include <gtest/gtest.h>

#include <string>

#include "assoc/paired_tests.hpp"
#include "assoc/validity.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;

// Invented: the same 85 staff asked twice. Exact identity: matching the columns by label gives the table
// with the columns in the rows' order, so the same test as that table.
TEST(PairedLabels, MatchTheColumnsToTheRowsWhateverTheirOrder) {
    const PairedResult reordered = paired_test(grid({{"Before / After", "No", "Yes"}, {"Yes", 5, 30}, {"No", 40, 10}}));
    const PairedResult aligned = paired_test(grid({{"", "Yes", "No"}, {"Yes", 30, 5}, {"No", 10, 40}}));
    EXPECT_EQ(reordered.p_value, aligned.p_value);
    EXPECT_EQ(reordered.statistic, aligned.statistic);
    ASSERT_EQ(reordered.remarks.size(), 1u);
    EXPECT_EQ(reordered.remarks[0], "The columns were matched to the rows by their labels: they are in another order "
                                    "than the rows, and were read as \"Yes\" and \"No\".");
    EXPECT_TRUE(aligned.remarks.empty());
}

TEST(PairedLabels, MatchLabelsWithoutRegardToCaseOrSpaces) {
    const PairedResult result = paired_test(grid({{"", "no ", "YES"}, {"Yes", 5, 30}, {"No", 40, 10}}));
    EXPECT_EQ(result.statistic, paired_test(grid({{30, 5}, {10, 40}})).statistic);
}

// Labels on one side only: the other side is read in the same order, and that is said. The statistic
// equals that of the unlabelled table (an exact identity).
TEST(PairedLabels, SayThatAnUnlabelledSideIsReadInTheOrderOfTheOther) {
    const PairedResult rows_only = paired_test(grid({{"Yes", 30, 5}, {"No", 10, 40}}));
    EXPECT_EQ(rows_only.statistic, paired_test(grid({{30, 5}, {10, 40}})).statistic);
    ASSERT_EQ(rows_only.remarks.size(), 1u);
    EXPECT_EQ(rows_only.remarks[0], "The columns have no labels, so they were read as the rows' categories in the same "
                                    "order (\"Yes\" and \"No\"); if they come in another order, label them.");
    const PairedResult columns_only = paired_test(grid({{"Yes", "No"}, {30, 5}, {10, 40}}));
    ASSERT_EQ(columns_only.remarks.size(), 1u);
    EXPECT_EQ(columns_only.remarks[0].rfind("The rows have no labels, so they were read as the columns' categories", 0), 0u);
    EXPECT_TRUE(paired_test(grid({{30, 5}, {10, 40}})).remarks.empty());
}

TEST(PairedLabels, RefuseLabelsThatDoNotMatch) {
    expect_error([] { paired_test(grid({{"", "Agree", "Disagree"}, {"Yes", 5, 30}, {"No", 40, 10}})); },
                 "a paired table needs the same categories as rows and as columns, matched by their labels; the rows "
                 "have \"Yes\" and \"No\", which no column has; the columns have \"Agree\" and \"Disagree\", which no "
                 "row has. Give the rows and the columns the same labels");
}

// Labels that name the occasion beside the category ("Low before", "Low after"): matched once the words
// all the rows share and those all the columns share are left out, and said. Exact identity: the same
// test as the table with the columns in the rows' order under the same labels.
TEST(PairedLabels, MatchLabelsThatDifferOnlyByTheWordsEachSideShares) {
    const PairedResult named = paired_test(grid({{"", "High after", "Mid after", "Low after"},
                                                 {"Low before", 2, 5, 20},
                                                 {"Mid before", 4, 18, 6},
                                                 {"High before", 15, 3, 1}}));
    const PairedResult aligned = paired_test(grid({{20, 5, 2}, {6, 18, 4}, {1, 3, 15}}));
    EXPECT_EQ(named.statistic, aligned.statistic);
    EXPECT_EQ(named.p_value, aligned.p_value);
    ASSERT_EQ(named.remarks.size(), 1u);
    EXPECT_EQ(named.remarks[0], "The rows and the columns have different labels, which match once the words that all "
                                "the rows share, and those that all the columns share, are left out; so row and column "
                                "were paired as \"Low before\" with \"Low after\", \"Mid before\" with \"Mid after\" and "
                                "\"High before\" with \"High after\". If these are not the same categories, give the rows "
                                "and the columns the same labels.");
}

// The shared words may stand in brackets. Aligned, the table is Fail/Pass by Fail/Pass with 14 who failed
// first and passed the retest and 9 the other way: McNemar's corrected statistic (|14 − 9| − 1)²/23 =
// 16/23 (the formula by hand).
TEST(PairedLabels, MatchLabelsWhoseSharedWordsStandInBrackets) {
    const PairedResult result = paired_test(grid({{"", "Pass (retest)", "Fail (retest)"},
                                                  {"Fail (first)", 14, 6},
                                                  {"Pass (first)", 30, 9}}));
    EXPECT_NEAR(result.statistic, 16.0 / 23.0, 1e-15);
}

// Only the words that every label of a side shares are left out: what is left must still match.
TEST(PairedLabels, RefuseLabelsThatDifferBeyondTheWordsEachSideShares) {
    expect_error([] { paired_test(grid({{"", "Approved after", "Rejected after"}, {"Yes before", 5, 30}, {"No before", 40, 10}})); },
                 "a paired table needs the same categories as rows and as columns, matched by their labels; the rows "
                 "have \"Yes before\" and \"No before\", which no column has; the columns have \"Approved after\" and "
                 "\"Rejected after\", which no row has. Give the rows and the columns the same labels");
}

TEST(PairedLabels, RefuseALabelGivenTwice) {
    expect_error([] { paired_test(grid({{"", "Yes", "Yes"}, {"Yes", 5, 30}, {"No", 40, 10}})); },
                 "the columns of the paired table carry the label \"Yes\" twice; each category needs one row and one "
                 "column");
}

TEST(PairedLabels, LeaveOutATotalRowAndColumn) {
    const PairedResult with_totals = paired_test(grid({{"", "Yes", "No", "Total"},
                                                       {"Yes", 30, 5, 35},
                                                       {"No", 10, 40, 50},
                                                       {"Total", 40, 45, 85}}));
    EXPECT_EQ(with_totals.statistic, paired_test(grid({{30, 5}, {10, 40}})).statistic);
}

TEST(PairedLabels, AreMentionedByTheCheckOfATableWithTheSameLabelsOnBothSides) {
    const std::string summary =
        check_validity(read_count_table(grid({{"Before / After", "No", "Yes"}, {"Yes", 5, 30}, {"No", 40, 10}}))).summary();
    EXPECT_NE(summary.find("The rows and the columns carry the same labels (\"Yes\" and \"No\"): if the table counts "
                           "the same people twice (before and after, or by two raters), the paired test (ASSOC.PAIRED) "
                           "fits it, not this test of independence."),
              std::string::npos)
        << summary;
}

TEST(PairedLabels, AreMentionedByTheCheckWhenTheyDifferOnlyByTheWordsEachSideShares) {
    const std::string summary = check_validity(read_count_table(grid({{"", "No after", "Yes after"},
                                                                      {"Yes before", 5, 30},
                                                                      {"No before", 40, 10}})))
                                    .summary();
    EXPECT_NE(summary.find("The rows and the columns carry the same labels but for the words each side's labels share "
                           "(\"Yes before\" and \"No before\"): if the table counts the same people twice"),
              std::string::npos)
        << summary;
}

TEST(PairedLabels, AreNotMentionedByTheCheckOfGroupsAgainstAnswers) {
    const std::string summary = check_validity(read_count_table(grid({{"", "Yes (survey)", "No (survey)"},
                                                                      {"Sales team", 5, 30},
                                                                      {"Legal team", 40, 10}})))
                                    .summary();
    EXPECT_EQ(summary.find("paired test"), std::string::npos) << summary;
}
