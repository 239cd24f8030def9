#pragma once
// Whether the column a measure takes as its outcome reads as the absence of another column: "No"
// before "Yes", "Not promoted" before "Promoted". Tables are often laid out in sorted order (a pivot
// table puts "No" before "Yes"), and the odds ratio, risk ratio, rates and rate difference of such a
// table are those of not having the outcome, easily read as those of having it.
#include <string>
#include <string_view>
#include <vector>

#include "assoc/strata.hpp"

namespace assoc {

// Whether `label` reads as the absence of `other`, by their words alone (ASCII case and spaces at the
// ends aside): a no-word beside a yes-word ("No"/"Yes", "N"/"Y", "False"/"True", "Nein"/"Ja",
// "Non"/"Oui", "Nee"/"Ja"); the other label negated ("Not promoted", "Non-manager", "No exception",
// "Without overtime" beside "With overtime", "Unsuccessful", "Incomplete", "Disagree"); or the same
// words followed or led by a no-word and a yes-word ("Promoted: no" beside "Promoted: yes").
bool names_the_absence_of(std::string_view label, std::string_view other);

namespace detail {

// Refuses, with an Error that says what was found and what to do, when `outcome` (the label of the
// column a measure takes as its outcome, column 1) reads as the absence of one of `others` (the labels
// of the table's other columns of counts). `measure` names the result ("the odds ratio", "the rates"),
// `position` the outcome column among the columns of counts ("first"; "third" for one row per stratum).
void require_outcome_first(const std::string& outcome, const std::vector<std::string>& others, const char* measure,
                           const char* position = "first");

// The same for strata, whose first column of counts is the outcome (stacked 2×2 tables), or whose
// first of each pair of columns is (one row per stratum: row 1's two columns, then row 2's).
void require_outcome_first(const Strata& strata, const char* measure);

}  // namespace detail
}  // namespace assoc
