// Records as workbooks hold them: whole columns with a header and blank cells below the last record,
// labels with stray spaces, weights left blank, and answer scales in their own order.
#include <gtest/gtest.h>

#include <string>
#include <vector>

#include "assoc/counts_from_records.hpp"
#include "assoc/levels.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::expect_error;
using assoc::test::grid;

namespace {

bool contains(const std::string& text, const std::string& part) { return text.find(part) != std::string::npos; }

std::vector<Cell> texts(std::initializer_list<const char*> values) {
    std::vector<Cell> cells;
    for (const char* value : values) cells.push_back(Cell::text(value));
    return cells;
}

// A column of cells as a whole sheet column gives it: the cells, then blanks down to the sheet's last row
// (left out before they arrive, as the add-in does, but remembered in the given shape).
CellGrid whole_column(std::initializer_list<assoc::test::CellLiteral> cells) {
    CellGrid column(cells.size(), 1);
    std::size_t r = 0;
    for (const auto& cell : cells) column.at(r++, 0) = cell.cell;
    column.set_given_shape(whole_column_rows, 1);
    return column;
}

}  // namespace

TEST(RecordRanges, CountNoBlankCellsAfterTheLastRecordAndDoNotMentionThem) {
    CellGrid rows = grid({{"x"}, {"y"}, {nullptr}, {nullptr}});
    CellGrid columns = grid({{"a"}, {"b"}, {nullptr}, {nullptr}});
    const RecordCounts counts = counts_from_records(rows, columns);
    EXPECT_EQ(counts.records, 2u);
    EXPECT_EQ(counts.skipped_blank, 0u);
    EXPECT_EQ(counts.feedback(), "Counted 2 records into 2 row levels and 2 column levels.");
}

TEST(RecordRanges, LeaveOutTheHeaderOfAWholeColumnAndSaySo) {
    const CellGrid channel = whole_column({"Channel", "Web", "Shop", "Web"});
    const CellGrid outcome = whole_column({"Outcome", "Yes", "No", "No"});
    EXPECT_EQ(distinct_levels(channel), texts({"Shop", "Web"}));
    const RecordCounts counts = counts_from_records(channel, outcome);
    EXPECT_EQ(counts.records, 3u);
    EXPECT_EQ(counts.counts.values(), (std::vector<double>{1, 0, 1, 1}));
    EXPECT_TRUE(contains(counts.feedback(),
                         "Row 1 (\"Channel\" and \"Outcome\") was read as a header and left out, since \"Channel\" is a "
                         "text found nowhere else in its whole column; if it is a record, select the records as a range "
                         "(for example A1:A500) instead of the whole column."))
        << counts.feedback();
}

// LEVELS and COUNTS agree: row 1 is a header when either whole column starts with a text found nowhere
// else in it, so a header above a column of repeated labels goes too.
TEST(RecordRanges, LeaveOutRow1OfEveryRangeWhenOneWholeColumnStartsWithAHeader) {
    const CellGrid channel = whole_column({"Channel", "Web", "Shop", "Web"});
    const CellGrid outcome = whole_column({"Yes", "Yes", "No", "No"});
    const RecordCounts counts = counts_from_records(channel, outcome);
    EXPECT_EQ(counts.records, 3u);
    EXPECT_EQ(counts.row_levels, texts({"Shop", "Web"}));
}

TEST(RecordRanges, KeepRow1OfAWholeColumnWhenItsLabelAppearsBelow) {
    const CellGrid channel = whole_column({"Web", "Web", "Shop"});
    EXPECT_EQ(distinct_levels(channel), texts({"Shop", "Web"}));
    EXPECT_EQ(counts_from_records(channel, whole_column({"No", "Yes", "No"})).records, 3u);
}

TEST(RecordRanges, KeepRow1OfARangeThatIsNoWholeColumn) {
    EXPECT_EQ(distinct_levels(grid({{"Channel"}, {"Web"}, {"Shop"}})), texts({"Channel", "Shop", "Web"}));
}

