#include "assoc/expected_counts.hpp"

#include "exact_margins.hpp"

namespace assoc {

Matrix expected_counts(const CountTable& table) {
    using namespace detail;
    const ScaledMargins margins = scaled_margins(table);
    Matrix expected(table.rows(), table.columns());
    for (std::size_t r = 0; r < table.rows(); ++r)
        for (std::size_t c = 0; c < table.columns(); ++c)
            // E needs no more than double precision (it is never a difference): R·C/n on the
            // rounded margins, scaled so that R·C cannot overflow.
            expected(r, c) = margins.unscaled(margins.rows[r].value() * margins.columns[c].value() / margins.total.value());
    return expected;
}

Matrix deviations_from_expected(const CountTable& table) {
    using namespace detail;
    const ScaledMargins margins = scaled_margins(table);
    Matrix deviations(table.rows(), table.columns());
    for (std::size_t r = 0; r < table.rows(); ++r)
        for (std::size_t c = 0; c < table.columns(); ++c) {
            const DoubleDouble observed{margins.scaled(table.count(r, c)), 0.0};
            const DoubleDouble scaled = observed * margins.total - margins.rows[r] * margins.columns[c];
            // The difference is formed exactly (or to about 2^-104); one rounding of it and one
            // division leave O − E accurate to about 1.5 ulp.
            deviations(r, c) = margins.unscaled(scaled.value() / margins.total.value());
        }
    return deviations;
}

}  // namespace assoc
