#pragma once
// r×c tables of the same two questions, one per stratum, read from a "long" range: one row per
// stratum and row category, with the stratum's label first, the row's label second and one count
// per column category after them (a header row with the column categories' names is optional).
//
//     Office      Department   Very low   Low   …   Very high
//     Northgate   Design          3        7            5
//     Northgate   Assembly        6       12            2
//     Riverside   Design          …
//
// The generalized Cochran–Mantel–Haenszel test (generalized_mantel_haenszel.hpp) reads this.
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/matrix.hpp"

namespace assoc {

struct LongStratum {
    std::string label;  // as the range shows it: a text, or a number written out
    // One row per row label of LongStrata::row_labels (0 where the stratum has no such row),
    // one column per column category.
    Matrix counts;
};

struct LongStrata {
    std::vector<std::string> row_labels;     // every distinct row label, in order of first appearance
    std::vector<std::string> column_labels;  // from the header row; "" without one
    std::vector<LongStratum> strata;         // in the order of the range
    std::size_t empty_rows = 0;              // wholly blank rows of the range, skipped
    std::vector<std::string> remarks;        // total rows, strata and columns set aside, in words
};

// Reads the long layout. The first row is a header when it holds no number and its count columns
// hold at least one text. Rules, each broken one an error that names the row:
// - at least 3 columns (stratum label, row label, counts), and 2 columns of counts at least;
// - every row with anything in it has a row label, and a stratum label or one above it (texts or numbers; the number
//   5 and the text "5" are different labels), and counts that are numbers of 0 or more (a blank
//   count is 0); wholly blank rows are skipped and counted;
// - a blank stratum label below a stratum's first row means the label above (a stratum named once);
// - a stratum is a run of rows with the same stratum label; the runs may come in any order, but a
//   stratum's rows must be together (a label that comes back after another stratum is an error, not
//   silently joined or split);
// - a row label appears at most once within a stratum;
// - rows whose row label or stratum label names a total ("Total", "All", … as total_lines.hpp knows
//   them), and count columns whose header names one, are set aside and named in `remarks`: a total
//   is not more people.
// At most `max_cells` counts are read (strata × row labels × columns).
LongStrata read_long_strata(const CellGrid& range, std::size_t max_cells = 2'000'000);

// "stratum "Northgate"", for messages.
std::string long_stratum_name(const LongStratum& stratum);

}  // namespace assoc
