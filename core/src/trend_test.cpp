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

    double n = 0.0, events = 0.0, score_sum = 0.0;
    for (std::size_t i = 0; i < k; ++i) {
        require(std::isfinite(first(i)) && first(i) >= 0 && std::isfinite(second(i)) && second(i) >= 0,
                "counts must be numbers of 0 or more");
        if (!std::isfinite(score(i))) throw Error("scores must be ordinary numbers, not " + format_number(score(i)));
        const double total = first(i) + second(i);
        n += total;
        events += first(i);
        score_sum += total * score(i);
    }
    require(n > 0, "the table holds no counts");
    const double mean_score = score_sum / n;
    // Centred sums: no cancellation between Σ x s and N p̄ s̄.
    double numerator = 0.0, score_spread = 0.0;
    for (std::size_t i = 0; i < k; ++i) {
        const double centred = score(i) - mean_score;
        numerator += first(i) * centred;
        score_spread += (first(i) + second(i)) * centred * centred;
    }
    const double share = events / n;
    require(share > 0 && share < 1, std::string("every count is in the ") + (share > 0 ? "first" : "second") +
                                        " outcome, so there is no share that could change");
    require(score_spread > 0, "the categories that hold counts all have the same score, so there is no order to test");

    result.z = numerator / std::sqrt(share * (1 - share) * score_spread);
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
