#include "assoc/generalized_mantel_haenszel.hpp"

#include <algorithm>
#include <cmath>
#include <string>

#include "assoc/chi_squared_distribution.hpp"
#include "assoc/count_table.hpp"
#include "assoc/error.hpp"
#include "assoc/expected_counts.hpp"
#include "assoc/format.hpp"

namespace assoc {
namespace {

// Whether a stratum's table can say anything about the association: 2 rows and 2 columns with counts.
bool informative(const Matrix& counts) {
    std::size_t rows = 0, columns = 0;
    double total = 0.0;
    for (std::size_t r = 0; r < counts.rows(); ++r) {
        double sum = 0.0;
        for (std::size_t c = 0; c < counts.columns(); ++c) sum += counts(r, c);
        rows += sum > 0;
        total += sum;
    }
    for (std::size_t c = 0; c < counts.columns(); ++c) {
        double sum = 0.0;
        for (std::size_t r = 0; r < counts.rows(); ++r) sum += counts(r, c);
        columns += sum > 0;
    }
    return rows >= 2 && columns >= 2 && total > 1;
}

std::string named_line(const char* kind, std::size_t index, const std::string& label) {
    return std::string(kind) + " " + std::to_string(index + 1) + (label.empty() ? "" : " (\"" + label + "\")");
}

// Solves V x = d for symmetric positive definite V (lower triangle used) by Cholesky's method and
// returns dᵀ x; false when a pivot falls to rounding level, i.e. V is singular.
bool quadratic_form(std::vector<double>& v, std::size_t size, const std::vector<double>& d, double& value) {
    std::vector<double> diagonal(size);
    for (std::size_t i = 0; i < size; ++i) diagonal[i] = v[i * size + i];
    for (std::size_t j = 0; j < size; ++j) {
        double pivot = v[j * size + j];
        for (std::size_t k = 0; k < j; ++k) pivot -= v[j * size + k] * v[j * size + k];
        if (!(pivot > 1e-9 * diagonal[j])) return false;
        const double root = std::sqrt(pivot);
        v[j * size + j] = root;
        for (std::size_t i = j + 1; i < size; ++i) {
            double sum = v[i * size + j];
            for (std::size_t k = 0; k < j; ++k) sum -= v[i * size + k] * v[j * size + k];
            v[i * size + j] = sum / root;
        }
    }
    // dᵀ V⁻¹ d = |L⁻¹ d|².
    std::vector<double> y(d);
    value = 0.0;
    for (std::size_t i = 0; i < size; ++i) {
        for (std::size_t k = 0; k < i; ++k) y[i] -= v[i * size + k] * y[k];
        y[i] /= v[i * size + i];
        value += y[i] * y[i];
    }
    return true;
}

}  // namespace

GeneralAssociationResult general_association_test(const LongStrata& data, const GeneralAssociationLimits& limits) {
    GeneralAssociationResult result;
    const std::size_t all_rows = data.row_labels.size(), all_columns = data.column_labels.size();

    std::vector<const LongStratum*> used;
    for (const LongStratum& stratum : data.strata) {
        if (informative(stratum.counts)) used.push_back(&stratum);
        else
            result.remarks.push_back("The " + long_stratum_name(stratum) +
                                     " has fewer than 2 rows or 2 columns with counts and adds nothing to the test.");
    }
    require(!used.empty(), "no stratum has counts in at least 2 rows and 2 columns, so there is nothing to test");
    result.strata_used = used.size();

    // Rows and columns with counts in the strata used; the others take no part.
    std::vector<double> row_sums(all_rows, 0.0), column_sums(all_columns, 0.0);
    for (const LongStratum* stratum : used)
        for (std::size_t r = 0; r < all_rows; ++r)
            for (std::size_t c = 0; c < all_columns; ++c) {
                row_sums[r] += stratum->counts(r, c);
                column_sums[c] += stratum->counts(r, c);
            }
    std::vector<std::size_t> rows, columns;
    for (std::size_t r = 0; r < all_rows; ++r) {
        if (row_sums[r] > 0) rows.push_back(r);
        else result.remarks.push_back("The " + named_line("row label", r, data.row_labels[r]) +
                                      " has no counts in the strata used and takes no part in the test.");
    }
    for (std::size_t c = 0; c < all_columns; ++c) {
        if (column_sums[c] > 0) columns.push_back(c);
        else result.remarks.push_back("The " + named_line("column of counts", c, data.column_labels[c]) +
                                      " has no counts in the strata used and takes no part in the test.");
    }
    for (const std::string& remark : data.remarks) result.remarks.push_back(remark);
    if (data.empty_rows > 0)
        result.remarks.push_back(std::to_string(data.empty_rows) + (data.empty_rows == 1 ? " empty row was" : " empty rows were") +
                                 " skipped.");
    result.rows = rows.size();
    result.columns = columns.size();
    // Informative strata leave at least 2 rows and 2 columns with counts.

    const std::size_t r1 = rows.size() - 1, c1 = columns.size() - 1, size = r1 * c1;
    require(size <= limits.max_dimension,
            "the test across strata compares (rows − 1) × (columns − 1) = " + format_count(static_cast<double>(size)) +
                " cells at once, and it handles at most " + format_count(static_cast<double>(limits.max_dimension)) +
                "; combine categories");
    const double work = static_cast<double>(used.size()) * static_cast<double>(size) * static_cast<double>(size) / 2 +
                        static_cast<double>(size) * static_cast<double>(size) * static_cast<double>(size) / 6;
    require(work <= limits.max_work, "this range has too many strata and categories to test in reasonable time (" +
                                         std::to_string(used.size()) + " strata, " + std::to_string(rows.size()) +
                                         " rows, " + std::to_string(columns.size()) +
                                         " columns); combine categories or strata");

    std::vector<double> difference(size, 0.0), variance(size * size, 0.0);
    std::vector<double> a(r1 * r1), b(c1 * c1);
    ReadOptions any_shape;
    any_shape.require_two_by_two = false;
    for (const LongStratum* stratum : used) {
        Matrix counts(rows.size(), columns.size());
        for (std::size_t i = 0; i < rows.size(); ++i)
            for (std::size_t j = 0; j < columns.size(); ++j) counts(i, j) = stratum->counts(rows[i], columns[j]);
        const CountTable table = CountTable::from_counts(counts, any_shape);
        const Matrix deviations = deviations_from_expected(table);  // kept rows and columns of this stratum only
        std::vector<double> row_total(rows.size(), 0.0), column_total(columns.size(), 0.0);
        for (std::size_t i = 0; i < table.rows(); ++i) {
            row_total[table.kept_rows()[i]] = table.row_total(i);
            for (std::size_t j = 0; j < table.columns(); ++j) {
                const std::size_t r = table.kept_rows()[i], c = table.kept_columns()[j];
                if (r < r1 && c < c1) difference[r * c1 + c] += deviations(i, j);
            }
        }
        for (std::size_t j = 0; j < table.columns(); ++j) column_total[table.kept_columns()[j]] = table.column_total(j);

        const double n = table.total();
        for (std::size_t i = 0; i < r1; ++i) {
            const double p = row_total[i] / n;
            for (std::size_t k = 0; k < r1; ++k) a[i * r1 + k] = p * ((i == k ? 1.0 : 0.0) - row_total[k] / n);
        }
        for (std::size_t j = 0; j < c1; ++j) {
            const double q = column_total[j] / n;
            for (std::size_t l = 0; l < c1; ++l) b[j * c1 + l] = q * ((j == l ? 1.0 : 0.0) - column_total[l] / n);
        }
        // V_h = n²/(n − 1) · A ⊗ B; only the lower triangle is summed.
        const double factor = n * n / (n - 1);
        for (std::size_t i = 0; i < r1; ++i)
            for (std::size_t j = 0; j < c1; ++j) {
                const std::size_t row = i * c1 + j;
                for (std::size_t k = 0; k <= i; ++k) {
                    const double aik = factor * a[i * r1 + k];
                    if (aik == 0) continue;
                    double* target = &variance[row * size + k * c1];
                    const double* bj = &b[j * c1];
                    const std::size_t last = k == i ? j : c1 - 1;
                    for (std::size_t l = 0; l <= last; ++l) target[l] += aik * bj[l];
                }
            }
    }

    for (double value : variance)
        require(std::isfinite(value), "the counts are too large to compute with; divide them all by a common factor");
    double statistic = 0.0;
    require(quadratic_form(variance, size, difference, statistic),
            "the strata together cannot compare every row with every column (each stratum compares only the rows and "
            "columns that hold counts in it, and here they do not overlap enough); combine sparse categories or strata");
    result.statistic = statistic;
    result.df = static_cast<double>(size);
    result.p_value = chi_squared_p_value(result.statistic, result.df);
    return result;
}

GeneralAssociationResult general_association_test(const CellGrid& range, const GeneralAssociationLimits& limits) {
    return general_association_test(read_long_strata(range), limits);
}

}  // namespace assoc
