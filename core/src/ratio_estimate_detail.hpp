#pragma once
// Shared steps of the odds ratio and the risk ratio (defined in ratio_estimate.cpp).
#include "assoc/count_table.hpp"
#include "assoc/ratio_estimate.hpp"

namespace assoc::detail {

// The four cells [[a, b], [c, d]] of a 2×2 table, each raised by 0.5 when any of them is 0.
struct TwoByTwoCells {
    double a = 0, b = 0, c = 0, d = 0;
    bool zero_cell_corrected = false;
};

// Checks that `table` is 2×2 (`what` names the measure in the message) and returns its cells.
TwoByTwoCells ratio_cells(const CountTable& table, const char* what);

// exp(log_estimate ± z·log_standard_error) with z the two-sided normal quantile of `confidence`.
RatioEstimate log_scale_estimate(double log_estimate, double log_standard_error, double confidence,
                                 bool zero_cell_corrected);

}  // namespace assoc::detail
