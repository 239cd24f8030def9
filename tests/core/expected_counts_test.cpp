// Expected counts E = R·C/n and the deviations O − E.
#include <gtest/gtest.h>

#include "assoc/expected_counts.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::counts_table;
using assoc::test::table;

TEST(ExpectedCounts, AreRowTotalTimesColumnTotalOverTheGrandTotal) {
    // Exact arithmetic: R = (10, 20), C = (12, 18), n = 30 → E = 4, 6, 8, 12.
    const Matrix expected = expected_counts(counts_table({{3, 7}, {9, 11}}));
    EXPECT_MATRIX_NEAR_REL(expected, (std::vector<double>{4, 6, 8, 12}), 1e-15);
}

TEST(ExpectedCounts, HaveTheMarginsOfTheObservedTable) {
    // Exact identity: Σ_c E = R and Σ_r E = C.
    const CountTable t = counts_table({{23, 41, 17, 9}, {31, 28, 22, 14}, {12, 19, 30, 25}});
    const Matrix expected = expected_counts(t);
    for (std::size_t r = 0; r < t.rows(); ++r) {
        double sum = 0;
        for (std::size_t c = 0; c < t.columns(); ++c) sum += expected(r, c);
        EXPECT_NEAR_REL(sum, t.row_total(r), 1e-14);
    }
    for (std::size_t c = 0; c < t.columns(); ++c) {
        double sum = 0;
        for (std::size_t r = 0; r < t.rows(); ++r) sum += expected(r, c);
        EXPECT_NEAR_REL(sum, t.column_total(c), 1e-14);
    }
}

TEST(ExpectedCounts, PutZeroInSetAsideRowsAndColumnsOfTheBodyShape) {
    // Body 3×3 with the middle row and middle column all zero; kept 2×2 [[1, 2], [3, 4]]:
    // R = (3, 7), C = (4, 6), n = 10 → E = 1.2, 1.8, 2.8, 4.2 (exact arithmetic).
    const CountTable t = table({{1, 0, 2}, {0, 0, 0}, {3, nullptr, 4}});
    const Matrix body = t.to_body_shape(expected_counts(t));
    EXPECT_MATRIX_NEAR_REL(body, (std::vector<double>{1.2, 0, 1.8, 0, 0, 0, 2.8, 0, 4.2}), 1e-15);
}

TEST(DeviationsFromExpected, AreExactlyZeroForAProportionalTable) {
    // [[1, 2], [2, 4]] and its 1e8 multiple are exactly independent (exact arithmetic).
    for (const CountTable& t : {counts_table({{1, 2}, {2, 4}}), counts_table({{1e8, 2e8}, {2e8, 4e8}}),
                                counts_table({{3, 6, 9}, {1, 2, 3}, {5, 10, 15}})}) {
        const Matrix deviations = deviations_from_expected(t);
        for (double d : deviations.values()) EXPECT_EQ(d, 0.0);
    }
}

TEST(DeviationsFromExpected, SumToZeroAlongEveryRowAndColumn) {
    // Exact identity: Σ_c (O − E) = R − R = 0.
    const CountTable t = counts_table({{12.5, 7.25, 3.1}, {8.4, 15.75, 6.6}, {4.2, 9.9, 18.05}});
    const Matrix d = deviations_from_expected(t);
    for (std::size_t r = 0; r < 3; ++r) EXPECT_NEAR(d(r, 0) + d(r, 1) + d(r, 2), 0.0, 1e-13);
    for (std::size_t c = 0; c < 3; ++c) EXPECT_NEAR(d(0, c) + d(1, c) + d(2, c), 0.0, 1e-13);
}

TEST(DeviationsFromExpected, KeepEveryDigitWithCountsNearOneHundredMillion) {
    // [[1e8, 1e8+1], [1e8+2, 1e8]]: for a 2×2 table O − E = ±(ad − bc)/n, and here
    // ad − bc = 1e16 − (1e8+1)(1e8+2) = −(3e8+2), n = 4e8+3 (exact arithmetic; mpmath 1.2.1
    // gives −0.7499999993750000000468750 for the first cell). Naive O − R·C/n in doubles keeps
    // about 8 of these digits.
    const Matrix d = deviations_from_expected(counts_table({{1e8, 1e8 + 1}, {1e8 + 2, 1e8}}));
    EXPECT_NEAR_REL(d(0, 0), -(3e8 + 2) / (4e8 + 3), 2e-16);
    EXPECT_NEAR_REL(d(1, 1), -(3e8 + 2) / (4e8 + 3), 2e-16);
    EXPECT_NEAR_REL(d(0, 1), (3e8 + 2) / (4e8 + 3), 2e-16);
}

TEST(DeviationsFromExpected, StayFiniteForCountsAboveTheSquareRootOfTheLargestDouble) {
    // Before the counts were scaled, O·n overflowed for counts near 1e200 and X² came out NaN.
    // Exact arithmetic: [[1, 1], [1, 2]]·1e200 has O − E = ±(2 − 1)/5 · 1e200 = ±2e199.
    const Matrix d = deviations_from_expected(counts_table({{1e200, 1e200}, {1e200, 2e200}}));
    EXPECT_NEAR_REL(d(0, 0), 2e199, 1e-15);
    EXPECT_NEAR_REL(d(0, 1), -2e199, 1e-15);
}

TEST(DeviationsFromExpected, StayAccurateForTinyWeights) {
    // The same table scaled by 1e-200: O − E = ±2e-201 (exact arithmetic); R·C used to underflow.
    const Matrix d = deviations_from_expected(counts_table({{1e-200, 1e-200}, {1e-200, 2e-200}}));
    EXPECT_NEAR_REL(d(0, 0), 2e-201, 1e-15);
    EXPECT_NEAR_REL(d(1, 1), 2e-201, 1e-15);
}
