// Reading r×c strata from the long layout (stratum label, row label, one count per column category).
// The tables are invented.
#include <gtest/gtest.h>

#include "assoc/long_strata.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;

TEST(LongStrata, ReadsAHeaderRowAndTheStrataInTheirOrder) {
    const LongStrata read = read_long_strata(grid({{"Office", "Department", "Low", "High"},
                                                   {"Riverside", "Design", 3, 5},
                                                   {"Riverside", "Assembly", 7, 2},
                                                   {"Northgate", "Assembly", 4, 4},
                                                   {"Northgate", "Design", 1, 6}}));
    ASSERT_EQ(read.strata.size(), 2u);
    EXPECT_EQ(read.strata[0].label, "Riverside");
    EXPECT_EQ(read.strata[1].label, "Northgate");
    EXPECT_EQ(read.row_labels, (std::vector<std::string>{"Design", "Assembly"}));
    EXPECT_EQ(read.column_labels, (std::vector<std::string>{"Low", "High"}));
    // Northgate's rows come in the other order; each lands in its label's row.
    EXPECT_EQ(read.strata[1].counts(0, 1), 6.0);
    EXPECT_EQ(read.strata[1].counts(1, 0), 4.0);
}

TEST(LongStrata, SetsAsideTotalRowsTotalStrataAndTotalColumnsAndSaysSo) {
    const LongStrata read = read_long_strata(grid({{"Office", "Department", "Low", "High", "Total"},
                                                   {"Riverside", "Design", 3, 5, 8},
                                                   {"Riverside", "Assembly", 7, 2, 9},
                                                   {"Riverside", "Total", 10, 7, 17},
                                                   {"Northgate", "Assembly", 4, 4, 8},
                                                   {"Northgate", "Design", 1, 6, 7},
                                                   {"All", "Design", 4, 11, 15}}));
    ASSERT_EQ(read.strata.size(), 2u);
    EXPECT_EQ(read.row_labels, (std::vector<std::string>{"Design", "Assembly"}));
    EXPECT_EQ(read.column_labels, (std::vector<std::string>{"Low", "High"}));
    EXPECT_EQ(read.strata[0].counts.columns(), 2u);
    EXPECT_EQ(read.strata[0].counts(1, 0), 7.0);
    EXPECT_EQ(read.remarks, (std::vector<std::string>{
                                "The column \"Total\" is a total and was set aside.",
                                "Rows 4 and 7 are totals and were set aside (a row or stratum label that names a total)."}));
}

// A stratum named as everyone whose counts are the sums of the other strata's is the company as a
// whole: set aside, and said; named as data ("East") it is a stratum.
TEST(LongStrata, SetsAsideAStratumNamingEveryoneThatHoldsTheSumsOfTheOthers) {
    const auto with_sums_named = [](const char* name) {
        return read_long_strata(grid({{"Office", "Group", "Yes", "No", "Maybe"},
                                      {"North", "Women", 5, 10, 3},
                                      {"North", "Men", 8, 9, 4},
                                      {"South", "Women", 7, 3, 2},
                                      {"South", "Men", 6, 6, 5},
                                      {name, "Women", 12, 13, 5},
                                      {name, "Men", 14, 15, 9}}));
    };
    const LongStrata all_offices = with_sums_named("All offices");
    ASSERT_EQ(all_offices.strata.size(), 2u);
    EXPECT_EQ(all_offices.remarks, (std::vector<std::string>{"The rows of \"All offices\" hold the sums of the other "
                                                             "strata and were set aside as totals."}));
    EXPECT_EQ(with_sums_named("East").strata.size(), 3u);
}

TEST(LongStrata, GivesAStratumWithoutSomeRowLabelARowOfZeros) {
    const LongStrata read = read_long_strata(grid({{"A", "x", 1, 2}, {"A", "y", 3, 4}, {"B", "y", 5, 6}, {"B", "z", 7, 8}}));
    ASSERT_EQ(read.row_labels.size(), 3u);
    EXPECT_EQ(read.strata[1].counts(0, 0), 0.0);
    EXPECT_EQ(read.strata[1].counts(2, 1), 8.0);
    EXPECT_EQ(read.column_labels, (std::vector<std::string>{"", ""}));
    ASSERT_EQ(read.remarks.size(), 1u);
    EXPECT_EQ(read.remarks[0], "Not every stratum has the same row labels: \"x\" (not in \"B\") and \"z\" (not in "
                               "\"A\"). A stratum without a row label counts 0 there; if two labels name the same group, "
                               "give them one label.");
}

