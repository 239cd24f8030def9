// Fuzz target: the odds ratio and the risk ratio of a 2×2 table with their intervals, and the
// interval for Cramér's V, at a confidence level from the input.
// Input: section 1 is the range; section 2 may give the confidence level.
// Checks: only assoc::Error leaves the core; estimates and limits finite, ≥ 0 and in order; V's
// limits in [0, 1]; remarks in Assoc's words; counts multiplied by a power of 4 leave the
// ratios as they are (unless a zero cell was corrected).
#include <cmath>
#include <optional>

#include "assoc/count_table.hpp"
#include "assoc/cramers_v_interval.hpp"
#include "assoc/odds_ratio.hpp"
#include "assoc/risk_ratio.hpp"
#include "fuzz_support.hpp"

using namespace assoc;
using namespace assoc::fuzz;

namespace {

struct Ratios {
    std::optional<RatioEstimate> odds, risk;
};

void check_ratio(const RatioEstimate& ratio, const std::string& what) {
    check_nonnegative(ratio.estimate, what);
    check_nonnegative(ratio.lower, what + ", lower limit");
    check_nonnegative(ratio.upper, what + ", upper limit");
    check_nonnegative(ratio.log_standard_error, what + ", standard error");
    if (ratio.lower > ratio.estimate * (1 + 1e-9) || ratio.upper < ratio.estimate * (1 - 1e-9))
        finding("the interval of the " + what + " does not hold it");
    if (!ratio.remark.empty()) check_message(ratio.remark, what + " remark");
}

Ratios check_ratios(const CellGrid& range, double confidence) {
    Ratios ratios;
    CountTable table;
    if (!attempt("read_count_table", [&] { table = read_count_table(range); })) return ratios;
    attempt("odds_ratio", [&] {
        const RatioEstimate ratio = odds_ratio(table, confidence);
        check_ratio(ratio, "odds ratio");
        ratios.odds = ratio;
    });
    attempt("risk_ratio", [&] {
        const RatioEstimate ratio = risk_ratio(table, confidence);
        check_ratio(ratio, "risk ratio");
        ratios.risk = ratio;
    });
    attempt("cramers_v_interval", [&] {
        const CramersVInterval interval = cramers_v_interval(table, confidence);
        check_between(interval.lower, 0, 1 + 1e-9, "V lower");
        check_between(interval.upper, 0, 1 + 1e-9, "V upper");
        if (interval.lower > interval.upper) finding("the interval for V is upside down");
    });
    return ratios;
}

void compare(const std::optional<RatioEstimate>& a, const std::optional<RatioEstimate>& b, const std::string& what) {
    if (!a || !b || a->zero_cell_corrected || b->zero_cell_corrected) return;
    if (!close(a->estimate, b->estimate, 1e-9)) finding("the " + what + " of the table times a power of 4 differs");
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const auto sections = read_sections(data, size);
    const CellGrid& range = section(sections, 0);
    const double confidence = number_at(section(sections, 1), 0, 0.95);
    const Ratios ratios = check_ratios(range, confidence);
    const CellGrid bigger = scaled(range, scale_factor(data, size));
    const Ratios scaled_ratios = check_ratios(bigger, confidence);
    compare(ratios.odds, scaled_ratios.odds, "odds ratio");
    compare(ratios.risk, scaled_ratios.risk, "risk ratio");
    return 0;
}
