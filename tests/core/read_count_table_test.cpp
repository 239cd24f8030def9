// Reading a count table from a range: headers, blanks, set-aside rows, and every error path.
#include <gtest/gtest.h>

#include "assoc/count_table.hpp"
#include "assoc/error.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::grid;
using assoc::test::expect_error;

TEST(ReadCountTable, ReadsAPlainBlockOfNumbersAsTheBody) {
    const CountTable table = read_count_table(grid({{1, 2, 3}, {4, 5, 6}}));
    EXPECT_EQ(table.rows(), 2u);
    EXPECT_EQ(table.columns(), 3u);
    EXPECT_DOUBLE_EQ(table.total(), 21);
    EXPECT_DOUBLE_EQ(table.row_total(1), 15);
    EXPECT_DOUBLE_EQ(table.column_total(2), 9);
    EXPECT_FALSE(table.has_row_labels());
    EXPECT_FALSE(table.has_column_labels());
}

TEST(ReadCountTable, SetsAsideAHeaderRowAndAHeaderColumn) {
    const CountTable table = read_count_table(grid({{"", "Yes", "No"}, {"Sales", 3, 7}, {"Legal", 2, 8}}));
    ASSERT_EQ(table.rows(), 2u);
    ASSERT_EQ(table.columns(), 2u);
    EXPECT_EQ(table.column_labels(), (std::vector<std::string>{"Yes", "No"}));
    EXPECT_EQ(table.row_labels(), (std::vector<std::string>{"Sales", "Legal"}));
    EXPECT_DOUBLE_EQ(table.count(1, 0), 2);
}

TEST(ReadCountTable, AcceptsRowLabelsWithoutAHeaderRow) {
    const CountTable table = read_count_table(grid({{"North", 3, 7}, {"South", 2, 8}}));
    EXPECT_TRUE(table.has_row_labels());
    EXPECT_FALSE(table.has_column_labels());
    EXPECT_DOUBLE_EQ(table.count(0, 1), 7);
}

TEST(ReadCountTable, ReadsBlanksAsZeroAndCountsThem) {
    const CountTable table = read_count_table(grid({{1, nullptr}, {3, 4}, {nullptr, 6}}));
    EXPECT_EQ(table.blank_cells(), 2u);
    EXPECT_DOUBLE_EQ(table.count(0, 1), 0);
    EXPECT_DOUBLE_EQ(table.total(), 14);
}

TEST(ReadCountTable, SetsAsideAllZeroRowsAndColumnsWithTheirLabels) {
    const CountTable table =
        read_count_table(grid({{"", "A", "B", "C"}, {"x", 1, 0, 2}, {"y", 0, 0, 0}, {"z", 3, nullptr, 4}}));
    EXPECT_EQ(table.rows(), 2u);
    EXPECT_EQ(table.columns(), 2u);
    ASSERT_EQ(table.set_aside_rows().size(), 1u);
    EXPECT_EQ(table.set_aside_rows()[0].label, "y");
    EXPECT_EQ(table.set_aside_rows()[0].index, 1u);
    ASSERT_EQ(table.set_aside_columns().size(), 1u);
    EXPECT_EQ(table.set_aside_columns()[0].label, "B");
    EXPECT_EQ(table.kept_rows(), (std::vector<std::size_t>{0, 2}));
}

TEST(ReadCountTable, SpreadsKeptResultsBackToTheBodyShapeWithZeros) {
    const CountTable table = read_count_table(grid({{1, 0, 2}, {0, 0, 0}, {3, 0, 4}}));
    Matrix kept(2, 2, 9.0);
    const Matrix body = table.to_body_shape(kept);
    ASSERT_EQ(body.rows(), 3u);
    ASSERT_EQ(body.columns(), 3u);
    EXPECT_EQ(body(0, 0), 9.0);
    EXPECT_EQ(body(1, 1), 0.0);
    EXPECT_EQ(body(0, 1), 0.0);
    EXPECT_EQ(body(2, 2), 9.0);
}

TEST(ReadCountTable, AllowsWeightedCountsButSaysTheyAreNotWhole) {
    const CountTable table = read_count_table(grid({{1.5, 2}, {3, 4}}));
    EXPECT_FALSE(table.whole_counts());
    EXPECT_TRUE(read_count_table(grid({{1, 2}, {3, 4}})).whole_counts());
}

