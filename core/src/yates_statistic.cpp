#include <algorithm>
#include <cmath>

#include "assoc/error.hpp"
#include "assoc/expected_counts.hpp"
#include "assoc/statistics.hpp"

namespace assoc {

double yates_statistic(const CountTable& table) {
    require(table.is_two_by_two(),
            "Yates' correction applies to 2×2 tables only; this table has " + std::to_string(table.rows()) +
                " rows and " + std::to_string(table.columns()) + " columns with counts");
    const Matrix deviation = deviations_from_expected(table);
    const Matrix expected = expected_counts(table);
    double sum = 0.0;
    for (std::size_t i = 0; i < deviation.size(); ++i) {
        const double corrected = std::max(0.0, std::fabs(deviation.values()[i]) - 0.5);
        sum += corrected * (corrected / expected.values()[i]);
    }
    return sum;
}

}  // namespace assoc
