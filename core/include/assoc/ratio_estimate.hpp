#pragma once
// What the odds ratio and the risk ratio of a 2×2 table have in common: an estimate with a
// confidence interval built on the log scale, and the zero-cell correction both apply.
#include <string>

#include "assoc/count_table.hpp"

namespace assoc {

struct RatioEstimate {
    double estimate = 1.0;
    double lower = 1.0;                 // lower end of the confidence interval
    double upper = 1.0;                 // upper end of the confidence interval
    double confidence = 0.95;
    double log_standard_error = 0.0;    // standard error of ln(estimate)
    // True when a cell was 0 and 0.5 was added to every cell (Haldane–Anscombe) first.
    bool zero_cell_corrected = false;
    // One sentence saying so for the validity check (ValidityCheck::remarks); "" when not corrected.
    std::string remark;
};

// Whether a 2×2 table has a zero cell, so that the ratios add 0.5 to every cell.
bool needs_zero_cell_correction(const CountTable& table);

// The sentence a validity check shows for a 2×2 table with a zero cell.
std::string zero_cell_correction_remark();

}  // namespace assoc
