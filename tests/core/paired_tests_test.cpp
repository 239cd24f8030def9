// McNemar's and Bowker's tests for paired classifications.
// McNemar: the approval-rating table [[794,150],[86,570]] from R's ?mcnemar.test example, which cites
// Agresti (1990), p. 350; expected values from statsmodels 0.13.5 mcnemar and R 4.2.2 mcnemar.test /
// binom.test. Bowker: invented appraisal ratings; statsmodels SquareTable.symmetry and R mcnemar.test.
// (Generators: tests/reference/workflow_generate.*.)
#include <gtest/gtest.h>

#include "assoc/paired_tests.hpp"
#include "published_tables.hpp"
#include "test_support.hpp"
#include "workflow_r_values.hpp"
#include "workflow_statsmodels_values.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;
namespace sm = assoc::reference::statsmodels_values;
namespace r = assoc::reference::r_values;

using assoc::test::published::approval;

namespace {
// Invented: the same staff's appraisal (below / meets / exceeds) in two consecutive years.
CellGrid ratings() { return grid({{24, 14, 6}, {4, 41, 15}, {1, 5, 19}}); }
}  // namespace

TEST(PairedTest, AppliesTheContinuityCorrectionToATwoByTwoByDefault) {
    const PairedResult result = paired_test(approval());
    EXPECT_EQ(result.method, PairedMethod::corrected);
    EXPECT_NEAR_REL(result.statistic, r::approval_corrected_statistic, 1e-12);
    EXPECT_NEAR_REL(result.statistic, sm::approval_corrected_statistic, 1e-12);
    EXPECT_NEAR_REL(result.p_value, r::approval_corrected_p, 1e-10);
    EXPECT_EQ(result.df, 1.0);
}

// Exact arithmetic: with b = c = 5 the difference is 0, and max(0, 0 − 1)² = 0, so X² = 0 and p = 1
// (not (0 − 1)²/10 = 0.1, which statsmodels 0.13.5 mcnemar gives). R 4.2.2:
// mcnemar.test(matrix(c(20,5,5,30),2))$statistic is 0, as here.
TEST(PairedTest, NeverLetsTheCorrectionExceedTheDifference) {
    const PairedResult result = paired_test(grid({{20, 5}, {5, 30}}));
    EXPECT_EQ(result.statistic, 0.0);
    EXPECT_EQ(result.p_value, 1.0);
}

TEST(PairedTest, LeavesTheCorrectionOutWhenAsked) {
    const PairedResult result = paired_test(approval(), PairedMethod::uncorrected);
    EXPECT_NEAR_REL(result.statistic, r::approval_uncorrected_statistic, 1e-12);
    EXPECT_NEAR_REL(result.statistic, sm::approval_uncorrected_statistic, 1e-12);
    EXPECT_NEAR_REL(result.p_value, r::approval_uncorrected_p, 1e-10);
    // published_values.md section 5: 17.36, z = −4.17 as quoted for this table (z² = 17.356).
    EXPECT_NEAR(result.statistic, 17.36, 0.005);
}

TEST(PairedTest, GivesTheExactTwoSidedBinomialPValue) {
    const PairedResult result = paired_test(approval(), PairedMethod::exact);
    EXPECT_NEAR_REL(result.p_value, sm::approval_exact_p, 1e-9);
    EXPECT_NEAR_REL(result.p_value, r::approval_exact_p, 1e-9);
    EXPECT_EQ(result.statistic, sm::approval_exact_statistic);  // min(b, c) = 86, as statsmodels reports
    EXPECT_EQ(result.df, 0.0);
}

// Exact identity: with b = 3, c = 9 the p-value is 2 (C(12,0) + … + C(12,3)) / 2¹² = 598/4096.
TEST(PairedTest, MatchesTheBinomialSumForASmallTable) {
    EXPECT_NEAR_REL(paired_test(grid({{10, 3}, {9, 12}}), PairedMethod::exact).p_value, 598.0 / 4096.0, 1e-13);
}

