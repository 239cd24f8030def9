// Fuzz target: goodness of fit of observed counts to expected counts or shares.
// Input: section 1, the observed counts; section 2, the expected counts or shares (may be missing);
// section 3 may give the number of estimated parameters.
// Checks: only assoc::Error leaves the core; the p-value in [0, 1]; the statistic ≥ 0; df ≥ 1; the
// expected counts finite and adding up to the observed total; shares multiplied by a power of 4
// change nothing; observed counts multiplied by a power of 4 k multiply the statistic by k.
#include <cmath>

#include "assoc/goodness_of_fit.hpp"
#include "fuzz_support.hpp"

using namespace assoc;
using namespace assoc::fuzz;

namespace {

double check_fit(const CellGrid& observed, const CellGrid& expected, double estimated) {
    double statistic = NAN;
    attempt("goodness_of_fit", [&] {
        const GoodnessOfFit result = goodness_of_fit(observed, expected, estimated);
        check_probability(result.p_value, "fit p-value");
        check_nonnegative(result.statistic, "fit statistic");
        if (!(result.df >= 1)) finding("fit df below 1");
        double observed_total = 0, expected_total = 0;
        for (double o : result.observed) observed_total += o;
        for (double e : result.expected) {
            check_nonnegative(e, "fitted expected count");
            expected_total += e;
        }
        if (!close(observed_total, expected_total, 1e-9)) finding("the expected counts do not add up to the observed total");
        statistic = result.statistic;
    });
    return statistic;
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const auto sections = read_sections(data, size);
    const CellGrid& observed = section(sections, 0);
    const CellGrid& expected = section(sections, 1);
    const double estimated = number_at(section(sections, 2), 0, 0);
    const double statistic = check_fit(observed, expected, estimated);
    if (!std::isfinite(statistic)) return 0;
    const double k = scale_factor(data, size);
    const CellGrid more_observed = scaled(observed, k), more_expected = scaled(expected, k);
    const double same = check_fit(observed, more_expected, estimated);
    if (std::isfinite(same) && !close(same, statistic, 1e-9)) finding("expected shares times a power of 4 change the fit");
    const double bigger = check_fit(more_observed, expected, estimated);
    if (std::isfinite(bigger) && !close(bigger, k * statistic, 1e-9))
        finding("the fit statistic of the counts times " + std::to_string(k) + " is not the statistic times that");
    return 0;
}
