// Fuzz target: the power of the chi-squared test and the sample size for a given power, and the
// chi-squared distribution behind them (p-values and critical values).
// Input: section 1 gives w, n, df, alpha and the power wanted, in its first five cells.
// Checks: only assoc::Error leaves the core; power and p-values in [0, 1]; power at least alpha and
// not falling as n doubles; the sample size a whole number that reaches the power while one less
// does not; the p-value of the critical value is alpha.
#include <cmath>

#include "assoc/chi_squared_distribution.hpp"
#include "assoc/power.hpp"
#include "fuzz_support.hpp"

using namespace assoc;
using namespace assoc::fuzz;

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const auto sections = read_sections(data, size);
    const CellGrid& arguments = section(sections, 0);
    const double w = number_at(arguments, 0, 0.3), n = number_at(arguments, 1, 100), df = number_at(arguments, 2, 1);
    const double alpha = number_at(arguments, 3, 0.05), wanted = number_at(arguments, 4, 0.8);

    double power = NAN;
    attempt("chi_squared_power", [&] {
        power = chi_squared_power(w, n, df, alpha);
        check_probability(power, "power");
        // (A subnormal alpha may leave the power to underflow to 0.)
        if (alpha >= 1e-300 && power < alpha * (1 - 1e-9)) finding("the power is below alpha");
    });
    if (std::isfinite(power))
        attempt("chi_squared_power (twice n)", [&] {
            const double more = chi_squared_power(w, 2 * n, df, alpha);
            check_probability(more, "power");
            if (more < power - 1e-9) finding("the power falls when n doubles");
        });
    attempt("chi_squared_sample_size", [&] {
        const double needed = chi_squared_sample_size(w, wanted, df, alpha);
        check_nonnegative(needed, "sample size");
        if (needed != std::floor(needed) || needed < 1) finding("the sample size is not a whole number of 1 or more");
        attempt("power at the sample size", [&] {
            if (chi_squared_power(w, needed, df, alpha) < wanted) finding("the sample size does not reach the power");
        });
        if (needed > 1)
            attempt("power one below the sample size", [&] {
                if (chi_squared_power(w, needed - 1, df, alpha) >= wanted) finding("one less than the sample size reaches the power");
            });
    });
    attempt("chi_squared_critical_value", [&] {
        const double critical = chi_squared_critical_value(df, alpha);
        check_nonnegative(critical, "critical value");
        const double p = chi_squared_p_value(critical, df);
        check_probability(p, "p-value of the critical value");
        // A critical value below the smallest normal double (tiny df, large alpha) underflows.
        if (critical > 1e-300 && !close(p, alpha, 1e-6)) finding("the p-value of the critical value is not alpha");
    });
    attempt("chi_squared_p_value", [&] { check_probability(chi_squared_p_value(n, df), "chi-squared p-value"); });
    return 0;
}
