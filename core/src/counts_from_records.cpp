#include "assoc/counts_from_records.hpp"

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <limits>

#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "assoc/levels.hpp"
#include "assoc/wording.hpp"
#include "cell_line.hpp"
#include "level_index.hpp"
#include "record_span.hpp"

namespace assoc {
namespace {

std::string count_text(std::size_t n) { return format_count(static_cast<double>(n)); }

std::string plural(std::size_t n, const std::string& word) { return count_text(n) + " " + word + (n == 1 ? "" : "s"); }

// The weights of the records, one per position of the ranges as given; positions past the cells that
// arrived (a range without its trailing blanks) are blank.
class Weights {
public:
    explicit Weights(const CellGrid& grid) : grid_(grid) {
        if (grid.empty()) return;
        detail::require_single_line(grid.given_rows(), grid.given_columns(), "weights");
        along_row_ = grid.given_rows() == 1 && grid.given_columns() > 1;
        length_ = along_row_ ? grid.given_columns() : grid.given_rows();
        present_ = along_row_ ? grid.columns() : grid.rows();
        if ((along_row_ ? grid.rows() : grid.columns()) != 1) present_ = 0;  // shape checked above
    }
    bool given() const { return !grid_.empty(); }
    std::size_t length() const { return length_; }
    // One past the last cell that arrived and is not blank.
    std::size_t end() const {
        std::size_t end = present_;
        while (end > 0 && (*this)[end - 1].is_blank()) --end;
        return end;
    }
    const Cell& operator[](std::size_t i) const {
        static const Cell blank;
        if (i >= present_) return blank;
        return along_row_ ? grid_.at(0, i) : grid_.at(i, 0);
    }

private:
    const CellGrid& grid_;
    bool along_row_ = false;
    std::size_t length_ = 0, present_ = 0;
};

// The weight of record `i`, checked: a finite number of 0 or more (a blank is handled by the caller).
// The message is only built on failure, since this runs once per record.
double checked_weight(const Cell& cell, const CodedLabels& shape, std::size_t i) {
    if (cell.is_number() && std::isfinite(cell.as_number()) && cell.as_number() >= 0) return cell.as_number();
    const std::string where = "the weight in " + detail::record_place(shape, i);
    if (cell.is_number() && cell.as_number() < 0)
        throw Error(where + " is " + format_number(cell.as_number(), 15) + "; a weight says how many people or items a "
                    "record stands for, so it cannot be negative (leave out a record that undoes another, such as a "
                    "credit note, or net the two)");
    throw Error(where + " holds " + cell.describe() + "; weights must be numbers of 0 or more");
}

// Before/after answers or two raters' verdicts counted into a table are read by ASSOC.PAIRED by
// position: row i and column i must be the same category. Each side's levels are its own, so when
// the two sides share some labels but not all (nobody answered "Neutral" afterwards) the positions
// no longer match, and a paired test of the table would compare different categories. Said here,
// since the table itself carries no labels.
std::string partial_overlap_remark(const std::vector<Cell>& rows, const std::vector<Cell>& columns) {
    std::vector<std::string> row_texts, column_texts, shared, rows_only, columns_only;
    for (const Cell& level : rows) row_texts.push_back(level_text(level));
    for (const Cell& level : columns) column_texts.push_back(level_text(level));
    const auto holds = [](const std::vector<std::string>& texts, const std::string& text) {
        return std::find(texts.begin(), texts.end(), text) != texts.end();
    };
    for (const std::string& text : row_texts) (holds(column_texts, text) ? shared : rows_only).push_back(text);
    for (const std::string& text : column_texts)
        if (!holds(row_texts, text)) columns_only.push_back(text);
    if (shared.empty() || (rows_only.empty() && columns_only.empty())) return "";
    const auto quoted = [](const std::vector<std::string>& texts) {
        std::vector<std::string> labels;
        for (const std::string& text : texts) labels.push_back(quoted_label(text));
        return name_list(labels);
    };
    std::string remark = "The row and column labels share " + quoted(shared) + " but not ";
    if (!rows_only.empty()) remark += quoted(rows_only) + " (rows only)";
    if (!rows_only.empty() && !columns_only.empty()) remark += " and ";
    if (!columns_only.empty()) remark += quoted(columns_only) + " (columns only)";
    return remark + ", so row k and column k are not always the same category: if the two ranges hold the same "
                    "people's answers twice (before and after, two raters), the paired test (ASSOC.PAIRED) would "
                    "compare different categories; give both sides every label with an order range, as in "
                    "ASSOC.COUNTS(B2:B81; C2:C81; ; H1:H5) with the labels listed in H1:H5.";
}

// A side whose every label names a single record (IDs, names, dates of each record) holds no
// categories: each row (column) would be a group of one, and the test would say nothing about any
// group. Refused from 5 records counted; weighted records may each stand for many people, and pass.
void refuse_labels_of_one(const RecordCounts& counted) {
    constexpr std::size_t fewest = 5;
    if (counted.records - counted.skipped_blank < fewest) return;
    const Matrix& counts = counted.counts;
    for (const bool rows : {true, false}) {
        const std::size_t lines = rows ? counts.rows() : counts.columns();
        const std::size_t length = rows ? counts.columns() : counts.rows();
        bool single = true;
        for (std::size_t i = 0; i < lines && single; ++i) {
            double sum = 0;
            for (std::size_t k = 0; k < length; ++k) sum += rows ? counts(i, k) : counts(k, i);
            single = sum <= 1;
        }
        if (!single) continue;
        const std::vector<Cell>& levels = rows ? counted.row_levels : counted.column_levels;
        std::vector<std::string> examples;
        for (std::size_t i = 0; i < levels.size() && examples.size() < 2; ++i)
            examples.push_back(quoted_label(level_text(levels[i])));
        const char* side = rows ? "row" : "column";
        throw Error(std::string("every record has a ") + side + " label of its own (" + examples[0] +
                    (examples.size() > 1 ? ", " + examples[1] : std::string()) + ", …), as IDs, names or dates do, so each " + side + " would be a group of one and the test would "
                    "say nothing about any group; count by a column that records share, such as a department or an "
                    "outcome");
    }
}

}  // namespace

RecordCounts counts_from_records(const CodedLabels& row_labels, const CodedLabels& column_labels,
                                 const CellGrid& weights, const LevelOrdering& order, const TextCollation& collation,
                                 std::size_t max_cells) {
    detail::CodedLevels rows(row_labels, "row labels");
    detail::CodedLevels columns(column_labels, "column labels");
    require(rows.records() == columns.records(),
            "the row labels (" + plural(rows.records(), "cell") + ") and the column labels (" +
                plural(columns.records(), "cell") + ") must be equally long: one pair of labels per record");
    const std::size_t given = rows.records();
    require(given < std::numeric_limits<std::uint32_t>::max(), "there are too many records to count");
    const Weights weight_of(weights);
    const bool weighted = weight_of.given();
    if (weighted)
        require(weight_of.length() == given, "the weights (" + plural(weight_of.length(), "cell") +
                                                 ") must be as long as the labels (" + plural(given, "cell") + ")");
    const detail::RecordSpan span = detail::record_span({&row_labels, &column_labels},
                                                        weighted ? &weight_of[0] : nullptr, weighted ? weight_of.end() : 0);

    RecordCounts result;
    result.records = span.end - span.first;
    result.header_left_out = span.header;
    result.weighted = weighted;
    result.along_row = row_labels.rows == 1 && row_labels.columns > 1;
    require(result.records > 0, "every record has a blank label, so there is nothing to count");

    // First pass: each record's labels become levels. A label is a level even when the other label
    // of its record is blank, so that the table has a row (or column) for every label of the range,
    // as distinct_levels lists them; such a row holds zeros when all its records were skipped.
    constexpr std::uint32_t skipped = detail::CodedLevels::skipped;
    std::vector<std::uint32_t> row_of(span.end), column_of(span.end);
    for (std::size_t i = span.first; i < span.end; ++i) {
        row_of[i] = rows.level(i);
        column_of[i] = columns.level(i);
        if (row_of[i] == skipped || column_of[i] == skipped) {
            row_of[i] = skipped;
            ++result.skipped_blank;
        }
    }
    require(result.skipped_blank < result.records, "every record has a blank label, so there is nothing to count");
    // A listed order orders the side(s) whose labels it lists; a side of which it lists none is sorted.
    std::vector<std::string> order_remarks;
    const auto side_order = [&](detail::LevelIndex& index, const char* what) {
        if (order.order != LevelOrder::listed) return order;
        if (!index.any_listed(order)) {
            order_remarks.push_back(std::string("The order lists none of the ") + what + ", so they were sorted.");
            return LevelOrdering(LevelOrder::sorted);
        }
        const std::string unused = index.add_listed(order, what);
        if (!unused.empty()) order_remarks.push_back(unused);
        return order;
    };
    const LevelOrdering row_order = side_order(rows.index(), "row labels");
    const LevelOrdering column_order = side_order(columns.index(), "column labels");
    require(row_order.order == order.order || column_order.order == order.order,
            "the order lists none of the row labels and none of the column labels; list the labels of the rows or "
            "of the columns in the wanted order");
    const detail::LevelIndex& row_index = rows.index();
    const detail::LevelIndex& column_index = columns.index();

    const double cells = static_cast<double>(row_index.size()) * static_cast<double>(column_index.size());
    require(cells <= static_cast<double>(max_cells),
            "the labels give " + plural(row_index.size(), "row level") + " and " +
                plural(column_index.size(), "column level") + ", a table of " + format_count(cells) +
                " cells; Assoc builds tables of at most " + count_text(max_cells) + " cells");

    // Second, allocation-free pass: add each record to its cell at the listed position.
    const std::vector<std::uint32_t> row_position = row_index.positions(row_order, collation);
    const std::vector<std::uint32_t> column_position = column_index.positions(column_order, collation);
    result.counts = Matrix(row_index.size(), column_index.size());
    for (std::size_t i = span.first; i < span.end; ++i) {
        if (row_of[i] == skipped) continue;
        double weight = 1.0;
        if (weighted) {
            const Cell& cell = weight_of[i];
            if (cell.is_blank()) {
                ++result.skipped_weight;
                result.blank_weight_places.push_back(i + 1);
                continue;
            }
            weight = checked_weight(cell, row_labels, i);
            if (weight == 0) ++result.zero_weight;
        }
        result.counts(row_position[row_of[i]], column_position[column_of[i]]) += weight;
    }
    require(result.skipped_blank + result.skipped_weight < result.records,
            "every record has a blank label or a blank weight, so there is nothing to count");

    for (double count : result.counts.values()) {
        result.total += count;
        result.whole_counts = result.whole_counts && count == std::floor(count);
    }
    require(std::isfinite(result.total), "the weights add up to more than a spreadsheet number can hold");
    result.row_levels = row_index.listed(row_order, collation);
    result.column_levels = column_index.listed(column_order, collation);
    if (!weighted) refuse_labels_of_one(result);
    result.remarks = span.remarks;
    for (std::string& remark : order_remarks) result.remarks.push_back(std::move(remark));
    for (std::string& remark : row_index.lookalike_remarks("row labels")) result.remarks.push_back(std::move(remark));
    for (std::string& remark : column_index.lookalike_remarks("column labels")) result.remarks.push_back(std::move(remark));
    std::string overlap = partial_overlap_remark(result.row_levels, result.column_levels);
    if (!overlap.empty()) result.remarks.push_back(std::move(overlap));
    return result;
}

RecordCounts counts_from_records(const CellGrid& row_labels, const CellGrid& column_labels, const CellGrid& weights,
                                 const LevelOrdering& order, const TextCollation& collation, std::size_t max_cells) {
    return counts_from_records(code_labels(row_labels), code_labels(column_labels), weights, order, collation,
                               max_cells);
}

std::string RecordCounts::feedback() const {
    const std::size_t skipped = skipped_blank + skipped_weight;
    const std::size_t counted = records - skipped;
    std::string text = "Counted " + (skipped > 0 ? count_text(counted) + " of " : std::string()) +
                       plural(records, "record") + " into " + plural(row_levels.size(), "row level") + " and " +
                       plural(column_levels.size(), "column level") + ".";
    if (skipped_blank > 0)
        text += " " + plural(skipped_blank, "record") + (skipped_blank == 1 ? " has" : " have") +
                " a blank label and " + (skipped_blank == 1 ? "was" : "were") + " skipped.";
    if (skipped_weight > 0)
        text += " " + plural(skipped_weight, "record") + (skipped_weight == 1 ? " has" : " have") + " a blank weight (" +
                numbered_lines(along_row ? "column" : "row", blank_weight_places) + " of the ranges) and " +
                (skipped_weight == 1 ? "was" : "were") + " skipped; give a weight of 0 to leave a record out on purpose.";
    if (weighted) {
        text += " The weights add up to " + format_count(total) + ".";
        if (zero_weight > 0)
            text += " " + plural(zero_weight, "record") + (zero_weight == 1 ? " has" : " have") + " a weight of 0.";
        text += " A weight counts its record that many times, so it must be a frequency weight (the number of people "
                "or items the record stands for), never an amount such as pay or an invoice value: the tests read "
                "the weighted counts as counts of independent cases.";
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
    ReadOptions as_levels = options;
    as_levels.find_totals = false;  // the labels are levels of the records, not the rows of a table with totals
    return read_count_table(grid, as_levels);
}

}  // namespace assoc
