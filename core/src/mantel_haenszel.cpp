#include "assoc/mantel_haenszel.hpp"

#include <boost/math/distributions/normal.hpp>
#include <algorithm>
#include <cmath>

#include "ascii_case.hpp"
#include "assoc/chi_squared_distribution.hpp"
#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "assoc/wording.hpp"
#include "boost_policy.hpp"
#include "common_odds_ratio.hpp"

namespace assoc {

Continuity parse_continuity(const std::string& word) {
    if (word.empty() || detail::equals_ignoring_case(word, "corrected")) return Continuity::corrected;
    if (detail::equals_ignoring_case(word, "uncorrected")) return Continuity::uncorrected;
    throw Error("the correction must be \"corrected\" or \"uncorrected\", not \"" + word + "\"");
}

namespace detail {

double common_odds_ratio(const Strata& strata) {
    double ad = 0.0, bc = 0.0;  // Σ a d / n and Σ b c / n
    for (const Stratum& s : strata.tables) {
        if (!s.informative()) continue;
        ad += s.a * s.d / s.total();
        bc += s.b * s.c / s.total();
    }
    require(ad > 0 && bc > 0,
            std::string("the common odds ratio cannot be estimated: every stratum has a 0 in ") +
                (ad > 0 ? "cell b or cell c, so it would be infinite" : "cell a or cell d, so it would be 0"));
    return ad / bc;
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
    MantelHaenszelResult result;
    result.confidence = confidence;
    result.remarks = strata.remarks;
    for (std::string& remark : detail::uninformative_strata_remarks(strata)) result.remarks.push_back(std::move(remark));

    double difference = 0.0, variance = 0.0;
    // Sums for the Robins–Breslow–Greenland variance: R = Σ ad/n, S = Σ bc/n and the P·R, P·S + Q·R,
    // Q·S terms with P = (a + d)/n, Q = (b + c)/n.
    double r = 0.0, s = 0.0, pr = 0.0, ps_qr = 0.0, qs = 0.0;
    for (const Stratum& t : strata.tables) {
        if (!t.informative()) continue;
        ++result.strata_used;
        const double n = t.total();
        const double row1 = t.a + t.b, row2 = t.c + t.d, col1 = t.a + t.c, col2 = t.b + t.d;
        difference += t.a - row1 * col1 / n;
        variance += row1 * row2 * col1 * col2 / (n * n * (n - 1));
        const double rk = t.a * t.d / n, sk = t.b * t.c / n;
        const double pk = (t.a + t.d) / n, qk = (t.b + t.c) / n;
        r += rk;
        s += sk;
        pr += pk * rk;
        ps_qr += pk * sk + qk * rk;
        qs += qk * sk;
    }
    require(result.strata_used > 0,
            "no stratum has counts in both rows and both columns, so there is nothing to test");

    const double correction = continuity == Continuity::corrected ? std::min(0.5, std::fabs(difference)) : 0.0;
    const double excess = std::fabs(difference) - correction;
    result.statistic = excess * excess / variance;
    result.p_value = chi_squared_p_value(result.statistic, 1.0);

    result.common_odds_ratio = detail::common_odds_ratio(strata);
    const double log_variance = pr / (2 * r * r) + ps_qr / (2 * r * s) + qs / (2 * s * s);
    const boost::math::normal_distribution<double, detail::Policy> normal;
    const double z = boost::math::quantile(boost::math::complement(normal, (1 - confidence) / 2));
    const double half_width = z * std::sqrt(log_variance);
    result.lower = result.common_odds_ratio * std::exp(-half_width);
    result.upper = result.common_odds_ratio * std::exp(half_width);
    return result;
}

MantelHaenszelResult mantel_haenszel_test(const CellGrid& strata, Continuity continuity, double confidence) {
    return mantel_haenszel_test(read_strata(strata), continuity, confidence);
}

}  // namespace assoc
