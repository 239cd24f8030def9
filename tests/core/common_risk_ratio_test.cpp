// The Mantel–Haenszel common risk ratio across strata with the Greenland–Robins interval
// (ASSOC.STRATARISK).
#include <gtest/gtest.h>

#include <cmath>
#include <string>

#include "assoc/common_risk_ratio.hpp"
#include "assoc/risk_ratio.hpp"
#include "rates_and_pairs_values.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;
using assoc::test::table;
namespace ref = assoc::reference;

namespace {

const ref::CommonRiskRatioCase& reference_case(const std::string& name) {
    return ref::case_named(ref::common_risk_ratio_cases, name);
}

Strata strata_of(const ref::CommonRiskRatioCase& c) {
    Strata strata;
    for (std::size_t k = 0; k < c.count; ++k)
        strata.tables.push_back({c.strata[k][0], c.strata[k][1], c.strata[k][2], c.strata[k][3], ""});
    return strata;
}

void expect_reference(const CommonRiskRatio& result, const ref::CommonRiskRatioCase& c) {
    EXPECT_NEAR_REL(result.ratio.estimate, c.ratio, 1e-13);
    EXPECT_NEAR_REL(result.ratio.lower, c.lower, 1e-12);
    EXPECT_NEAR_REL(result.ratio.upper, c.upper, 1e-12);
    EXPECT_NEAR_REL(result.ratio.log_standard_error, c.log_standard_error, 1e-12);
}

}  // namespace

TEST(CommonRiskRatio, MatchesStatsmodelsAndTheGreenlandRobinsIntervalAcrossOffices) {
    // Estimate: statsmodels 0.13.5 StratifiedTable.riskratio_pooled. Interval: Greenland & Robins
    // (1985), Biometrics 41:55–68, variance of the log ratio, in 50-digit mpmath (the formula as the R
    // package Hmisc implements it in mhgr(); published_values.md section 13).
    expect_reference(common_risk_ratio(strata_of(reference_case("offices"))), reference_case("offices"));
}

TEST(CommonRiskRatio, UsesTheConfidenceLevelGiven) {
    const ref::CommonRiskRatioCase& c = reference_case("offices_90");
    expect_reference(common_risk_ratio(strata_of(c), c.confidence), c);
}

TEST(CommonRiskRatio, NeedsNoCorrectionForAZeroCellAndLeavesOutStrataThatAddNothing) {
    // Stratum 1 has a = 0 (it still counts), stratum 3 an empty row, stratum 4 nobody with the outcome.
    const ref::CommonRiskRatioCase& c = reference_case("sparse");
    const CommonRiskRatio result = common_risk_ratio(strata_of(c));
    expect_reference(result, c);
    EXPECT_FALSE(result.ratio.zero_cell_corrected);
    EXPECT_EQ(result.strata_used, 4u);
    ASSERT_EQ(result.remarks.size(), 2u);
    EXPECT_EQ(result.remarks[0], "The stratum 3 has an empty row and adds nothing to the common risk ratio.");
    EXPECT_EQ(result.remarks[1],
              "The stratum 4 has no counts in column 1 (the outcome) and adds nothing to the common risk ratio.");
}

TEST(CommonRiskRatio, EqualsTheRiskRatioAndItsIntervalForASingleStratum) {
    // Identity: for one stratum R/S = (a/n1)/(c/n0) and the Greenland–Robins variance reduces to
    // Katz's 1/a − 1/n1 + 1/c − 1/n0, the interval of ASSOC.RISKRATIO (no zero cell, so no correction).
    Strata one;
    one.tables.push_back({73, 173, 46, 199, ""});
    const CommonRiskRatio common = common_risk_ratio(one);
    const RatioEstimate single = risk_ratio(table({{73, 173}, {46, 199}}));
    EXPECT_NEAR_REL(common.ratio.estimate, single.estimate, 1e-14);
    EXPECT_NEAR_REL(common.ratio.lower, single.lower, 1e-13);
    EXPECT_NEAR_REL(common.ratio.upper, single.upper, 1e-13);
}

