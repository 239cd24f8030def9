#include "assoc/residuals.hpp"

#include <cmath>
#include <vector>

#include "assoc/error.hpp"
#include "assoc/expected_counts.hpp"
#include "exact_margins.hpp"

namespace assoc {

Matrix residuals(const CountTable& table, ResidualKind kind) {
    const Matrix deviation = deviations_from_expected(table);
    const Matrix expected = expected_counts(table);
    // 1 − R/n and 1 − C/n for the adjusted residuals, as (n − R)/n from the double-double
    // margins: that keeps the digits when one row or column holds nearly everything.
    std::vector<double> row_share_left, column_share_left;
    if (kind == ResidualKind::adjusted) {
        // With one row (or column) 1 − R/n is 0 and every adjusted residual 0/0; only a table
        // read without the 2×2 requirement can get here so.
        require(table.rows() >= 2 && table.columns() >= 2,
                "adjusted residuals need at least 2 rows and 2 columns with counts");
        const detail::TableMargins margins = detail::table_margins(table);
        for (const detail::DoubleDouble& row : margins.rows)
            row_share_left.push_back((margins.total - row).value() / margins.total.value());
        for (const detail::DoubleDouble& column : margins.columns)
            column_share_left.push_back((margins.total - column).value() / margins.total.value());
    }
    Matrix result(table.rows(), table.columns());
    double chi_squared = 0.0;
    for (std::size_t r = 0; r < table.rows(); ++r)
        for (std::size_t c = 0; c < table.columns(); ++c) {
            const double d = deviation(r, c), e = expected(r, c);
            switch (kind) {
            case ResidualKind::raw: result(r, c) = d; break;
            case ResidualKind::pearson: result(r, c) = d / std::sqrt(e); break;
            case ResidualKind::adjusted:
                result(r, c) = d / std::sqrt(e * row_share_left[r] * column_share_left[c]);
                break;
            case ResidualKind::contribution:
            case ResidualKind::percent:
                result(r, c) = d * (d / e);
                chi_squared += result(r, c);
                break;
            }
        }
    for (double value : result.values())
        require(std::isfinite(value), "a residual of this table is larger than a spreadsheet number can hold (above "
                                      "1.8e308); the counts span too wide a range (a count near 1e308 beside an "
                                      "expected count near 1e-308)");
    if (kind == ResidualKind::percent)
        for (std::size_t r = 0; r < table.rows(); ++r)
            for (std::size_t c = 0; c < table.columns(); ++c)
                result(r, c) = chi_squared > 0 ? 100.0 * result(r, c) / chi_squared : 0.0;
    return result;
}

}  // namespace assoc
