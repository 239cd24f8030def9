#pragma once
// The Breslow–Day test, with Tarone's correction, that the odds ratio is the same in every
// stratum. A small p-value says the strata differ, so one common odds ratio (and the
// Mantel–Haenszel summary) hides real differences between them.
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/strata.hpp"

namespace assoc {

struct HomogeneityResult {
    double p_value = 1.0;
    double statistic = 0.0;  // Breslow–Day with Tarone's correction, chi-squared with df
    double df = 0.0;         // informative strata − 1
    double uncorrected_statistic = 0.0;  // Breslow–Day without Tarone's correction
    std::size_t strata_used = 0;
    std::vector<std::string> remarks;  // strata left out (an empty row or column)
};

// For each stratum, A is the count of cell a that its margins would give at the Mantel–Haenszel
// common odds ratio ψ (the root of A (r2 − c1 + A) = ψ (r1 − A)(c1 − A) inside the margins), and
// V = 1 / (1/A + 1/(r1 − A) + 1/(c1 − A) + 1/(r2 − c1 + A)). The statistic is
// Σ (a − A)² / V − (Σa − ΣA)² / ΣV (Tarone 1985), on (strata used − 1) degrees of freedom.
// Strata without counts in both rows and both columns are left out and named in `remarks`;
// at least 2 must remain.
HomogeneityResult breslow_day_test(const Strata& strata);
HomogeneityResult breslow_day_test(const CellGrid& strata);

}  // namespace assoc
