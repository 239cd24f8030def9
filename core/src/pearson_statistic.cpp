#include "assoc/statistics.hpp"
#include "exact_margins.hpp"

namespace assoc {

double pearson_statistic(const CountTable& table) {
    // The deviation comes from the cancellation-free routine (TableMargins::deviation, as
    // deviations_from_expected), so each term keeps full precision however large the counts;
    // d·(d/E) rather than d²/E, because d² overflows (or underflows) long before the term does.
    // One pass, without the matrices: every ASSOC.PVALUE cell of a sheet runs this.
    double sum = 0.0;
    const double n = table.total();
    if (table.whole_counts() && n <= 0x1p53) {
        // The common case: TableMargins' arithmetic for whole counts, on the table's own totals
        // (copying them into margins cost as much as the sum for a small table).
        using detail::TableMargins;
        for (std::size_t r = 0; r < table.rows(); ++r) {
            const double row = table.row_total(r);
            for (std::size_t c = 0; c < table.columns(); ++c) {
                const double column = table.column_total(c);
                const double d = TableMargins::whole_deviation(table.count(r, c), row, column, n);
                sum += d * (d / TableMargins::whole_expected(row, column, n));
            }
        }
        return sum;
    }
    const detail::TableMargins margins = detail::table_margins(table);
    for (std::size_t r = 0; r < table.rows(); ++r)
        for (std::size_t c = 0; c < table.columns(); ++c) {
            const double d = margins.deviation(table.count(r, c), r, c);
            sum += d * (d / margins.expected(r, c));
        }
    return sum;
}

}  // namespace assoc
