#include "assoc/residuals.hpp"

#include <algorithm>
#include <cmath>
#include <vector>

#include "assoc/error.hpp"
#include "assoc/expected_counts.hpp"
#include "exact_margins.hpp"

namespace assoc {

Matrix residuals(const CountTable& table, ResidualKind kind) {
    const Matrix deviation = deviations_from_expected(table);
    const Matrix expected = expected_counts(table);
    // √(1 − R/n) and √(1 − C/n) for the adjusted residuals, as √(n − R)/√n with n − R the sum of the
    // other rows' double-double totals: that keeps the digits when one row or column holds nearly everything, and the roots
    // (divided out one at a time below) keep E·(1 − R/n)(1 − C/n) from underflowing when E is tiny.
    std::vector<double> row_share_left, column_share_left;
    if (kind == ResidualKind::adjusted) {
        // With one row (or column) 1 − R/n is 0 and every adjusted residual 0/0; only a table
        // read without the 2×2 requirement can get here so.
        require(table.rows() >= 2 && table.columns() >= 2,
                "adjusted residuals need at least 2 rows and 2 columns with counts");
        const detail::TableMargins margins = detail::table_margins(table);
        const double root_total = std::sqrt(margins.total.value());
        for (const detail::DoubleDouble& others : detail::sums_of_the_others(margins.rows))
            row_share_left.push_back(std::sqrt(others.value()) / root_total);
        for (const detail::DoubleDouble& others : detail::sums_of_the_others(margins.columns))
            column_share_left.push_back(std::sqrt(others.value()) / root_total);
    }
    Matrix result(table.rows(), table.columns());
    for (std::size_t r = 0; r < table.rows(); ++r)
        for (std::size_t c = 0; c < table.columns(); ++c) {
            const double d = deviation(r, c), e = expected(r, c);
            switch (kind) {
            case ResidualKind::raw: result(r, c) = d; break;
            case ResidualKind::pearson: result(r, c) = d / std::sqrt(e); break;
            case ResidualKind::adjusted:
                result(r, c) = d / std::sqrt(e) / row_share_left[r] / column_share_left[c];
                break;
            case ResidualKind::contribution:
            case ResidualKind::percent:
                result(r, c) = d * (d / e);
                break;
            }
        }
    for (double value : result.values())
        require(std::isfinite(value), "a residual of this table is larger than a spreadsheet number can hold (above "
                                      "1.8e308); the counts span too wide a range (a count near 1e308 beside an "
                                      "expected count near 1e-308)");
    if (kind == ResidualKind::percent) {
        // Shares of X², each contribution first divided by the largest: X² itself may pass 1e308.
        double largest = 0.0, shares = 0.0;
        for (double contribution : result.values()) largest = std::max(largest, contribution);
        for (double contribution : result.values()) shares += largest > 0 ? contribution / largest : 0.0;
        for (std::size_t r = 0; r < table.rows(); ++r)
            for (std::size_t c = 0; c < table.columns(); ++c)
                result(r, c) = largest > 0 ? 100.0 * (result(r, c) / largest / shares) : 0.0;
    }
    return result;
}

}  // namespace assoc
