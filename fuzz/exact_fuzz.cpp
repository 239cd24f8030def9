// Fuzz target: the exact test (Fisher's 2×2 test on every side, Freeman–Halton for r×c) under small
// work caps, as a worksheet cell would run it with less time, alone and for every pair of rows.
// Input: section 1 is the range.
// Checks: only assoc::Error leaves the core (the limit error among them); p-values in [0, 1]; for a
// 2×2 table the two one-sided p-values add up to at least 1 and the two-sided one is at least the
// smaller of them; pairwise p-values in [0, 1], adjusted ones no smaller; no call runs far past its cap.
#include "assoc/count_table.hpp"
#include "assoc/exact_test.hpp"
#include "assoc/pairwise_comparisons.hpp"
#include "fuzz_support.hpp"

using namespace assoc;
using namespace assoc::fuzz;

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const auto sections = read_sections(data, size);
    const CellGrid& range = section(sections, 0);
    CountTable table;
    if (!attempt("read_count_table", [&] { table = read_count_table(range); })) return 0;
    const ExactLimits limits{0.05, 20'000'000};
    // The cap is wall-clock time, and the clock is read every few thousand steps: 1 s of CPU time is
    // 20 times the cap, far more than the core needs to notice it.
    const double allowed = 1.0;
    double p[3] = {-1, -1, -1};
    const Side sides[3] = {Side::two_sided, Side::lower, Side::upper};
    for (int i = 0; i < 3; ++i) {
        if (i > 0 && !table.is_two_by_two()) break;
        attempt("exact_p_value", [&] {
            p[i] = exact_p_value(table, sides[i], limits);
            check_probability(p[i], "exact p-value");
        }, allowed);
    }
    if (table.is_two_by_two() && p[0] >= 0 && p[1] >= 0 && p[2] >= 0) {
        if (p[1] + p[2] < 1 - 1e-9) finding("the one-sided exact p-values add up to less than 1");
        if (p[0] < std::min(p[1], p[2]) * (1 - 1e-6)) finding("the two-sided exact p-value is below a one-sided one");
    }
    attempt("pairwise_comparisons (exact)", [&] {
        const PairwiseComparisons pairs = pairwise_comparisons(table, PAdjustment::holm, PairwiseMethod::exact, limits);
        for (const PairComparison& pair : pairs.pairs) {
            check_probability(pair.p_value, "pairwise exact p-value");
            check_probability(pair.adjusted_p_value, "adjusted pairwise exact p-value");
            if (pair.adjusted_p_value < pair.p_value) finding("an adjusted pairwise p-value is below its p-value");
        }
    }, allowed);
    return 0;
}