// Ranges drawn with their header (A1:A6): the header is no record when each range starts with a text
// found nowhere else in it, above records whose labels repeat. Invented records of a fictional company.
TEST(RecordRanges, LeaveOutTheHeaderOfRangesDrawnWithItAndSaySo) {
    const CellGrid dept = grid({{"Dept"}, {"Sales"}, {"Legal"}, {"Sales"}, {"Legal"}, {"Sales"}});
    const CellGrid outcome = grid({{"Outcome"}, {"Yes"}, {"No"}, {"No"}, {"Yes"}, {"Yes"}});
    EXPECT_EQ(distinct_levels(dept), texts({"Legal", "Sales"}));
    const RecordCounts counts = counts_from_records(dept, outcome);
    EXPECT_EQ(counts.records, 5u);
    EXPECT_EQ(counts.row_levels, texts({"Legal", "Sales"}));
    EXPECT_EQ(counts.column_levels, texts({"No", "Yes"}));
    EXPECT_EQ(counts.counts.values(), (std::vector<double>{1, 1, 1, 2}));
    EXPECT_TRUE(contains(counts.feedback(),
                         "Row 1 (\"Dept\" and \"Outcome\") was read as a header and left out, since each is a text "
                         "found nowhere else in its range above records whose labels repeat; if it is a record, move it to "
                         "another row of the range."))
        << counts.feedback();
}

// Records under a title and a blank row, read by whole columns: the title is no header of the
// records, and the header below it would have been counted as a record. Invented records.
TEST(RecordRanges, RefuseATitleAboveTheHeaderSayingWhereToStart) {
    const CellGrid dept = whole_column({"Promotion round 2025", nullptr, "Dept", "Sales", "Legal", "Sales", "Legal"});
    const CellGrid outcome = whole_column({nullptr, nullptr, "Outcome", "Yes", "No", "No", "Yes"});
    const char* const message =
        "row 1 (\"Promotion round 2025\") and row 3 (\"Dept\" and \"Outcome\") both look like headers: texts found "
        "nowhere else in their ranges, above the records; start every range at its row 4, below the header, leaving "
        "out the title above it";
    expect_error([&] { counts_from_records(dept, outcome); }, message);
    expect_error([&] { distinct_levels(dept); },
                 "row 1 (\"Promotion round 2025\") and row 3 (\"Dept\") both look like headers: texts found nowhere "
                 "else in their range, above the records; start every range at its row 4, below the header, leaving out "
                 "the title above it");
}

// A range drawn from a blank row above the header: the blanks are no records, the header is left out.
TEST(RecordRanges, LeaveOutBlankRowsAboveTheHeaderAndTheHeader) {
    const CellGrid dept = grid({{nullptr}, {"Dept"}, {"Sales"}, {"Legal"}, {"Sales"}, {"Legal"}, {"Sales"}});
    const CellGrid outcome = grid({{nullptr}, {"Outcome"}, {"Yes"}, {"No"}, {"No"}, {"Yes"}, {"Yes"}});
    EXPECT_EQ(distinct_levels(dept), texts({"Legal", "Sales"}));
    const RecordCounts counts = counts_from_records(dept, outcome);
    EXPECT_EQ(counts.records, 5u);
    EXPECT_EQ(counts.skipped_blank, 0u);
    EXPECT_TRUE(counts.header_left_out);
    EXPECT_EQ(counts.counts.values(), (std::vector<double>{1, 1, 1, 2}));
    EXPECT_TRUE(contains(counts.feedback(), "Row 2 (\"Dept\" and \"Outcome\") was read as a header and left out"))
        << counts.feedback();
}

// A whole column whose header is in row 2, under a blank row 1.
TEST(RecordRanges, LeaveOutTheHeaderOfAWholeColumnThatStartsLower) {
    const RecordCounts counts = counts_from_records(whole_column({nullptr, "Channel", "Web", "Shop", "Web"}),
                                                    whole_column({nullptr, "Outcome", "Yes", "No", "No"}));
    EXPECT_EQ(counts.records, 3u);
    EXPECT_EQ(counts.row_levels, texts({"Shop", "Web"}));
}

// A header in every range with the first record right below it is the plain case, whatever that record.
TEST(RecordRanges, KeepAFirstRecordRightBelowTheHeaderOfWholeColumns) {
    const RecordCounts counts = counts_from_records(whole_column({"Dept", "Audit", "Sales", "Legal", "Sales", "Legal"}),
                                                    whole_column({"Outcome", "Maybe", "Yes", "No", "No", "Yes"}));
    EXPECT_EQ(counts.records, 5u);
    EXPECT_EQ(counts.row_levels, texts({"Audit", "Legal", "Sales"}));
}

