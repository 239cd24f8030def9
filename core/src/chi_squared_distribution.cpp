#include "assoc/chi_squared_distribution.hpp"

#include <boost/math/distributions/chi_squared.hpp>
#include <boost/math/special_functions/gamma.hpp>
#include <cmath>

#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "boost_policy.hpp"

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
    return boost::math::quantile(boost::math::complement(Distribution(df), alpha));
}

}  // namespace assoc
