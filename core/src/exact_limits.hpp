#pragma once
// The errors an exact test gives at its work cap (the 2×2, r×c and pairwise exact tests).
#include <cmath>
#include <cstddef>
#include <string>

#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "assoc/work_limits.hpp"

namespace assoc::detail {

// What to do instead, at the end of every message that stops the test: the simulation that orders
// tables as the exact test does, so that its p-value estimates the exact one.
inline const char* const simulate_instead =
    "use ASSOC.SIMULATE(range; ; ; \"exact\") for a Monte Carlo estimate of the exact p-value instead";

// A memory limit in MB as people read it: "400", "1.5".
inline std::string megabytes(std::size_t bytes) {
    const double value = static_cast<double>(bytes) / 1e6;
    return value >= 10 ? format_count(std::round(value)) : format_number(value, 3);
}

// `resource` is what ran out: "time" or "memory". The message names both limits.
inline Error exact_limit_error(const ExactLimits& limits, const char* resource) {
    return Error(std::string("the exact test for this table needs more ") + resource + " than allowed (the limit is " +
                 format_number(limits.max_seconds, 3) + " seconds and " + megabytes(limits.max_memory_bytes) +
                 " MB of working memory); " + simulate_instead);
}

}  // namespace assoc::detail
