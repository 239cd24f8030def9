// Totals and percentages inside a range of counts: labelled totals set aside, unlabelled sums refused,
// percentages and shares refused, what stays ambiguous doubted (never "Sound").
#include <gtest/gtest.h>

#include <string>
#include <vector>

#include "assoc/count_table.hpp"
#include "assoc/goodness_of_fit.hpp"
#include "assoc/ordinal_test.hpp"
#include "assoc/paired_tests.hpp"
#include "assoc/rates.hpp"
#include "assoc/statistics.hpp"
#include "assoc/trend_test.hpp"
#include "assoc/validity.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;
using assoc::test::table;

namespace {

bool contains(const std::string& text, const std::string& part) { return text.find(part) != std::string::npos; }

// Invented: promotions by department of a fictional company, the same table with and without totals.
CellGrid without_totals() { return grid({{"", "Promoted", "Not promoted"}, {"Sales", 30, 45}, {"Legal", 10, 80}}); }

}  // namespace

// Exact identity: setting the total row and column aside leaves the table without them.
TEST(TotalLines, ALabelledTotalRowAndColumnGiveTheSameTestAsTheTableWithoutThem) {
    const CountTable with = read_count_table(grid({{"Dept / Outcome", "Promoted", "Not promoted", "Total"},
                                                   {"Sales", 30, 45, 75},
                                                   {"Legal", 10, 80, 90},
                                                   {"Total", 40, 125, 165}}));
    const CountTable without = read_count_table(without_totals());
    EXPECT_EQ(with.counts().values(), without.counts().values());
    EXPECT_EQ(independence_test(with, Method::pearson).p_value, independence_test(without, Method::pearson).p_value);
    ASSERT_EQ(with.set_aside_rows().size(), 1u);
    EXPECT_EQ(with.set_aside_rows()[0].why, SetAside::Why::total);
    EXPECT_TRUE(with.doubts().empty());
    const std::string summary = check_validity(with).summary();
    EXPECT_EQ(summary.rfind("Sound:", 0), 0u) << summary;
    EXPECT_TRUE(contains(summary, "The row \"Total\" is a total and was set aside. The column \"Total\" is a total and "
                                  "was set aside."))
        << summary;
}

TEST(TotalLines, KnowsTheWordsForATotalInSeveralLanguagesInAnyCase) {
    for (const char* word : {"TOTAL", "Totals", "Grand total", "Total:", "total staff", "Subtotal", "Sum", "All",
                             "Summe", "Gesamt", "Insgesamt", "Somme", "Totale", "Totaal", "Totalt", "Suma", "Razem",
                             "Σ", "∑"}) {
        const CountTable read = read_count_table(grid({{"", "Yes", "No"}, {"North", 5, 9}, {"South", 7, 3}, {word, 12, 12}}));
        EXPECT_EQ(read.rows(), 2u) << word;
        EXPECT_EQ(read.set_aside_rows().size(), 1u) << word;
    }
}

TEST(TotalLines, TakesNoWordThatOnlyBeginsLikeATotalForOne) {
    for (const char* word : {"Summer", "Allowances", "Totally new", "Summit"}) {
        const CountTable read = read_count_table(grid({{"", "Yes", "No"}, {"North", 5, 9}, {"South", 7, 3}, {word, 2, 8}}));
        EXPECT_EQ(read.rows(), 3u) << word;
    }
}

TEST(TotalLines, RefusesARowWithoutALabelThatHoldsTheSumOfTheOthers) {
    expect_error([] { read_count_table(grid({{30, 45}, {10, 80}, {40, 125}})); },
                 "row 3 holds the sum of rows 1–2 in every column, so it looks like a total, and a total must not be "
                 "tested as if it held more counts; leave it out of the range, or label it \"Total\" (it is then set "
                 "aside). If it does hold counts, give the rows labels");
}

TEST(TotalLines, RefusesAColumnWithoutALabelThatHoldsTheSumOfTheOthersCountingRowsOfTheRange) {
    expect_error([] { read_count_table(grid({{"Sales", 30, 45, 75}, {"Legal", 10, 80, 90}})); },
                 "column 4 holds the sum of columns 2–3 in every row, so it looks like a total, and a total must not "
                 "be tested as if it held more counts; leave it out of the range, or label it \"Total\" (it is then "
                 "set aside). If it does hold counts, give the columns labels");
}

// Found by the bad-input battery: at 1e-300 every difference fell below an absolute tolerance.
TEST(TotalLines, TakesNoLineOfTinyCountsForATotalWhenItIsNotTheSum) {
    const CountTable read = read_count_table(grid({{10e-300, 20e-300, 30e-300}, {20e-300, 20e-300, 20e-300},
                                                   {30e-300, 20e-300, 10e-300}}));
    EXPECT_EQ(read.rows(), 3u);
    EXPECT_EQ(read.columns(), 3u);
}

