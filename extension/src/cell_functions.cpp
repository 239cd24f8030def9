// The adapters: one small function per worksheet function. Each takes the converted arguments,
// calls the core and returns the result; the generated UNO methods (assoc_functions.cpp) do
// the conversions and the error mapping around them. Declared in the generated header.
#include <string>

#include "assoc/breslow_day.hpp"
#include "assoc/common_risk_ratio.hpp"
#include "assoc/cell_p_values.hpp"
#include "assoc/chi_squared_distribution.hpp"
#include "assoc/cochrans_q.hpp"
#include "assoc/count_table.hpp"
#include "assoc/counts_from_records.hpp"
#include "assoc/cramers_v_interval.hpp"
#include "assoc/effect_size.hpp"
#include "assoc/error.hpp"
#include "assoc/exact_test.hpp"
#include "assoc/format.hpp"
#include "assoc/expected_counts.hpp"
#include "assoc/generalized_mantel_haenszel.hpp"
#include "assoc/goodness_of_fit.hpp"
#include "assoc/levels.hpp"
#include "assoc/mantel_haenszel.hpp"
#include "assoc/monte_carlo.hpp"
#include "assoc/odds_ratio.hpp"
#include "assoc/ordinal_measures.hpp"
#include "assoc/ordinal_test.hpp"
#include "assoc/paired_tests.hpp"
#include "assoc/pairwise_comparisons.hpp"
#include "assoc/power.hpp"
#include "assoc/rates.hpp"
#include "assoc/report.hpp"
#include "assoc/risk_ratio.hpp"
#include "assoc/selection_impact.hpp"
#include "assoc/trend_test.hpp"
#include "assoc_functions.hpp"
#include "check.hpp"
#include "office_collation.hpp"
#include "remembered.hpp"
#include "worksheet_limits.hpp"

