#include "reading.hpp"

#include <unordered_set>

#include "assoc/counts_from_records.hpp"
#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "assoc/levels.hpp"
#include "sheet_plan.hpp"

namespace assoc::command {
namespace {

const std::string select_hint =
    "Select a table of counts (its labels may be included), or two columns of records, and run the command again.";
const std::string choose_hint = "Choose how to read the selection: \"a table of counts\" or \"two columns of records\".";

// Whether a message of the functions names a row or column by its number ("row 6", "Row 2 ("North"),
// column 3"): they count within the ranges they are given, which the command takes from the selection.
bool names_a_position(const std::string& message) {
    for (const char* word : {"row ", "rows ", "column ", "columns ", "Row ", "Rows ", "Column ", "Columns "}) {
        const std::string w(word);
        for (std::size_t at = message.find(w); at != std::string::npos; at = message.find(w, at + 1)) {
            const std::size_t next = at + w.size();
            if (next < message.size() && message[next] >= '0' && message[next] <= '9') return true;
        }
    }
    return false;
}

std::string sentence_from(const std::string& core_message) {
    std::string text = core_message;
    if (!text.empty() && text.front() >= 'a' && text.front() <= 'z') text.front() = static_cast<char>(text.front() - 32);
    if (!text.empty() && text.back() != '.') text += '.';
    return text;
}

CellGrid column_of(const CellGrid& grid, std::size_t column, std::size_t first_row = 0) {
    CellGrid out(grid.rows() - first_row, 1);
    for (std::size_t r = first_row; r < grid.rows(); ++r) out.at(r - first_row, 0) = grid.at(r, column);
    return out;
}

bool any_text(const CellGrid& column, std::size_t first_row) {
    for (std::size_t r = first_row; r < column.rows(); ++r)
        if (column.at(r, 0).is_text()) return true;
    return false;
}

bool has_repeated_label(const CellGrid& column, std::size_t first_row) {
    std::unordered_set<std::string> seen;
    for (std::size_t r = first_row; r < column.rows(); ++r) {
        const Cell& cell = column.at(r, 0);
        if (cell.is_blank()) continue;
        if (!seen.insert((cell.is_text() ? "t" : "n") + level_text(cell)).second) return true;
    }
    return false;
}

// The first row of two record columns names them when both its cells are texts that appear
// nowhere else in their column (a department called "Department" would be one record of its own).
bool names_in_first_row(const CellGrid& a, const CellGrid& b) {
    if (a.rows() < 3 || !a.at(0, 0).is_text() || !b.at(0, 0).is_text()) return false;
    for (const CellGrid* column : {&a, &b}) {
        const Cell& name = column->at(0, 0);
        for (std::size_t r = 1; r < column->rows(); ++r)
            if (column->at(r, 0) == name) return false;
    }
    return true;
}

std::string rows_phrase(const RangeRef& range) {
    return range.rows == 1 ? "row " + std::to_string(range.row + 1)
                           : "rows " + std::to_string(range.row + 1) + " to " + std::to_string(range.row + range.rows);
}

std::string count_phrase(std::size_t n, const char* word) {
    return format_count(static_cast<double>(n)) + " " + word + (n == 1 ? "" : "s");
}

Reading read_records(RangeRef rows_range, const CellGrid& rows_column, RangeRef columns_range,
                     const CellGrid& columns_column, bool whole_columns, const TextCollation& collation) {
    if (rows_range.row != columns_range.row || rows_range.rows != columns_range.rows)
        throw Error("The two columns of records must cover the same rows: one covers " + rows_phrase(rows_range) +
                    ", the other " + rows_phrase(columns_range) + ".");
    RecordSource source;
    source.header_row = names_in_first_row(rows_column, columns_column);
    // The sheet's formulas read exactly the ranges counted here. Below a row of names the records
    // alone are counted, unless the functions would take their first record for a header (or could
    // not tell): then the ranges are given with their names, which the functions leave out themselves.
    bool with_names = false;
    if (source.header_row) {
        // Whether the functions read the ranges from `start` with their first cell as a header (or refuse
        // them: -1), or as a record (0).
        const auto first_cell = [&](std::size_t start) {
            try {
                return counts_from_records(column_of(rows_column, 0, start), column_of(columns_column, 0, start), CellGrid(),
                                           LevelOrder::sorted, collation)
                               .header_left_out
                           ? 1
                           : 0;
            } catch (const Error&) {
                return -1;
            }
        };
        with_names = first_cell(1) != 0 && first_cell(0) == 1;
    }
    const std::size_t first = source.header_row && !with_names ? 1 : 0;
    if (source.header_row) {
        source.row_name = rows_column.at(0, 0).as_text();
        source.column_name = columns_column.at(0, 0).as_text();
    }
    const std::size_t named = source.header_row ? 1 : 0;
    if (rows_column.rows() - named < 2)
        throw Error("Two columns of records need at least two records; the selection has " +
                    count_phrase(rows_column.rows() - named, "row") + " of them. " + select_hint);
    rows_range.row += first;
    rows_range.rows -= first;
    columns_range.row += first;
    columns_range.rows -= first;
    source.row_labels = rows_range;
    source.column_labels = columns_range;

    Reading reading;
    try {
        const RecordCounts counts = counts_from_records(column_of(rows_column, 0, first), column_of(columns_column, 0, first),
                                                        CellGrid(), LevelOrder::sorted, collation);
        source.row_levels = counts.row_levels;
        source.column_levels = counts.column_levels;
        source.records = counts.records;
        source.skipped_blank = counts.skipped_blank;
        reading.table = counts.table();
    } catch (const Error& error) {
        // The functions number the records' rows from the first row counted; say where that is on the sheet.
        const std::string where = rows_range.row != 0 && names_a_position(error.what())
                                      ? " Rows are counted from the first row read, sheet row " +
                                            std::to_string(rows_range.row + 1) + "."
                                      : "";
        throw Error("The two columns cannot be counted into a table: " + sentence_from(error.what()) + where + " " +
                    select_hint);
    }
    for (const Cell& level : source.row_levels) reading.row_names.push_back(level_text(level));
    for (const Cell& level : source.column_levels) reading.column_names.push_back(level_text(level));
    reading.variables = {source.row_name, source.column_name};

    std::string text = "two columns of records, " + qualified_address(rows_range) + " and " + range_address(columns_range);
    if (whole_columns) text += " (the rows in use of the selected columns)";
    text += ": " + count_phrase(source.records, "record");
    if (source.skipped_blank > 0) text += " (" + count_phrase(source.skipped_blank, "record") + " with a blank label skipped)";
    text += source.header_row ? ", named \"" + source.row_name + "\" and \"" + source.column_name + "\" in the row above"
                              : ", with no row of names (the first row is a record)";
    text += "; counted into " + std::to_string(source.row_levels.size()) + " rows × " +
            std::to_string(source.column_levels.size()) + " columns";
    reading.description = text;
    reading.record_source = std::move(source);
    return reading;
}

std::string trimmed(const std::string& text) {
    const std::size_t first = text.find_first_not_of(" \t");
    if (first == std::string::npos) return "";
    return text.substr(first, text.find_last_not_of(" \t") - first + 1);
}

// The variables named in the corner cell of a table with both headers, as typed: "Department /
// Outcome" (or with a backslash) names both, a text without a separator the rows.
VariableNames names_in_corner(const CellGrid& grid, const TableSource& source) {
    if (!source.header_row || !source.header_column || !grid.at(0, 0).is_text()) return {};
    const std::string& corner = grid.at(0, 0).as_text();
    const std::size_t separator = corner.find_first_of("/\\");
    if (separator == std::string::npos) return {trimmed(corner), ""};
    return {trimmed(corner.substr(0, separator)), trimmed(corner.substr(separator + 1))};
}

Reading read_table(const RangeRef& range, const CellGrid& grid) {
    Reading reading;
    try {
        reading.table = read_count_table(grid);
    } catch (const Error& error) {
        // The functions number rows and columns from the selection's first cell; say where that is.
        const std::string where = (range.row != 0 || range.column != 0) && names_a_position(error.what())
                                      ? " Rows and columns are counted from the selection's first cell, " +
                                            cell_address(range.row, range.column) + "."
                                      : "";
        throw Error("The selection cannot be read as a table of counts: " + sentence_from(error.what()) + where + " " +
                    select_hint);
    }
    TableSource source{range, reading.table.has_column_labels(), reading.table.has_row_labels()};
    const std::size_t first_row = source.header_row ? 1 : 0, first_column = source.header_column ? 1 : 0;
    for (std::size_t r = 0; r < reading.table.body_rows(); ++r) {
        const Cell& label = grid.at(first_row + r, 0);
        reading.row_names.push_back(source.header_column && label.is_text() ? label.as_text()
                                                                            : "Row " + std::to_string(r + 1));
    }
    for (std::size_t c = 0; c < reading.table.body_columns(); ++c) {
        const Cell& label = grid.at(0, first_column + c);
        reading.column_names.push_back(source.header_row && label.is_text() ? label.as_text()
                                                                           : "Column " + std::to_string(c + 1));
    }
    reading.variables = names_in_corner(grid, source);

    std::string labels = source.header_row && source.header_column ? "with row and column labels"
                         : source.header_row                       ? "with column labels"
                         : source.header_column                    ? "with row labels"
                                                                   : "without labels";
    reading.description = "a table of counts, " + qualified_address(range) + ": " +
                          std::to_string(reading.table.body_rows()) + " rows × " +
                          std::to_string(reading.table.body_columns()) + " columns " + labels;
    reading.table_source = source;
    return reading;
}

Reading read_block(const RangeRef& range, const CellGrid& grid, ReadAs read_as, bool whole_columns,
                   const TextCollation& collation) {
    if (grid.rows() * grid.columns() <= 1) throw Error("Only one cell is selected. " + select_hint);
    if (grid.columns() == 1)
        throw Error("Only one column is selected. " + select_hint +
                    " (To count records, select their two columns; hold Ctrl to select columns that are not side "
                    "by side.)");
    if (read_as == ReadAs::records) {
        if (grid.columns() != 2)
            throw Error("Only two columns can be read as records; the selection has " +
                        std::to_string(grid.columns()) + " columns.");
    }
    if (grid.columns() == 2 && read_as != ReadAs::table) {
        RangeRef left = range, right = range;
        left.columns = right.columns = 1;
        right.column += 1;
        const CellGrid a = column_of(grid, 0), b = column_of(grid, 1);
        if (read_as == ReadAs::records) return read_records(left, a, right, b, whole_columns, collation);
        const std::size_t start = a.rows() > 1 && a.at(0, 0).is_text() && b.at(0, 0).is_text() ? 1 : 0;
        const bool text_a = any_text(a, start), text_b = any_text(b, start);
        if (text_a && text_b) return read_records(left, a, right, b, whole_columns, collation);
        if (text_a || text_b) {
            if (has_repeated_label(text_a ? a : b, start)) return read_records(left, a, right, b, whole_columns, collation);
            throw Error("The selection holds one column of labels and one column of numbers, like a list of counts "
                        "by one category. A test of association needs a table with at least two columns of counts, "
                        "or two columns of records. To read the two columns as records anyway, choose \"two columns "
                        "of records\" as the way to read the selection.");
        }
        const std::size_t rows = grid.rows() - start;
        if (rows > max_two_column_table_rows && read_as == ReadAs::automatic)
            throw Error("The two columns hold only numbers, in " + std::to_string(rows) +
                        " rows: that could be a table of counts with " + std::to_string(rows) +
                        " rows and 2 columns, or records whose labels are number codes. " + choose_hint);
    }
    return read_table(range, grid);
}

Reading read_any(const SelectionContent& content, ReadAs read_as, const TextCollation& collation) {
    require(content.ranges.size() == content.values.size(), "The selection could not be read.");
    if (content.ranges.empty()) throw Error("Nothing is selected. " + select_hint);
    if (content.ranges.size() > 2)
        throw Error("The selection has " + std::to_string(content.ranges.size()) +
                    " separate parts. Select one block of cells, or two columns of records (hold Ctrl to select the "
                    "second).");
    if (content.ranges.size() == 2) {
        if (read_as == ReadAs::table)
            throw Error("Two separate columns cannot be read as a table of counts; select the table as one block.");
        const CellGrid &a = content.values[0], &b = content.values[1];
        if (a.columns() != 1 || b.columns() != 1)
            throw Error("Two separate parts can only be read as two columns of records, and each part must be a "
                        "single column. " + select_hint);
        // Left to right, whatever the order of selecting.
        const bool swap = content.ranges[1].column < content.ranges[0].column;
        return swap ? read_records(content.ranges[1], b, content.ranges[0], a, content.whole_columns, collation)
                    : read_records(content.ranges[0], a, content.ranges[1], b, content.whole_columns, collation);
    }
    const CellGrid& grid = content.values[0];
    if (grid.empty()) throw Error("Nothing is selected. " + select_hint);
    return read_block(content.ranges[0], grid, read_as, content.whole_columns, collation);
}

}  // namespace

ReadAs parse_read_as(const std::string& word) {
    if (word.empty() || word == "automatic") return ReadAs::automatic;
    if (word == "table") return ReadAs::table;
    if (word == "records") return ReadAs::records;
    throw Error("ReadAs must be \"table\", \"records\" or \"automatic\", not \"" + word + "\".");
}

Reading read_selection(const SelectionContent& content, const TextCollation& collation, ReadAs read_as) {
    Reading reading = read_any(content, read_as, collation);
    // The sheet shows each row and column of the table in several blocks and in the chart.
    const std::size_t rows = reading.table.body_rows(), columns = reading.table.body_columns();
    if (rows > max_sheet_rows || columns > max_sheet_columns)
        throw Error("The selection gives a table of " + format_count(static_cast<double>(rows)) + " rows × " +
                    format_count(static_cast<double>(columns)) + " columns; the command lays out at most " +
                    std::to_string(max_sheet_rows) + " rows and " + std::to_string(max_sheet_columns) +
                    " columns. For a table this large, use the worksheet functions on it directly (ASSOC.PVALUE, "
                    "ASSOC.RESIDUALS, ASSOC.CELLTEST, …).");
    return reading;
}

std::string cell_address(std::size_t row, std::size_t column) {
    return column_letters(column) + std::to_string(row + 1);
}

std::string range_address(const RangeRef& range) {
    const std::string first = cell_address(range.row, range.column);
    if (range.rows <= 1 && range.columns <= 1) return first;
    return first + ":" + cell_address(range.row + range.rows - 1, range.column + range.columns - 1);
}

std::string qualified_address(const RangeRef& range) { return quoted_sheet(range.sheet) + "." + range_address(range); }

std::string absolute_reference(const RangeRef& range) {
    Area area{range.row, range.column, range.rows, range.columns};
    return "$" + quoted_sheet(range.sheet) + "." + absolute_area(area);
}

std::string quoted_sheet(const std::string& sheet) {
    std::string text = "'";
    for (char c : sheet) text += c == '\'' ? std::string("''") : std::string(1, c);
    return text + "'";
}

}  // namespace assoc::command
