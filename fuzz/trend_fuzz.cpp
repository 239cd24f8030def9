// Fuzz target: the trend test (Cochran–Armitage) for a 2×k or k×2 table read from cells, with scores.
// Input: section 1 is the range; section 2, if present, the scores.
// Checks: only assoc::Error leaves the core; the p-value in [0, 1]; z finite and z² the statistic;
// scores moved and stretched (2s + 1) give the same z; counts multiplied by a power of 4 k
// multiply the statistic by k.
#include <cmath>

#include "assoc/trend_test.hpp"
#include "fuzz_support.hpp"

using namespace assoc;
using namespace assoc::fuzz;

namespace {

double check_trend(const CellGrid& range, const CellGrid& scores) {
    double z = NAN;
    attempt("trend_test", [&] {
        const TrendResult result = trend_test(range, scores);
        check_probability(result.p_value, "trend p-value");
        check_finite(result.z, "trend z");
        check_nonnegative(result.statistic, "trend statistic");
        if (!close(result.statistic, result.z * result.z, 1e-12)) finding("the trend statistic is not z²");
        if (result.categories < 2) finding("a trend over fewer than 2 categories");
        z = result.z;
    });
    return z;
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const auto sections = read_sections(data, size);
    const CellGrid& range = section(sections, 0);
    const CellGrid& scores = section(sections, 1);
    const double z = check_trend(range, scores);
    if (!std::isfinite(z)) return 0;

    CellGrid stretched = scores;
    for (std::size_t r = 0; r < scores.rows(); ++r)
        for (std::size_t c = 0; c < scores.columns(); ++c)
            if (scores.at(r, c).is_number()) stretched.at(r, c) = Cell::number(2 * scores.at(r, c).as_number() + 1);
    const double stretched_z = check_trend(range, stretched);
    if (std::isfinite(stretched_z) && !close(stretched_z, z, 1e-7)) finding("scores 2s + 1 change the trend's z");
    const double k = scale_factor(data, size);
    const CellGrid bigger = scaled(range, k);
    const double scaled_z = check_trend(bigger, scores);
    if (std::isfinite(scaled_z) && !close(scaled_z * scaled_z, k * z * z, 1e-7))
        finding("the trend statistic of the table times " + std::to_string(k) + " is not the statistic times that");
    return 0;
}
