#pragma once
// The linear-by-linear association test for a table whose rows and columns are both ordered
// (tenure band by satisfaction on a five-point scale): does a higher row go with a higher column?
// Where the association follows the order, it is far more powerful than the chi-squared test of
// independence, which ignores the order.
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/count_table.hpp"

namespace assoc {

struct OrdinalResult {
    double p_value = 1.0;     // two-sided: the upper tail of chi-squared with 1 degree of freedom
    double statistic = 0.0;   // Mantel's M² = (n − 1) r²
    double df = 1.0;
    // r: the Pearson correlation of the row scores with the column scores, each person (count)
    // weighing once. Positive when higher rows go with higher columns.
    double correlation = 0.0;
    std::vector<std::string> remarks;  // from a range: how it was read (table_notes)
};

// Mantel's linear-by-linear test (Mantel 1963; Agresti 2007, section 2.5): with row scores u and
// column scores v, r = Σ n_ij (u_i − ū)(v_j − v̄) / √(Σ n_i+ (u_i − ū)² · Σ n_+j (v_j − v̄)²) and
// M² = (n − 1) r², chi-squared with 1 degree of freedom under independence.
//
// Scores are given per row and column of the body (rows and columns of zeros included, since
// they keep their place in the order): `row_scores` one per body row, `column_scores` one per
// body column; empty means 1, 2, 3, …. Given scores must be finite and strictly monotone
// (rising or falling). M² does not change when the scores are shifted or stretched (u → a + b·u,
// b ≠ 0); r changes sign when b < 0.
//
// For a 2×k table with the same column scores, M² = (n − 1)/n · z² of the Cochran–Armitage test
// (trend_test.hpp, whose variance uses n), and r has the sign opposite to its z when the row
// scores rise (z follows the share of row 1, r the weight of row 2).
//
// The sum Σ n_ij (u_i − ū)(v_j − v̄) is formed as Σ (O − E)_ij (u_i − ū)(v_j − v̄) with O − E from
// deviations_from_expected, so a table near independence keeps the digits of its small r.
OrdinalResult ordinal_test(const CountTable& table, const std::vector<double>& row_scores = {},
                           const std::vector<double>& column_scores = {});

// Reads the table as read_count_table does (header row and label column allowed), and each
// non-empty scores grid as one row or one column of numbers.
OrdinalResult ordinal_test(const CellGrid& table, const CellGrid& row_scores = CellGrid(),
                           const CellGrid& column_scores = CellGrid());

}  // namespace assoc
