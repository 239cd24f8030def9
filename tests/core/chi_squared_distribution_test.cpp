// The chi-squared upper tail and its critical values, against the NIST/SEMATECH e-Handbook
// table and against mpmath 1.2.1 (60 digits), both held in core_reference_values.hpp
// (written by tests/reference/generate_core_values.py).
#include <gtest/gtest.h>

#include <cmath>
#include <limits>

#include "assoc/chi_squared_distribution.hpp"
#include "reference_support.hpp"

using namespace assoc;
using assoc::reference::CriticalValue;
using assoc::reference::UpperTail;
using assoc::test::expect_error;

TEST(ChiSquaredCriticalValue, MatchesTheNistTableToThePrintedThreeDecimals) {
    // NIST/SEMATECH e-Handbook of Statistical Methods, section 1.3.6.7.4, upper-tail critical
    // values; several entries are recalled (from memory), see published_values.md section 1.
    for (const CriticalValue& entry : reference::nist_critical_values)
        EXPECT_NEAR(chi_squared_critical_value(entry.df, entry.alpha), entry.nist, 0.0005 + 1e-12)
            << "df " << entry.df << ", alpha " << entry.alpha;
}

TEST(ChiSquaredCriticalValue, MatchesTheMpmathRootToTwelveDigits) {
    // mpmath 1.2.1 findroot of Q(df/2, c/2) = alpha at 60 digits.
    for (const CriticalValue& entry : reference::nist_critical_values)
        EXPECT_NEAR_REL(chi_squared_critical_value(entry.df, entry.alpha), entry.mpmath_root, 1e-12)
            << "df " << entry.df << ", alpha " << entry.alpha;
}

TEST(ChiSquaredCriticalValue, HasTheAlphaOfItsPValue) {
    // Exact identity: P(X ≥ c(alpha)) = alpha.
    for (double df : {1.0, 2.5, 7.0, 40.0, 1000.0})
        for (double alpha : {0.2, 0.05, 1e-6, 1e-50})
            EXPECT_NEAR_REL(chi_squared_p_value(chi_squared_critical_value(df, alpha), df), alpha, 1e-12)
                << "df " << df << ", alpha " << alpha;
}

TEST(ChiSquaredCriticalValue, IsFiniteForAnAlphaFarOutInTheTail) {
    const double c = chi_squared_critical_value(1, 1e-300);
    EXPECT_TRUE(std::isfinite(c));
    // Exact identity, as above.
    EXPECT_NEAR_REL(chi_squared_p_value(c, 1), 1e-300, 1e-12);
}

TEST(ChiSquaredCriticalValue, MatchesMpmathForAnAlphaBelowTheSmallestNormalDoubleAndTinyDegreesOfFreedom) {
    // mpmath 1.3.0 findroot of ln Q(df/2, c/2) = ln alpha at 50 digits. A fuzz finding: df 2^-1019
    // with alpha 2^-1074 gave NaN (the prefix's t = (y - a)/a overflowed for a tiny a).
    EXPECT_NEAR_REL(chi_squared_critical_value(0x1p-1019, 0x1p-1074), 67.757694249064906, 1e-12);
    EXPECT_NEAR_REL(chi_squared_critical_value(1e-300, 1e-310), 38.646331256371537, 1e-12);
    EXPECT_NEAR_REL(chi_squared_critical_value(0.01, 1e-310), 1403.9667449156242, 1e-12);
}

TEST(ChiSquaredPValue, MatchesMpmathForOrdinaryAndLargeDegreesOfFreedom) {
    // mpmath 1.2.1 gammainc at 60 digits. Boost's own error grows with df: about 2e-13 at
    // df 1e8 and 2e-12 at df 1e10 (still within what the rounding of df and x permits),
    // so the two entries above 1e8 get 1e-11.
    for (const UpperTail& entry : reference::ordinary_p_values)
        EXPECT_NEAR_REL(chi_squared_p_value(entry.statistic, entry.df), entry.p_value, entry.df > 1e8 ? 1e-11 : 1e-12)
            << "statistic " << entry.statistic << ", df " << entry.df;
}

TEST(ChiSquaredPValue, MatchesMpmathFarOutInTheTailBelowOneInAGoogolToo) {
    // mpmath 1.2.1 gammainc at 60 digits; every p here is below 1e-100 (down to 2e-306), where
    // 1 − cdf would give 0.
    for (const UpperTail& entry : reference::far_tail_p_values) {
        ASSERT_LT(entry.p_value, 1e-100);
        EXPECT_NEAR_REL(chi_squared_p_value(entry.statistic, entry.df), entry.p_value, 1e-12)
            << "statistic " << entry.statistic << ", df " << entry.df;
    }
}

TEST(ChiSquaredPValue, ForTwoDegreesOfFreedomIsTheExponentialTail) {
    // Exact identity: chi-squared(2) is the exponential with mean 2, so P(X ≥ x) = exp(−x/2).
    for (double x : {0.1, 1.0, 5.991464547107981, 40.0, 700.0, 1400.0})
        EXPECT_NEAR_REL(chi_squared_p_value(x, 2), std::exp(-x / 2), 1e-14) << x;
}

