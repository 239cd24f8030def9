#include "assoc/ratio_estimate.hpp"

#include <boost/math/distributions/normal.hpp>
#include <cmath>

#include "argument_checks.hpp"
#include "assoc/error.hpp"
#include "assoc/outcome_column.hpp"
#include "boost_policy.hpp"
#include "ratio_estimate_detail.hpp"

namespace assoc {

bool needs_zero_cell_correction(const CountTable& table) {
    if (!table.is_two_by_two()) return false;
    for (double count : table.counts().values())
        if (count == 0) return true;
    return false;
}

std::string zero_cell_correction_remark() {
    return "A cell of this 2×2 table is 0, so the odds ratio and the risk ratio add 0.5 to every cell "
           "(the Haldane–Anscombe correction) before they are computed.";
}

namespace detail {

TwoByTwoCells ratio_cells(const CountTable& table, const char* what) {
    require(table.is_two_by_two(), std::string(what) + " needs a 2×2 table; this table has " +
                                       std::to_string(table.rows()) + " rows and " + std::to_string(table.columns()) +
                                       " columns with counts");
    if (table.has_column_labels())
        require_outcome_first(table.column_labels()[0], {table.column_labels()[1]}, what);
    TwoByTwoCells cells{table.count(0, 0), table.count(0, 1), table.count(1, 0), table.count(1, 1), false};
    if (needs_zero_cell_correction(table)) {
        // Every cell, not only the zero ones: that is the estimator the literature describes
        // and whose properties are known.
        cells.a += 0.5;
        cells.b += 0.5;
        cells.c += 0.5;
        cells.d += 0.5;
        cells.zero_cell_corrected = true;
    }
    return cells;
}

RatioEstimate log_scale_estimate(double log_estimate, double log_standard_error, double confidence,
                                 bool zero_cell_corrected) {
    const boost::math::normal_distribution<double, Policy> standard_normal;
    const double z = boost::math::quantile(boost::math::complement(standard_normal, (1 - confidence) / 2));
    RatioEstimate result;
    result.estimate = std::exp(log_estimate);
    result.lower = std::exp(log_estimate - z * log_standard_error);
    result.upper = std::exp(log_estimate + z * log_standard_error);
    result.confidence = confidence;
    result.log_standard_error = log_standard_error;
    result.zero_cell_corrected = zero_cell_corrected;
    if (zero_cell_corrected) result.remark = zero_cell_correction_remark();
    require(std::isfinite(result.estimate) && std::isfinite(result.upper) && result.lower > 0,
            "the ratio or its confidence limits are too large or too small for a spreadsheet number with these "
            "counts");
    return result;
}

}  // namespace detail
}  // namespace assoc
