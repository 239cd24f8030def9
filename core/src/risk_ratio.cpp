#include "assoc/risk_ratio.hpp"

#include <cmath>

#include "argument_checks.hpp"
#include "ratio_estimate_detail.hpp"

namespace assoc {

RatioEstimate risk_ratio(const CountTable& table, double confidence) {
    detail::check_confidence(confidence);
    const detail::TwoByTwoCells cells = detail::ratio_cells(table, "the risk ratio");
    const double row1 = cells.a + cells.b, row2 = cells.c + cells.d;
    const double log_risk_ratio = std::log(cells.a) - std::log(row1) - std::log(cells.c) + std::log(row2);
    // 1/a − 1/(a+b) written as (b/a)/(a+b): no cancellation when a is large and b small,
    // and no overflowing product for huge counts.
    const double log_standard_error = std::sqrt(cells.b / cells.a / row1 + cells.d / cells.c / row2);
    return detail::log_scale_estimate(log_risk_ratio, log_standard_error, confidence, cells.zero_cell_corrected);
}

}  // namespace assoc
