#include "assoc/pairwise_comparisons.hpp"

#include <algorithm>
#include <chrono>
#include <cmath>

#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "assoc/statistics.hpp"
#include "assoc/validity.hpp"
#include "exact_limits.hpp"
#include "row_names.hpp"

namespace assoc {
namespace {

using Clock = std::chrono::steady_clock;

std::string quoted_pair(const PairComparison& pair) {
    return "\"" + pair.first_name + "\"–\"" + pair.second_name + "\"";
}

// "A and B", "A, B and C", or the first three and how many more.
std::string listed(const std::vector<std::string>& items) {
    const std::size_t shown = std::min<std::size_t>(items.size(), 3);
    std::string text;
    for (std::size_t i = 0; i < shown; ++i)
        text += (i == 0 ? "" : i + 1 == shown && shown == items.size() ? " and " : ", ") + items[i];
    if (items.size() > shown) text += " and " + std::to_string(items.size() - shown) + " more";
    return text;
}

// The error when the exact tests of all pairs do not fit the limits.
Error pairs_limit_error(const ExactLimits& limits, const PairComparison& pair) {
    return Error("the exact tests of the pairs need more time or memory than allowed (" +
                 format_number(limits.max_seconds, 3) + " seconds for all pairs together and " +
                 detail::megabytes(limits.max_memory_bytes) + " MB of working memory; they stopped at the pair " + quoted_pair(pair) +
                 "); use \"pearson\" for chi-squared p-values instead");
}

}  // namespace

double PairwiseComparisons::smallest_adjusted_p_value() const {
    double smallest = 1.0;
    for (const PairComparison& pair : pairs) smallest = std::min(smallest, pair.adjusted_p_value);
    return smallest;
}

PairwiseComparisons pairwise_comparisons(const CountTable& table, PAdjustment adjustment, PairwiseMethod method,
                                         const ExactLimits& limits) {
    const std::size_t rows = table.rows();
    require(rows >= 2, "pairwise comparisons need at least 2 rows with counts; this table has " + std::to_string(rows));
    require(rows <= max_pairwise_rows, "pairwise comparisons take at most " + std::to_string(max_pairwise_rows) +
                                           " rows with counts (" + format_count(max_pairwise_rows * (max_pairwise_rows - 1) / 2.0) +
                                           " pairs); this table has " + format_count(static_cast<double>(rows)));
    if (method == PairwiseMethod::exact)
        require(table.whole_counts(), "the exact test needs whole counts; this table holds counts that are not whole numbers");

    const std::vector<std::string> names = detail::body_row_names(table);
    PairwiseComparisons result;
    for (const SetAside& aside : table.set_aside_rows()) {
        std::string sentence = detail::row_reference(table, aside.index, names[aside.index]) +
                               (aside.why == SetAside::Why::total ? " is a total and takes no part in the comparisons."
                                                                  : " has no counts and takes no part in the comparisons.");
        sentence[0] = 'R';
        result.remarks.push_back(sentence);
    }

    std::vector<std::string> one_column, doubtful;
    const Clock::time_point start = Clock::now();
    for (std::size_t i = 0; i < rows; ++i) {
        for (std::size_t j = i + 1; j < rows; ++j) {
            PairComparison pair;
            pair.first = table.kept_rows()[i];
            pair.second = table.kept_rows()[j];
            pair.first_name = names[pair.first];
            pair.second_name = names[pair.second];

            Matrix counts(2, table.columns());
            for (std::size_t c = 0; c < table.columns(); ++c) {
                counts(0, c) = table.count(i, c);
                counts(1, c) = table.count(j, c);
            }
            ReadOptions options;
            options.require_two_by_two = false;
            const CountTable two_rows = CountTable::from_counts(counts, options);
            if (two_rows.columns() < 2) {
                // Both rows have all their counts in the same column: their shares are identical.
                pair.p_value = 1.0;
                one_column.push_back(quoted_pair(pair));
            } else if (method == PairwiseMethod::pearson) {
                pair.p_value = independence_test(two_rows, Method::pearson).p_value;
                if (check_validity(two_rows).exact_test_recommended) doubtful.push_back(quoted_pair(pair));
            } else {
                const double spent = std::chrono::duration<double>(Clock::now() - start).count();
                if (spent >= limits.max_seconds) throw pairs_limit_error(limits, pair);
                // The caller's limits (its forecast too), with the time the earlier pairs left.
                ExactLimits left = limits;
                left.max_seconds -= spent;
                try {
                    pair.p_value = exact_p_value(two_rows, Side::two_sided, left);
                } catch (const Error&) {
                    throw pairs_limit_error(limits, pair);
                }
            }
            result.pairs.push_back(pair);
        }
    }

    std::vector<double> p_values;
    for (const PairComparison& pair : result.pairs) p_values.push_back(pair.p_value);
    const std::vector<double> adjusted = adjust_p_values(p_values, adjustment);
    for (std::size_t k = 0; k < result.pairs.size(); ++k) result.pairs[k].adjusted_p_value = adjusted[k];

    if (!one_column.empty())
        result.remarks.push_back("The pair" + std::string(one_column.size() == 1 ? " " : "s ") + listed(one_column) +
                                 (one_column.size() == 1 ? " has" : " have") +
                                 " all counts in one column, so the two rows' shares are the same; the p-value is 1.");
    if (!doubtful.empty())
        result.remarks.push_back("The chi-squared p-value" + std::string(doubtful.size() == 1 ? " of the pair " : "s of the pairs ") +
                                 listed(doubtful) + (doubtful.size() == 1 ? " is" : " are") +
                                 " doubtful (small expected counts); \"exact\" tests each pair exactly.");
    return result;
}

}  // namespace assoc
