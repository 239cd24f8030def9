#pragma once
// The long computations of the worksheet functions, remembered: each call looks its exact input
// up in a ResultCache first and computes only what is not there. Same answers and same refusals
// (assoc::Error with the same message) as the core functions they wrap.
#include "assoc/count_table.hpp"
#include "assoc/exact_test.hpp"
#include "assoc/monte_carlo.hpp"
#include "result_cache.hpp"

namespace assoc::calc {

// The add-in's one cache: 4 MB, shared by all documents, emptied when the extension's library
// is unloaded (with the office, or when the extension is removed).
ResultCache& shared_result_cache();
inline constexpr std::size_t shared_result_cache_bytes = 4'000'000;

// exact_p_value (ASSOC.EXACT, ASSOC.PVALUE "exact", ASSOC.REPORT's exact line, ASSOC.CHECK's
// trials of them), keyed by the counts, the side and the limits.
double remembered_exact_p_value(ResultCache& cache, const CountTable& table, Side side, const ExactLimits& limits);
// The same in the shared cache, in the form ReportOptions::exact_test takes.
double shared_exact_p_value(const CountTable& table, Side side, const ExactLimits& limits);

// monte_carlo_test (ASSOC.SIMULATE), keyed by the counts and every option: trials, seed, statistic,
// order of tables and limits (time and work). The simulation is deterministic for a given seed, so its answer can be reused.
SimulationResult remembered_monte_carlo_test(ResultCache& cache, const CountTable& table, const SimulationOptions& options);

}  // namespace assoc::calc
