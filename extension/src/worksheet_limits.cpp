#include "worksheet_limits.hpp"

#include <algorithm>
#include <chrono>
#include <limits>

#if defined(__GLIBC__)
#include <malloc.h>
#endif

namespace assoc::calc {
namespace {

// Calls arrive on varying threads but never at the same time; a budget belongs to its thread.
thread_local const CellBudget* current_budget = nullptr;

double now() { return std::chrono::duration<double>(std::chrono::steady_clock::now().time_since_epoch()).count(); }

double within_budget(double seconds) { return std::min(seconds, std::max(0.0, seconds_left())); }

}  // namespace

double seconds_left() {
    return current_budget == nullptr ? std::numeric_limits<double>::infinity() : current_budget->deadline_ - now();
}

CellBudget::CellBudget(double seconds) : outer_(current_budget), deadline_(now() + seconds) {
    // A budget inside another never outlasts it.
    if (outer_ != nullptr) deadline_ = std::min(deadline_, outer_->deadline_);
    current_budget = this;
}

CellBudget::~CellBudget() { current_budget = outer_; }

ExactLimits exact_limits() {
    ExactLimits limits = worksheet_exact_limits;
    limits.max_seconds = within_budget(limits.max_seconds);
    return limits;
}

ExactLimits report_exact_limits() {
    ExactLimits limits = worksheet_report_exact_limits;
    limits.max_seconds = within_budget(limits.max_seconds);
    return limits;
}

SimulationLimits simulation_limits() {
    SimulationLimits limits;
    limits.max_seconds = within_budget(worksheet_simulation_seconds);
    return limits;
}

ReturnFreedMemory::~ReturnFreedMemory() {
#if defined(__GLIBC__)
    // Only worth the walk over the heap when much is held free (the trim itself takes a few
    // milliseconds per hundred MB). mallinfo2 counts every arena; it came with glibc 2.33.
#if __GLIBC__ > 2 || (__GLIBC__ == 2 && __GLIBC_MINOR__ >= 33)
    constexpr std::size_t worth_returning = 32'000'000;
    if (mallinfo2().fordblks < worth_returning) return;
#endif
    malloc_trim(0);
#endif
}

}  // namespace assoc::calc
