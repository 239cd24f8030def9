#pragma once
// The risk ratio (relative risk) of a 2×2 table with the log-method (Katz) confidence interval.
#include "assoc/count_table.hpp"
#include "assoc/ratio_estimate.hpp"

namespace assoc {

// For the table [[a, b], [c, d]] with rows as groups and column 1 as the event: the risk
// a/(a + b) in row 1 over the risk c/(c + d) in row 2, with the interval
// exp(ln RR ± z·√(1/a − 1/(a + b) + 1/c − 1/(c + d))), z the two-sided normal quantile of `confidence`.
// When a cell is 0, 0.5 is first added to every cell (as for the odds ratio) and the result says so.
RatioEstimate risk_ratio(const CountTable& table, double confidence = 0.95);

}  // namespace assoc