TEST(RecordRanges, LeaveOutATextHeaderAboveNumberCodes) {
    const RecordCounts counts =
        counts_from_records(grid({{"Grade"}, {1}, {2}, {1}, {3}}), grid({{"Outcome"}, {"Yes"}, {"No"}, {"No"}, {"Yes"}}));
    EXPECT_EQ(counts.records, 4u);
    EXPECT_EQ(counts.row_levels.size(), 3u);
}

TEST(RecordRanges, RefuseARow1ThatIsAHeaderInOneRangeAndARecordLabelInTheOther) {
    expect_error(
        [] {
            counts_from_records(grid({{"Dept"}, {"Sales"}, {"Legal"}, {"Sales"}, {"Legal"}}),
                                grid({{"Yes"}, {"Yes"}, {"No"}, {"No"}, {"Yes"}}));
        },
        "row 1 (\"Dept\" and \"Yes\") may be a header or a record: in some ranges it looks like a header (a text "
        "found nowhere else, above records whose labels repeat), in others it does not; if row 1 is a header, start every "
        "range one row later; if it is a record, move it to another row of the ranges");
}

// A header above a column with a level of one person (the only "Audit") is still a header.
TEST(RecordRanges, LeaveOutAHeaderAboveALevelThatComesOnce) {
    const RecordCounts counts = counts_from_records(grid({{"Dept"}, {"Sales"}, {"Legal"}, {"Sales"}, {"Audit"}}),
                                                    grid({{"Outcome"}, {"Yes"}, {"No"}, {"No"}, {"Yes"}}));
    EXPECT_EQ(counts.records, 4u);
    EXPECT_TRUE(counts.header_left_out);
}

// Known limit: a first record whose labels each come once, above others that repeat, looks like a header
// and is left out, and the feedback says so.
TEST(RecordRanges, TakeAFirstRecordOfLabelsThatComeOnceForAHeaderAndSaySo) {
    const RecordCounts counts = counts_from_records(grid({{"Audit"}, {"Sales"}, {"Legal"}, {"Sales"}}),
                                                    grid({{"Maybe"}, {"Yes"}, {"No"}, {"No"}}));
    EXPECT_EQ(counts.records, 3u);
    EXPECT_TRUE(contains(counts.feedback(), "Row 1 (\"Audit\" and \"Maybe\") was read as a header and left out"))
        << counts.feedback();
}

TEST(RecordRanges, ReadATextWeightInRow1AsAHeaderRow) {
    const RecordCounts counts = counts_from_records(grid({{"Dept"}, {"x"}, {"y"}}), grid({{"Outcome"}, {"a"}, {"b"}}),
                                                    grid({{"Weight"}, {2}, {3}}));
    EXPECT_EQ(counts.records, 2u);
    EXPECT_EQ(counts.total, 5);
    EXPECT_TRUE(contains(counts.feedback(), "Row 1 (\"Dept\" and \"Outcome\") was read as a header and left out, since its "
                                            "weight is the text \"Weight\"."))
        << counts.feedback();
}

TEST(RecordRanges, ReadWeightsThatLostTheirTrailingBlanksAtTheirGivenLength) {
    CellGrid weights = grid({{2}, {3}});
    weights.set_given_shape(3, 1);
    const RecordCounts counts = counts_from_records(grid({{"x"}, {"y"}, {"x"}}), grid({{"a"}, {"b"}, {"b"}}), weights);
    EXPECT_EQ(counts.skipped_weight, 1u);
    EXPECT_EQ(counts.total, 5);
}

TEST(RecordRanges, MergeLabelsThatDifferOnlyBySpacesAtTheirEndsAndSaySo) {
    const RecordCounts counts = counts_from_records(grid({{"x"}, {"x"}, {"y"}}), grid({{"No"}, {"No "}, {" Yes"}}));
    EXPECT_EQ(counts.column_levels, texts({"No", "Yes"}));
    EXPECT_EQ(counts.counts.values(), (std::vector<double>{2, 0, 0, 1}));
    EXPECT_TRUE(contains(counts.feedback(), "The column labels \"No\" and \"No \" differ only by spaces at the start or "
                                            "end and were counted as one label, \"No\"."))
        << counts.feedback();
}

TEST(RecordRanges, TreatALabelOfOnlySpacesAsBlank) {
    const RecordCounts counts = counts_from_records(grid({{"x"}, {"y"}}), grid({{"a"}, {"   "}}));
    EXPECT_EQ(counts.skipped_blank, 1u);
}

