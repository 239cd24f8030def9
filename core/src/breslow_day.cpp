#include "assoc/breslow_day.hpp"

#include <algorithm>
#include <cmath>

#include "assoc/chi_squared_distribution.hpp"
#include "assoc/error.hpp"
#include "common_odds_ratio.hpp"

namespace assoc {
namespace {

// The count of cell a that the stratum's margins give at odds ratio psi: the root of
// (1 − ψ) A² + (r2 − c1 + ψ (r1 + c1)) A − ψ r1 c1 = 0 between max(0, c1 − r2) and min(r1, c1).
// Both roots are formed without cancellation; the one inside the margins is kept.
double fitted_a(const Stratum& t, double psi) {
    const double r1 = t.a + t.b, r2 = t.c + t.d, c1 = t.a + t.c;
    const double low = std::max(0.0, c1 - r2), high = std::min(r1, c1);
    const double quadratic = 1 - psi, linear = r2 - c1 + psi * (r1 + c1), constant = -psi * r1 * c1;
    double root;
    if (quadratic == 0) {
        root = -constant / linear;
    } else {
        const double q = -0.5 * (linear + std::copysign(std::sqrt(linear * linear - 4 * quadratic * constant), linear));
        const double first = q / quadratic, second = constant / q;
        const auto distance = [&](double x) { return x < low ? low - x : (x > high ? x - high : 0.0); };
        root = distance(first) <= distance(second) ? first : second;
    }
    return std::clamp(root, low, high);  // only rounding can take the root outside
}

}  // namespace

HomogeneityResult breslow_day_test(const Strata& strata) {
    HomogeneityResult result;
    result.remarks = strata.remarks;
    for (std::string& remark : detail::uninformative_strata_remarks(strata)) result.remarks.push_back(std::move(remark));
    for (const Stratum& t : strata.tables) result.strata_used += t.informative() ? 1 : 0;
    require(result.strata_used >= 2,
            "the test of equal odds ratios needs at least 2 strata with counts in both rows and both columns");
    const double psi = detail::common_odds_ratio(strata);

    double sum_squares = 0.0, sum_a = 0.0, sum_fitted = 0.0, sum_variance = 0.0;
    for (const Stratum& t : strata.tables) {
        if (!t.informative()) continue;
        const double fitted = fitted_a(t, psi);
        const double r1 = t.a + t.b, r2 = t.c + t.d, c1 = t.a + t.c;
        const double variance = 1 / (1 / fitted + 1 / (r1 - fitted) + 1 / (c1 - fitted) + 1 / (r2 - c1 + fitted));
        sum_squares += (t.a - fitted) * (t.a - fitted) / variance;
        sum_a += t.a;
        sum_fitted += fitted;
        sum_variance += variance;
    }
    result.uncorrected_statistic = sum_squares;
    // Tarone's term never exceeds the sum (Cauchy–Schwarz); max() only absorbs rounding.
    const double tarone = (sum_a - sum_fitted) * (sum_a - sum_fitted) / sum_variance;
    result.statistic = std::max(0.0, sum_squares - tarone);
    result.df = static_cast<double>(result.strata_used - 1);
    result.p_value = chi_squared_p_value(result.statistic, result.df);
    return result;
}

HomogeneityResult breslow_day_test(const CellGrid& strata) { return breslow_day_test(read_strata(strata)); }

}  // namespace assoc
