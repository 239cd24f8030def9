// Counting raw records into a table: levels, weights, blanks, feedback and every error path.
#include <gtest/gtest.h>

#include <map>
#include <random>
#include <string>
#include <utility>

#include "assoc/counts_from_records.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;

namespace {

CellGrid column_of_texts(const std::vector<std::string>& values) {
    CellGrid cells(values.size(), 1);
    for (std::size_t i = 0; i < values.size(); ++i)
        cells.at(i, 0) = values[i].empty() ? Cell::blank() : Cell::text(values[i]);
    return cells;
}

std::string text_of(const Cell& cell) { return cell.as_text(); }

}  // namespace

TEST(CountsFromRecords, CountsEachPairOfLabelsIntoItsCell) {
    const RecordCounts counts = counts_from_records(grid({{"Sales"}, {"Legal"}, {"Sales"}, {"Sales"}}),
                                                    grid({{"yes"}, {"no"}, {"no"}, {"yes"}}));
    EXPECT_EQ(counts.row_levels, (std::vector<Cell>{Cell::text("Legal"), Cell::text("Sales")}));
    EXPECT_EQ(counts.column_levels, (std::vector<Cell>{Cell::text("no"), Cell::text("yes")}));
    EXPECT_EQ(counts.counts.values(), (std::vector<double>{1, 0, 1, 2}));
    EXPECT_EQ(counts.total, 4);
    EXPECT_EQ(counts.records, 4u);
}

// Independent check: the same random records counted with a plain std::map of label pairs.
TEST(CountsFromRecords, AgreesWithANaiveMapCountOfRandomRecords) {
    std::mt19937 generator(20240611);
    std::uniform_int_distribution<int> department(0, 6), grade(0, 3), blank(0, 49);
    const std::vector<std::string> departments = {"Sales", "Legal", "Audit", "IT", "HR", "Ops", "sales"};
    std::vector<std::string> rows, columns;
    std::map<std::pair<std::string, std::string>, double> naive;
    for (int i = 0; i < 20000; ++i) {
        std::string row = departments[department(generator)];
        std::string column = "G" + std::to_string(grade(generator));
        if (blank(generator) == 0) row.clear();
        rows.push_back(row);
        columns.push_back(column);
        if (!row.empty()) naive[{row, column}] += 1;
    }
    const RecordCounts counts = counts_from_records(column_of_texts(rows), column_of_texts(columns));
    double cells_checked = 0;
    for (std::size_t r = 0; r < counts.row_levels.size(); ++r)
        for (std::size_t c = 0; c < counts.column_levels.size(); ++c) {
            const auto key = std::make_pair(text_of(counts.row_levels[r]), text_of(counts.column_levels[c]));
            const auto found = naive.find(key);
            EXPECT_EQ(counts.counts(r, c), found == naive.end() ? 0.0 : found->second) << key.first << "/" << key.second;
            cells_checked += found == naive.end() ? 0 : 1;
        }
    EXPECT_EQ(cells_checked, static_cast<double>(naive.size()));  // every naive cell has its place
    double naive_total = 0;
    for (const auto& cell : naive) naive_total += cell.second;
    EXPECT_EQ(counts.total, naive_total);
    EXPECT_EQ(counts.skipped_blank, 20000u - static_cast<std::size_t>(naive_total));
}

TEST(CountsFromRecords, ListsLevelsInTheOrderOfFirstAppearanceWhenAsked) {
    const RecordCounts counts = counts_from_records(grid({{"b", "a", "b"}}), grid({{2, 1, 3}}), CellGrid(),
                                                    LevelOrder::first_seen);
    EXPECT_EQ(counts.row_levels, (std::vector<Cell>{Cell::text("b"), Cell::text("a")}));
    EXPECT_EQ(counts.column_levels, (std::vector<Cell>{Cell::number(2), Cell::number(1), Cell::number(3)}));
    EXPECT_EQ(counts.counts.values(), (std::vector<double>{1, 0, 1, 0, 1, 0}));
}

