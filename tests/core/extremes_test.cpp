// Results at the extremes where digits used to be lost or computations broke (issues 9 and 15):
// counts from 1e-10 to 1e308, fitted cells within a hair of their bounds, differences that cancel,
// subnormal significance levels. Expected values from mpmath 1.2.1 at 80 to 700 digits
// (tests/reference/extremes_generate.py, extremes_values.hpp) or exact identities, named beside each
// check; the tolerance is 1e-12 relative throughout.
#include <gtest/gtest.h>

#include <cmath>
#include <string>

#include "assoc/breslow_day.hpp"
#include "assoc/chi_squared_distribution.hpp"
#include "assoc/cramers_v_interval.hpp"
#include "assoc/effect_size.hpp"
#include "assoc/expected_counts.hpp"
#include "assoc/goodness_of_fit.hpp"
#include "assoc/mantel_haenszel.hpp"
#include "assoc/paired_tests.hpp"
#include "assoc/power.hpp"
#include "assoc/residuals.hpp"
#include "assoc/statistics.hpp"
#include "assoc/trend_test.hpp"
#include "extremes_values.hpp"
#include "noncentral_values.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::counts_table;
using assoc::test::expect_error;
using assoc::test::grid;
namespace ref = assoc::reference;

namespace {

constexpr double tolerance = 1e-12;

CellGrid strata_grid(const ref::StrataCase& c) {
    std::vector<std::vector<Cell>> rows;
    for (int k = 0; k < c.strata; ++k) {
        rows.emplace_back();
        for (double v : c.cells[k]) rows.back().push_back(Cell::number(v));
    }
    return CellGrid::from_rows(rows);
}

CountTable wide_table() { return counts_table({{2, 0}, {1, 1e308}}); }

}  // namespace

// --- Cochran–Armitage ------------------------------------------------------------------------------

TEST(Extremes, TrendTestKeepsItsDigitsAtLargeCountsAndInFarTails) {
    for (const ref::TrendCase& c : ref::trend_extremes) {
        Matrix table(2, static_cast<std::size_t>(c.categories));
        std::vector<double> scores;
        for (int i = 0; i < c.categories; ++i) {
            table(0, static_cast<std::size_t>(i)) = c.first[i];
            table(1, static_cast<std::size_t>(i)) = c.second[i];
            scores.push_back(c.scores[i]);
        }
        const TrendResult result = trend_test(table, scores);
        EXPECT_NEAR_REL(result.z, c.z, tolerance) << c.name;
        EXPECT_NEAR_REL(result.p_value, c.p_value, tolerance) << c.name;
    }
}

// --- Breslow–Day and Mantel–Haenszel ---------------------------------------------------------------

TEST(Extremes, BreslowDayIsRightFromTinyWeightsToCountsOf1e120) {
    for (const ref::StrataCase& c : ref::strata_extremes) {
        const HomogeneityResult result = breslow_day_test(strata_grid(c));
        EXPECT_NEAR_REL(result.statistic, c.homogeneity_statistic, tolerance) << c.name;
        EXPECT_NEAR_REL(result.uncorrected_statistic, c.homogeneity_uncorrected, tolerance) << c.name;
        if (c.homogeneity_p == 0) EXPECT_EQ(result.p_value, 0.0) << c.name;
        else EXPECT_NEAR_REL(result.p_value, c.homogeneity_p, tolerance) << c.name;
    }
}

TEST(Extremes, MantelHaenszelIsRightFromTinyWeightsToCountsOf1e120) {
    for (const ref::StrataCase& c : ref::strata_extremes) {
        const MantelHaenszelResult result = mantel_haenszel_test(strata_grid(c));
        if (c.mh_statistic == 0) EXPECT_EQ(result.statistic, 0.0) << c.name;
        else EXPECT_NEAR_REL(result.statistic, c.mh_statistic, tolerance) << c.name;
        if (c.mh_p == 0) EXPECT_EQ(result.p_value, 0.0) << c.name;
        else EXPECT_NEAR_REL(result.p_value, c.mh_p, tolerance) << c.name;
        EXPECT_NEAR_REL(result.common_odds_ratio, c.common_odds_ratio, tolerance) << c.name;
        EXPECT_NEAR_REL(result.lower, c.lower, tolerance) << c.name;
        EXPECT_NEAR_REL(result.upper, c.upper, tolerance) << c.name;
    }
}

// --- 2×2 and r×c tables ----------------------------------------------------------------------------

