// Rates with Wilson score intervals (ASSOC.RATES) and rate differences with Newcombe's hybrid score
// interval (ASSOC.RATEDIFF).
#include <gtest/gtest.h>

#include <cmath>
#include <string>

#include "assoc/rates.hpp"
#include "rates_and_pairs_values.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;
namespace ref = assoc::reference;

namespace {

const ref::WilsonCase& wilson_case(const std::string& name) { return ref::case_named(ref::wilson_cases, name); }
const ref::NewcombeCase& newcombe_case(const std::string& name) { return ref::case_named(ref::newcombe_cases, name); }

}  // namespace

// ------------------------------------------------------------------------------ Wilson intervals

TEST(WilsonInterval, MatchesTheFormulaInFiftyDigitsForEveryReferenceCase) {
    // rates_and_pairs_values.hpp: mpmath 1.2.1; statsmodels 0.13.5 proportion_confint(method="wilson")
    // and R 4.2.2 prop.test(correct = FALSE) agree.
    for (const ref::WilsonCase& c : ref::wilson_cases) {
        SCOPED_TRACE(c.name);
        const RateInterval interval = wilson_interval(c.count, c.total, c.confidence);
        EXPECT_DOUBLE_EQ(interval.rate, c.count / c.total);
        if (c.lower == 0) EXPECT_EQ(interval.lower, 0.0);
        else EXPECT_NEAR_REL(interval.lower, c.lower, 1e-13);
        EXPECT_NEAR_REL(interval.upper, c.upper, 1e-13);
    }
}

TEST(WilsonInterval, ReproducesNewcombesPublishedSingleProportionExamples) {
    // Newcombe (1998a), Statistics in Medicine 17:857–872, Table I, method 3 (score, no continuity
    // correction), to the 4 decimals printed (from memory; published_values.md section 12; the 50-digit
    // values above agree):
    // 81/263: 0.2553–0.3662; 15/148: 0.0624–0.1605; 0/20: 0–0.1611; 1/29: 0.0061–0.1718.
    const struct { double x, n, lower, upper; } published[] = {
        {81, 263, 0.2553, 0.3662}, {15, 148, 0.0624, 0.1605}, {0, 20, 0.0, 0.1611}, {1, 29, 0.0061, 0.1718}};
    for (const auto& p : published) {
        const RateInterval interval = wilson_interval(p.x, p.n);
        EXPECT_NEAR(interval.lower, p.lower, 0.00005) << p.x << "/" << p.n;
        EXPECT_NEAR(interval.upper, p.upper, 0.00005) << p.x << "/" << p.n;
    }
}

TEST(WilsonInterval, StartsAtExactlyZeroForARateOfZero) {
    // The score test never rejects p = 0 when x = 0 (exact identity); the upper end is z² / (n + z²).
    const RateInterval interval = wilson_interval(0, 20);
    EXPECT_EQ(interval.rate, 0.0);
    EXPECT_EQ(interval.lower, 0.0);
    const double z = 1.959963984540054;  // the two-sided 95% normal quantile (common practice)
    EXPECT_NEAR_REL(interval.upper, z * z / (20 + z * z), 1e-13);
}

TEST(WilsonInterval, EndsAtExactlyOneForARateOfOne) {
    // By symmetry with a rate of 0: upper = 1 and lower = n / (n + z²) (exact identity).
    const RateInterval interval = wilson_interval(12, 12);
    EXPECT_EQ(interval.rate, 1.0);
    EXPECT_EQ(interval.upper, 1.0);
    EXPECT_NEAR_REL(interval.lower, wilson_case("all_promoted").lower, 1e-13);
}

