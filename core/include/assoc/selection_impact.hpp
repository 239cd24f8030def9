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
    double selection_rate = 0.0;  // selected / considered
    double impact_ratio = 0.0;    // selection_rate / the highest group's rate
    bool below_threshold = false;
    std::string flag;  // impact_flag(threshold) when below, "" otherwise
};

struct SelectionImpact {
    std::vector<GroupImpact> groups;  // in the order of the input
    std::size_t highest_group = 0;    // 0-based index of the (first) group with the highest rate
    double highest_rate = 0.0;
    double threshold = 0.8;
};

// Per group (one pair of selected and considered counts), its rate and impact ratio. A group is
// flagged when its ratio is below `threshold` (0 < threshold ≤ 1, default 0.8); the rule says
// "less than", so a ratio equal to the threshold (up to a relative 1e-12 for rounding) is not
// flagged. Errors: fewer than 2 groups, blank or negative counts, more selected than considered,
// a group with 0 considered (its rate is undefined), and no one selected in any group (there is
// no highest rate to compare with).
SelectionImpact selection_impact(const std::vector<double>& selected, const std::vector<double>& considered,
                                 double threshold = 0.8);
// The same from two equally long single rows or columns of numbers.
SelectionImpact selection_impact(const CellGrid& selected, const CellGrid& considered, double threshold = 0.8);

// The flag text: "below four-fifths of the highest rate" at 0.8, "below 90% of the highest rate" at 0.9.
std::string impact_flag(double threshold);

// The caution that goes with every report of impact ratios.
std::string selection_impact_caution();

}  // namespace assoc
