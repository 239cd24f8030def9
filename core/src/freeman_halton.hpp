#pragma once
// The Freeman–Halton exact test for r×c tables, by a network algorithm (see freeman_halton.cpp).
#include "assoc/exact_test.hpp"
#include "assoc/matrix.hpp"

namespace assoc::detail {

// Two-sided exact p-value of a table of whole counts whose rows and columns all hold counts.
double freeman_halton_p_value(const Matrix& counts, const ExactLimits& limits);

}  // namespace assoc::detail
