// Pairwise comparisons of the rows of a table (ASSOC.PAIRWISE): which groups differ from which.
#include <gtest/gtest.h>

#include <cstddef>
#include <string>
#include <vector>

#include "assoc/pairwise_comparisons.hpp"
#include "assoc/statistics.hpp"
#include "rates_and_pairs_values.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;
using assoc::test::table;
namespace ref = assoc::reference;

namespace {

template <std::size_t R, std::size_t C>
CountTable reference_table(const double (&counts)[R][C]) {
    Matrix matrix(R, C);
    for (std::size_t r = 0; r < R; ++r)
        for (std::size_t c = 0; c < C; ++c) matrix(r, c) = counts[r][c];
    ReadOptions options;
    return CountTable::from_counts(matrix, options);
}

template <std::size_t N>
void expect_pairs(const PairwiseComparisons& result, const std::size_t (&first)[N], const std::size_t (&second)[N]) {
    ASSERT_EQ(result.pairs.size(), N);
    for (std::size_t k = 0; k < N; ++k) {
        EXPECT_EQ(result.pairs[k].first, first[k]) << "pair " << k;
        EXPECT_EQ(result.pairs[k].second, second[k]) << "pair " << k;
    }
}

template <std::size_t N>
void expect_p_values(const PairwiseComparisons& result, const double (&raw)[N], const double (&adjusted)[N],
                     double tolerance) {
    ASSERT_EQ(result.pairs.size(), N);
    for (std::size_t k = 0; k < N; ++k) {
        EXPECT_NEAR_REL(result.pairs[k].p_value, raw[k], tolerance) << "pair " << k;
        EXPECT_NEAR_REL(result.pairs[k].adjusted_p_value, adjusted[k], tolerance) << "pair " << k;
    }
}

}  // namespace

TEST(PairwiseComparisons, ComparesEveryPairOfRowsInTheOrderOfTheRange) {
    // (1,2), (1,3), …, (1,5), (2,3), …, (4,5): the order of the reference (itertools.combinations).
    const PairwiseComparisons result = pairwise_comparisons(reference_table(ref::departments::counts));
    expect_pairs(result, ref::departments::first, ref::departments::second);
}

TEST(PairwiseComparisons, MatchesScipyPerPairWithHolmsAdjustment) {
    // scipy 1.10.1 chi2_contingency(correction=False) per pair (R 4.2.2 prop.test(correct = FALSE)
    // agrees), statsmodels 0.13.5 multipletests(method="holm") (R p.adjust agrees).
    const PairwiseComparisons result = pairwise_comparisons(reference_table(ref::departments::counts));
    expect_p_values(result, ref::departments::pearson, ref::departments::holm, 1e-10);
}

TEST(PairwiseComparisons, AdjustsWithBonferroniWhenAsked) {
    const PairwiseComparisons result =
        pairwise_comparisons(reference_table(ref::departments::counts), PAdjustment::bonferroni);
    expect_p_values(result, ref::departments::pearson, ref::departments::bonferroni, 1e-10);
}

TEST(PairwiseComparisons, LeavesThePValuesAsTheyAreWithNoAdjustment) {
    const PairwiseComparisons result = pairwise_comparisons(reference_table(ref::departments::counts), PAdjustment::none);
    expect_p_values(result, ref::departments::pearson, ref::departments::pearson, 1e-10);
}

TEST(PairwiseComparisons, MatchesRsFisherTestPerPairWithTheExactMethod) {
    // R 4.2.2 fisher.test on each pair's table; R sums the tables with a relative tolerance of 1e-7.
    const PairwiseComparisons result =
        pairwise_comparisons(reference_table(ref::departments::counts), PAdjustment::holm, PairwiseMethod::exact);
    expect_p_values(result, ref::departments::exact, ref::departments::exact_holm, 1e-7);
}

TEST(PairwiseComparisons, TestsWiderRowsOnTheirColumnsAndLeavesOutARowOfZeros) {
    // Branches: row 3 is all zeros (no pair with it), and the pair (1, 2) has no counts in column 3,
    // so its table is 2×3 (scipy on the reduced table; R chisq.test agrees).
    const PairwiseComparisons result = pairwise_comparisons(reference_table(ref::branches::counts));
    expect_pairs(result, ref::branches::first, ref::branches::second);
    expect_p_values(result, ref::branches::pearson, ref::branches::holm, 1e-10);
    ASSERT_EQ(result.remarks.size(), 2u);
    EXPECT_EQ(result.remarks[0], "Row 3 has no counts and takes no part in the comparisons.");
}

TEST(PairwiseComparisons, TestsWiderRowsExactlyAsRDoes) {
    // R 4.2.2 fisher.test (Freeman–Halton for the 2×3 and 2×4 pairs).
    const PairwiseComparisons result =
        pairwise_comparisons(reference_table(ref::branches::counts), PAdjustment::holm, PairwiseMethod::exact);
    expect_p_values(result, ref::branches::exact, ref::branches::exact_holm, 1e-7);
}

