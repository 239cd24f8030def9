// Fuzz target: counting raw records (two label ranges and optional weights) and listing levels,
// by both routes the add-in can take: cells (CellGrid) and labels in dictionary form (CodedLabels,
// built here as the add-in builds them, where one label may arrive as several spellings).
// Input: section 1, the row labels; section 2, the column labels; section 3, the weights (may be
// empty); section 4 may give the order word, and "whole" in its second cell makes the label ranges
// whole sheet columns (or rows) that lost their trailing blanks, as the add-in reads A:A.
// Checks: only assoc::Error leaves the core; both routes give the same table, levels, feedback and
// errors; the counts are those of a plain recount, record by record (texts trimmed, blank labels and
// blank weights skipped, a header and the trailing blanks left out); the levels are distinct; the
// table built from the counts reads back with the same total.
#include <cmath>

#include "assoc/coded_labels.hpp"
#include "assoc/counts_from_records.hpp"
#include "assoc/levels.hpp"
#include "assoc/wording.hpp"
#include "fuzz_support.hpp"

using namespace assoc;
using namespace assoc::fuzz;

namespace {

// Labels are trimmed (levels.hpp): "Sales " is the level "Sales", and a text of spaces is blank.
bool blank_label(const Cell& cell) { return cell.is_blank() || (cell.is_text() && trimmed_label(cell.as_text()).empty()); }

bool same_level(const Cell& a, const Cell& b) {
    if (a.kind() != b.kind()) return false;
    return a.is_number() ? a.as_number() == b.as_number() : trimmed_label(a.as_text()) == trimmed_label(b.as_text());
}

// The labels as the add-in codes them, except that a label seen before gets a new spelling now and
// then (the add-in does so when Calc hands equal texts over as different strings).
CodedLabels coded_like_the_add_in(const CellGrid& grid, unsigned& random) {
    CodedLabels coded;
    coded.rows = grid.given_rows() == 1 || grid.given_columns() == 1 ? grid.given_rows() : grid.rows();
    coded.columns = grid.given_rows() == 1 || grid.given_columns() == 1 ? grid.given_columns() : grid.columns();
    coded.whole_line = is_whole_line(grid.given_rows(), grid.given_columns());
    for (std::size_t r = 0; r < grid.rows(); ++r)
        for (std::size_t c = 0; c < grid.columns(); ++c) {
            const Cell& cell = grid.at(r, c);
            if (blank_label(cell)) {
                coded.codes.push_back(CodedLabels::blank);
                continue;
            }
            random = random * 1103515245u + 12345u;
            std::uint32_t code = static_cast<std::uint32_t>(coded.spellings.size());
            // The add-in gives one spelling to equal texts (exactly equal: " North" is another) and numbers.
            if ((random >> 16) % 4 != 0)
                for (std::uint32_t s = 0; s < coded.spellings.size(); ++s)
                    if (coded.spellings[s] == (cell.is_number() ? Cell::number(cell.as_number() + 0.0) : cell)) {
                        code = s;
                        break;
                    }
            if (code == coded.spellings.size())
                coded.spellings.push_back(cell.is_number() ? Cell::number(cell.as_number() + 0.0) : cell);
            coded.codes.push_back(code);
        }
    coded.codes.resize(coded.rows * coded.columns, CodedLabels::blank);  // the trailing blanks left out
    return coded;
}

std::vector<Cell> line(const CellGrid& grid) {
    std::vector<Cell> cells;
    for (std::size_t r = 0; r < grid.rows(); ++r)
        for (std::size_t c = 0; c < grid.columns(); ++c) cells.push_back(grid.at(r, c));
    return cells;
}

std::size_t position(const std::vector<Cell>& levels, const Cell& label) {
    for (std::size_t i = 0; i < levels.size(); ++i)
        if (same_level(levels[i], label)) return i;
    finding("a label is missing from the levels");
}

void check_distinct(const std::vector<Cell>& levels) {
    for (std::size_t i = 0; i < levels.size(); ++i) {
        if (blank_label(levels[i])) finding("a blank is listed as a level");
        for (std::size_t j = i + 1; j < levels.size(); ++j)
            if (same_level(levels[i], levels[j])) finding("a level is listed twice");
    }
}

std::string describe(const RecordCounts& a, const RecordCounts& b) { return ": \"" + a.feedback() + "\" against \"" + b.feedback() + "\""; }
std::string describe(const std::vector<Cell>& a, const std::vector<Cell>& b) {
    return ": " + std::to_string(a.size()) + " levels against " + std::to_string(b.size());
}

// Both routes: the same answer, or the same error.
template <class Result, class ByCells, class ByCodes, class Same>
void agree(const char* what, ByCells by_cells, ByCodes by_codes, Same same) {
    Result a, b;
    std::string error_a, error_b;
    const bool ok_a = attempt(what, [&] {
        try { a = by_cells(); } catch (const Error& e) { error_a = e.what(); throw; }
    });
    const bool ok_b = attempt(what, [&] {
        try { b = by_codes(); } catch (const Error& e) { error_b = e.what(); throw; }
    });
    if (ok_a != ok_b || error_a != error_b) finding(std::string(what) + ": the cell and dictionary routes disagree: \"" +
                                                     error_a + "\" against \"" + error_b + "\"");
    if (ok_a && !same(a, b)) finding(std::string(what) + ": the cell and dictionary routes give different answers" + describe(a, b));
}

bool same_levels(const std::vector<Cell>& a, const std::vector<Cell>& b) {
    if (a.size() != b.size()) return false;
    for (std::size_t i = 0; i < a.size(); ++i)
        if (!same_level(a[i], b[i])) return false;
    return true;
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const auto sections = read_sections(data, size);
    CellGrid rows = section(sections, 0), columns = section(sections, 1);
    const CellGrid& weights = section(sections, 2);
    LevelOrder order = LevelOrder::sorted;
    attempt("parse_level_order", [&] { order = parse_level_order(word_at(section(sections, 3), 0)); });
    if (word_at(section(sections, 3), 1) == "whole") {
        for (CellGrid* labels : {&rows, &columns}) {
            if (labels->columns() == 1) labels->set_given_shape(whole_column_rows, 1);
            else if (labels->rows() == 1) labels->set_given_shape(1, whole_row_columns);
        }
    }
    unsigned random = static_cast<unsigned>(size);
    const CodedLabels coded_rows = coded_like_the_add_in(rows, random);
    const CodedLabels coded_columns = coded_like_the_add_in(columns, random);

    for (const auto* labels : {&rows, &columns}) {
        const CodedLabels& coded = labels == &rows ? coded_rows : coded_columns;
        agree<std::vector<Cell>>(
            "distinct_levels", [&] { return distinct_levels(*labels, order); },
            [&] { return distinct_levels(coded, order); }, same_levels);
    }
    agree<RecordCounts>(
        "counts_from_records", [&] { return counts_from_records(rows, columns, weights, order); },
        [&] { return counts_from_records(coded_rows, coded_columns, weights, order); },
        [](const RecordCounts& a, const RecordCounts& b) {
            return same_levels(a.row_levels, b.row_levels) && same_levels(a.column_levels, b.column_levels) &&
                   a.counts.values() == b.counts.values() && a.feedback() == b.feedback();
        });

    RecordCounts counted;
    if (!attempt("counts_from_records", [&] { counted = counts_from_records(rows, columns, weights, order); })) return 0;
    check_distinct(counted.row_levels);
    check_distinct(counted.column_levels);
    check_message(counted.feedback(), "feedback");
    // A plain recount, record by record in the same order (so even weighted sums agree exactly), over
    // the records: up to the last position that holds anything, after a header when there is one.
    const std::vector<Cell> row_cells = line(rows), column_cells = line(columns), weight_cells = line(weights);
    std::size_t end = 0;
    for (std::size_t i = 0; i < std::max({row_cells.size(), column_cells.size(), weight_cells.size()}); ++i)
        if ((i < row_cells.size() && !blank_label(row_cells[i])) || (i < column_cells.size() && !blank_label(column_cells[i])) ||
            (i < weight_cells.size() && !weight_cells[i].is_blank()))
            end = i + 1;
    if (counted.records > end || end - counted.records > 1) finding("records miscounted");
    const std::size_t first = end - counted.records;  // 1 when a header was left out
    Matrix recount(counted.row_levels.size(), counted.column_levels.size());
    std::size_t skipped = 0;
    const Cell blank;
    for (std::size_t i = first; i < end; ++i) {
        const Cell& row = i < row_cells.size() ? row_cells[i] : blank;
        const Cell& column = i < column_cells.size() ? column_cells[i] : blank;
        if (blank_label(row) || blank_label(column)) {
            ++skipped;
            continue;
        }
        const Cell& weight = weights.empty() || i >= weight_cells.size() ? blank : weight_cells[i];
        if (!weights.empty() && weight.is_blank()) continue;  // counted in skipped_weight
        recount(position(counted.row_levels, row), position(counted.column_levels, column)) +=
            weights.empty() ? 1.0 : weight.as_number();
    }
    if (recount.values() != counted.counts.values()) finding("the counts differ from a plain recount");
    if (skipped != counted.skipped_blank) finding("blank labels miscounted");
    check_nonnegative(counted.total, "total");
    attempt("table from records", [&] {
        const CountTable table = counted.table();
        if (!close(table.total(), counted.total, 1e-12)) finding("the table from records has another total");
    });
    return 0;
}
