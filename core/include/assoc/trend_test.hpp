#pragma once
// The Cochran–Armitage test for a trend in a share across ordered categories (e.g. the share of
// staff promoted by number of training sessions attended). More powerful than the chi-squared
// test of independence when the categories have an order and the share rises or falls steadily.
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/matrix.hpp"

namespace assoc {

struct TrendResult {
    double p_value = 1.0;  // two-sided
    // Positive when the share of the first outcome rises with the score, negative when it falls.
    double z = 0.0;
    double statistic = 0.0;  // z², chi-squared with 1 degree of freedom
    std::size_t categories = 0;
    bool categories_in_columns = true;  // 2×k table (true) or k×2 table (false)
    std::vector<std::string> remarks;   // from a range: how it was read (table_notes)
};

// `table` is 2×k (the outcomes are the rows, the ordered categories the columns) or k×2 (the
// categories are the rows, the outcomes the columns), k ≥ 2; a 2×2 table gives the same result
// read either way. The "first outcome" is row 1 of a 2×k table, column 1 of a k×2 table.
// `scores` (one per category, any finite numbers) default to 1, 2, …, k.
//
// z = Σ x_i (s_i − s̄) / √(p̄ (1 − p̄) Σ n_i (s_i − s̄)²), with x_i the first outcome's count in
// category i, n_i the category's total, s̄ = Σ n_i s_i / N and p̄ = Σ x_i / N. This variance uses N,
// as R's prop.trend.test does (z² is its statistic); Mantel's M² = (N − 1) r² uses N − 1 and is
// smaller by the factor (N − 1)/N.
TrendResult trend_test(const Matrix& table, const std::vector<double>& scores = {});

// Reads the table as read_count_table does (header row and label column allowed; a category
// with no counts is kept, so that scores still line up), and the scores from a single row or
// column of numbers; an empty `scores` grid gives the default scores.
TrendResult trend_test(const CellGrid& table, const CellGrid& scores = CellGrid());

}  // namespace assoc
