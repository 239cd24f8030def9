// The likelihood-ratio statistic G² = 2 Σ O ln(O/E), with 0·ln 0 = 0.
#include <gtest/gtest.h>

#include <cmath>

#include "assoc/statistics.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::counts_table;

TEST(LikelihoodRatioStatistic, TreatsAZeroCellAsContributingNothingToTheSum) {
    // [[0, 5], [5, 5]]: n = 15, E = (5/3, 10/3, 10/3, 20/3); the zero cell adds 0·ln 0 = 0.
    // mpmath 1.2.1 (50 digits): 2 Σ O ln(O/E) over the non-zero cells = 5.232481437645478365.
    EXPECT_NEAR_REL(likelihood_ratio_statistic(counts_table({{0, 5}, {5, 5}})), 5.232481437645478365, 1e-13);
}

TEST(LikelihoodRatioStatistic, MatchesTheTextbookSumOnAnOrdinaryTable) {
    // Direct formula 2 Σ O ln(O·n/(R·C)), evaluated here in doubles: fine for small counts.
    const double counts[2][3] = {{23, 41, 17}, {31, 28, 22}};
    const double rows[2] = {81, 81}, columns[3] = {54, 69, 39}, n = 162;
    double sum = 0;
    for (int r = 0; r < 2; ++r)
        for (int c = 0; c < 3; ++c) sum += counts[r][c] * std::log(counts[r][c] * n / (rows[r] * columns[c]));
    EXPECT_NEAR_REL(likelihood_ratio_statistic(counts_table({{23, 41, 17}, {31, 28, 22}})), 2 * sum, 1e-12);
}

TEST(LikelihoodRatioStatistic, IsExactlyZeroForAProportionalTable) {
    // Exact identity: O = E in every cell, so every ln(O/E) = 0.
    EXPECT_EQ(likelihood_ratio_statistic(counts_table({{2, 4, 6}, {3, 6, 9}})), 0.0);
}

TEST(LikelihoodRatioStatistic, IsFiniteWhenACountIsAVanishingShareOfItsExpectedValue) {
    // Regression: with O/E below 2^-53, x = (O − E)/E rounds to −1 and log1p(x) has a pole; the core
    // threw "the result is too large for a spreadsheet number". mpmath 1.2.1 (50 digits):
    // [[1, 1e17], [1e17, 1e17]] → 104649628752909489.2126929, and the weighted
    // [[1e-10, 1e8], [1e8, 1e8]] → 104649628.7529095590337776.
    EXPECT_NEAR_REL(likelihood_ratio_statistic(counts_table({{1, 1e17}, {1e17, 1e17}})), 104649628752909489.2126929,
                    1e-13);
    EXPECT_NEAR_REL(likelihood_ratio_statistic(counts_table({{1e-10, 1e8}, {1e8, 1e8}})), 104649628.7529095590337776,
                    1e-13);
}

TEST(LikelihoodRatioStatistic, IsNeverNegative) {
    // Each term O ln(O/E) − (O − E) is ≥ 0 (exact maths); rounding must not push the sum below 0.
    for (const CountTable& t : {counts_table({{1e8, 1e8 + 1}, {1e8 + 2, 1e8}}), counts_table({{5, 5}, {5, 6}}),
                                counts_table({{1, 2, 3}, {2, 4, 6.000001}})})
        EXPECT_GE(likelihood_ratio_statistic(t), 0.0);
}

TEST(LikelihoodRatioStatistic, GrowsInProportionToTheCounts) {
    // Exact identity: G²(k·O) = k·G²(O).
    const double base = likelihood_ratio_statistic(counts_table({{0, 5, 8}, {6, 3, 2}}));
    EXPECT_NEAR_REL(likelihood_ratio_statistic(counts_table({{0, 5e150, 8e150}, {6e150, 3e150, 2e150}})),
                    1e150 * base, 1e-13);
}
