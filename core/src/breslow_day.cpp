#include "assoc/breslow_day.hpp"

#include <algorithm>
#include <cmath>
#include <utility>

#include "assoc/chi_squared_distribution.hpp"
#include "assoc/error.hpp"
#include "common_odds_ratio.hpp"
#include "extended_arithmetic.hpp"

namespace assoc {
namespace {

// One stratum's table fitted to the common odds ratio ψ: A = a + δ, B = b − δ, C = c − δ,
// D = d + δ with A·D = ψ·B·C, all four scaled by 2^-exponent.
struct FittedStratum {
    double difference;  // δ·2^-exponent, the fitted minus the observed count of cell a
    double inverse_sum;  // (1/A + 1/B + 1/C + 1/D)·2^exponent, for the cells scaled
    int exponent;
};

// The positive root of q x² − l x + k = 0 that lies below k/l·2 (q of either sign, l > 0, k ≥ 0),
// given the discriminant l² − 4qk formed without cancellation: 2k / (l + √disc).
double small_root(double l, double k, double discriminant) { return 2 * k / (l + std::sqrt(discriminant)); }

// Solves A·D = ψ·B·C for the stratum. Which cells shrink is decided first: those of the product
// that is too large (a·d against ψ·b·c, compared in double-double). With s1 ≤ s2 the shrinking
// cells, g1, g2 the growing ones and (p, q) = (1, ψ) or (ψ, 1) the factor on each side, the fitted
// table is s − m, g + m with p(s1 − m)(s2 − m) = q(g1 + m)(g2 + m), a quadratic in m whose
// discriminant is a sum of non-negative terms. When m is more than half of s1 the smallest cell
// s1 − m would lose its digits to cancellation, so it is solved for directly instead (u = s1 − m,
// the others (s2 − s1) + u and (g + s1) − u): each fitted cell keeps its relative precision even
// when it lies within a hair of its bound. The cells are scaled to at most 2 first (an exact power
// of two), and p and q to at most 1, so that nothing overflows.
FittedStratum fit(const Stratum& t, double psi) {
    using detail::DoubleDouble;
    using detail::exact_product;
    const int exponent = std::ilogb(std::max({t.a, t.b, t.c, t.d}));
    const double a = std::ldexp(t.a, -exponent), b = std::ldexp(t.b, -exponent), c = std::ldexp(t.c, -exponent),
                 d = std::ldexp(t.d, -exponent);
    const int psi_exponent = std::ilogb(psi);
    const double scaled_psi = std::ldexp(psi, -std::max(psi_exponent, 0)), one = std::ldexp(1.0, -std::max(psi_exponent, 0));
    // a·d − ψ·b·c: its sign says whether a and d shrink (δ < 0) or b and c do.
    const DoubleDouble gap = DoubleDouble{one, 0} * exact_product(a, d) - DoubleDouble{scaled_psi, 0} * exact_product(b, c);
    const double sign = gap.hi != 0 ? gap.hi : gap.lo;
    if (sign == 0) return {0.0, 1 / a + 1 / b + 1 / c + 1 / d, exponent};

    const bool ad_shrink = sign > 0;
    double s1 = ad_shrink ? a : b, s2 = ad_shrink ? d : c;
    double g1 = ad_shrink ? b : a, g2 = ad_shrink ? c : d;
    const double p = ad_shrink ? one : scaled_psi, q = ad_shrink ? scaled_psi : one;
    if (s1 > s2) std::swap(s1, s2);
    if (g1 > g2) std::swap(g1, g2);

    // m from p s1 s2 − q g1 g2 − (p(s1 + s2) + q(g1 + g2)) m + (p − q) m² = 0.
    const double k = ad_shrink ? gap.value() : -gap.value();
    const double l = p * (s1 + s2) + q * (g1 + g2);
    const double discriminant = p * p * (s1 - s2) * (s1 - s2) + q * q * (g1 - g2) * (g1 - g2) +
                                2 * p * q * ((s1 + s2) * (g1 + g2) + 2 * g1 * g2 + 2 * s1 * s2);
    double m = std::min(small_root(l, k, discriminant), s1);
    double shrunk1 = s1 - m, shrunk2 = s2 - m, grown1 = g1 + m, grown2 = g2 + m;
    if (m > s1 / 2) {
        // u = s1 − m from (p − q) u² + (p Δ + q (G1 + G2)) u − q G1 G2 = 0, Δ = s2 − s1, G = g + s1.
        const double spread = s2 - s1, big1 = g1 + s1, big2 = g2 + s1;
        const double l2 = p * spread + q * (big1 + big2);
        const double discriminant2 = p * p * spread * spread + 2 * p * q * spread * (big1 + big2) +
                                     4 * p * q * big1 * big2 + q * q * (big1 - big2) * (big1 - big2);
        const double u = std::min(small_root(l2, q * big1 * big2, discriminant2), s1);
        shrunk1 = u;
        shrunk2 = spread + u;
        grown1 = big1 - u;
        grown2 = big2 - u;
        m = s1 - u;
    }
    const double inverse_sum = 1 / shrunk1 + 1 / shrunk2 + 1 / grown1 + 1 / grown2;
    return {ad_shrink ? -m : m, inverse_sum, exponent};
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

    // Each stratum adds (a − A)²/V = V z² with V = 1/(1/A + 1/B + 1/C + 1/D) and z = δ/V. Tarone's
    // correction takes off (Σ δ)²/Σ V = (Σ V z)²/Σ V, which leaves Σ V (z − z̄)² with z̄ = Σ δ / Σ V:
    // a sum of non-negative terms, so nothing cancels however close the two are.
    std::vector<double> variances, z;
    double sum_variance = 0.0, sum_difference = 0.0;
    for (const Stratum& t : strata.tables) {
        if (!t.informative()) continue;
        const FittedStratum fitted = fit(t, psi);
        const double variance = std::ldexp(1 / fitted.inverse_sum, fitted.exponent);
        const double difference = std::ldexp(fitted.difference, fitted.exponent);
        variances.push_back(variance);
        z.push_back(fitted.difference * fitted.inverse_sum);  // δ/V: the scale cancels
        sum_variance += variance;
        sum_difference += difference;
    }
    const double mean_z = sum_difference / sum_variance;
    double uncorrected = 0.0, corrected = 0.0;
    for (std::size_t k = 0; k < z.size(); ++k) {
        uncorrected += variances[k] * z[k] * z[k];
        corrected += variances[k] * (z[k] - mean_z) * (z[k] - mean_z);
    }
    require(std::isfinite(corrected) && std::isfinite(uncorrected),
            "the statistic of the test of equal odds ratios is larger than a spreadsheet number can hold for these "
            "counts (the odds ratios differ beyond doubt); divide every count by a common factor to see its size");
    result.uncorrected_statistic = uncorrected;
    result.statistic = corrected;
    result.df = static_cast<double>(result.strata_used - 1);
    result.p_value = chi_squared_p_value(result.statistic, result.df);
    return result;
}

HomogeneityResult breslow_day_test(const CellGrid& strata) { return breslow_day_test(read_strata(strata)); }

}  // namespace assoc