TEST(ReadCountTable, RejectsTextInTheBodyNamingTheCell) {
    expect_error([] { read_count_table(grid({{"", "A", "B"}, {"x", 1, 2}, {"y", "n/a", 4}})); },
                 "row 3 (\"y\"), column 2 (\"A\") holds the text \"n/a\"; counts must be numbers");
}

// Imported data often holds numbers as texts, and reports a dash for zero: the refusal says which.
TEST(ReadCountTable, RejectsANumberStoredAsTextSayingSo) {
    expect_error([] { read_count_table(grid({{"", "A", "B"}, {"x", 1, 2}, {"y", " 1,200 ", 4}})); },
                 "row 3 (\"y\"), column 2 (\"A\") holds the text \" 1,200 \", a number stored as text (as imported "
                 "or pasted data often is); counts must be numbers: enter it again as a number, or convert those cells "
                 "to numbers");
}

TEST(ReadCountTable, RejectsADashSayingThatZeroIsABlankOr0) {
    expect_error([] { read_count_table(grid({{"", "A", "B"}, {"x", 1, 2}, {"y", "–", 4}})); },
                 "row 3 (\"y\"), column 2 (\"A\") holds the text \"–\", which a report may use for zero; counts must "
                 "be numbers: leave the cell blank (read as 0) or enter 0");
}

TEST(ReadCountTable, RejectsNegativeCountsNamingTheCell) {
    expect_error([] { read_count_table(grid({{1, 2}, {3, -4}})); },
                 "row 2, column 2 holds the number -4; counts cannot be negative");
}

TEST(ReadCountTable, RejectsNonFiniteNumbers) {
    expect_error([] { read_count_table(grid({{1, 2}, {std::nan(""), 4}})); },
                 "row 2, column 1 holds a value that is not a number; counts must be ordinary numbers");
    expect_error([] { read_count_table(grid({{1, HUGE_VAL}, {3, 4}})); },
                 "row 1, column 2 holds an infinite value; counts must be ordinary numbers");
}

TEST(ReadCountTable, RejectsAFirstRowThatMixesLabelsAndNumbers) {
    expect_error([] { read_count_table(grid({{"A", 5, "C"}, {1, 2, 3}, {4, 5, 6}})); },
                 "row 1 mixes labels and numbers (row 1, column 1 holds the text \"A\"); a header row must hold "
                 "only labels and a row of counts only numbers");
}

// A title row above the header, or a pivot table's field row ("Count - Employee", "Outcome") above its
// row of labels: which row names the columns is not guessed.
TEST(ReadCountTable, RefusesTwoRowsOfLabelsSayingWhichToSelect) {
    const char* const message =
        "rows 1 and 2 both hold only labels (row 2: \"Department\", \"No\" and \"Yes\"), but a table has one row of labels "
        "above its counts; select the table from its row of column labels down, leaving out a title or a pivot "
        "table's field row above it";
    expect_error([] { read_count_table(grid({{"Count - Employee", "Outcome", ""}, {"Department", "No", "Yes"},
                                             {"Finance", 4, 6}, {"Sales", 12, 15}})); },
                 message);
    expect_error([] { read_count_table(grid({{"Promotions by department", "", ""}, {"Department", "No", "Yes"},
                                             {"Finance", 4, 6}, {"Sales", 12, 15}})); },
                 message);
}

// Counts that an import left as text ("10", " 1,200 "): every row under the header would read as
// another row of labels, so the refusal says what they are instead of speaking of titles.
TEST(ReadCountTable, RefusesCountsStoredAsTextSayingWhatTheyAre) {
    const char* const message =
        "the counts are numbers stored as text (as imported or pasted data often is; row 2, column 2 holds the text "
        "\"10\"); counts must be numbers: enter them again as numbers, or convert those cells to numbers";
    expect_error([] { read_count_table(grid({{"Department", "Yes", "No"}, {"Finance", "10", "12"},
                                             {"Sales", "8", " 1,200 "}})); },
                 message);
    // A blank cell among them (read as 0 if they were numbers): the message names the first text.
    expect_error([] { read_count_table(grid({{"Department", "Yes", "No"}, {"Finance", nullptr, "12"},
                                             {"Sales", "8", "9"}})); },
                 "the counts are numbers stored as text (as imported or pasted data often is; row 2, column 3 holds "
                 "the text \"12\"); counts must be numbers: enter them again as numbers, or convert those cells to "
                 "numbers");
}