TEST(ChiSquaredPValue, ForOneDegreeOfFreedomIsTheTwoSidedNormalTail) {
    // Exact identity: chi-squared(1) is Z², so P(X ≥ z²) = erfc(z/√2). (Not beyond z = 10:
    // erfc of the rounded z/√2 then carries a relative error near z²·1e-16 itself.)
    for (double z : {0.5, 1.959963984540054, 3.0, 6.0, 10.0})
        EXPECT_NEAR_REL(chi_squared_p_value(z * z, 1), std::erfc(z / std::sqrt(2.0)), 1e-13) << z;
}

TEST(ChiSquaredPValue, IsOneAtZero) {
    for (double df : {0.5, 1.0, 10.0, 600.0, 1e6, 1e10}) EXPECT_EQ(chi_squared_p_value(0, df), 1.0) << df;
}

TEST(ChiSquaredPValue, IsOneForATinyStatisticWithManyDegreesOfFreedom) {
    // A perfectly proportional 25×26 table has X² = 0 and df 600; Boost's series overflowed in
    // Γ(df/2) there before the core answered such points itself (regression).
    // P(X < x) ≤ (x/2)^(df/2)/Γ(df/2 + 1) is far below 1e-16 in each case (the bound is exact maths).
    EXPECT_EQ(chi_squared_p_value(1e-10, 600), 1.0);
    EXPECT_EQ(chi_squared_p_value(1e-300, 1e4), 1.0);
    EXPECT_EQ(chi_squared_p_value(1.0, 1e6), 1.0);
}

TEST(ChiSquaredPValue, IsZeroForAnInfiniteStatistic) { EXPECT_EQ(chi_squared_p_value(HUGE_VAL, 3), 0.0); }

TEST(ChiSquaredPValue, UnderflowsToZeroBeyondTheSmallestDouble) {
    // mpmath 1.2.1: P(X ≥ 2000) for df 10 is about 1e-426, below the smallest double.
    EXPECT_EQ(chi_squared_p_value(2000, 10), 0.0);
}

TEST(ChiSquaredPValue, RejectsANegativeStatistic) {
    expect_error([] { chi_squared_p_value(-1, 2); }, "a chi-squared statistic must be 0 or more, not -1");
}

TEST(ChiSquaredPValue, RejectsAStatisticThatIsNotANumber) {
    expect_error([] { chi_squared_p_value(std::nan(""), 2); },
                 "the chi-squared statistic is not a number; it must be a number of 0 or more");
}

TEST(ChiSquaredPValue, RejectsZeroOrNegativeDegreesOfFreedom) {
    expect_error([] { chi_squared_p_value(1, 0); }, "the degrees of freedom must be above 0, not 0");
    expect_error([] { chi_squared_p_value(1, -3); }, "the degrees of freedom must be above 0, not -3");
}

TEST(ChiSquaredPValue, RejectsDegreesOfFreedomThatAreNotANumber) {
    expect_error([] { chi_squared_p_value(1, std::nan("")); },
                 "the degrees of freedom are not a number; they must be a number above 0");
}

TEST(ChiSquaredPValue, RejectsHugeOrInfiniteDegreesOfFreedom) {
    expect_error([] { chi_squared_p_value(1, 1e11); },
                 "the degrees of freedom must be at most 10,000,000,000, not 1e+11");
    expect_error([] { chi_squared_p_value(1e300, 1e300); },
                 "the degrees of freedom must be at most 10,000,000,000, not 1e+300");
    expect_error([] { chi_squared_p_value(1, HUGE_VAL); },
                 "the degrees of freedom must be at most 10,000,000,000, not infinity");
}

TEST(ChiSquaredPValue, AcceptsTheLargestDegreesOfFreedomAllowed) {
    // mpmath 1.2.1: P(X ≥ 1e10) for df 1e10 is 0.49999811936805484 (ordinary_p_values).
    EXPECT_NEAR_REL(chi_squared_p_value(1e10, 1e10), 0.49999811936805484, 1e-11);
}

TEST(ChiSquaredCriticalValue, RejectsAnAlphaOfZeroOrOne) {
    expect_error([] { chi_squared_critical_value(1, 0); },
                 "alpha (the significance level) must lie between 0 and 1, not 0");
    expect_error([] { chi_squared_critical_value(1, 1); },
                 "alpha (the significance level) must lie between 0 and 1, not 1");
}

TEST(ChiSquaredCriticalValue, RejectsAnAlphaOutsideZeroToOne) {
    expect_error([] { chi_squared_critical_value(1, -0.05); },
                 "alpha (the significance level) must lie between 0 and 1, not -0.05");
    expect_error([] { chi_squared_critical_value(1, 5); },
                 "alpha (the significance level) must lie between 0 and 1, not 5");
}

TEST(ChiSquaredCriticalValue, RejectsAnAlphaThatIsNotANumber) {
    expect_error([] { chi_squared_critical_value(1, std::nan("")); },
                 "alpha (the significance level) is not a number; it must lie between 0 and 1");
}

TEST(ChiSquaredCriticalValue, RejectsBadDegreesOfFreedom) {
    expect_error([] { chi_squared_critical_value(0, 0.05); }, "the degrees of freedom must be above 0, not 0");
    expect_error([] { chi_squared_critical_value(1e20, 0.05); },
                 "the degrees of freedom must be at most 10,000,000,000, not 1e+20");
    expect_error([] { chi_squared_critical_value(std::nan(""), 0.05); },
                 "the degrees of freedom are not a number; they must be a number above 0");
}
