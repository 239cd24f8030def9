// Fuzz target: strata read from cells (read_strata), the Mantel–Haenszel test, the test of equal
// odds ratios (Breslow–Day with Tarone's correction) and the common risk ratio.
// Input: section 1 is the range; section 2 may give the confidence and the correction word.
// Checks: only assoc::Error leaves the core; p-values in [0, 1]; statistics ≥ 0; the common odds
// and risk ratios positive and inside their intervals; counts multiplied by a power of 4 k
// leave the common odds and risk ratios as they are and multiply the Breslow–Day statistic by k, and the uncorrected
// Mantel–Haenszel statistic by k or more, as the formulas say.
#include <cmath>

#include "assoc/breslow_day.hpp"
#include "assoc/common_risk_ratio.hpp"
#include "assoc/mantel_haenszel.hpp"
#include "assoc/strata.hpp"
#include "fuzz_support.hpp"

using namespace assoc;
using namespace assoc::fuzz;

namespace {

struct Figures {
    double odds_ratio = NAN, risk_ratio = NAN, mh_uncorrected = NAN, breslow_day = NAN;
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
                finding("the interval does not hold the common odds ratio");
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
            finding("Tarone's correction made the Breslow–Day statistic larger");
        if (!(result.df >= 1)) finding("Breslow–Day df below 1");
        for (const std::string& remark : result.remarks) check_message(remark, "Breslow–Day remark");
        figures.breslow_day = result.uncorrected_statistic;
    });
    attempt("common_risk_ratio", [&] {
        const CommonRiskRatio result = common_risk_ratio(range, confidence);
        check_nonnegative(result.ratio.estimate, "common risk ratio");
        check_nonnegative(result.ratio.lower, "common risk ratio, lower limit");
        check_nonnegative(result.ratio.upper, "common risk ratio, upper limit");
        if (result.ratio.lower > result.ratio.estimate * (1 + 1e-9) || result.ratio.upper < result.ratio.estimate * (1 - 1e-9))
            finding("the interval does not hold the common risk ratio");
        for (const std::string& remark : result.remarks) check_message(remark, "common risk ratio remark");
        if (!result.ratio.remark.empty()) check_message(result.ratio.remark, "common risk ratio remark");
        if (!result.ratio.zero_cell_corrected) figures.risk_ratio = result.ratio.estimate;
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
    const Figures figures = check_strata(range, continuity, confidence);
    const double k = scale_factor(data, size);
    const CellGrid bigger = scaled(range, k);
    const Figures scaled_figures = check_strata(bigger, continuity, confidence);
    const std::string times = " of the strata times " + std::to_string(k);
    if (std::isfinite(figures.odds_ratio) && std::isfinite(scaled_figures.odds_ratio) &&
        !close(figures.odds_ratio, scaled_figures.odds_ratio, 1e-9))
        finding("the common odds ratio" + times + " differs");
    if (std::isfinite(figures.risk_ratio) && std::isfinite(scaled_figures.risk_ratio) &&
        !close(figures.risk_ratio, scaled_figures.risk_ratio, 1e-9))
        finding("the common risk ratio" + times + " differs");
    if (std::isfinite(figures.breslow_day) && std::isfinite(scaled_figures.breslow_day) &&
        !close(scaled_figures.breslow_day, k * figures.breslow_day, 1e-6))
        finding("the Breslow–Day statistic" + times + " is not the statistic times that");
    if (std::isfinite(figures.mh_uncorrected) && std::isfinite(scaled_figures.mh_uncorrected) && k >= 1 &&
        scaled_figures.mh_uncorrected < k * figures.mh_uncorrected * (1 - 1e-9) - 1e-9)
        finding("the uncorrected Mantel–Haenszel statistic" + times + " is less than the statistic times that");
    return 0;
}
