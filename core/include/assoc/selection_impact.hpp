#pragma once
// Selection rates by group and their ratio to the highest rate, with the four-fifths rule of
// thumb from the US Uniform Guidelines on Employee Selection Procedures, 29 CFR 1607.4(D): a
// group's rate below four-fifths (80%) of the highest group's rate is generally taken as
// evidence of adverse impact. It is a screening rule, not a test: see selection_impact_caution().
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/cell.hpp"

namespace assoc {

struct GroupImpact {
    // Whether the group has people considered, and so a rate; a group without is left empty (no rate,
    // no ratio) and `flag` says why.
    bool has_rate = true;
    double selection_rate = 0.0;  // selected / considered
    double impact_ratio = 0.0;    // selection_rate / the highest group's rate
    bool below_threshold = false;
    std::string flag;  // impact_flag(threshold) when below, the reason when the group has no rate, "" otherwise
};

struct SelectionImpact {
    std::vector<GroupImpact> groups;  // in the order of the input
    std::size_t highest_group = 0;    // 0-based index of the (first) group with the highest rate
    double highest_rate = 0.0;
    double threshold = 0.8;
    // How the ranges were read, for ASSOC.CHECK: a header left out, groups left empty.
    std::vector<std::string> remarks;
};

// Per group (one pair of selected and considered counts), its rate and impact ratio. A group is
// flagged when its ratio is below `threshold` (0 < threshold ≤ 1, default 0.8); the rule says
// "less than", so a ratio equal to the threshold (up to a relative 1e-12 for rounding) is not
// flagged. A group with 0 people considered has no rate: it is left empty with the reason in its
// flag, and the others are answered. Errors: fewer than 2 groups with people considered, negative
// counts, more selected than considered, and no one selected in any group (there is no highest
// rate to compare with). Messages name group i as "group i".
SelectionImpact selection_impact(const std::vector<double>& selected, const std::vector<double>& considered,
                                 double threshold = 0.8);
// The same from two single rows or columns of numbers, as long as each other as given (whole columns
// may be given: the blank cells after the last group are no groups). A first cell that holds a text
// (in either range, the other's first cell being a text or blank) is a header and is left out; a
// group whose two cells are blank, or whose considered count is 0, is left empty with its reason.
// One of the two blank, or a text below the header, is an error. Messages name groups by their row
// (column) in the ranges, the header being row 1.
SelectionImpact selection_impact(const CellGrid& selected, const CellGrid& considered, double threshold = 0.8);

// The flag text: "below four-fifths of the highest rate" at 0.8, "below 90% of the highest rate" at 0.9.
std::string impact_flag(double threshold);

// The caution that goes with every report of impact ratios.
std::string selection_impact_caution();

}  // namespace assoc
