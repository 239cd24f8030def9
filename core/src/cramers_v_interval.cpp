#include "assoc/cramers_v_interval.hpp"

#include <algorithm>
#include <boost/math/distributions/non_central_chi_squared.hpp>
#include <boost/math/distributions/normal.hpp>
#include <boost/math/tools/toms748_solve.hpp>
#include <cmath>

#include "argument_checks.hpp"
#include "assoc/error.hpp"
#include "assoc/chi_squared_distribution.hpp"
#include "assoc/effect_size.hpp"
#include "assoc/statistics.hpp"
#include "boost_policy.hpp"

namespace assoc {
namespace {

using NoncentralChiSquared = boost::math::non_central_chi_squared_distribution<double, detail::Policy>;

// Beyond this statistic the interval uses the Cornish–Fisher expansion of the noncentral
// chi-squared quantile: Boost's series there needs work that grows with √λ (0.7 s at λ = 1e9) and
// fails past λ ≈ 4e9, while the expansion's first neglected terms, of order 1/(df + 2λ)², move λ by
// less than 1e-11 of itself from here on (tests/reference/noncentral_generate.py checks it).
constexpr double expansion_from = 1e5;

// μ = λ/n with P(X ≥ n·ratio | df, λ) = the upper tail whose standard normal point is z, by the
// Cornish–Fisher expansion to the third order in the cumulants κ_r = 2^(r−1) (r − 1)! (df + r λ).
// Everything is in units of n, so that X² = n·ratio may pass the largest double.
double scaled_noncentrality_by_expansion(double ratio, double n, double df, double z) {
    const double d = df / n;
    const double z2 = z * z, z3 = z2 * z, z4 = z2 * z2;
    // The quantile over n, minus the observed ratio; it rises with μ (by about 1 per unit).
    const auto gap = [&](double mu) {
        const double base = d + 2 * mu;  // (df + 2λ)/n
        const double g1 = 8 * (d + 3 * mu) / std::pow(2 * base, 1.5) / std::sqrt(n);
        const double g2 = 12 * (d + 4 * mu) / (base * base * n);
        const double g3 = 384 * (d + 5 * mu) / (std::pow(2 * base, 2.5) * std::pow(n, 1.5));
        const double w = z + (z2 - 1) * g1 / 6 + (z3 - 3 * z) * g2 / 24 - (2 * z3 - 5 * z) * g1 * g1 / 36 +
                         (z4 - 6 * z2 + 3) * g3 / 120 - (z4 - 5 * z2 + 2) * g1 * g2 / 24 +
                         (12 * z4 - 53 * z2 + 17) * g1 * g1 * g1 / 324;
        return d + mu + std::sqrt(2 * base / n) * w - ratio;
    };
    const double spread = std::sqrt(2 * (d + 2 * ratio) / n);  // σ/n at μ near the ratio
    const double guess = std::max(0.0, ratio - d - z * spread);
    const double low = std::max(0.0, guess - 50 * spread), high = guess + 50 * spread;
    if (gap(low) >= 0) return low;
    std::uintmax_t iterations = 200;
    const auto root = boost::math::tools::toms748_solve(gap, low, high, boost::math::tools::eps_tolerance<double>(50),
                                                        iterations, detail::Policy());
    return (root.first + root.second) / 2;
}

// λ/n with P(X ≥ n·ratio | df, λ) = upper_tail, or 0 when λ = 0 already gives at least that.
double scaled_noncentrality(double ratio, double n, double df, double upper_tail, double central_p_value) {
    if (central_p_value >= upper_tail) return 0.0;
    const double statistic = ratio * n;
    if (statistic < expansion_from)
        return NoncentralChiSquared::find_non_centrality(boost::math::complement(df, statistic, upper_tail)) / n;
    const boost::math::normal_distribution<double, detail::Policy> normal;
    return scaled_noncentrality_by_expansion(ratio, n, df, boost::math::quantile(boost::math::complement(normal, upper_tail)));
}

}  // namespace

NoncentralityInterval noncentrality_interval(double statistic, double df, double confidence) {
    detail::check_confidence(confidence);
    const double central_p_value = chi_squared_p_value(statistic, df);  // checks the statistic and df
    require(std::isfinite(statistic), "the chi-squared statistic must be a finite number");
    const double alpha = 1 - confidence;
    return {scaled_noncentrality(statistic, 1.0, df, alpha / 2, central_p_value),
            scaled_noncentrality(statistic, 1.0, df, 1 - alpha / 2, central_p_value)};
}

CramersVInterval cramers_v_interval(const CountTable& table, double confidence) {
    detail::check_confidence(confidence);
    const double statistic = pearson_statistic(table);  // may pass 1e308 for huge counts: then only X²/n is used
    const double df = degrees_of_freedom(table);
    const double alpha = 1 - confidence;
    const double central_p_value = chi_squared_p_value(statistic, df);
    const double n = table.total();
    const double sides = static_cast<double>(std::min(table.rows(), table.columns()) - 1);
    CramersVInterval result;
    result.confidence = confidence;
    result.estimate = cramers_v(table);
    const double ratio = std::isfinite(statistic) ? statistic / n : result.estimate * result.estimate * sides;  // X²/n
    const double lower = scaled_noncentrality(ratio, n, df, alpha / 2, central_p_value);
    const double upper = scaled_noncentrality(ratio, n, df, 1 - alpha / 2, central_p_value);
    result.noncentrality_lower = lower * n;
    result.noncentrality_upper = upper * n;
    result.lower = std::min(1.0, std::sqrt(lower / sides));
    result.upper = std::min(1.0, std::sqrt(upper / sides));
    return result;
}

}  // namespace assoc
