// Cochran's Q for repeated yes/no answers (ASSOC.REPEATED). Expected values: statsmodels 0.13.5
// cochrans_q (tests/reference/ordered_generate.py); for two occasions McNemar's statistic without
// continuity correction (exact identity; R 4.2.2 mcnemar.test(correct = FALSE) on the approval table
// of published_values.md section 5, in workflow_r_values.hpp). The other answers are invented.
#include <gtest/gtest.h>

#include <tuple>

#include "assoc/cochrans_q.hpp"
#include "assoc/paired_tests.hpp"
#include "array_tables.hpp"
#include "ordered_values.hpp"
#include "test_support.hpp"
#include "workflow_r_values.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;
namespace ref = assoc::reference::ordered_values;
using assoc::test::matrix_of;
namespace r = assoc::reference::r_values;

namespace {

// One row per person of a 2×2 paired table: a people answering yes twice, b yes then no, and so on.
Matrix people_of(double a, double b, double c, double d) {
    Matrix matrix(static_cast<std::size_t>(a + b + c + d), 2);
    std::size_t row = 0;
    for (const auto& [count, first, second] :
         {std::tuple{a, 1.0, 1.0}, std::tuple{b, 1.0, 0.0}, std::tuple{c, 0.0, 1.0}, std::tuple{d, 0.0, 0.0}})
        for (double i = 0; i < count; ++i, ++row) {
            matrix(row, 0) = first;
            matrix(row, 1) = second;
        }
    return matrix;
}

// The survey waves as text answers with a header row.
CellGrid waves_as_text() {
    CellGrid range(19, 3);
    for (std::size_t j = 0; j < 3; ++j) range.at(0, j) = Cell::text("Wave " + std::to_string(j + 1));
    for (std::size_t i = 0; i < 18; ++i)
        for (std::size_t j = 0; j < 3; ++j) range.at(i + 1, j) = Cell::text(ref::wave_answers[i][j] == 1 ? "Yes" : "No");
    return range;
}

}  // namespace

TEST(CochransQ, MatchesStatsmodelsOnThreeSurveyWaves) {
    const RepeatedResult result = cochrans_q_test(matrix_of(ref::wave_answers));
    EXPECT_NEAR_REL(result.statistic, ref::wave_repeated_statistic, 1e-12);
    EXPECT_NEAR_REL(result.p_value, ref::wave_repeated_p, 1e-10);
    EXPECT_EQ(result.df, ref::wave_repeated_df);
    EXPECT_EQ(result.people, 18u);
}

TEST(CochransQ, MatchesStatsmodelsOnFourTasks) {
    const RepeatedResult result = cochrans_q_test(matrix_of(ref::task_answers));
    EXPECT_NEAR_REL(result.statistic, ref::task_repeated_statistic, 1e-12);
    EXPECT_NEAR_REL(result.p_value, ref::task_repeated_p, 1e-10);
    EXPECT_EQ(result.df, 3.0);
}

// Exact identity: with two occasions Q = (b − c)² / (b + c), McNemar's statistic without correction.
TEST(CochransQ, IsTheUncorrectedMcNemarStatisticForTwoOccasions) {
    const RepeatedResult result = cochrans_q_test(people_of(794, 150, 86, 570));
    EXPECT_NEAR_REL(result.statistic, r::approval_uncorrected_statistic, 1e-12);
    EXPECT_NEAR_REL(result.p_value, r::approval_uncorrected_p, 1e-10);
    Matrix square(2, 2);
    square(0, 0) = 794;
    square(0, 1) = 150;
    square(1, 0) = 86;
    square(1, 1) = 570;
    const PairedResult mcnemar = paired_test(square, PairedMethod::uncorrected);
    EXPECT_NEAR_REL(result.statistic, mcnemar.statistic, 1e-12);
    EXPECT_EQ(result.df, 1.0);
}

// Exact identity: swapping yes and no leaves Q unchanged.
TEST(CochransQ, IsTheSameWhicheverAnswerCountsAsYes) {
    const RepeatedResult as_yes = cochrans_q_test(waves_as_text(), Cell::text("yes"));
    const RepeatedResult as_no = cochrans_q_test(waves_as_text(), Cell::text("No"));
    EXPECT_NEAR_REL(as_yes.statistic, ref::wave_repeated_statistic, 1e-12);
    EXPECT_NEAR_REL(as_no.statistic, as_yes.statistic, 1e-12);
}

TEST(CochransQ, SaysWhichTextLabelItCountedAsYes) {
    const RepeatedResult result = cochrans_q_test(waves_as_text());
    EXPECT_EQ(result.remarks, (std::vector<std::string>{"The answers are \"Yes\" and \"No\"; \"Yes\" was counted as yes "
                                                        "(the yes argument chooses; Cochran's Q is the same either way)."}));
}