TEST(WilsonInterval, ContainsTheRateAndStaysInsideZeroToOneForEveryCount) {
    // Identity: the Wilson interval always holds the sample rate and lies in [0, 1].
    for (double n : {1.0, 2.0, 7.0, 50.0, 1e6}) {
        for (double x = 0; x <= n; x += (n > 100 ? n / 7 : 1)) {
            for (double confidence : {0.5, 0.95, 0.999999}) {
                const RateInterval interval = wilson_interval(x, n, confidence);
                EXPECT_LE(0.0, interval.lower);
                EXPECT_LE(interval.lower, interval.rate);
                EXPECT_LE(interval.rate, interval.upper);
                EXPECT_LE(interval.upper, 1.0);
            }
        }
    }
}

TEST(WilsonInterval, IsSymmetricBetweenACountAndTheRest) {
    // Identity: the interval for x of n is one minus the interval for n − x of n, mirrored.
    const RateInterval one = wilson_interval(13, 97), other = wilson_interval(84, 97);
    EXPECT_NEAR(one.lower, 1 - other.upper, 1e-15);
    EXPECT_NEAR(one.upper, 1 - other.lower, 1e-15);
}

TEST(WilsonInterval, KeepsItsDigitsForATinyWeightedCount) {
    // 10⁻⁶ of 10: the textbook (A − B) / (2(n + z²)) loses about 12 digits of the lower end to
    // cancellation; 2x² / (n (A + B)) keeps them. Against 50-digit mpmath (rates_and_pairs_values.hpp).
    const ref::WilsonCase& c = wilson_case("tiny_weight");
    const RateInterval interval = wilson_interval(c.count, c.total, c.confidence);
    EXPECT_NEAR_REL(interval.lower, c.lower, 1e-13);
    EXPECT_NEAR_REL(interval.upper, c.upper, 1e-13);
}

TEST(WilsonInterval, MatchesTheReferenceForHugeCounts) {
    const ref::WilsonCase& c = wilson_case("huge");  // 3·10^11 of 10^12
    const RateInterval interval = wilson_interval(c.count, c.total, c.confidence);
    EXPECT_NEAR_REL(interval.lower, c.lower, 1e-13);
    EXPECT_NEAR_REL(interval.upper, c.upper, 1e-13);
}

TEST(WilsonInterval, RejectsACountAboveItsTotal) {
    expect_error([] { wilson_interval(5, 4); }, "the count of a rate must lie from 0 to its total 4, not 5");
}

TEST(WilsonInterval, RejectsATotalOfZero) {
    expect_error([] { wilson_interval(0, 0); }, "a rate needs a total above 0, not 0");
}

TEST(WilsonInterval, RejectsAConfidenceLevelOfOne) {
    expect_error([] { wilson_interval(1, 4, 1); },
                 "the confidence level must lie between 0 and 1 (for example 0.95), not 1");
}

// ------------------------------------------------------------------------------ rates by row

TEST(RowRates, GivesEachRowItsTotalRateAndWilsonInterval) {
    // Invented departments; Design 73 of 246 and Logistics 13 of 97 against mpmath (statsmodels agrees).
    const RowRates rates = row_rates(grid({{"Department", "Promoted", "Not promoted"},
                                           {"Design", 73, 173},
                                           {"Logistics", 13, 84}}));
    ASSERT_EQ(rates.rows.size(), 2u);
    EXPECT_EQ(rates.rows[0].name, "Design");
    EXPECT_TRUE(rates.rows[0].has_counts);
    EXPECT_EQ(rates.rows[0].total, 246);
    EXPECT_DOUBLE_EQ(rates.rows[0].rate.rate, 73.0 / 246.0);
    EXPECT_NEAR_REL(rates.rows[0].rate.lower, wilson_case("design").lower, 1e-13);
    EXPECT_NEAR_REL(rates.rows[0].rate.upper, wilson_case("design").upper, 1e-13);
    EXPECT_NEAR_REL(rates.rows[1].rate.lower, wilson_case("logistics").lower, 1e-13);
    EXPECT_NEAR_REL(rates.rows[1].rate.upper, wilson_case("logistics").upper, 1e-13);
    EXPECT_TRUE(rates.remarks.empty());
}

