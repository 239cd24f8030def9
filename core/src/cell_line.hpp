#pragma once
// A range that must be a single row or a single column (labels, weights, scores, group
// counts), read as one sequence of cells.
#include <cstddef>
#include <string>

#include "assoc/cell.hpp"
#include "assoc/error.hpp"

namespace assoc::detail {

class CellLine {
public:
    // `what` names the range in messages, e.g. "row labels".
    CellLine(const CellGrid& grid, const std::string& what) : grid_(&grid) {
        require(!grid.empty(), "the range of " + what + " is empty");
        require(grid.rows() == 1 || grid.columns() == 1,
                "the " + what + " must be a single row or a single column; the range has " + std::to_string(grid.rows()) +
                    " rows and " + std::to_string(grid.columns()) + " columns");
        along_row_ = grid.rows() == 1;
    }
    std::size_t size() const { return along_row_ ? grid_->columns() : grid_->rows(); }
    const Cell& operator[](std::size_t i) const { return along_row_ ? grid_->at(0, i) : grid_->at(i, 0); }

private:
    const CellGrid* grid_;
    bool along_row_ = false;
};

}  // namespace assoc::detail
