#include "assoc/power.hpp"

#include <algorithm>
#include <boost/math/distributions/non_central_chi_squared.hpp>
#include <cmath>
#include <string>

#include "argument_checks.hpp"
#include "assoc/chi_squared_distribution.hpp"
#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "boost_policy.hpp"

namespace assoc {
namespace {

using NoncentralChiSquared = boost::math::non_central_chi_squared_distribution<double, detail::Policy>;

// A trillion counts: far beyond any practical sample, and still exact as a spreadsheet number.
constexpr double largest_sample_size = 1e12;

void check_df(double df) { detail::whole_number(df, 1, 1e6, "the degrees of freedom"); }

// An effect size of 5 or more is a percentage typed as a number (30 for 0.3) far more often than an
// effect: a test of independence has w at most the square root of its degrees of freedom, and a
// goodness of fit reaches 5 only against a share below 1 in 26 that is met 25 times too often.
// Answered, it gives a power of 1 and a sample size of 1 or 2, with full confidence.
constexpr double largest_w = 5;

void check_w(double w) {
    require(std::isfinite(w) && w >= 0, "the effect size w must be a number of 0 or more, not " + format_number(w));
    if (w >= largest_w)
        throw Error("the effect size w is " + format_number(w) + "; w is a fraction, about 0.1 for a small effect, 0.3 "
                    "for a medium and 0.5 for a large one, and Assoc takes w below " + format_number(largest_w) +
                    ". If " + format_number(w) + " is a percentage, enter " + format_number(w / 100) + " (or " +
                    format_number(w) + "%)");
}

// Power for noncentrality λ against the critical value of level alpha.
double power_at(double lambda, double df, double critical_value, double alpha) {
    // With no effect the chance of rejecting is alpha by the definition of the critical value;
    // recomputing it from the critical value would be off in the last digit.
    // The power grows from alpha with slope ½[P(χ²(df + 2) > c) − P(χ²(df) > c)] ≤ ½ in λ, so below
    // λ = 1e-17·alpha it is alpha to the last digit; Boost's series is unreliable for such a λ
    // (subnormal noncentralities gave powers that fell as n doubled).
    if (lambda < 1e-17 * alpha) return alpha;
    // The chance of missing is P(X ≤ c) ≤ e^(c/2) E[e^(−X/2)] = e^(c/2 − λ/4) 2^(−df/2) (Chernoff's
    // bound at t = 1/2). Past e^−750 it is below the smallest double, so the power is exactly 1 in
    // double precision; Boost's series would give up on such a λ (about 2^31 and beyond).
    if (critical_value / 2 - lambda / 4 - df / 2 * std::log(2.0) < -750) return 1.0;
    // The power never falls below alpha (λ ≥ 0); for a tiny λ rounding could take it a unit below.
    return std::max(alpha, boost::math::cdf(boost::math::complement(NoncentralChiSquared(df, lambda), critical_value)));
}

}  // namespace

double chi_squared_power(double w, double n, double df, double alpha) {
    check_w(w);
    require(std::isfinite(n) && n > 0, "the total count n must be a number above 0, not " + format_number(n));
    check_df(df);
    const double critical_value = chi_squared_critical_value(df, alpha);  // checks alpha
    const double lambda = n * w * w;
    require(std::isfinite(lambda), "n·w² is too large for a spreadsheet number");
    return power_at(lambda, df, critical_value, alpha);
}

double chi_squared_sample_size(double w, double power, double df, double alpha) {
    check_w(w);
    require(w > 0, "the effect size w must be above 0; no sample size finds an effect of 0");
    check_df(df);
    const double critical_value = chi_squared_critical_value(df, alpha);  // checks alpha
    require(power > alpha && power < 1, "the power must lie between alpha (" + format_number(alpha) +
                                            ") and 1, for example 0.8, not " + format_number(power));
    // The noncentrality that gives exactly `power`; the answer is the whole n just above λ/w².
    const double lambda = NoncentralChiSquared::find_non_centrality(boost::math::complement(df, critical_value, power));
    const double real_n = lambda / (w * w);
    const std::string too_large = "the sample size needed is above " + format_count(largest_sample_size) +
                                  "; an effect this small cannot be found with any practical sample";
    require(std::isfinite(real_n) && real_n <= largest_sample_size, too_large);
    // The root is close but not exact (and the power is rounded near 1), so settle the answer
    // with the power itself: bracket it from the estimate with doubling steps (lo fails, hi reaches;
    // n = 0 counts as failing), then halve. Power grows with n, so this ends within about 100 tries.
    auto reaches = [&](double n) { return n > 0 && power_at(n * w * w, df, critical_value, alpha) >= power; };
    double hi = std::max(1.0, std::ceil(real_n)), lo = hi - 1;
    for (double step = 1; reaches(lo); step *= 2) {
        hi = lo;
        lo = std::max(0.0, hi - step);
    }
    for (double step = 1; !reaches(hi); step *= 2) {
        lo = hi;
        hi = lo + step;
        require(hi <= 2 * largest_sample_size, too_large);
    }
    while (hi - lo > 1) {
        const double middle = std::floor(lo + (hi - lo) / 2);
        (reaches(middle) ? hi : lo) = middle;
    }
    require(hi <= largest_sample_size, too_large);
    return hi;
}

}  // namespace assoc