TEST(RowRates, CountsEveryColumnAfterTheFirstAsTheRest) {
    // Column 1 against columns 2 and 3 together: 4 of 4 + 3 + 2 = 9 (definition).
    const RowRates rates = row_rates(grid({{4, 3, 2}, {1, 1, 1}}));
    EXPECT_EQ(rates.rows[0].total, 9);
    EXPECT_DOUBLE_EQ(rates.rows[0].rate.rate, 4.0 / 9.0);
    EXPECT_EQ(rates.rows[0].name, "row 1");
}

TEST(RowRates, UsesTheConfidenceLevelGiven) {
    const ref::WilsonCase& c = wilson_case("finance_90");  // 10 of 54 at 90%
    const RowRates rates = row_rates(grid({{10, 44}}), 0.90);
    EXPECT_NEAR_REL(rates.rows[0].rate.lower, c.lower, 1e-13);
    EXPECT_NEAR_REL(rates.rows[0].rate.upper, c.upper, 1e-13);
}

TEST(RowRates, AcceptsATableOfOneRow) {
    const RowRates rates = row_rates(grid({{"", "Promoted", "Not promoted"}, {"Design", 73, 173}}));
    ASSERT_EQ(rates.rows.size(), 1u);
    EXPECT_DOUBLE_EQ(rates.rows[0].rate.rate, 73.0 / 246.0);
}

TEST(RowRates, LeavesARowOfZerosWithoutARateAndSaysWhy) {
    const RowRates rates = row_rates(grid({{"", "Yes", "No"}, {"Design", 3, 4}, {"Legal", 0, nullptr}, {"Sales", 2, 2}}));
    ASSERT_EQ(rates.rows.size(), 3u);
    EXPECT_FALSE(rates.rows[1].has_counts);
    EXPECT_TRUE(rates.rows[2].has_counts);
    ASSERT_EQ(rates.remarks.size(), 1u);
    EXPECT_EQ(rates.remarks[0], "Row 3 (Legal) has no counts, so it has no rate; its line stays empty.");
}

TEST(RowRates, NamesAnUnlabelledRowOfZerosByItsPlace) {
    const RowRates rates = row_rates(grid({{3, 4}, {0, 0}}));
    ASSERT_EQ(rates.remarks.size(), 1u);
    EXPECT_EQ(rates.remarks[0], "Row 2 has no counts, so it has no rate; its line stays empty.");
}

TEST(RowRates, GivesRatesOfZeroAndOneWithIntervalsInsideZeroToOne) {
    // Column 1 empty in one row, the only column with counts in another: rates 0 and 1, whose
    // intervals end at exactly 0 and exactly 1 (exact identities of the Wilson interval).
    const RowRates rates = row_rates(grid({{0, 20}, {12, 0}}));
    EXPECT_EQ(rates.rows[0].rate.rate, 0.0);
    EXPECT_EQ(rates.rows[0].rate.lower, 0.0);
    EXPECT_NEAR_REL(rates.rows[0].rate.upper, wilson_case("newcombe_0_of_20").upper, 1e-13);
    EXPECT_EQ(rates.rows[1].rate.rate, 1.0);
    EXPECT_EQ(rates.rows[1].rate.upper, 1.0);
    EXPECT_NEAR_REL(rates.rows[1].rate.lower, wilson_case("all_promoted").lower, 1e-13);
}

TEST(RowRates, KeepsAColumnOfZerosAsTheOutcome) {
    // Nobody in column 1: every rate is 0, not the rate of the next column.
    const RowRates rates = row_rates(grid({{"", "Promoted", "Not promoted"}, {"A", 0, 5}, {"B", nullptr, 7}}));
    EXPECT_EQ(rates.rows[0].rate.rate, 0.0);
    EXPECT_EQ(rates.rows[1].rate.rate, 0.0);
    EXPECT_EQ(rates.rows[1].total, 7);
}

