// Whole tables against general-purpose reference libraries: each test runs on every table in
// core_reference_values.hpp (library_tables), written by tests/reference/generate_core_values.py
// with scipy 1.10.1 (chi2_contingency, contingency.association), statsmodels 0.13.5
// (Table.resid_pearson, Table.standardized_resids), numpy 1.24.2 (Bergsma's formula) and
// mpmath 1.2.1 at 60 digits. The tables: Agresti's party identification table, invented 3×4,
// 4×5 and weighted (non-integer) 3×3 tables, tables with an all-zero row, an all-zero column and a
// zero cell, a small 2×3 where the bias-corrected V floors at 0, and a 2×2.
// Tolerances: 1e-10 relative against the double-precision libraries (their own last digits
// vary), 1e-12 against mpmath.
#include <gtest/gtest.h>

#include "assoc/effect_size.hpp"
#include "assoc/expected_counts.hpp"
#include "assoc/residuals.hpp"
#include "assoc/statistics.hpp"
#include "reference_support.hpp"

using namespace assoc;
using assoc::reference::ReferenceTable;
using assoc::test::table_of;

namespace {

constexpr double library_tolerance = 1e-10;
constexpr double mpmath_tolerance = 1e-12;

class LibraryReferenceTable : public ::testing::TestWithParam<ReferenceTable> {
protected:
    const ReferenceTable& reference = GetParam();
    const CountTable table = table_of(GetParam());
};

}  // namespace

TEST_P(LibraryReferenceTable, KeepsTheRowsAndColumnsThatHoldCounts) {
    EXPECT_EQ(table.rows(), reference.kept_rows);
    EXPECT_EQ(table.columns(), reference.kept_columns);
}

TEST_P(LibraryReferenceTable, HasTheDegreesOfFreedomOfTheKeptRowsAndColumns) {
    EXPECT_EQ(degrees_of_freedom(table), reference.df);
}

TEST_P(LibraryReferenceTable, PearsonStatisticMatchesScipy) {
    EXPECT_NEAR_REL(pearson_statistic(table), reference.scipy_pearson, library_tolerance);
}

TEST_P(LibraryReferenceTable, PearsonStatisticMatchesMpmath) {
    EXPECT_NEAR_REL(pearson_statistic(table), reference.pearson, mpmath_tolerance);
}

TEST_P(LibraryReferenceTable, PearsonPValueMatchesScipyAndMpmath) {
    const double p = independence_test(table, Method::pearson).p_value;
    EXPECT_NEAR_REL(p, reference.scipy_pearson_p, library_tolerance);
    EXPECT_NEAR_REL(p, reference.pearson_p, mpmath_tolerance);
}

TEST_P(LibraryReferenceTable, LikelihoodRatioStatisticMatchesScipy) {
    EXPECT_NEAR_REL(likelihood_ratio_statistic(table), reference.scipy_likelihood_ratio, library_tolerance);
}

TEST_P(LibraryReferenceTable, LikelihoodRatioStatisticMatchesMpmath) {
    EXPECT_NEAR_REL(likelihood_ratio_statistic(table), reference.likelihood_ratio, mpmath_tolerance);
}

TEST_P(LibraryReferenceTable, LikelihoodRatioPValueMatchesScipyAndMpmath) {
    const double p = independence_test(table, Method::likelihood_ratio).p_value;
    EXPECT_NEAR_REL(p, reference.scipy_likelihood_ratio_p, library_tolerance);
    EXPECT_NEAR_REL(p, reference.likelihood_ratio_p, mpmath_tolerance);
}

TEST_P(LibraryReferenceTable, ExpectedCountsMatchScipy) {
    EXPECT_MATRIX_NEAR_REL(expected_counts(table), reference.scipy_expected, library_tolerance);
}

TEST_P(LibraryReferenceTable, RawResidualsMatchMpmath) {
    EXPECT_MATRIX_NEAR_REL(residuals(table, ResidualKind::raw), reference.raw_residuals, mpmath_tolerance);
}

TEST_P(LibraryReferenceTable, PearsonResidualsMatchStatsmodels) {
    EXPECT_MATRIX_NEAR_REL(residuals(table, ResidualKind::pearson), reference.statsmodels_pearson_residuals,
                           library_tolerance);
}

TEST_P(LibraryReferenceTable, AdjustedResidualsMatchStatsmodels) {
    EXPECT_MATRIX_NEAR_REL(residuals(table, ResidualKind::adjusted), reference.statsmodels_adjusted_residuals,
                           library_tolerance);
}

TEST_P(LibraryReferenceTable, AdjustedResidualsMatchMpmath) {
    EXPECT_MATRIX_NEAR_REL(residuals(table, ResidualKind::adjusted), reference.adjusted_residuals, mpmath_tolerance);
}

TEST_P(LibraryReferenceTable, CramersVMatchesScipy) {
    EXPECT_NEAR_REL(cramers_v(table), reference.scipy_cramers_v, library_tolerance);
}

TEST_P(LibraryReferenceTable, BiasCorrectedVMatchesBergsmasFormulaInNumpyAndMpmath) {
    // Bergsma (2013), formula as in published_values.md section 11 (no library implements it).
    const double corrected = cramers_v_corrected(table);
    EXPECT_NEAR_REL(corrected, reference.numpy_cramers_v_corrected, library_tolerance);
    EXPECT_NEAR_REL(corrected, reference.cramers_v_corrected, mpmath_tolerance);
}

TEST_P(LibraryReferenceTable, BiasCorrectedVIsNeverAboveV) {
    EXPECT_LE(cramers_v_corrected(table), cramers_v(table));
}

TEST_P(LibraryReferenceTable, ContingencyCoefficientMatchesScipy) {
    EXPECT_NEAR_REL(contingency_coefficient(table), reference.scipy_contingency_coefficient, library_tolerance);
}

TEST_P(LibraryReferenceTable, CohensWMatchesMpmath) {
    EXPECT_NEAR_REL(cohens_w(table), reference.cohens_w, mpmath_tolerance);
}

INSTANTIATE_TEST_SUITE_P(AgainstScipyStatsmodelsAndMpmath, LibraryReferenceTable,
                         ::testing::ValuesIn(assoc::reference::library_tables), assoc::test::reference_table_name);

TEST(LibraryReferenceTables, YatesStatisticMatchesScipyOnEveryTwoByTwoTable) {
    int two_by_two = 0;
    for (const ReferenceTable& reference : assoc::reference::library_tables) {
        if (reference.kept_rows != 2 || reference.kept_columns != 2) continue;
        ++two_by_two;
        const TestResult yates = independence_test(table_of(reference), Method::yates);
        EXPECT_NEAR_REL(yates.statistic, reference.scipy_yates, library_tolerance) << reference.name;
        EXPECT_NEAR_REL(yates.p_value, reference.scipy_yates_p, library_tolerance) << reference.name;
        EXPECT_NEAR_REL(yates.statistic, reference.yates, mpmath_tolerance) << reference.name;
    }
    EXPECT_GT(two_by_two, 0);
}

TEST(LibraryReferenceTables, PhiMatchesMpmathOnEveryTwoByTwoTable) {
    for (const ReferenceTable& reference : assoc::reference::library_tables) {
        if (reference.kept_rows != 2 || reference.kept_columns != 2) continue;
        EXPECT_NEAR_REL(phi_coefficient(table_of(reference)), reference.phi, mpmath_tolerance) << reference.name;
    }
}
