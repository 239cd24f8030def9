#pragma once
// The margins of a count table (row totals, column totals, grand total) summed in
// double-double, about 32 significant digits, for forming O − E = (O·n − R·C)/n.
// Why not the double totals CountTable keeps: they are rounded once the counts are not
// whole numbers (weighted data) or pass 2^53, and for a nearly independent table
// O·n − R·C is a small difference of large numbers, so a rounded R or n would leave
// only a few correct digits in it.
// Why scaled: O·n and R·C overflow for counts above about 1e154 (and underflow for
// tiny weights). When the total is beyond 2^±500, every count is multiplied by the same
// power of two, 2^-exponent, chosen to bring the total near 1; that is exact, and O − E
// and E scale back exactly.
#include <cmath>
#include <cstddef>
#include <vector>

#include "assoc/count_table.hpp"
#include "extended_arithmetic.hpp"

namespace assoc::detail {

// The few double-double operations the margins need. They are the "sloppy" kind, accurate for
// sums of non-negative numbers and for products, which is all they are used for here.

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

struct ScaledMargins {
    int exponent = 0;  // every count was multiplied by 2^-exponent
    std::vector<DoubleDouble> rows, columns;
    DoubleDouble total;

    double scaled(double count) const { return exponent == 0 ? count : std::ldexp(count, -exponent); }
    double unscaled(double value) const { return exponent == 0 ? value : std::ldexp(value, exponent); }

    // E of cell (r, c). It needs no more than double precision (it is never a difference): R·C/n
    // on the rounded margins, scaled so that R·C cannot overflow.
    double expected(std::size_t r, std::size_t c) const {
        return unscaled(rows[r].value() * columns[c].value() / total.value());
    }

    // O − E of cell (r, c) whose count is `count`. The difference O·n − R·C is formed exactly (or
    // to about 2^-104); one rounding of it and one division leave O − E accurate to about 1.5 ulp.
    double deviation(double count, std::size_t r, std::size_t c) const {
        const DoubleDouble observed{scaled(count), 0.0};
        const DoubleDouble difference = observed * total - rows[r] * columns[c];
        return unscaled(difference.value() / total.value());
    }
};

inline ScaledMargins scaled_margins(const CountTable& table) {
    ScaledMargins margins;
    // Ordinary totals need no scaling (O·n stays far from overflow and underflow), which keeps
    // the common case free of ldexp calls.
    const double total = table.total();
    if (total > 0 && (total > 0x1p500 || total < 0x1p-500)) margins.exponent = std::ilogb(total);
    margins.rows.assign(table.rows(), DoubleDouble{});
    margins.columns.assign(table.columns(), DoubleDouble{});
    if (margins.exponent == 0 && table.whole_counts() && total <= 0x1p53) {
        // The common case: whole counts whose total is below 2^53 add up exactly in doubles,
        // so the table's own totals are already exact.
        for (std::size_t r = 0; r < table.rows(); ++r) margins.rows[r].hi = table.row_total(r);
        for (std::size_t c = 0; c < table.columns(); ++c) margins.columns[c].hi = table.column_total(c);
        margins.total.hi = total;
        return margins;
    }
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
