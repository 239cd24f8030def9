// No exception but assoc::Error leaves the core (Boost's included), and what does come back for an
// accepted table is a number, not NaN. Each test drives every public function over awkward inputs.
#include <gtest/gtest.h>

#include <cmath>
#include <functional>
#include <limits>
#include <string>
#include <vector>

#include "assoc/chi_squared_distribution.hpp"
#include "assoc/common_risk_ratio.hpp"
#include "assoc/effect_size.hpp"
#include "assoc/expected_counts.hpp"
#include "assoc/generalized_mantel_haenszel.hpp"
#include "assoc/ordinal_measures.hpp"
#include "assoc/ordinal_test.hpp"
#include "assoc/pairwise_comparisons.hpp"
#include "assoc/rates.hpp"
#include "assoc/residuals.hpp"
#include "assoc/statistics.hpp"
#include "assoc/validity.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::counts_table;

namespace {

constexpr double infinity = std::numeric_limits<double>::infinity();
const double not_a_number = std::nan("");

// Runs `action`; it may return or throw assoc::Error with a non-empty message, nothing else.
// Returns whether it returned.
bool returns_or_throws_error(const std::function<void()>& action, const std::string& what) {
    try {
        action();
        return true;
    } catch (const Error& error) {
        EXPECT_FALSE(std::string(error.what()).empty()) << what;
    } catch (const std::exception& other) {
        ADD_FAILURE() << what << " threw a non-assoc exception: " << other.what();
    } catch (...) {
        ADD_FAILURE() << what << " threw something that is not an exception";
    }
    return false;
}

// Awkward tables: extreme magnitudes, subnormal counts, near-independence, zero cells, a long
// table. Some are refused when read (with an assoc::Error); the others must compute.
std::vector<Matrix> awkward_counts() {
    auto matrix = [](std::initializer_list<std::initializer_list<double>> rows) {
        Matrix m(rows.size(), rows.begin()->size());
        std::size_t r = 0;
        for (const auto& row : rows) {
            std::size_t c = 0;
            for (double value : row) m(r, c++) = value;
            ++r;
        }
        return m;
    };
    std::vector<Matrix> tables = {
        matrix({{1e300, 1e-300}, {1e-300, 1e300}}),
        matrix({{1e300, 1e-300}, {1e-300, 1e-300}}),
        matrix({{1e200, 1e200}, {1e200, 2e200}}),
        matrix({{5e-324, 5e-324}, {5e-324, 1e-323}}),
        matrix({{1e-300, 2e-300, 3e-300}, {4e-300, 5e-300, 7e-300}}),
        matrix({{1, 1e17}, {1e17, 1e17}}),
        matrix({{0, 5}, {5, 0}}),
        matrix({{1e8, 1e8 + 1}, {1e8 + 2, 1e8}}),
        matrix({{0.001, 0}, {0, 0.002}}),
        matrix({{1, 0, 0}, {0, 1, 0}, {0, 0, 1e15}}),
    };
    Matrix wide(2, 5000);
    for (std::size_t c = 0; c < 5000; ++c) {
        wide(0, c) = static_cast<double>(c % 7 + 1);
        wide(1, c) = static_cast<double>(c % 5 + 1);
    }
    tables.push_back(wide);
    return tables;
}

}  // namespace

