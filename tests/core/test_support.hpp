#pragma once
// Small helpers shared by the core tests: building grids and checking error messages.
#include <gtest/gtest.h>

#include <cmath>
#include <initializer_list>
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/count_table.hpp"
#include "assoc/error.hpp"
#include "assoc/matrix.hpp"

namespace assoc::test {

// One cell written the short way: a number, a text, or nullptr for a blank.
struct CellLiteral {
    Cell cell;
    CellLiteral(double value) : cell(Cell::number(value)) {}
    CellLiteral(int value) : cell(Cell::number(value)) {}
    CellLiteral(const char* value) : cell(value[0] == '\0' ? Cell::blank() : Cell::text(value)) {}
    CellLiteral(std::nullptr_t) {}
};

inline CellGrid grid(std::initializer_list<std::initializer_list<CellLiteral>> rows) {
    std::vector<std::vector<Cell>> cells;
    for (const auto& row : rows) {
        cells.emplace_back();
        for (const auto& literal : row) cells.back().push_back(literal.cell);
    }
    return CellGrid::from_rows(cells);
}

inline CountTable table(std::initializer_list<std::initializer_list<CellLiteral>> rows) {
    return read_count_table(grid(rows));
}

// Runs `action` and checks that it throws assoc::Error with exactly `message`.
template <class Action>
void expect_error(Action action, const std::string& message) {
    try {
        action();
        ADD_FAILURE() << "expected the error: " << message;
    } catch (const Error& error) {
        EXPECT_EQ(std::string(error.what()), message);
    } catch (...) {
        ADD_FAILURE() << "a different exception than assoc::Error was thrown";
    }
}

// |actual − expected| ≤ tolerance · |expected|.
inline ::testing::AssertionResult near_relative(double actual, double expected, double tolerance) {
    const double error = std::fabs(actual - expected);
    if (error <= tolerance * std::fabs(expected)) return ::testing::AssertionSuccess();
    return ::testing::AssertionFailure() << "actual " << actual << " differs from expected " << expected
                                         << " by " << error / std::fabs(expected) << " relative (tolerance "
                                         << tolerance << ")";
}

// A table straight from counts given row by row (no labels), as CountTable::from_counts reads them.
inline CountTable counts_table(std::size_t rows, std::size_t columns, const std::vector<double>& counts,
                               const ReadOptions& options = {}) {
    Matrix matrix(rows, columns);
    for (std::size_t r = 0; r < rows; ++r)
        for (std::size_t c = 0; c < columns; ++c) matrix(r, c) = counts.at(r * columns + c);
    return CountTable::from_counts(matrix, options);
}

inline CountTable counts_table(std::initializer_list<std::initializer_list<double>> rows) {
    std::vector<double> counts;
    for (const auto& row : rows) counts.insert(counts.end(), row.begin(), row.end());
    return counts_table(rows.size(), rows.begin()->size(), counts);
}

// Every element of `actual` (row by row) within `tolerance` relative of `expected`; an expected
// 0 must come out exactly 0.
inline ::testing::AssertionResult matrix_near_relative(const Matrix& actual, const std::vector<double>& expected,
                                                       double tolerance) {
    if (actual.size() != expected.size())
        return ::testing::AssertionFailure() << "the matrix has " << actual.size() << " elements, expected "
                                             << expected.size();
    for (std::size_t i = 0; i < expected.size(); ++i) {
        const ::testing::AssertionResult element = near_relative(actual.values()[i], expected[i], tolerance);
        if (!element) return ::testing::AssertionFailure() << "element " << i << ": " << element.message();
    }
    return ::testing::AssertionSuccess();
}

// The largest relative error of `actual` against `expected` (for reporting accuracy figures).
inline double relative_error(double actual, double expected) {
    return expected == 0 ? std::fabs(actual) : std::fabs(actual - expected) / std::fabs(expected);
}

}  // namespace assoc::test

#define EXPECT_NEAR_REL(actual, expected, tolerance) \
    EXPECT_TRUE(::assoc::test::near_relative((actual), (expected), (tolerance)))
#define EXPECT_MATRIX_NEAR_REL(actual, expected, tolerance) \
    EXPECT_TRUE(::assoc::test::matrix_near_relative((actual), (expected), (tolerance)))
