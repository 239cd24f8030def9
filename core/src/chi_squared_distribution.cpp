#include "assoc/chi_squared_distribution.hpp"

#include <boost/math/distributions/chi_squared.hpp>
#include <boost/math/special_functions/gamma.hpp>
#include <boost/math/special_functions/log1p.hpp>
#include <cmath>
#include <limits>

#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "boost_policy.hpp"
#include "stirling.hpp"

namespace assoc {
namespace {

using Distribution = boost::math::chi_squared_distribution<double, detail::Policy>;

// Boost's series stop converging somewhere above 1e10 degrees of freedom; a table of at most
// a million cells has fewer than a million, so the cap costs nobody anything.
constexpr double max_df = 1e10;

void check_df(double df) {
    require(!std::isnan(df), "the degrees of freedom are not a number; they must be a number above 0");
    // Messages with numbers are built only on failure: this runs for every p-value of a sheet.
    if (!(df > 0)) throw Error("the degrees of freedom must be above 0, not " + format_number(df));
    if (!(df <= max_df))
        throw Error("the degrees of freedom must be at most " + format_count(max_df) + ", not " + format_number(df));
}

// ln of e^-y y^a / Γ(a), the prefix of Legendre's continued fraction for Q(a, y). For a of 1 or more
// it is written as a·(ln(1 + t) − t) − s(a) + ln a with t = (y − a)/a, so that nothing large cancels;
// below 1 nothing large cancels in the plain form, and t would overflow for a tiny a (a degrees of
// freedom of 1e-307 gave NaN).
double log_gamma_prefix(double a, double y) {
    if (a < 1) return -y + a * std::log(y) - boost::math::lgamma(a, detail::Policy());
    const double t = (y - a) / a;
    return a * boost::math::log1pmx(t, detail::Policy()) - detail::stirling_part(a) + std::log(a);
}

// ln Q(a, y), the regularised upper incomplete gamma function, for y > a + 1, where Q may be far
// below the smallest double: ln of the prefix (log_gamma_prefix) plus ln of Legendre's continued
// fraction (modified Lentz), which converges in a few dozen terms this far out.
double log_upper_gamma(double a, double y) {
    const double tiny = 1e-300;
    double b = y + 1 - a, c = 1 / tiny, d = 1 / b, h = d;
    for (int i = 1; i < 100000; ++i) {
        const double an = -i * (i - a);
        b += 2;
        d = an * d + b;
        if (std::fabs(d) < tiny) d = tiny;
        c = b + an / c;
        if (std::fabs(c) < tiny) c = tiny;
        d = 1 / d;
        const double step = d * c;
        h *= step;
        if (std::fabs(step - 1) < 1e-17) break;
    }
    return log_gamma_prefix(a, y) + std::log(h);
}

// The critical value for an alpha below the smallest normal double (2.2e-308, reachable only by
// typing such a number): Boost's quantile loses digits there (up to 8e-6), so Newton's method on
// ln Q(df/2, x/2) = ln alpha instead, whose derivative is −1/(2 y h) with h the continued fraction.
double critical_value_far_out(double df, double alpha) {
    const double a = df / 2, log_alpha = std::log(alpha);
    double x = boost::math::quantile(boost::math::complement(Distribution(df), std::numeric_limits<double>::min()));
    for (int i = 0; i < 100; ++i) {
        const double y = x / 2;
        const double log_q = log_upper_gamma(a, y);
        const double log_h = log_q - log_gamma_prefix(a, y);
        const double step = (log_q - log_alpha) * 2 * y * std::exp(log_h);
        x += step;
        if (std::fabs(step) <= 1e-16 * x) break;
    }
    return x;
}

}  // namespace

double chi_squared_p_value(double statistic, double df) {
    check_df(df);
    require(!std::isnan(statistic), "the chi-squared statistic is not a number; it must be a number of 0 or more");
    if (!(statistic >= 0)) throw Error("a chi-squared statistic must be 0 or more, not " + format_number(statistic));
    if (std::isinf(statistic)) return 0.0;
    // Far below the mean, the lower tail P(X < x) ≤ (x/2)^(df/2) / Γ(df/2 + 1) is under 2^-54,
    // so the p-value is 1 to the last digit. Boost's series for such points overflow in
    // Γ(df/2) once df passes about 340 (a statistic of exactly 0 with df 600 threw), so
    // answer them here.
    const double half_df = df / 2;
    if (statistic == 0 ||
        half_df * std::log(statistic / 2) - boost::math::lgamma(half_df + 1, detail::Policy()) < std::log(0x1p-54))
        return 1.0;
    return boost::math::cdf(boost::math::complement(Distribution(df), statistic));
}

double chi_squared_critical_value(double df, double alpha) {
    check_df(df);
    require(!std::isnan(alpha), "alpha (the significance level) is not a number; it must lie between 0 and 1");
    require(alpha > 0 && alpha < 1, "alpha (the significance level) must lie between 0 and 1, not " + format_number(alpha));
    if (alpha < std::numeric_limits<double>::min()) return critical_value_far_out(df, alpha);
    return boost::math::quantile(boost::math::complement(Distribution(df), alpha));
}

}  // namespace assoc
