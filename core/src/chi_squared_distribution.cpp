#include "assoc/chi_squared_distribution.hpp"

#include <boost/math/distributions/chi_squared.hpp>
#include <cmath>

#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "boost_policy.hpp"

namespace assoc {
namespace {

using Distribution = boost::math::chi_squared_distribution<double, detail::Policy>;

void check_df(double df) {
    require(std::isfinite(df) && df > 0, "the degrees of freedom must be a number above 0, not " + format_number(df));
}

}  // namespace

double chi_squared_p_value(double statistic, double df) {
    check_df(df);
    require(!std::isnan(statistic) && statistic >= 0,
            "a chi-squared statistic must be 0 or more, not " + format_number(statistic));
    if (std::isinf(statistic)) return 0.0;
    return boost::math::cdf(boost::math::complement(Distribution(df), statistic));
}

double chi_squared_critical_value(double df, double alpha) {
    check_df(df);
    require(alpha > 0 && alpha < 1, "alpha (the significance level) must lie between 0 and 1, not " + format_number(alpha));
    return boost::math::quantile(boost::math::complement(Distribution(df), alpha));
}

}  // namespace assoc
