#pragma once
// Which cells of the ranges of records are records: ranges drawn generously, or whole sheet columns
// (A:A) that grow with the data, end in blank cells that are no records, and a whole column starts
// with its header. Both are left out, with words for the feedback.
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/coded_labels.hpp"

namespace assoc::detail {

struct RecordSpan {
    std::size_t first = 0;  // the first record: after the blanks and the header that come before it
    bool header = false;    // whether a header was left out (the cell before `first`)
    std::size_t end = 0;    // one past the last position that holds anything in any range
    std::vector<std::string> remarks;
};

// The records of one call: `labels` are the label ranges (equally long); `first_weight` is the first
// cell of the weights (nullptr without weights) and `weights_end` one past their last non-blank cell.
// - Positions after the last one that holds a label or a weight in any range are no records: they
//   are neither counted nor mentioned.
// - Positions blank in every range before the first label are no records (nor mentioned).
// - A title above the header (a text in some ranges only, or one followed by blank positions) above a
//   header-like position is refused, saying which position to start from.
// - The first position is a header, left out and named in a remark, when the first cell of a whole
//   sheet column (or row) of labels is a text that appears nowhere else in that range (its spaces at
//   the ends aside), or when the first weight is a text and the first labels are texts or blank.
//   Row 1 of a whole column that holds a real record with a label found nowhere else would be taken
//   for a header: the remark says so, and a range without the whole column (A1:A500) avoids it.
RecordSpan record_span(const std::vector<const CodedLabels*>& labels, const Cell* first_weight = nullptr,
                       std::size_t weights_end = 0);

// "row 7" or "column 7" of ranges shaped like `labels` (0-based position `i`): how messages name a record.
std::string record_place(const CodedLabels& labels, std::size_t i);

}  // namespace assoc::detail
