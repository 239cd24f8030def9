#pragma once
// Pearson's goodness-of-fit test: do the counts of one categorical variable follow given shares?
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/cell.hpp"

namespace assoc {

struct GoodnessOfFit {
    double statistic = 0.0;           // X² = Σ (O − E)² / E
    double df = 0.0;                  // categories − 1 − estimated parameters
    double p_value = 1.0;
    std::vector<double> observed;     // as read, one per category
    std::vector<double> expected;     // rescaled to the observed total, one per category
    std::size_t categories = 0;       // categories tested: those with an expected count above 0
    std::vector<std::string> remarks; // how the ranges were read (expected values matched by label)
};

// The test on numbers. `expected` holds expected counts or shares in any unit (9, 3, 3, 1 or
// 0.5625, …); they are rescaled to the observed total. Empty `expected` means equal shares.
// A category expected to be 0 must have an observed count of 0; it is then left out and does not
// count as a category. `estimated` parameters taken from the data lower the df, which must stay ≥ 1.
GoodnessOfFit goodness_of_fit(const std::vector<double>& observed, const std::vector<double>& expected = {},
                              double estimated = 0);

// The same, reading the worksheet ranges. Each range is one row or one column of numbers;
// it may carry labels the way a table does (see read_count_table): a text cell at its start
// ("Observed"), or a row of labels above a row of counts, or a column of labels to the left of
// a column of counts. Blanks count as 0. The two ranges need the same number of values but
// not the same orientation. When both name every category (distinct labels), the expected values are
// matched to the observed categories by label, whatever their order; different labels are an error.
// An empty `expected` grid means equal shares.
GoodnessOfFit goodness_of_fit(const CellGrid& observed, const CellGrid& expected = {}, double estimated = 0);

}  // namespace assoc
