// Distinct labels and their order: what counts as one level, and how levels are listed.
#include <gtest/gtest.h>

#include <cmath>
#include <limits>

#include "assoc/levels.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;

namespace {
std::vector<Cell> texts(std::initializer_list<const char*> values) {
    std::vector<Cell> cells;
    for (const char* value : values) cells.push_back(Cell::text(value));
    return cells;
}
}  // namespace

TEST(Levels, ListsNumbersAscendingBeforeTextsSortedWithoutRegardToCase) {  // order of texts: text_collation_test
    const auto levels = distinct_levels(grid({{"East"}, {10}, {"north"}, {2}, {"west"}, {"East"}, {2}}));
    EXPECT_EQ(levels, (std::vector<Cell>{Cell::number(2), Cell::number(10), Cell::text("East"), Cell::text("north"),
                                         Cell::text("west")}));
}

TEST(Levels, ListsLevelsInTheOrderTheyFirstAppearWhenAsked) {
    const auto levels = distinct_levels(grid({{"north", "East", "north", "west", "East"}}), LevelOrder::first_seen);
    EXPECT_EQ(levels, texts({"north", "East", "west"}));
}

TEST(Levels, CountsTextsThatDifferOnlyInCapitalsAsDifferentLevels) {
    const auto levels = distinct_levels(grid({{"SALES"}, {"Sales"}, {"sales"}, {"SALES"}}));
    // Same letters: lower case first (the Unicode Collation Algorithm's tertiary level; text_collation_test).
    EXPECT_EQ(levels, texts({"sales", "Sales", "SALES"}));
}

TEST(Levels, CountsTheNumberFiveAndTheTextFiveAsDifferentLevels) {
    const auto levels = distinct_levels(grid({{5}, {"5"}, {5.0}}));
    EXPECT_EQ(levels, (std::vector<Cell>{Cell::number(5), Cell::text("5")}));
}

TEST(Levels, SkipsBlanksAndEmptyTexts) {
    CellGrid labels(4, 1);
    labels.at(0, 0) = Cell::text("Legal");
    labels.at(2, 0) = Cell::text("");  // what a formula like ="" leaves
    labels.at(3, 0) = Cell::text("Audit");
    EXPECT_EQ(distinct_levels(labels), texts({"Audit", "Legal"}));
}

TEST(Levels, TreatsMinusZeroAndZeroAsOneLevelShownAsZero) {
    const auto levels = distinct_levels(grid({{-0.0}, {0.0}}));
    ASSERT_EQ(levels.size(), 1u);
    EXPECT_FALSE(std::signbit(levels[0].as_number()));
}

TEST(Levels, WritesNumberLevelsAsPlainText) {
    EXPECT_EQ(level_text(Cell::number(3)), "3");
    EXPECT_EQ(level_text(Cell::number(0.25)), "0.25");
    EXPECT_EQ(level_text(Cell::number(-0.0)), "0");
    EXPECT_EQ(level_text(Cell::text("Sales")), "Sales");
}

TEST(Levels, ReadsTheOrderWordInAnyCaseAndDefaultsToSorted) {
    EXPECT_EQ(parse_level_order(""), LevelOrder::sorted);
    EXPECT_EQ(parse_level_order("Sorted"), LevelOrder::sorted);
    EXPECT_EQ(parse_level_order("FIRST"), LevelOrder::first_seen);
}

TEST(Levels, RejectsAnUnknownOrderWord) {
    expect_error([] { parse_level_order("alphabetic"); }, "the order must be \"sorted\" or \"first\", not \"alphabetic\"");
}

TEST(Levels, RejectsARangeOfMoreThanOneRowAndColumn) {
    expect_error([] { distinct_levels(grid({{"a", "b"}, {"c", "d"}})); },
                 "the labels must be a single row or a single column; the range has 2 rows and 2 columns");
}

TEST(Levels, RejectsARangeOfOnlyBlanks) {
    expect_error([] { distinct_levels(CellGrid(3, 1)); }, "the labels are all blank");
}

TEST(Levels, RejectsANonFiniteNumberAsALabel) {
    expect_error([] { distinct_levels(grid({{"a"}, {std::numeric_limits<double>::infinity()}})); },
                 "label 2 of 2 in the labels holds an infinite value; labels must be texts or ordinary numbers");
}

TEST(Levels, MergesTwoSpellingsOfOneLabelInCodedLabels) {
    CodedLabels coded;
    coded.rows = 1;
    coded.columns = 3;
    coded.spellings = {Cell::text("east"), Cell::text("east"), Cell::number(2)};
    coded.codes = {1, 2, 0};
    EXPECT_EQ(distinct_levels(coded, LevelOrder::first_seen), (std::vector<Cell>{Cell::text("east"), Cell::number(2)}));
}
