#pragma once
// A range that must be a single row or a single column (labels, weights, scores, group
// counts), read as one sequence of cells.
#include <cstddef>
#include <string>

#include "assoc/cell.hpp"
#include "assoc/error.hpp"

namespace assoc::detail {

// Throws Error unless a range of `rows` × `columns` cells is one row or one column.
// `what` names the range in messages, e.g. "row labels".
inline void require_single_line(std::size_t rows, std::size_t columns, const std::string& what) {
    require(rows > 0 && columns > 0, "the range of " + what + " is empty");
    require(rows == 1 || columns == 1, "the " + what + " must be a single row or a single column; the range has " +
                                           std::to_string(rows) + " rows and " + std::to_string(columns) + " columns");
}

class CellLine {
public:
    // `what` names the range in messages, e.g. "row labels".
    CellLine(const CellGrid& grid, const std::string& what) : grid_(&grid) {
        require_single_line(grid.rows(), grid.columns(), what);
        along_row_ = grid.rows() == 1;
    }
    std::size_t size() const { return along_row_ ? grid_->columns() : grid_->rows(); }
    const Cell& operator[](std::size_t i) const { return along_row_ ? grid_->at(0, i) : grid_->at(i, 0); }

private:
    const CellGrid* grid_;
    bool along_row_ = false;
};

}  // namespace assoc::detail
