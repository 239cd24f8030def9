// Power and sample size of the chi-squared test for Cohen's effect size w.
#include <gtest/gtest.h>

#include "assoc/power.hpp"
#include "small_sample_values.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
namespace ref = assoc::reference;

TEST(ChiSquaredPower, MatchesTheNoncentralChiSquaredOfScipyAndR) {
    // scipy 1.10.1 ncx2.sf(chi2.isf(alpha, df), df, n·w²); R 4.2.2 pchisq(ncp=) agrees to 1e-15.
    for (const ref::PowerCase& c : ref::power_cases)
        EXPECT_NEAR_REL(chi_squared_power(c.w, c.n, c.df, c.alpha), c.power, 1e-10)
            << "w " << c.w << ", n " << c.n << ", df " << c.df;
}

TEST(ChiSquaredPower, StraddlesPointEightBetween87And88CountsForWPointThree) {
    // published_values.md section 8: power 0.799055746 at n = 87 and 0.803527484 at n = 88 (R agrees);
    // Cohen (1988) ch. 7 prints N = 87 for w = 0.3, power .80 (from memory).
    EXPECT_NEAR(chi_squared_power(0.3, 87, 1), 0.799055746, 1e-9);
    EXPECT_NEAR(chi_squared_power(0.3, 88, 1), 0.803527484, 1e-9);
}

TEST(ChiSquaredPower, IsAlphaForAnEffectOfZero) {
    // With λ = 0 the noncentral distribution is the central one: power = P(reject | H0) = alpha.
    EXPECT_NEAR_REL(chi_squared_power(0, 100, 3, 0.05), 0.05, 1e-12);
}

// Exact bound: P(miss) ≤ e^(c/2 − λ/4)·2^(−df/2) (Chernoff at t = 1/2), here e^(−2.5e9): the power
// is 1 in double precision, also where the noncentral series cannot be summed.
// Exact identity: the power's slope in λ is ½[P(χ²(df + 2) > c) − P(χ²(df) > c)] ≤ ½, so a subnormal
// noncentrality leaves it at alpha to the last digit (the fuzz target found it falling as n doubled).
TEST(ChiSquaredPower, IsAlphaForASubnormalNoncentralityWhateverN) {
    for (double n : {0x1p-1074, 0x1p-1073, 1e-310, 1e-300})
        EXPECT_EQ(chi_squared_power(4, n, 1, 0.05), 0.05) << n;
}

TEST(ChiSquaredPower, IsOneWhenTheNoncentralityIsHuge) {
    EXPECT_EQ(chi_squared_power(1, 1e10, 1), 1.0);
    EXPECT_EQ(chi_squared_power(0.5, 1e12, 30, 0.001), 1.0);
}

TEST(ChiSquaredPower, RejectsANegativeEffectSize) {
    expect_error([] { chi_squared_power(-0.1, 100, 1); }, "the effect size w must be a number of 0 or more, not -0.1");
}

TEST(ChiSquaredPower, RejectsFractionalDegreesOfFreedom) {
    expect_error([] { chi_squared_power(0.3, 100, 1.5); }, "the degrees of freedom must be a whole number, not 1.5");
}

TEST(ChiSquaredPower, RejectsATotalOfZero) {
    expect_error([] { chi_squared_power(0.3, 0, 1); }, "the total count n must be a number above 0, not 0");
}

TEST(ChiSquaredPower, RejectsAnAlphaOutsideZeroAndOne) {
    expect_error([] { chi_squared_power(0.3, 100, 1, 5); },
                 "alpha (the significance level) must lie between 0 and 1, not 5");
}

TEST(ChiSquaredSampleSize, Gives88ForWPointThreeAtPowerPointEight) {
    // published_values.md section 8: the smallest n reaching .80 is 88 (Cohen's table prints 87 = λ/w² rounded).
    EXPECT_EQ(chi_squared_sample_size(0.3, 0.80, 1), 88);
}

TEST(ChiSquaredSampleSize, MatchesTheTableOfSmallestSampleSizes) {
    // published_values.md section 8 (Cohen 1988 Table 7.4.6, from memory; recomputed with scipy ncx2 and R),
    // plus two cases beyond it, all by scanning n with scipy 1.10.1 ncx2.
    for (const ref::SampleSizeCase& c : ref::sample_size_cases)
        EXPECT_EQ(chi_squared_sample_size(c.w, c.power, c.df, c.alpha), c.n)
            << "w " << c.w << ", power " << c.power << ", df " << c.df;
}

TEST(ChiSquaredSampleSize, GivesTheSmallestWholeNumberReachingThePower) {
    // The defining property, checked with chi_squared_power itself.
    const double n = chi_squared_sample_size(0.17, 0.85, 5, 0.01);
    EXPECT_GE(chi_squared_power(0.17, n, 5, 0.01), 0.85);
    EXPECT_LT(chi_squared_power(0.17, n - 1, 5, 0.01), 0.85);
}

TEST(ChiSquaredSampleSize, SettlesForAPowerVeryCloseToOne) {
    const double n = chi_squared_sample_size(0.3, 1 - 1e-12, 3);
    EXPECT_GE(chi_squared_power(0.3, n, 3), 1 - 1e-12);
    EXPECT_LT(chi_squared_power(0.3, n - 1, 3), 1 - 1e-12);
}

TEST(ChiSquaredSampleSize, IsOneForAHugeEffect) {
    // n·w² = 24 is far beyond the critical value 3.84 for one count.
    EXPECT_EQ(chi_squared_sample_size(4.9, 0.8, 1), 1);
}

TEST(ChiSquaredSampleSize, RefusesAnEffectSizeTypedAsAPercentage) {
    expect_error([] { chi_squared_sample_size(30, 0.8, 1); },
                 "the effect size w is 30; w is a fraction, about 0.1 for a small effect, 0.3 for a medium and 0.5 for "
                 "a large one, and Assoc takes w below 5. If 30 is a percentage, enter 0.3 (or 30%)");
}

TEST(ChiSquaredPower, RefusesAnEffectSizeOfFiveOrMore) {
    EXPECT_THROW(chi_squared_power(5, 100, 4), Error);
    EXPECT_NO_THROW(chi_squared_power(4.99, 100, 4));
}

TEST(ChiSquaredSampleSize, RejectsAPowerNotAboveAlpha) {
    expect_error([] { chi_squared_sample_size(0.3, 0.04, 1); },
                 "the power must lie between alpha (0.05) and 1, for example 0.8, not 0.04");
}

TEST(ChiSquaredSampleSize, RejectsAnEffectOfZero) {
    expect_error([] { chi_squared_sample_size(0, 0.8, 1); },
                 "the effect size w must be above 0; no sample size finds an effect of 0");
}

TEST(ChiSquaredSampleSize, RejectsAnEffectTooSmallForAnyPracticalSample) {
    expect_error([] { chi_squared_sample_size(1e-9, 0.8, 1); },
                 "the sample size needed is above 1,000,000,000,000; an effect this small cannot be found with "
                 "any practical sample");
}