// A second header row of years typed as text, above real counts, is still two rows of labels.
TEST(ReadCountTable, RefusesAHeaderRowOfYearsAsTextAsTwoRowsOfLabels) {
    expect_error([] { read_count_table(grid({{"Department", "Promoted", "Promoted"}, {nullptr, "2025", "2026"},
                                             {"Finance", 4, 6}, {"Sales", 12, 15}})); },
                 "rows 1 and 2 both hold only labels (row 2: \"2025\" and \"2026\"), but a table has one row of "
                 "labels above its counts; select the table from its row of column labels down, leaving out a title "
                 "or a pivot table's field row above it");
}

// Blank rows above the header, or a blank column left of the row labels: a range drawn from above or
// from the left of the table. Read from there, the header would be taken for counts.
TEST(ReadCountTable, RefusesBlankLinesBeforeTheLabelsSayingWhereToStart) {
    expect_error([] { read_count_table(grid({{"", "", ""}, {"", "", ""}, {"Department", "No", "Yes"},
                                             {"Finance", 4, 6}, {"Sales", 12, 15}})); },
                 "rows 1–2 of the range are blank and row 3 holds only labels; a table is read from its first row, so "
                 "select it from its row of labels, row 3 (blank rows after a table are left out, not those before it)");
    expect_error([] { read_count_table(grid({{"", "Department", "No", "Yes"}, {"", "Finance", 4, 6},
                                             {"", "Sales", 12, 15}})); },
                 "column 1 of the range is blank and column 2 holds only labels; a table is read from its first column, "
                 "so select it from its column of labels, column 2 (blank columns after a table are left out, not "
                 "those before it)");
}

// A blank first row before counts without labels is a row of zeros, set aside as before.
TEST(ReadCountTable, SetsAsideABlankFirstRowBeforeCountsWithoutLabels) {
    const CountTable read = read_count_table(grid({{"", ""}, {4, 6}, {12, 15}}));
    EXPECT_EQ(read.rows(), 2u);
    ASSERT_EQ(read.set_aside_rows().size(), 1u);
    EXPECT_EQ(read.set_aside_rows()[0].range_number, 1u);
}

// A title, a blank row, then the header: the same two rows of labels.
TEST(ReadCountTable, RefusesTwoRowsOfLabelsWithBlankRowsBetweenThem) {
    expect_error([] { read_count_table(grid({{"Promotions by department", "", ""}, {"", "", ""},
                                             {"Department", "No", "Yes"}, {"Finance", 4, 6}, {"Sales", 12, 15}})); },
                 "rows 1 and 3 both hold only labels (row 3: \"Department\", \"No\" and \"Yes\"), but a table has one "
                 "row of labels above its counts; select the table from its row of column labels down, leaving out a "
                 "title or a pivot table's field row above it");
}

// Two row variables side by side (region and department; a pivot table with two row fields).
TEST(ReadCountTable, RefusesTwoColumnsOfLabelsSayingWhatToDo) {
    expect_error([] { read_count_table(grid({{"Region", "Department", "No", "Yes"}, {"North", "Finance", 4, 6},
                                             {nullptr, "Sales", 12, 15}, {"South", "Finance", 5, 5}})); },
                 "columns 1 and 2 both hold only labels (column 2: \"Finance\" and \"Sales\"), "
                 "but a table has one column of row labels beside its counts; put the two in one column (for example "
                 "=A2&\" \"&B2), or select the table from its column of row labels on");
}

TEST(ReadCountTable, RejectsATableWithOneNonEmptyRow) {
    expect_error([] { read_count_table(grid({{1, 2, 3}, {0, 0, nullptr}})); },
                 "the table has only 1 row with counts (1 row with all zeros set aside); a test of association "
                 "needs at least 2 rows and 2 columns with counts");
}

TEST(ReadCountTable, RejectsASingleColumn) {
    expect_error([] { read_count_table(grid({{"", "Count"}, {"a", 1}, {"b", 2}})); },
                 "the table has only 1 column with counts; a test of association needs at least 2 rows and 2 "
                 "columns with counts");
}

TEST(ReadCountTable, RejectsAnEmptyRange) {
    expect_error([] { read_count_table(CellGrid()); }, "the range is empty; select a table of counts");
}

