// Goodman–Kruskal γ and Kendall's τ-b of ordered tables (ASSOC.STRENGTH "gamma" and "taub").
// Published: Agresti (2007), An Introduction to Categorical Data Analysis, 2nd ed., job satisfaction
// by income, C = 1331, D = 849, γ = 0.221 (from memory; tests/reference/published_values.md section 14).
// Recomputed: pairs counted over the expanded data with numpy 1.24.2, τ-b by scipy 1.10.1 kendalltau
// on the expanded data (tests/reference/ordered_generate.py).
#include <gtest/gtest.h>

#include "assoc/ordinal_measures.hpp"
#include "array_tables.hpp"
#include "ordered_values.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::table;
namespace ref = assoc::reference::ordered_values;
using assoc::test::table_of;

TEST(GoodmanKruskalGamma, ReproducesAgrestisJobSatisfactionExample) {
    const double gamma = goodman_kruskal_gamma(table_of(ref::job_counts));
    EXPECT_NEAR(gamma, 0.221, 0.0005);                   // as printed (from memory)
    EXPECT_DOUBLE_EQ(gamma, (1331.0 - 849.0) / (1331.0 + 849.0));  // the printed C and D, recounted by numpy
    EXPECT_NEAR_REL(gamma, ref::job_gamma, 1e-14);
}

TEST(GoodmanKruskalGamma, MatchesAPairCountOfTheTenureTable) {
    EXPECT_NEAR_REL(goodman_kruskal_gamma(table_of(ref::tenure_counts)), ref::tenure_gamma, 1e-14);
}

TEST(GoodmanKruskalGamma, IsOneWhenNoPairIsDiscordant) {
    EXPECT_EQ(goodman_kruskal_gamma(table({{5, 2}, {0, 4}})), 1.0);  // common practice: γ = 1 when D = 0
}

TEST(GoodmanKruskalGamma, ChangesSignWhenTheColumnsAreReversed) {
    EXPECT_NEAR_REL(goodman_kruskal_gamma(table({{14, 24, 15, 9, 4}, {4, 13, 14, 17, 15}})),
                    -goodman_kruskal_gamma(table({{4, 9, 15, 24, 14}, {15, 17, 14, 13, 4}})), 1e-14);
}

TEST(KendallTauB, MatchesScipyOnAgrestisJobSatisfactionTable) {
    EXPECT_NEAR_REL(kendall_tau_b(table_of(ref::job_counts)), ref::job_tau_b, 1e-12);
}

TEST(KendallTauB, MatchesScipyOnTheTenureTable) {
    EXPECT_NEAR_REL(kendall_tau_b(table_of(ref::tenure_counts)), ref::tenure_tau_b, 1e-12);
}

// Exact identity: for a 2×2 table τ-b is phi, (ad − bc)/√(r1 r2 c1 c2).
TEST(KendallTauB, IsPhiForATwoByTwoTable) {
    const double a = 18, b = 7, c = 9, d = 16;
    EXPECT_NEAR_REL(kendall_tau_b(table({{a, b}, {c, d}})),
                    (a * d - b * c) / std::sqrt((a + b) * (c + d) * (a + c) * (b + d)), 1e-14);
}

TEST(KendallTauB, IsOneForCountsOnTheDiagonalOfASquareTable) {
    EXPECT_NEAR_REL(kendall_tau_b(table({{3, 0, 0}, {0, 5, 0}, {0, 0, 2}})), 1.0, 1e-15);
}

TEST(KendallTauB, IsSmallerThanGammaWhenThereAreTies) {
    const CountTable job = table_of(ref::job_counts);
    EXPECT_LT(std::fabs(kendall_tau_b(job)), std::fabs(goodman_kruskal_gamma(job)));
}

// Exact fractions (Python's fractions): for [[1e15, 1], [1, 1]], C − D = 1e15 − 1 and the untied pairs
// on either side 2·(1e15 + 1)·2, so τ-b = (1e15 − 1)/(2e15 + 2); n² − ΣT² lost 2.5% of it (found by
// the ordinal fuzz target: τ-b further from 0 than γ).
TEST(KendallTauB, KeepsItsDigitsWhenOneCountDwarfsTheOthers) {
    const CountTable lopsided = table({{1e15, 1}, {1, 1}});
    EXPECT_NEAR_REL(kendall_tau_b(lopsided), 0.499999999999999, 1e-14);
    EXPECT_NEAR_REL(goodman_kruskal_gamma(lopsided), 0.999999999999998, 1e-14);
}

// Exact identity: both measures are ratios of pair counts, so multiplying every count by the same
// factor changes neither, also for weights so large that n² would overflow.
TEST(OrdinalMeasures, AreUnchangedWhenEveryCountIsMultipliedByAHugeFactor) {
    const CountTable job = table_of(ref::job_counts);
    Matrix huge(4, 4);
    for (std::size_t r = 0; r < 4; ++r)
        for (std::size_t c = 0; c < 4; ++c) huge(r, c) = ref::job_counts[r][c] * 1e300;
    const CountTable scaled = CountTable::from_counts(huge);
    EXPECT_NEAR_REL(goodman_kruskal_gamma(scaled), goodman_kruskal_gamma(job), 1e-14);
    EXPECT_NEAR_REL(kendall_tau_b(scaled), kendall_tau_b(job), 1e-14);
}
