// Fisher's exact test for 2×2 tables; r×c tables go to the Freeman–Halton network (freeman_halton.cpp).
#include "assoc/exact_test.hpp"

#include <algorithm>
#include <boost/math/distributions/hypergeometric.hpp>
#include <cmath>
#include <limits>

#include "assoc/error.hpp"
#include "boost_policy.hpp"
#include "freeman_halton.hpp"

namespace assoc {
namespace {

using Hypergeometric = boost::math::hypergeometric_distribution<double, detail::Policy>;

// Fisher's test: with all margins fixed, the top-left count a is hypergeometric.
double fisher_two_by_two(const CountTable& table, Side side) {
    const double limit = static_cast<double>(std::numeric_limits<unsigned>::max());
    require(table.total() <= limit, "the exact test handles totals up to " + std::to_string(std::numeric_limits<unsigned>::max()) +
                                        "; this table is larger (the chi-squared test is accurate at this size)");
    const auto a = static_cast<unsigned>(table.count(0, 0));
    const auto row1 = static_cast<unsigned>(table.row_total(0));
    const auto column1 = static_cast<unsigned>(table.column_total(0));
    const auto n = static_cast<unsigned>(table.total());
    const Hypergeometric distribution(column1, row1, n);
    const unsigned low = row1 + column1 > n ? row1 + column1 - n : 0;
    const unsigned high = std::min(row1, column1);

    if (side == Side::lower) return boost::math::cdf(distribution, a);
    if (side == Side::upper) return a == low ? 1.0 : boost::math::cdf(boost::math::complement(distribution, a - 1));

    // Two-sided: the probabilities rise up to the mode and fall after it, so the tables no more
    // probable than the observed one form two tails; find each tail's edge by bisection.
    const double threshold = boost::math::pdf(distribution, a) * (1 + exact_tie_tolerance);
    const auto mode = static_cast<unsigned>(std::floor((static_cast<double>(row1) + 1) * (static_cast<double>(column1) + 1) /
                                                       (static_cast<double>(n) + 2)));
    auto in_tail = [&](unsigned x) { return boost::math::pdf(distribution, x) <= threshold; };
    double p = 0.0;
    if (in_tail(low)) {  // largest x in [low, mode] still in the lower tail
        unsigned lo = low, hi = std::min(mode, high);
        while (lo < hi) {
            const unsigned mid = lo + (hi - lo + 1) / 2;
            if (in_tail(mid)) lo = mid; else hi = mid - 1;
        }
        p += boost::math::cdf(distribution, lo);
    }
    if (mode < high && in_tail(high)) {  // smallest x in (mode, high] in the upper tail
        unsigned lo = mode + 1, hi = high;
        while (lo < hi) {
            const unsigned mid = lo + (hi - lo) / 2;
            if (in_tail(mid)) hi = mid; else lo = mid + 1;
        }
        p += lo == 0 ? 1.0 : boost::math::cdf(boost::math::complement(distribution, lo - 1));
    }
    return std::min(p, 1.0);
}

}  // namespace

double exact_p_value(const CountTable& table, Side side, const ExactLimits& limits) {
    require(table.whole_counts(), "the exact test needs whole counts; this table holds counts that are not whole numbers");
    if (table.is_two_by_two()) return fisher_two_by_two(table, side);
    require(side == Side::two_sided, "one-sided exact tests (\"lower\", \"upper\") apply to 2×2 tables only; this table has " +
                                         std::to_string(table.rows()) + " rows and " + std::to_string(table.columns()) +
                                         " columns with counts");
    return detail::freeman_halton_p_value(table.counts(), limits);
}

}  // namespace assoc
