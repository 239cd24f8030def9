#include "assoc/long_strata.hpp"

#include <cmath>
#include <map>
#include <string>
#include <tuple>
#include <utility>

#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "assoc/wording.hpp"
#include "total_lines.hpp"

namespace assoc {

namespace {

// A stratum named as everyone ("All offices") whose counts are, cell by cell, the sums of the other
// strata's is the company as a whole, not one more stratum: set aside, and said. Only with at least
// 2 other strata (with one, equal counts are easily a coincidence).
void set_aside_whole_group_stratum(LongStrata& strata) {
    if (strata.strata.size() < 3) return;
    for (std::size_t k = 0; k < strata.strata.size(); ++k) {
        if (!detail::names_the_whole_group(strata.strata[k].label)) continue;
        const Matrix& whole = strata.strata[k].counts;
        bool sums = true;
        for (std::size_t r = 0; r < whole.rows() && sums; ++r)
            for (std::size_t c = 0; c < whole.columns() && sums; ++c) {
                double sum = 0.0;
                for (std::size_t j = 0; j < strata.strata.size(); ++j)
                    if (j != k) sum += strata.strata[j].counts(r, c);
                sums = detail::same_amount(sum, whole(r, c));
            }
        if (!sums) continue;
        strata.remarks.push_back("The rows of " + quoted_label(strata.strata[k].label) +
                                 " hold the sums of the other strata and were set aside as totals.");
        strata.strata.erase(strata.strata.begin() + static_cast<std::ptrdiff_t>(k));
        return;
    }
}

std::string range_row(std::size_t row) { return "row " + std::to_string(row + 1); }

// A label as the range shows it: texts as they are, numbers written out.
std::string label_text(const Cell& cell) { return cell.is_text() ? cell.as_text() : format_number(cell.as_number(), 15); }

// Labels are compared as cells: the number 5 and the text "5" differ (as in ASSOC.COUNTS).
struct LabelKey {
    bool is_text;
    double number;
    std::string text;
    explicit LabelKey(const Cell& cell)
        : is_text(cell.is_text()), number(cell.is_number() ? cell.as_number() : 0.0), text(cell.is_text() ? cell.as_text() : "") {}
    friend bool operator<(const LabelKey& a, const LabelKey& b) {
        return std::tie(a.is_text, a.number, a.text) < std::tie(b.is_text, b.number, b.text);
    }
};

bool is_blank_row(const CellGrid& range, std::size_t row) {
    for (std::size_t c = 0; c < range.columns(); ++c)
        if (!range.at(row, c).is_blank()) return false;
    return true;
}

bool is_header(const CellGrid& range) {
    bool text_count_column = false;
    for (std::size_t c = 0; c < range.columns(); ++c) {
        const Cell& cell = range.at(0, c);
        if (cell.is_number()) return false;
        text_count_column = text_count_column || (c >= 2 && cell.is_text());
    }
    return text_count_column;
}

std::string quoted(const std::string& label) { return "\"" + label + "\""; }

std::string capitalised_lines(const std::vector<std::size_t>& rows) {
    std::string text = numbered_lines("row", rows);
    if (!text.empty() && text[0] == 'r') text[0] = 'R';
    return text;
}

}  // namespace

LongStrata read_long_strata(const CellGrid& range, std::size_t max_cells) {
    require(!range.empty(), "the range is empty; select the strata in the long layout (stratum, row label, counts)");
    require(range.columns() >= 4,
            "the range needs a column of stratum labels, a column of row labels and at least 2 columns of counts "
            "(one per column category); this range has " +
                std::to_string(range.columns()) + (range.columns() == 1 ? " column" : " columns"));
    const std::size_t categories = range.columns() - 2;
    const bool header = is_header(range);

    LongStrata result;
    // Count columns headed as totals are set aside; `kept` holds the others' positions.
    std::vector<std::size_t> kept;
    std::vector<std::string> total_columns;
    for (std::size_t c = 0; c < categories; ++c) {
        const Cell& name = range.at(0, c + 2);
        if (header && name.is_text() && detail::is_total_label(name.as_text())) total_columns.push_back(quoted_label(name.as_text()));
        else kept.push_back(c);
    }
    if (!total_columns.empty())
        result.remarks.push_back("The column" + std::string(total_columns.size() == 1 ? " " : "s ") + name_list(total_columns) +
                                 (total_columns.size() == 1 ? " is a total and was" : " are totals and were") + " set aside.");
    require(kept.size() >= 2, "the range needs at least 2 columns of counts besides its totals");
    result.column_labels.assign(kept.size(), "");
    if (header)
        for (std::size_t c = 0; c < kept.size(); ++c)
            if (range.at(0, kept[c] + 2).is_text()) result.column_labels[c] = range.at(0, kept[c] + 2).as_text();
    std::vector<std::size_t> total_rows;  // 1-based rows of the range set aside as totals

    std::map<LabelKey, std::size_t> row_index;      // row label → its row in every stratum's table
    std::map<LabelKey, std::size_t> stratum_index;  // stratum label → its stratum
    // Per stratum, the rows of its table as (row label index, range row), and the counts in order.
    struct Pending {
        std::vector<std::pair<std::size_t, std::size_t>> rows;
    };
    std::vector<Pending> pending;
    std::vector<std::vector<double>> counts;  // per stratum: row after row of its range rows
    // Per row label, the stratum and range row where it was last seen: strata are runs, so a label
    // seen again in the same stratum is a repeat.
    std::vector<std::size_t> row_last_stratum, row_last_range_row;
    std::size_t last_stratum = static_cast<std::size_t>(-1);
    constexpr std::size_t no_row = static_cast<std::size_t>(-1);
    std::size_t last_stratum_row = no_row;  // the last row that named its stratum

    for (std::size_t r = header ? 1 : 0; r < range.rows(); ++r) {
        if (is_blank_row(range, r)) {
            ++result.empty_rows;
            continue;
        }
        // A blank stratum label below a stratum's first row means "as above" (a stratum named once, or
        // its cells merged), as in the stacked layout of read_strata; a blank one at the top names nothing.
        const Cell& stratum = range.at(r, 0).is_blank() && last_stratum_row != no_row ? range.at(last_stratum_row, 0)
                                                                                   : range.at(r, 0);
        const Cell& row = range.at(r, 1);
        if (stratum.is_blank())
            throw Error(range_row(r) + " has no stratum label in column 1, and no stratum starts above it; give the "
                                       "first row of every stratum its stratum's label");
        if (!range.at(r, 0).is_blank()) last_stratum_row = r;
        if (row.is_blank()) throw Error(range_row(r) + " has no row label in column 2; every row of counts needs one");
        if ((stratum.is_text() && detail::is_total_label(stratum.as_text())) ||
            (row.is_text() && detail::is_total_label(row.as_text()))) {
            total_rows.push_back(r + 1);
            continue;
        }

        const auto [found, is_new] = stratum_index.emplace(LabelKey(stratum), result.strata.size());
        if (is_new) {
            result.strata.push_back({label_text(stratum), Matrix()});
            pending.emplace_back();
            counts.emplace_back();
        } else if (found->second != last_stratum) {
            throw Error("the stratum " + quoted(label_text(stratum)) + " comes back at " + range_row(r) +
                        " after rows of another stratum; keep each stratum's rows together (sort the range by its "
                        "first column)");
        }
        const std::size_t k = found->second;
        last_stratum = k;

        const auto [row_found, new_row] = row_index.emplace(LabelKey(row), result.row_labels.size());
        const std::size_t label = row_found->second;
        if (new_row) {
            result.row_labels.push_back(label_text(row));
            row_last_stratum.push_back(k);
            row_last_range_row.push_back(r);
        } else if (row_last_stratum[label] == k) {
            throw Error("the row label " + quoted(label_text(row)) + " appears twice in the stratum " +
                        quoted(label_text(stratum)) + " (" + range_row(row_last_range_row[label]) + " and " +
                        range_row(r) + "); give each row of a stratum once");
        } else {
            row_last_stratum[label] = k;
            row_last_range_row[label] = r;
        }
        pending[k].rows.emplace_back(label, r);

        for (std::size_t c : kept) {
            const Cell& cell = range.at(r, c + 2);
            double value = 0.0;
            if (!cell.is_blank()) {
                // The message is built only on failure: a range can hold a million counts.
                const auto fail = [&](const std::string& reason) {
                    throw Error(range_row(r) + ", column " + std::to_string(c + 3) + " holds " + cell.describe() + reason);
                };
                if (!cell.is_number()) fail(detail::text_among_counts_reason(cell));
                value = cell.as_number();
                if (!std::isfinite(value)) fail("; counts must be ordinary numbers");
                if (value < 0) fail("; counts cannot be negative");
            }
            counts[k].push_back(value);
        }
    }
    if (!total_rows.empty())
        result.remarks.push_back(capitalised_lines(total_rows) + (total_rows.size() == 1 ? " is a total and was" : " are totals and were") +
                                 " set aside (a row or stratum label that names a total).");
    require(!result.strata.empty(), "the range holds no rows of counts");
    const std::size_t categories_kept = kept.size();
    const double cells = static_cast<double>(result.strata.size()) * static_cast<double>(result.row_labels.size()) *
                         static_cast<double>(categories_kept);
    require(cells <= static_cast<double>(max_cells),
            "the strata make " + format_count(cells) + " count cells (strata × row labels × columns); at most " +
                format_count(static_cast<double>(max_cells)) + " can be read");

    for (std::size_t k = 0; k < result.strata.size(); ++k) {
        Matrix table(result.row_labels.size(), categories_kept);
        for (std::size_t i = 0; i < pending[k].rows.size(); ++i)
            for (std::size_t c = 0; c < categories_kept; ++c)
                table(pending[k].rows[i].first, c) = counts[k][i * categories_kept + c];
        result.strata[k].counts = std::move(table);
    }
    // A row label missing from some strata: a group with nobody there, or one labelled otherwise in
    // another stratum ("Over 10" and "10+"), which would be tested as two groups. Said, not refused.
    if (result.strata.size() >= 2) {
        std::vector<std::vector<std::string>> missing_from(result.row_labels.size());
        for (std::size_t k = 0; k < result.strata.size(); ++k) {
            std::vector<bool> present(result.row_labels.size(), false);
            for (const auto& [label, range_row_index] : pending[k].rows) present[label] = true;
            for (std::size_t label = 0; label < present.size(); ++label)
                if (!present[label]) missing_from[label].push_back(quoted(result.strata[k].label));
        }
        std::vector<std::string> missing;
        for (std::size_t label = 0; label < missing_from.size(); ++label)
            if (!missing_from[label].empty())
                missing.push_back(quoted(result.row_labels[label]) + " (not in " + name_list(missing_from[label], 3) + ")");
        if (!missing.empty())
            result.remarks.push_back("Not every stratum has the same row labels: " + name_list(missing, 4) +
                                     ". A stratum without a row label counts 0 there; if two labels name the same "
                                     "group, give them one label.");
    }
    set_aside_whole_group_stratum(result);
    return result;
}

std::string long_stratum_name(const LongStratum& stratum) { return "stratum " + quoted(stratum.label); }

}  // namespace assoc
