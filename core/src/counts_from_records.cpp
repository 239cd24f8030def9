#include "assoc/counts_from_records.hpp"

#include <cmath>
#include <cstdint>
#include <limits>
#include <optional>

#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "cell_line.hpp"
#include "level_index.hpp"

namespace assoc {
namespace {

std::string count_text(std::size_t n) { return format_count(static_cast<double>(n)); }

std::string plural(std::size_t n, const std::string& word) { return count_text(n) + " " + word + (n == 1 ? "" : "s"); }

// The weight of record `i`, checked: a finite number of 0 or more. The message is only built
// on failure, since this runs once per record.
double checked_weight(const Cell& cell, std::size_t i, std::size_t length) {
    if (cell.is_number() && std::isfinite(cell.as_number()) && cell.as_number() >= 0) return cell.as_number();
    const std::string where = "weight " + count_text(i + 1) + " of " + count_text(length);
    if (cell.is_blank()) throw Error(where + " is blank; give every record a weight (0 leaves it out)");
    throw Error(where + " holds " + cell.describe() + "; weights must be numbers of 0 or more");
}

}  // namespace

RecordCounts counts_from_records(const CodedLabels& row_labels, const CodedLabels& column_labels,
                                 const CellGrid& weights, LevelOrder order, const TextCollation& collation,
                                 std::size_t max_cells) {
    detail::CodedLevels rows(row_labels, "row labels");
    detail::CodedLevels columns(column_labels, "column labels");
    require(rows.records() == columns.records(),
            "the row labels (" + plural(rows.records(), "cell") + ") and the column labels (" +
                plural(columns.records(), "cell") + ") must be equally long: one pair of labels per record");
    const std::size_t n = rows.records();
    require(n < std::numeric_limits<std::uint32_t>::max(), "there are too many records to count");
    const bool weighted = !weights.empty();
    std::optional<detail::CellLine> weight_line;
    if (weighted) {
        weight_line.emplace(weights, "weights");
        require(weight_line->size() == n, "the weights (" + plural(weight_line->size(), "cell") +
                                              ") must be as long as the labels (" + plural(n, "cell") + ")");
    }

    RecordCounts result;
    result.records = n;
    result.weighted = weighted;

    // First pass: each record's labels become levels. A label is a level even when the other label
    // of its record is blank, so that the table has a row (or column) for every label of the range,
    // as distinct_levels lists them; such a row holds zeros when all its records were skipped.
    constexpr std::uint32_t skipped = detail::CodedLevels::skipped;
    std::vector<std::uint32_t> row_of(n), column_of(n);
    for (std::size_t i = 0; i < n; ++i) {
        row_of[i] = rows.level(i);
        column_of[i] = columns.level(i);
        if (row_of[i] == skipped || column_of[i] == skipped) {
            row_of[i] = skipped;
            ++result.skipped_blank;
        }
    }
    require(result.skipped_blank < n, "every record has a blank label, so there is nothing to count");
    const detail::LevelIndex& row_index = rows.index();
    const detail::LevelIndex& column_index = columns.index();

    const double cells = static_cast<double>(row_index.size()) * static_cast<double>(column_index.size());
    require(cells <= static_cast<double>(max_cells),
            "the labels give " + plural(row_index.size(), "row level") + " and " +
                plural(column_index.size(), "column level") + ", a table of " + format_count(cells) +
                " cells; Assoc builds tables of at most " + count_text(max_cells) + " cells");

    // Second, allocation-free pass: add each record to its cell at the listed position.
    const std::vector<std::uint32_t> row_position = row_index.positions(order, collation);
    const std::vector<std::uint32_t> column_position = column_index.positions(order, collation);
    result.counts = Matrix(row_index.size(), column_index.size());
    for (std::size_t i = 0; i < n; ++i) {
        if (row_of[i] == skipped) continue;
        double weight = 1.0;
        if (weighted) {
            weight = checked_weight((*weight_line)[i], i, n);
            if (weight == 0) ++result.zero_weight;
        }
        result.counts(row_position[row_of[i]], column_position[column_of[i]]) += weight;
    }

    for (double count : result.counts.values()) {
        result.total += count;
        result.whole_counts = result.whole_counts && count == std::floor(count);
    }
    require(std::isfinite(result.total), "the weights add up to more than a spreadsheet number can hold");
    result.row_levels = row_index.listed(order, collation);
    result.column_levels = column_index.listed(order, collation);
    result.remarks = row_index.lookalike_remarks("row labels");
    for (std::string& remark : column_index.lookalike_remarks("column labels")) result.remarks.push_back(std::move(remark));
    return result;
}

RecordCounts counts_from_records(const CellGrid& row_labels, const CellGrid& column_labels, const CellGrid& weights,
                                 LevelOrder order, const TextCollation& collation, std::size_t max_cells) {
    return counts_from_records(code_labels(row_labels), code_labels(column_labels), weights, order, collation,
                               max_cells);
}

std::string RecordCounts::feedback() const {
    const std::size_t counted = records - skipped_blank;
    std::string text = "Counted " + (skipped_blank > 0 ? count_text(counted) + " of " : std::string()) +
                       plural(records, "record") + " into " + plural(row_levels.size(), "row level") + " and " +
                       plural(column_levels.size(), "column level") + ".";
    if (skipped_blank > 0)
        text += " " + plural(skipped_blank, "record") + (skipped_blank == 1 ? " has" : " have") +
                " a blank label and " + (skipped_blank == 1 ? "was" : "were") + " skipped.";
    if (weighted) {
        text += " The weights add up to " + format_count(total) + ".";
        if (zero_weight > 0)
            text += " " + plural(zero_weight, "record") + (zero_weight == 1 ? " has" : " have") + " a weight of 0.";
        if (!whole_counts) text += " Some counts are not whole numbers; exact tests need whole counts.";
    }
    for (const std::string& remark : remarks) text += " " + remark;
    return text;
}

CountTable RecordCounts::table(const ReadOptions& options) const {
    CellGrid grid(row_levels.size() + 1, column_levels.size() + 1);
    for (std::size_t c = 0; c < column_levels.size(); ++c) grid.at(0, c + 1) = Cell::text(level_text(column_levels[c]));
    for (std::size_t r = 0; r < row_levels.size(); ++r) {
        grid.at(r + 1, 0) = Cell::text(level_text(row_levels[r]));
        for (std::size_t c = 0; c < column_levels.size(); ++c) grid.at(r + 1, c + 1) = Cell::number(counts(r, c));
    }
    return read_count_table(grid, options);
}

}  // namespace assoc
