#include <algorithm>
#include <cmath>

#include "assoc/error.hpp"
#include "assoc/expected_counts.hpp"
#include "assoc/statistics.hpp"
#include "exact_margins.hpp"

namespace assoc {

double yates_statistic(const CountTable& table) {
    require(table.is_two_by_two(),
            "Yates' correction applies to 2×2 tables only; this table has " + std::to_string(table.rows()) +
                " rows and " + std::to_string(table.columns()) + " columns with counts");
    // |O − E| − ½ straight from |O·n − R·C| − n/2 (exact for whole counts below 2^53): forming
    // O − E first and then taking ½ off would lose digits when |O − E| is close to ½.
    const detail::TableMargins margins = detail::table_margins(table);
    double sum = 0.0;
    for (std::size_t r = 0; r < 2; ++r)
        for (std::size_t c = 0; c < 2; ++c) {
            const double corrected = std::max(0.0, margins.distance_beyond_half(table.count(r, c), r, c));
            sum += corrected * (corrected / margins.expected(r, c));
        }
    return sum;
}

}  // namespace assoc
