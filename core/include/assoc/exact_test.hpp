#pragma once
// Exact tests of independence, conditional on both margins: Fisher's test for 2×2
// tables and the Freeman–Halton extension for r×c tables.
#include "assoc/count_table.hpp"
#include "assoc/work_limits.hpp"

namespace assoc {

enum class Side {
    two_sided,  // probability of all tables no more probable than the observed one
    lower,      // 2×2 only: P(a ≤ observed a), evidence that the odds ratio is below 1
    upper,      // 2×2 only: P(a ≥ observed a), evidence that the odds ratio is above 1
};

// Two tables whose probabilities differ by less than this relative amount count as tied,
// so rounding cannot drop a table that is exactly as probable as the observed one.
inline constexpr double exact_tie_tolerance = 1e-7;

// The exact p-value. Needs whole counts. Throws assoc::Error for weighted counts, one-sided tests
// on tables other than 2×2, 2×2 tables whose total is 2^53 or more (past which a double does not
// hold every whole number), and r×c tables past the limits.
double exact_p_value(const CountTable& table, Side side = Side::two_sided, const ExactLimits& limits = {});

}  // namespace assoc
