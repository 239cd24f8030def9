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

struct CodedLabels {
    // The code of a blank cell, or of a text of no characters: no label, the record is skipped.
    static constexpr std::uint32_t blank = std::numeric_limits<std::uint32_t>::max();

    std::size_t rows = 0;     // the shape of the range the labels come from (checked by the
    std::size_t columns = 0;  // functions that read them: one row or one column)
    // Texts and numbers. The same level may be spelled more than once (two copies of one text):
    // the readers merge them, as the levels of levels.hpp say.
    std::vector<Cell> spellings;
    std::vector<std::uint32_t> codes;  // rows × columns, row by row: an index into spellings, or blank
};

// Codes a range of cells; blank cells and texts of no characters get CodedLabels::blank.
CodedLabels code_labels(const CellGrid& range);

}  // namespace assoc
