#pragma once
// A sheet described as data, before anything touches a document: which cells get which text or
// formula, how they look, which blocks are merged, where the colour scale and the chart go. The
// blocks of analysis_sheet.cpp write into a SheetPlan; uno/sheet_writer.cpp carries it out on a
// new sheet. Plain C++ (no UNO), so layouts are unit-tested without an office.
#include <cstddef>
#include <map>
#include <optional>
#include <string>
#include <vector>

namespace assoc::command {

// A block of cells of the new sheet; 0-based.
struct Area {
    std::size_t row = 0;
    std::size_t column = 0;
    std::size_t rows = 1;
    std::size_t columns = 1;

    std::size_t last_row() const { return row + rows - 1; }
    std::size_t last_column() const { return column + columns - 1; }
};

// How a cell looks; the writer turns each into cell properties (colours from palette.hpp).
enum class Look {
    title,      // the sheet's title
    note,       // grey explanations
    section,    // a section heading
    header,     // a row of column labels, ruled below
    label,      // the label of a line
    text,       // a sentence (wrapped)
    caution,    // the cautions (wrapped, dark red)
    input,      // a value the user may change (alpha)
    count,      // counts: whole numbers with separators, decimals when there are any
    decimal,    // expected counts, statistics: 2 decimals
    strength,   // Cramér's V and such: 3 decimals
    p_value,    // 4 decimals, scientific below 0.0001
    residual,   // signed, 2 decimals
    percent,    // 0.0%
    whole,      // 0 decimals
    key_low,    // the heat map's key: its three colours
    key_middle,
    key_high,
};

struct Entry {
    enum class Kind { text, number, formula, array_formula, formula_block };
    Kind kind = Kind::text;
    Area area;            // one cell, or the block of an array formula or a formula block
    std::string content;  // a text, or a formula in English names with ";" separators
    double number = 0.0;  // the value of a number entry
    std::vector<std::string> block;  // a formula block: one formula per cell, row by row

    // The formula or text of the cell (row, column) of this entry ("" outside it; an array
    // formula's for its first cell only).
    std::string at(std::size_t row, std::size_t column) const;
};

struct ChartPlan {
    std::string name;    // unique in the document (the writer makes it so)
    std::string title;
    Area data;           // first row: series names; first column: categories
    Area anchor;         // the cells the chart covers
};

class SheetPlan {
public:
    void text(std::size_t row, std::size_t column, std::string value, Look look = Look::label);
    void number(std::size_t row, std::size_t column, double value, Look look);
    void formula(std::size_t row, std::size_t column, std::string formula, Look look);
    void array_formula(const Area& area, std::string formula, Look look);
    // A block of ordinary formulas, one per cell (row by row), written in one go: one step of
    // Calc's undo list instead of one per cell (see uno/sheet_writer.cpp on undo).
    void formulas(const Area& area, std::vector<std::string> formulas, Look look);
    void look(const Area& area, Look look);
    // Merges the area and wraps its text over `lines` lines of height.
    void merge(const Area& area, std::size_t lines = 1);
    void colour_scale(const Area& area) { colour_scales_.push_back(area); }
    // Rows grouped into an outline and collapsed (the user opens them with the + in the margin).
    void collapse_rows(std::size_t first, std::size_t count) { collapsed_.push_back(Area{first, 0, count, 1}); }
    void chart(ChartPlan chart) { chart_ = std::move(chart); }
    void column_width(std::size_t column, double millimetres) { column_widths_[column] = millimetres; }

    // Figures that blocks refer to before (or after) they are placed: a formula may hold
    // placeholder(name); resolve() replaces each with the address given to name().
    static std::string placeholder(const std::string& name);
    void name(const std::string& name, const std::string& address) { names_[name] = address; }
    bool has_name(const std::string& name) const { return names_.count(name) > 0; }
    // Replaces every placeholder; throws std::logic_error for one without an address (a bug).
    void resolve();

    const std::vector<Entry>& entries() const { return entries_; }
    const std::vector<std::pair<Area, Look>>& looks() const { return looks_; }
    const std::vector<std::pair<Area, std::size_t>>& merges() const { return merges_; }
    const std::vector<Area>& colour_scales() const { return colour_scales_; }
    const std::vector<Area>& collapsed_rows() const { return collapsed_; }
    const std::optional<ChartPlan>& chart() const { return chart_; }
    const std::map<std::size_t, double>& column_widths() const { return column_widths_; }
    // The entry whose area starts at (row, column), or nullptr.
    const Entry* entry_at(std::size_t row, std::size_t column) const;
    // The formula or text written into the cell (row, column), "" for none.
    std::string content_at(std::size_t row, std::size_t column) const;
    std::size_t rows_used() const;
    std::size_t columns_used() const;

private:
    void resolve_in(std::string& text) const;

    std::vector<Entry> entries_;
    std::vector<std::pair<Area, Look>> looks_;
    std::vector<std::pair<Area, std::size_t>> merges_;
    std::vector<Area> colour_scales_;
    std::vector<Area> collapsed_;
    std::optional<ChartPlan> chart_;
    std::map<std::size_t, double> column_widths_;
    std::map<std::string, std::string> names_;
};

// References as formulas write them.
std::string column_letters(std::size_t column);                  // 0 → "A", 27 → "AB"
std::string absolute_cell(std::size_t row, std::size_t column);  // "$B$12"
std::string absolute_area(const Area& area);                     // "$B$12:$D$14" (or one cell)
// A text as a formula's string literal: "say ""hi""".
std::string string_literal(const std::string& text);

}  // namespace assoc::command
