#pragma once
// A spreadsheet cell as the core sees it: blank, a number or a text.
// Used for what arrives from a range and for what goes back into cells.
#include <cstddef>
#include <string>
#include <vector>

namespace assoc {

class Cell {
public:
    enum class Kind { blank, number, text };

    Cell() = default;  // blank
    static Cell blank() { return Cell(); }
    static Cell number(double value) { Cell c; c.kind_ = Kind::number; c.number_ = value; return c; }
    static Cell text(std::string value) { Cell c; c.kind_ = Kind::text; c.text_ = std::move(value); return c; }

    Kind kind() const { return kind_; }
    bool is_blank() const { return kind_ == Kind::blank; }
    bool is_number() const { return kind_ == Kind::number; }
    bool is_text() const { return kind_ == Kind::text; }
    double as_number() const { return number_; }
    const std::string& as_text() const { return text_; }

    // Plain words for messages: a blank, the number -3, the text "n/a".
    std::string describe() const;

    friend bool operator==(const Cell& a, const Cell& b) {
        return a.kind_ == b.kind_ && (a.kind_ != Kind::number || a.number_ == b.number_) && a.text_ == b.text_;
    }
    friend bool operator!=(const Cell& a, const Cell& b) { return !(a == b); }

private:
    Kind kind_ = Kind::blank;
    double number_ = 0.0;
    std::string text_;
};

// A rectangular block of cells, stored row by row.
class CellGrid {
public:
    CellGrid() = default;
    CellGrid(std::size_t rows, std::size_t columns) : rows_(rows), columns_(columns), cells_(rows * columns) {}
    // Builds a grid from rows of equal length (handy in tests); throws Error on ragged rows.
    static CellGrid from_rows(const std::vector<std::vector<Cell>>& rows);

    std::size_t rows() const { return rows_; }
    std::size_t columns() const { return columns_; }
    bool empty() const { return rows_ == 0 || columns_ == 0; }
    // The shape of the range as it was given, before the adapter left out its trailing blank rows and
    // columns: a whole sheet column (A:A) keeps the sheet's height here. Equal to rows() and columns()
    // unless set.
    std::size_t given_rows() const { return given_rows_ > rows_ ? given_rows_ : rows_; }
    std::size_t given_columns() const { return given_columns_ > columns_ ? given_columns_ : columns_; }
    void set_given_shape(std::size_t rows, std::size_t columns) {
        given_rows_ = rows;
        given_columns_ = columns;
    }
    Cell& at(std::size_t row, std::size_t column) { return cells_[row * columns_ + column]; }
    // The cells row by row.
    std::vector<Cell>::const_iterator begin() const { return cells_.begin(); }
    std::vector<Cell>::const_iterator end() const { return cells_.end(); }
    const Cell& at(std::size_t row, std::size_t column) const { return cells_[row * columns_ + column]; }

private:
    std::size_t rows_ = 0;
    std::size_t columns_ = 0;
    std::size_t given_rows_ = 0, given_columns_ = 0;
    std::vector<Cell> cells_;
};

}  // namespace assoc
