#pragma once
// A confidence interval for Cramér's V, by inverting the noncentral chi-squared distribution.
#include "assoc/count_table.hpp"

namespace assoc {

struct CramersVInterval {
    double estimate = 0.0;  // Cramér's V from the observed X² (as cramers_v)
    double lower = 0.0;
    double upper = 0.0;
    double confidence = 0.95;
    double noncentrality_lower = 0.0;  // λ_L
    double noncentrality_upper = 0.0;  // λ_U
};

// With x the observed Pearson X² and df = (r − 1)(c − 1), P(X ≥ x | λ) for X ~ χ²(df, λ) rises with λ.
// λ_L solves P(X ≥ x | λ_L) = α/2 and λ_U solves P(X ≥ x | λ_U) = 1 − α/2, α = 1 − confidence.
// A bound is 0 when even λ = 0 gives a probability above its target (the observed X² is too small:
// λ_L = 0 when the ordinary p-value is ≥ α/2, and both are 0 when it is ≥ 1 − α/2, an interval [0, 0]
// that says the table is closer to independence than chance usually gives).
// V bounds are √(λ / (n (min(r, c) − 1))), capped at 1. The interval treats the table as one sample
// of n counts with X² approximately noncentral chi-squared: it is rough for small or sparse tables.
// Statistics of 1e5 and more use the Cornish–Fisher expansion of the noncentral chi-squared quantile
// (to the third order in its cumulants, accurate there to better than 1e-11 of λ) instead of the
// series, whose work grows with √λ; beyond X² = 1e308 everything is computed in units of n.
CramersVInterval cramers_v_interval(const CountTable& table, double confidence = 0.95);

// The noncentrality bounds alone, for an observed chi-squared statistic with df degrees of freedom.
struct NoncentralityInterval {
    double lower = 0.0, upper = 0.0;
};
NoncentralityInterval noncentrality_interval(double statistic, double df, double confidence = 0.95);

}  // namespace assoc
