#include "assoc/validity.hpp"

#include <algorithm>
#include <cctype>
#include <cmath>

#include "assoc/error.hpp"
#include "assoc/expected_counts.hpp"
#include "assoc/format.hpp"
#include "assoc/ratio_estimate.hpp"

namespace assoc {
namespace {

std::string describe_set_aside(const std::vector<SetAside>& lines, const char* word) {
    std::string names;
    for (std::size_t i = 0; i < lines.size(); ++i) {
        if (i > 0) names += (i + 1 == lines.size()) ? " and " : ", ";
        names += lines[i].label.empty() ? std::to_string(lines[i].index + 1) : "\"" + lines[i].label + "\"";
    }
    const bool one = lines.size() == 1;
    const bool labelled = std::any_of(lines.begin(), lines.end(), [](const SetAside& line) { return !line.label.empty(); });
    // "The row \"Legal\" has …", but "Row 2 has …" (not "The row 2").
    std::string noun = std::string(word) + (one ? "" : "s");
    noun = labelled ? "The " + noun : static_cast<char>(std::toupper(static_cast<unsigned char>(noun[0]))) + noun.substr(1);
    return noun + " " + names + (one ? " has" : " have") +
           " no counts and " + (one ? "was" : "were") + " set aside.";
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
    check.remarks = table.reading_remarks();
    if (needs_zero_cell_correction(table)) check.remarks.push_back(zero_cell_correction_remark());
    return check;
}

std::string ValidityCheck::summary() const {
    std::string text;
    const std::string smallest = "the smallest expected count is " + format_number(smallest_expected, 3);
    if (!exact_test_recommended) {
        text = "Sound: " + smallest + " and ";
        text += cells_below_five == 0 ? "no cell expects fewer than 5, so the chi-squared approximation can be trusted."
                                      : format_count(static_cast<double>(cells_below_five)) + " of " +
                                            format_count(static_cast<double>(cells)) +
                                            " cells expect fewer than 5, within Cochran's rule (at most 20%, none below 1).";
    } else {
        text = "Doubtful: " + smallest + ", and " + format_count(static_cast<double>(cells_below_five)) + " of " +
               format_count(static_cast<double>(cells)) + " cells (" +
               format_number(100.0 * share_below_five, 3) + "%) expect fewer than 5";
        text += std::string("; Cochran's rule asks for none below 1 and at most 20% below 5") +
                (any_below_one ? " (some cells expect fewer than 1)." : ".");
        text += whole_counts ? " Use the exact test (ASSOC.EXACT) or a simulated p-value (ASSOC.SIMULATE) instead."
                             : " Combine sparse categories or collect more data.";
    }
    if (blank_cells > 0)
        text += " " + format_count(static_cast<double>(blank_cells)) + (blank_cells == 1 ? " blank cell was" : " blank cells were") +
                " read as 0.";
    if (!set_aside_rows.empty()) text += " " + describe_set_aside(set_aside_rows, "row");
    if (!set_aside_columns.empty()) text += " " + describe_set_aside(set_aside_columns, "column");
    if (!whole_counts) text += " Some counts are not whole numbers (weighted data); exact tests need whole counts.";
    for (const std::string& remark : remarks) text += " " + remark;
    return text;
}

}  // namespace assoc
