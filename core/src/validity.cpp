#include "assoc/validity.hpp"

#include <algorithm>
#include <cmath>
#include <unordered_set>

#include "ascii_case.hpp"
#include "assoc/error.hpp"
#include "assoc/expected_counts.hpp"
#include "assoc/format.hpp"
#include "assoc/ratio_estimate.hpp"
#include "assoc/wording.hpp"
#include "row_names.hpp"
#include "shared_words.hpp"

namespace assoc {
namespace {

using detail::capitalised;


// "The row "Legal" has no counts and was set aside.", "Rows 7–40 have no counts and were set aside.":
// labelled lines by their labels (a handful, the rest counted), the others by their row numbers in runs.
std::string describe_set_aside(const std::vector<SetAside>& all, const char* word, SetAside::Why why) {
    std::vector<std::string> labelled;
    std::vector<std::size_t> numbers;
    for (const SetAside& line : all) {
        if (line.why != why) continue;
        if (line.label.empty()) numbers.push_back(line.range_number);
        else labelled.push_back(quoted_label(line.label));
    }
    const std::size_t count = labelled.size() + numbers.size();
    if (count == 0) return "";
    const bool one = count == 1;
    // A label that comes more than once (a "Total" row in every stratum) is named once, and the
    // lines are counted: "The 2 rows "Total" are totals …".
    const std::size_t labelled_lines = labelled.size();
    {
        std::unordered_set<std::string> seen;
        std::vector<std::string> distinct;
        for (std::string& label : labelled)
            if (seen.insert(label).second) distinct.push_back(std::move(label));
        labelled = std::move(distinct);
    }
    const std::string how_many =
        labelled.size() < labelled_lines && numbers.empty() ? format_count(static_cast<double>(labelled_lines)) + " " : "";
    std::vector<std::string> names;
    const std::size_t shown = 5;
    for (std::size_t i = 0; i < labelled.size() && i < shown; ++i) names.push_back(labelled[i]);
    if (labelled.size() > shown) names.push_back(format_count(static_cast<double>(labelled.size() - shown)) + " more");
    if (!numbers.empty()) names.push_back(numbered_lines(word, numbers));
    std::string text = labelled.empty() ? capitalised(name_list(names, names.size()))
                                        : "The " + how_many + std::string(word) + (one ? " " : "s ") +
                                              name_list(names, names.size());
    if (why == SetAside::Why::total) return text + (one ? " is a total and was set aside." : " are totals and were set aside.");
    return text + (one ? " has no counts and was set aside." : " have no counts and were set aside.");
}

}  // namespace

std::vector<std::string> table_notes(const CountTable& table) {
    std::vector<std::string> notes = table.doubts();
    notes.insert(notes.end(), table.reading_remarks().begin(), table.reading_remarks().end());
    for (const auto& [lines, word] : {std::pair{&table.set_aside_rows(), "row"}, std::pair{&table.set_aside_columns(), "column"}}) {
        const std::string sentence = describe_set_aside(*lines, word, SetAside::Why::total);
        if (!sentence.empty()) notes.push_back(sentence);
    }
    return notes;
}

namespace {

// When the rows and the columns carry the same set of labels, the table may classify the same people
// twice, and then the paired test is the one that fits.
std::string same_labels_remark(const CountTable& table) {
    if (!table.has_row_labels() || !table.has_column_labels()) return "";
    const std::vector<std::string> row_labels = detail::category_labels(table, true),
                                   column_labels = detail::category_labels(table, false);
    std::vector<std::string> rows, columns, shown;
    for (const std::string& label : row_labels) {
        rows.push_back(folded_label(label));
        shown.push_back(quoted_label(label));
    }
    for (const std::string& label : column_labels) columns.push_back(folded_label(label));
    if (rows.size() < 2 || rows.size() != columns.size()) return "";
    if (std::any_of(rows.begin(), rows.end(), [](const std::string& label) { return label.empty(); })) return "";
    const auto same_sets = [](std::vector<std::string> a, std::vector<std::string> b) {
        std::sort(a.begin(), a.end());
        std::sort(b.begin(), b.end());
        return a == b && std::adjacent_find(a.begin(), a.end()) == a.end();
    };
    std::string how = "carry the same labels";
    if (!same_sets(rows, columns)) {
        // "Yes before" and "Yes after": the same labels once the words each side shares are left out.
        if (!same_sets(detail::label_keys(row_labels), detail::label_keys(column_labels))) return "";
        how = "carry the same labels but for the words each side's labels share";
    }
    return "The rows and the columns " + how + " (" + name_list(shown, 4) +
           "): if the table counts the same people twice (before and after, or by two raters), the paired test "
           "(ASSOC.PAIRED) fits it, not this test of independence.";
}

}  // namespace

ValidityCheck check_validity(const CountTable& table) {
    ValidityCheck check;
    const Matrix expected = expected_counts(table);
    check.cells = expected.size();
    // Only a table read without the 2×2 requirement can get here empty; min_element on it crashed.
    require(check.cells > 0, "the table holds no counts, so there is nothing to check");
    check.smallest_expected = *std::min_element(expected.values().begin(), expected.values().end());
    for (double e : expected.values()) {
        if (e < 5) ++check.cells_below_five;
        if (e < 1) check.any_below_one = true;
    }
    check.share_below_five = static_cast<double>(check.cells_below_five) / static_cast<double>(check.cells);
    check.cochran_rule_met = !check.any_below_one && check.share_below_five <= 0.2;
    // In a 2×2 table one cell below 5 is already 25% of the cells, so Cochran's rule also gives the
    // usual advice for 2×2 tables: any expected count below 5 calls for the exact test.
    check.exact_test_recommended = !check.cochran_rule_met;
    check.blank_cells = table.blank_cells();
    check.whole_counts = table.whole_counts();
    check.set_aside_rows = table.set_aside_rows();
    check.set_aside_columns = table.set_aside_columns();
    check.doubts = table.doubts();
    if (!check.whole_counts)
        check.doubts.push_back(
            "Some counts are not whole numbers (weighted data): the chi-squared p-value treats them as counts of "
            "independent people or items, so it is right only for frequency weights (each weight the number of "
            "people a record stands for), never for amounts such as pay or invoice values, nor for survey weights; "
            "exact tests need whole counts.");
    check.remarks = table.reading_remarks();
    if (needs_zero_cell_correction(table)) check.remarks.push_back(zero_cell_correction_remark());
    const std::string paired = same_labels_remark(table);
    if (!paired.empty()) check.remarks.push_back(paired);
    return check;
}

std::string ValidityCheck::summary() const {
    std::string expectation;
    const std::string smallest = "the smallest expected count is " + format_number(smallest_expected, 3);
    if (!exact_test_recommended) {
        expectation = smallest + " and ";
        expectation += cells_below_five == 0
                           ? "no cell expects fewer than 5, so the chi-squared approximation can be trusted."
                           : format_count(static_cast<double>(cells_below_five)) + " of " +
                                 format_count(static_cast<double>(cells)) +
                                 " cells expect fewer than 5, within Cochran's rule (at most 20%, none below 1).";
    } else {
        expectation = smallest + ", and " + format_count(static_cast<double>(cells_below_five)) + " of " +
                      format_count(static_cast<double>(cells)) + " cells (" +
                      format_number(100.0 * share_below_five, 3) + "%) expect fewer than 5";
        expectation += std::string("; Cochran's rule asks for none below 1 and at most 20% below 5") +
                       (any_below_one ? " (some cells expect fewer than 1)." : ".");
        expectation += whole_counts ? " Use the exact test (ASSOC.EXACT) or a simulated p-value (ASSOC.SIMULATE) instead."
                                    : " Combine sparse categories or collect more data.";
    }
    std::string text;
    if (doubts.empty()) {
        text = (exact_test_recommended ? "Doubtful: " : "Sound: ") + expectation;
    } else {
        text = "Doubtful:";
        for (const std::string& doubt : doubts) text += " " + doubt;
        // With the doubts first, the expected counts are only a further fact.
        if (!exact_test_recommended && cells_below_five == 0)
            expectation = smallest + " and no cell expects fewer than 5.";
        text += " " + capitalised(expectation);
    }
    if (blank_cells > 0)
        text += " " + format_count(static_cast<double>(blank_cells)) + (blank_cells == 1 ? " blank cell was" : " blank cells were") +
                " read as 0.";
    for (SetAside::Why why : {SetAside::Why::total, SetAside::Why::no_counts}) {
        const std::string rows = describe_set_aside(set_aside_rows, "row", why);
        const std::string columns = describe_set_aside(set_aside_columns, "column", why);
        if (!rows.empty()) text += " " + rows;
        if (!columns.empty()) text += " " + columns;
    }
    for (const std::string& remark : remarks) text += " " + remark;
    return text;
}

}  // namespace assoc
