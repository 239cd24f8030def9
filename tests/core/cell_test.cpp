// Cells as the core sees them, and how they are named in messages.
#include <gtest/gtest.h>

#include <cmath>

#include "assoc/cell.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;

TEST(Cell, DescribesABlank) { EXPECT_EQ(Cell::blank().describe(), "a blank"); }

TEST(Cell, DescribesATextInQuotes) { EXPECT_EQ(Cell::text("n/a").describe(), "the text \"n/a\""); }

TEST(Cell, DescribesANumberWithoutSpuriousDigits) {
    EXPECT_EQ(Cell::number(-4).describe(), "the number -4");
    EXPECT_EQ(Cell::number(0.1).describe(), "the number 0.1");
    EXPECT_EQ(Cell::number(1234567.5).describe(), "the number 1234567.5");
}

TEST(Cell, DescribesNonFiniteNumbersInWords) {
    EXPECT_EQ(Cell::number(std::nan("")).describe(), "a value that is not a number");
    EXPECT_EQ(Cell::number(-HUGE_VAL).describe(), "an infinite value");
}

TEST(Cell, ComparesByKindAndValue) {
    EXPECT_EQ(Cell::number(2), Cell::number(2));
    EXPECT_NE(Cell::number(2), Cell::text("2"));
    EXPECT_NE(Cell::blank(), Cell::number(0));
}

TEST(CellGrid, BuildsFromRowsOfEqualLength) {
    const CellGrid grid = CellGrid::from_rows({{Cell::number(1), Cell::text("a")}, {Cell::blank(), Cell::number(2)}});
    EXPECT_EQ(grid.rows(), 2u);
    EXPECT_EQ(grid.columns(), 2u);
    EXPECT_EQ(grid.at(0, 1), Cell::text("a"));
    EXPECT_TRUE(grid.at(1, 0).is_blank());
}

TEST(CellGrid, RejectsRaggedRows) {
    expect_error([] { CellGrid::from_rows({{Cell::number(1), Cell::number(2)}, {Cell::number(3)}}); },
                 "the rows of the range have different lengths");
}
