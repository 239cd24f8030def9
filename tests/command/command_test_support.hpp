#pragma once
// What the command's unit tests share: a selection made of one block of cells, read as the
// extension reads it but with the core's collation (the extension passes the office's).
#include <string>

#include "assoc/cell.hpp"
#include "reading.hpp"

namespace assoc::command::test {

inline SelectionContent block(const CellGrid& cells, std::size_t row = 3, std::size_t column = 0,
                              const std::string& sheet = "HR data") {
    SelectionContent content;
    content.ranges.push_back(RangeRef{sheet, row, column, cells.rows(), cells.columns()});
    content.values.push_back(cells);
    return content;
}

inline Reading read(const SelectionContent& content, ReadAs read_as = ReadAs::automatic) {
    return read_selection(content, unicode_collation(), read_as);
}

}  // namespace assoc::command::test