TEST(LongStrata, SaysNothingOfRowLabelsWhenEveryStratumHasThemAll) {
    const LongStrata read = read_long_strata(grid({{"A", "x", 1, 2}, {"A", "y", 3, 4}, {"B", "y", 5, 6}, {"B", "x", 7, 8}}));
    EXPECT_TRUE(read.remarks.empty());
}

TEST(LongStrata, ReadsNumbersAsLabelsAndBlankCountsAsZero) {
    const LongStrata read = read_long_strata(grid({{2024, 1, 4, nullptr}, {2024, 2, nullptr, 3}}));
    EXPECT_EQ(read.strata[0].label, "2024");
    EXPECT_EQ(read.row_labels, (std::vector<std::string>{"1", "2"}));
    EXPECT_EQ(read.strata[0].counts(0, 1), 0.0);
}

TEST(LongStrata, SkipsAndCountsWhollyBlankRows) {
    const LongStrata read = read_long_strata(grid({{"A", "x", 1, 2}, {nullptr, nullptr, nullptr, nullptr}, {"A", "y", 3, 4}}));
    EXPECT_EQ(read.empty_rows, 1u);
    EXPECT_EQ(read.strata.size(), 1u);
}

TEST(LongStrata, RefusesAStratumWhoseRowsAreNotTogether) {
    expect_error([] { read_long_strata(grid({{"A", "x", 1, 2}, {"B", "x", 3, 4}, {"A", "y", 5, 6}})); },
                 "the stratum \"A\" comes back at row 3 after rows of another stratum; keep each stratum's rows "
                 "together (sort the range by its first column)");
}

TEST(LongStrata, RefusesARowLabelGivenTwiceInAStratum) {
    expect_error([] { read_long_strata(grid({{"A", "x", 1, 2}, {"A", "x", 3, 4}})); },
                 "the row label \"x\" appears twice in the stratum \"A\" (row 1 and row 2); give each row of a stratum once");
}

// A stratum named on its first row only (or in merged cells), as in the stacked layout: the same strata
// as with the name on every row (an identity).
TEST(LongStrata, ReadsABlankStratumLabelAsTheOneAbove) {
    const LongStrata named_once = read_long_strata(
        grid({{"A", "x", 1, 2}, {nullptr, "y", 3, 4}, {"B", "x", 5, 6}, {nullptr, "y", 7, 8}}));
    const LongStrata named_always =
        read_long_strata(grid({{"A", "x", 1, 2}, {"A", "y", 3, 4}, {"B", "x", 5, 6}, {"B", "y", 7, 8}}));
    ASSERT_EQ(named_once.strata.size(), 2u);
    for (std::size_t k = 0; k < 2; ++k) {
        EXPECT_EQ(named_once.strata[k].label, named_always.strata[k].label);
        EXPECT_EQ(named_once.strata[k].counts.values(), named_always.strata[k].counts.values());
    }
}

TEST(LongStrata, RefusesAFirstRowWithoutAStratumLabel) {
    expect_error([] { read_long_strata(grid({{nullptr, "x", 1, 2}, {"A", "y", 3, 4}})); },
                 "row 1 has no stratum label in column 1, and no stratum starts above it; give the first row of every "
                 "stratum its stratum's label");
}

TEST(LongStrata, RefusesTextAmongTheCounts) {
    expect_error([] { read_long_strata(grid({{"A", "x", 1, 2}, {"A", "y", "n/a", 4}})); },
                 "row 2, column 3 holds the text \"n/a\"; counts must be numbers");
}

TEST(LongStrata, RefusesARangeWithTooFewColumns) {
    expect_error([] { read_long_strata(grid({{"A", "x", 1}, {"A", "y", 3}})); },
                 "the range needs a column of stratum labels, a column of row labels and at least 2 columns of counts "
                 "(one per column category); this range has 3 columns");
}

TEST(LongStrata, RefusesMoreCountCellsThanItReads) {
    expect_error([] { read_long_strata(grid({{"A", "x", 1, 2}, {"B", "y", 3, 4}, {"C", "z", 5, 6}}), 12); },
                 "the strata make 18 count cells (strata × row labels × columns); at most 12 can be read");
}