TEST(ErrorContainment, EveryTableFunctionReturnsANumberOrAnAssocErrorOnAwkwardTables) {
    int table_number = 0;
    for (const Matrix& counts : awkward_counts()) {
        const std::string name = "table " + std::to_string(++table_number);
        CountTable table;
        if (!returns_or_throws_error([&] { table = CountTable::from_counts(counts); }, name)) continue;
        auto finite = [&](double value, const std::string& what) {
            EXPECT_FALSE(std::isnan(value)) << what << " on " << name;
        };
        auto finite_matrix = [&](const Matrix& m, const std::string& what) {
            for (double value : m.values()) finite(value, what);
        };
        returns_or_throws_error([&] { finite(pearson_statistic(table), "X²"); }, name);
        returns_or_throws_error([&] { finite(likelihood_ratio_statistic(table), "G²"); }, name);
        returns_or_throws_error([&] { finite(yates_statistic(table), "Yates"); }, name);
        for (Method method : {Method::pearson, Method::likelihood_ratio, Method::yates})
            returns_or_throws_error([&] { finite(independence_test(table, method).p_value, "p"); }, name);
        returns_or_throws_error([&] { finite_matrix(expected_counts(table), "E"); }, name);
        returns_or_throws_error([&] { finite_matrix(deviations_from_expected(table), "O − E"); }, name);
        for (ResidualKind kind : {ResidualKind::raw, ResidualKind::pearson, ResidualKind::adjusted,
                                  ResidualKind::contribution, ResidualKind::percent})
            returns_or_throws_error([&] { finite_matrix(residuals(table, kind), "residuals"); }, name);
        returns_or_throws_error([&] { finite(cramers_v(table), "V"); }, name);
        returns_or_throws_error([&] { finite(cramers_v_corrected(table), "corrected V"); }, name);
        returns_or_throws_error([&] { finite(phi_coefficient(table), "phi"); }, name);
        returns_or_throws_error([&] { finite(contingency_coefficient(table), "C"); }, name);
        returns_or_throws_error([&] { finite(cohens_w(table), "w"); }, name);
        returns_or_throws_error([&] { EXPECT_FALSE(check_validity(table).summary().empty()); }, name);
    }
}

TEST(ErrorContainment, TheDistributionFunctionsThrowOnlyAssocErrors) {
    const std::vector<double> values = {-infinity, -1, -1e-300, 0, 4.9e-324, 1e-300, 1e-10, 0.05, 0.5,  1,
                                        2,         10, 600,     1e6, 1e10,    1e11,   1e300, infinity, not_a_number};
    for (double a : values)
        for (double b : values) {
            const std::string what = std::to_string(a) + ", " + std::to_string(b);
            returns_or_throws_error([&] { EXPECT_GE(chi_squared_p_value(a, b), 0.0) << what; }, "p " + what);
            returns_or_throws_error([&] { EXPECT_GE(chi_squared_critical_value(a, b), 0.0) << what; }, "c " + what);
        }
}

TEST(ErrorContainment, TablesReadWithoutTheTwoByTwoRequirementFailWithAssocErrorsOnly) {
    ReadOptions options;
    options.require_two_by_two = false;
    Matrix one_row(1, 3, 2.0), all_zero(2, 2, 0.0);
    for (const Matrix& counts : {one_row, all_zero}) {
        const CountTable table = CountTable::from_counts(counts, options);
        returns_or_throws_error([&] { pearson_statistic(table); }, "X²");
        returns_or_throws_error([&] { likelihood_ratio_statistic(table); }, "G²");
        returns_or_throws_error([&] { independence_test(table); }, "test");
        returns_or_throws_error([&] { residuals(table, ResidualKind::adjusted); }, "adjusted");
        returns_or_throws_error([&] { residuals(table, ResidualKind::percent); }, "percent");
        returns_or_throws_error([&] { cramers_v(table); }, "V");
        returns_or_throws_error([&] { cramers_v_corrected(table); }, "corrected V");
        returns_or_throws_error([&] { check_validity(table); }, "validity");  // an empty table crashed here
    }
}

// The tests for ordered tables and r×c strata on the same awkward tables (each table also as two
// strata: itself and itself reversed).
TEST(ErrorContainment, TheOrderedAndStratifiedTestsReturnANumberOrAnAssocErrorOnAwkwardTables) {
    int table_number = 0;
    for (const Matrix& counts : awkward_counts()) {
        const std::string name = "table " + std::to_string(++table_number);
        CountTable table;
        if (!returns_or_throws_error([&] { table = CountTable::from_counts(counts); }, name)) continue;
        auto finite = [&](double value, const std::string& what) { EXPECT_FALSE(std::isnan(value)) << what << " on " << name; };
        returns_or_throws_error([&] { finite(ordinal_test(table).statistic, "M²"); }, name);
        returns_or_throws_error([&] { finite(ordinal_test(table).p_value, "ordinal p"); }, name);
        returns_or_throws_error([&] { finite(goodman_kruskal_gamma(table), "gamma"); }, name);
        returns_or_throws_error([&] { finite(kendall_tau_b(table), "tau-b"); }, name);
        LongStrata strata;
        strata.row_labels.assign(counts.rows(), "");
        strata.column_labels.assign(counts.columns(), "");
        Matrix reversed(counts.rows(), counts.columns());
        for (std::size_t r = 0; r < counts.rows(); ++r)
            for (std::size_t c = 0; c < counts.columns(); ++c)
                reversed(r, c) = counts(counts.rows() - 1 - r, c);
        strata.strata = {{"A", counts}, {"B", reversed}};
        returns_or_throws_error([&] { finite(general_association_test(strata).statistic, "generalized CMH"); }, name);
    }
}