TEST(CommonRiskRatio, IsTheSameForStrataStackedOrOneRowEach) {
    // The layouts of read_strata hold the same tables (identity).
    const CommonRiskRatio rows = common_risk_ratio(grid({{"Office", "a", "b", "c", "d"},
                                                         {"Northgate", 41, 56, 10, 11},
                                                         {"Riverside", 23, 61, 12, 25},
                                                         {"Hillcrest", 7, 31, 13, 70},
                                                         {"Lakeview", 2, 25, 11, 93}}));
    const CommonRiskRatio stacked = common_risk_ratio(grid({{41, 56}, {10, 11}, {23, 61}, {12, 25}, {7, 31}, {13, 70}, {2, 25}, {11, 93}}));
    EXPECT_EQ(rows.ratio.estimate, stacked.ratio.estimate);
    EXPECT_EQ(rows.ratio.lower, stacked.ratio.lower);
    expect_reference(rows, reference_case("offices"));
}

TEST(CommonRiskRatio, NamesAStratumThatAddsNothingByItsLabel) {
    const CommonRiskRatio result = common_risk_ratio(grid({{"", "a", "b", "c", "d"},
                                                           {"Northgate", 41, 56, 10, 11},
                                                           {"Depot", 0, 0, 4, 5},
                                                           {"Riverside", 23, 61, 12, 25}}));
    ASSERT_EQ(result.remarks.size(), 1u);
    EXPECT_EQ(result.remarks[0], "The stratum 2 (Depot) has an empty row and adds nothing to the common risk ratio.");
}

TEST(CommonRiskRatio, IsExactlyOneWhenEveryoneHasTheOutcome) {
    // b = d = 0 in every stratum: every risk is 1, so the ratio is 1 and its variance 0 (identity).
    const CommonRiskRatio result = common_risk_ratio(grid({{5, 0, 3, 0}, {2, 0, 7, 0}}));
    EXPECT_EQ(result.ratio.estimate, 1.0);
    EXPECT_EQ(result.ratio.lower, 1.0);
    EXPECT_EQ(result.ratio.upper, 1.0);
}

TEST(CommonRiskRatio, RefusesARatioOfZero) {
    expect_error([] { common_risk_ratio(grid({{0, 5, 3, 4}, {0, 6, 2, 7}})); },
                 "the common risk ratio cannot be estimated: every stratum has a 0 in cell a (row 1, column 1), so "
                 "it would be 0");
}

TEST(CommonRiskRatio, RefusesAnInfiniteRatio) {
    expect_error([] { common_risk_ratio(grid({{2, 5, 0, 4}, {1, 6, 0, 7}})); },
                 "the common risk ratio cannot be estimated: every stratum has a 0 in cell c (row 2, column 1), so "
                 "it would be infinite");
}

TEST(CommonRiskRatio, RefusesStrataThatAllAddNothing) {
    expect_error([] { common_risk_ratio(grid({{0, 5, 0, 4}, {3, 4, 0, 0}})); },
                 "no stratum has counts in both rows and in column 1, so there is no common risk ratio to estimate");
}

TEST(CommonRiskRatio, RefusesAConfidenceLevelOutsideZeroToOne) {
    expect_error([] { common_risk_ratio(grid({{2, 5, 1, 4}, {1, 6, 3, 7}}), 0); },
                 "the confidence level must lie between 0 and 1 (for example 0.95), not 0");
}

TEST(CommonRiskRatio, ReadsStrataAsTheMantelHaenszelTestDoes) {
    // read_strata's own message for a range of the wrong shape.
    expect_error([] { common_risk_ratio(grid({{1, 2, 3}, {4, 5, 6}})); },
                 "strata must be given as one row of 4 counts (a, b, c, d) per stratum, or as 2×2 tables stacked in 2 "
                 "columns; this range has 3 columns of counts");
}
