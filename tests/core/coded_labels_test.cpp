// Labels in dictionary form: one spelling per distinct label, a code per cell.
#include <gtest/gtest.h>

#include "assoc/coded_labels.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::grid;

TEST(CodedLabels, ListsEachDistinctLabelOnceInOrderOfFirstAppearance) {
    const CodedLabels coded = code_labels(grid({{"west"}, {3}, {"east"}, {"west"}, {3.0}}));
    EXPECT_EQ(coded.spellings, (std::vector<Cell>{Cell::text("west"), Cell::number(3), Cell::text("east")}));
    EXPECT_EQ(coded.codes, (std::vector<std::uint32_t>{0, 1, 2, 0, 1}));
}

TEST(CodedLabels, GivesBlankCellsAndEmptyTextsTheBlankCode) {
    CellGrid range = grid({{"a", nullptr, "a"}});
    range.at(0, 2) = Cell::text("");
    const CodedLabels coded = code_labels(range);
    EXPECT_EQ(coded.codes, (std::vector<std::uint32_t>{0, CodedLabels::blank, CodedLabels::blank}));
    EXPECT_EQ(coded.spellings.size(), 1u);
}

TEST(CodedLabels, KeepsTheShapeOfTheRangeAndCodesItRowByRow) {
    const CodedLabels coded = code_labels(grid({{"a", "b"}, {"b", "c"}}));
    EXPECT_EQ(coded.rows, 2u);
    EXPECT_EQ(coded.columns, 2u);
    EXPECT_EQ(coded.codes, (std::vector<std::uint32_t>{0, 1, 1, 2}));
}

TEST(CodedLabels, TellsTheNumberFiveFromTheTextFive) {
    const CodedLabels coded = code_labels(grid({{5, "5"}}));
    EXPECT_EQ(coded.codes, (std::vector<std::uint32_t>{0, 1}));
}
