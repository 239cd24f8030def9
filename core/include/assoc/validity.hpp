#pragma once
// The checks a careful statistician makes before trusting a chi-squared p-value.
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/count_table.hpp"

namespace assoc {

struct ValidityCheck {
    double smallest_expected = 0.0;
    std::size_t cells = 0;              // kept cells
    std::size_t cells_below_five = 0;   // kept cells with E < 5
    double share_below_five = 0.0;      // cells_below_five / cells
    bool any_below_one = false;         // some E < 1
    // Cochran's rule: no expected count below 1 and at most 20% of them below 5.
    bool cochran_rule_met = true;
    // The approximation is doubtful (Cochran's rule fails, or a 2×2 table has an E < 5):
    // use the exact test.
    bool exact_test_recommended = false;
    std::size_t blank_cells = 0;
    bool whole_counts = true;
    std::vector<SetAside> set_aside_rows, set_aside_columns;
    // What makes the table itself doubtful, whatever its expected counts: counts that are not whole
    // numbers, a line labelled as data that holds the sum of the others, rows that each add up to 100
    // (see CountTable::doubts). Any of them makes the verdict "Doubtful".
    std::vector<std::string> doubts;
    // Further remarks that other routines add (e.g. a correction they applied).
    std::vector<std::string> remarks;

    // The verdict in plain words, one paragraph: first "Sound:" or "Doubtful:", then the facts.
    // Its length does not grow with the table: set-aside lines are named in a short summary.
    std::string summary() const;
};

ValidityCheck check_validity(const CountTable& table);

// What a function that reads the table without the chi-squared verdict (the trend, ordinal, paired
// tests, the rate difference) passes on to ASSOC.CHECK: the table's doubts, how it was read, and the
// rows and columns set aside as totals ("The row "Total" is a total and was set aside.").
std::vector<std::string> table_notes(const CountTable& table);

}  // namespace assoc
