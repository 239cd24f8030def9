#include "assoc/odds_ratio.hpp"

#include <cmath>

#include "argument_checks.hpp"
#include "ratio_estimate_detail.hpp"

namespace assoc {

RatioEstimate odds_ratio(const CountTable& table, double confidence) {
    detail::check_confidence(confidence);
    const detail::TwoByTwoCells cells = detail::ratio_cells(table, "the odds ratio");
    // Logs first: the products ad and bc could overflow for very large counts.
    const double log_odds_ratio = std::log(cells.a) + std::log(cells.d) - std::log(cells.b) - std::log(cells.c);
    const double log_standard_error = std::sqrt(1 / cells.a + 1 / cells.b + 1 / cells.c + 1 / cells.d);
    return detail::log_scale_estimate(log_odds_ratio, log_standard_error, confidence, cells.zero_cell_corrected);
}

}  // namespace assoc
