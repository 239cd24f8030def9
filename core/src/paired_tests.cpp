#include "assoc/paired_tests.hpp"

#include <algorithm>
#include <cmath>

#include "ascii_case.hpp"
#include "assoc/chi_squared_distribution.hpp"
#include "assoc/count_table.hpp"
#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "assoc/validity.hpp"
#include "assoc/wording.hpp"
#include "discrete_tail.hpp"
#include "row_names.hpp"
#include "shared_words.hpp"
#include "stirling.hpp"

namespace assoc {

std::optional<PairedMethod> parse_paired_method(const std::string& word) {
    if (word.empty()) return std::nullopt;
    if (detail::equals_ignoring_case(word, "corrected")) return PairedMethod::corrected;
    if (detail::equals_ignoring_case(word, "uncorrected")) return PairedMethod::uncorrected;
    if (detail::equals_ignoring_case(word, "exact")) return PairedMethod::exact;
    throw Error("the method must be \"corrected\", \"uncorrected\" or \"exact\", not \"" + word + "\"");
}

namespace {

std::string not_square(std::size_t rows, std::size_t columns) {
    return "a paired table must be square, the same categories as rows and as columns; this one has " +
           std::to_string(rows) + " rows and " + std::to_string(columns) + " columns of counts";
}

// Two-sided: twice the smaller tail of Binomial(b + c, ½), at most 1. The tail comes from the same
// summation as Fisher's 2×2 test (discrete_tail.hpp), whose cost does not grow with the counts;
// Boost's binomial distribution lost digits at a million changes (2e-8 at 2e9, 2e-5 at 2e12) and
// took minutes, or gave nonsense, far beyond.
PairedResult exact_mcnemar(double b, double c) {
    require(b == std::floor(b) && c == std::floor(c),
            "the exact paired test needs whole counts; the cells off the diagonal hold " + format_number(b, 15) +
                " and " + format_number(c, 15));
    const double m = b + c;
    require(m < 0x1p53, "the exact paired test takes up to 9,007,199,254,740,991 changes (2^53 − 1) in all, and this "
                        "table has " + format_count(m) + "; at this size use the chi-squared version (\"corrected\")");
    PairedResult result;
    result.method = PairedMethod::exact;
    result.statistic = std::min(b, c);
    result.df = 0.0;
    const detail::DiscreteTail<2> binomial({0.0, m}, {+1, -1}, {m / 2, m / 2}, m, 1.0, 2.0, detail::stirling_part(m), 0.0, m);
    // The work is bounded by the method itself (well under a millisecond); the limit only guards it.
    const ExactLimits limits;
    const detail::Deadline deadline(limits);
    result.p_value = std::min(1.0, 2 * binomial.lower(result.statistic, deadline));
    return result;
}

// For each row, the column whose label folds to the same key, or k when none does; the keys of
// one side must differ (require_labels sees to the labels themselves).
std::vector<std::size_t> match_by_keys(const std::vector<std::string>& rows, const std::vector<std::string>& columns) {
    std::vector<std::size_t> column_of_row(rows.size(), columns.size());
    for (std::size_t r = 0; r < rows.size(); ++r)
        for (std::size_t c = 0; c < columns.size(); ++c)
            if (rows[r] == columns[c]) column_of_row[r] = c;
    return column_of_row;
}

bool one_to_one(const std::vector<std::size_t>& column_of_row) {
    std::vector<bool> taken(column_of_row.size(), false);
    for (std::size_t c : column_of_row) {
        if (c >= taken.size() || taken[c]) return false;
        taken[c] = true;
    }
    return true;
}

// For each row of categories (in order), the position among the category columns of the column with
// the same label. Without labels on both sides: the same position.
std::vector<std::size_t> columns_matching_rows(const CountTable& read, std::vector<std::string>& remarks) {
    const std::size_t k = read.category_rows().size();
    std::vector<std::size_t> same_place(k);
    for (std::size_t i = 0; i < k; ++i) same_place[i] = i;
    if (!read.has_row_labels() || !read.has_column_labels()) {
        // Labels on one side only: the other side is read in the same order, and that is said.
        const bool rows_labelled = read.has_row_labels();
        if (rows_labelled || read.has_column_labels()) {
            std::vector<std::string> labels;
            for (const std::string& label : detail::category_labels(read, rows_labelled)) labels.push_back(quoted_label(label));
            remarks.push_back(std::string("The ") + (rows_labelled ? "columns" : "rows") + " have no labels, so they were "
                              "read as the " + (rows_labelled ? "rows'" : "columns'") + " categories in the same order (" +
                              name_list(labels, 6) + "); if they come in another order, label them.");
        }
        return same_place;
    }

    const std::vector<std::string> rows = detail::category_labels(read, true), columns = detail::category_labels(read, false);
    const auto require_labels = [](const std::vector<std::string>& labels, const char* side) {
        std::vector<std::string> seen;
        for (const std::string& label : labels) {
            require(!label.empty(), std::string("a ") + side + " of the paired table has no label; row i and column i "
                                    "must be the same category, so give every row and every column its label (or "
                                    "give labels on one side only and keep the same order)");
            const std::string key = folded_label(label);
            require(std::find(seen.begin(), seen.end(), key) == seen.end(),
                    std::string("the ") + side + "s of the paired table carry the label " + quoted_label(label) +
                        " twice; each category needs one row and one column");
            seen.push_back(key);
        }
    };
    require_labels(rows, "row");
    require_labels(columns, "column");

    std::vector<std::size_t> column_of_row(k);
    std::vector<std::string> rows_only, columns_only;
    for (std::size_t r = 0; r < k; ++r) {
        const auto match = std::find_if(columns.begin(), columns.end(),
                                        [&](const std::string& column) { return folded_label(column) == folded_label(rows[r]); });
        if (match == columns.end()) rows_only.push_back(quoted_label(rows[r]));
        else column_of_row[r] = static_cast<std::size_t>(match - columns.begin());
    }
    for (const std::string& column : columns)
        if (std::none_of(rows.begin(), rows.end(), [&](const std::string& row) { return folded_label(row) == folded_label(column); }))
            columns_only.push_back(quoted_label(column));
    // Labels that name the occasion beside the category ("Yes before" and "Yes after", "Fail (first)"
    // and "Fail (retest)") match once the words every row shares, and those every column shares,
    // are left out: all of them, one to one, or none. Said, with the labels matched.
    if (!rows_only.empty() || !columns_only.empty()) {
        const std::vector<std::size_t> by_stems = match_by_keys(detail::label_keys(rows), detail::label_keys(columns));
        if (one_to_one(by_stems)) {
            std::vector<std::string> pairs;
            for (std::size_t r = 0; r < k; ++r)
                pairs.push_back(quoted_label(rows[r]) + " with " + quoted_label(columns[by_stems[r]]));
            remarks.push_back("The rows and the columns have different labels, which match once the words that all "
                              "the rows share, and those that all the columns share, are left out; so row and column "
                              "were paired as " + name_list(pairs, 6) + ". If these are not the same categories, "
                              "give the rows and the columns the same labels.");
            return by_stems;
        }
    }
    if (!rows_only.empty() || !columns_only.empty()) {
        std::vector<std::string> parts;
        if (!rows_only.empty()) parts.push_back("the rows have " + name_list(rows_only, 4) + ", which no column has");
        if (!columns_only.empty())
            parts.push_back("the columns have " + name_list(columns_only, 4) + ", which no row has");
        std::string found;
        for (const std::string& part : parts) found += "; " + part;
        throw Error("a paired table needs the same categories as rows and as columns, matched by their labels" + found +
                    ". Give the rows and the columns the same labels");
    }
    if (column_of_row != same_place) {
        std::vector<std::string> order;
        for (std::size_t r = 0; r < k; ++r) order.push_back(quoted_label(columns[column_of_row[r]]));
        remarks.push_back("The columns were matched to the rows by their labels: they are in another order than "
                          "the rows, and were read as " + name_list(order, 6) + ".");
    }
    return column_of_row;
}

}  // namespace

PairedResult paired_test(const Matrix& square, std::optional<PairedMethod> method) {
    const std::size_t k = square.rows();
    require(k == square.columns(), not_square(square.rows(), square.columns()));
    require(k >= 2, "a paired table needs at least 2 categories");
    for (double value : square.values())
        if (!(std::isfinite(value) && value >= 0))
            throw Error("counts must be numbers of 0 or more, not " + format_number(value));

    if (k > 2 && method && *method != PairedMethod::uncorrected)
        throw Error(std::string("the ") + (*method == PairedMethod::exact ? "exact test" : "continuity correction") +
                    " applies to 2×2 tables only; for " + std::to_string(k) + "×" + std::to_string(k) +
                    " tables omit the method (or give \"uncorrected\") for the test of symmetry");
    const PairedMethod applied = method.value_or(k == 2 ? PairedMethod::corrected : PairedMethod::uncorrected);

    bool any_pair = false;
    for (std::size_t i = 0; i < k; ++i)
        for (std::size_t j = i + 1; j < k; ++j) any_pair = any_pair || square(i, j) + square(j, i) > 0;
    require(any_pair, "no pair changed category (every count off the diagonal is 0), so there is nothing to test");

    if (applied == PairedMethod::exact) return exact_mcnemar(square(0, 1), square(1, 0));

    PairedResult result;
    result.method = applied;
    for (std::size_t i = 0; i < k; ++i)
        for (std::size_t j = i + 1; j < k; ++j) {
            const double upper = square(i, j), lower = square(j, i);
            if (upper + lower == 0) continue;  // no changes either way: no information, no df
            double gap = std::fabs(upper - lower);
            if (applied == PairedMethod::corrected) gap = std::max(0.0, gap - 1);
            result.statistic += gap * (gap / (upper + lower));  // gap² would overflow near 1e154
            result.df += 1;
        }
    result.p_value = chi_squared_p_value(result.statistic, result.df);
    return result;
}

PairedResult paired_test(const CellGrid& table, std::optional<PairedMethod> method) {
    ReadOptions options;
    options.require_two_by_two = false;  // a category nobody chose is still a row and a column
    const CountTable read = read_count_table(table, options);
    const Matrix counts = read.category_counts();
    require(counts.rows() == counts.columns(), not_square(counts.rows(), counts.columns()));
    std::vector<std::string> remarks;
    const std::vector<std::size_t> column_of_row = columns_matching_rows(read, remarks);
    Matrix square(counts.rows(), counts.columns());
    for (std::size_t r = 0; r < counts.rows(); ++r)
        for (std::size_t c = 0; c < counts.columns(); ++c) square(r, c) = counts(r, column_of_row[c]);
    PairedResult result = paired_test(square, method);
    result.remarks = table_notes(read);
    result.remarks.insert(result.remarks.end(), remarks.begin(), remarks.end());
    return result;
}

}  // namespace assoc