TEST(TotalLines, RefusesUnlabelledTotalsOnBothSides) {
    EXPECT_THROW(read_count_table(grid({{30, 45, 75}, {10, 80, 90}, {40, 125, 165}})), Error);
}

TEST(TotalLines, FindsATotalAtTheTopToo) {
    expect_error([] { read_count_table(grid({{40, 125}, {30, 45}, {10, 80}})); },
                 "row 1 holds the sum of rows 2–3 in every column, so it looks like a total, and a total must not be "
                 "tested as if it held more counts; leave it out of the range, or label it \"Total\" (it is then set "
                 "aside). If it does hold counts, give the rows labels");
}

TEST(TotalLines, KeepsALineLabelledAsDataThatHoldsTheSumButDoubtsIt) {
    const CountTable read =
        read_count_table(grid({{"", "Yes", "No"}, {"North", 5, 9}, {"South", 7, 3}, {"East", 12, 12}}));
    EXPECT_EQ(read.rows(), 3u);
    ASSERT_EQ(read.doubts().size(), 1u);
    EXPECT_EQ(read.doubts()[0], "The row \"East\" holds the sum of the other rows in every column: if it is a total, "
                                "leave it out of the range or label it \"Total\"; it was tested as counts.");
    EXPECT_EQ(check_validity(read).summary().rfind("Doubtful: The row \"East\"", 0), 0u);
}

// "All staff", "Company": labels that name everyone, on a line that holds the sum of the others.
TEST(TotalLines, SetsAsideALineNamingEveryoneThatHoldsTheSum) {
    for (const char* label : {"All staff", "Company", "Overall figure", "Whole company"}) {
        const CountTable read =
            read_count_table(grid({{"", "Yes", "No"}, {label, 12, 12}, {"North", 5, 9}, {"South", 7, 3}}));
        EXPECT_EQ(read.rows(), 2u) << label;
        EXPECT_TRUE(read.doubts().empty()) << label;
        EXPECT_NE(check_validity(read).summary().find(std::string("The row \"") + label +
                                                      "\" is a total and was set aside."),
                  std::string::npos)
            << label << ": " << check_validity(read).summary();
    }
}

// "N", "Headcount": a column of group sizes beside the counts, as workbooks put it. Set aside, it
// leaves the same test as the table without it (an identity).
TEST(TotalLines, SetsAsideALineNamingTheGroupsSizeThatHoldsTheSum) {
    const double without = independence_test(read_count_table(without_totals()), Method::pearson).p_value;
    for (const char* label : {"N", "n", "Count", "Headcount", "Number of staff", "Respondents", "Base", "Anzahl",
                              "Effectif", "Aantal"}) {
        const CountTable read = read_count_table(
            grid({{"", "Promoted", "Not promoted", label}, {"Sales", 30, 45, 75}, {"Legal", 10, 80, 90}}));
        EXPECT_EQ(read.columns(), 2u) << label;
        EXPECT_TRUE(read.doubts().empty()) << label;
        EXPECT_EQ(independence_test(read, Method::pearson).p_value, without) << label;
        EXPECT_NE(check_validity(read).summary().find(std::string("The column \"") + label +
                                                      "\" is a total and was set aside."),
                  std::string::npos)
            << label << ": " << check_validity(read).summary();
    }
}

// A group called "Staff" is data unless it holds the sum; "No" is an answer even when it does.
TEST(TotalLines, KeepsAGroupNamedLikeASizeThatDoesNotHoldTheSum) {
    const CountTable read =
        read_count_table(grid({{"", "Managers", "Staff"}, {"Promoted", 4, 26}, {"Not promoted", 6, 39}, {"Left", 1, 9}}));
    EXPECT_EQ(read.columns(), 2u);
    EXPECT_TRUE(read.doubts().empty());
}

// "N" beside Yes and No, but larger than their sum (some people did not answer): no group, so doubted.
TEST(TotalLines, DoubtsALineLabelledAsANumberThatDoesNotHoldTheSum) {
    const CountTable read =
        read_count_table(grid({{"", "Yes", "No", "N"}, {"Sales", 30, 45, 80}, {"Legal", 10, 80, 95}}));
    EXPECT_EQ(read.columns(), 3u);
    ASSERT_EQ(read.doubts().size(), 1u);
    EXPECT_EQ(read.doubts()[0], "The column \"N\" is labelled as a number of people or cases, but it does not hold the "
                                "sum of the other columns, so it was tested as a group of its own; if it gives the "
                                "groups' sizes, leave it out of the range.");
}

TEST(TotalLines, KeepsAnAnswerNamedNoThatHoldsTheSumButDoubtsIt) {
    const CountTable read =
        read_count_table(grid({{"", "Yes", "Maybe", "No"}, {"North", 5, 9, 14}, {"South", 7, 3, 10}}));
    EXPECT_EQ(read.columns(), 3u);
    ASSERT_EQ(read.doubts().size(), 1u);
    EXPECT_EQ(read.doubts()[0].rfind("The column \"No\" holds the sum of the other columns in every row", 0), 0u);
}

