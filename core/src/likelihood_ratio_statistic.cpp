#include <boost/math/special_functions/log1p.hpp>
#include <cmath>

#include "assoc/expected_counts.hpp"
#include "assoc/statistics.hpp"
#include "boost_policy.hpp"

namespace assoc {

double likelihood_ratio_statistic(const CountTable& table) {
    // G² = 2 Σ [O ln(O/E) − (O − E)], since Σ (O − E) = 0. Each bracket is ≥ 0, and with
    // x = (O − E)/E it equals E·[(1 + x) ln(1 + x) − x] = E·[log1pmx(x) + x·log1p(x)],
    // which keeps its digits when O is close to E (a naive sum of O ln(O/E) does not).
    const Matrix deviation = deviations_from_expected(table);
    const Matrix expected = expected_counts(table);
    const detail::Policy policy;
    double sum = 0.0;
    for (std::size_t i = 0; i < deviation.size(); ++i) {
        const double e = expected.values()[i];
        const double observed = table.counts().values()[i];
        const double d = deviation.values()[i];
        if (observed == 0) {  // 0·ln 0 = 0, leaving −(O − E) = E
            sum += e;
        } else if (observed < 0.5 * e) {
            // Far below E, x = (O − E)/E is close to −1 and 1 + x loses O/E's digits (it even
            // rounds to 0 when O/E < 2^-53, where log1p(x) has a pole). The direct form has no
            // cancellation here: O ln(O/E) lies in [−E/e, 0) while −(O − E) ≥ E/2.
            const double ratio = observed / e;  // 0 only when O/E is below the smallest double
            sum += observed * (ratio > 0 ? std::log(ratio) : std::log(observed) - std::log(e)) - d;
        } else if (observed > 2 * e) {
            // Far above E the direct form has no cancellation either (O ln(O/E) > 0.69 O), and x·log1p(x)
            // would overflow where E is tiny beside O ([[2, 0], [1, 1e308]] has E = 6e-308).
            const double ratio = observed / e;
            sum += observed * (std::isfinite(ratio) ? std::log(ratio) : std::log(observed) - std::log(e)) - d;
        } else {
            const double x = d / e;
            sum += e * (boost::math::log1pmx(x, policy) + x * boost::math::log1p(x, policy));
        }
    }
    return 2.0 * sum;
}

}  // namespace assoc
