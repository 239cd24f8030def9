#include "assoc/matrix.hpp"

namespace assoc {

Matrix Matrix::transposed() const {
    Matrix result(columns_, rows_);
    for (std::size_t r = 0; r < rows_; ++r)
        for (std::size_t c = 0; c < columns_; ++c) result(c, r) = (*this)(r, c);
    return result;
}

}  // namespace assoc
