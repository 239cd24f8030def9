#pragma once
// Which groups differ from which: after a test of an r×c table, every pair of rows compared on the
// columns, with the p-values adjusted for the number of pairs.
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/count_table.hpp"
#include "assoc/exact_test.hpp"
#include "assoc/p_value_adjustment.hpp"

namespace assoc {

enum class PairwiseMethod {
    pearson,  // Pearson's X² without correction on each pair's 2×c table
    exact,    // the exact test (Fisher, Freeman–Halton) on each pair's 2×c table
};

struct PairComparison {
    std::size_t first = 0, second = 0;   // the two rows' places in the range's body (0-based), first < second
    std::string first_name, second_name;  // their labels, or "row k" (k the place in the body, from 1)
    double p_value = 1.0;                 // the test of the pair's 2×c table
    double adjusted_p_value = 1.0;        // adjusted over all the pairs
};

struct PairwiseComparisons {
    // Every pair of the rows with counts, in the order (1,2), (1,3), …, (1,r), (2,3), … of the range.
    std::vector<PairComparison> pairs;
    // Rows of zeros left out, pairs whose counts fall in one column, pairs with small expected counts.
    std::vector<std::string> remarks;
    double smallest_adjusted_p_value() const;
};

// Rows compared at most: 100 rows make 4,950 pairs.
inline constexpr std::size_t max_pairwise_rows = 100;

// Each pair of rows with counts is tested on its own 2×c table, columns of zeros in both rows left
// out; a pair whose counts all fall in one column has identical shares and gets p = 1 (with a
// remark). The p-values are then adjusted over all pairs (Holm by default). Rows of zeros take no
// part. With `exact`, `limits` bound all the pairs' exact tests together (time in total, memory per
// pair), and the counts must be whole. Errors for more than max_pairwise_rows rows with counts.
PairwiseComparisons pairwise_comparisons(const CountTable& table, PAdjustment adjustment = PAdjustment::holm,
                                         PairwiseMethod method = PairwiseMethod::pearson,
                                         const ExactLimits& limits = {});

}  // namespace assoc
