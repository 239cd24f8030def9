#pragma once
// Names of the rows of a table's body for results and messages: the row's label, or "row k" when
// the range has no label for it (k its 1-based row in the range as selected, a header row being row
// 1, as every message counts rows); and the labels of a side's categories.
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/count_table.hpp"

namespace assoc::detail {

// One name per row of the body (kept and set-aside rows alike), in the order of the range.
inline std::vector<std::string> body_row_names(const CountTable& table) {
    std::vector<std::string> names(table.body_rows());
    for (std::size_t r = 0; r < names.size(); ++r) {
        names[r] = table.body_row_labels()[r];
        if (names[r].empty()) names[r] = "row " + std::to_string(table.range_row(r));
    }
    return names;
}

// The labels of the categories on one side (rows or columns; totals left out, lines of zeros kept),
// in the order of the range: "" where the range has none.
inline std::vector<std::string> category_labels(const CountTable& table, bool rows) {
    std::vector<std::string> labels;
    for (std::size_t i : rows ? table.category_rows() : table.category_columns())
        labels.push_back((rows ? table.body_row_labels() : table.body_column_labels())[i]);
    return labels;
}

// "row 3" or "row 3 (Legal)": a row named in a message by its row in the range and its name from
// body_row_names.
inline std::string row_reference(const CountTable& table, std::size_t body_row, const std::string& name) {
    const std::string place = "row " + std::to_string(table.range_row(body_row));
    return name == place ? place : place + " (" + name + ")";
}

}  // namespace assoc::detail
