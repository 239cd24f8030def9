#include "assoc/goodness_of_fit.hpp"

#include <algorithm>
#include <cmath>
#include <string>

#include "argument_checks.hpp"
#include "ascii_case.hpp"
#include "assoc/chi_squared_distribution.hpp"
#include "assoc/count_table.hpp"
#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "assoc/validity.hpp"
#include "assoc/wording.hpp"
#include "exact_margins.hpp"
#include "row_names.hpp"
#include "total_lines.hpp"

namespace assoc {
namespace {

std::string values_phrase(std::size_t n) { return std::to_string(n) + (n == 1 ? " value" : " values"); }

// One row or one column of numbers, with the labels of its categories when every category has one.
struct Line {
    std::vector<double> values;
    std::vector<std::string> labels;  // one per value, or none
    // What reading the range set aside or doubted (a "Total" row left out, a line that holds the sum of
    // the others), for ASSOC.CHECK: said, not only done.
    std::vector<std::string> notes;
};

// One row or one column of numbers, with the labels a table may have; zeros are kept in place.
// `counts_only`: percentages and shares are refused (observed counts), or allowed (expected shares).
Line read_line(const CellGrid& range, bool counts_only) {
    ReadOptions options;
    options.require_two_by_two = false;
    options.counts_only = counts_only;
    const CountTable table = read_count_table(range, options);
    // Total lines are left out; a category observed 0 times still counts here.
    const Matrix counts = table.category_counts();
    require(counts.rows() == 1 || counts.columns() == 1,
            "select one row or one column of numbers; this range has " + std::to_string(counts.rows()) +
                " rows and " + std::to_string(counts.columns()) + " columns of numbers");
    Line line;
    line.values = counts.values();
    // The categories run along the line: a column's are named by the row labels, a row's by the
    // column labels (a single header cell, "Observed", names the line, not a category).
    const bool along_rows = counts.columns() == 1 && counts.rows() > 1;
    if (line.values.size() > 1) line.labels = detail::category_labels(table, along_rows);
    if (std::any_of(line.labels.begin(), line.labels.end(), [](const std::string& label) { return label.empty(); }))
        line.labels.clear();
    line.notes = table_notes(table);
    return line;
}

// When both ranges name their categories, the expected values are taken by label, not by place: a
// plan typed in another order than the counts ("South, North, East" beside "North, South, East")
// would otherwise be tested against the wrong categories. Labels that do not match are an error.
std::vector<double> expected_by_label(const Line& observed, const Line& expected, std::vector<std::string>& remarks) {
    if (observed.labels.empty() || expected.labels.empty()) return expected.values;
    std::vector<std::string> observed_keys, expected_keys;
    for (const std::string& label : observed.labels) observed_keys.push_back(folded_label(label));
    for (const std::string& label : expected.labels) expected_keys.push_back(folded_label(label));
    const auto repeats = [](std::vector<std::string> keys) {
        std::sort(keys.begin(), keys.end());
        return std::adjacent_find(keys.begin(), keys.end()) != keys.end();
    };
    if (repeats(observed_keys) || repeats(expected_keys)) return expected.values;
    if (observed_keys == expected_keys) return expected.values;
    std::vector<std::string> only_observed, only_expected;
    std::vector<double> ordered;
    for (std::size_t i = 0; i < observed_keys.size(); ++i) {
        const auto at = std::find(expected_keys.begin(), expected_keys.end(), observed_keys[i]);
        if (at == expected_keys.end())
            only_observed.push_back(quoted_label(observed.labels[i]));
        else
            ordered.push_back(expected.values[static_cast<std::size_t>(at - expected_keys.begin())]);
    }
    for (std::size_t i = 0; i < expected_keys.size(); ++i)
        if (std::find(observed_keys.begin(), observed_keys.end(), expected_keys[i]) == observed_keys.end())
            only_expected.push_back(quoted_label(expected.labels[i]));
    if (!only_observed.empty() || !only_expected.empty()) {
        std::string found;
        if (!only_observed.empty()) found += "; only in the observed range: " + name_list(only_observed, 6);
        if (!only_expected.empty()) found += "; only in the expected range: " + name_list(only_expected, 6);
        throw Error("the two ranges name different categories" + found +
                    ". Give both the same labels (spaces at the ends and capitals aside), or leave the labels out of "
                    "the expected range to take its values in the observed range's order");
    }
    remarks.push_back("The expected values were matched to the observed categories by their labels: the expected "
                      "range lists them in another order.");
    return ordered;
}

void check_values(const std::vector<double>& values, const char* what) {
    for (std::size_t i = 0; i < values.size(); ++i)
        require(std::isfinite(values[i]) && values[i] >= 0, std::string(what) + " " + std::to_string(i + 1) + " is " +
                                                                format_number(values[i]) +
                                                                "; it must be a number of zero or more");
}

}  // namespace

GoodnessOfFit goodness_of_fit(const std::vector<double>& observed, const std::vector<double>& expected,
                              double estimated) {
    require(!observed.empty(), "there are no observed counts; select one row or one column of counts");
    detail::whole_number(estimated, 0, 1e6, "the number of estimated parameters");
    check_values(observed, "observed count");
    const std::vector<double> shares = expected.empty() ? std::vector<double>(observed.size(), 1.0) : expected;
    require(shares.size() == observed.size(),
            "the observed range has " + values_phrase(observed.size()) + " but the expected range has " +
                values_phrase(shares.size()) + "; give one expected count or share per category");
    check_values(shares, "expected value");

    // The totals in double-double, and O − E = (O·S − T·s)/S with T the observed total, s the share and
    // S the shares' total, each product formed exactly on factors scaled by powers of two
    // (exact_margins.hpp): the deviation keeps its digits for counts near 1e8 and nothing overflows
    // for counts near 1e308.
    detail::DoubleDouble observed_total, share_total;
    for (std::size_t i = 0; i < observed.size(); ++i) {
        observed_total = observed_total + observed[i];
        share_total = share_total + shares[i];
    }
    require(observed_total.hi > 0, "the observed counts add up to 0; there is nothing to test");
    require(share_total.hi > 0, "the expected counts or shares add up to 0; give each category its expected share");
    require(std::isfinite(observed_total.hi) && std::isfinite(share_total.hi),
            "the counts add up to more than a spreadsheet number can hold");

    GoodnessOfFit result;
    result.observed = observed;
    result.expected.assign(observed.size(), 0.0);
    for (std::size_t i = 0; i < observed.size(); ++i) {
        if (shares[i] == 0) {
            require(observed[i] == 0, "category " + std::to_string(i + 1) + " is expected to have no counts but has " +
                                          format_count(observed[i]) + "; give it an expected share above 0");
            continue;  // expected and observed 0: no information, not a category of the test
        }
        ++result.categories;
        const detail::DoubleDouble count{observed[i], 0.0}, share{shares[i], 0.0};
        const double e = detail::product_over(observed_total, share, share_total);
        const double deviation =
            detail::divided(detail::difference_of_products(count, share_total, observed_total, share), share_total);
        result.expected[i] = e;
        result.statistic += deviation * (deviation / e);
    }
    require(std::isfinite(result.statistic),
            "the goodness-of-fit statistic is larger than a spreadsheet number can hold for these counts (its "
            "p-value is 0); divide every count by a common factor to see its size");

    const double categories = static_cast<double>(result.categories);
    require(result.categories >= 2, "the test needs at least 2 categories with an expected count above 0");
    result.df = categories - 1 - estimated;
    require(result.df >= 1, std::to_string(result.categories) + " categories leave " + format_count(categories - 1) +
                                " degrees of freedom, and " + format_count(estimated) +
                                " estimated parameters leave none; the test needs at least 1");
    result.p_value = chi_squared_p_value(result.statistic, result.df);
    return result;
}

namespace {

// Smallest number of decimals (up to 9) that writes every value: how finely they were rounded.
int decimals_of(const std::vector<double>& values) {
    for (int decimals = 0; decimals < 9; ++decimals) {
        const double scale = std::pow(10.0, decimals);
        if (std::all_of(values.begin(), values.end(), [&](double v) {
                return std::fabs(v * scale - std::nearbyint(v * scale)) <= 1e-6;
            }))
            return decimals;
    }
    return 9;
}

// Expected values that show what they add up to must add up to it; otherwise a category is missing or
// a value mistyped, and rescaling them would test against a plan nobody meant:
// - under a label that says they are percentages ("Expected %"), 100 within 1, or 1 within 0.01 when
//   the cells are formatted as percentages (30% holds 0.3);
// - values that are all shares (from 0 to below 1, none a whole unit), 1 allowing for their rounding
//   (half a unit of their last decimal each).
// Other values are parts in any unit (9 : 3 : 3 : 1) and are rescaled.
void require_plan_adds_up(const CellGrid& expected, const std::vector<double>& values) {
    double sum = 0;
    for (double value : values) sum += value;
    if (!expected.empty() && expected.at(0, 0).is_text()) {
        const std::string& label = expected.at(0, 0).as_text();
        // Any "%" here, even after a digit ("Plan 2026 %"); the words as a count table reads them.
        const bool percent = label.find('%') != std::string::npos || detail::names_percentages(label);
        if (percent && !(std::fabs(sum - 100) <= 1 || std::fabs(sum - 1) <= 0.01))
            throw Error("in the expected range: the percentages under the label " + quoted_label(label) + " add up to " +
                        format_number(sum, 6) + ", not 100, so a category may be missing or a value mistyped; correct "
                        "them, or give expected counts under a label that does not speak of percentages");
    }
    if (values.size() < 2 || sum == 0 ||  // a plan of zeros is said by the test itself
        std::any_of(values.begin(), values.end(), [](double v) { return !(v >= 0 && v < 1); }))
        return;
    const double rounding = 0.5 * std::pow(10.0, -decimals_of(values)) * static_cast<double>(values.size());
    if (std::fabs(sum - 1) <= std::max(rounding, 1e-9)) return;
    throw Error("in the expected range: the values are shares (all between 0 and 1) but add up to " +
                format_number(sum, 6) + ", not 1, even allowing for their rounding, so a category may be missing or a "
                "value mistyped; correct them so that they add up to 1, or give expected counts");
}

}  // namespace

GoodnessOfFit goodness_of_fit(const CellGrid& observed, const CellGrid& expected, double estimated) {
    const Line observed_line = read_line(observed, true);
    std::vector<double> expected_values;
    std::vector<std::string> remarks = observed_line.notes;
    if (!expected.empty()) {
        Line expected_line;
        try {
            expected_line = read_line(expected, false);
        } catch (const Error& error) {
            // The reader's messages speak of counts; say which range they are about.
            throw Error(std::string("in the expected range: ") + error.what());
        }
        require_plan_adds_up(expected, expected_line.values);
        for (const std::string& note : expected_line.notes)
            remarks.push_back("In the expected range: " + detail::in_sentence(note));
        if (expected_line.values.size() == observed_line.values.size())
            expected_values = expected_by_label(observed_line, expected_line, remarks);
        else
            expected_values = expected_line.values;  // the count mismatch is said below
    }
    GoodnessOfFit result = goodness_of_fit(observed_line.values, expected_values, estimated);
    result.remarks = std::move(remarks);
    return result;
}

}  // namespace assoc