// A survey answer such as "All of the time" is data: by its label alone it is never a total.
TEST(TotalLines, KeepsALineNamingEveryoneThatDoesNotHoldTheSum) {
    const CountTable read =
        read_count_table(grid({{"", "Yes", "No"}, {"All of the time", 12, 10}, {"Sometimes", 5, 9}, {"Never", 7, 3}}));
    EXPECT_EQ(read.rows(), 3u);
    EXPECT_TRUE(read.doubts().empty());
}

TEST(TotalLines, SetsAsideALabelledTotalThatIsNotTheSumButDoubtsIt) {
    const CountTable read = read_count_table(grid({{"", "Yes", "No"}, {"North", 5, 9}, {"South", 7, 3}, {"Total", 20, 12}}));
    EXPECT_EQ(read.rows(), 2u);
    ASSERT_EQ(read.doubts().size(), 1u);
    EXPECT_EQ(read.doubts()[0], "The row \"Total\" was set aside as a total, but it does not hold the sum of the other "
                                "rows; check that it is a total and that no row is missing.");
}

TEST(TotalLines, AcceptsSubtotalsThatHoldTheSumOfTheirBlock) {
    const CountTable read = read_count_table(grid({{"", "Yes", "No"},
                                                   {"North A", 5, 9},
                                                   {"North B", 7, 3},
                                                   {"Subtotal North", 12, 12},
                                                   {"South A", 4, 6},
                                                   {"South B", 2, 8},
                                                   {"Subtotal South", 6, 14},
                                                   {"Total", 18, 26}}));
    EXPECT_EQ(read.rows(), 4u);
    EXPECT_TRUE(read.doubts().empty());
    EXPECT_TRUE(contains(check_validity(read).summary(),
                         "The rows \"Subtotal North\", \"Subtotal South\" and \"Total\" are totals and were set aside."));
}

// A single row cannot show a total well: 5 = 3 + 2 is a coincidence, not a total.
TEST(TotalLines, TakesNoCoincidenceInASingleLineForATotal) {
    EXPECT_EQ(goodness_of_fit(grid({{5, 3, 2}})).categories, 3u);
}

TEST(TotalLines, RefusesATotalAtTheEndOfALongSingleColumnOfCounts) {
    expect_error([] { goodness_of_fit(grid({{315}, {108}, {101}, {32}, {556}})); },
                 "row 5 holds the sum of rows 1–4 in every column, so it looks like a total, and a total must not be "
                 "tested as if it held more counts; leave it out of the range, or label it \"Total\" (it is then set "
                 "aside). If it does hold counts, give the rows labels");
}

TEST(TotalLines, KnowsALabelThatEndsInTheWordForATotal) {
    for (const char* word : {"Row total", "Department totals", "Office subtotal"}) {
        const CountTable read = read_count_table(grid({{"", "Yes", "No"}, {"North", 5, 9}, {"South", 7, 3}, {word, 12, 12}}));
        EXPECT_EQ(read.rows(), 2u) << word;
    }
    // A name that only contains the word is no total ("Lump sum" is a way of paying).
    EXPECT_EQ(read_count_table(grid({{"", "Yes", "No"}, {"North", 5, 9}, {"South", 7, 3}, {"Lump sum", 2, 8}})).rows(), 3u);
}

// Invented: promotions in two groups of departments, each followed by its subtotal.
TEST(TotalLines, RefusesASubtotalWithoutALabelInsideTheTable) {
    expect_error([] {
        read_count_table(grid({{"Dept", "Yes", "No"}, {"Sales", 30, 45}, {"Legal", 10, 80}, {"", 40, 125},
                               {"Audit", 22, 41}, {"Tax", 5, 9}}));
    },
                 "row 4 holds the sum of rows 2–3 above it in every column, so it looks like a subtotal, and a subtotal "
                 "must not be tested as if it held more counts; label it \"Subtotal\" (it is then set aside) or delete "
                 "it. If it does hold counts, give the rows labels");
}

TEST(TotalLines, DoubtsALineLabelledAsDataThatHoldsTheSumOfTheLinesAboveIt) {
    const CountTable read = read_count_table(grid({{"Dept", "Yes", "No"}, {"Sales", 30, 45}, {"Legal", 10, 80},
                                                   {"Front office", 40, 125}, {"Audit", 22, 41}, {"Tax", 5, 9}}));
    EXPECT_EQ(read.rows(), 5u);
    ASSERT_EQ(read.doubts().size(), 1u);
    EXPECT_EQ(read.doubts()[0], "The row \"Front office\" holds the sum of rows 2–3 above it in every column: if it is "
                                "a subtotal, label it \"Subtotal\" (it is then set aside); it was tested as counts.");
}

