#pragma once
// The small part of Stirling's formula, shared by the computations that work with logarithms of
// huge factorials without letting their large parts cancel (fisher_two_by_two.cpp,
// chi_squared_distribution.cpp).
#include <boost/math/special_functions/gamma.hpp>
#include <cmath>

#include "boost_policy.hpp"

namespace assoc::detail {

inline constexpr double half_log_two_pi = 0.918938533204672741780329736406;  // ½ ln 2π

// s(k) = ln k! − (k ln k − k) = ln Γ(k + 1) − k ln k + k, for k ≥ 0 (0 at k = 0); about ½ ln 2πk.
inline double stirling_part(double k) {
    if (k == 0) return 0.0;
    if (k <= 15) {
        if (k == std::floor(k)) {
            double factorial = 1;  // exact: 15! is below 2^53
            for (double i = 2; i <= k; ++i) factorial *= i;
            return std::log(factorial) - k * std::log(k) + k;
        }
        return boost::math::lgamma(k + 1, Policy()) - k * std::log(k) + k;
    }
    // Stirling's series: ½ ln 2πk + 1/(12k) − 1/(360k³) + 1/(1260k⁵) − 1/(1680k⁷) + 1/(1188k⁹); past
    // k = 15 the next term is below 2e-16.
    const double inverse = 1 / k, square = inverse * inverse;
    const double series =
        inverse * (1.0 / 12 - square * (1.0 / 360 - square * (1.0 / 1260 - square * (1.0 / 1680 - square / 1188))));
    return half_log_two_pi + 0.5 * std::log(k) + series;
}

}  // namespace assoc::detail
