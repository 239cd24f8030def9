#include "assoc/effect_size.hpp"

#include <algorithm>
#include <cmath>

#include "assoc/error.hpp"
#include "assoc/expected_counts.hpp"
#include "assoc/statistics.hpp"
#include "exact_margins.hpp"

namespace assoc {
namespace {

using detail::DoubleDouble;

// φ² = X²/n = Σ (O·n − R·C)² / (n² R C), in double-double from the exact numerators: it never
// overflows where X² would (X² can pass 1e308 while φ² is at most min(r, c) − 1), and it keeps the
// digits that the bias correction's subtraction needs.
DoubleDouble phi_squared(const CountTable& table) {
    const detail::TableMargins margins = detail::table_margins(table);
    const detail::Normalised n = detail::normalised(margins.total);
    DoubleDouble sum;
    for (std::size_t r = 0; r < table.rows(); ++r) {
        const detail::Normalised row = detail::normalised(margins.rows[r]);
        for (std::size_t c = 0; c < table.columns(); ++c) {
            const detail::Normalised column = detail::normalised(margins.columns[c]);
            const detail::Scaled numerator = margins.numerator(table.count(r, c), r, c);
            const DoubleDouble term = detail::quotient(numerator.value * numerator.value,
                                                       n.mantissa * n.mantissa * row.mantissa * column.mantissa);
            sum = sum + detail::times_power_of_two(term, 2 * numerator.exponent - 2 * n.exponent - row.exponent -
                                                             column.exponent);
        }
    }
    return sum;
}

}  // namespace

double cramers_v(const CountTable& table) {
    // Only a table read without the 2×2 requirement can fail this; V would be 0/0 there.
    require(table.rows() >= 2 && table.columns() >= 2, "Cramér's V needs at least 2 rows and 2 columns with counts");
    const double smaller_side = static_cast<double>(std::min(table.rows(), table.columns()));
    return std::sqrt(phi_squared(table).value() / (smaller_side - 1));
}

double cramers_v_corrected(const CountTable& table) {
    const double n = table.total();
    require(n > 1, "the bias-corrected Cramér's V needs a total count above 1");
    const double r = static_cast<double>(table.rows()), c = static_cast<double>(table.columns());
    // φ² − (r − 1)(c − 1)/(n − 1) in double-double. Where the two are equal in exact arithmetic
    // ([[1, 0], [2, 3]]: 0.2 and 1/5) the difference is within about 1e-30 of 0 and is taken as 0; a
    // plain double left a residue of about 1e-17 there, and its square root showed as V = 6e-9.
    const DoubleDouble n_minus_one = detail::exact_sum(n, -1.0);
    const DoubleDouble bias = detail::quotient(DoubleDouble{(r - 1) * (c - 1), 0.0}, n_minus_one);
    const DoubleDouble observed = phi_squared(table);
    const DoubleDouble excess = observed - bias;
    const double corrected = excess.hi > 0x1p-100 * (observed.hi + bias.hi) ? excess.value() : 0.0;
    const double r_tilde = r - (r - 1) * (r - 1) / (n - 1);
    const double c_tilde = c - (c - 1) * (c - 1) / (n - 1);
    const double denominator = std::min(r_tilde - 1, c_tilde - 1);
    if (corrected == 0) return 0.0;
    require(denominator > 0, "the bias-corrected Cramér's V is undefined for so few counts");
    return std::sqrt(corrected / denominator);
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
    const double phi2 = phi_squared(table).value();  // X²/(X² + n) = φ²/(φ² + 1)
    return std::sqrt(phi2 / (phi2 + 1));
}

double cohens_w(const CountTable& table) { return std::sqrt(phi_squared(table).value()); }

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
