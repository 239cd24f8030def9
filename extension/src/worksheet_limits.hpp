#pragma once
// The caps of the worksheet functions, in one place. Calc runs an add-in's cell on its own thread
// of work and recalculates add-in cells whenever a document loads, so a cell that runs long
// freezes the office each time; every function whose work can grow with its input stops at a
// cap with an error whose ASSOC.CHECK text says what to do instead:
//
//   ASSOC.EXACT (every side) and ASSOC.PVALUE with "exact"   5 seconds, 400 MB of working memory
//   ASSOC.PAIRWISE with "exact"                             the same, for all its pairs together
//   ASSOC.REPORT, its exact p-value                         2 seconds, 100 MB
//   ASSOC.SIMULATE                                          5 seconds
//   ASSOC.CHECK, all it tries on its range together         10 seconds (it may run two of the above)
//   the menu command's probe of the exact test              0.05 seconds, 50 MB (whether its sheet
//                                                           keeps the exact p-value live)
//
// The r×c exact test refuses at once a table it cannot finish within its cap (ExactLimits::forecast,
// on in all of these), and the add-in's cache (extension/cache/) keys its answers on these limits.
//
// The exact test of a 2×2 table needs well under a millisecond whatever its counts; the caps bind
// r×c tables. Every other function does a bounded amount of work (at most a few thousand steps of
// a series or a root search, over at most a million cells), and reading a range is bounded by the
// reader's million-cell cap. The core's own defaults, for other callers, are in
// core/include/assoc/work_limits.hpp.
#include "assoc/work_limits.hpp"

namespace assoc::calc {

inline constexpr ExactLimits worksheet_exact_limits{5.0, 400'000'000};
inline constexpr ExactLimits worksheet_report_exact_limits{2.0, 100'000'000};
inline constexpr double worksheet_simulation_seconds = 5.0;
inline constexpr double worksheet_check_seconds = 10.0;
inline constexpr ExactLimits command_exact_probe_limits{0.05, 50'000'000};

// The limits for a computation in the current cell: the caps above, cut to what is left of
// ASSOC.CHECK's own cap while it runs.
ExactLimits exact_limits();
ExactLimits report_exact_limits();
SimulationLimits simulation_limits();

// While one exists on the thread (ASSOC.CHECK trying functions), every cap is cut to what is left
// of `seconds` from its creation.
class CellBudget {
public:
    explicit CellBudget(double seconds);
    ~CellBudget();
    CellBudget(const CellBudget&) = delete;
    CellBudget& operator=(const CellBudget&) = delete;

private:
    const CellBudget* outer_;
    double deadline_;  // seconds on the steady clock
    friend double seconds_left();
};

// What is left of the innermost CellBudget on this thread (infinity when there is none).
double seconds_left();

// On leaving the scope (also by an error), gives the memory that the allocator keeps after a
// large computation back to the system: glibc holds freed heap memory for reuse, so after an exact
// test that took hundreds of MB the office would stay that large. Elsewhere it does nothing.
class ReturnFreedMemory {
public:
    ReturnFreedMemory() = default;
    ~ReturnFreedMemory();
    ReturnFreedMemory(const ReturnFreedMemory&) = delete;
    ReturnFreedMemory& operator=(const ReturnFreedMemory&) = delete;
};

}  // namespace assoc::calc