TEST(TotalLines, TakesNoSumOfTheLinesAboveAtASinglePositionForASubtotal) {
    const CountTable read = read_count_table(grid({{"Dept", "Yes", "No"}, {"Sales", 3, 0}, {"Legal", 2, 0},
                                                   {"Audit", 5, 4}, {"Tax", 5, 9}}));
    EXPECT_TRUE(read.doubts().empty());
}

TEST(SummaryLines, AreRefusedWhenLabelledAsAPercentageAverageOrRateAndNotWhole) {
    for (const char* label : {"% promoted", "Average", "Promotion rate", "Share (%)", "Mittelwert"}) {
        EXPECT_THROW(read_count_table(grid({{"Dept", "Yes", "No", label}, {"Sales", 30, 45, 0.4}, {"Legal", 10, 80, 0.11},
                                            {"Audit", 22, 41, 0.35}})),
                     Error)
            << label;
    }
    expect_error([] {
        read_count_table(grid({{"Dept", "Yes", "No"}, {"Sales", 30, 45}, {"Legal", 10, 80}, {"Average", 20, 62.5}}));
    },
                 "the row \"Average\" holds the number 62.5, not a whole number, under a label that names a percentage, "
                 "an average or a rate, so it holds no counts; leave it out of the range (the tests need the number of "
                 "people or items in each cell)");
}

TEST(SummaryLines, AreRefusedWhenLabelledAsPercentagesEvenWhenWhole) {
    expect_error([] {
        read_count_table(grid({{"Dept", "Yes %", "No %"}, {"Sales", 40, 60}, {"Legal", 11, 89}, {"Audit", 35, 65}}));
    },
                 "the column \"Yes %\" is labelled as percentages and holds numbers from 0 to 100, so it holds no "
                 "counts; leave it out of the range, or enter the counts (the tests need the number of people or items "
                 "in each cell)");
}

// Categories can carry such words: bands of a pay rise, ratings around the average.
TEST(SummaryLines, KeepLinesOfWholeCountsWhateverTheirLabels) {
    const CountTable read = read_count_table(grid({{"Rise", "Yes", "No"}, {"0-2%", 30, 45}, {"2-4%", 10, 80},
                                                   {"Above average", 22, 41}, {"Flat rate", 3, 7}}));
    EXPECT_EQ(read.rows(), 4u);
    EXPECT_TRUE(read.doubts().empty()) << read.doubts().front();
}

// "Media" is a department in English, though the word for an average in Spanish and Italian.
TEST(SummaryLines, KeepAMediaDepartmentOfWeightedCounts) {
    const CountTable read = read_count_table(grid({{"Dept", "Yes", "No"}, {"Sales", 30.5, 45}, {"Media", 10.25, 80}}));
    EXPECT_EQ(read.rows(), 2u);
}

// Invented: a row of averages under promotions by department, rounded to whole numbers
// ((30 + 10 + 20) / 3 = 20, (45 + 80 + 61) / 3 = 62).
TEST(SummaryLines, OfWholeNumbersAreDoubtedAsAnAverageAtTheEndWithinTheOthers) {
    const CountTable read = read_count_table(
        grid({{"Dept", "Yes", "No"}, {"Sales", 30, 45}, {"Legal", 10, 80}, {"Audit", 20, 61}, {"Average", 20, 62}}));
    EXPECT_EQ(read.rows(), 4u);
    ASSERT_EQ(read.doubts().size(), 1u);
    EXPECT_EQ(read.doubts()[0], "The row \"Average\" is labelled as an average, a rate or a share, not as a number of "
                                "people or items, and was tested as counts; if it is no group of its own, leave it out "
                                "of the range.");
    EXPECT_EQ(check_validity(read).summary().rfind("Doubtful:", 0), 0u);
}

// A rating scale: "Average" between "Poor" and "Good" is an answer.
TEST(SummaryLines, OfWholeNumbersAreNotDoubtedAsARatingInTheMiddleOfAScale) {
    const CountTable read = read_count_table(
        grid({{"Group", "Poor", "Average", "Good", "Excellent"}, {"Women", 10, 30, 25, 8}, {"Men", 12, 28, 22, 9}}));
    EXPECT_TRUE(read.doubts().empty());
}

// Invented: 12 of 42 is 28.6%, 8 of 33 is 24.2%, 15 of 35 is 42.9%, typed rounded as 29, 24, 43.
TEST(SummaryLines, OfWholeNumbersAreDoubtedAsARateThatIsThePercentageOfAnotherLine) {
    const CountTable read = read_count_table(grid({{"Dept", "Promoted", "Not promoted", "Rate"},
                                                   {"Sales", 12, 30, 29},
                                                   {"Legal", 8, 25, 24},
                                                   {"Audit", 15, 20, 43}}));
    ASSERT_EQ(read.doubts().size(), 1u);
    EXPECT_TRUE(contains(read.doubts()[0], "The column \"Rate\" is labelled as an average, a rate or a share"));
}

