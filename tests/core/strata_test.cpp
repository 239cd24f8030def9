// Reading strata: the two layouts, labels, and the shapes that are rejected rather than reshaped.
#include <gtest/gtest.h>

#include "assoc/strata.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;

TEST(ReadStrata, ReadsOneRowOfFourCountsPerStratumWithLabels) {
    const Strata strata = read_strata(grid({{"", "a", "b", "c", "d"}, {"North", 1, 2, 3, 4}, {"South", 5, 6, 7, 8}}));
    ASSERT_EQ(strata.tables.size(), 2u);
    EXPECT_EQ(strata.layout, StrataLayout::one_row_each);
    EXPECT_EQ(strata.tables[1].label, "South");
    EXPECT_EQ(strata.tables[1].a, 5);
    EXPECT_EQ(strata.tables[1].d, 8);
}

TEST(ReadStrata, ReadsTwoByTwoTablesStackedInTwoColumns) {
    const Strata strata = read_strata(grid({{1, 2}, {3, 4}, {5, 6}, {7, 8}}));
    ASSERT_EQ(strata.tables.size(), 2u);
    EXPECT_EQ(strata.layout, StrataLayout::stacked_blocks);
    const Stratum& second = strata.tables[1];
    EXPECT_EQ(second.a, 5);
    EXPECT_EQ(second.b, 6);
    EXPECT_EQ(second.c, 7);
    EXPECT_EQ(second.d, 8);
}

TEST(ReadStrata, NamesAStackedTableByTheLabelOfItsFirstRow) {
    const Strata strata = read_strata(grid({{"North", 1, 2}, {nullptr, 3, 4}, {"South", 5, 6}, {nullptr, 7, 8}}));
    EXPECT_EQ(strata.tables[1].label, "South");
    EXPECT_EQ(stratum_name(strata, 1), "stratum 2 (South)");
}

TEST(ReadStrata, KeepsAStratumOfZerosInItsPlace) {
    const Strata strata = read_strata(grid({{1, 2, 3, 4}, {0, 0, 0, 0}, {5, 6, 7, 8}}));
    ASSERT_EQ(strata.tables.size(), 3u);
    EXPECT_EQ(strata.tables[2].a, 5);
    EXPECT_FALSE(strata.tables[1].informative());
}

TEST(ReadStrata, RejectsThreeColumnsOfCounts) {
    expect_error([] { read_strata(grid({{1, 2, 3}, {4, 5, 6}})); },
                 "strata must be given as one row of 4 counts (a, b, c, d) per stratum, or as 2×2 tables stacked in 2 "
                 "columns; this range has 3 columns of counts");
}

TEST(ReadStrata, RejectsAnOddNumberOfStackedRows) {
    expect_error([] { read_strata(grid({{1, 2}, {3, 4}, {5, 6}})); },
                 "stacked 2×2 tables need an even number of rows of counts; this range has 3");
}

TEST(ReadStrata, RejectsASingleStratum) {
    expect_error([] { read_strata(grid({{1, 2, 3, 4}})); },
                 "a stratified test needs at least 2 strata; this range holds 1");
}

TEST(ReadStrata, RejectsTextAmongTheCounts) {
    expect_error([] { read_strata(grid({{1, 2, 3, 4}, {5, 6, "x", 8}})); },
                 "row 2, column 3 holds the text \"x\"; counts must be numbers");
}
