#pragma once
// Power and sample size of the chi-squared test for an effect size w (Cohen 1988, ch. 7).
// Model: with n counts in all, X² follows the noncentral chi-squared distribution with df degrees
// of freedom and noncentrality λ = n·w²; the test rejects at the critical value c with
// P(χ²(df) ≥ c) = alpha.

namespace assoc {

// P(χ²(df, λ = n·w²) > c): the chance the test finds an effect of size w with n counts.
// w ≥ 0, n > 0, df a whole number ≥ 1, 0 < alpha < 1. With w = 0 the power is alpha.
double chi_squared_power(double w, double n, double df, double alpha = 0.05);

// The smallest whole n whose power reaches `power`: w > 0, alpha < power < 1. An answer above
// a trillion (1e12) counts is an error.
double chi_squared_sample_size(double w, double power, double df, double alpha = 0.05);

}  // namespace assoc
