// independence_test: the statistic of a method, its degrees of freedom and its p-value.
#include <gtest/gtest.h>

#include "assoc/chi_squared_distribution.hpp"
#include "assoc/statistics.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::counts_table;
using assoc::test::expect_error;

TEST(IndependenceTest, UsesPearsonsStatisticByDefault) {
    const CountTable t = counts_table({{23, 41, 17}, {31, 28, 22}});
    EXPECT_EQ(independence_test(t).statistic, pearson_statistic(t));
}

TEST(IndependenceTest, ReportsTheStatisticOfTheChosenMethod) {
    const CountTable t = counts_table({{12, 5}, {3, 10}});
    EXPECT_EQ(independence_test(t, Method::likelihood_ratio).statistic, likelihood_ratio_statistic(t));
    EXPECT_EQ(independence_test(t, Method::yates).statistic, yates_statistic(t));
}

TEST(IndependenceTest, ReportsTheUpperTailPValueOfItsStatistic) {
    const CountTable t = counts_table({{23, 41, 17, 9}, {31, 28, 22, 14}, {12, 19, 30, 25}});
    for (Method method : {Method::pearson, Method::likelihood_ratio}) {
        const TestResult result = independence_test(t, method);
        EXPECT_EQ(result.p_value, chi_squared_p_value(result.statistic, result.df));
    }
}

TEST(IndependenceTest, GivesAPValueOfOneForAProportionalTable) {
    // Exact identity: X² = 0 and P(χ² ≥ 0) = 1.
    const TestResult result = independence_test(counts_table({{2, 4, 6}, {3, 6, 9}}));
    EXPECT_EQ(result.statistic, 0.0);
    EXPECT_EQ(result.p_value, 1.0);
}

TEST(IndependenceTest, HandlesAProportionalTableWithHundredsOfDegreesOfFreedom) {
    // Regression: a 25×26 table with X² = 0 has df 600, where Boost's series threw an overflow error.
    Matrix counts(25, 26);
    for (std::size_t r = 0; r < 25; ++r)
        for (std::size_t c = 0; c < 26; ++c) counts(r, c) = static_cast<double>((r + 1) * (c + 1));
    const TestResult result = independence_test(CountTable::from_counts(counts));
    EXPECT_EQ(result.df, 600.0);
    EXPECT_EQ(result.statistic, 0.0);
    EXPECT_EQ(result.p_value, 1.0);
}

TEST(DegreesOfFreedom, AreRowsLessOneTimesColumnsLessOne) {
    // Definition: df = (r − 1)(c − 1) (common practice; e.g. Agresti 2007, section 2.4).
    EXPECT_EQ(degrees_of_freedom(counts_table({{1, 2, 3, 4}, {5, 6, 7, 8}, {9, 1, 2, 3}})), 6.0);
    EXPECT_EQ(degrees_of_freedom(counts_table({{1, 2}, {3, 4}})), 1.0);
}

TEST(DegreesOfFreedom, CountOnlyRowsAndColumnsThatHoldCounts) {
    // A 4×4 body with one empty row and one empty column is a 3×3 table: df 4.
    EXPECT_EQ(degrees_of_freedom(counts_table({{1, 0, 2, 3}, {0, 0, 0, 0}, {4, 0, 5, 6}, {7, 0, 8, 9}})), 4.0);
}

TEST(IndependenceTest, RejectsYatesOnALargerTable) {
    expect_error([] { independence_test(counts_table({{1, 2}, {3, 4}, {5, 6}}), Method::yates); },
                 "Yates' correction applies to 2×2 tables only; this table has 3 rows and 2 columns with counts");
}

TEST(MethodName, NamesEachMethodInPlainWords) {
    EXPECT_EQ(method_name(Method::pearson), "Pearson X²");
    EXPECT_EQ(method_name(Method::likelihood_ratio), "likelihood-ratio G²");
    EXPECT_EQ(method_name(Method::yates), "Yates-corrected X²");
}
