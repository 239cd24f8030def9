#pragma once
// The Mantel–Haenszel common risk ratio across strata (for example Design's promotion rate over
// Assembly's, office by office), with the Greenland–Robins interval: the one ratio to set beside the
// four-fifths selection-rate ratio when the comparison is made within groups.
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/ratio_estimate.hpp"
#include "assoc/strata.hpp"

namespace assoc {

struct CommonRiskRatio {
    // The ratio, the ends of its interval, the confidence and the standard error of its logarithm
    // (never zero-cell corrected: the Mantel–Haenszel sums need no correction).
    RatioEstimate ratio;
    std::size_t strata_used = 0;       // strata with counts in both rows and in column 1
    std::vector<std::string> remarks;  // strata that add nothing, named
};

// With each stratum's table [[a, b], [c, d]] (rows the groups, column 1 the outcome), n1 = a + b,
// n0 = c + d, n = n1 + n0: the Mantel–Haenszel estimate
//   RR = R / S,  R = Σ a·n0/n,  S = Σ c·n1/n,
// and the interval exp(ln RR ± z·√V) with the Greenland–Robins (1985) variance of ln RR
//   V = Σ (n1·n0·(a + c) − a·c·n) / n²  /  (R·S),
// whose numerator is computed as Σ (a·n1·d + c·n0·b) / n² (the same sum, without cancellation).
// For a single stratum both reduce to the risk ratio (a/n1)/(c/n0) and Katz's variance
// 1/a − 1/n1 + 1/c − 1/n0. A stratum with an empty row, or with no count in column 1, adds 0 to
// every sum: it is left out and named in `remarks`. Errors when no stratum remains, or when the
// ratio is 0 (a = 0 in every stratum used) or infinite (c = 0 in every stratum used).
CommonRiskRatio common_risk_ratio(const Strata& strata, double confidence = 0.95);
// The strata read from a range as ASSOC.STRATA reads them (read_strata).
CommonRiskRatio common_risk_ratio(const CellGrid& range, double confidence = 0.95);

}  // namespace assoc
