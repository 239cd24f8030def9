#pragma once
// The test statistics of independence for a two-way count table.
#include <string>

#include "assoc/count_table.hpp"

namespace assoc {

// Pearson's X² = Σ (O − E)² / E.
double pearson_statistic(const CountTable& table);

// The likelihood-ratio statistic G² = 2 Σ O ln(O / E), with 0·ln 0 = 0.
double likelihood_ratio_statistic(const CountTable& table);

// Yates' continuity-corrected X² = Σ max(0, |O − E| − ½)² / E, for 2×2 tables only.
// The correction is capped at |O − E|, so it never turns a deviation around.
double yates_statistic(const CountTable& table);

// (rows − 1)(columns − 1) over the rows and columns that hold counts.
double degrees_of_freedom(const CountTable& table);

enum class Method { pearson, likelihood_ratio, yates };

// The statistic of `method`, with its degrees of freedom and upper-tail p-value. A statistic above
// the largest double (only where counts near 1e308 meet expected counts near 1e-308) is infinity,
// and its p-value 0, which is right: the p-value of a statistic that large is below 1e-308.
struct TestResult {
    double statistic = 0.0;
    double df = 0.0;
    double p_value = 1.0;
};
TestResult independence_test(const CountTable& table, Method method = Method::pearson);

// The statistic itself, or an error that says it is too large to show (with its p-value) when it is.
double representable_statistic(const TestResult& result, Method method);

// Plain name of a method for messages and reports: "Pearson X²", "G²", "Yates X²".
std::string method_name(Method method);

}  // namespace assoc
