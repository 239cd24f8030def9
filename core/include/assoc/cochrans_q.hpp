#pragma once
// Cochran's Q test for the same people answering yes or no on k ≥ 2 occasions (survey waves,
// raters, tasks): does the share of yes change from one occasion to another? For k = 2 it is
// McNemar's test without the continuity correction.
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/matrix.hpp"

namespace assoc {

struct RepeatedResult {
    double p_value = 1.0;
    double statistic = 0.0;  // Q, chi-squared with k − 1 degrees of freedom
    double df = 0.0;         // k − 1
    std::size_t people = 0;  // rows used
    std::size_t occasions = 0;
    std::size_t set_aside = 0;  // rows with a blank answer (read from cells only)
    // What CHECK says about the reading: the label counted as yes, the rows set aside.
    std::vector<std::string> remarks;
};

// Q = (k − 1) (k Σ_j C_j² − T²) / (k T − Σ_i R_i²), with C_j the yes answers on occasion j, R_i
// person i's yes answers and T all yes answers (Cochran 1950). `answers` holds one row per person,
// one column per occasion, each 1 (yes) or 0 (no). People who answer the same every time add
// nothing to either sum. Errors: fewer than 2 occasions or 1 person; no one whose answers differ.
RepeatedResult cochrans_q_test(const Matrix& answers);

// Reads the answers from a range: one row per person, one column per occasion, with an optional
// header row (a first row of texts none of which is an answer below it). Answers are
// 1 and 0 (yes and no; TRUE and FALSE arrive as 1 and 0), or texts when exactly two labels occur.
// `yes` (blank: omitted) names the label that counts as yes, in any case; without it "yes" (any
// case) is taken when it is one of the two, else the first label met, and a remark says which
// (Q is the same either way, since swapping yes and no leaves it unchanged). A row with a blank
// answer is set aside and counted in the remarks; wholly blank rows are skipped.
RepeatedResult cochrans_q_test(const CellGrid& answers, const Cell& yes = Cell());

}  // namespace assoc
