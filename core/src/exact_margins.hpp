#pragma once
// The margins of a count table (row totals, column totals, grand total) summed in
// double-double, about 32 significant digits, for forming O − E = (O·n − R·C)/n.
// Why not the double totals CountTable keeps: they are rounded once the counts are not
// whole numbers (weighted data) or pass 2^53, and for a nearly independent table
// O·n − R·C is a small difference of large numbers, so a rounded R or n would leave
// only a few correct digits in it.
// Why scaled: O·n and R·C overflow for counts above about 1e154 (and underflow for
// tiny weights). Every count is multiplied by the same power of two, 2^-exponent,
// chosen to bring the total near 1; that is exact, and O − E and E scale back exactly.
#include <cmath>
#include <cstddef>
#include <vector>

#include "assoc/count_table.hpp"
#include "extended_arithmetic.hpp"

namespace assoc::detail {

// hi + lo renormalised when |hi| ≥ |lo| is known (Dekker's fast two-sum).
inline DoubleDouble renormalised(double hi, double lo) {
    const double s = hi + lo;
    return {s, lo - (s - hi)};
}

inline DoubleDouble operator+(const DoubleDouble& x, double y) {
    const DoubleDouble s = exact_sum(x.hi, y);
    return renormalised(s.hi, s.lo + x.lo);
}

// Exact when both low parts are 0 (whole counts below 2^53); otherwise about 2^-104 relative.
inline DoubleDouble operator*(const DoubleDouble& x, const DoubleDouble& y) {
    const DoubleDouble p = exact_product(x.hi, y.hi);
    return renormalised(p.hi, p.lo + (x.hi * y.lo + x.lo * y.hi));
}

// x / y with one correction step of the double quotient: exact when the quotient is a
// double, otherwise about 2^-104 relative.
inline DoubleDouble operator/(const DoubleDouble& x, const DoubleDouble& y) {
    const double first = x.hi / y.hi;
    const DoubleDouble remainder = x - y * DoubleDouble{first, 0.0};
    return renormalised(first, remainder.hi / y.hi);
}

struct ScaledMargins {
    int exponent = 0;  // every count was multiplied by 2^-exponent
    std::vector<DoubleDouble> rows, columns;
    DoubleDouble total;

    double scaled(double count) const { return std::ldexp(count, -exponent); }
    double unscaled(double value) const { return std::ldexp(value, exponent); }
};

inline ScaledMargins scaled_margins(const CountTable& table) {
    ScaledMargins margins;
    if (table.total() > 0) margins.exponent = std::ilogb(table.total());
    margins.rows.assign(table.rows(), DoubleDouble{});
    margins.columns.assign(table.columns(), DoubleDouble{});
    for (std::size_t r = 0; r < table.rows(); ++r)
        for (std::size_t c = 0; c < table.columns(); ++c) {
            const double count = margins.scaled(table.count(r, c));
            margins.rows[r] = margins.rows[r] + count;
            margins.columns[c] = margins.columns[c] + count;
        }
    for (const DoubleDouble& row : margins.rows) margins.total = margins.total + row.hi + row.lo;
    return margins;
}

}  // namespace assoc::detail
