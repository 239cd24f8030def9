#pragma once
// Adjusting a family of p-values for multiple testing, so that the chance of any false
// finding among them stays at the chosen level.
#include <string>
#include <vector>

namespace assoc {

enum class PAdjustment {
    holm,        // Holm (1979) step-down: uniformly more powerful than Bonferroni, same guarantee
    bonferroni,  // each p times the number of tests, at most 1
    none,        // the p-values as they are
};

// Reads an option word: "holm", "bonferroni" or "none" (any case, surrounding spaces ignored).
PAdjustment p_adjustment_from_word(const std::string& word);

// The adjusted p-values, in the order given. Each p must lie in [0, 1].
// Holm: sort ascending, p'(i) = max over j ≤ i of min(1, (m − j + 1)·p(j)), m the number of p-values.
std::vector<double> adjust_p_values(const std::vector<double>& p_values, PAdjustment adjustment);

}  // namespace assoc
