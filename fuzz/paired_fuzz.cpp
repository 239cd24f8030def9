// Fuzz target: paired answers (McNemar's test for 2×2, Bowker's for k×k) read from cells.
// Input: section 1 is the range; section 2 may give the method word.
// Checks: only assoc::Error leaves the core; p-values in [0, 1]; statistics ≥ 0; df ≥ 1 (0 for the
// exact test); counts multiplied by a power of 4 k multiply the uncorrected statistic by k.
#include <cmath>

#include "assoc/paired_tests.hpp"
#include "fuzz_support.hpp"

using namespace assoc;
using namespace assoc::fuzz;

namespace {

double check_paired(const CellGrid& range, std::optional<PairedMethod> method) {
    double statistic = NAN;
    attempt("paired_test", [&] {
        const PairedResult result = paired_test(range, method);
        check_probability(result.p_value, "paired p-value");
        check_nonnegative(result.statistic, "paired statistic");
        // The exact test has no degrees of freedom (0); the chi-squared ones have 1 or more.
        if (result.method == PairedMethod::exact ? result.df != 0 : !(result.df >= 1)) finding("paired df wrong");
        statistic = result.statistic;
    });
    return statistic;
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const auto sections = read_sections(data, size);
    const CellGrid& range = section(sections, 0);
    std::optional<PairedMethod> method;
    attempt("parse_paired_method", [&] { method = parse_paired_method(word_at(section(sections, 1), 0)); });
    check_paired(range, method);
    const double statistic = check_paired(range, PairedMethod::uncorrected);
    const double k = scale_factor(data, size);
    const CellGrid bigger = scaled(range, k);
    const double scaled_statistic = check_paired(bigger, PairedMethod::uncorrected);
    if (std::isfinite(statistic) && std::isfinite(scaled_statistic) && !close(scaled_statistic, k * statistic, 1e-9))
        finding("the uncorrected paired statistic of the table times " + std::to_string(k) + " is not the statistic times that");
    return 0;
}