TEST(LevelOrder, FollowsARangeThatListsTheLabels) {
    const CellGrid answers = grid({{"Good"}, {"Poor"}, {"Excellent"}, {"Good"}});
    const LevelOrdering scale = LevelOrdering::from_range(grid({{"Poor", "Fair", " Good", "Excellent"}}));
    EXPECT_EQ(distinct_levels(answers, scale), texts({"Poor", "Fair", "Good", "Excellent"}));
}

// One order for both sides of ASSOC.COUNTS: the answer scale orders the rows; the offices, none of which
// it lists, are sorted, and the feedback says so.
TEST(LevelOrder, SortsTheSideWhoseLabelsTheListDoesNotHold) {
    const LevelOrdering scale = LevelOrdering::from_range(grid({{"Poor", "Fair", "Good", "Excellent"}}));
    const RecordCounts counts = counts_from_records(grid({{"Good"}, {"Poor"}, {"Excellent"}, {"Good"}}),
                                                    grid({{"South"}, {"North"}, {"North"}, {"South"}}), CellGrid(), scale);
    EXPECT_EQ(counts.row_levels, texts({"Poor", "Fair", "Good", "Excellent"}));
    EXPECT_EQ(counts.column_levels, texts({"North", "South"}));
    EXPECT_EQ(counts.counts.values(), (std::vector<double>{1, 0, 0, 0, 0, 2, 1, 0}));
    EXPECT_TRUE(contains(counts.feedback(), "The order lists none of the column labels, so they were sorted."));
}

TEST(LevelOrder, ListsALabelNoRecordHoldsWithZerosAndSaysSo) {
    const LevelOrdering scale = LevelOrdering::from_range(grid({{"Poor"}, {"Fair"}, {"Good"}}));
    const RecordCounts counts =
        counts_from_records(grid({{"Good"}, {"Poor"}, {"Good"}}), grid({{"Good"}, {"Good"}, {"Poor"}}), CellGrid(), scale);
    EXPECT_EQ(counts.row_levels, texts({"Poor", "Fair", "Good"}));
    EXPECT_EQ(counts.counts.values(), (std::vector<double>{0, 0, 1, 0, 0, 0, 1, 0, 1}));
    EXPECT_TRUE(contains(counts.feedback(), "The order lists \"Fair\", which no record of the row labels holds; its line "
                                            "holds zeros."))
        << counts.feedback();
}

TEST(LevelOrder, RefusesLabelsTheListLacksNamingThem) {
    const LevelOrdering scale = LevelOrdering::from_range(grid({{"Poor"}, {"good"}}));
    expect_error([&] { distinct_levels(grid({{"Good"}, {"Poor"}, {"Excellent"}}), scale); },
                 "the order lists 2 labels but not \"Good\" and \"Excellent\" (the order has \"good\", which differs in "
                 "capitals), found in the labels; list every label in the order's range");
}

TEST(LevelOrder, RefusesALabelListedTwice) {
    expect_error([] { LevelOrdering::from_range(grid({{"Poor"}, {"Good"}, {"Poor "}})); },
                 "the order lists \"Poor\" twice; list each label once, in the wanted order");
}

TEST(LevelOrder, TakesAHundredLabels) {
    CellGrid list(100, 1), records(200, 1);
    for (std::size_t i = 0; i < 100; ++i) {
        list.at(i, 0) = Cell::text("level " + std::to_string(99 - i));
        records.at(2 * i, 0) = Cell::text("level " + std::to_string(i));
        records.at(2 * i + 1, 0) = Cell::text("level " + std::to_string(i));
    }
    const std::vector<Cell> levels = distinct_levels(records, LevelOrdering::from_range(list));
    ASSERT_EQ(levels.size(), 100u);
    EXPECT_EQ(levels.front(), Cell::text("level 99"));
    EXPECT_EQ(levels.back(), Cell::text("level 0"));
}

// A count typed under the records ("Total | 5") is no record: counted, it would add a level of one
// person on each side. It is refused, in both functions, with what was found.
TEST(RecordRanges, RefuseATotalLineUnderTheRecords) {
    expect_error(
        [] {
            counts_from_records(grid({{"Dept"}, {"Sales"}, {"Legal"}, {"Legal"}, {"Sales"}, {"Sales"}, {"Total"}}),
                                grid({{"Outcome"}, {"Yes"}, {"No"}, {"Yes"}, {"No"}, {"Yes"}, {5}}));
        },
        "the last record, row 7, holds \"Total\", which reads as a total line under the records rather than a "
        "record: leave it out of the ranges (Assoc counts the records itself); if it is a record, move it up among "
        "the others");
}

