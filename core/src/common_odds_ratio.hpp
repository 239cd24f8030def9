#pragma once
// Pieces of the Mantel–Haenszel analysis that the Breslow–Day test shares (defined in
// mantel_haenszel.cpp).
#include <string>
#include <vector>

#include "assoc/strata.hpp"

namespace assoc::detail {

// The Mantel–Haenszel common odds ratio Σ(a d / n) / Σ(b c / n) over the informative strata;
// throws Error when it is 0 or infinite.
double common_odds_ratio(const Strata& strata);

// One sentence per stratum that adds nothing (an empty row or column), naming it.
std::vector<std::string> uninformative_strata_remarks(const Strata& strata);

}  // namespace assoc::detail