TEST(ReadCountTable, RejectsARangeOfLabelsOnly) {
    expect_error([] { read_count_table(grid({{"Region", "Team"}})); }, "the range holds only labels and no counts");
}

TEST(ReadCountTable, RejectsATableAboveTheSizeCap) {
    ReadOptions options;
    options.max_body_cells = 5;
    expect_error([&] { read_count_table(grid({{1, 2, 3}, {4, 5, 6}}), options); },
                 "the table has 6 count cells; Assoc reads at most 5");
}

TEST(ReadCountTable, RejectsAMillionAndOneCellsByDefault) {
    CellGrid big(1001, 1000);
    expect_error([&] { read_count_table(big); }, "the table has 1,001,000 count cells; Assoc reads at most 1,000,000");
}

TEST(ReadCountTable, ReadsAnAllBlankFirstRowAsAnEmptyBodyRowNotAHeader) {
    // A header row needs one text at least; an all-blank row is a row of zeros, set aside.
    const CountTable table = read_count_table(grid({{nullptr, nullptr}, {1, 2}, {3, 4}}));
    EXPECT_FALSE(table.has_column_labels());
    EXPECT_EQ(table.blank_cells(), 2u);
    ASSERT_EQ(table.set_aside_rows().size(), 1u);
    EXPECT_EQ(table.set_aside_rows()[0].index, 0u);
}

TEST(ReadCountTable, AcceptsABlankLabelInTheHeaderColumn) {
    const CountTable table = read_count_table(grid({{"", "A", "B"}, {"x", 1, 2}, {nullptr, 3, 4}}));
    EXPECT_TRUE(table.has_row_labels());
    EXPECT_EQ(table.row_labels(), (std::vector<std::string>{"x", ""}));
    EXPECT_DOUBLE_EQ(table.count(1, 0), 3);
}

TEST(ReadCountTable, AcceptsABlankLabelInTheHeaderRow) {
    const CountTable table = read_count_table(grid({{"", "A", nullptr}, {"x", 1, 2}, {"y", 3, 4}}));
    EXPECT_EQ(table.column_labels(), (std::vector<std::string>{"A", ""}));
}

TEST(ReadCountTable, ReadsNumbersInTheFirstColumnAsCountsNotLabels) {
    // The header-column rule is the header-row rule: numbers (years, say) make it a column of counts.
    const CountTable table = read_count_table(grid({{"", "Yes", "No"}, {2021, 3, 4}, {2022, 5, 6}}));
    EXPECT_FALSE(table.has_row_labels());
    EXPECT_EQ(table.body_columns(), 3u);
    EXPECT_DOUBLE_EQ(table.count(0, 0), 2021);
}

TEST(ReadCountTable, RejectsAFirstColumnMixingLabelsAndNumbersNamingTheText) {
    expect_error([] { read_count_table(grid({{"", "Yes", "No"}, {"x", 1, 2}, {5, 3, 4}})); },
                 "row 2, column 1 holds the text \"x\"; counts must be numbers");
}

// Rows and columns count in the range as selected (a header row is row 1), and are named by their
// labels too where the range has them.
TEST(ReadCountTable, NamesTheCellByItsPlaceInTheRangeIncludingHeaders) {
    expect_error([] { read_count_table(grid({{"", "A", "B"}, {"x", 1, -2}, {"y", 3, 4}})); },
                 "row 2 (\"x\"), column 3 (\"B\") holds the number -2; counts cannot be negative");
    expect_error([] { read_count_table(grid({{1, 2}, {-0.5, 4}})); },
                 "row 2, column 1 holds the number -0.5; counts cannot be negative");
}

TEST(ReadCountTable, RejectsAFirstRowMixingLabelsAndNumbersBesideAHeaderColumn) {
    expect_error([] { read_count_table(grid({{"", 5, "C"}, {"x", 1, 2}, {"y", 3, 4}})); },
                 "row 1 mixes labels and numbers (row 1, column 3 holds the text \"C\"); a header row must hold "
                 "only labels and a row of counts only numbers");
}

TEST(ReadCountTable, RejectsTextBelowTheFirstRowNamingTheCell) {
    expect_error([] { read_count_table(grid({{1, 2, 3}, {4, "five", 6}})); },
                 "row 2, column 2 holds the text \"five\"; counts must be numbers");
}

