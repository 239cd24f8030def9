#pragma once
// A count table built from raw records: one pair of labels per record (e.g. each employee's
// department and whether they were promoted), optionally weighted.
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/coded_labels.hpp"
#include "assoc/count_table.hpp"
#include "assoc/levels.hpp"
#include "assoc/matrix.hpp"
#include "assoc/text_collation.hpp"

namespace assoc {

struct RecordCounts {
    std::vector<Cell> row_levels;     // the label of each row of counts (a number or a text)
    std::vector<Cell> column_levels;  // the label of each column of counts
    Matrix counts;                    // row_levels.size() × column_levels.size(): records, or sums of weights
    double total = 0.0;               // sum of all counts

    // Records in the ranges: their cells, without a header in the first cell and without the blank
    // cells after the last record (see record_span.hpp).
    std::size_t records = 0;
    bool header_left_out = false;   // the first cell of the ranges was read as a header (record_span.hpp)
    std::size_t skipped_blank = 0;  // records left out because a label is blank
    // Records left out because their weight is blank, and their rows (columns) in the ranges, 1-based.
    std::size_t skipped_weight = 0;
    std::vector<std::size_t> blank_weight_places;
    std::size_t zero_weight = 0;    // counted records whose weight is 0
    bool weighted = false;          // whether weights were given
    bool along_row = false;         // the records run along a row (their places are columns)
    bool whole_counts = true;       // whether every count is a whole number
    // Sentences about labels that look alike but are counted apart ("Sales" and "sales").
    std::vector<std::string> remarks;

    // What was counted and what was left out, in plain sentences.
    std::string feedback() const;

    // The counts as a CountTable labelled with the levels (numbers written as text), ready for
    // the tests of association; `options` as for read_count_table.
    CountTable table(const ReadOptions& options = {}) const;
};

// Counts records into a table. `row_labels` and `column_labels` are equally long single rows or
// columns (they need not have the same orientation); `weights`, when not empty, is a single row
// or column as long as they were given (it may have lost its trailing blanks: CellGrid::given_rows)
// with numbers of 0 or more. A record whose row or column label is blank is skipped (and counted in
// skipped_blank); its weight is not read, but its other label is still a level, so the table has a
// row and a column for every label of the two ranges, as distinct_levels lists them (a label whose
// records were all skipped gets zeros). A record whose weight is blank is skipped too (counted in
// skipped_weight; the feedback names its rows); a negative weight, or one that is not a number, is an
// Error naming its row. Trailing blank positions and a header in the first cell are no records (see
// record_span.hpp). Levels are identified as described in levels.hpp and listed in `order` (texts in
// the order of `collation` when sorted, as distinct_levels lists them; a listed order orders the side
// whose labels it lists, and the other side is sorted). Throws Error when the table would have more
// than `max_cells` cells.
//
// Cost: one array lookup per label and record, plus one hash lookup per distinct spelling:
// independent of the number of levels.
RecordCounts counts_from_records(const CodedLabels& row_labels, const CodedLabels& column_labels,
                                 const CellGrid& weights = CellGrid(), const LevelOrdering& order = LevelOrder::sorted,
                                 const TextCollation& collation = unicode_collation(),
                                 std::size_t max_cells = 1'000'000);

// The same, from ranges of cells (coded first with code_labels: one hash lookup per label).
RecordCounts counts_from_records(const CellGrid& row_labels, const CellGrid& column_labels,
                                 const CellGrid& weights = CellGrid(), const LevelOrdering& order = LevelOrder::sorted,
                                 const TextCollation& collation = unicode_collation(),
                                 std::size_t max_cells = 1'000'000);

}  // namespace assoc
