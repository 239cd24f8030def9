#pragma once
// A two-way table of counts read from a range of cells, with its labels and the
// facts a careful reader needs later: which rows/columns were empty and set aside,
// how many blanks were read as zero, whether all counts are whole numbers.
#include <cstddef>
#include <string>
#include <vector>

#include "assoc/cell.hpp"
#include "assoc/matrix.hpp"

namespace assoc {

// A row or column of the body whose counts are all zero. It takes no part in totals,
// degrees of freedom or tests; it is only reported.
struct SetAside {
    std::size_t index = 0;  // 0-based position in the body
    std::string label;      // its header label, or "" when the range has none
};

struct ReadOptions {
    // Body cells allowed before reading stops with an error instead of exhausting memory.
    std::size_t max_body_cells = 1'000'000;
    // Whether a table needs at least 2 non-empty rows and 2 non-empty columns.
    bool require_two_by_two = true;
};

class CountTable {
public:
    // The counts of the non-empty rows and columns, in their original order.
    const Matrix& counts() const { return counts_; }
    std::size_t rows() const { return counts_.rows(); }
    std::size_t columns() const { return counts_.columns(); }
    double count(std::size_t row, std::size_t column) const { return counts_(row, column); }

    double total() const { return total_; }
    double row_total(std::size_t row) const { return row_totals_[row]; }
    double column_total(std::size_t column) const { return column_totals_[column]; }
    const std::vector<double>& row_totals() const { return row_totals_; }
    const std::vector<double>& column_totals() const { return column_totals_; }

    // Labels of the kept rows/columns ("" where the range has no header).
    const std::vector<std::string>& row_labels() const { return row_labels_; }
    const std::vector<std::string>& column_labels() const { return column_labels_; }
    bool has_row_labels() const { return has_row_labels_; }
    bool has_column_labels() const { return has_column_labels_; }

    // Shape of the body as it was in the range, before empty rows/columns were set aside.
    std::size_t body_rows() const { return body_rows_; }
    std::size_t body_columns() const { return body_columns_; }
    // Body position of each kept row/column.
    const std::vector<std::size_t>& kept_rows() const { return kept_rows_; }
    const std::vector<std::size_t>& kept_columns() const { return kept_columns_; }
    const std::vector<SetAside>& set_aside_rows() const { return set_aside_rows_; }
    const std::vector<SetAside>& set_aside_columns() const { return set_aside_columns_; }

    std::size_t blank_cells() const { return blank_cells_; }
    // Warnings about how the range was read that ASSOC.CHECK passes on (e.g. years read as counts).
    const std::vector<std::string>& reading_remarks() const { return reading_remarks_; }
    bool whole_counts() const { return whole_counts_; }
    bool is_two_by_two() const { return rows() == 2 && columns() == 2; }

    // Spreads a result of the kept shape back to the body's shape; set-aside cells get `fill`.
    Matrix to_body_shape(const Matrix& kept, double fill = 0.0) const;

    // Builds a table straight from counts (no labels), for callers that already have numbers.
    static CountTable from_counts(const Matrix& counts, const ReadOptions& options = {});

private:
    friend CountTable read_count_table(const CellGrid&, const ReadOptions&);
    void finish(const Matrix& body, const ReadOptions& options);

    Matrix counts_;
    double total_ = 0.0;
    std::vector<double> row_totals_, column_totals_;
    std::vector<std::string> row_labels_, column_labels_;
    std::vector<std::string> body_row_labels_, body_column_labels_;
    bool has_row_labels_ = false, has_column_labels_ = false;
    std::size_t body_rows_ = 0, body_columns_ = 0;
    std::vector<std::size_t> kept_rows_, kept_columns_;
    std::vector<SetAside> set_aside_rows_, set_aside_columns_;
    std::size_t blank_cells_ = 0;
    std::vector<std::string> reading_remarks_;
    bool whole_counts_ = true;
};

// Reads a count table from a range (see DEVELOPERS.md, "Reading a table"):
// - the first row is a header when all its cells are text or blank and one at least is text;
// - the first column below it is a header column by the same rule;
// - body cells are numbers; blanks count as 0; text, negative or non-finite numbers are errors
//   that name the cell by its 1-based row and column in the range;
// - all-zero rows and columns are set aside; fewer than 2 non-empty rows or columns is an error.
CountTable read_count_table(const CellGrid& range, const ReadOptions& options = {});

}  // namespace assoc