TEST(ReadCountTable, RejectsATableWhoseCountsAreAllZero) {
    expect_error([] { read_count_table(grid({{0, 0}, {nullptr, 0}})); },
                 "the table has no row with counts (2 rows with all zeros set aside); a test of association needs at "
                 "least 2 rows and 2 columns with counts");
}

TEST(ReadCountTable, RejectsATableWithOneNonEmptyColumnAfterSettingAside) {
    expect_error([] { read_count_table(grid({{"", "A", "B"}, {"x", 1, 0}, {"y", 2, 0}})); },
                 "the table has only 1 column with counts (1 column with all zeros set aside); a test of "
                 "association needs at least 2 rows and 2 columns with counts");
}

TEST(ReadCountTable, RejectsASingleColumnOfNumbers) {
    expect_error([] { read_count_table(grid({{1}, {2}, {3}})); },
                 "the table has only 1 column with counts; a test of association needs at least 2 rows and 2 "
                 "columns with counts");
}

TEST(ReadCountTable, RejectsARangeOfLabelsInOneColumn) {
    expect_error([] { read_count_table(grid({{"Region"}, {"North"}})); }, "the range holds only labels and no counts");
}

TEST(ReadCountTable, RejectsCountsWhoseTotalIsTooLargeForANumber) {
    expect_error([] { read_count_table(grid({{1e308, 1e308}, {1e308, 1e308}})); },
                 "the counts add up to more than a spreadsheet number can hold");
}

TEST(ReadCountTable, AcceptsATableOfExactlyTheSizeCap) {
    ReadOptions options;
    options.max_body_cells = 6;
    EXPECT_EQ(read_count_table(grid({{1, 2, 3}, {4, 5, 6}}), options).rows(), 2u);
}

TEST(ReadCountTable, LeavesHeadersOutOfTheSizeCap) {
    ReadOptions options;
    options.max_body_cells = 6;
    EXPECT_EQ(read_count_table(grid({{"", "A", "B", "C"}, {"x", 1, 2, 3}, {"y", 4, 5, 6}}), options).columns(), 3u);
}

TEST(ReadCountTable, ChecksTheSizeCapBeforeReadingAnyCell) {
    // A million and one cells with text in them: the size, not the text, is what gets reported.
    CellGrid big(1001, 1000);
    big.at(500, 500) = Cell::text("x");
    expect_error([&] { read_count_table(big); }, "the table has 1,001,000 count cells; Assoc reads at most 1,000,000");
}

TEST(CountTableFromCounts, RejectsNegativeAndNonFiniteCounts) {
    Matrix counts(2, 2, 1.0);
    counts(1, 0) = -1;
    expect_error([&] { CountTable::from_counts(counts); },
                 "row 2, column 1 holds the number -1; counts must be numbers of zero or more");
    counts(1, 0) = std::nan("");
    expect_error([&] { CountTable::from_counts(counts); },
                 "row 2, column 1 holds a value that is not a number; counts must be numbers of zero or more");
}

TEST(CountTableFromCounts, RejectsAnEmptyMatrix) {
    expect_error([] { CountTable::from_counts(Matrix()); }, "the range is empty; select a table of counts");
}

TEST(CountTableFromCounts, AcceptsOneRowWhenTheTwoByTwoRequirementIsOff) {
    ReadOptions options;
    options.require_two_by_two = false;
    Matrix counts(1, 3, 2.0);
    EXPECT_EQ(CountTable::from_counts(counts, options).rows(), 1u);
}

TEST(ReadCountTable, RejectsCountsTooSmallOrTooFarApartToComputeWith) {
    // Expected counts below the smallest ordinary double (about 2.2e-308) would become 0 and the
    // statistics 0/0; both tables get here: E = 1e-323·1e-323/2.5e-323 and 2e-300·2e-300/1e300.
    const std::string message =
        "the counts are too small, or too far apart in size, to compute with (an expected count falls below "
        "1e-308); multiply them all by a common factor or round the smallest to 0";
    expect_error([&] { read_count_table(grid({{5e-324, 5e-324}, {5e-324, 1e-323}})); }, message);
    expect_error([&] { read_count_table(grid({{1e300, 1e-300}, {1e-300, 1e-300}})); }, message);
}

TEST(ReadCountTable, AcceptsTinyWeightsWhoseExpectedCountsAreOrdinaryNumbers) {
    EXPECT_EQ(read_count_table(grid({{1e-300, 2e-300}, {3e-300, 4e-300}})).rows(), 2u);
}
