// The exact test's early refusal (ExactLimits::forecast): a table that cannot finish within the
// limits is refused with the limit's own message without spending the limit first, and a table
// that finishes is computed as without the forecast. Nothing here is timed (speed is measured by
// bench/exact_refusal_validation.cpp): a refusal that came only at the limit would make the tests
// with a ten-minute limit run for ten minutes.
#include <gtest/gtest.h>

#include <string>
#include <utility>
#include <vector>

#include "assoc/error.hpp"
#include "assoc/exact_test.hpp"
#include "test_support.hpp"

using namespace assoc;
using assoc::test::counts_table;
using assoc::test::expect_error;

namespace {

ExactLimits with_forecast(double seconds, std::size_t bytes, bool forecast = true) {
    ExactLimits limits{seconds, bytes};
    limits.forecast = forecast;
    return limits;
}

const std::string instead = "use ASSOC.SIMULATE(range; ; ; \"exact\") for a Monte Carlo estimate of the exact p-value "
                            "instead";
const std::string ten_minutes = " than allowed (the limit is 600 seconds and 400 MB of working memory); " + instead;

}  // namespace

// Invented, 5×4 with 200,000 records: the first column alone can be filled in about 10¹³ ways.
TEST(ExactRefusal, RefusesATableOfTwoHundredThousandCountsAtOnceEvenWithTenMinutes) {
    expect_error([] {
        exact_p_value(counts_table({{10400, 9600, 10000, 10000}, {9800, 10200, 10000, 10000},
                                    {10000, 10000, 10400, 9600}, {10200, 9800, 10000, 10000},
                                    {10000, 10000, 9800, 10200}}),
                      Side::two_sided, with_forecast(600, 400'000'000));
    }, "the exact test for this table needs more time" + ten_minutes);
}

// bench/exact_suite.txt "4x4_n80" (invented): the futures of its last two columns hold about
// 530,000 values, more than 5 MB; the refusal names the memory, and comes at the memory limit,
// not after ten minutes.
TEST(ExactRefusal, RefusesATableWhoseFuturesCannotFitInTheMemoryLimit) {
    expect_error([] {
        exact_p_value(counts_table({{6, 3, 0, 4}, {4, 6, 1, 6}, {5, 2, 4, 7}, {7, 2, 6, 17}}), Side::two_sided,
                      with_forecast(600, 5'000'000));
    }, "the exact test for this table needs more memory than allowed (the limit is 600 seconds and 5 MB of working "
       "memory); " + instead);
}

// The memory of the last stage's futures is foreseen from the lists built so far, and the
// forecast must not refuse a table that fits: around the least memory bench/exact_suite.txt
// "4x4_n80" (invented) needs (about 15.5 MB here; its futures hold about 530,000 values), every
// limit gives the same outcome with the forecast as without it, a refusal naming the memory or
// the very same p-value. Nothing here reads the clock in a way that matters (ten minutes).
TEST(ExactRefusal, ForeseesTheMemoryOfTheFuturesWithoutRefusingATableThatFits) {
    const CountTable table = counts_table({{6, 3, 0, 4}, {4, 6, 1, 6}, {5, 2, 4, 7}, {7, 2, 6, 17}});
    // The p-value, or the refusal's message.
    const auto outcome = [&table](std::size_t bytes, bool forecast) -> std::pair<double, std::string> {
        try {
            return {exact_p_value(table, Side::two_sided, with_forecast(600, bytes, forecast)), ""};
        } catch (const Error& e) {
            return {-1, e.what()};
        }
    };
    int computed = 0, refused = 0;
    for (std::size_t quarter_megabytes = 58; quarter_megabytes <= 66; ++quarter_megabytes) {
        const std::size_t bytes = quarter_megabytes * 250'000;
        const auto without = outcome(bytes, false);
        EXPECT_EQ(outcome(bytes, true), without) << "limit of " << bytes << " bytes";
        ++(without.second.empty() ? computed : refused);
    }
    // The limits straddle the need: some are refused, some computed.
    EXPECT_GT(computed, 0);
    EXPECT_GT(refused, 0);
}

// Tables of bench/exact_suite.txt that finish well within ASSOC.EXACT's limits (5 s, 400 MB), of
// the shapes the forecast treats differently (few and many stages, 2 to 8 rows): computed, with
// the very p-value the test gives without the forecast (exact identity: the forecast only reads).
// The forecast reads the clock, so the limit here is four times the worksheet's: under the
// sanitizers (build-sanitize/, build-clang/) the enumeration is 2 to 8 times slower, unevenly
// across its stages, and on a machine running two test commands at once the 2×12 table was
// refused at 5 s. That no table finishing within 5 s is refused in the release build is measured
// by bench/exact_refusal_validation.cpp, not here.
TEST(ExactRefusal, ComputesTablesThatFinishWithTheSameValueAsWithoutTheForecast) {
    const std::vector<std::vector<std::vector<double>>> tables = {
        {{6, 4, 8, 8, 5, 5}, {2, 15, 6, 8, 8, 4}, {0, 3, 9, 2, 4, 3}},                                    // 3x6_n100
        {{0, 4, 1, 3, 3}, {1, 3, 3, 1, 0}, {2, 3, 5, 3, 3}, {1, 0, 1, 3, 1}, {2, 3, 3, 0, 1}},           // 5x5_n50_a
        {{20, 9, 20, 12, 15, 25, 24, 30, 13, 10, 26, 12}, {4, 4, 13, 3, 8, 7, 14, 11, 5, 5, 4, 6}},      // 2x12_n300
        {{3, 4, 1, 1, 4, 2, 5, 2, 4, 1, 3, 4, 1, 1, 4},
         {1, 7, 4, 1, 1, 3, 5, 3, 6, 1, 0, 1, 4, 3, 4},
         {2, 4, 3, 1, 0, 5, 4, 0, 3, 2, 1, 1, 6, 2, 2}},                                                  // 3x15_n120
    };
    for (const auto& rows : tables) {
        std::vector<double> counts;
        for (const auto& row : rows) counts.insert(counts.end(), row.begin(), row.end());
        const CountTable table = counts_table(rows.size(), rows.front().size(), counts);
        const double without = exact_p_value(table, Side::two_sided, with_forecast(600, 400'000'000, false));
        EXPECT_EQ(exact_p_value(table, Side::two_sided, with_forecast(20, 400'000'000)), without);
    }
}
