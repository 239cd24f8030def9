#pragma once
// A dense matrix of doubles, stored row by row: counts, expected counts, residuals.
#include <cstddef>
#include <vector>

namespace assoc {

class Matrix {
public:
    Matrix() = default;
    Matrix(std::size_t rows, std::size_t columns, double fill = 0.0)
        : rows_(rows), columns_(columns), values_(rows * columns, fill) {}

    std::size_t rows() const { return rows_; }
    std::size_t columns() const { return columns_; }
    std::size_t size() const { return values_.size(); }
    double& operator()(std::size_t row, std::size_t column) { return values_[row * columns_ + column]; }
    double operator()(std::size_t row, std::size_t column) const { return values_[row * columns_ + column]; }
    const std::vector<double>& values() const { return values_; }

    Matrix transposed() const;

private:
    std::size_t rows_ = 0;
    std::size_t columns_ = 0;
    std::vector<double> values_;
};

}  // namespace assoc
