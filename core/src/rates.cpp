#include "assoc/rates.hpp"

#include <boost/math/distributions/normal.hpp>
#include <algorithm>
#include <cmath>

#include "argument_checks.hpp"
#include "assoc/count_table.hpp"
#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "assoc/outcome_column.hpp"
#include "assoc/validity.hpp"
#include "boost_policy.hpp"
#include "row_names.hpp"

namespace assoc {
namespace {

// z with P(|Z| ≤ z) = confidence.
double two_sided_z(double confidence) {
    const boost::math::normal_distribution<double, detail::Policy> normal;
    return boost::math::quantile(boost::math::complement(normal, (1 - confidence) / 2));
}

RateInterval wilson(double count, double total, double z) {
    const double z2 = z * z;
    RateInterval interval;
    interval.rate = count / total;
    const double p = interval.rate;
    // lower = (A − B) / (2(n + z²)) = 2x² / (n (A + B)), since A² − B² = 4x²(1 + z²/n): no cancellation.
    // From a total of 1 up, in shares of the total (A/n, B/n), so that huge counts cannot overflow;
    // below it in counts, so that z²/n cannot overflow for a tiny (weighted) total.
    double lower = 0.0, upper = 1.0;
    if (total >= 1) {
        const double a = 2 * p + z2 / total;
        const double b = z * std::sqrt(z2 / total / total + 4 * p * (1 - p) / total);
        lower = 2 * p * p / (a + b);
        upper = (a + b) / (2 * (1 + z2 / total));
    } else {
        const double a = 2 * count + z2;
        const double b = z * std::sqrt(z2 + 4 * count * (1 - p));
        lower = p * (2 * count / (a + b));
        upper = (a + b) / (2 * (total + z2));
    }
    // Exact ends at the edges, and rounding must not push an end past the rate or out of [0, 1].
    interval.lower = count == 0 ? 0.0 : std::min(std::max(lower, 0.0), p);
    interval.upper = count == total ? 1.0 : std::max(std::min(upper, 1.0), p);
    return interval;
}

RateDifference newcombe(double count1, double total1, double count2, double total2, double confidence) {
    const double z = two_sided_z(confidence);
    RateDifference result;
    result.confidence = confidence;
    result.first = wilson(count1, total1, z);
    result.second = wilson(count2, total2, z);
    const RateInterval& one = result.first;
    const RateInterval& two = result.second;
    result.difference = one.rate - two.rate;
    result.lower = result.difference - std::hypot(one.rate - one.lower, two.upper - two.rate);
    result.upper = result.difference + std::hypot(one.upper - one.rate, two.rate - two.lower);
    // The exact ends are inside [−1, 1] (each Wilson end is inside [0, 1]); keep rounding there too.
    result.lower = std::max(result.lower, -1.0);
    result.upper = std::min(result.upper, 1.0);
    return result;
}

void check_rate(double count, double total) {
    require(std::isfinite(total) && total > 0, "a rate needs a total above 0, not " + format_number(total));
    require(std::isfinite(count) && count >= 0 && count <= total,
            "the count of a rate must lie from 0 to its total " + format_number(total) + ", not " +
                format_number(count));
}

// A table of counts whose rows all stay in the result (a table of one row is fine).
CountTable read_rate_table(const CellGrid& range) {
    ReadOptions options;
    options.require_two_by_two = false;
    return read_count_table(range, options);
}

// The rates are those of the body's first column (the outcome), which must not read as the absence of
// another column of counts.
void require_outcome_column_first(const CountTable& table, const char* measure) {
    if (!table.has_column_labels()) return;
    std::vector<std::string> others = detail::category_labels(table, false);
    if (others.empty()) return;
    const std::string outcome = others.front();
    others.erase(others.begin());
    detail::require_outcome_first(outcome, others, measure);
}

}  // namespace

RateInterval wilson_interval(double count, double total, double confidence) {
    detail::check_confidence(confidence);
    check_rate(count, total);
    return wilson(count, total, two_sided_z(confidence));
}

RowRates row_rates(const CellGrid& range, double confidence) {
    detail::check_confidence(confidence);
    const CountTable table = read_rate_table(range);
    // Columns set aside as totals are not the rest: "Promoted | Total" holds one column of counts.
    std::size_t totals = 0;
    for (const SetAside& aside : table.set_aside_columns())
        if (aside.why == SetAside::Why::total) ++totals;
    if (table.body_columns() - totals < 2)
        throw Error("rates need at least 2 columns of counts (column 1 the outcome of interest, the others the "
                    "rest); this range has 1" + std::string(totals == 0 ? "" : totals == 1 ? " besides a total" :
                                                                                " besides its totals"));
    require(!table.kept_rows().empty(), "no row of the table has counts, so there is no rate to compute");
    require_outcome_column_first(table, "the rates");
    const Matrix body = table.to_body_shape(table.counts());
    const std::vector<std::string> names = detail::body_row_names(table);
    const double z = two_sided_z(confidence);

    RowRates result;
    result.confidence = confidence;
    result.remarks = table_notes(table);
    for (std::size_t r = 0; r < table.body_rows(); ++r) {
        RowRate row;
        row.name = names[r];
        for (std::size_t c = 0; c < table.body_columns(); ++c) row.total += body(r, c);
        row.has_counts = row.total > 0;
        const bool total_line =
            std::any_of(table.set_aside_rows().begin(), table.set_aside_rows().end(), [&](const SetAside& aside) {
                return aside.index == r && aside.why == SetAside::Why::total;
            });
        if (row.has_counts) {
            row.rate = wilson(body(r, 0), row.total, z);
        } else {
            std::string sentence = detail::row_reference(table, r, row.name) +
                                   (total_line ? " is a total of the other rows, so it has no rate of its own; its "
                                                 "line stays empty."
                                               : " has no counts, so it has no rate; its line stays empty.");
            sentence[0] = 'R';
            result.remarks.push_back(sentence);
        }
        result.rows.push_back(row);
    }
    return result;
}

RateDifference rate_difference(double count1, double total1, double count2, double total2, double confidence) {
    detail::check_confidence(confidence);
    check_rate(count1, total1);
    check_rate(count2, total2);
    return newcombe(count1, total1, count2, total2, confidence);
}

RateDifference rate_difference(const CellGrid& range, double confidence) {
    detail::check_confidence(confidence);
    const CountTable table = read_rate_table(range);
    // Total rows and columns are left out; the two groups and two outcomes must remain.
    const Matrix body = table.category_counts();
    require(body.rows() == 2 && body.columns() == 2,
            "the rate difference needs a 2×2 table (two groups, the outcome of interest and the rest); this range "
            "has " +
                std::to_string(body.rows()) + (body.rows() == 1 ? " row" : " rows") + " and " +
                std::to_string(body.columns()) + (body.columns() == 1 ? " column" : " columns") +
                " of counts");
    require_outcome_column_first(table, "the rate difference");
    const std::vector<std::string> names = detail::body_row_names(table);
    for (std::size_t r = 0; r < 2; ++r)
        require(body(r, 0) + body(r, 1) > 0, detail::row_reference(table, table.category_rows()[r],
                                                                   names[table.category_rows()[r]]) +
                                                 " has no counts, so it has no rate to compare; the rate difference "
                                                 "needs counts in both rows");
    RateDifference result = newcombe(body(0, 0), body(0, 0) + body(0, 1), body(1, 0), body(1, 0) + body(1, 1), confidence);
    result.remarks = table_notes(table);
    return result;
}

}  // namespace assoc
