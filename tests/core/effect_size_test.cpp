// Effect sizes: Cramér's V, Bergsma's bias-corrected V, signed phi, contingency coefficient,
// Cohen's w. (Library checks on more tables: library_reference_tables_test.)
#include <gtest/gtest.h>

#include <cmath>

#include "assoc/effect_size.hpp"
#include "assoc/statistics.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::counts_table;
using assoc::test::expect_error;

TEST(CramersV, IsOneForAPerfectAssociation) {
    // Exact identity: a diagonal table has X² = n·(min(r, c) − 1), so V = 1.
    EXPECT_NEAR_REL(cramers_v(counts_table({{10, 0, 0}, {0, 7, 0}, {0, 0, 4}})), 1.0, 1e-15);
}

// Exact identity: rows proportional to each other give O = E in every cell, so X² = 0.
TEST(CramersV, IsZeroForAProportionalTable) { EXPECT_EQ(cramers_v(counts_table({{2, 4, 6}, {3, 6, 9}})), 0.0); }

TEST(CramersV, IsTheSizeOfPhiInATwoByTwoTable) {
    // Exact identity for 2×2 tables (min(r, c) − 1 = 1): V = |phi|.
    const CountTable t = counts_table({{3, 12}, {10, 5}});
    EXPECT_NEAR_REL(cramers_v(t), std::fabs(phi_coefficient(t)), 1e-15);
}

TEST(CramersV, OfTheAlcoholTableMatchesTheRecomputedValue) {
    // Agresti (2007) infant malformation by maternal alcohol consumption (data from memory,
    // published_values.md sections 4 and 11): V = 0.019259050, Ṽ = 0.015751747 (scipy 1.10.1 /
    // Bergsma's formula, printed to 9 decimals there).
    const CountTable t = counts_table({{48, 38, 5, 1, 1}, {17066, 14464, 788, 126, 37}});
    EXPECT_NEAR(cramers_v(t), 0.019259050, 5e-10);
    EXPECT_NEAR(cramers_v_corrected(t), 0.015751747, 5e-10);
}

TEST(CramersVCorrected, FloorsAtZeroWhenTheTableShowsLessAssociationThanChance) {
    // published_values.md section 11: invented [[5, 3, 2], [4, 6, 1]], X² = 7/5, n = 21:
    // X²/n − (r−1)(c−1)/(n−1) = 1/15 − 1/10 < 0, so Ṽ = 0 while V = 0.258198890.
    const CountTable t = counts_table({{5, 3, 2}, {4, 6, 1}});
    EXPECT_EQ(cramers_v_corrected(t), 0.0);
    EXPECT_NEAR(cramers_v(t), 0.258198890, 5e-10);
}

TEST(CramersVCorrected, IsOneForAPerfectTwoByTwoAssociation) {
    // [[10, 0], [0, 10]], n = 20: φ̃² = 1 − 1/19 and r̃ − 1 = c̃ − 1 = 1 − 1/19, so Ṽ = 1 (exact arithmetic).
    EXPECT_NEAR_REL(cramers_v_corrected(counts_table({{10, 0}, {0, 10}})), 1.0, 1e-15);
}

TEST(CramersVCorrected, RejectsATotalOfOneOrLess) {
    expect_error([] { cramers_v_corrected(counts_table({{0.2, 0.3}, {0.1, 0.3}})); },
                 "the bias-corrected Cramér's V needs a total count above 1");
}

TEST(PhiCoefficient, IsPositiveWhenTheDiagonalIsLargerThanIndependenceGives) {
    // (ad − bc)/√(r1 r2 c1 c2) = 105/√(17·13·15·15) for [[12, 5], [3, 10]] (exact arithmetic).
    EXPECT_NEAR_REL(phi_coefficient(counts_table({{12, 5}, {3, 10}})), 105 / std::sqrt(17.0 * 13 * 15 * 15), 1e-15);
}

TEST(PhiCoefficient, IsNegativeWhenTheOffDiagonalIsLarger) {
    EXPECT_NEAR_REL(phi_coefficient(counts_table({{5, 12}, {10, 3}})), -105 / std::sqrt(17.0 * 13 * 15 * 15), 1e-15);
    EXPECT_NEAR_REL(phi_coefficient(counts_table({{0, 7}, {7, 0}})), -1.0, 1e-15);
}

TEST(PhiCoefficient, SquaredTimesNIsPearsonsStatistic) {
    // Exact identity for 2×2 tables: n·phi² = X².
    const CountTable t = counts_table({{189, 10845}, {104, 10933}});
    EXPECT_NEAR_REL(t.total() * phi_coefficient(t) * phi_coefficient(t), pearson_statistic(t), 1e-14);
}

TEST(PhiCoefficient, StaysFiniteForHugeCounts) {
    // Scale invariance (exact identity) at a scale where r1 r2 c1 c2 overflows a double.
    EXPECT_NEAR_REL(phi_coefficient(counts_table({{12e150, 5e150}, {3e150, 10e150}})),
                    105 / std::sqrt(17.0 * 13 * 15 * 15), 1e-14);
}

TEST(PhiCoefficient, RejectsALargerTableAndPointsToCramersV) {
    expect_error([] { phi_coefficient(counts_table({{1, 2, 3}, {4, 5, 6}})); },
                 "phi is defined for 2×2 tables only; this table has 2 rows and 3 columns with counts; use Cramér's V");
}

TEST(ContingencyCoefficient, IsTheRootOfXSquaredOverXSquaredPlusN) {
    // small table [[3, 7], [9, 11]]: X² = 5/8, n = 30 → C = √((5/8)/(5/8 + 30)) = √(5/245) = 1/7.
    EXPECT_NEAR_REL(contingency_coefficient(counts_table({{3, 7}, {9, 11}})), 1.0 / 7, 1e-15);
}

TEST(CohensW, IsTheRootOfXSquaredOverN) {
    // [[3, 7], [9, 11]]: w = √((5/8)/30) = √(1/48) (exact arithmetic).
    EXPECT_NEAR_REL(cohens_w(counts_table({{3, 7}, {9, 11}})), std::sqrt(1.0 / 48), 1e-15);
}

TEST(EffectSizes, UseTheUncorrectedStatisticEvenForTwoByTwoTables) {
    // A reported bug in several packages: V from the Yates-corrected X². Here V² n = X² (uncorrected).
    const CountTable t = counts_table({{12, 5}, {3, 10}});
    EXPECT_NEAR_REL(cramers_v(t) * cramers_v(t) * t.total(), pearson_statistic(t), 1e-14);
    EXPECT_GT(std::fabs(cramers_v(t) * cramers_v(t) * t.total() - yates_statistic(t)), 1.0);
}
