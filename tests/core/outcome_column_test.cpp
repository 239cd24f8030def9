// The measures of a 2×2 table's column 1 (odds ratio, risk ratio, rates, rate difference, and the
// common ratios of strata) refuse a table whose first column of counts reads as the absence of another
// ("No" before "Yes", as a pivot table sorts them): they would measure not having the outcome. The
// tables are invented; the refusals are about reading, and the value checked when a table passes is
// the cross-product ratio (10·30)/(40·20) = 0.375, an exact identity.
#include <gtest/gtest.h>

#include <string>

#include "assoc/common_risk_ratio.hpp"
#include "assoc/mantel_haenszel.hpp"
#include "assoc/odds_ratio.hpp"
#include "assoc/rates.hpp"
#include "assoc/risk_ratio.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;
using assoc::test::table;

namespace {

std::string refusal(const std::string& outcome, const std::string& other, const std::string& measure) {
    return "the first column of counts, \"" + outcome + "\", reads as the absence of the column \"" + other +
           "\", and the first column is the outcome: " + measure + " would measure \"" + outcome + "\", not \"" +
           other + "\" (a table in sorted order, as a pivot table is, puts \"No\" before \"Yes\"); put the column \"" +
           other + "\" first. If \"" + outcome + "\" is the outcome you mean, leave the header row out of the range";
}

CountTable with_columns(const char* first, const char* second) {
    return table({{"Group", first, second}, {"Women", 10, 40}, {"Men", 20, 30}});
}

}  // namespace

TEST(OutcomeColumn, OddsRatioRefusesNoBeforeYes) {
    expect_error([] { odds_ratio(with_columns("No", "Yes")); }, refusal("No", "Yes", "the odds ratio"));
}

TEST(OutcomeColumn, OddsRatioRefusesTheOtherLabelNegated) {
    for (const auto& labels : {std::pair{"Not promoted", "Promoted"}, {"non-manager", "Manager"},
                               {"No exception", "Exception"}, {"Unsuccessful", "Successful"},
                               {"Without overtime", "With overtime"}, {"Promoted: no", "Promoted: yes"},
                               {"N", "Y"}, {"FALSE", "TRUE"}, {"Nein", "Ja"}, {"no - left", "yes - left"}}) {
        const char* const first = labels.first;
        const char* const second = labels.second;
        expect_error([&] { odds_ratio(with_columns(first, second)); }, refusal(first, second, "the odds ratio"));
    }
}

TEST(OutcomeColumn, OddsRatioTakesTheOutcomeFirstAndLabelsThatNegateNothing) {
    for (const auto& [first, second] : {std::pair{"Yes", "No"}, {"Promoted", "Not promoted"}, {"Hired", "Rejected"},
                                        {"Left", "Stayed"}, {"No", "Maybe"}, {"Not sure", "Promoted"},
                                        {"Inbound", "Outbound"}, {"Under 30", "30 and over"}})
        EXPECT_DOUBLE_EQ(odds_ratio(with_columns(first, second)).estimate, 0.375) << first << " | " << second;
}

TEST(OutcomeColumn, OddsRatioOfCountsWithoutAHeaderRowTakesColumnOneAsGiven) {
    // The way out the refusal names: the same counts without the header row, (10·30)/(40·20).
    EXPECT_DOUBLE_EQ(odds_ratio(table({{"Women", 10, 40}, {"Men", 20, 30}})).estimate, 0.375);
}

TEST(OutcomeColumn, RiskRatioRefusesNoBeforeYesBesideATotalColumn) {
    expect_error([] { risk_ratio(table({{"", "No", "Yes", "Total"}, {"Women", 40, 10, 50}, {"Men", 30, 20, 50}})); },
                 refusal("No", "Yes", "the risk ratio"));
}

TEST(OutcomeColumn, RatesRefuseAFirstColumnThatNegatesAnyOther) {
    expect_error([] { row_rates(grid({{"", "Not hired", "Withdrew", "Hired"}, {"Women", 10, 3, 40}, {"Men", 20, 4, 30}})); },
                 refusal("Not hired", "Hired", "the rates"));
}

TEST(OutcomeColumn, RateDifferenceRefusesNoBeforeYes) {
    expect_error([] { rate_difference(grid({{"", "No", "Yes"}, {"Women", 40, 10}, {"Men", 30, 20}})); },
                 refusal("No", "Yes", "the rate difference"));
}

TEST(OutcomeColumn, StackedStrataRefuseNoBeforeYesForTheCommonRatios) {
    const CellGrid strata = grid({{"Office", "Group", "No", "Yes"},
                                  {"North", "Women", 20, 5},
                                  {"", "Men", 18, 9},
                                  {"South", "Women", 25, 8},
                                  {"", "Men", 22, 12}});
    expect_error([&] { mantel_haenszel_test(strata); }, refusal("No", "Yes", "the common odds ratio"));
    expect_error([&] { common_risk_ratio(strata); }, refusal("No", "Yes", "the common risk ratio"));
}

TEST(OutcomeColumn, StrataOfOneRowEachRefuseEitherPairOfColumns) {
    expect_error(
        [] {
            common_risk_ratio(grid({{"Office", "Women promoted", "Women not promoted", "Men not promoted", "Men promoted"},
                                    {"North", 5, 20, 18, 9},
                                    {"South", 8, 25, 22, 12}}));
        },
        "the third column of counts, \"Men not promoted\", reads as the absence of the column \"Men promoted\", and the "
        "third column is the outcome: the common risk ratio would measure \"Men not promoted\", not \"Men promoted\" (a "
        "table in sorted order, as a pivot table is, puts \"No\" before \"Yes\"); put the column \"Men promoted\" before "
        "it. If \"Men not promoted\" is the outcome you mean, leave the header row out of the range");
}
