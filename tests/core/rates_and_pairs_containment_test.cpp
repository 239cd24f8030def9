// Rates, rate differences, pairwise comparisons and the common risk ratio on awkward counts: each
// returns finite numbers or throws assoc::Error, nothing else (the rule of every core function).
#include <gtest/gtest.h>

#include <cmath>
#include <functional>
#include <string>
#include <vector>

#include "assoc/common_risk_ratio.hpp"
#include "assoc/pairwise_comparisons.hpp"
#include "assoc/rates.hpp"
#include "test_support.hpp"

using namespace assoc;

namespace {

// Runs `action`; it may return or throw assoc::Error with a non-empty message, nothing else.
void returns_or_throws_error(const std::function<void()>& action, const std::string& what) {
    try {
        action();
    } catch (const Error& error) {
        EXPECT_FALSE(std::string(error.what()).empty()) << what;
    } catch (const std::exception& other) {
        ADD_FAILURE() << what << " threw a non-assoc exception: " << other.what();
    } catch (...) {
        ADD_FAILURE() << what << " threw something that is not an exception";
    }
}

CellGrid grid_of(const std::vector<std::vector<double>>& rows) {
    CellGrid cells(rows.size(), rows.front().size());
    for (std::size_t r = 0; r < rows.size(); ++r)
        for (std::size_t c = 0; c < rows[r].size(); ++c) cells.at(r, c) = Cell::number(rows[r][c]);
    return cells;
}

// Extreme magnitudes, subnormal counts, zeros; 2 or 4 columns so that every function reads them.
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

TEST(RatesAndPairsContainment, EveryFunctionReturnsFiniteNumbersOrAnAssocErrorOnAwkwardCounts) {
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
