#pragma once
// Tables from the C arrays that the reference generators write (e.g. ordered_values.hpp).
#include <cstddef>

#include "assoc/count_table.hpp"
#include "assoc/matrix.hpp"

namespace assoc::test {

template <std::size_t R, std::size_t C>
Matrix matrix_of(const double (&values)[R][C]) {
    Matrix matrix(R, C);
    for (std::size_t r = 0; r < R; ++r)
        for (std::size_t c = 0; c < C; ++c) matrix(r, c) = values[r][c];
    return matrix;
}

template <std::size_t R, std::size_t C>
CountTable table_of(const double (&counts)[R][C]) {
    return CountTable::from_counts(matrix_of(counts));
}

}  // namespace assoc::test