TEST(CountsFromRecords, AcceptsARowOfLabelsBesideAColumnOfLabels) {
    const RecordCounts counts = counts_from_records(grid({{"x", "y", "x"}}), grid({{1}, {1}, {2}}));
    EXPECT_EQ(counts.counts.values(), (std::vector<double>{1, 1, 1, 0}));
}

TEST(CountsFromRecords, AddsWeightsInsteadOfCountingRecords) {
    const RecordCounts counts =
        counts_from_records(grid({{"x"}, {"x"}, {"y"}}), grid({{"a"}, {"a"}, {"b"}}), grid({{1.5}, {2}, {0}}));
    EXPECT_EQ(counts.counts.values(), (std::vector<double>{3.5, 0, 0, 0}));
    EXPECT_TRUE(counts.weighted);
    EXPECT_FALSE(counts.whole_counts);
    EXPECT_EQ(counts.zero_weight, 1u);
}

TEST(CountsFromRecords, SkipsRecordsWithABlankLabelAndCountsThem) {
    const RecordCounts counts =
        counts_from_records(grid({{"x"}, {nullptr}, {"y"}, {"x"}}), grid({{"a"}, {"b"}, {nullptr}, {"b"}}));
    EXPECT_EQ(counts.skipped_blank, 2u);
    EXPECT_EQ(counts.total, 2);
}

TEST(CountsFromRecords, DoesNotReadTheWeightOfASkippedRecord) {
    const RecordCounts counts =
        counts_from_records(grid({{"x"}, {nullptr}}), grid({{"a"}, {"b"}}), grid({{2}, {"n/a"}}));
    EXPECT_EQ(counts.total, 2);
}

TEST(CountsFromRecords, SaysInItsFeedbackWhatWasCountedAndSkipped) {
    const RecordCounts counts =
        counts_from_records(grid({{"x"}, {nullptr}, {"y"}, {"x"}}), grid({{"a"}, {"b"}, {nullptr}, {"b"}}));
    EXPECT_EQ(counts.feedback(),
              "Counted 2 of 4 records into 2 row levels and 2 column levels. 2 records have a blank label and were "
              "skipped.");
}

// The table lines up with distinct_levels of each range: "y" is a level although its only record
// was skipped, and its row holds zeros.
TEST(CountsFromRecords, KeepsALabelWhoseRecordsWereAllSkippedAsARowOfZeros) {
    const RecordCounts counts =
        counts_from_records(grid({{"x"}, {nullptr}, {"y"}, {"x"}}), grid({{"a"}, {"b"}, {nullptr}, {"b"}}));
    EXPECT_EQ(counts.row_levels, (std::vector<Cell>{Cell::text("x"), Cell::text("y")}));
    EXPECT_EQ(counts.row_levels, distinct_levels(grid({{"x"}, {nullptr}, {"y"}, {"x"}})));
    EXPECT_EQ(counts.counts.values(), (std::vector<double>{1, 1, 0, 0}));
}

// The add-in hands over coded labels in which one text may have two spellings (two copies of the
// same string); they are one level.
TEST(CountsFromRecords, MergesTwoSpellingsOfOneLabelInCodedLabels) {
    CodedLabels rows;
    rows.rows = 4;
    rows.columns = 1;
    rows.spellings = {Cell::text("Sales"), Cell::text("Legal"), Cell::text("Sales")};
    rows.codes = {0, 1, 2, CodedLabels::blank};
    const RecordCounts counts = counts_from_records(rows, code_labels(grid({{"yes", "no", "yes", "no"}})));
    EXPECT_EQ(counts.row_levels, (std::vector<Cell>{Cell::text("Legal"), Cell::text("Sales")}));
    EXPECT_EQ(counts.counts.values(), (std::vector<double>{1, 0, 0, 2}));
    EXPECT_EQ(counts.skipped_blank, 1u);
}

