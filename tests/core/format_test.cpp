// Numbers as they are written into messages and report sentences (common practice: thousands
// separators for counts, significant digits for statistics, scientific notation for tiny p).
#include <gtest/gtest.h>

#include <cmath>

#include "assoc/format.hpp"

using namespace assoc;

TEST(FormatCount, GroupsThousandsWithCommas) {
    EXPECT_EQ(format_count(0), "0");
    EXPECT_EQ(format_count(999), "999");
    EXPECT_EQ(format_count(1000), "1,000");
    EXPECT_EQ(format_count(1234567), "1,234,567");
    EXPECT_EQ(format_count(-1234), "-1,234");
}

TEST(FormatCount, KeepsTheFractionOfAWeightedCount) { EXPECT_EQ(format_count(2.5), "2.5"); }

TEST(FormatCount, SwitchesToScientificNotationBeyondFifteenDigits) { EXPECT_EQ(format_count(1e15), "1e+15"); }

TEST(FormatNumber, ShowsSignificantDigitsWithoutTrailingZeros) {
    EXPECT_EQ(format_number(0.051234), "0.05123");
    EXPECT_EQ(format_number(3.841458820694124, 3), "3.84");
    EXPECT_EQ(format_number(2.0), "2");
}

TEST(FormatNumber, NamesNonFiniteValuesInWords) {
    EXPECT_EQ(format_number(std::nan("")), "not a number");
    EXPECT_EQ(format_number(HUGE_VAL), "infinity");
    EXPECT_EQ(format_number(-HUGE_VAL), "minus infinity");
}

TEST(FormatPValue, ShowsOrdinaryPValuesWithThreeSignificantDigits) {
    EXPECT_EQ(format_p_value(0.0234), "0.0234");
    EXPECT_EQ(format_p_value(0.001), "0.001");
    EXPECT_EQ(format_p_value(1), "1");
}

TEST(FormatPValue, ShowsTinyPValuesInScientificNotationSoTheirSizeIsVisible) {
    EXPECT_EQ(format_p_value(2.9535891832117595e-07), "3.0e-07");
    EXPECT_EQ(format_p_value(1e-300), "1.0e-300");
    EXPECT_EQ(format_p_value(0), "0");
}

TEST(FormatStatistic, ShowsOneDecimalForOrdinaryValues) {
    EXPECT_EQ(format_statistic(4.4962), "4.5");
    EXPECT_EQ(format_statistic(-5.3208), "-5.3");
    EXPECT_EQ(format_statistic(123456.74), "123456.7");
}

// Issue 9: a report on counts of 1e15 once wrote an adjusted residual with 30 digits.
TEST(FormatStatistic, ShowsHugeValuesInScientificNotation) {
    EXPECT_EQ(format_statistic(-34860834.438919716), "-3.49e+07");
    EXPECT_EQ(format_statistic(8.164965809277261e+153), "8.16e+153");
}
