#pragma once
// The Mantel–Haenszel test across strata: is there an association between the two questions
// once the strata (e.g. departments) are held apart? With the common odds ratio and its interval.
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/strata.hpp"

namespace assoc {

enum class Continuity { corrected, uncorrected };

// Reads the option word: "corrected" or "uncorrected", in any case; "" gives corrected.
Continuity parse_continuity(const std::string& word);

struct MantelHaenszelResult {
    double p_value = 1.0;
    double statistic = 0.0;           // chi-squared with 1 degree of freedom
    double common_odds_ratio = 1.0;   // Σ(a d / n) / Σ(b c / n): odds of column 1 in row 1 over row 2
    double lower = 0.0, upper = 0.0;  // confidence interval for the common odds ratio
    double confidence = 0.95;
    std::size_t strata_used = 0;  // strata with counts in both rows and both columns
    // Sentences about strata that add nothing (an empty row or column).
    std::vector<std::string> remarks;
};

// The Mantel–Haenszel statistic (|Σa − ΣE(a)| − ½)² / ΣVar(a) with E(a) = r1 c1 / n and
// Var(a) = r1 r2 c1 c2 / (n² (n − 1)); the ½ is left out when `continuity` is uncorrected, and
// never exceeds |Σa − ΣE(a)| (R's mantelhaen.test applies no correction at all once the
// difference is below ½; for larger differences the two agree).
// The interval uses the Robins–Breslow–Greenland (1986) variance of log(odds ratio).
// Strata without counts in both rows and both columns contribute exactly 0 to every sum;
// they are kept out and named in `remarks`. Errors when no stratum is informative, or when
// the odds ratio is 0 or infinite (a·d = 0 or b·c = 0 in every stratum).
MantelHaenszelResult mantel_haenszel_test(const Strata& strata, Continuity continuity = Continuity::corrected,
                                          double confidence = 0.95);
MantelHaenszelResult mantel_haenszel_test(const CellGrid& strata, Continuity continuity = Continuity::corrected,
                                          double confidence = 0.95);

}  // namespace assoc