namespace assoc::calc {
namespace {

// The long computations (exact tests, simulations) go through the add-in's cache (extension/cache/):
// an unchanged table is not computed again on the next recalculation or load, and a refusal is
// remembered like an answer. Their caps are in worksheet_limits.hpp.

std::vector<double> ratio_row(const RatioEstimate& ratio) {
    remark(ratio.remark);
    return {ratio.estimate, ratio.lower, ratio.upper};
}

}  // namespace

namespace cell_functions {

Matrix expected(const CellGrid& range) {
    const CountTable table = read_count_table(range);
    return table.to_body_shape(expected_counts(table));
}

std::vector<double> statistic(const CellGrid& range, Method method) {
    const TestResult result = independence_test(read_count_table(range), method);
    return {representable_statistic(result, method), result.df, result.p_value};
}

double pvalue(const CellGrid& range, PValueMethod method) {
    const CountTable table = read_count_table(range);
    switch (method) {
    case PValueMethod::pearson: return independence_test(table, Method::pearson).p_value;
    case PValueMethod::g: return independence_test(table, Method::likelihood_ratio).p_value;
    case PValueMethod::yates: return independence_test(table, Method::yates).p_value;
    case PValueMethod::exact: {
        const ReturnFreedMemory after;
        return shared_exact_p_value(table, Side::two_sided, exact_limits());
    }
    }
    throw Error("unknown method");
}

double df(const CellGrid& range) { return degrees_of_freedom(read_count_table(range)); }

double critical(double df, double alpha) { return chi_squared_critical_value(df, alpha); }

Matrix residuals(const CellGrid& range, ResidualKind kind) {
    const CountTable table = read_count_table(range);
    return table.to_body_shape(assoc::residuals(table, kind));
}

double strength(const CellGrid& range, Measure measure) {
    const CountTable table = read_count_table(range);
    switch (measure) {
    case Measure::cramer: return cramers_v(table);
    case Measure::cramer_corrected: return cramers_v_corrected(table);
    case Measure::phi: return phi_coefficient(table);
    case Measure::contingency: return contingency_coefficient(table);
    case Measure::w: return cohens_w(table);
    case Measure::gamma: return goodman_kruskal_gamma(table);
    case Measure::tau_b: return kendall_tau_b(table);
    }
    throw Error("unknown measure");
}

std::vector<double> vinterval(const CellGrid& range, double confidence) {
    const CramersVInterval v = cramers_v_interval(read_count_table(range), confidence);
    if (v.upper == 0)
        remark("The interval is 0 to 0 because X² is smaller than independence itself gives in " +
               format_number(100 * (1 - (1 - confidence) / 2)) +
               "% of samples: the counts are closer to independence than chance usually leaves them (check that "
               "they were not balanced on purpose); it does not mean that V is exactly 0.");
    return {v.estimate, v.lower, v.upper};
}

double exact(const CellGrid& range, Side side) {
    const ReturnFreedMemory after;
    return shared_exact_p_value(read_count_table(range), side, exact_limits());
}

std::vector<double> simulate(const CellGrid& range, double trials, double seed, SimulationMethod method) {
    SimulationOptions options = simulation_options(trials, seed);
    options.statistic = method == SimulationMethod::g ? Method::likelihood_ratio : Method::pearson;
    if (method == SimulationMethod::exact) options.order = SimulationOrder::probability;
    options.limits = simulation_limits();
    // Remembered (keyed by the counts and every option): the same seed gives the same answer.
    const SimulationResult result = remembered_monte_carlo_test(shared_result_cache(), read_count_table(range), options);
    return {result.p_value, result.standard_error, static_cast<double>(result.trials)};
}

std::vector<double> oddsratio(const CellGrid& range, double confidence) {
    return ratio_row(odds_ratio(read_count_table(range), confidence));
}

std::vector<double> riskratio(const CellGrid& range, double confidence) {
    return ratio_row(risk_ratio(read_count_table(range), confidence));
}

CellGrid celltest(const CellGrid& range, PAdjustment adjust) {
    const CountTable table = read_count_table(range);
    const Matrix p_values = cell_p_values(table, adjust);
    // Untested cells (set-aside rows and columns) stay blank: a 0 would read as a strong finding.
    CellGrid cells(table.body_rows(), table.body_columns());
    for (std::size_t r = 0; r < table.rows(); ++r)
        for (std::size_t c = 0; c < table.columns(); ++c)
            cells.at(table.kept_rows()[r], table.kept_columns()[c]) = Cell::number(p_values(r, c));
    return cells;
}

std::vector<double> fit(const CellGrid& observed, const CellGrid& expected, double estimated) {
    const GoodnessOfFit result = goodness_of_fit(observed, expected, estimated);
    for (const std::string& sentence : result.remarks) remark(sentence);
    return {result.p_value, result.statistic, result.df};
}

double power(double w, double n, double df, double alpha) { return chi_squared_power(w, n, df, alpha); }

double samplesize(double w, double power, double df, double alpha) {
    return chi_squared_sample_size(w, power, df, alpha);
}

Matrix counts(const CodedLabels& row_labels, const CodedLabels& column_labels, const CellGrid& weights,
              LevelOrdering order) {
    // The core gives a row and a column to every label of the ranges, also to one whose records were
    // all skipped (the other label blank), so the table lines up with ASSOC.LEVELS.
    const RecordCounts counted = counts_from_records(row_labels, column_labels, weights, order, office_collation());
    remark(counted.feedback());
    return counted.counts;
}

CellGrid levels(const CodedLabels& labels, LevelOrdering order) {
    const LevelList list = level_list(labels, order, office_collation());
    for (const std::string& sentence : list.remarks) remark(sentence);
    CellGrid column(list.levels.size(), 1);
    for (std::size_t i = 0; i < list.levels.size(); ++i) column.at(i, 0) = list.levels[i];
    return column;
}

std::vector<double> strata(const CellGrid& range, Continuity correction) {
    const MantelHaenszelResult result = mantel_haenszel_test(range, correction);
    for (const std::string& sentence : result.remarks) remark(sentence);
    return {result.p_value, result.statistic, result.common_odds_ratio, result.lower, result.upper};
}

std::vector<double> homogeneity(const CellGrid& range) {
    const HomogeneityResult result = breslow_day_test(range);
    for (const std::string& sentence : result.remarks) remark(sentence);
    return {result.p_value, result.statistic, result.df};
}

std::vector<double> paired(const CellGrid& range, std::optional<PairedMethod> method) {
    const PairedResult result = paired_test(range, method);
    for (const std::string& sentence : result.remarks) remark(sentence);
    return {result.p_value, result.statistic, result.df};
}

std::vector<double> trend(const CellGrid& range, const CellGrid& scores) {
    const TrendResult result = trend_test(range, scores);
    for (const std::string& sentence : result.remarks) remark(sentence);
    return {result.p_value, result.z};
}

CellGrid impact(const CellGrid& selected, const CellGrid& considered, double threshold) {
    const SelectionImpact result = selection_impact(selected, considered, threshold);
    for (const std::string& sentence : result.remarks) remark(sentence);
    remark(selection_impact_caution());
    CellGrid rows(result.groups.size(), 3);
    for (std::size_t i = 0; i < result.groups.size(); ++i) {
        const GroupImpact& group = result.groups[i];
        if (group.has_rate) {
            rows.at(i, 0) = Cell::number(group.selection_rate);
            rows.at(i, 1) = Cell::number(group.impact_ratio);
        }
        rows.at(i, 2) = group.flag.empty() ? Cell::blank() : Cell::text(group.flag);
    }
    return rows;
}

std::string check(const CellGrid& range, const Cell& function_or_word) { return check_range(range, function_or_word); }

CellGrid report(const CellGrid& range, double alpha) {
    const CountTable table = read_count_table(range);
    const ReturnFreedMemory after;
    ReportOptions options;
    options.alpha = alpha;
    options.exact_limits = report_exact_limits();
    options.variables = variable_names_from_corner(range, table);
    options.exact_test = shared_exact_p_value;  // the exact line, remembered like ASSOC.EXACT's
    const std::vector<ReportLine> lines = association_report(table, options);
    CellGrid cells(lines.size(), 2);
    for (std::size_t i = 0; i < lines.size(); ++i) {
        cells.at(i, 0) = Cell::text(lines[i].label);
        cells.at(i, 1) = lines[i].value;
    }
    return cells;
}

// --- The figures a memo needs: rates, a difference of rates, pairs of groups, a common risk ratio ---

CellGrid rates(const CellGrid& range, double confidence) {
    const RowRates result = row_rates(range, confidence);
    for (const std::string& sentence : result.remarks) remark(sentence);
    // A row without counts stays blank: a 0 would read as a rate of 0.
    CellGrid cells(result.rows.size(), 4);
    for (std::size_t r = 0; r < result.rows.size(); ++r) {
        const RowRate& row = result.rows[r];
        if (!row.has_counts) continue;
        cells.at(r, 0) = Cell::number(row.total);
        cells.at(r, 1) = Cell::number(row.rate.rate);
        cells.at(r, 2) = Cell::number(row.rate.lower);
        cells.at(r, 3) = Cell::number(row.rate.upper);
    }
    return cells;
}

std::vector<double> ratediff(const CellGrid& range, double confidence) {
    const RateDifference result = rate_difference(range, confidence);
    for (const std::string& sentence : result.remarks) remark(sentence);
    return {result.difference, result.lower, result.upper};
}

CellGrid pairwise(const CellGrid& range, PAdjustment adjust, PairwiseMethod method) {
    const ReturnFreedMemory after;
    const PairwiseComparisons result = pairwise_comparisons(read_count_table(range), adjust, method, exact_limits());
    for (const std::string& sentence : result.remarks) remark(sentence);
    CellGrid cells(result.pairs.size(), 4);
    for (std::size_t k = 0; k < result.pairs.size(); ++k) {
        const PairComparison& pair = result.pairs[k];
        cells.at(k, 0) = Cell::text(pair.first_name);
        cells.at(k, 1) = Cell::text(pair.second_name);
        cells.at(k, 2) = Cell::number(pair.p_value);
        cells.at(k, 3) = Cell::number(pair.adjusted_p_value);
    }
    return cells;
}

std::vector<double> stratarisk(const CellGrid& range, double confidence) {
    const CommonRiskRatio result = common_risk_ratio(range, confidence);
    for (const std::string& sentence : result.remarks) remark(sentence);
    return {result.ratio.estimate, result.ratio.lower, result.ratio.upper};
}

// --- Ordered tables, association within r×c strata, repeated yes/no answers (issue 13) -------------

std::vector<double> ordinal(const CellGrid& range, const CellGrid& row_scores, const CellGrid& column_scores) {
    const OrdinalResult result = ordinal_test(range, row_scores, column_scores);
    for (const std::string& sentence : result.remarks) remark(sentence);
    return {result.p_value, result.statistic, result.df, result.correlation};
}

std::vector<double> within(const CellGrid& strata) {
    const GeneralAssociationResult result = general_association_test(strata);
    for (const std::string& sentence : result.remarks) remark(sentence);
    return {result.p_value, result.statistic, result.df};
}

std::vector<double> repeated(const CellGrid& answers, const Cell& yes) {
    const RepeatedResult result = cochrans_q_test(answers, yes);
    for (const std::string& sentence : result.remarks) remark(sentence);
    return {result.p_value, result.statistic, result.df};
}

}  // namespace cell_functions
}  // namespace assoc::calc
