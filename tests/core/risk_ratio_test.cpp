// The risk ratio of a 2×2 table with the log-method (Katz) interval.
#include <gtest/gtest.h>

#include "assoc/risk_ratio.hpp"
#include "small_sample_values.hpp"
#include "published_tables.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::table;
namespace ref = assoc::reference;

using assoc::test::published::aspirin;

TEST(RiskRatio, MatchesTheAspirinTableEstimateAndLogInterval) {
    // statsmodels 0.13.5 Table2x2.riskratio / riskratio_confint; Agresti prints RR 1.82.
    const RatioEstimate r = risk_ratio(aspirin());
    EXPECT_NEAR_REL(r.estimate, ref::aspirin_risk_ratio, 1e-13);
    EXPECT_NEAR_REL(r.lower, ref::aspirin_risk_ratio_lower, 1e-12);
    EXPECT_NEAR_REL(r.upper, ref::aspirin_risk_ratio_upper, 1e-12);
    EXPECT_NEAR_REL(r.log_standard_error, ref::aspirin_log_risk_ratio_se, 1e-12);
    EXPECT_NEAR(r.estimate, 1.82, 0.005);
}

TEST(RiskRatio, IsTheRatioOfTheRowRisksOfColumnOne) {
    // Definition: (189 / 11034) / (104 / 11037).
    EXPECT_NEAR_REL(risk_ratio(aspirin()).estimate, (189.0 / 11034.0) / (104.0 / 11037.0), 1e-14);
}

TEST(RiskRatio, AddsOneHalfToEveryCellWhenOneIsZero) {
    // statsmodels Table2x2(table + 0.5, shift_zeros=False): (0.5/11) / (5.5/11) = 1/11.
    const RatioEstimate r = risk_ratio(table({{0, 10}, {5, 5}}));
    EXPECT_NEAR_REL(r.estimate, ref::haldane_risk_ratio, 1e-14);
    EXPECT_NEAR_REL(r.lower, ref::haldane_risk_ratio_lower, 1e-12);
    EXPECT_NEAR_REL(r.upper, ref::haldane_risk_ratio_upper, 1e-12);
    EXPECT_TRUE(r.zero_cell_corrected);
    EXPECT_EQ(r.remark, zero_cell_correction_remark());
}

TEST(RiskRatio, IsRefusedWhenEveryoneHasTheEventBecauseAColumnIsEmpty) {
    // The empty column is set aside when the table is read, so no 2×2 table is left.
    expect_error([] { risk_ratio(table({{5, 0}, {7, 0}})); },
                 "the table has only 1 column with counts (1 column with all zeros set aside); a test of "
                 "association needs at least 2 rows and 2 columns with counts");
}

TEST(RiskRatio, RejectsATableThatIsNotTwoByTwo) {
    expect_error([] { risk_ratio(table({{1, 2}, {3, 4}, {5, 6}})); },
                 "the risk ratio needs a 2×2 table; this table has 3 rows and 2 columns with counts");
}

TEST(RiskRatio, RejectsAConfidenceLevelOfOne) {
    expect_error([] { risk_ratio(aspirin(), 1); },
                 "the confidence level must lie between 0 and 1 (for example 0.95), not 1");
}
