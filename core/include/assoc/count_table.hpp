#pragma once
// A two-way table of counts read from a range of cells, with its labels and the
// facts a careful reader needs later: which rows/columns were set aside (empty, or totals of the
// others), how many blanks were read as zero, whether all counts are whole numbers, and what
// about the range was ambiguous.
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/matrix.hpp"

namespace assoc {

// A row or column of the body that takes no part in the tests: all its counts are zero, or it is
// a total of the others. It is only reported.
struct SetAside {
    enum class Why { no_counts, total };
    std::size_t index = 0;  // 0-based position in the body
    std::string label;      // its header label (trimmed), or "" when the range has none
    Why why = Why::no_counts;
    // Its 1-based row (column) in the range as selected, the header row (column) being row 1 when
    // there is one: how messages name a line that has no label.
    std::size_t range_number = 0;
};

struct ReadOptions {
    // Body cells allowed before reading stops with an error instead of exhausting memory.
    std::size_t max_body_cells = 1'000'000;
    // Whether a table needs at least 2 non-empty rows and 2 non-empty columns.
    bool require_two_by_two = true;
    // Whether the numbers must be counts: percentages or shares typed instead of counts (lines that
    // each add up to 100 or 1 with entries that are not whole) are refused. Off for expected shares.
    bool counts_only = true;
    // Whether total lines are looked for (see read_count_table). Off for tables whose labels are
    // data values, such as the levels of counted records.
    bool find_totals = true;
    // Whether lines that share a label are doubted (with find_totals). Off for stacked strata, whose
    // groups repeat their labels in every stratum.
    bool distinct_labels = true;
};

class CountTable {
public:
    // The counts of the rows and columns that take part, in their original order.
    const Matrix& counts() const { return every_row_kept_ && every_column_kept_ ? body_ : counts_; }
    std::size_t rows() const { return counts().rows(); }
    std::size_t columns() const { return counts().columns(); }
    double count(std::size_t row, std::size_t column) const { return counts()(row, column); }

    double total() const { return total_; }
    double row_total(std::size_t row) const { return row_totals_[row]; }
    double column_total(std::size_t column) const { return column_totals_[column]; }
    const std::vector<double>& row_totals() const { return row_totals_; }
    const std::vector<double>& column_totals() const { return column_totals_; }

    // Labels of the kept rows/columns, trimmed ("" where the range has no header).
    const std::vector<std::string>& row_labels() const { return every_row_kept_ ? body_row_labels_ : row_labels_; }
    const std::vector<std::string>& column_labels() const {
        return every_column_kept_ ? body_column_labels_ : column_labels_;
    }
    bool has_row_labels() const { return has_row_labels_; }
    bool has_column_labels() const { return has_column_labels_; }
    // Labels of every body row/column, set-aside ones included.
    const std::vector<std::string>& body_row_labels() const { return body_row_labels_; }
    const std::vector<std::string>& body_column_labels() const { return body_column_labels_; }

    // Shape of the body as it was in the range, before rows/columns were set aside.
    std::size_t body_rows() const { return body_rows_; }
    std::size_t body_columns() const { return body_columns_; }
    // The 1-based row (column) of the range that holds body row (column) `index`: messages count
    // rows and columns of the range as selected, a header row (column) being row (column) 1.
    std::size_t range_row(std::size_t index) const { return index + (has_column_labels_ ? 2 : 1); }
    std::size_t range_column(std::size_t index) const { return index + (has_row_labels_ ? 2 : 1); }
    // Body position of each kept row/column.
    const std::vector<std::size_t>& kept_rows() const { return every_row_kept_ ? category_rows_ : kept_rows_; }
    const std::vector<std::size_t>& kept_columns() const { return every_column_kept_ ? category_columns_ : kept_columns_; }
    const std::vector<SetAside>& set_aside_rows() const { return set_aside_rows_; }
    const std::vector<SetAside>& set_aside_columns() const { return set_aside_columns_; }
    // Body positions of the rows/columns that are not totals (empty ones included): the categories
    // of tables whose every category keeps its place (paired tables, strata, trends, one line of counts).
    const std::vector<std::size_t>& category_rows() const { return category_rows_; }
    const std::vector<std::size_t>& category_columns() const { return category_columns_; }
    // The counts of those rows and columns (zeros where a line is empty).
    Matrix category_counts() const;

    std::size_t blank_cells() const { return blank_cells_; }
    // Warnings about how the range was read that ASSOC.CHECK passes on (e.g. years read as counts).
    const std::vector<std::string>& reading_remarks() const { return reading_remarks_; }
    // What about the range is ambiguous (a line that holds the sum of the others but is labelled as
    // data, rows that each add up to 100): sentences that make the verdict on the table "Doubtful".
    const std::vector<std::string>& doubts() const { return doubts_; }
    bool whole_counts() const { return whole_counts_; }
    bool is_two_by_two() const { return rows() == 2 && columns() == 2; }

    // Spreads a result of the kept shape back to the body's shape; set-aside cells get `fill`.
    Matrix to_body_shape(const Matrix& kept, double fill = 0.0) const;

    // Builds a table straight from counts (no labels), for callers that already have numbers.
    static CountTable from_counts(const Matrix& counts, const ReadOptions& options = {});

private:
    friend CountTable read_count_table(const CellGrid&, const ReadOptions&);
    // `body_totals`: the sums of the body's rows, then of its columns, total lines left out;
    // `whole`: whether every count they add up is whole.
    // `total_rows`, `total_columns`: non-zero for a total line (char rather than bool: bit vectors
    // cost more than the sums in a small table).
    void finish(Matrix body, const ReadOptions& options, const std::vector<char>& total_rows,
                const std::vector<char>& total_columns, std::vector<double> body_totals, bool whole);

    // When no row (column) is set aside, the kept rows (columns) are the body's: counts(), the labels
    // and kept_rows() then hand out the body's own members, and the kept copies stay empty.
    bool every_row_kept_ = false, every_column_kept_ = false;
    Matrix counts_;
    Matrix body_;
    double total_ = 0.0;
    std::vector<double> row_totals_, column_totals_;
    std::vector<std::string> row_labels_, column_labels_;
    std::vector<std::string> body_row_labels_, body_column_labels_;
    bool has_row_labels_ = false, has_column_labels_ = false;
    std::size_t body_rows_ = 0, body_columns_ = 0;
    std::vector<std::size_t> kept_rows_, kept_columns_;
    std::vector<std::size_t> category_rows_, category_columns_;
    std::vector<SetAside> set_aside_rows_, set_aside_columns_;
    std::size_t blank_cells_ = 0;
    std::vector<std::string> reading_remarks_;
    std::vector<std::string> doubts_;
    bool whole_counts_ = true;
};

// Reads a count table from a range (see DEVELOPERS.md, "Reading a table"):
// - the first row is a header when all its cells are text or blank and one at least is text;
// - the first column below it is a header column by the same rule; labels are trimmed;
// - body cells are numbers; blanks count as 0; text, negative or non-finite numbers are errors
//   that name the cell by its 1-based row and column in the range;
// - total lines (see total_lines.hpp) are set aside when labelled as totals; a line without a
//   label that holds the sum of the others is refused; one labelled otherwise is kept and doubted;
// - percentages and shares typed instead of counts are refused (options.counts_only);
// - all-zero rows and columns are set aside; fewer than 2 non-empty rows or columns is an error.
CountTable read_count_table(const CellGrid& range, const ReadOptions& options = {});

}  // namespace assoc
