#include "assoc/common_risk_ratio.hpp"

#include <cmath>

#include "argument_checks.hpp"
#include "assoc/error.hpp"
#include "assoc/outcome_column.hpp"
#include "ratio_estimate_detail.hpp"

namespace assoc {

CommonRiskRatio common_risk_ratio(const Strata& strata, double confidence) {
    detail::check_confidence(confidence);
    detail::require_outcome_first(strata, "the common risk ratio");
    CommonRiskRatio result;
    result.remarks = strata.remarks;  // how the strata were read (rows paired in order, totals left out)
    double r = 0.0, s = 0.0, numerator = 0.0;  // Σ a·n0/n, Σ c·n1/n, Σ (a·n1·d + c·n0·b)/n²
    for (std::size_t k = 0; k < strata.tables.size(); ++k) {
        const Stratum& t = strata.tables[k];
        const double n1 = t.a + t.b, n0 = t.c + t.d, n = n1 + n0;
        if (n1 == 0 || n0 == 0) {
            result.remarks.push_back("The " + stratum_name(strata, k) +
                                     " has an empty row and adds nothing to the common risk ratio.");
            continue;
        }
        if (t.a + t.c == 0) {
            result.remarks.push_back("The " + stratum_name(strata, k) +
                                     " has no counts in column 1 (the outcome) and adds nothing to the common risk "
                                     "ratio.");
            continue;
        }
        ++result.strata_used;
        // Each product formed from shares (a/n, n0/n, …) so that huge counts cannot overflow.
        r += t.a * (n0 / n);
        s += t.c * (n1 / n);
        numerator += (t.a / n) * (n1 / n) * t.d + (t.c / n) * (n0 / n) * t.b;
    }
    require(result.strata_used > 0,
            "no stratum has counts in both rows and in column 1, so there is no common risk ratio to estimate");
    require(r > 0 && s > 0, std::string("the common risk ratio cannot be estimated: every stratum has a 0 in ") +
                                (r > 0 ? "cell c (row 2, column 1), so it would be infinite"
                                       : "cell a (row 1, column 1), so it would be 0"));
    const double log_variance = numerator / r / s;
    result.ratio = detail::log_scale_estimate(std::log(r) - std::log(s), std::sqrt(log_variance), confidence, false);
    return result;
}

CommonRiskRatio common_risk_ratio(const CellGrid& range, double confidence) {
    return common_risk_ratio(read_strata(range), confidence);
}

}  // namespace assoc