// Exact identity: b = c gives the largest possible p-value, 1.
TEST(PairedTest, CapsTheExactPValueAtOne) {
    EXPECT_EQ(paired_test(grid({{10, 4}, {4, 12}}), PairedMethod::exact).p_value, 1.0);
}

TEST(PairedTest, UsesBowkersTestForAThreeByThreeTable) {
    const PairedResult result = paired_test(ratings());
    EXPECT_EQ(result.method, PairedMethod::uncorrected);
    EXPECT_NEAR_REL(result.statistic, sm::ratings_bowker_statistic, 1e-12);
    EXPECT_NEAR_REL(result.statistic, r::ratings_bowker_statistic, 1e-12);
    EXPECT_EQ(result.df, r::ratings_bowker_df);
    EXPECT_NEAR_REL(result.p_value, r::ratings_bowker_p, 1e-10);
    EXPECT_NEAR_REL(result.p_value, sm::ratings_bowker_p, 1e-10);
}

TEST(PairedTest, SkipsEmptyPairsFromBowkersDegreesOfFreedom) {
    const PairedResult result =
        paired_test(grid({{14, 0, 5, 2}, {0, 22, 7, 1}, {1, 3, 11, 4}, {0, 2, 6, 9}}));
    EXPECT_EQ(result.df, r::sparse_bowker_df);  // 5 of the 6 pairs hold counts
    EXPECT_NEAR_REL(result.statistic, r::sparse_bowker_statistic, 1e-12);
    EXPECT_NEAR_REL(result.p_value, sm::sparse_bowker_p, 1e-10);
}

TEST(PairedTest, KeepsACategoryNobodyChoseSoTheTableStaysSquare) {
    // Category 3 is empty in both years: rows and columns must still line up.
    const PairedResult result = paired_test(grid({{5, 3, 0}, {9, 7, 0}, {0, 0, 0}}), PairedMethod::uncorrected);
    EXPECT_EQ(result.df, 1.0);
    EXPECT_NEAR_REL(result.statistic, 36.0 / 12.0, 1e-14);
}

TEST(PairedTest, ReadsTheMethodWordAndLeavesTheDefaultOpen) {
    EXPECT_FALSE(parse_paired_method("").has_value());
    EXPECT_EQ(parse_paired_method("Exact"), PairedMethod::exact);
    expect_error([] { parse_paired_method("binomial"); },
                 "the method must be \"corrected\", \"uncorrected\" or \"exact\", not \"binomial\"");
}

TEST(PairedTest, RejectsATableThatIsNotSquare) {
    expect_error([] { paired_test(grid({{1, 2, 3}, {4, 5, 6}})); },
                 "a paired table must be square, the same categories as rows and as columns; this one has 2 rows and "
                 "3 columns of counts");
}

TEST(PairedTest, RejectsTheCorrectionForALargerTable) {
    expect_error([] { paired_test(ratings(), PairedMethod::corrected); },
                 "the continuity correction applies to 2×2 tables only; for 3×3 tables omit the method (or give "
                 "\"uncorrected\") for the test of symmetry");
}

TEST(PairedTest, RejectsTheExactTestForALargerTable) {
    expect_error([] { paired_test(ratings(), PairedMethod::exact); },
                 "the exact test applies to 2×2 tables only; for 3×3 tables omit the method (or give \"uncorrected\") "
                 "for the test of symmetry");
}

TEST(PairedTest, RejectsATableWithNoChanges) {
    expect_error([] { paired_test(grid({{5, 0}, {0, 7}})); },
                 "no pair changed category (every count off the diagonal is 0), so there is nothing to test");
}

TEST(PairedTest, RejectsFractionalCountsForTheExactTest) {
    expect_error([] { paired_test(grid({{5, 2.5}, {3, 7}}), PairedMethod::exact); },
                 "the exact paired test needs whole counts; the cells off the diagonal hold 2.5 and 3");
}
