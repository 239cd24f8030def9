// Cell residuals: raw, Pearson, adjusted (Haberman 1973), contribution and percent.
// (Published and library checks: agresti_party_identification_test, library_reference_tables_test.)
#include <gtest/gtest.h>

#include <cmath>

#include "assoc/residuals.hpp"
#include "assoc/statistics.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::counts_table;
using assoc::test::table;

namespace {

// [[3, 7], [9, 11]]: R = (10, 20), C = (12, 18), n = 30, E = (4, 6, 8, 12), O − E = (−1, 1, 1, −1).
CountTable small_table() { return counts_table({{3, 7}, {9, 11}}); }

double sum(const Matrix& m) {
    double total = 0;
    for (double v : m.values()) total += v;
    return total;
}

}  // namespace

TEST(Residuals, RawResidualsAreObservedLessExpected) {
    // Exact arithmetic, see small_table().
    EXPECT_MATRIX_NEAR_REL(residuals(small_table(), ResidualKind::raw), (std::vector<double>{-1, 1, 1, -1}), 1e-15);
}

TEST(Residuals, PearsonResidualsDivideByTheRootOfTheExpectedCount) {
    // (O − E)/√E: −1/2, 1/√6, 1/√8, −1/√12 (exact arithmetic).
    EXPECT_MATRIX_NEAR_REL(residuals(small_table(), ResidualKind::pearson),
                           (std::vector<double>{-0.5, 1 / std::sqrt(6.0), 1 / std::sqrt(8.0), -1 / std::sqrt(12.0)}),
                           1e-15);
}

TEST(Residuals, AdjustedResidualsDivideByTheirStandardError) {
    // Haberman (1973): (O − E)/√(E (1 − R/n)(1 − C/n)). First cell: −1/√(4·(2/3)·(3/5)) = −1/√1.6.
    const Matrix adjusted = residuals(small_table(), ResidualKind::adjusted);
    EXPECT_NEAR_REL(adjusted(0, 0), -1 / std::sqrt(1.6), 1e-15);
}

TEST(Residuals, AdjustedResidualsOfATwoByTwoTableAreAllPlusOrMinusTheRootOfXSquared) {
    // Exact identity for 2×2 tables: every adjusted residual is ±√X² (the signed root of the statistic).
    for (const CountTable& t : {small_table(), counts_table({{12, 5}, {3, 10}}), counts_table({{189, 10845}, {104, 10933}})}) {
        const double root = std::sqrt(pearson_statistic(t));
        const Matrix adjusted = residuals(t, ResidualKind::adjusted);
        for (double value : adjusted.values()) EXPECT_NEAR_REL(std::fabs(value), root, 1e-14);
    }
}

TEST(Residuals, AdjustedResidualsKeepTheirDigitsWhenOneRowHoldsNearlyEverything) {
    // Weighted [[1e8+0.1, 1e8+0.3], [0.2, 0.7]]: 1 − R/n is about 5e-9, and from rounded totals it
    // kept only 8 digits (the core gave 0.52704627281 before the double-double margins).
    // mpmath 1.2.1 (50 digits, from the exact doubles): ±0.5270462745601924187887959.
    const Matrix adjusted = residuals(counts_table({{1e8 + 0.1, 1e8 + 0.3}, {0.2, 0.7}}), ResidualKind::adjusted);
    EXPECT_MATRIX_NEAR_REL(adjusted,
                           (std::vector<double>{0.5270462745601924187887959, -0.5270462745601924187887959,
                                                -0.5270462745601924187887959, 0.5270462745601924187887959}),
                           1e-13);
}

TEST(Residuals, ContributionsAddUpToPearsonsStatistic) {
    // Exact identity: Σ (O − E)²/E = X².
    const CountTable t = counts_table({{23, 41, 17, 9}, {31, 28, 22, 14}, {12, 19, 30, 25}});
    EXPECT_NEAR_REL(sum(residuals(t, ResidualKind::contribution)), pearson_statistic(t), 1e-14);
}

TEST(Residuals, ContributionsAreSquaredPearsonResiduals) {
    const Matrix contribution = residuals(small_table(), ResidualKind::contribution);
    const Matrix pearson = residuals(small_table(), ResidualKind::pearson);
    for (std::size_t i = 0; i < contribution.size(); ++i)
        EXPECT_NEAR_REL(contribution.values()[i], pearson.values()[i] * pearson.values()[i], 1e-15);
}

TEST(Residuals, PercentagesAddUpToOneHundred) {
    const CountTable t = counts_table({{23, 41, 17, 9}, {31, 28, 22, 14}, {12, 19, 30, 25}});
    EXPECT_NEAR_REL(sum(residuals(t, ResidualKind::percent)), 100.0, 1e-14);
    // small_table(): contributions 1/4, 1/6, 1/8, 1/12 of X² = 5/8 → 40%, 26.67%, 20%, 13.33%.
    EXPECT_MATRIX_NEAR_REL(residuals(small_table(), ResidualKind::percent),
                           (std::vector<double>{40, 80.0 / 3, 20, 40.0 / 3}), 1e-14);
}

TEST(Residuals, PercentagesAreZeroWhenTheTableShowsNoAssociation) {
    // Exact identity: proportional rows give O = E, so every contribution is 0 (and X² = 0: shares of
    // nothing are reported as 0, not as 0/0).
    const Matrix percent = residuals(counts_table({{2, 4, 6}, {3, 6, 9}}), ResidualKind::percent);
    for (double value : percent.values()) EXPECT_EQ(value, 0.0);
}

TEST(Residuals, HaveTheShapeOfTheKeptTableAndSpreadBackWithZeros) {
    const CountTable t = table({{3, 0, 7}, {0, 0, 0}, {9, 0, 11}});
    const Matrix kept = residuals(t, ResidualKind::raw);
    ASSERT_EQ(kept.rows(), 2u);
    ASSERT_EQ(kept.columns(), 2u);
    EXPECT_MATRIX_NEAR_REL(t.to_body_shape(kept), (std::vector<double>{-1, 0, 1, 0, 0, 0, 1, 0, -1}), 1e-15);
}
