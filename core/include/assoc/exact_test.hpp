#pragma once
// Exact tests of independence, conditional on both margins: Fisher's test for 2×2
// tables and the Freeman–Halton extension for r×c tables.
#include <cstddef>

#include "assoc/count_table.hpp"

namespace assoc {

enum class Side {
    two_sided,  // probability of all tables no more probable than the observed one
    lower,      // 2×2 only: P(a ≤ observed a), evidence that the odds ratio is below 1
    upper,      // 2×2 only: P(a ≥ observed a), evidence that the odds ratio is above 1
};

// Two tables whose probabilities differ by less than this relative amount count as tied,
// so rounding cannot drop a table that is exactly as probable as the observed one.
inline constexpr double exact_tie_tolerance = 1e-7;

// Limits past which the r×c test stops with an error that suggests a simulated p-value,
// instead of hanging the office or exhausting its memory.
struct ExactLimits {
    double max_seconds = 20.0;
    // Working memory in bytes, as the test counts what it holds (its lists of partial values,
    // their hash-map nodes, its temporaries): the process's peak resident memory grows by about
    // as much as the count, or somewhat less.
    std::size_t max_memory_bytes = 1'000'000'000;  // 1 GB
    // Refuse at once a table that cannot finish within the limits: the r×c test counts the work of
    // each of its stages before doing it and measures its pace as it goes, and stops as soon as the
    // rest cannot fit (see freeman_halton.cpp). Off, it runs until a limit is reached (benches).
    bool forecast = true;
};

// The exact p-value. Needs whole counts. Throws assoc::Error for weighted counts,
// one-sided tests on tables other than 2×2, and tables past the limits.
double exact_p_value(const CountTable& table, Side side = Side::two_sided, const ExactLimits& limits = {});

}  // namespace assoc
