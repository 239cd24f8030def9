#pragma once
// A range of labels in dictionary form: each distinct value once (a "spelling"), and for each
// cell of the range the index of its spelling. A caller that reads a very large range of records
// (the Calc add-in, with a million labels that repeat a few values) converts each distinct value
// once instead of making a Cell per record; counts_from_records and distinct_levels work from
// the codes at the cost of an array lookup per record.
#include <cstddef>
#include <cstdint>
#include <limits>
#include <vector>

#include "assoc/cell.hpp"

namespace assoc {

// A range this tall is a whole sheet column (A:A), one this wide a whole sheet row (1:1): Calc 7.4's
// sheets have 1,048,576 rows and 16,384 columns (larger sheets, an experimental option, have more).
constexpr std::size_t whole_column_rows = 1'048'576;
constexpr std::size_t whole_row_columns = 16'384;
// Whether a range of `rows` × `columns` cells is a whole sheet column or row.
inline bool is_whole_line(std::size_t rows, std::size_t columns) {
    return (columns == 1 && rows >= whole_column_rows) || (rows == 1 && columns >= whole_row_columns);
}

struct CodedLabels {
    // The code of a blank cell, or of a text of no characters: no label, the record is skipped.
    static constexpr std::uint32_t blank = std::numeric_limits<std::uint32_t>::max();

    std::size_t rows = 0;     // the shape of the range the labels come from (checked by the
    std::size_t columns = 0;  // functions that read them: one row or one column)
    // The range is a whole sheet column or row (A:A, 1:1): its first cell may be a header, which the
    // readers leave out when it is a text found nowhere else in the range (see record_span.hpp).
    bool whole_line = false;
    // Texts and numbers. The same level may be spelled more than once (two copies of one text):
    // the readers merge them, as the levels of levels.hpp say.
    std::vector<Cell> spellings;
    std::vector<std::uint32_t> codes;  // rows × columns, row by row: an index into spellings, or blank
};

// Codes a range of cells; blank cells and texts of no characters (or of spaces only) get
// CodedLabels::blank. Texts that differ in any character get different spellings, so the readers can
// tell which differ only by spaces at their ends. whole_line follows the range's given shape.
CodedLabels code_labels(const CellGrid& range);

}  // namespace assoc