TEST(Extremes, YatesKeepsItsDigitsWhenTheDeviationIsJustAboveOneHalf) {
    const CountTable table = counts_table({{99999997, 99999999}, {99999999, 99999999}});
    EXPECT_NEAR_REL(yates_statistic(table), ref::yates_near_1e8_statistic, tolerance);
    EXPECT_NEAR_REL(independence_test(table, Method::yates).p_value, ref::yates_near_1e8_p, tolerance);
}

TEST(Extremes, ATableOfSingleDigitsBeside1e308HasFiniteStatistics) {
    EXPECT_NEAR_REL(pearson_statistic(wide_table()), ref::wide_table_pearson, tolerance);
    EXPECT_NEAR_REL(likelihood_ratio_statistic(wide_table()), ref::wide_table_likelihood_ratio, tolerance);
    EXPECT_NEAR_REL(yates_statistic(wide_table()), ref::wide_table_yates, tolerance);
    EXPECT_NEAR_REL(cramers_v(wide_table()), ref::wide_table_cramers_v, tolerance);
    EXPECT_NEAR_REL(phi_coefficient(wide_table()), ref::wide_table_cramers_v, tolerance);  // |φ| = V for 2×2
    EXPECT_NEAR_REL(cohens_w(wide_table()), ref::wide_table_w, tolerance);
    EXPECT_MATRIX_NEAR_REL(expected_counts(wide_table()), std::vector<double>(std::begin(ref::wide_table_expected),
                                                                               std::end(ref::wide_table_expected)),
                           tolerance);
    EXPECT_MATRIX_NEAR_REL(residuals(wide_table(), ResidualKind::adjusted),
                           std::vector<double>(std::begin(ref::wide_table_adjusted), std::end(ref::wide_table_adjusted)),
                           tolerance);
}

// X² = n·φ² and φ² = min(r, c) − 1 = 2 for a perfectly associated 3×3 table: with n = 1.6e308 the
// statistic is 3.2e308, beyond the largest double (exact arithmetic); its p-value is 0.
TEST(Extremes, AStatisticBeyondTheLargestNumberIsAnExplainedErrorWithAPValueOf0) {
    const CountTable table = counts_table({{8e307, 0, 0}, {0, 8e307, 0}, {0, 0, 1e4}});
    const TestResult result = independence_test(table);
    EXPECT_EQ(result.p_value, 0.0);
    expect_error([&] { representable_statistic(result, Method::pearson); },
                 "Pearson X² is larger than a spreadsheet number can hold (above 1.8e308) for this table, so its "
                 "p-value is 0; divide every count by the same factor to see its size (it shrinks by that factor)");
    EXPECT_NEAR_REL(cramers_v(table), 1.0, tolerance);
}

// Exact identity: [[1, 0], [2, 3]] has X²/n = 0.2 = (r − 1)(c − 1)/(n − 1), so the corrected φ² is 0;
// so does every 2×2 table with (ad − bc)²(n − 1) = r1 r2 c1 c2 (checked in integer arithmetic).
TEST(Extremes, BiasCorrectedCramersVIsExactlyZeroWhereTheCorrectionEqualsPhiSquared) {
    EXPECT_EQ(cramers_v_corrected(counts_table({{1, 0}, {2, 3}})), 0.0);
    int tables = 0;
    for (long long a = 0; a < 30; ++a)
        for (long long b = 0; b < 30; ++b)
            for (long long c = 0; c < 30; ++c)
                for (long long d = 0; d < 30; ++d) {
                    const long long r1 = a + b, r2 = c + d, c1 = a + c, c2 = b + d, n = a + b + c + d;
                    if (r1 == 0 || r2 == 0 || c1 == 0 || c2 == 0 || (a * d - b * c) * (a * d - b * c) * (n - 1) != r1 * r2 * c1 * c2)
                        continue;
                    ++tables;
                    const auto value = [](long long x) { return static_cast<double>(x); };
                    EXPECT_EQ(cramers_v_corrected(counts_table({{value(a), value(b)}, {value(c), value(d)}})), 0.0)
                        << a << " " << b << " " << c << " " << d;
                }
    EXPECT_GT(tables, 300);
}

// --- Goodness of fit and paired tests --------------------------------------------------------------

TEST(Extremes, GoodnessOfFitHasAFiniteStatisticForCountsUpTo1e300) {
    const GoodnessOfFit result = goodness_of_fit(std::vector<double>{28, 9007199254740992.0, 1, 1e300}, {}, 0);
    EXPECT_NEAR_REL(result.statistic, ref::fit_extreme_statistic, tolerance);
    EXPECT_EQ(result.p_value, 0.0);  // the statistic is 3e300: the p-value is far below 1e-308
}

