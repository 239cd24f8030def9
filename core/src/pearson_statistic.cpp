#include "assoc/statistics.hpp"
#include "exact_margins.hpp"

namespace assoc {

double pearson_statistic(const CountTable& table) {
    // The deviation comes from the cancellation-free routine (TableMargins::deviation, as
    // deviations_from_expected), so each term keeps full precision however large the counts;
    // d·(d/E) rather than d²/E, because d² overflows (or underflows) long before the term does.
    // One pass, without the matrices: every ASSOC.PVALUE cell of a sheet runs this.
    const detail::TableMargins margins = detail::table_margins(table);
    double sum = 0.0;
    for (std::size_t r = 0; r < table.rows(); ++r)
        for (std::size_t c = 0; c < table.columns(); ++c) {
            const double d = margins.deviation(table.count(r, c), r, c);
            sum += d * (d / margins.expected(r, c));
        }
    return sum;
}

}  // namespace assoc
