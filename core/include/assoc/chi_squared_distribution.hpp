#pragma once
// The chi-squared distribution's upper tail, as the tests of association use it.
// Both functions go through Boost.Math's complement routines, never 1 − cdf, so
// p-values stay accurate far out in the tail (down to about 1e-300).

namespace assoc {

// P(X ≥ statistic) for X ~ chi-squared(df). 0 < df ≤ 1e10, statistic ≥ 0 (infinity gives 0).
double chi_squared_p_value(double statistic, double df);

// The value c with P(X ≥ c) = alpha for X ~ chi-squared(df). 0 < df ≤ 1e10, 0 < alpha < 1.
double chi_squared_critical_value(double df, double alpha);

}  // namespace assoc
