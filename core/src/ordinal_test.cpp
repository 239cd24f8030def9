#include "assoc/ordinal_test.hpp"

#include <algorithm>
#include <cmath>
#include <string>

#include "assoc/chi_squared_distribution.hpp"
#include "assoc/error.hpp"
#include "assoc/expected_counts.hpp"
#include "assoc/format.hpp"
#include "assoc/validity.hpp"
#include "category_order.hpp"
#include "cell_line.hpp"
#include "row_names.hpp"

namespace assoc {
namespace {

// "row" or "column", with what the scores belong to, for messages.
struct Side {
    const char* name;     // "row"
    std::size_t count;    // rows (columns) of the body
};

std::string numbered(const Side& side, std::size_t index) {
    return std::string(side.name) + " score " + std::to_string(index + 1);
}

// The scores of every body row (column): given, or 1, 2, 3, …; checked for count, finiteness and order.
std::vector<double> checked_scores(const std::vector<double>& given, const Side& side) {
    if (given.empty()) {
        std::vector<double> defaults(side.count);
        for (std::size_t i = 0; i < side.count; ++i) defaults[i] = static_cast<double>(i + 1);
        return defaults;
    }
    require(given.size() == side.count,
            "there are " + std::to_string(given.size()) + " " + side.name + " scores for " + std::to_string(side.count) +
                " " + side.name + "s; give one score per " + side.name + " (" + side.name +
                "s of zeros included, in the order of the table)");
    for (std::size_t i = 0; i < given.size(); ++i)
        require(std::isfinite(given[i]),
                numbered(side, i) + " is " + format_number(given[i]) + "; scores must be ordinary numbers");
    const bool rising = given.size() < 2 || given[1] > given[0];
    for (std::size_t i = 1; i < given.size(); ++i) {
        const double before = given[i - 1], now = given[i];
        if (now == before)
            throw Error(std::string(side.name) + " scores " + std::to_string(i) + " and " + std::to_string(i + 1) +
                        " are both " + format_number(now, 15) + "; each " + side.name +
                        " needs a score of its own, rising (or falling) with the order of the " + side.name + "s");
        if ((now > before) != rising)
            throw Error(std::string("the ") + side.name + " scores " + (rising ? "rise and then fall" : "fall and then rise") +
                        " (" + numbered(side, i - 1) + " is " + format_number(before, 15) + ", " + numbered(side, i) +
                        " is " + format_number(now, 15) + "); scores must rise, or fall, steadily with the order of the " +
                        side.name + "s");
    }
    return given;
}

// The scores of the kept rows (columns), centred on their count-weighted mean and divided by their
// largest distance from it: M² and |r| do not change, and no product can overflow.
std::vector<double> standardized(const std::vector<double>& body_scores, const std::vector<std::size_t>& kept,
                                 const std::vector<double>& totals, double n) {
    // First brought into [−1, 1] (scores near the largest double would overflow the mean).
    double size = 0.0;
    for (std::size_t i : kept) size = std::max(size, std::fabs(body_scores[i]));
    std::vector<double> scores;
    double mean = 0.0;
    for (std::size_t i = 0; i < kept.size(); ++i) {
        scores.push_back(body_scores[kept[i]] / size);
        mean += totals[i] / n * scores.back();
    }
    double largest = 0.0;
    for (double& score : scores) {
        score -= mean;
        largest = std::max(largest, std::fabs(score));
    }
    for (double& score : scores) score /= largest;  // largest > 0: at least 2 kept scores, all distinct
    return scores;
}

std::vector<double> read_scores(const CellGrid& grid, const char* side) {
    std::vector<double> scores;
    if (grid.empty()) return scores;
    const detail::CellLine line(grid, std::string(side) + " scores");
    for (std::size_t i = 0; i < line.size(); ++i) {
        const Cell& cell = line[i];
        if (!cell.is_number())
            throw Error(std::string(side) + " score " + std::to_string(i + 1) + " holds " + cell.describe() +
                        "; scores must be numbers");
        scores.push_back(cell.as_number());
    }
    return scores;
}

}  // namespace

OrdinalResult ordinal_test(const CountTable& table, const std::vector<double>& row_scores,
                           const std::vector<double>& column_scores) {
    const std::vector<double> rows = checked_scores(row_scores, {"row", table.body_rows()});
    const std::vector<double> columns = checked_scores(column_scores, {"column", table.body_columns()});
    require(table.rows() >= 2 && table.columns() >= 2,
            "the linear-by-linear test needs at least 2 rows and 2 columns with counts");
    const double n = table.total();
    require(n > 1, "the linear-by-linear test needs a total count above 1, since M² = (n − 1) r²");

    const std::vector<double> u = standardized(rows, table.kept_rows(), table.row_totals(), n);
    const std::vector<double> v = standardized(columns, table.kept_columns(), table.column_totals(), n);
    const Matrix deviations = deviations_from_expected(table);
    double cross = 0.0, row_spread = 0.0, column_spread = 0.0;
    for (std::size_t r = 0; r < table.rows(); ++r) {
        double along_row = 0.0;
        for (std::size_t c = 0; c < table.columns(); ++c) along_row += deviations(r, c) * v[c];
        cross += along_row * u[r];
        row_spread += table.row_total(r) * u[r] * u[r];
    }
    for (std::size_t c = 0; c < table.columns(); ++c) column_spread += table.column_total(c) * v[c] * v[c];

    OrdinalResult result;
    result.correlation = std::clamp(cross / std::sqrt(row_spread) / std::sqrt(column_spread), -1.0, 1.0);
    result.statistic = (n - 1) * result.correlation * result.correlation;
    result.p_value = chi_squared_p_value(result.statistic, 1.0);
    return result;
}

OrdinalResult ordinal_test(const CellGrid& table, const CellGrid& row_scores, const CellGrid& column_scores) {
    const CountTable read = read_count_table(table);
    // Each side is taken in the table's order (scores must rise or fall with it), which its labels
    // must not contradict.
    for (const bool rows : {true, false})
        if (auto why = detail::categories_out_of_order(detail::category_labels(read, rows), rows ? "row" : "column", nullptr))
            throw Error(*why);
    OrdinalResult result = ordinal_test(read, read_scores(row_scores, "row"), read_scores(column_scores, "column"));
    result.remarks = table_notes(read);
    return result;
}

}  // namespace assoc