TEST(CochransQ, SetsAsideAndCountsPeopleWithABlankAnswer) {
    CellGrid range = waves_as_text();
    CellGrid longer(22, 3);
    for (std::size_t i = 0; i < 19; ++i)
        for (std::size_t j = 0; j < 3; ++j) longer.at(i, j) = range.at(i, j);
    longer.at(19, 0) = Cell::text("Yes");
    longer.at(19, 2) = Cell::text("No");  // row 20: a blank in wave 2
    longer.at(20, 1) = Cell::text("No");  // row 21: blanks in waves 1 and 3; row 22 wholly blank
    const RepeatedResult result = cochrans_q_test(longer, Cell::text("Yes"));
    EXPECT_NEAR_REL(result.statistic, ref::wave_repeated_statistic, 1e-12);
    EXPECT_EQ(result.set_aside, 2u);
    EXPECT_EQ(result.remarks, (std::vector<std::string>{"2 people with a blank answer were set aside (rows 20 and 21 of "
                                                        "the range); Cochran's Q uses only people who answered on "
                                                        "every occasion.",
                                                        "1 empty row was skipped."}));
}

TEST(CochransQ, ReadsOnesAndZerosWithoutAHeader) {
    const RepeatedResult result = cochrans_q_test(grid({{1, 0, 0}, {1, 1, 0}, {1, 0, 1}, {0, 0, 0}}));
    EXPECT_EQ(result.people, 4u);
    EXPECT_TRUE(result.remarks.empty());
}

// Exact identity: a first column of employee numbers or names, one per person, leaves the test as
// it is without that column, and the feedback says it was read so.
TEST(CochransQ, ReadsAFirstColumnOfPeoplesNumbersOrNamesAsTheirLabels) {
    const RepeatedResult plain = cochrans_q_test(grid({{"W1", "W2", "W3"}, {1, 0, 1}, {1, 1, 1}, {0, 0, 1}, {1, 0, 0}}));
    for (const CellGrid& range :
         {grid({{"ID", "W1", "W2", "W3"}, {101, 1, 0, 1}, {102, 1, 1, 1}, {103, 0, 0, 1}, {104, 1, 0, 0}}),
          grid({{"Name", "W1", "W2", "W3"}, {"Ada", 1, 0, 1}, {"Ben", 1, 1, 1}, {"Cy", 0, 0, 1}, {"Di", 1, 0, 0}}),
          grid({{4401, 1, 0, 1}, {4402, 1, 1, 1}, {4403, 0, 0, 1}, {4404, 1, 0, 0}}),
          grid({{"ID", "W1", "W2", "W3"}, {"a", "Yes", "No", "Yes"}, {"b", "Yes", "Yes", "Yes"}, {"c", "No", "No", "Yes"},
                {"d", "Yes", "No", "No"}})}) {
        const RepeatedResult result = cochrans_q_test(range);
        EXPECT_EQ(result.occasions, 3u);
        EXPECT_EQ(result.people, 4u);
        EXPECT_EQ(result.statistic, plain.statistic);
        ASSERT_FALSE(result.remarks.empty());
        EXPECT_EQ(result.remarks[0], "Column 1 holds a different entry on every row and no answer, so it was read as "
                                     "the people's names or numbers and left out of the answers.");
    }
}

// A first column that repeats an entry, or holds only answers, is answers.
TEST(CochransQ, ReadsAFirstColumnThatRepeatsAnEntryAsAnswers) {
    expect_error([] { cochrans_q_test(grid({{101, 1, 0}, {101, 1, 1}, {103, 0, 0}})); },
                 "row 1, column 1 holds the number 101; answers must be 1 (yes) or 0 (no), or two text labels");
    EXPECT_EQ(cochrans_q_test(grid({{1, 0, 0}, {0, 1, 0}, {1, 0, 1}})).occasions, 3u);
}

TEST(CochransQ, RefusesAThirdLabel) {
    expect_error([] { cochrans_q_test(grid({{"Yes", "No"}, {"No", "yes"}})); },
                 "the answers hold more than two labels (\"Yes\", \"No\" and \"yes\"); a yes/no test needs exactly two "
                 "(labels are compared exactly: \"Yes\" and \"yes\" are two labels)");
}

TEST(CochransQ, RefusesNumbersOtherThanOneAndZero) {
    expect_error([] { cochrans_q_test(grid({{1, 0}, {2, 1}})); },
                 "row 2, column 1 holds the number 2; answers must be 1 (yes) or 0 (no), or two text labels");
}

TEST(CochransQ, RefusesNumbersMixedWithTexts) {
    expect_error([] { cochrans_q_test(grid({{1, 0}, {"Yes", "No"}})); },
                 "the answers mix numbers and texts (row 1, column 1 holds the number 1, row 2, column 1 the text "
                 "\"Yes\"); use 1 and 0, or two text labels");
}

TEST(CochransQ, RefusesAYesLabelThatIsNotAnAnswer) {
    expect_error([] { cochrans_q_test(waves_as_text(), Cell::text("Agree")); },
                 "the yes label \"Agree\" is not among the answers, which are \"Yes\" and \"No\"");
}

TEST(CochransQ, RefusesAnswersThatNeverChange) {
    expect_error([] { cochrans_q_test(grid({{1, 1, 1}, {0, 0, 0}})); },
                 "no one's answers differ from one occasion to another (each person answered the same every time), so "
                 "there is no change to test");
}

TEST(CochransQ, RefusesASingleOccasion) {
    expect_error([] { cochrans_q_test(grid({{1}, {0}})); },
                 "Cochran's Q needs at least 2 occasions (columns of answers); this range has 1 column");
}
