#include "assoc/expected_counts.hpp"
#include "assoc/statistics.hpp"

namespace assoc {

double pearson_statistic(const CountTable& table) {
    // (O − E)²/E = (O·n − R·C)² / (n·R·C): the deviation comes from the cancellation-free
    // routine, so each term keeps full precision however large the counts.
    const Matrix deviation = deviations_from_expected(table);
    const Matrix expected = expected_counts(table);
    double sum = 0.0;
    for (std::size_t i = 0; i < deviation.size(); ++i) {
        const double d = deviation.values()[i];
        sum += d * d / expected.values()[i];
    }
    return sum;
}

}  // namespace assoc
