#include "assoc/paired_tests.hpp"

#include <algorithm>
#include <cmath>

#include "ascii_case.hpp"
#include "assoc/chi_squared_distribution.hpp"
#include "assoc/count_table.hpp"
#include "assoc/error.hpp"
#include "assoc/format.hpp"
#include "discrete_tail.hpp"
#include "stirling.hpp"

namespace assoc {

std::optional<PairedMethod> parse_paired_method(const std::string& word) {
    if (word.empty()) return std::nullopt;
    if (detail::equals_ignoring_case(word, "corrected")) return PairedMethod::corrected;
    if (detail::equals_ignoring_case(word, "uncorrected")) return PairedMethod::uncorrected;
    if (detail::equals_ignoring_case(word, "exact")) return PairedMethod::exact;
    throw Error("the method must be \"corrected\", \"uncorrected\" or \"exact\", not \"" + word + "\"");
}

namespace {

std::string not_square(std::size_t rows, std::size_t columns) {
    return "a paired table must be square, the same categories as rows and as columns; this one has " +
           std::to_string(rows) + " rows and " + std::to_string(columns) + " columns of counts";
}

// Two-sided: twice the smaller tail of Binomial(b + c, ½), at most 1. The tail comes from the same
// summation as Fisher's 2×2 test (discrete_tail.hpp), whose cost does not grow with the counts;
// Boost's binomial distribution lost digits at a million changes (2e-8 at 2e9, 2e-5 at 2e12) and
// took minutes, or gave nonsense, far beyond.
PairedResult exact_mcnemar(double b, double c) {
    require(b == std::floor(b) && c == std::floor(c),
            "the exact paired test needs whole counts; the cells off the diagonal hold " + format_number(b, 15) +
                " and " + format_number(c, 15));
    const double m = b + c;
    require(m < 0x1p53, "the exact paired test takes up to 9,007,199,254,740,991 changes (2^53 − 1) in all, and this "
                        "table has " + format_count(m) + "; at this size use the chi-squared version (\"corrected\")");
    PairedResult result;
    result.method = PairedMethod::exact;
    result.statistic = std::min(b, c);
    result.df = 0.0;
    const detail::DiscreteTail<2> binomial({0.0, m}, {+1, -1}, {m / 2, m / 2}, m, 1.0, 2.0, detail::stirling_part(m), 0.0, m);
    // The work is bounded by the method itself (well under a millisecond); the limit only guards it.
    const ExactLimits limits;
    const detail::Deadline deadline(limits);
    result.p_value = std::min(1.0, 2 * binomial.lower(result.statistic, deadline));
    return result;
}

}  // namespace

PairedResult paired_test(const Matrix& square, std::optional<PairedMethod> method) {
    const std::size_t k = square.rows();
    require(k == square.columns(), not_square(square.rows(), square.columns()));
    require(k >= 2, "a paired table needs at least 2 categories");
    for (double value : square.values())
        if (!(std::isfinite(value) && value >= 0))
            throw Error("counts must be numbers of 0 or more, not " + format_number(value));

    if (k > 2 && method && *method != PairedMethod::uncorrected)
        throw Error(std::string("the ") + (*method == PairedMethod::exact ? "exact test" : "continuity correction") +
                    " applies to 2×2 tables only; for " + std::to_string(k) + "×" + std::to_string(k) +
                    " tables omit the method (or give \"uncorrected\") for the test of symmetry");
    const PairedMethod applied = method.value_or(k == 2 ? PairedMethod::corrected : PairedMethod::uncorrected);

    bool any_pair = false;
    for (std::size_t i = 0; i < k; ++i)
        for (std::size_t j = i + 1; j < k; ++j) any_pair = any_pair || square(i, j) + square(j, i) > 0;
    require(any_pair, "no pair changed category (every count off the diagonal is 0), so there is nothing to test");

    if (applied == PairedMethod::exact) return exact_mcnemar(square(0, 1), square(1, 0));

    PairedResult result;
    result.method = applied;
    for (std::size_t i = 0; i < k; ++i)
        for (std::size_t j = i + 1; j < k; ++j) {
            const double upper = square(i, j), lower = square(j, i);
            if (upper + lower == 0) continue;  // no changes either way: no information, no df
            double gap = std::fabs(upper - lower);
            if (applied == PairedMethod::corrected) gap = std::max(0.0, gap - 1);
            result.statistic += gap * (gap / (upper + lower));  // gap² would overflow near 1e154
            result.df += 1;
        }
    result.p_value = chi_squared_p_value(result.statistic, result.df);
    return result;
}

PairedResult paired_test(const CellGrid& table, std::optional<PairedMethod> method) {
    ReadOptions options;
    options.require_two_by_two = false;  // a category nobody chose is still a row and a column
    const CountTable read = read_count_table(table, options);
    require(read.body_rows() == read.body_columns(), not_square(read.body_rows(), read.body_columns()));
    return paired_test(read.to_body_shape(read.counts()), method);
}

}  // namespace assoc
