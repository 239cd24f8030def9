#include "assoc/mantel_haenszel.hpp"

#include <boost/math/distributions/normal.hpp>
#include <algorithm>
#include <cmath>

#include "ascii_case.hpp"
#include "assoc/chi_squared_distribution.hpp"
#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "assoc/outcome_column.hpp"
#include "assoc/wording.hpp"
#include "boost_policy.hpp"
#include "common_odds_ratio.hpp"
#include "extended_arithmetic.hpp"

namespace assoc {

Continuity parse_continuity(const std::string& word) {
    if (word.empty() || detail::equals_ignoring_case(word, "corrected")) return Continuity::corrected;
    if (detail::equals_ignoring_case(word, "uncorrected")) return Continuity::uncorrected;
    throw Error("the correction must be \"corrected\" or \"uncorrected\", not \"" + word + "\"");
}

namespace detail {

ScaledStrata scaled_strata(const Strata& strata) {
    ScaledStrata scaled;
    double largest = 0.0;
    for (const Stratum& t : strata.tables)
        if (t.informative()) largest = std::max({largest, t.a, t.b, t.c, t.d});
    scaled.exponent = largest > 0 ? std::ilogb(largest) : 0;
    for (const Stratum& t : strata.tables)
        if (t.informative())
            scaled.tables.push_back({std::ldexp(t.a, -scaled.exponent), std::ldexp(t.b, -scaled.exponent),
                                     std::ldexp(t.c, -scaled.exponent), std::ldexp(t.d, -scaled.exponent), t.label});
    return scaled;
}

double common_odds_ratio(const Strata& strata) {
    // Σ a d / n and Σ b c / n on the scaled cells: the ratio does not change, and a·(d/n) neither
    // overflows nor underflows where the counts are near the ends of the double range.
    double ad = 0.0, bc = 0.0;
    bool any_ad = false, any_bc = false;
    for (const Stratum& s : scaled_strata(strata).tables) {
        ad += s.a * (s.d / s.total());
        bc += s.b * (s.c / s.total());
        any_ad = any_ad || (s.a > 0 && s.d > 0);
        any_bc = any_bc || (s.b > 0 && s.c > 0);
    }
    require(any_ad && any_bc,
            std::string("the common odds ratio cannot be estimated: every stratum has a 0 in ") +
                (any_ad ? "cell b or cell c, so it would be infinite" : "cell a or cell d, so it would be 0"));
    const double ratio = ad / bc;
    require(ratio > 0 && std::isfinite(ratio),
            "the common odds ratio is " + std::string(ratio > 0 ? "above 1e308" : "below 1e-308") +
                ", beyond what a spreadsheet number can hold; the strata's counts are too far apart in size");
    return ratio;
}

std::vector<std::string> uninformative_strata_remarks(const Strata& strata) {
    std::vector<std::string> names;
    for (std::size_t k = 0; k < strata.tables.size(); ++k)
        if (!strata.tables[k].informative()) names.push_back(stratum_name(strata, k).substr(8));  // "3 (Legal)"
    if (names.empty()) return {};
    if (names.size() == 1) return {"The stratum " + names[0] + " has an empty row or column and adds nothing to the test."};
    return {"The strata " + name_list(names) + " have an empty row or column and add nothing to the test."};
}

}  // namespace detail

MantelHaenszelResult mantel_haenszel_test(const Strata& strata, Continuity continuity, double confidence) {
    require(confidence > 0 && confidence < 1,
            "the confidence level must lie between 0 and 1, not " + format_number(confidence));
    detail::require_outcome_first(strata, "the common odds ratio");
    MantelHaenszelResult result;
    result.confidence = confidence;
    result.remarks = strata.remarks;
    for (std::string& remark : detail::uninformative_strata_remarks(strata)) result.remarks.push_back(std::move(remark));
    for (std::size_t k = 0; k < strata.tables.size(); ++k) {
        const Stratum& t = strata.tables[k];
        if (!t.informative()) continue;
        ++result.strata_used;
        require(t.total() > 1, "the " + stratum_name(strata, k) + " holds " + format_number(t.total()) +
                                   " counts in all; the Mantel–Haenszel variance needs more than 1 in every stratum "
                                   "(weights below 1 cannot be used)");
    }
    require(result.strata_used > 0,
            "no stratum has counts in both rows and both columns, so there is nothing to test");

    // Every sum is formed on the cells scaled by 2^-exponent (exact), so that products of counts
    // near 1e308 do not overflow and products of tiny weights do not underflow.
    const detail::ScaledStrata scaled = detail::scaled_strata(strata);
    const int e = scaled.exponent;
    double difference = 0.0, variance = 0.0;  // Σ(a − E(a)) and Σ Var(a), both over 2^e
    // Sums for the Robins–Breslow–Greenland variance: R = Σ ad/n, S = Σ bc/n and the P·R, P·S + Q·R,
    // Q·S terms with P = (a + d)/n, Q = (b + c)/n (R and S over 2^e, P and Q free of the scale).
    double r = 0.0, s = 0.0, pr = 0.0, ps_qr = 0.0, qs = 0.0;
    for (const Stratum& t : scaled.tables) {
        const double n = t.total(), unscaled_n = std::ldexp(n, e);
        const double row1 = t.a + t.b, row2 = t.c + t.d, col1 = t.a + t.c, col2 = t.b + t.d;
        // a − r1 c1 / n = (a d − b c)/n, with both products exact.
        difference += (detail::exact_product(t.a, t.d) - detail::exact_product(t.b, t.c)).value() / n;
        // r1 r2 c1 c2 / (n² (n − 1)), in an order that cannot overflow; n − 1 in the counts' own units.
        variance += (row1 / n) * (row2 / n) * col1 * (std::ldexp(col2, e) / (unscaled_n - 1));
        const double rk = t.a * (t.d / n), sk = t.b * (t.c / n);
        const double pk = (t.a + t.d) / n, qk = (t.b + t.c) / n;
        r += rk;
        s += sk;
        pr += pk * rk;
        ps_qr += pk * sk + qk * rk;
        qs += qk * sk;
    }

    const double unscaled_difference = std::ldexp(difference, e);
    const double correction =
        continuity == Continuity::corrected ? std::min(0.5, std::fabs(unscaled_difference)) : 0.0;
    const double excess = std::fabs(unscaled_difference) - correction;
    result.statistic = excess * (excess / std::ldexp(variance, e));
    require(std::isfinite(result.statistic),
            "the Mantel–Haenszel statistic is larger than a spreadsheet number can hold for these counts (the "
            "association is beyond doubt); divide every count by a common factor to see its size");
    result.p_value = chi_squared_p_value(result.statistic, 1.0);

    result.common_odds_ratio = detail::common_odds_ratio(strata);
    // PR/(2R²) + (PS + QR)/(2RS) + QS/(2S²), each divided in turn so that nothing overflows.
    const double log_variance = (pr / r) / (2 * r) + (ps_qr / r) / (2 * s) + (qs / s) / (2 * s);
    const boost::math::normal_distribution<double, detail::Policy> normal;
    const double z = boost::math::quantile(boost::math::complement(normal, (1 - confidence) / 2));
    // The variance is for counts in their own units: scaling them by 2^e divides it by 2^e.
    const double half_width = z * std::sqrt(std::ldexp(log_variance, -e));
    result.lower = result.common_odds_ratio * std::exp(-half_width);
    result.upper = result.common_odds_ratio * std::exp(half_width);
    require(result.lower > 0 && std::isfinite(result.upper),
            "the confidence interval of the common odds ratio reaches beyond what a spreadsheet number can hold "
            "(below 1e-308 or above 1e308); the strata hold too few counts for an interval at this confidence");
    return result;
}

MantelHaenszelResult mantel_haenszel_test(const CellGrid& strata, Continuity continuity, double confidence) {
    return mantel_haenszel_test(read_strata(strata), continuity, confidence);
}

}  // namespace assoc