TEST(NotCountsLines, ATargetOrAnExpectedNumberBesideTheCountsIsDoubted) {
    for (const char* label : {"Expected", "Target", "Budget", "Plan 2026", "Forecast", "Soll", "Objectif"}) {
        const CountTable read =
            read_count_table(grid({{"Office", "Observed", label}, {"North", 10, 12}, {"South", 20, 18}, {"East", 15, 15}}));
        EXPECT_EQ(read.columns(), 2u) << label;
        ASSERT_EQ(read.doubts().size(), 1u) << label;
        EXPECT_EQ(read.doubts()[0], "The column \"" + std::string(label) +
                                        "\" is labelled as a target, a plan or an expected number, not as a number of "
                                        "people or items, and was tested as counts; if it is no group of its own, "
                                        "leave it out of the range.");
    }
}

TEST(NotCountsLines, OutcomesNamedAfterATargetAreNotDoubted) {
    for (const std::vector<const char*>& labels :
         {std::vector<const char*>{"Below target", "On target", "Above target"},
          std::vector<const char*>{"Target met", "Target missed", "No target"},
          std::vector<const char*>{"Within budget", "Over budget", "No budget"}}) {
        const CountTable read = read_count_table(
            grid({{"Team", labels[0], labels[1], labels[2]}, {"North", 10, 12, 4}, {"South", 20, 18, 6}}));
        EXPECT_TRUE(read.doubts().empty()) << labels[0];
    }
}

TEST(NotCountsLines, ADifferenceIsDoubtedButATeamNamedAfterChangeIsNot) {
    const CountTable difference = read_count_table(
        grid({{"Dept", "Left", "Stayed"}, {"Sales", 12, 30}, {"Legal", 8, 25}, {"Net change vs last year", 3, 2}}));
    ASSERT_EQ(difference.doubts().size(), 1u);
    EXPECT_TRUE(contains(difference.doubts()[0], "is labelled as a difference or a change")) << difference.doubts()[0];
    const CountTable team = read_count_table(
        grid({{"Dept", "Left", "Stayed"}, {"Sales", 12, 30}, {"Legal", 8, 25}, {"Change management", 3, 7}}));
    EXPECT_TRUE(team.doubts().empty());
}

TEST(NotCountsLines, ARunningCountIsDoubted) {
    const CountTable read =
        read_count_table(grid({{"Band", "New", "Cumulative"}, {"A", 10, 10}, {"B", 20, 30}, {"C", 15, 45}}));
    ASSERT_EQ(read.doubts().size(), 1u);
    EXPECT_TRUE(contains(read.doubts()[0], "The column \"Cumulative\" is labelled as a running count"));
}

// Invented: invoice amounts in euros, not invoices, by region and payment outcome.
TEST(NotCountsLines, AmountsOfMoneyOrTimeAreDoubtedEvenWhenEveryLineNamesOne) {
    const CountTable read = read_count_table(grid({{"Region", "Amount on time (EUR)", "Amount late (EUR)"},
                                                   {"North", 125000, 38000},
                                                   {"South", 98000, 41000}}));
    ASSERT_EQ(read.doubts().size(), 1u);
    EXPECT_EQ(read.doubts()[0], "Columns 2–3 are labelled as amounts of money or time, not as a number of people or "
                                "items, and were tested as counts; the tests need the number of people or items in "
                                "each cell, and on amounts their p-value means nothing.");
    for (const char* label : {"Salary", "Hours overtime", "Cost (€)", "Revenue $", "Gehalt"}) {
        const CountTable one =
            read_count_table(grid({{"Team", "Staff", label}, {"North", 10, 1200}, {"South", 20, 1800}}));
        EXPECT_EQ(one.doubts().size(), 1u) << label;
    }
}

TEST(NotCountsLines, BandsAndKindsOfPayOrHoursAreCategories) {
    const CountTable read = read_count_table(grid({{"Pattern", "Left", "Stayed"},
                                                   {"Flexible hours", 5, 20},
                                                   {"Under 30 hours", 3, 9},
                                                   {"Salary band A", 10, 30},
                                                   {"€20k–30k", 12, 28},
                                                   {"Late payment", 4, 6}}));
    EXPECT_TRUE(read.doubts().empty()) << read.doubts().front();
}

// Invented: promotions by department with each department's average age typed beside the counts.
TEST(NotCountsLines, AMeasureOfEachGroupBesideTheCountsIsDoubted) {
    const CountTable read = read_count_table(grid({{"Dept", "Yes", "No", "Age"},
                                                   {"Sales", 12, 30, 41},
                                                   {"Legal", 5, 22, 38},
                                                   {"IT", 9, 14, 35}}));
    ASSERT_EQ(read.doubts().size(), 1u);
    EXPECT_EQ(read.doubts()[0], "The column \"Age\" is labelled as a measure of each group (an age, a score, an index, "
                                "a spread), not as a number of people or items, and was tested as counts; the tests "
                                "need the number of people or items in each cell; leave it out of the range.");
    EXPECT_EQ(check_validity(read).summary().rfind("Doubtful:", 0), 0u);
    for (const char* label : {"Score", "Index", "Std. dev.", "FTE", "Year", "Years of service", "Rating"}) {
        const CountTable one =
            read_count_table(grid({{"Team", "Yes", "No", label}, {"North", 10, 12, 7}, {"South", 20, 18, 9}}));
        EXPECT_EQ(one.doubts().size(), 1u) << label;
    }
}

