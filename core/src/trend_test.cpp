#include "assoc/trend_test.hpp"

#include <boost/math/distributions/normal.hpp>
#include <algorithm>
#include <cmath>
#include <string>

#include "assoc/count_table.hpp"
#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "boost_policy.hpp"
#include "cell_line.hpp"
#include "extended_arithmetic.hpp"

namespace assoc {

TrendResult trend_test(const Matrix& table, const std::vector<double>& scores) {
    TrendResult result;
    require(table.rows() == 2 || table.columns() == 2,
            "the trend test needs a table with 2 rows (outcomes) and a column per ordered category, or 2 columns "
            "and a row per category; this one has " +
                std::to_string(table.rows()) + " rows and " + std::to_string(table.columns()) + " columns of counts");
    result.categories_in_columns = table.rows() == 2;
    const std::size_t k = result.categories_in_columns ? table.columns() : table.rows();
    result.categories = k;
    require(k >= 2, "the trend test needs at least 2 ordered categories");
    require(scores.empty() || scores.size() == k, "there are " + std::to_string(scores.size()) + " scores for " +
                                                      std::to_string(k) + " categories; give one score per category");

    // first(i), second(i): the two outcome counts of category i.
    const auto first = [&](std::size_t i) { return result.categories_in_columns ? table(0, i) : table(i, 0); };
    const auto second = [&](std::size_t i) { return result.categories_in_columns ? table(1, i) : table(i, 1); };
    const auto score = [&](std::size_t i) { return scores.empty() ? static_cast<double>(i + 1) : scores[i]; };

    for (std::size_t i = 0; i < k; ++i) {
        require(std::isfinite(first(i)) && first(i) >= 0 && std::isfinite(second(i)) && second(i) >= 0,
                "counts must be numbers of 0 or more");
        if (!std::isfinite(score(i))) throw Error("scores must be ordinary numbers, not " + format_number(score(i)));
    }
    // z = T √N / √(X (N − X) U) with T = N Σ x s − X Σ n s and U = N Σ n s² − (Σ n s)²: the same z
    // without the mean score, whose rounding cost up to 2e-11 of z at counts near 1e5 (and z enters a
    // far-tail p-value roughly squared). Every sum is in double-double from exact products, on counts
    // scaled by an even power of two and scores by any power of two (both exact; z scales with the
    // square root of the counts and not at all with the scores), so nothing overflows.
    using detail::DoubleDouble;
    using detail::exact_product;
    double largest_count = 0.0, largest_score = 0.0;
    for (std::size_t i = 0; i < k; ++i) {
        largest_count = std::max({largest_count, first(i), second(i)});
        largest_score = std::max(largest_score, std::fabs(score(i)));
    }
    require(largest_count > 0, "the table holds no counts");
    const int count_exponent = 2 * (std::ilogb(largest_count) / 2);
    const int score_exponent = largest_score > 0 ? std::ilogb(largest_score) : 0;
    DoubleDouble n, events, others, weighted_events, weighted, weighted_squares;  // N, X, N − X, Σxs, Σns, Σns²
    for (std::size_t i = 0; i < k; ++i) {
        const double x = std::ldexp(first(i), -count_exponent), y = std::ldexp(second(i), -count_exponent);
        const double s = std::ldexp(score(i), -score_exponent);
        const DoubleDouble square = exact_product(s, s);
        events = events + DoubleDouble{x, 0};
        others = others + DoubleDouble{y, 0};
        weighted_events = weighted_events + exact_product(x, s);
        weighted = weighted + exact_product(x, s) + exact_product(y, s);
        weighted_squares = weighted_squares + DoubleDouble{x, 0} * square + DoubleDouble{y, 0} * square;
    }
    n = events + others;
    require(events.hi > 0 && others.hi > 0, std::string("every count is in the ") + (events.hi > 0 ? "first" : "second") +
                                                " outcome, so there is no share that could change");
    const DoubleDouble spread = n * weighted_squares - weighted * weighted;
    // Equal scores give U = 0 exactly in exact arithmetic; here it is within rounding of 0.
    require(spread.hi > 0x1p-96 * (n * weighted_squares).hi,
            "the categories that hold counts all have the same score, so there is no order to test");
    const DoubleDouble numerator = n * weighted_events - events * weighted;
    // Each factor under its own root: with one count near 1e301 beside single digits, X, N − X and U
    // scale to about 1, 1e-300 and 1e-300, whose product underflowed to 0 (z was infinite).
    const double scaled_z = numerator.value() * std::sqrt(n.value()) /
                            (std::sqrt(events.value()) * std::sqrt(others.value()) * std::sqrt(spread.value()));
    result.z = std::ldexp(scaled_z, count_exponent / 2);
    result.statistic = result.z * result.z;
    const boost::math::normal_distribution<double, detail::Policy> normal;
    result.p_value = std::min(1.0, 2 * boost::math::cdf(boost::math::complement(normal, std::fabs(result.z))));
    return result;
}

TrendResult trend_test(const CellGrid& table, const CellGrid& scores) {
    ReadOptions options;
    options.require_two_by_two = false;  // a category nobody is in still has its score
    const CountTable read = read_count_table(table, options);
    const Matrix body = read.category_counts();  // every category keeps its place; totals are left out
    std::vector<double> score_values;
    if (!scores.empty()) {
        const detail::CellLine line(scores, "scores");
        for (std::size_t i = 0; i < line.size(); ++i) {
            const Cell& cell = line[i];
            if (!(cell.is_number() && std::isfinite(cell.as_number())))
                throw Error("score " + std::to_string(i + 1) + " holds " + cell.describe() + "; scores must be numbers");
            score_values.push_back(cell.as_number());
        }
    }
    return trend_test(body, score_values);
}

}  // namespace assoc