TEST(CountsFromRecords, GivesTheSameTableFromCodedLabelsAsFromCells) {
    std::mt19937 generator(20261202);
    std::uniform_int_distribution<int> pick(0, 9);
    CellGrid rows(500, 1), columns(1, 500);
    for (std::size_t i = 0; i < 500; ++i) {
        const int r = pick(generator), c = pick(generator);
        rows.at(i, 0) = r == 0 ? Cell::blank() : r < 5 ? Cell::number(r) : Cell::text("R" + std::to_string(r));
        columns.at(0, i) = c == 0 ? Cell::text("") : Cell::text("C" + std::to_string(c % 4));
    }
    for (LevelOrder order : {LevelOrder::sorted, LevelOrder::first_seen}) {
        const RecordCounts from_cells = counts_from_records(rows, columns, CellGrid(), order);
        const RecordCounts from_codes = counts_from_records(code_labels(rows), code_labels(columns), CellGrid(), order);
        EXPECT_EQ(from_codes.row_levels, from_cells.row_levels);
        EXPECT_EQ(from_codes.column_levels, from_cells.column_levels);
        EXPECT_EQ(from_codes.counts.values(), from_cells.counts.values());
        EXPECT_EQ(from_codes.feedback(), from_cells.feedback());
    }
}

TEST(CountsFromRecords, RejectsCodedLabelsWhoseCodesDoNotFitTheirSpellings) {
    CodedLabels rows;
    rows.rows = 2;
    rows.columns = 1;
    rows.spellings = {Cell::text("Sales")};
    rows.codes = {0, 7};
    expect_error([&] { counts_from_records(rows, code_labels(grid({{"a", "b"}}))); },
                 "the labels are not coded consistently");
}

TEST(CountsFromRecords, PointsOutLabelsThatDifferOnlyInCapitals) {
    const RecordCounts counts = counts_from_records(grid({{"Sales", "sales", "Legal"}}), grid({{1, 2, 1}}));
    EXPECT_EQ(counts.feedback(), "Counted 3 records into 3 row levels and 2 column levels. The row labels \"Sales\" "
                                 "and \"sales\" differ only in capitals and are counted apart.");
}

TEST(CountsFromRecords, PointsOutATextThatReadsLikeANumberLabel) {
    const RecordCounts counts = counts_from_records(grid({{"a", "b", "c"}}), grid({{5, "5", 6}}));
    ASSERT_EQ(counts.remarks.size(), 1u);
    EXPECT_EQ(counts.remarks[0], "The column labels hold both the number 5 and the text \"5\"; they are counted apart.");
}

TEST(CountsFromRecords, GivesALabelledCountTableForTheTests) {
    const RecordCounts counts = counts_from_records(grid({{"x", "y", "x", "y"}}), grid({{1, 2, 2, 2}}));
    const CountTable table = counts.table();
    EXPECT_EQ(table.row_labels(), (std::vector<std::string>{"x", "y"}));
    EXPECT_EQ(table.column_labels(), (std::vector<std::string>{"1", "2"}));
    EXPECT_EQ(table.count(1, 1), 2);
}

TEST(CountsFromRecords, RejectsLabelRangesOfDifferentLengths) {
    expect_error([] { counts_from_records(grid({{"x"}, {"y"}, {"x"}}), grid({{"a"}, {"b"}})); },
                 "the row labels (3 cells) and the column labels (2 cells) must be equally long: one pair of labels "
                 "per record");
}

TEST(CountsFromRecords, RejectsWeightsOfAnotherLength) {
    expect_error([] { counts_from_records(grid({{"x"}, {"y"}}), grid({{"a"}, {"b"}}), grid({{1}})); },
                 "the weights (1 cell) must be as long as the labels (2 cells)");
}

TEST(CountsFromRecords, RejectsANegativeWeightNamingItsRow) {
    expect_error([] { counts_from_records(grid({{"x"}, {"y"}}), grid({{"a"}, {"b"}}), grid({{1}, {-2}})); },
                 "the weight in row 2 is -2; a weight says how many people or items a record stands for, so it "
                 "cannot be negative (leave out a record that undoes another, such as a credit note, or net the two)");
}