TEST(RecordRanges, RefuseATotalLineUnderTheRecordsWhenListingTheirLevels) {
    expect_error([] { distinct_levels(whole_column({"Dept", "Sales", "Legal", "Sales", nullptr, "Grand total"})); },
                 "the last record, row 6, holds \"Grand total\", which reads as a total line under the records rather "
                 "than a record: leave it out of the range (Assoc counts the records itself); if it is a record, move "
                 "it up among the others");
}

// "Count | 5" under the records is the same line under another word; "N" among the answers is not.
TEST(RecordRanges, RefuseACountLineUnderTheRecordsWhereANumberStandsAmongTexts) {
    expect_error(
        [] {
            counts_from_records(grid({{"Dept"}, {"Sales"}, {"Legal"}, {"Legal"}, {"Sales"}, {"Count"}}),
                                grid({{"Outcome"}, {"Yes"}, {"No"}, {"Yes"}, {"No"}, {4}}));
        },
        "the last record, row 6, holds \"Count\", which reads as a total line under the records rather than a "
        "record: leave it out of the ranges (Assoc counts the records itself); if it is a record, move it up among "
        "the others");
}

TEST(RecordRanges, CountALastAnswerNAsARecord) {
    const RecordCounts counts = counts_from_records(grid({{"Sales"}, {"Legal"}, {"Sales"}, {"Legal"}}),
                                                    grid({{"Y"}, {"Y"}, {"Y"}, {"N"}}));
    EXPECT_EQ(counts.records, 4u);
    EXPECT_EQ(counts.column_levels.size(), 2u);
}

TEST(RecordRanges, CountALastRecordNamedNumberOfBesideACodeOfNumbers) {
    const RecordCounts counts = counts_from_records(grid({{"Sales"}, {"Legal"}, {"Sales"}, {"Number of staff"}}),
                                                    grid({{1}, {0}, {0}, {1}}));
    EXPECT_EQ(counts.records, 4u);
}

TEST(RecordRanges, SayWhenALabelReadsAsAMissingValue) {
    const RecordCounts counts = counts_from_records(grid({{"Sales"}, {"Legal"}, {"Sales"}, {"Legal"}, {"Sales"}}),
                                                    grid({{"Yes"}, {"n/a"}, {"Yes"}, {"-"}, {"n/a"}}));
    EXPECT_EQ(counts.column_levels.size(), 3u);
    ASSERT_EQ(counts.remarks.size(), 1u);
    EXPECT_EQ(counts.remarks[0], "The column labels include \"n/a\" and 1 other label that reads as a missing value, "
                                 "and their records were counted as levels of their own; if they have no answer, "
                                 "clear those cells (records with a blank label are skipped, and said); if one is an "
                                 "answer (\"Not applicable\"), write it in words.");
}

TEST(RecordRanges, SayWhenALetterStandsBesideTheWordItBegins) {
    const RecordCounts counts = counts_from_records(grid({{"Sales"}, {"Legal"}, {"Sales"}, {"Legal"}, {"Sales"}}),
                                                    grid({{"Yes"}, {"No"}, {"Y"}, {"No"}, {"Yes"}}));
    EXPECT_EQ(counts.column_levels.size(), 3u);
    ASSERT_EQ(counts.remarks.size(), 1u);
    EXPECT_EQ(counts.remarks[0], "The column labels \"Y\" and \"Yes\" may be one label written two ways (a letter "
                                 "and the word it begins), and are counted apart; if they are one, write them one way.");
}

TEST(RecordRanges, SayNothingOfGradesThatAreLettersAlone) {
    const RecordCounts counts = counts_from_records(grid({{"Sales"}, {"Legal"}, {"Sales"}, {"Legal"}}),
                                                    grid({{"A"}, {"B"}, {"C"}, {"A"}}));
    EXPECT_TRUE(counts.remarks.empty());
}

// An answer that reads like a total word but that several people gave is a record.
TEST(RecordRanges, CountAnAnswerAllGivenMoreThanOnceEvenLast) {
    const RecordCounts counts =
        counts_from_records(grid({{"Sales"}, {"Legal"}, {"Sales"}, {"Legal"}}), grid({{"All"}, {"Some"}, {"All"}, {"All"}}));
    EXPECT_EQ(counts.records, 4u);
    EXPECT_EQ(counts.column_levels.size(), 2u);
}

