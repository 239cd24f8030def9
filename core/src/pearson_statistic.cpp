#include "assoc/expected_counts.hpp"
#include "assoc/statistics.hpp"

namespace assoc {

double pearson_statistic(const CountTable& table) {
    // The deviation comes from the cancellation-free routine, so each term keeps full
    // precision however large the counts; d·(d/E) rather than d²/E, because d² overflows
    // (or underflows) long before the term does.
    const Matrix deviation = deviations_from_expected(table);
    const Matrix expected = expected_counts(table);
    double sum = 0.0;
    for (std::size_t i = 0; i < deviation.size(); ++i) {
        const double d = deviation.values()[i];
        sum += d * (d / expected.values()[i]);
    }
    return sum;
}

}  // namespace assoc
