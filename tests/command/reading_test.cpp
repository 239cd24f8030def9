// What the command reads from a selection: tables, records, and the selections it refuses (the
// messages are the contract, checked word for word).
#include "reading.hpp"

#include <gtest/gtest.h>

#include "command_test_support.hpp"
#include "test_support.hpp"

namespace assoc::command {
namespace {

using assoc::test::expect_error;
using assoc::test::grid;
using test::block;
using test::read;

const CellGrid promotions = grid({{"Department / Outcome", "Promoted", "Not promoted"},
                                  {"Design", 41, 56},
                                  {"Assembly", 10, 11},
                                  {"Sales", 7, 31}});

TEST(ReadSelection, ReadsALabelledTableWithTheVariablesNamedInItsCorner) {
    const Reading reading = read(block(promotions));
    ASSERT_TRUE(reading.table_source.has_value());
    EXPECT_FALSE(reading.is_records());
    EXPECT_TRUE(reading.table_source->header_row);
    EXPECT_TRUE(reading.table_source->header_column);
    EXPECT_EQ(reading.variables.rows, "Department");
    EXPECT_EQ(reading.variables.columns, "Outcome");
    EXPECT_EQ(reading.row_names, (std::vector<std::string>{"Design", "Assembly", "Sales"}));
    EXPECT_EQ(reading.column_names, (std::vector<std::string>{"Promoted", "Not promoted"}));
    EXPECT_EQ(reading.table.total(), 156);
    EXPECT_EQ(reading.description,
              "a table of counts, 'HR data'.A4:C7: 3 rows × 2 columns with row and column labels");
}

TEST(ReadSelection, NamesTheRowsAndColumnsOfATableWithoutLabelsByNumber) {
    const Reading reading = read(block(grid({{3, 5, 8}, {9, 4, 2}})));
    EXPECT_EQ(reading.row_names, (std::vector<std::string>{"Row 1", "Row 2"}));
    EXPECT_EQ(reading.column_names, (std::vector<std::string>{"Column 1", "Column 2", "Column 3"}));
    EXPECT_TRUE(reading.variables.rows.empty());
}

TEST(ReadSelection, ReadsTwoTextColumnsAsRecordsWithTheirNamesInTheFirstRow) {
    const Reading reading = read(block(grid({{"Region", "Exception"},
                                                       {"North", "No"},
                                                       {"South", "Yes"},
                                                       {"North", "Yes"},
                                                       {"South", "No"},
                                                       {"North", "No"}}),
                                                 0, 1));
    ASSERT_TRUE(reading.is_records());
    const RecordSource& records = *reading.record_source;
    EXPECT_TRUE(records.header_row);
    EXPECT_EQ(records.row_name, "Region");
    EXPECT_EQ(records.column_name, "Exception");
    EXPECT_EQ(range_address(records.row_labels), "B2:B6");
    EXPECT_EQ(range_address(records.column_labels), "C2:C6");
    EXPECT_EQ(records.records, 5u);
    EXPECT_EQ(reading.row_names, (std::vector<std::string>{"North", "South"}));
    EXPECT_EQ(reading.column_names, (std::vector<std::string>{"No", "Yes"}));
    EXPECT_EQ(reading.table.count(0, 0), 2);  // North, No
    EXPECT_EQ(reading.variables.rows, "Region");
}

// The first record's region comes only once while the others repeat: counted alone, the functions
// would take it for a header, so the sheet's formulas get the ranges with their names, which the
// functions leave out themselves.
TEST(ReadSelection, GivesTheFormulasTheNamesRowWhenTheFirstRecordAloneWouldPassForAHeader) {
    const Reading reading = read(block(grid({{"Region", "Exception"},
                                             {"East", "No"},
                                             {"South", "Yes"},
                                             {"North", "Yes"},
                                             {"South", "No"},
                                             {"North", "No"}}),
                                       0, 1));
    const RecordSource& records = *reading.record_source;
    EXPECT_TRUE(records.header_row);
    EXPECT_EQ(range_address(records.row_labels), "B1:B6");
    EXPECT_EQ(range_address(records.column_labels), "C1:C6");
    EXPECT_EQ(records.records, 5u);
    EXPECT_EQ(reading.row_names, (std::vector<std::string>{"East", "North", "South"}));
}

TEST(ReadSelection, ReadsAFirstRowAsARecordWhenItsLabelAppearsAgainBelow) {
    const Reading reading =
        read(block(grid({{"North", "No"}, {"South", "Yes"}, {"North", "Yes"}, {"South", "No"}}), 0, 1));
    ASSERT_TRUE(reading.is_records());
    EXPECT_FALSE(reading.record_source->header_row);
    EXPECT_EQ(reading.record_source->records, 4u);
}

TEST(ReadSelection, ReadsALabelColumnWithRepeatsBesideNumberCodesAsRecords) {
    const Reading reading = read(
        block(grid({{"Department", "Promoted"}, {"Design", 1}, {"Sales", 0}, {"Design", 0}, {"Sales", 1}})));
    ASSERT_TRUE(reading.is_records());
    EXPECT_EQ(reading.column_names, (std::vector<std::string>{"0", "1"}));
}

TEST(ReadSelection, ReadsTwoColumnsSelectedApartFromLeftToRight) {
    SelectionContent content;
    content.ranges = {RangeRef{"Invoices", 0, 4, 4, 1}, RangeRef{"Invoices", 0, 1, 4, 1}};
    content.values = {grid({{"Exception"}, {"Yes"}, {"No"}, {"No"}}), grid({{"Region"}, {"North"}, {"South"}, {"South"}})};
    const Reading reading = read(content);
    ASSERT_TRUE(reading.is_records());
    EXPECT_EQ(reading.record_source->row_name, "Region");
    EXPECT_EQ(range_address(reading.record_source->column_labels), "E2:E4");
}

TEST(ReadSelection, RefusesASingleCell) {
    expect_error([] { read(block(grid({{5}}))); },
                 "Only one cell is selected. Select a table of counts (its labels may be included), or two columns of "
                 "records, and run the command again.");
}

TEST(ReadSelection, RefusesASingleColumnAndSaysHowToSelectRecords) {
    expect_error([] { read(block(grid({{"North"}, {"South"}}))); },
                 "Only one column is selected. Select a table of counts (its labels may be included), or two columns "
                 "of records, and run the command again. (To count records, select their two columns; hold Ctrl to "
                 "select columns that are not side by side.)");
}

TEST(ReadSelection, RefusesASelectionOfThreeParts) {
    SelectionContent content = block(grid({{1, 2}, {3, 4}}));
    content.ranges.push_back(content.ranges[0]);
    content.values.push_back(content.values[0]);
    content.ranges.push_back(content.ranges[0]);
    content.values.push_back(content.values[0]);
    expect_error([&] { read(content); },
                 "The selection has 3 separate parts. Select one block of cells, or two columns of records (hold Ctrl "
                 "to select the second).");
}

TEST(ReadSelection, RefusesOneColumnOfLabelsBesideOneColumnOfCounts) {
    expect_error([] { read(block(grid({{"Design", 41}, {"Assembly", 10}, {"Sales", 7}}))); },
                 "The selection holds one column of labels and one column of numbers, like a list of counts by one "
                 "category. A test of association needs a table with at least two columns of counts, or two columns "
                 "of records. To read the two columns as records anyway, choose \"two columns of records\" as the way "
                 "to read the selection.");
}

CellGrid number_codes(std::size_t rows) {
    CellGrid cells(rows, 2);
    for (std::size_t r = 0; r < rows; ++r) {
        cells.at(r, 0) = Cell::number(static_cast<double>(1 + r % 3));
        cells.at(r, 1) = Cell::number(static_cast<double>(r % 2));
    }
    return cells;
}

TEST(ReadSelection, RefusesTwoLongColumnsOfNumbersAsAmbiguous) {
    expect_error([] { read(block(number_codes(40))); },
                 "The two columns hold only numbers, in 40 rows: that could be a table of counts with 40 rows and 2 "
                 "columns, or records whose labels are number codes. Choose how to read the selection: \"a table of "
                 "counts\" or \"two columns of records\".");
}

TEST(ReadSelection, ReadsTwoLongColumnsOfNumbersAsRecordsWhenAskedTo) {
    const Reading reading = read(block(number_codes(40)), ReadAs::records);
    ASSERT_TRUE(reading.is_records());
    EXPECT_EQ(reading.table.body_rows(), 3u);
    EXPECT_EQ(reading.table.total(), 40);
}

TEST(ReadSelection, ReadsTwoLongColumnsOfNumbersAsATableWhenAskedTo) {
    const Reading reading = read(block(number_codes(40)), ReadAs::table);
    EXPECT_FALSE(reading.is_records());
    EXPECT_EQ(reading.table.body_rows(), 40u);
}

TEST(ReadSelection, ReadsAShortTwoColumnBlockOfNumbersAsATable) {
    const Reading reading = read(block(grid({{12, 30}, {18, 25}, {9, 40}})));
    EXPECT_FALSE(reading.is_records());
    EXPECT_EQ(reading.table.body_rows(), 3u);
}

TEST(ReadSelection, RefusesTextAmongTheCountsWithTheReasonTheFunctionsGive) {
    expect_error([] { read(block(grid({{"", "Yes", "No"}, {"North", 4, "n/a"}, {"South", 2, 7}}), 0, 0)); },
                 "The selection cannot be read as a table of counts: Row 2 (\"North\"), column 3 (\"No\") holds the "
                 "text \"n/a\"; counts must be numbers. Select a table of counts (its labels may be included), or two columns of records, "
                 "and run the command again.");
}

// The functions number rows and columns within the selection; below or beside A1 those are not the
// sheet's, so the message says where they start.
TEST(ReadSelection, SaysWhereTheRowsOfATableAreCountedFromWhenTheSelectionIsNotAtA1) {
    expect_error([] { read(block(grid({{"", "Yes", "No"}, {"North", 4, "n/a"}, {"South", 2, 7}}), 5, 1)); },
                 "The selection cannot be read as a table of counts: Row 2 (\"North\"), column 3 (\"No\") holds the "
                 "text \"n/a\"; counts must be numbers. Rows and columns are counted from the selection's first "
                 "cell, B6. Select a table of counts (its labels may be included), or two columns of records, and run "
                 "the command again.");
}

TEST(ReadSelection, SaysWhereTheRowsOfRecordsAreCountedFromWhenTheyDoNotStartInRow1) {
    // Names on sheet row 10, records on rows 11 to 14, a total line on row 15 (row 5 of the records).
    expect_error([] {
        read(block(grid({{"Region", "Exception"}, {"North", "Yes"}, {"South", "No"}, {"North", "No"},
                         {"South", "Yes"}, {"Total", 4}}),
                   9, 0));
    },
                 "The two columns cannot be counted into a table: The last record, row 5, holds \"Total\", which reads "
                 "as a total line under the records rather than a record: leave it out of the ranges (Assoc counts "
                 "the records itself); if it is a record, move it up among the others. Rows are counted from the "
                 "first row read, sheet row 11. Select a table of counts (its labels may be included), or two "
                 "columns of records, and run the command again.");
}

TEST(ReadSelection, RefusesRecordColumnsThatCoverDifferentRows) {
    SelectionContent content;
    content.ranges = {RangeRef{"Invoices", 0, 1, 4, 1}, RangeRef{"Invoices", 1, 4, 3, 1}};
    content.values = {grid({{"Region"}, {"North"}, {"South"}, {"South"}}), grid({{"Yes"}, {"No"}, {"No"}})};
    expect_error([&] { read(content); },
                 "The two columns of records must cover the same rows: one covers rows 1 to 4, the other rows 2 to 4.");
}

TEST(ReadSelection, RefusesRecordsWithOnlyOneLabelInAColumn) {
    expect_error([] { read(block(grid({{"North", "No"}, {"South", "No"}, {"North", "No"}}), 0, 1)); },
                 "The two columns cannot be counted into a table: The table has only 1 column with counts; a test of "
                 "association needs at least 2 rows and 2 columns with counts. Select a table of counts (its labels "
                 "may be included), or two columns of records, and run the command again.");
}

TEST(ReadSelection, RefusesTwoPartsReadAsATable) {
    SelectionContent content;
    content.ranges = {RangeRef{"S", 0, 0, 2, 1}, RangeRef{"S", 0, 2, 2, 1}};
    content.values = {grid({{1}, {2}}), grid({{3}, {4}})};
    expect_error([&] { read(content, ReadAs::table); },
                 "Two separate columns cannot be read as a table of counts; select the table as one block.");
}

TEST(ReadSelection, RefusesRecordsWithMoreLabelsThanTheSheetLaysOut) {
    CellGrid cells(400, 2);
    for (std::size_t r = 0; r < 400; ++r) {
        cells.at(r, 0) = Cell::text("Employee " + std::to_string(r % 250));
        cells.at(r, 1) = Cell::text(r % 3 == 0 ? "Yes" : "No");
    }
    expect_error([&] { read(block(cells, 0, 1)); },
                 "The selection gives a table of 250 rows × 2 columns; the command lays out at most 200 rows and 50 "
                 "columns. For a table this large, use the worksheet functions on it directly (ASSOC.PVALUE, "
                 "ASSOC.RESIDUALS, ASSOC.CELLTEST, …).");
}

TEST(ParseReadAs, RefusesAnUnknownWord) {
    expect_error([] { parse_read_as("list"); },
                 "ReadAs must be \"table\", \"records\" or \"automatic\", not \"list\".");
}

TEST(Addresses, QuoteSheetNamesForReferences) {
    EXPECT_EQ(absolute_reference(RangeRef{"Bob's data", 3, 0, 4, 3}), "$'Bob''s data'.$A$4:$C$7");
    EXPECT_EQ(qualified_address(RangeRef{"HR", 0, 27, 1, 1}), "'HR'.AB1");
}

}  // namespace
}  // namespace assoc::command