// Before/after answers whose sides hold different labels: read by position (as ASSOC.PAIRED reads a
// table), "Neutral" would meet "Disagree". Counted as given, and said, with the way to align them.
TEST(RecordRanges, SayWhenTheTwoSidesShareSomeLabelsButNotAll) {
    const RecordCounts counts = counts_from_records(grid({{"Agree"}, {"Neutral"}, {"Agree"}, {"Neutral"}}),
                                                    grid({{"Agree"}, {"Disagree"}, {"Agree"}, {"Agree"}}));
    EXPECT_EQ(counts.counts.rows(), 2u);
    EXPECT_TRUE(contains(counts.feedback(),
                         "The row and column labels share \"Agree\" but not \"Neutral\" (rows only) and \"Disagree\" "
                         "(columns only), so row k and column k are not always the same category"))
        << counts.feedback();
}

TEST(RecordRanges, SayNothingOfLabelsWhenTheSidesShareAllOrNone) {
    const RecordCounts same = counts_from_records(grid({{"Yes"}, {"No"}, {"Yes"}}), grid({{"No"}, {"No"}, {"Yes"}}));
    const RecordCounts apart = counts_from_records(grid({{"Sales"}, {"Legal"}, {"Sales"}}), grid({{"No"}, {"No"}, {"Yes"}}));
    EXPECT_FALSE(contains(same.feedback(), "share"));
    EXPECT_FALSE(contains(apart.feedback(), "share"));
}

// A header repeated among the records (a report pasted page by page): on top of the range and again
// lower down, "Dept | Promoted" is found nowhere else, so it is no header by the first-row rule, and
// counted it would add a level of two records on each side. Refused, naming the rows.
TEST(RecordRanges, RefuseAHeaderRepeatedAmongTheRecords) {
    expect_error(
        [] {
            counts_from_records(grid({{"Dept"}, {"Sales"}, {"Sales"}, {"IT"}, {"Dept"}, {"IT"}, {"Finance"}, {"Finance"}}),
                                grid({{"Promoted"}, {"Yes"}, {"No"}, {"Yes"}, {"Promoted"}, {"No"}, {"Yes"}, {"No"}}));
        },
        "rows 1 and 5 hold the same texts (\"Dept\" and \"Promoted\"), found nowhere else in the ranges: a header "
        "repeated among the records (as in a report pasted page by page), which would be counted as records; leave the "
        "header out of the ranges and delete its repeats from the records (if they are records, sort the records so "
        "that another one comes first)");
}

// The same line lower down, with the range started below the header, may be a group of its own (one
// person whose department and answer no one else has): counted, and said.
TEST(RecordRanges, CountARecordOfTextsFoundNowhereElseAndSaySo) {
    const RecordCounts counts =
        counts_from_records(grid({{"Sales"}, {"Sales"}, {"IT"}, {"Dept"}, {"IT"}, {"Finance"}, {"Finance"}}),
                            grid({{"Yes"}, {"No"}, {"Yes"}, {"Promoted"}, {"No"}, {"Yes"}, {"No"}}));
    EXPECT_EQ(counts.records, 7u);
    EXPECT_EQ(counts.row_levels.size(), 4u);
    ASSERT_EQ(counts.remarks.size(), 1u);
    EXPECT_EQ(counts.remarks[0], "Row 4 holds texts (\"Dept\" and \"Promoted\"), found nowhere else in the ranges, and "
                                 "was counted as a record: if it is a header repeated among the records (as in a "
                                 "report pasted page by page) or a note, leave it out.");
}

// A department whose every record gave the one answer no other department gave is no header when the
// others share a single answer: the rest of the records must vary in every range for the doubt.
TEST(RecordRanges, CountAFirstRecordRepeatedWhenTheOtherRecordsShareOneAnswer) {
    const RecordCounts counts =
        counts_from_records(grid({{"Sales"}, {"IT"}, {"IT"}, {"Sales"}, {"Legal"}, {"Legal"}, {"IT"}, {"Legal"}}),
                            grid({{"Yes"}, {"No"}, {"No"}, {"Yes"}, {"No"}, {"No"}, {"No"}, {"No"}}));
    EXPECT_EQ(counts.records, 8u);
    EXPECT_TRUE(counts.remarks.empty()) << counts.feedback();
}

