#include "assoc/residuals.hpp"

#include <cmath>

#include "assoc/expected_counts.hpp"

namespace assoc {

Matrix residuals(const CountTable& table, ResidualKind kind) {
    const Matrix deviation = deviations_from_expected(table);
    const Matrix expected = expected_counts(table);
    const double n = table.total();
    Matrix result(table.rows(), table.columns());
    double chi_squared = 0.0;
    for (std::size_t r = 0; r < table.rows(); ++r)
        for (std::size_t c = 0; c < table.columns(); ++c) {
            const double d = deviation(r, c), e = expected(r, c);
            switch (kind) {
            case ResidualKind::raw: result(r, c) = d; break;
            case ResidualKind::pearson: result(r, c) = d / std::sqrt(e); break;
            case ResidualKind::adjusted: {
                // 1 − R/n written as (n − R)/n keeps the digits when one row holds nearly everything.
                const double row_share_left = (n - table.row_total(r)) / n;
                const double column_share_left = (n - table.column_total(c)) / n;
                result(r, c) = d / std::sqrt(e * row_share_left * column_share_left);
                break;
            }
            case ResidualKind::contribution:
            case ResidualKind::percent:
                result(r, c) = d * d / e;
                chi_squared += result(r, c);
                break;
            }
        }
    if (kind == ResidualKind::percent)
        for (std::size_t r = 0; r < table.rows(); ++r)
            for (std::size_t c = 0; c < table.columns(); ++c)
                result(r, c) = chi_squared > 0 ? 100.0 * result(r, c) / chi_squared : 0.0;
    return result;
}

}  // namespace assoc