TEST(NotCountsLines, CategoriesThatNameAMeasureAmongOtherWordsAreNotDoubted) {
    const CountTable read = read_count_table(grid({{"Tenure", "Less than a year", "Retirement age", "Low score",
                                                    "High score"},
                                                   {"North", 5, 2, 7, 9},
                                                   {"South", 3, 4, 6, 8}}));
    EXPECT_TRUE(read.doubts().empty()) << read.doubts().front();
}

TEST(RepeatedLabels, AreDoubtedAsOneGroupSplitOrCopied) {
    const CountTable read =
        read_count_table(grid({{"Dept", "Yes", "No"}, {"Sales", 30, 45}, {"Legal", 10, 80}, {"Sales", 22, 41}}));
    EXPECT_EQ(read.rows(), 3u);
    ASSERT_EQ(read.doubts().size(), 1u);
    EXPECT_EQ(read.doubts()[0], "Rows 2 and 4 have the same label, \"Sales\", and were tested as different rows; if they "
                                "are one group, add their counts together.");
    EXPECT_EQ(check_validity(read).summary().rfind("Doubtful:", 0), 0u);
}

TEST(Percentages, AreRefusedWhenEveryRowAddsUpToAHundred) {
    expect_error([] { read_count_table(grid({{"", "Yes", "No"}, {"North", 12.5, 87.5}, {"South", 40.2, 59.8}})); },
                 "every row adds up to 100 and some entries are not whole numbers, so these look like percentages, not "
                 "counts; the tests need the number of people (or items) in each cell, which a percentage hides: enter "
                 "the counts instead");
}

TEST(Percentages, AreRefusedAsSharesWhenEveryColumnAddsUpToOne) {
    expect_error([] { read_count_table(grid({{0.25, 0.6}, {0.75, 0.4}})); },
                 "every column adds up to 1 and some entries are not whole numbers, so these look like shares "
                 "(proportions), not counts; the tests need the number of people (or items) in each cell, which a "
                 "share hides: enter the counts instead");
}

TEST(Percentages, AreRefusedWhenTheWholeTableAddsUpToAHundred) {
    expect_error([] { read_count_table(grid({{10.5, 30}, {20, 39.5}})); },
                 "the entries add up to 100 and some are not whole numbers, so these look like percentages of the whole "
                 "table, not counts; the tests need the number of people (or items) in each cell: enter the counts "
                 "instead");
}

TEST(Percentages, OfWholeNumbersThatAddUpToExactlyAHundredPerRowAreDoubted) {
    const CountTable read = read_count_table(grid({{60, 40}, {35, 65}}));
    ASSERT_EQ(read.doubts().size(), 1u);
    EXPECT_EQ(read.doubts()[0], "Every row adds up to exactly 100: if these are percentages, enter the counts instead "
                                "(the tests need the number of people in each cell); if each row really counts 100 "
                                "people, this can be ignored.");
}

// Whole percentages rounded: 33 + 33 + 33 = 99, 17 + 17 + 67 = 101.
TEST(Percentages, OfWholeNumbersThatAddUpToAHundredWithinRoundingPerRowAreDoubted) {
    const CountTable read = read_count_table(grid({{33, 33, 33}, {17, 17, 67}, {50, 25, 25}}));
    ASSERT_EQ(read.doubts().size(), 1u);
    EXPECT_EQ(read.doubts()[0], "Every row adds up to 99, 100 or 101, as percentages rounded to whole numbers do: if "
                                "these are percentages, enter the counts instead (the tests need the number of people in "
                                "each cell); if each row really counts about 100 people, this can be ignored.");
}

TEST(Percentages, OfWholeNumbersAreNotDoubtedWhenARowAddsUpToMore) {
    EXPECT_TRUE(read_count_table(grid({{33, 33, 33}, {17, 17, 69}})).doubts().empty());
}

TEST(Percentages, ArePlainWeightedCountsWhenTheLinesAddUpToOtherTotals) {
    EXPECT_NO_THROW(read_count_table(grid({{12.5, 87.5}, {40.2, 70.8}})));
}

TEST(Percentages, AreAllowedAsExpectedShares) {
    // Mendel's dihybrid cross against 9:3:3:1 given as percentages (published_values.md section 6:
    // X² = 196/417 exactly; the shares are the same ratios).
    const GoodnessOfFit fit = goodness_of_fit(grid({{315, 108, 101, 32}}), grid({{56.25, 18.75, 18.75, 6.25}}));
    EXPECT_NEAR(fit.statistic, 196.0 / 417.0, 1e-13);
}

