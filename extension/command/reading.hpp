#pragma once
// What the selection holds: a table of counts, or two columns of records (one label of each kind
// per record). Plain C++ (no UNO): the command's UNO side hands over the cells it read, and gets
// back either a Reading or an assoc::Error whose message tells the user what to select instead.
// Ambiguous selections are refused with words, never guessed: the user can then say how to read
// them (the dialog's "Read the selection as", or the dispatch argument ReadAs).
#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/count_table.hpp"
#include "assoc/report.hpp"
#include "assoc/text_collation.hpp"

namespace assoc::command {

// A block of cells on a sheet; rows and columns are 0-based.
struct RangeRef {
    std::string sheet;
    std::size_t row = 0;
    std::size_t column = 0;
    std::size_t rows = 0;
    std::size_t columns = 0;
};

enum class ReadAs { automatic, table, records };

// Reads the dispatch argument ReadAs: "table", "records", or "" / "automatic"; throws Error otherwise.
ReadAs parse_read_as(const std::string& word);

// The cells of the selection, as the UNO side read them.
struct SelectionContent {
    std::vector<RangeRef> ranges;   // one block, or two columns selected apart (Ctrl+click)
    std::vector<CellGrid> values;   // the cells of each range (blank cells blank, as the functions see them)
    // Whole columns were selected and cut to the rows in use; `ranges` hold the cut ranges.
    bool whole_columns = false;
};

// A table of counts in the document.
struct TableSource {
    RangeRef range;  // the whole selection, labels included: what the formulas refer to
    bool header_row = false;
    bool header_column = false;
};

// Two columns of records in the document.
struct RecordSource {
    RangeRef row_labels;     // the records' labels for the rows of the table (header excluded)
    RangeRef column_labels;  // and for its columns
    bool header_row = false;  // the first selected row held the columns' names
    std::string row_name;     // the names in that row, or ""
    std::string column_name;
    std::vector<Cell> row_levels;     // the distinct labels now, as ASSOC.LEVELS lists them
    std::vector<Cell> column_levels;
    std::size_t records = 0;
    std::size_t skipped_blank = 0;
};

struct Reading {
    std::optional<TableSource> table_source;  // exactly one of the two is set
    std::optional<RecordSource> record_source;
    CountTable table;  // the counts as the functions read them now
    // Names for the rows and columns of the body, in body order: labels, or "Row 1", "Column 1".
    std::vector<std::string> row_names;
    std::vector<std::string> column_names;
    VariableNames variables;  // what rows and columns classify, as typed ("" when unknown)
    std::string description;  // one sentence on what was read, for the sheet and the dialog

    bool is_records() const { return record_source.has_value(); }
};

// Reads the selection. Records' labels are put in the order of `collation` (the office's, in the
// extension: the order ASSOC.LEVELS lists them in). Throws assoc::Error with a message for the user
// when the selection is not a table of counts or two columns of records, or is ambiguous.
Reading read_selection(const SelectionContent& content, const TextCollation& collation,
                       ReadAs read_as = ReadAs::automatic);

// An all-number block of two columns with more body rows than this is refused as ambiguous (a
// table of counts that long is rare, numeric codes of records are not) unless ReadAs says which.
inline constexpr std::size_t max_two_column_table_rows = 30;

// The largest table the analysis sheet lays out (each row and column of it appears in several blocks
// and in the chart); larger ones are refused with a pointer to the worksheet functions.
inline constexpr std::size_t max_sheet_rows = 200;
inline constexpr std::size_t max_sheet_columns = 50;

// The cell address as people write it: "A1", "AB12".
std::string cell_address(std::size_t row, std::size_t column);
// "A4:C9", or "A4" for one cell.
std::string range_address(const RangeRef& range);
// "'HR data'.A4:C9": the sheet quoted, as the sheet's messages and notes name a range.
std::string qualified_address(const RangeRef& range);
// "$'HR data'.$A$4:$C$9": an absolute reference for formulas on another sheet.
std::string absolute_reference(const RangeRef& range);
// The sheet name quoted for a reference: 'HR data', 'Bob''s'.
std::string quoted_sheet(const std::string& sheet);

}  // namespace assoc::command