TEST(Extremes, GoodnessOfFitKeepsItsDigitsForCountsNear1e8) {
    const GoodnessOfFit result = goodness_of_fit(std::vector<double>{100000001, 100000000, 99999999, 100000003}, {}, 0);
    EXPECT_NEAR_REL(result.statistic, ref::fit_near_1e8_statistic, tolerance);
    EXPECT_NEAR_REL(result.p_value, ref::fit_near_1e8_p, tolerance);
}

// Exact arithmetic: (b − c)²/(b + c) with b = 1.7e308, c = 1 is 1.7e308·(1 − 2/(1.7e308 + 1))… ≈ 1.7e308.
TEST(Extremes, PairedTestHasAFiniteStatisticForCountsNearTheLargestNumber) {
    const PairedResult result = paired_test(grid({{1, 1.7e308}, {1, 3}}), PairedMethod::uncorrected);
    EXPECT_NEAR_REL(result.statistic, 1.7e308, tolerance);
    EXPECT_EQ(result.p_value, 0.0);
}

// mpmath 1.2.1: twice the smaller binomial tail, summed term by term. Boost's binomial lost digits here
// (2e-8 at 2e9 changes, 2e-5 at 2e12) and took minutes beyond 1e18.
TEST(Extremes, ExactPairedTestKeepsItsDigitsForMillionsOfChanges) {
    for (const ref::PairedCase& c : ref::paired_exact) {
        const PairedResult result = paired_test(grid({{1, c.b}, {c.c, 3}}), PairedMethod::exact);
        EXPECT_NEAR_REL(result.p_value, c.p_value, tolerance) << c.b << " " << c.c;
    }
}

TEST(Extremes, ExactPairedTestRefusesMoreChangesThanWholeNumbersReach) {
    expect_error([] { paired_test(grid({{1, 1e16}, {1e16, 3}}), PairedMethod::exact); },
                 "the exact paired test takes up to 9,007,199,254,740,991 changes (2^53 − 1) in all, and this table "
                 "has 2e+16; at this size use the chi-squared version (\"corrected\")");
}

// --- Power and critical values ---------------------------------------------------------------------

// Definition: with no effect (w = 0) the test rejects with probability alpha exactly.
TEST(Extremes, PowerWithNoEffectIsExactlyAlpha) {
    for (double alpha : {0.05, 0.01, 0.1, 1e-10})
        for (double df : {1.0, 4.0, 100.0}) EXPECT_EQ(chi_squared_power(0, 500, df, alpha), alpha) << alpha << " " << df;
}

TEST(Extremes, CriticalValuesForSubnormalAlphaKeepTheirDigits) {
    for (const ref::CriticalCase& c : ref::subnormal_alpha_critical)
        EXPECT_NEAR_REL(chi_squared_critical_value(c.df, c.alpha), c.critical, tolerance) << c.df << " " << c.alpha;
}

// mpmath 1.2.1's Poisson mixture (tests/reference/noncentral_generate.py): the Cornish–Fisher
// expansion used from a statistic of 1e5 on.
TEST(Extremes, NoncentralityBoundsAtLargeStatisticsMatchThePoissonMixture) {
    for (const ref::NoncentralCase& c : ref::noncentral_large) {
        const NoncentralityInterval interval = noncentrality_interval(c.statistic, c.df);
        EXPECT_NEAR_REL(interval.lower, c.lambda_lower, tolerance) << c.statistic;
        EXPECT_NEAR_REL(interval.upper, c.lambda_upper, tolerance) << c.statistic;
    }
}

// Issue 9: the report on counts of 1e15 said "Not computed: the result cannot be represented as a whole
// number" for both limits. The interval must now exist and hold the estimate (mpmath 1.2.1 for V).
TEST(Extremes, CramersVIntervalExistsForCountsOf1e15) {
    const CramersVInterval v = cramers_v_interval(counts_table({{1e15, 2e15}, {3e15, 1e15 + 7}}));
    EXPECT_NEAR_REL(v.estimate, ref::counts_of_1e15_cramers_v, tolerance);
    EXPECT_LT(v.lower, v.estimate);
    EXPECT_GT(v.upper, v.estimate);
    EXPECT_LT(v.upper - v.lower, 1e-7);
}