TEST(RowRates, RejectsASingleColumnOfCounts) {
    expect_error([] { row_rates(grid({{3}, {4}})); },
                 "rates need at least 2 columns of counts (column 1 the outcome of interest, the others the rest); "
                 "this range has 1");
}

TEST(RowRates, RejectsOneColumnOfCountsBesideATotal) {
    // Invented: everyone promoted in both groups, so "Total" holds the sum and is set aside; the
    // one column left has no rest to compare with.
    expect_error([] { row_rates(grid({{"", "Promoted", "Total"}, {"A", 10, 10}, {"B", 12, 12}})); },
                 "rates need at least 2 columns of counts (column 1 the outcome of interest, the others the rest); "
                 "this range has 1 besides a total");
}

TEST(RowRates, RejectsAnOutcomeBesideTheGroupSizes) {
    // Invented: "Promoted | Total" typed for rates, the total not being the sum of the one column.
    EXPECT_THROW(row_rates(grid({{"", "Promoted", "Total"}, {"A", 10, 50}, {"B", 12, 40}})), Error);
}

TEST(RowRates, RejectsATableWithoutCounts) {
    expect_error([] { row_rates(grid({{0, 0}, {0, nullptr}})); },
                 "no row of the table has counts, so there is no rate to compute");
}

TEST(RowRates, RejectsTextAmongTheCounts) {
    expect_error([] { row_rates(grid({{"", "Yes", "No"}, {"A", 3, "n/a"}})); },
                 "row 2 (\"A\"), column 3 (\"No\") holds the text \"n/a\"; counts must be numbers");
}

// ------------------------------------------------------------------------------ rate differences

TEST(RateDifference, MatchesNewcombesMethodTenForEveryReferenceCase) {
    // rates_and_pairs_values.hpp: mpmath from the Wilson ends; statsmodels 0.13.5
    // confint_proportions_2indep(method="newcomb") agrees.
    for (const ref::NewcombeCase& c : ref::newcombe_cases) {
        SCOPED_TRACE(c.name);
        const RateDifference d = rate_difference(c.count1, c.total1, c.count2, c.total2, c.confidence);
        EXPECT_NEAR(d.difference, c.difference, 1e-15);
        EXPECT_NEAR(d.lower, c.lower, 1e-14);
        EXPECT_NEAR(d.upper, c.upper, 1e-14);
    }
}

TEST(RateDifference, ReproducesNewcombesPublishedDifferenceExamples) {
    // Newcombe (1998), Statistics in Medicine 17:873–890, Table II, method 10, to the 4 decimals
    // printed (from memory; published_values.md section 12; the 50-digit values agree):
    // (a) 56/70 − 48/80: 0.0524 to 0.3339; (b) 9/10 − 3/10: 0.1705 to 0.8090; (d) 5/56 − 0/29: −0.0381
    // to 0.1926; (e) 0/10 − 0/20: −0.1611 to 0.2775; (f) 0/10 − 0/10: −0.2775 to 0.2775;
    // (g) 10/10 − 0/20: 0.6791 to 1; (h) 10/10 − 0/10: 0.6075 to 1.
    const struct { double x1, n1, x2, n2, lower, upper; } published[] = {
        {56, 70, 48, 80, 0.0524, 0.3339}, {9, 10, 3, 10, 0.1705, 0.8090}, {5, 56, 0, 29, -0.0381, 0.1926},
        {0, 10, 0, 20, -0.1611, 0.2775},  {0, 10, 0, 10, -0.2775, 0.2775}, {10, 10, 0, 20, 0.6791, 1.0},
        {10, 10, 0, 10, 0.6075, 1.0}};
    for (const auto& p : published) {
        const RateDifference d = rate_difference(p.x1, p.n1, p.x2, p.n2);
        EXPECT_NEAR(d.lower, p.lower, 0.00005) << p.x1 << "/" << p.n1 << " − " << p.x2 << "/" << p.n2;
        EXPECT_NEAR(d.upper, p.upper, 0.00005) << p.x1 << "/" << p.n1 << " − " << p.x2 << "/" << p.n2;
    }
}

