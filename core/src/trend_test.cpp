#include "assoc/trend_test.hpp"

#include <boost/math/distributions/normal.hpp>
#include <algorithm>
#include <cmath>
#include <string>
#include <vector>

#include "assoc/count_table.hpp"
#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "assoc/validity.hpp"
#include "boost_policy.hpp"
#include "category_order.hpp"
#include "cell_line.hpp"
#include "extended_arithmetic.hpp"
#include "row_names.hpp"

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
    // z = T √N / √(X Y U), X and Y the two outcomes' totals, N = X + Y, with
    //   T = Σ (x_i Y − y_i X) d_i   and   U = N Σ n_i d_i² − (Σ n_i d_i)²,
    // where d_i = s_i − s_m is each score less the score of the category with the most counts. Any
    // shift of the scores gives the same T and U in exact arithmetic (Σ (x_i Y − y_i X) = 0); this
    // one keeps U free of cancellation: the category m weighs at least 1/k of N, so N Σ n d² is at
    // most k + 1 times U. Centred on an arbitrary score instead (or written N Σ x s − X Σ n s), a
    // count near 1e30 beside single digits left U and T as the difference of two numbers equal to
    // 30 digits, and z depended on the scores at 2e-4 (fuzz/corpus/trend/lopsided_counts_*). Every
    // sum is in double-double from exact products and differences, on counts scaled by an even
    // power of two and differences of scores by any power of two (both exact; z scales with the
    // square root of the counts and not at all with the scores), so nothing overflows.
    using detail::DoubleDouble;
    using detail::exact_product;
    using detail::exact_sum;
    double largest_count = 0.0;
    std::size_t most = 0;
    for (std::size_t i = 0; i < k; ++i) {
        largest_count = std::max({largest_count, first(i), second(i)});
        if (first(i) + second(i) > first(most) + second(most)) most = i;
    }
    require(largest_count > 0, "the table holds no counts");
    const int count_exponent = 2 * (std::ilogb(largest_count) / 2);
    std::vector<DoubleDouble> difference(k);
    double largest_difference = 0.0;
    bool scores_differ = false;
    for (std::size_t i = 0; i < k; ++i) {
        difference[i] = exact_sum(score(i), -score(most));
        largest_difference = std::max(largest_difference, std::fabs(difference[i].hi));
        if (difference[i].hi != 0 && first(i) + second(i) > 0) scores_differ = true;
    }
    require(scores_differ, "the categories that hold counts all have the same score, so there is no order to test");
    const int score_exponent = std::ilogb(largest_difference);
    DoubleDouble events, others;  // X, N − X
    std::vector<double> x(k), y(k);
    for (std::size_t i = 0; i < k; ++i) {
        x[i] = std::ldexp(first(i), -count_exponent);
        y[i] = std::ldexp(second(i), -count_exponent);
        difference[i] = {std::ldexp(difference[i].hi, -score_exponent), std::ldexp(difference[i].lo, -score_exponent)};
        events = events + DoubleDouble{x[i], 0};
        others = others + DoubleDouble{y[i], 0};
    }
    require(events.hi > 0 && others.hi > 0, std::string("every count is in the ") + (events.hi > 0 ? "first" : "second") +
                                                " outcome, so there is no share that could change");
    const DoubleDouble n = events + others;
    DoubleDouble numerator, weighted, weighted_squares;  // T, Σ n d, Σ n d²
    for (std::size_t i = 0; i < k; ++i) {
        const DoubleDouble count = exact_sum(x[i], y[i]);
        const DoubleDouble weighted_difference = count * difference[i];
        weighted = weighted + weighted_difference;
        weighted_squares = weighted_squares + weighted_difference * difference[i];
        numerator = numerator + (DoubleDouble{x[i], 0} * others - DoubleDouble{y[i], 0} * events) * difference[i];
    }
    const DoubleDouble spread = n * weighted_squares - weighted * weighted;
    require(spread.hi > 0, "the scores of the categories that hold counts differ too little to be told apart");
    // Each factor under its own root: with one count near 1e301 beside single digits, X, N − X and U
    // scale to about 1, 1e-300 and 1e-300, whose product underflowed to 0 (z was infinite).
    const double scaled_z = numerator.value() * std::sqrt(n.value()) /
                            (std::sqrt(events.value()) * std::sqrt(others.value()) * std::sqrt(spread.value()));
    result.z = std::ldexp(scaled_z, count_exponent / 2);
    // |z| ≤ √N (z² = N r², r the correlation of the outcome with the score); rounding could pass it by
    // an ulp, and at N near the largest double z² then overflowed (found by the trend fuzz target).
    const double total = std::ldexp(n.value(), count_exponent);
    if (std::isfinite(total) && std::fabs(result.z) > std::sqrt(total)) result.z = std::copysign(std::sqrt(total), result.z);
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
    if (scores.empty() && (body.rows() == 2 || body.columns() == 2)) {
        // The categories run along the columns of a 2×k table (as trend_test(Matrix) decides).
        const bool in_columns = body.rows() == 2;
        if (auto why = detail::categories_out_of_order(detail::category_labels(read, !in_columns),
                                                       in_columns ? "column" : "row", "scores"))
            throw Error(*why);
    }
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
    TrendResult result = trend_test(body, score_values);
    result.remarks = table_notes(read);
    return result;
}

}  // namespace assoc
