#pragma once
// The error an exact test gives at its work cap (shared by the 2×2 and the r×c tests).
#include <cmath>
#include <string>

#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "assoc/work_limits.hpp"

namespace assoc::detail {

// `resource` is what ran out: "time" or "memory". The message names both limits.
inline Error exact_limit_error(const ExactLimits& limits, const char* resource) {
    const double megabytes = static_cast<double>(limits.max_memory_bytes) / 1e6;
    return Error(std::string("the exact test for this table needs more ") + resource + " than allowed (the limit is " +
                 format_number(limits.max_seconds, 3) + " seconds and " +
                 (megabytes >= 10 ? format_count(std::round(megabytes)) : format_number(megabytes, 3)) +
                 " MB of working memory); use ASSOC.SIMULATE for a Monte Carlo p-value instead");
}

}  // namespace assoc::detail