TEST(RateDifference, ReachesExactlyOneWhenOneRowHasEveryoneAndTheOtherNoOne) {
    // Rates 1 and 0: the upper end is 1 − 0 + √(0 + 0) = 1 exactly (Newcombe's example (h)).
    const RateDifference d = rate_difference(10, 10, 0, 10);
    EXPECT_EQ(d.difference, 1.0);
    EXPECT_EQ(d.upper, 1.0);
    EXPECT_GE(d.lower, -1.0);
}

TEST(RateDifference, IsTheMirrorImageWhenTheRowsAreSwapped) {
    // Identity: swapping the groups negates the difference and swaps the ends.
    const RateDifference d = rate_difference(73, 246, 46, 245), swapped = rate_difference(46, 245, 73, 246);
    EXPECT_NEAR(d.difference, -swapped.difference, 1e-16);
    EXPECT_NEAR(d.lower, -swapped.upper, 1e-15);
    EXPECT_NEAR(d.upper, -swapped.lower, 1e-15);
}

TEST(RateDifference, ReadsATwoByTwoRangeWithHeaders) {
    const ref::NewcombeCase& c = newcombe_case("design_assembly");
    const RateDifference d = rate_difference(grid({{"", "Promoted", "Not promoted"}, {"Design", 73, 173}, {"Assembly", 46, 199}}));
    EXPECT_NEAR(d.difference, c.difference, 1e-15);
    EXPECT_NEAR(d.lower, c.lower, 1e-14);
    EXPECT_NEAR(d.upper, c.upper, 1e-14);
    EXPECT_NEAR_REL(d.first.rate, 73.0 / 246.0, 1e-15);
}

TEST(RateDifference, UsesTheConfidenceLevelGiven) {
    const ref::NewcombeCase& c = newcombe_case("design_assembly_90");
    const RateDifference d = rate_difference(grid({{73, 173}, {46, 199}}), 0.90);
    EXPECT_NEAR(d.lower, c.lower, 1e-14);
    EXPECT_NEAR(d.upper, c.upper, 1e-14);
}

TEST(RateDifference, AcceptsAColumnOfZerosAsRatesOfZero) {
    // Nobody promoted in either group: the difference is 0 with Newcombe's example (f) interval.
    const ref::NewcombeCase& c = newcombe_case("newcombe_f");
    const RateDifference d = rate_difference(grid({{0, 10}, {0, 10}}));
    EXPECT_EQ(d.difference, 0.0);
    EXPECT_NEAR(d.lower, c.lower, 1e-14);
    EXPECT_NEAR(d.upper, c.upper, 1e-14);
}

TEST(RateDifference, RejectsARowWithoutCounts) {
    expect_error([] { rate_difference(grid({{"", "Yes", "No"}, {"Design", 3, 4}, {"Legal", 0, 0}})); },
                 "row 3 (Legal) has no counts, so it has no rate to compare; the rate difference needs counts in "
                 "both rows");
}

TEST(RateDifference, RejectsATableThatIsNotTwoByTwo) {
    expect_error([] { rate_difference(grid({{1, 2}, {3, 4}, {5, 6}})); },
                 "the rate difference needs a 2×2 table (two groups, the outcome of interest and the rest); this "
                 "range has 3 rows and 2 columns of counts");
}

TEST(RateDifference, RejectsAConfidenceLevelOutsideZeroToOne) {
    expect_error([] { rate_difference(grid({{1, 2}, {3, 4}}), 95); },
                 "the confidence level must lie between 0 and 1 (for example 0.95), not 95");
}
