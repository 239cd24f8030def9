#pragma once
// Fisher's exact test for 2×2 tables (see fisher_two_by_two.cpp).
#include "assoc/exact_test.hpp"

namespace assoc::detail {

// The p-value of the table [[a, b], [c, d]] of whole counts, every row and column holding counts,
// total below 2^53. Its cost does not grow with the counts (well under a millisecond on any table).
double fisher_two_by_two_p_value(double a, double b, double c, double d, Side side, const ExactLimits& limits);

}  // namespace assoc::detail