TEST(CountsFromRecords, RejectsATextWeightBelowTheFirstRow) {
    expect_error([] { counts_from_records(grid({{"x"}, {"y"}}), grid({{"a"}, {"b"}}), grid({{1}, {"one"}})); },
                 "the weight in row 2 holds the text \"one\"; weights must be numbers of 0 or more");
}

TEST(CountsFromRecords, SkipsARecordWithABlankWeightAndSaysWhich) {
    const RecordCounts counts =
        counts_from_records(grid({{"x"}, {"y"}, {"x"}}), grid({{"a"}, {"b"}, {"b"}}), grid({{1}, {nullptr}, {2}}));
    EXPECT_EQ(counts.counts.values(), (std::vector<double>{1, 2, 0, 0}));
    EXPECT_EQ(counts.skipped_weight, 1u);
    EXPECT_NE(counts.feedback().find("Counted 2 of 3 records into 2 row levels and 2 column levels. 1 record has a "
                                     "blank weight (row 2 of the ranges) and was skipped; give a weight of 0 to leave "
                                     "a record out on purpose."),
              std::string::npos)
        << counts.feedback();
}

TEST(CountsFromRecords, RejectsATwoDimensionalRangeOfLabels) {
    expect_error([] { counts_from_records(grid({{"x", "y"}, {"x", "y"}}), grid({{"a", "b", "c", "d"}})); },
                 "the row labels must be a single row or a single column; the range has 2 rows and 2 columns");
}

TEST(CountsFromRecords, RejectsRecordsThatAreAllBlank) {
    expect_error([] { counts_from_records(CellGrid(2, 1), grid({{"a"}, {"b"}})); },
                 "every record has a blank label, so there is nothing to count");
}

TEST(CountsFromRecords, RejectsATableLargerThanTheCellLimit) {
    expect_error(
        [] {
            counts_from_records(grid({{"a", "b", "c"}}), grid({{1, 2, 3}}), CellGrid(), LevelOrder::sorted,
                                unicode_collation(), 8);
        },
        "the labels give 3 row levels and 3 column levels, a table of 9 cells; Assoc builds tables of at most 8 cells");
}

TEST(CountsFromRecords, CountsFurtherLabelsThatDifferOnlyInCapitalsWithoutNamingThem) {
    const RecordCounts counts = counts_from_records(grid({{"Sales", "sales", "SALES", "Legal", "legal", "Sales"}}),
                                                    grid({{1, 2, 1, 2, 1, 2}}));
    ASSERT_EQ(counts.remarks.size(), 1u);
    EXPECT_EQ(counts.remarks[0], "The row labels \"Sales\" and \"sales\" differ only in capitals and are counted "
                                 "apart; so are 2 other labels that differ from another only in capitals.");
}

// Invented: employee numbers selected instead of the department column.
TEST(CountsFromRecords, RefusesALabelOfItsOwnForEveryRecord) {
    expect_error([] {
        counts_from_records(grid({{"E101"}, {"E102"}, {"E103"}, {"E104"}, {"E105"}}),
                            grid({{"Yes"}, {"No"}, {"Yes"}, {"No"}, {"No"}}));
    },
                 "every record has a row label of its own (\"E101\", \"E102\", …), as IDs, names or dates do, so "
                 "each row would be a group of one and the test would say nothing about any group; count by a column "
                 "that records share, such as a department or an outcome");
}

TEST(CountsFromRecords, KeepsFewRecordsAndWeightedRecordsWithLabelsOfTheirOwn) {
    EXPECT_NO_THROW(counts_from_records(grid({{"A"}, {"B"}, {"C"}, {"D"}}), grid({{"Yes"}, {"No"}, {"Yes"}, {"No"}})));
    // Weighted records each stand for many people: one record per department and outcome is a table.
    EXPECT_NO_THROW(counts_from_records(grid({{"Sales"}, {"Legal"}, {"IT"}, {"HR"}, {"Ops"}}),
                                        grid({{"Yes"}, {"No"}, {"Yes"}, {"No"}, {"Yes"}}),
                                        grid({{12}, {30}, {8}, {15}, {22}})));
}
