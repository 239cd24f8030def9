// The adapters: one small function per worksheet function. Each takes the converted arguments,
// calls the core and returns the result; the generated UNO methods (assoc_functions.cpp) do
// the conversions and the error mapping around them. Declared in the generated header.
#include <algorithm>

#include "assoc/chi_squared_distribution.hpp"
#include "assoc/count_table.hpp"
#include "assoc/effect_size.hpp"
#include "assoc/error.hpp"
#include "assoc/expected_counts.hpp"
#include "assoc/report.hpp"
#include "assoc/validity.hpp"
#include "assoc_functions.hpp"
#include "option_words.hpp"

namespace assoc::calc {
namespace {

std::string as_sentence(const std::string& text) {
    return !text.empty() && text.back() == '.' ? text : text + ".";
}

// ASSOC.CHECK's second argument: run every function that accepts the word on the table, and
// say in words which of them fail and why. Any function's option words take part, through the
// generated option_trials(), so a new word or function needs nothing here.
std::string try_option_word(const CellGrid& range, const Cell& argument) {
    std::vector<std::string> all_words;
    for (const OptionTrial& trial : option_trials())
        if (std::find(all_words.begin(), all_words.end(), trial.word) == all_words.end()) all_words.push_back(trial.word);
    if (!argument.is_text())
        return "The second argument must be an option word (" + quoted_list(all_words, "or") + "), not " +
               argument.describe() + ".";

    const std::string word = normalized_word(argument.as_text());
    bool known = false;
    std::vector<std::pair<std::string, std::vector<std::string>>> failures;  // reason → functions
    for (const OptionTrial& trial : option_trials()) {
        if (word != trial.word) continue;
        known = true;
        try {
            trial.run(range);
        } catch (const Error& error) {
            const std::string reason = error.what();
            auto same = std::find_if(failures.begin(), failures.end(), [&](const auto& f) { return f.first == reason; });
            if (same == failures.end()) failures.push_back({reason, {trial.function}});
            else same->second.push_back(trial.function);
        }
    }
    if (!known)
        return "\"" + argument.as_text() + "\" is not an option word of any ASSOC function; the words are " +
               quoted_list(all_words) + ".";
    if (failures.empty()) return "\"" + word + "\" can be used on this table.";
    std::string text;
    for (const auto& [reason, functions] : failures) {
        std::string names;
        for (std::size_t i = 0; i < functions.size(); ++i)
            names += (i == 0 ? "" : i + 1 == functions.size() ? " and " : ", ") + functions[i];
        text += (text.empty() ? "" : " ") + names + " with \"" + word + "\" cannot be used here: " + as_sentence(reason);
    }
    return text;
}

}  // namespace

namespace cell_functions {

Matrix expected(const CellGrid& range) {
    const CountTable table = read_count_table(range);
    return table.to_body_shape(expected_counts(table));
}

std::vector<double> statistic(const CellGrid& range, Method method) {
    const TestResult result = independence_test(read_count_table(range), method);
    return {result.statistic, result.df, result.p_value};
}

double pvalue(const CellGrid& range, Method method) { return independence_test(read_count_table(range), method).p_value; }

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
    }
    throw Error("unknown measure");
}

std::string check(const CellGrid& range, const Cell& method) {
    std::string verdict;
    try {
        verdict = check_validity(read_count_table(range)).summary();
    } catch (const Error& error) {
        return "Cannot use this table: " + as_sentence(error.what());
    }
    return method.is_blank() ? verdict : verdict + " " + try_option_word(range, method);
}

CellGrid report(const CellGrid& range, double alpha) {
    const CountTable table = read_count_table(range);
    ReportOptions options;
    options.alpha = alpha;
    options.variables = variable_names_from_corner(range, table);
    const std::vector<ReportLine> lines = association_report(table, options);
    CellGrid cells(lines.size(), 2);
    for (std::size_t i = 0; i < lines.size(); ++i) {
        cells.at(i, 0) = Cell::text(lines[i].label);
        cells.at(i, 1) = lines[i].value;
    }
    return cells;
}

}  // namespace cell_functions
}  // namespace assoc::calc
