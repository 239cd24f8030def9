#include "sheet_plan.hpp"

#include <algorithm>
#include <stdexcept>

namespace assoc::command {
namespace {

// Placeholders are delimited by the ASCII unit separator, which no typed label holds.
constexpr char mark = '\x1F';

}  // namespace

void SheetPlan::text(std::size_t row, std::size_t column, std::string value, Look look) {
    entries_.push_back({Entry::Kind::text, Area{row, column}, std::move(value), 0.0, {}});
    looks_.push_back({Area{row, column}, look});
}

void SheetPlan::number(std::size_t row, std::size_t column, double value, Look look) {
    entries_.push_back({Entry::Kind::number, Area{row, column}, std::string(), value, {}});
    looks_.push_back({Area{row, column}, look});
}

void SheetPlan::formula(std::size_t row, std::size_t column, std::string formula, Look look) {
    entries_.push_back({Entry::Kind::formula, Area{row, column}, std::move(formula), 0.0, {}});
    looks_.push_back({Area{row, column}, look});
}

void SheetPlan::array_formula(const Area& area, std::string formula, Look look) {
    entries_.push_back({Entry::Kind::array_formula, area, std::move(formula), 0.0, {}});
    looks_.push_back({area, look});
}

void SheetPlan::formulas(const Area& area, std::vector<std::string> formulas, Look look) {
    if (formulas.size() != area.rows * area.columns) throw std::logic_error("a formula block of the wrong size");
    Entry entry{Entry::Kind::formula_block, area, std::string(), 0.0, std::move(formulas)};
    entries_.push_back(std::move(entry));
    looks_.push_back({area, look});
}

void SheetPlan::look(const Area& area, Look look) { looks_.push_back({area, look}); }

void SheetPlan::merge(const Area& area, std::size_t lines) { merges_.push_back({area, std::max<std::size_t>(lines, 1)}); }

std::string SheetPlan::placeholder(const std::string& name) { return std::string(1, mark) + name + mark; }

void SheetPlan::resolve() {
    for (Entry& entry : entries_) {
        for (std::string& formula : entry.block) resolve_in(formula);
        resolve_in(entry.content);
    }
}

void SheetPlan::resolve_in(std::string& text) const {
    for (std::size_t start = text.find(mark); start != std::string::npos; start = text.find(mark, start)) {
        const std::size_t end = text.find(mark, start + 1);
        if (end == std::string::npos) throw std::logic_error("an unfinished placeholder in " + text);
        const std::string name = text.substr(start + 1, end - start - 1);
        const auto found = names_.find(name);
        if (found == names_.end()) throw std::logic_error("no cell was named " + name);
        text.replace(start, end - start + 1, found->second);
        start += found->second.size();
    }
}

std::string Entry::at(std::size_t row, std::size_t column) const {
    if (row < area.row || row > area.last_row() || column < area.column || column > area.last_column()) return "";
    if (kind == Kind::formula_block) return block[(row - area.row) * area.columns + (column - area.column)];
    return row == area.row && column == area.column ? content : "";
}

std::string SheetPlan::content_at(std::size_t row, std::size_t column) const {
    for (const Entry& entry : entries_) {
        const std::string text = entry.at(row, column);
        if (!text.empty()) return text;
    }
    return "";
}

const Entry* SheetPlan::entry_at(std::size_t row, std::size_t column) const {
    for (const Entry& entry : entries_)
        if (entry.area.row == row && entry.area.column == column) return &entry;
    return nullptr;
}

std::size_t SheetPlan::rows_used() const {
    std::size_t rows = 0;
    for (const Entry& entry : entries_) rows = std::max(rows, entry.area.last_row() + 1);
    if (chart_) rows = std::max(rows, chart_->anchor.last_row() + 1);
    return rows;
}

std::size_t SheetPlan::columns_used() const {
    std::size_t columns = 0;
    for (const Entry& entry : entries_) columns = std::max(columns, entry.area.last_column() + 1);
    for (const auto& merge : merges_) columns = std::max(columns, merge.first.last_column() + 1);
    if (chart_) columns = std::max(columns, chart_->anchor.last_column() + 1);
    return columns;
}

std::string column_letters(std::size_t column) {
    std::string name;
    for (std::size_t index = column + 1; index > 0; index = (index - 1) / 26)
        name.insert(name.begin(), static_cast<char>('A' + (index - 1) % 26));
    return name;
}

std::string absolute_cell(std::size_t row, std::size_t column) {
    return "$" + column_letters(column) + "$" + std::to_string(row + 1);
}

std::string absolute_area(const Area& area) {
    const std::string first = absolute_cell(area.row, area.column);
    if (area.rows == 1 && area.columns == 1) return first;
    return first + ":" + absolute_cell(area.last_row(), area.last_column());
}

std::string string_literal(const std::string& text) {
    std::string literal = "\"";
    for (char c : text) literal += c == '"' ? std::string("\"\"") : std::string(1, c);
    return literal + "\"";
}

}  // namespace assoc::command
