// Fuzz target: a count table read from cells (read_count_table), and every statistic of a table:
// expected counts, the three chi-squared tests, degrees of freedom, residuals of every kind, effect
// sizes, the interval for Cramér's V, cell p-values, pairwise comparisons of rows and the validity check.
// Input: section 1 is the range.
// Checks: only assoc::Error leaves the core; p-values in [0, 1]; statistics, expected counts and
// effect sizes finite and in range (a chi-squared statistic past the largest double is infinity
// with p = 0, and the worksheet's statistic an explained error); a table of counts multiplied by a power of 4 gives
// the statistics multiplied by it (V unchanged), as the formulas say.
#include <cmath>

#include "assoc/cell_p_values.hpp"
#include "assoc/count_table.hpp"
#include "assoc/cramers_v_interval.hpp"
#include "assoc/effect_size.hpp"
#include "assoc/expected_counts.hpp"
#include "assoc/pairwise_comparisons.hpp"
#include "assoc/residuals.hpp"
#include "assoc/statistics.hpp"
#include "assoc/validity.hpp"
#include "fuzz_support.hpp"

using namespace assoc;
using namespace assoc::fuzz;

namespace {

void check_table(const CountTable& table) {
    check_nonnegative(table.total(), "total");
    if (!(table.total() > 0)) finding("a table was read with a total of 0");
    if (table.rows() < 2 || table.columns() < 2) finding("a table was read with fewer than 2 rows or columns");
    for (double count : table.counts().values()) check_nonnegative(count, "count");
    for (double total : table.row_totals()) if (!(total > 0)) finding("a kept row has no counts");
    for (double total : table.column_totals()) if (!(total > 0)) finding("a kept column has no counts");
    for (const std::string& remark : table.reading_remarks()) check_message(remark, "reading remark");
}

struct Figures {
    double pearson = NAN, likelihood_ratio = NAN, v = NAN;
};

Figures check_statistics(const CountTable& table) {
    Figures figures;
    attempt("expected counts", [&] {
        const Matrix expected = expected_counts(table);
        for (double e : expected.values())
            if (!(e > 0) || !std::isfinite(e)) finding("an expected count is " + std::to_string(e));
    });
    for (Method method : {Method::pearson, Method::likelihood_ratio, Method::yates}) {
        const std::string name = "independence test (" + method_name(method) + ")";
        attempt(name, [&] {
            const TestResult result = independence_test(table, method);
            check_probability(result.p_value, name + ": p-value");
            // A statistic past the largest double is infinity with p = 0 (statistics.hpp); the worksheet
            // shows it as an error that says so (representable_statistic).
            if (result.statistic == INFINITY) {
                if (result.p_value != 0) finding(name + ": an infinite statistic with a p-value above 0");
                attempt(name + ": statistic shown", [&] {
                    representable_statistic(result, method);
                    finding(name + ": an infinite statistic was returned as representable");
                });
                return;
            }
            check_nonnegative(result.statistic, name + ": statistic");
            if (!(result.df >= 1)) finding(name + ": df below 1");
            if (method == Method::pearson) figures.pearson = result.statistic;
            if (method == Method::likelihood_ratio) figures.likelihood_ratio = result.statistic;
        });
    }
    attempt("Yates below Pearson", [&] {
        if (table.is_two_by_two() && yates_statistic(table) > pearson_statistic(table) * (1 + 1e-12))
            finding("the Yates statistic is above Pearson's");
    });
    attempt("degrees of freedom", [&] { check_nonnegative(degrees_of_freedom(table), "df"); });
    for (ResidualKind kind : {ResidualKind::pearson, ResidualKind::adjusted, ResidualKind::raw,
                              ResidualKind::contribution, ResidualKind::percent}) {
        attempt("residuals", [&] {
            const Matrix values = residuals(table, kind);
            check_finite(values, "residual");
            if (kind == ResidualKind::contribution)
                for (double v : values.values()) check_nonnegative(v, "contribution");
            if (kind == ResidualKind::percent)
                for (double v : values.values()) check_between(v, 0, 100 * (1 + 1e-9), "percent of X²");
        });
    }
    attempt("Cramér's V", [&] { figures.v = cramers_v(table); check_between(figures.v, 0, 1 + 1e-9, "V"); });
    attempt("corrected V", [&] { check_between(cramers_v_corrected(table), 0, 1 + 1e-9, "corrected V"); });
    attempt("phi", [&] { check_between(phi_coefficient(table), -1 - 1e-9, 1 + 1e-9, "phi"); });
    attempt("contingency coefficient", [&] { check_between(contingency_coefficient(table), 0, 1, "C"); });
    attempt("w", [&] { check_nonnegative(cohens_w(table), "w"); });
    attempt("V interval", [&] {
        const CramersVInterval interval = cramers_v_interval(table);
        check_between(interval.lower, 0, 1 + 1e-9, "V lower");
        check_between(interval.upper, 0, 1 + 1e-9, "V upper");
        // The interval is for the noncentrality (λ), whose estimate is X² − df rather than the X² of V:
        // the upper limit may fall below V (down to [0, 0], as documented) when X² is small for its df.
        if (interval.lower > interval.estimate * (1 + 1e-9) + 1e-12 || interval.lower > interval.upper)
            finding("the lower limit for V is above V or above the upper limit");
    });
    for (PAdjustment adjustment : {PAdjustment::holm, PAdjustment::bonferroni, PAdjustment::none})
        attempt("cell p-values", [&] {
            const Matrix p_values = cell_p_values(table, adjustment);
            for (double p : p_values.values()) check_probability(p, "cell p-value");
        });
    attempt("pairwise comparisons", [&] {
        const PairwiseComparisons pairs = pairwise_comparisons(table);
        for (const PairComparison& pair : pairs.pairs) {
            check_probability(pair.p_value, "pairwise p-value");
            check_probability(pair.adjusted_p_value, "adjusted pairwise p-value");
            if (pair.adjusted_p_value < pair.p_value) finding("an adjusted pairwise p-value is below its p-value");
            check_message(pair.first_name, "pair name");
        }
        for (const std::string& remark : pairs.remarks) check_message(remark, "pairwise remark");
    });
    attempt("validity", [&] {
        const ValidityCheck validity = check_validity(table);
        check_nonnegative(validity.smallest_expected, "smallest expected count");
        check_probability(validity.share_below_five, "share below five");
        check_message(validity.summary(), "validity summary");
        for (const std::string& remark : validity.remarks) check_message(remark, "validity remark");
    });
    return figures;
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const auto sections = read_sections(data, size);
    const CellGrid& range = section(sections, 0);
    CountTable table;
    if (!attempt("read_count_table", [&] { table = read_count_table(range); })) return 0;
    check_table(table);
    const Figures figures = check_statistics(table);

    // Every count times k (a power of 4): X², G² and the expected counts scale by k, V does not.
    const double k = scale_factor(data, size);
    const CellGrid bigger = scaled(range, k);
    CountTable scaled_table;
    if (!attempt("read_count_table (scaled)", [&] { scaled_table = read_count_table(bigger); })) return 0;
    const Figures scaled_figures = check_statistics(scaled_table);
    if (std::isfinite(figures.pearson) && std::isfinite(scaled_figures.pearson) &&
        !close(scaled_figures.pearson, k * figures.pearson, 1e-7))
        finding("X² of the table times " + std::to_string(k) + " is not X² times that");
    if (std::isfinite(figures.likelihood_ratio) && std::isfinite(scaled_figures.likelihood_ratio) &&
        !close(scaled_figures.likelihood_ratio, k * figures.likelihood_ratio, 1e-7))
        finding("G² of the table times " + std::to_string(k) + " is not G² times that");
    if (std::isfinite(figures.v) && std::isfinite(scaled_figures.v) && !close(scaled_figures.v, figures.v, 1e-7))
        finding("V of the table times " + std::to_string(k) + " differs");
    return 0;
}
