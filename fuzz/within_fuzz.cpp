// Fuzz target: association within strata in long form (a stratum label column, a row label column
// and the counts; read_long_strata) and the generalized Cochran–Mantel–Haenszel test, under a small
// work cap.
// Input: section 1 is the range.
// Checks: only assoc::Error leaves the core; the p-value in [0, 1]; the statistic ≥ 0; df ≥ 1 and
// (rows − 1)(columns − 1); remarks in Assoc's words; the cap holds; counts multiplied by a
// power of 4 k ≥ 1 multiply the statistic by k or more (each stratum's covariance has the factor
// n²/(n − 1), which grows by k²/k·(n − 1)/(n − 1/k)).
#include <cmath>

#include "assoc/generalized_mantel_haenszel.hpp"
#include "assoc/long_strata.hpp"
#include "fuzz_support.hpp"

using namespace assoc;
using namespace assoc::fuzz;

namespace {

double check_within(const CellGrid& range) {
    double statistic = NAN;
    attempt("read_long_strata", [&] {
        const LongStrata strata = read_long_strata(range);
        for (const LongStratum& stratum : strata.strata) check_message(long_stratum_name(stratum), "stratum name");
    });
    attempt(
        "general_association_test",
        [&] {
            const GeneralAssociationResult result = general_association_test(range, {1000, 2e6});
            check_probability(result.p_value, "p-value");
            check_nonnegative(result.statistic, "statistic");
            if (!(result.df >= 1)) finding("df below 1");
            if (result.df != static_cast<double>((result.rows - 1) * (result.columns - 1)))
                finding("df is not (rows − 1)(columns − 1)");
            for (const std::string& remark : result.remarks) check_message(remark, "remark");
            statistic = result.statistic;
        },
        2.0);
    return statistic;
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const auto sections = read_sections(data, size);
    const CellGrid& range = section(sections, 0);
    const double statistic = check_within(range);
    const double k = scale_factor(data, size);
    if (!std::isfinite(statistic) || k < 1) return 0;
    const CellGrid bigger = scaled(range, k);
    const double scaled_statistic = check_within(bigger);
    if (std::isfinite(scaled_statistic) && scaled_statistic < k * statistic * (1 - 1e-9) - 1e-9)
        finding("the statistic of the strata times " + std::to_string(k) + " is less than the statistic times that");
    return 0;
}