// Functions without the chi-squared verdict pass on what was set aside, for ASSOC.CHECK to say.
// Exact identity: each gives what it gives on the table without its total row and column.
TEST(TotalLines, AreNamedByTheFunctionsThatReadTheTableWithoutTheVerdict) {
    const CellGrid with_totals = grid({{"", "Yes", "No", "Total"}, {"A", 10, 30, 40}, {"B", 5, 40, 45}, {"Total", 15, 70, 85}});
    const CellGrid plain = grid({{"", "Yes", "No"}, {"A", 10, 30}, {"B", 5, 40}});
    const std::vector<std::string> said = {"The row \"Total\" is a total and was set aside.",
                                           "The column \"Total\" is a total and was set aside."};
    EXPECT_EQ(rate_difference(with_totals).remarks, said);
    EXPECT_EQ(rate_difference(with_totals).difference, rate_difference(plain).difference);
    EXPECT_EQ(trend_test(with_totals).remarks, said);
    EXPECT_EQ(trend_test(with_totals).z, trend_test(plain).z);
    EXPECT_EQ(ordinal_test(with_totals).remarks, said);
    EXPECT_EQ(ordinal_test(with_totals).statistic, ordinal_test(plain).statistic);
    EXPECT_TRUE(rate_difference(plain).remarks.empty());
}

TEST(TotalLines, AreNamedByThePairedTestBeforeItsOwnRemarks) {
    const PairedResult result =
        paired_test(grid({{"Before/After", "Yes", "No", "Total"}, {"Yes", 20, 5, 25}, {"No", 15, 30, 45}, {"Total", 35, 35, 70}}));
    ASSERT_GE(result.remarks.size(), 2u);
    EXPECT_EQ(result.remarks[0], "The row \"Total\" is a total and was set aside.");
    EXPECT_EQ(result.remarks[1], "The column \"Total\" is a total and was set aside.");
    EXPECT_EQ(result.statistic, paired_test(grid({{20, 5}, {15, 30}})).statistic);
}

// Invented: a summary of survey answers whose blank answers were gathered under "(empty)".
TEST(MissingValueLines, AreDoubtedAsPeopleWithoutAnAnswerTestedAsAGroup) {
    const CountTable read =
        read_count_table(grid({{"Dept", "Yes", "No", "(empty)"}, {"Sales", 12, 30, 3}, {"Legal", 8, 25, 2}}));
    EXPECT_EQ(read.columns(), 3u);
    ASSERT_EQ(read.doubts().size(), 1u);
    EXPECT_EQ(read.doubts()[0], "The column \"(empty)\" is labelled as a missing value and was tested as a group of "
                                "its own; if it holds people or items without an answer, leave it out of the range; if "
                                "it is an answer (\"Not applicable\"), write it in words.");
    for (const char* label : {"n/a", "N/A", "#N/A", "-", "?", "NaN", "null", "(blank)"}) {
        const CountTable other =
            read_count_table(grid({{"Dept", "Yes", "No"}, {"Sales", 12, 30}, {"Legal", 8, 25}, {label, 3, 2}}));
        EXPECT_EQ(other.doubts().size(), 1u) << label;
    }
}

TEST(MissingValueLines, AnEmptySpacerLineSoLabelledIsOnlySetAside) {
    const CountTable read = read_count_table(
        grid({{"Dept", "Yes", "-", "No"}, {"Sales", 12, "", 30}, {"Legal", 8, "", 25}}));
    EXPECT_TRUE(read.doubts().empty());
    EXPECT_EQ(read.set_aside_columns().size(), 1u);
}

TEST(MissingValueLines, AnAnswerInWordsIsNoMissingValue) {
    const CountTable read = read_count_table(grid({{"Dept", "Yes", "No", "Not applicable", "No answer"},
                                                   {"Sales", 12, 30, 3, 2},
                                                   {"Legal", 8, 25, 2, 4}}));
    EXPECT_TRUE(read.doubts().empty());
}

// Invented: a report that breaks a department down ("of which managers"), as finance reports do.
TEST(PartLines, AreRefusedWhenNoCountIsLargerThanInTheLineBefore) {
    expect_error([] {
        read_count_table(grid({{"Dept", "Yes", "No"}, {"Sales", 12, 30}, {"- of which managers", 3, 8}, {"Legal", 8, 25}}));
    },
                 "the row \"- of which managers\" reads as a part of what the rows before it count (its label says "
                 "so, and none of its counts is larger than in the row \"Sales\"), so its people would be counted "
                 "twice; leave it out of the range, or subtract it from the row it is a part of to make two groups");
}

TEST(PartLines, AreKnownInOtherLanguagesAndAfterABullet) {
    for (const char* label : {"of which: managers", "Thereof managers", "davon Führung", "• dont cadres", "incl. temps"}) {
        EXPECT_THROW(read_count_table(grid({{"Dept", "Yes", "No"}, {"Sales", 12, 30}, {label, 3, 8}, {"Legal", 8, 25}})),
                     Error)
            << label;
    }
}

