#pragma once
// Pieces of the Mantel–Haenszel analysis that the Breslow–Day test shares (defined in
// mantel_haenszel.cpp).
#include <string>
#include <vector>

#include "assoc/strata.hpp"

namespace assoc::detail {

// The informative strata (counts in both rows and both columns) with every count multiplied by
// 2^-exponent, which brings the largest to [1, 2): exact, and products of counts then neither
// overflow nor underflow. Sums of a·d/n scale by 2^exponent; ratios of them do not change.
struct ScaledStrata {
    std::vector<Stratum> tables;
    int exponent = 0;
};
ScaledStrata scaled_strata(const Strata& strata);

// The Mantel–Haenszel common odds ratio Σ(a d / n) / Σ(b c / n) over the informative strata;
// throws Error when it is 0 or infinite, or beyond the range of a double.
double common_odds_ratio(const Strata& strata);

// One sentence per stratum that adds nothing (an empty row or column), naming it.
std::vector<std::string> uninformative_strata_remarks(const Strata& strata);

}  // namespace assoc::detail
