#pragma once
// The caps of the core's long computations, in one place. Every computation whose work can grow
// with its input (the exact tests, the simulated p-value, the test across r×c strata) takes one of
// these and stops at it with
// an assoc::Error that says what to do instead; the rest of the core does a bounded amount of work
// whatever the input. These are the core's defaults for callers such as the bench and the tests;
// the worksheet functions use tighter caps of their own, all in extension/src/worksheet_limits.hpp.
#include <cstddef>

namespace assoc {

// Limits past which an exact test stops with an error that suggests a simulated p-value, instead
// of hanging the caller or exhausting its memory. The 2×2 test needs far less than any limit
// (its cost does not grow with the counts); the r×c test counts its working memory in bytes
// before it takes it (its lists of partial values, their hash-map nodes, its temporaries), so
// the process's peak resident memory grows by about as much as the count, or somewhat less.
struct ExactLimits {
    double max_seconds = 20.0;
    std::size_t max_memory_bytes = 1'000'000'000;  // 1 GB
    // Refuse at once a table that cannot finish within the limits: the r×c test counts the work of
    // each of its stages before doing it and measures its pace as it goes, and stops as soon as the
    // rest cannot fit (see freeman_halton.cpp). Off, it runs until a limit is reached (benches).
    bool forecast = true;
};

// The exact part of the report runs whenever the report does, so it has a short leash by default.
inline constexpr ExactLimits default_report_exact_limits{2.0, 100'000'000};

// Limits of the simulated (Monte Carlo) p-value. `max_work` is an estimate made before the
// simulation starts (in units of about one step of the search for a cell's count, about 6 ns
// here; drawing a cell costs 20 units more, a cell's share of the statistic 2): a request that
// would need more is refused at once with the number of trials that fits. The clock is read while
// it runs, so the time limit holds on any machine.
struct SimulationLimits {
    double max_seconds = 20.0;
    double max_work = 1e9;  // about 6 seconds
};

// Limits that keep the test across r×c strata (ASSOC.WITHIN) quick on any range, checked before it
// starts: the size of the matrix to invert, (rows − 1)(columns − 1), and the work of summing it over
// the strata, strata × that size².
struct GeneralAssociationLimits {
    std::size_t max_dimension = 1000;
    double max_work = 2e9;  // about 2 seconds
};

}  // namespace assoc
