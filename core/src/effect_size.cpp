#include "assoc/effect_size.hpp"

#include <algorithm>
#include <cmath>

#include "assoc/error.hpp"
#include "assoc/expected_counts.hpp"
#include "assoc/statistics.hpp"

namespace assoc {

double cramers_v(const CountTable& table) {
    // Only a table read without the 2×2 requirement can fail this; V would be 0/0 there.
    require(table.rows() >= 2 && table.columns() >= 2, "Cramér's V needs at least 2 rows and 2 columns with counts");
    const double smaller_side = static_cast<double>(std::min(table.rows(), table.columns()));
    return std::sqrt(pearson_statistic(table) / (table.total() * (smaller_side - 1)));
}

double cramers_v_corrected(const CountTable& table) {
    const double n = table.total();
    require(n > 1, "the bias-corrected Cramér's V needs a total count above 1");
    const double r = static_cast<double>(table.rows()), c = static_cast<double>(table.columns());
    const double phi_squared = std::max(0.0, pearson_statistic(table) / n - (r - 1) * (c - 1) / (n - 1));
    const double r_tilde = r - (r - 1) * (r - 1) / (n - 1);
    const double c_tilde = c - (c - 1) * (c - 1) / (n - 1);
    const double denominator = std::min(r_tilde - 1, c_tilde - 1);
    if (phi_squared == 0) return 0.0;
    require(denominator > 0, "the bias-corrected Cramér's V is undefined for so few counts");
    return std::sqrt(phi_squared / denominator);
}

double phi_coefficient(const CountTable& table) {
    require(table.is_two_by_two(), "phi is defined for 2×2 tables only; this table has " +
                                       std::to_string(table.rows()) + " rows and " +
                                       std::to_string(table.columns()) + " columns with counts; use Cramér's V");
    // (ad − bc)/√(r1 r2 c1 c2) = (O − E)/√(E₁₁ E₂₂) for the top-left cell, since ad − bc = n (O − E)
    // and E₁₁ E₂₂ = r1 c1 r2 c2 / n². O − E comes without cancellation, and nothing here can
    // overflow the way the product of four margins does for large counts.
    const Matrix deviation = deviations_from_expected(table);
    const Matrix expected = expected_counts(table);
    return deviation(0, 0) / std::sqrt(expected(0, 0)) / std::sqrt(expected(1, 1));
}

double contingency_coefficient(const CountTable& table) {
    const double x2 = pearson_statistic(table);
    return std::sqrt(x2 / (x2 + table.total()));
}

double cohens_w(const CountTable& table) { return std::sqrt(pearson_statistic(table) / table.total()); }

std::string strength_in_words(double cramers_v, const CountTable& table) {
    const double k = static_cast<double>(std::min(table.rows(), table.columns())) - 1;
    const double w = cramers_v * std::sqrt(k);
    if (w < 0.1) return "very weak";
    if (w < 0.3) return "weak";
    if (w < 0.5) return "moderate";
    return "strong";
}

std::string strength_bands() {
    return "Cohen's bands for w = V·√(min(rows, columns) − 1): below 0.1 very weak, from 0.1 weak, from 0.3 "
           "moderate, from 0.5 strong";
}

}  // namespace assoc
