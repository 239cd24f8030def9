// The odds ratio of a 2×2 table with Woolf's interval, and the zero-cell correction.
#include <gtest/gtest.h>

#include "assoc/odds_ratio.hpp"
#include "assoc/validity.hpp"
#include "small_sample_values.hpp"
#include "published_tables.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::table;
namespace ref = assoc::reference;

using assoc::test::published::aspirin;

TEST(OddsRatio, MatchesTheAspirinTableEstimateAndWoolfInterval) {
    // statsmodels 0.13.5 Table2x2 (small_sample_values.hpp); Agresti prints 1.83 (1.44, 2.33).
    const RatioEstimate r = odds_ratio(aspirin());
    EXPECT_NEAR_REL(r.estimate, ref::aspirin_odds_ratio, 1e-13);
    EXPECT_NEAR_REL(r.lower, ref::aspirin_odds_ratio_lower, 1e-12);
    EXPECT_NEAR_REL(r.upper, ref::aspirin_odds_ratio_upper, 1e-12);
    EXPECT_NEAR_REL(r.log_standard_error, ref::aspirin_log_odds_ratio_se, 1e-13);
    EXPECT_NEAR(r.lower, 1.44, 0.005);
    EXPECT_NEAR(r.upper, 2.33, 0.005);
    EXPECT_FALSE(r.zero_cell_corrected);
    EXPECT_EQ(r.remark, "");
}

TEST(OddsRatio, NarrowsTheIntervalForALowerConfidence) {
    // statsmodels 0.13.5 Table2x2.oddsratio_confint(alpha=0.10).
    const RatioEstimate r = odds_ratio(aspirin(), 0.90);
    EXPECT_NEAR_REL(r.lower, ref::aspirin_odds_ratio_lower_90, 1e-12);
    EXPECT_NEAR_REL(r.upper, ref::aspirin_odds_ratio_upper_90, 1e-12);
    EXPECT_DOUBLE_EQ(r.confidence, 0.90);
}

TEST(OddsRatio, AddsOneHalfToEveryCellWhenOneIsZero) {
    // Haldane–Anscombe: statsmodels Table2x2(table + 0.5, shift_zeros=False); OR = 0.5·5.5/(10.5·5.5).
    const RatioEstimate r = odds_ratio(table({{0, 10}, {5, 5}}));
    EXPECT_NEAR_REL(r.estimate, ref::haldane_odds_ratio, 1e-14);
    EXPECT_NEAR_REL(r.estimate, 0.5 / 10.5, 1e-15);
    EXPECT_NEAR_REL(r.lower, ref::haldane_odds_ratio_lower, 1e-12);
    EXPECT_NEAR_REL(r.upper, ref::haldane_odds_ratio_upper, 1e-12);
    EXPECT_TRUE(r.zero_cell_corrected);
}

TEST(OddsRatio, SaysInItsRemarkThatTheCellsWereCorrected) {
    const RatioEstimate r = odds_ratio(table({{0, 10}, {5, 5}}));
    EXPECT_EQ(r.remark, zero_cell_correction_remark());
    EXPECT_NE(r.remark.find("0.5 to every cell"), std::string::npos);
}

TEST(OddsRatio, IsTheReciprocalWhenTheRowsAreSwapped) {
    // Exact identity: swapping the rows inverts the odds ratio and its interval.
    const RatioEstimate r = odds_ratio(aspirin());
    const RatioEstimate swapped = odds_ratio(table({{104, 10933}, {189, 10845}}));
    EXPECT_NEAR_REL(swapped.estimate, 1 / r.estimate, 1e-14);
    EXPECT_NEAR_REL(swapped.lower, 1 / r.upper, 1e-14);
    EXPECT_NEAR_REL(swapped.upper, 1 / r.lower, 1e-14);
}

TEST(OddsRatio, UsesTheTwoByTwoLeftAfterAnEmptyRowIsSetAside) {
    const RatioEstimate r = odds_ratio(table({{189, 10845}, {0, 0}, {104, 10933}}));
    EXPECT_NEAR_REL(r.estimate, ref::aspirin_odds_ratio, 1e-13);
}

TEST(OddsRatio, RejectsATableThatIsNotTwoByTwo) {
    expect_error([] { odds_ratio(table({{1, 2, 3}, {4, 5, 6}})); },
                 "the odds ratio needs a 2×2 table; this table has 2 rows and 3 columns with counts");
}

TEST(OddsRatio, RejectsAConfidenceLevelOutsideZeroAndOne) {
    expect_error([] { odds_ratio(aspirin(), 95); },
                 "the confidence level must lie between 0 and 1 (for example 0.95), not 95");
    expect_error([] { odds_ratio(aspirin(), 0); },
                 "the confidence level must lie between 0 and 1 (for example 0.95), not 0");
}

TEST(ValidityCheck, RemarksOnTheZeroCellCorrectionOfATwoByTwoTable) {
    const ValidityCheck check = check_validity(table({{0, 10}, {5, 5}}));
    ASSERT_EQ(check.remarks.size(), 1u);
    EXPECT_EQ(check.remarks[0], zero_cell_correction_remark());
    EXPECT_NE(check.summary().find(zero_cell_correction_remark()), std::string::npos);
}

TEST(ValidityCheck, MakesNoZeroCellRemarkForLargerTables) {
    EXPECT_TRUE(check_validity(table({{0, 10, 3}, {5, 5, 2}})).remarks.empty());
    EXPECT_TRUE(check_validity(aspirin()).remarks.empty());
}
