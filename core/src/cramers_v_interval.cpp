#include "assoc/cramers_v_interval.hpp"

#include <algorithm>
#include <boost/math/distributions/non_central_chi_squared.hpp>
#include <cmath>

#include "argument_checks.hpp"
#include "assoc/chi_squared_distribution.hpp"
#include "assoc/effect_size.hpp"
#include "assoc/statistics.hpp"
#include "boost_policy.hpp"

namespace assoc {
namespace {

using NoncentralChiSquared = boost::math::non_central_chi_squared_distribution<double, detail::Policy>;

// The λ with P(X ≥ statistic | df, λ) = upper_tail, or 0 when λ = 0 already gives at least that.
double noncentrality_for(double statistic, double df, double upper_tail, double central_p_value) {
    if (central_p_value >= upper_tail) return 0.0;
    return NoncentralChiSquared::find_non_centrality(boost::math::complement(df, statistic, upper_tail));
}

}  // namespace

CramersVInterval cramers_v_interval(const CountTable& table, double confidence) {
    detail::check_confidence(confidence);
    const double statistic = pearson_statistic(table);
    const double df = degrees_of_freedom(table);
    const double alpha = 1 - confidence;
    const double central_p_value = chi_squared_p_value(statistic, df);

    CramersVInterval result;
    result.confidence = confidence;
    result.estimate = cramers_v(table);
    result.noncentrality_lower = noncentrality_for(statistic, df, alpha / 2, central_p_value);
    result.noncentrality_upper = noncentrality_for(statistic, df, 1 - alpha / 2, central_p_value);
    const double scale = table.total() * static_cast<double>(std::min(table.rows(), table.columns()) - 1);
    result.lower = std::min(1.0, std::sqrt(result.noncentrality_lower / scale));
    result.upper = std::min(1.0, std::sqrt(result.noncentrality_upper / scale));
    return result;
}

}  // namespace assoc
