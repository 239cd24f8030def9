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

}  // namespace assoc::test

#define EXPECT_NEAR_REL(actual, expected, tolerance) \
    EXPECT_TRUE(::assoc::test::near_relative((actual), (expected), (tolerance)))
