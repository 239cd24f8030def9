// Fuzz target: strata read from cells (read_strata), the Mantel–Haenszel test and the test of equal
// odds ratios (Breslow–Day with Tarone's correction).
// Input: section 1 is the range; section 2 may give the confidence and the correction word.
// Checks: only assoc::Error leaves the core; p-values in [0, 1]; statistics ≥ 0; the common odds
// ratio positive and inside its interval; everyday counts multiplied by a power of 4 k leave the
// common odds ratio as it is and multiply the Breslow–Day statistic by k, and the uncorrected
// Mantel–Haenszel statistic by k or more, as the formulas say.
#include <cmath>

#include "assoc/breslow_day.hpp"
#include "assoc/mantel_haenszel.hpp"
#include "assoc/strata.hpp"
#include "fuzz_support.hpp"

using namespace assoc;
using namespace assoc::fuzz;

namespace {

struct Figures {
    double odds_ratio = NAN, mh_uncorrected = NAN, breslow_day = NAN;
};

Figures check_strata(const CellGrid& range, Continuity continuity, double confidence) {
    Figures figures;
    attempt("read_strata", [&] {
        const Strata strata = read_strata(range);
        for (std::size_t k = 0; k < strata.tables.size(); ++k) check_message(stratum_name(strata, k), "stratum name");
    });
    for (Continuity c : {continuity, Continuity::uncorrected}) {
        attempt("mantel_haenszel_test", [&] {
            const MantelHaenszelResult result = mantel_haenszel_test(range, c, confidence);
            check_probability(result.p_value, "Mantel–Haenszel p-value");
            check_nonnegative(result.statistic, "Mantel–Haenszel statistic");
            check_nonnegative(result.common_odds_ratio, "common odds ratio");
            check_nonnegative(result.lower, "common odds ratio, lower limit");
            check_nonnegative(result.upper, "common odds ratio, upper limit");
            if (result.lower > result.common_odds_ratio * (1 + 1e-9) || result.upper < result.common_odds_ratio * (1 - 1e-9))
                wrong("the interval does not hold the common odds ratio");
            for (const std::string& remark : result.remarks) check_message(remark, "Mantel–Haenszel remark");
            figures.odds_ratio = result.common_odds_ratio;
            if (c == Continuity::uncorrected) figures.mh_uncorrected = result.statistic;
        });
    }
    attempt("breslow_day_test", [&] {
        const HomogeneityResult result = breslow_day_test(range);
        check_probability(result.p_value, "Breslow–Day p-value");
        check_nonnegative(result.statistic, "Breslow–Day statistic");
        check_nonnegative(result.uncorrected_statistic, "Breslow–Day statistic without Tarone's correction");
        if (result.statistic > result.uncorrected_statistic * (1 + 1e-9) + 1e-12)
            wrong("Tarone's correction made the Breslow–Day statistic larger");
        if (!(result.df >= 1)) wrong("Breslow–Day df below 1");
        for (const std::string& remark : result.remarks) check_message(remark, "Breslow–Day remark");
        figures.breslow_day = result.uncorrected_statistic;
    });
    return figures;
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const auto sections = read_sections(data, size);
    const CellGrid& range = section(sections, 0);
    const CellGrid& arguments = section(sections, 1);
    const double confidence = number_at(arguments, 0, 0.95);
    Continuity continuity = Continuity::corrected;
    attempt("parse_continuity", [&] { continuity = parse_continuity(word_at(arguments, 1)); });
    const bool numbers = check_numbers({&range});
    const CheckValues values(numbers);
    // Values are checked only for everyday counts (see check_numbers); the calls always run.
    if (!numbers) {
        attempt("mantel_haenszel_test", [&] { mantel_haenszel_test(range, continuity, confidence); });
        attempt("breslow_day_test", [&] { breslow_day_test(range); });
        return 0;
    }
    const Figures figures = check_strata(range, continuity, confidence);
    const double k = scale_factor(data, size);
    const CellGrid bigger = scaled(range, k);
    if (!check_numbers({&bigger})) return 0;
    const Figures scaled_figures = check_strata(bigger, continuity, confidence);
    const std::string times = " of the strata times " + std::to_string(k);
    if (std::isfinite(figures.odds_ratio) && std::isfinite(scaled_figures.odds_ratio) &&
        !close(figures.odds_ratio, scaled_figures.odds_ratio, 1e-9))
        wrong("the common odds ratio" + times + " differs");
    if (std::isfinite(figures.breslow_day) && std::isfinite(scaled_figures.breslow_day) &&
        !close(scaled_figures.breslow_day, k * figures.breslow_day, 1e-6))
        wrong("the Breslow–Day statistic" + times + " is not the statistic times that");
    if (std::isfinite(figures.mh_uncorrected) && std::isfinite(scaled_figures.mh_uncorrected) && k >= 1 &&
        scaled_figures.mh_uncorrected < k * figures.mh_uncorrected * (1 - 1e-9) - 1e-9)
        wrong("the uncorrected Mantel–Haenszel statistic" + times + " is less than the statistic times that");
    return 0;
}