TEST(PartLines, AreDoubtedWhenLargerThanTheLineBefore) {
    const CountTable read =
        read_count_table(grid({{"Dept", "Yes", "No"}, {"Sales", 12, 30}, {"of which managers", 13, 8}, {"Legal", 8, 25}}));
    ASSERT_EQ(read.doubts().size(), 1u);
    EXPECT_EQ(read.doubts()[0], "The row \"of which managers\" is labelled as a part of another row, and was tested as "
                                "a group of its own; if its people are counted in another row too, leave it out of the "
                                "range.");
}

TEST(PartLines, AreNotWordsThatOnlyBeginTheSame) {
    const CountTable read = read_count_table(
        grid({{"Dept", "Yes", "No"}, {"Sales", 12, 30}, {"Inclusion team", 3, 8}, {"Dontnet office", 8, 25}}));
    EXPECT_TRUE(read.doubts().empty());
}

// A row numbering the columns under the header (1, 2) was tested as a group of people.
TEST(UnlabelledLines, AmongLabelledOnesAreDoubted) {
    const CountTable read =
        read_count_table(grid({{"Dept", "Yes", "No"}, {"", 1, 2}, {"Sales", 12, 30}, {"Legal", 8, 25}}));
    EXPECT_EQ(read.rows(), 3u);
    ASSERT_EQ(read.doubts().size(), 1u);
    EXPECT_EQ(read.doubts()[0], "Row 2 has no label, unlike the other rows, and was tested as a group; if it numbers the "
                                "columns or holds something other than counts, leave it out of the range, and if it is "
                                "a group, label it.");
}

TEST(UnlabelledLines, WithoutCountsAreOnlySetAside) {
    const CountTable read =
        read_count_table(grid({{"Dept", "Yes", "No"}, {"Sales", 12, 30}, {"", "", ""}, {"Legal", 8, 25}}));
    EXPECT_TRUE(read.doubts().empty());
}


// Invented: the number hired beside the number of applicants, as a sheet of selection rates has them;
// read as a table of counts it would count each person hired twice.
TEST(PartBesideWhole, IsRefusedWhenOneOfTwoColumnsNamesTheWholeGroupAndHoldsMore) {
    expect_error([] { read_count_table(grid({{"Office", "Hired", "Applicants"}, {"North", 10, 50}, {"South", 12, 40}})); },
                 "the column \"Applicants\" names the whole group and holds at least as many as the column \"Hired\" "
                 "in every row, so it reads as everyone, of whom the column \"Hired\" is a part: its people would be "
                 "counted twice, and the test would compare a part with the whole instead of with the rest; replace it "
                 "with the rest, its counts minus those of the column \"Hired\" (a table of counts holds each person "
                 "once)");
}

TEST(PartBesideWhole, IsRefusedForRowsAndForTotalsCountsAndEveryoneToo) {
    for (const char* whole : {"Total", "N", "Headcount", "All staff", "Whole company", "Candidates", "Everyone"}) {
        EXPECT_THROW(read_count_table(grid({{"", "North", "South", "East"}, {"Promoted", 4, 6, 3}, {whole, 20, 31, 9}})),
                     Error)
            << whole;
    }
}

TEST(PartBesideWhole, IsRefusedWhatEverTheOtherSidesTotalHolds) {
    // The "Total" row is set aside and takes no part in the comparison.
    EXPECT_THROW(read_count_table(grid({{"", "Hired", "Applicants"}, {"North", 10, 50}, {"South", 12, 40}, {"Total", 22, 9}})),
                 Error);
}

TEST(PartBesideWhole, KeepsAnAnswerThatBeginsWithAll) {
    // A survey scale ("All of the time | Some of the time") is not everyone beside a part.
    const CountTable read = read_count_table(
        grid({{"", "All of the time", "Some of the time"}, {"Sales", 20, 5}, {"Legal", 14, 9}}));
    EXPECT_EQ(read.columns(), 2u);
    EXPECT_TRUE(read.doubts().empty());
}

TEST(PartBesideWhole, KeepsAWholeGroupLabelThatIsSmallerSomewhere) {
    // "N" smaller than "Yes" in one row cannot hold everyone of that row; doubted as a count label.
    const CountTable read = read_count_table(grid({{"", "Yes", "N"}, {"Sales", 10, 50}, {"Legal", 40, 12}}));
    EXPECT_EQ(read.columns(), 2u);
    EXPECT_EQ(read.doubts().size(), 1u);
}

TEST(PartBesideWhole, KeepsAGroupNamedByAWordForPeople) {
    const CountTable read = read_count_table(grid({{"", "Managers", "Staff"}, {"Promoted", 4, 26}, {"Not promoted", 6, 39}}));
    EXPECT_EQ(read.columns(), 2u);
    EXPECT_TRUE(read.doubts().empty());
}
