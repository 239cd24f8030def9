#pragma once
// K 2×2 tables of the same two questions, one per stratum (e.g. promoted or not by sex, one
// table per department), for the Mantel–Haenszel and Breslow–Day tests.
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/cell.hpp"

namespace assoc {

// One stratum's table:   column 1  column 2
//                row 1      a         b
//                row 2      c         d
struct Stratum {
    double a = 0.0, b = 0.0, c = 0.0, d = 0.0;
    std::string label;  // from the label column, or "" when there is none
    double total() const { return a + b + c + d; }
    // Both rows and both columns hold counts; otherwise the stratum says nothing about the odds ratio.
    bool informative() const { return a + b > 0 && c + d > 0 && a + c > 0 && b + d > 0; }
};

enum class StrataLayout {
    one_row_each,    // K rows × 4 columns: a, b, c, d per stratum
    stacked_blocks,  // 2K rows × 2 columns: the 2×2 tables one below the other
};

struct Strata {
    std::vector<Stratum> tables;  // one 2×2 table per stratum, in the order of the range
    StrataLayout layout = StrataLayout::one_row_each;
    std::size_t blank_cells = 0;  // blank count cells, read as 0
    // The header labels of the columns of counts (2 when stacked, 4 with one row each; "" where none):
    // what tells which column is the outcome.
    std::vector<std::string> column_labels;
    // How the range was read, in sentences for ASSOC.CHECK: rows paired in order because the labels do
    // not show the strata, rows of a stratum matched by their group labels, totals set aside.
    std::vector<std::string> remarks;
};

// Reads strata from a range. The header row and label column are recognised as for
// read_count_table (a first row or column of texts); total lines are left out. The counts must be
// 4 columns (one stratum per row) or 2 columns (stacked 2×2 tables); any other shape is an error,
// never reshaped. At least 2 strata are needed.
//
// In the stacked layout the labels say which rows form a stratum, and each stratum must have
// exactly 2 rows (an error names a stratum that has another number, and its rows):
// - two label columns (e.g. Office, Sex): the first names the stratum, blank meaning "as above";
// - one label column: the stratum's name on its first row with blanks below it; or the stratum's
//   name on each of its rows; or group labels that repeat (Women, Men, Women, Men: the period
//   is the number of rows per stratum);
// - no labels, or labels that are all different: the rows are taken two by two in order (a remark
//   says so when there are labels). Labels that repeat in no such pattern are an error.
// When the groups of each stratum carry labels, a stratum whose two rows come in the other order is
// matched to the first stratum's order (and a remark says so).
Strata read_strata(const CellGrid& range);

// "stratum 3" or "stratum 3 (Legal)", for messages.
std::string stratum_name(const Strata& strata, std::size_t index);

}  // namespace assoc
