#pragma once
// The odds ratio of a 2×2 table with Woolf's (logit) confidence interval.
#include "assoc/count_table.hpp"
#include "assoc/ratio_estimate.hpp"

namespace assoc {

// For the table [[a, b], [c, d]]: the cross-product ratio ad / (bc), the odds of column 1 in
// row 1 over the odds of column 1 in row 2, with the interval exp(ln OR ± z·√(1/a + 1/b + 1/c + 1/d)),
// z the two-sided normal quantile of `confidence` (0 < confidence < 1).
// When a cell is 0, 0.5 is first added to every cell (Haldane–Anscombe) and the result says so.
// This is the sample odds ratio, not the conditional maximum-likelihood one some exact tests report.
RatioEstimate odds_ratio(const CountTable& table, double confidence = 0.95);

}  // namespace assoc
