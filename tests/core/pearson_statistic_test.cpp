// Pearson's X² = Σ (O − E)²/E. (Published and library checks: agresti_party_identification_test,
// library_reference_tables_test, large_count_accuracy_test.)
#include <gtest/gtest.h>

#include <cmath>

#include "assoc/statistics.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::counts_table;

namespace {

// n(ad − bc)² / (r1 r2 c1 c2) in doubles: exact integers up to the final division for small
// counts, a few roundings (each 1.1e-16 relative) for the larger tables.
double two_by_two_formula(double a, double b, double c, double d) {
    const double n = a + b + c + d, cross = a * d - b * c;
    return n * cross * cross / ((a + b) * (c + d) * (a + c) * (b + d));
}

}  // namespace

TEST(PearsonStatistic, OfATwoByTwoTableIsNTimesTheSquaredCrossDifferenceOverTheMargins) {
    // Exact identity for 2×2 tables: X² = n(ad − bc)² / (r1 r2 c1 c2).
    const double tables[][4] = {{12, 5, 3, 10}, {3, 1, 1, 3}, {189, 10845, 104, 10933},
                                {0, 10, 5, 5},  {1, 0, 0, 1}, {48, 17066, 38, 14464}};
    for (const auto& t : tables)
        EXPECT_NEAR_REL(pearson_statistic(counts_table({{t[0], t[1]}, {t[2], t[3]}})),
                        two_by_two_formula(t[0], t[1], t[2], t[3]), 1e-15)
            << t[0] << " " << t[1] << " " << t[2] << " " << t[3];
}

TEST(PearsonStatistic, OfTheSickLeaveTableIsTheExactFraction) {
    // Invented table [[12, 5], [3, 10]]: 30·105²/(17·13·15·15) = 330750/49725 (exact arithmetic).
    EXPECT_NEAR_REL(pearson_statistic(counts_table({{12, 5}, {3, 10}})), 330750.0 / 49725.0, 4e-16);
}

TEST(PearsonStatistic, IsExactlyZeroForAProportionalTable) {
    // Exact identity: proportional rows give O = E in every cell.
    EXPECT_EQ(pearson_statistic(counts_table({{2, 4, 6}, {3, 6, 9}})), 0.0);
}

TEST(PearsonStatistic, GrowsInProportionToTheCounts) {
    // Exact identity: X²(k·O) = k·X²(O); k a power of two keeps every count exact.
    const double base = pearson_statistic(counts_table({{23, 41, 17}, {31, 28, 22}}));
    EXPECT_NEAR_REL(pearson_statistic(counts_table({{23 * 1024., 41 * 1024., 17 * 1024.}, {31 * 1024., 28 * 1024., 22 * 1024.}})),
                    1024 * base, 1e-14);
}

TEST(PearsonStatistic, DoesNotDependOnTheOrderOrOrientationOfTheTable) {
    // Exact identity: X² is a sum over cells, unchanged by permuting rows or transposing.
    const double original = pearson_statistic(counts_table({{23, 41, 17}, {31, 28, 22}, {12, 19, 30}}));
    EXPECT_NEAR_REL(pearson_statistic(counts_table({{12, 19, 30}, {23, 41, 17}, {31, 28, 22}})), original, 1e-14);
    EXPECT_NEAR_REL(pearson_statistic(counts_table({{23, 31, 12}, {41, 28, 19}, {17, 22, 30}})), original, 1e-14);
}

TEST(PearsonStatistic, IsTheSameWithAnAllZeroRowSetAside) {
    // Definition (issue 2, item 1): an all-zero row is set aside, so the two tables are the same test.
    EXPECT_EQ(pearson_statistic(counts_table({{10, 4, 6}, {0, 0, 0}, {3, 9, 8}})),
              pearson_statistic(counts_table({{10, 4, 6}, {3, 9, 8}})));
}

TEST(PearsonStatistic, StaysFiniteForCountsNearOneE200) {
    // Exact identity X²(k·O) = k·X²(O) with X²([[1, 1], [1, 2]]) = 5·1²/(2·3·2·3) = 5/36.
    // Before the fix (d·(d/E) and scaled margins) this was NaN.
    EXPECT_NEAR_REL(pearson_statistic(counts_table({{1e200, 1e200}, {1e200, 2e200}})), 1e200 * 5 / 36, 1e-15);
    EXPECT_NEAR_REL(pearson_statistic(counts_table({{1e-200, 1e-200}, {1e-200, 2e-200}})), 1e-200 * 5 / 36, 1e-15);
}