// Rates, rate differences, pairwise comparisons and the common risk ratio read ranges themselves:
// awkward counts as cells, 2 or 4 columns so that every one of them reads them.
namespace {

CellGrid grid_of(const std::vector<std::vector<double>>& rows) {
    CellGrid cells(rows.size(), rows.front().size());
    for (std::size_t r = 0; r < rows.size(); ++r)
        for (std::size_t c = 0; c < rows[r].size(); ++c) cells.at(r, c) = Cell::number(rows[r][c]);
    return cells;
}

const std::vector<std::vector<std::vector<double>>> awkward = {
    {{1e300, 1e-300}, {1e-300, 1e300}},
    {{1.7e308, 1e-300}, {1e-300, 1e-300}},
    {{1e200, 1e200}, {1e200, 2e200}},
    {{5e-324, 5e-324}, {5e-324, 1e-323}},
    {{0.001, 0}, {0, 0.002}},
    {{1e-6, 10}, {1e-7, 10}},
    {{1, 1e17}, {1e17, 1e17}},
    {{0, 5}, {5, 0}},
    {{1e300, 1e-300, 1e-300, 1e300}, {5e-324, 1, 1, 5e-324}},
    {{1e308, 1e308, 1, 1}, {2, 3, 1e-300, 4}},
};

void expect_finite(double value, const std::string& what) { EXPECT_TRUE(std::isfinite(value)) << what; }

}  // namespace

TEST(ErrorContainment, RatesPairsAndTheCommonRiskRatioReturnFiniteNumbersOrAnAssocErrorOnAwkwardCounts) {
    int number = 0;
    for (const auto& rows : awkward) {
        const std::string name = "table " + std::to_string(++number);
        const CellGrid range = grid_of(rows);
        returns_or_throws_error([&] {
            for (const RowRate& row : row_rates(range).rows) {
                if (!row.has_counts) continue;
                expect_finite(row.rate.rate, name);
                EXPECT_LE(0.0, row.rate.lower) << name;
                EXPECT_LE(row.rate.lower, row.rate.rate) << name;
                EXPECT_LE(row.rate.rate, row.rate.upper) << name;
                EXPECT_LE(row.rate.upper, 1.0) << name;
            }
        }, name + " rates");
        returns_or_throws_error([&] {
            const RateDifference d = rate_difference(range);
            expect_finite(d.lower, name);
            expect_finite(d.upper, name);
            EXPECT_LE(-1.0, d.lower) << name;
            EXPECT_LE(d.lower, d.difference) << name;
            EXPECT_LE(d.difference, d.upper) << name;
            EXPECT_LE(d.upper, 1.0) << name;
        }, name + " difference");
        returns_or_throws_error([&] {
            for (PairwiseMethod method : {PairwiseMethod::pearson, PairwiseMethod::exact})
                for (const PairComparison& pair :
                     pairwise_comparisons(read_count_table(range), PAdjustment::holm, method, {2.0, 100'000'000}).pairs) {
                    EXPECT_TRUE(pair.p_value >= 0 && pair.p_value <= 1) << name;
                    EXPECT_TRUE(pair.adjusted_p_value >= pair.p_value && pair.adjusted_p_value <= 1) << name;
                }
        }, name + " pairs");
        returns_or_throws_error([&] {
            const CommonRiskRatio ratio = common_risk_ratio(range);
            expect_finite(ratio.ratio.estimate, name);
            expect_finite(ratio.ratio.lower, name);
            expect_finite(ratio.ratio.upper, name);
        }, name + " common risk ratio");
    }
}