TEST(PairwiseComparisons, GivesOneToAPairWhoseCountsFallInOneColumn) {
    // Rows 1 and 2 are both 100% in column 1: identical shares, p = 1; it still counts as a pair for
    // the adjustment (statsmodels multipletests on {1, p13, p23}).
    const PairwiseComparisons result = pairwise_comparisons(reference_table(ref::one_column::counts));
    expect_p_values(result, ref::one_column::pearson, ref::one_column::holm, 1e-10);
    ASSERT_FALSE(result.remarks.empty());
    EXPECT_EQ(result.remarks[0], "The pair \"row 1\"–\"row 2\" has all counts in one column, so the two rows' "
                                 "shares are the same; the p-value is 1.");
}

TEST(PairwiseComparisons, GivesThePValueOfTheWholeTableForTwoRows) {
    // Identity: with two rows there is one pair, its table is the whole table, and adjusting one
    // p-value leaves it as it is.
    const CountTable two_rows = table({{"", "Yes", "No", "Maybe"}, {"Design", 12, 30, 5}, {"Assembly", 20, 18, 9}});
    const PairwiseComparisons result = pairwise_comparisons(two_rows);
    ASSERT_EQ(result.pairs.size(), 1u);
    EXPECT_EQ(result.pairs[0].p_value, independence_test(two_rows, Method::pearson).p_value);
    EXPECT_EQ(result.pairs[0].adjusted_p_value, result.pairs[0].p_value);
    const PairwiseComparisons exact = pairwise_comparisons(two_rows, PAdjustment::holm, PairwiseMethod::exact);
    EXPECT_EQ(exact.pairs[0].p_value, exact_p_value(two_rows));
}

TEST(PairwiseComparisons, NamesRowsByTheirLabelsOrByTheirPlace) {
    const PairwiseComparisons labelled =
        pairwise_comparisons(table({{"", "Yes", "No"}, {"Design", 3, 4}, {"Sales", 5, 1}}));
    EXPECT_EQ(labelled.pairs[0].first_name, "Design");
    EXPECT_EQ(labelled.pairs[0].second_name, "Sales");
    const PairwiseComparisons unlabelled = pairwise_comparisons(table({{3, 4}, {0, 0}, {5, 1}}));
    EXPECT_EQ(unlabelled.pairs[0].first_name, "row 1");
    EXPECT_EQ(unlabelled.pairs[0].second_name, "row 3");
}

TEST(PairwiseComparisons, ReportsTheSmallestAdjustedPValue) {
    const PairwiseComparisons result = pairwise_comparisons(reference_table(ref::departments::counts));
    EXPECT_NEAR_REL(result.smallest_adjusted_p_value(), ref::departments::holm[8], 1e-10);  // Sales–Logistics
}

TEST(PairwiseComparisons, SaysWhichChiSquaredPValuesAreDoubtful) {
    // Small expected counts in the pairs with row 3 (Cochran's rule, as ASSOC.CHECK judges a table).
    const PairwiseComparisons result = pairwise_comparisons(table({{"", "Yes", "No"}, {"A", 30, 40}, {"B", 35, 30}, {"C", 1, 3}}));
    ASSERT_EQ(result.remarks.size(), 1u);
    EXPECT_EQ(result.remarks[0], "The chi-squared p-values of the pairs \"A\"–\"C\" and \"B\"–\"C\" are "
                                 "doubtful (small expected counts); \"exact\" tests each pair exactly.");
}

TEST(PairwiseComparisons, RefusesWeightedCountsForTheExactMethod) {
    expect_error([] { pairwise_comparisons(table({{1.5, 2}, {3, 4}}), PAdjustment::holm, PairwiseMethod::exact); },
                 "the exact test needs whole counts; this table holds counts that are not whole numbers");
}

TEST(PairwiseComparisons, StopsTheExactTestsAtTheLimitsWithAnErrorThatPointsToPearson) {
    // 3 rows × 8 columns with n ≈ 600 per pair: far beyond a 0.05-second budget.
    std::vector<double> counts;
    for (int r = 0; r < 3; ++r)
        for (int c = 0; c < 8; ++c) counts.push_back(30 + 7 * ((r * 8 + c) % 5));
    const CountTable wide = assoc::test::counts_table(3, 8, counts);
    expect_error([&] { pairwise_comparisons(wide, PAdjustment::holm, PairwiseMethod::exact, {0.05, 400'000'000}); },
                 "the exact tests of the pairs need more time or memory than allowed (0.05 seconds for all pairs "
                 "together and 400 MB of working memory; they stopped at the pair \"row 1\"–\"row 2\"); use "
                 "\"pearson\" for chi-squared p-values instead");
}

TEST(PairwiseComparisons, RefusesMoreRowsThanItCompares) {
    Matrix counts(max_pairwise_rows + 1, 2, 1.0);
    expect_error([&] { pairwise_comparisons(CountTable::from_counts(counts)); },
                 "pairwise comparisons take at most 100 rows with counts (4,950 pairs); this table has 101");
}
