#pragma once
// The margins of a count table (row totals, column totals, grand total) summed in
// double-double, about 32 significant digits, and O − E = (O·n − R·C)/n formed from them.
// Why not the double totals CountTable keeps: they are rounded once the counts are not
// whole numbers (weighted data) or pass 2^53, and for a nearly independent table
// O·n − R·C is a small difference of large numbers, so a rounded R or n would leave
// only a few correct digits in it.
// Why each factor is scaled by its own power of two: O·n and R·C overflow for counts above
// about 1e154 and underflow for tiny weights, and one factor for the whole table cannot avoid
// both when the counts span a wide range ([[2, 0], [1, 1e308]] has R·C from 6 to 3e308, and
// E = 6e-308). Each factor is brought to [1, 2) exactly, the products are formed exactly there,
// and the two are aligned to the larger's exponent before they are subtracted; only a part
// below 2^-1000 of the larger product can be lost, and O − E and E scale back exactly.
#include <algorithm>
#include <cmath>
#include <cstddef>
#include <vector>

#include "assoc/count_table.hpp"
#include "extended_arithmetic.hpp"

namespace assoc::detail {

// x·2^k, exact unless a part underflows.
inline DoubleDouble times_power_of_two(const DoubleDouble& x, int k) { return {std::ldexp(x.hi, k), std::ldexp(x.lo, k)}; }

// A positive double-double as mantissa · 2^exponent with the mantissa's high part in [1, 2).
struct Normalised {
    DoubleDouble mantissa;
    int exponent = 0;
};

inline Normalised normalised(const DoubleDouble& x) {
    const int exponent = std::ilogb(x.hi);
    return {times_power_of_two(x, -exponent), exponent};
}

// A double-double value · 2^exponent.
struct Scaled {
    DoubleDouble value;
    int exponent = 0;
};

struct TableMargins {
    std::vector<DoubleDouble> rows, columns;
    DoubleDouble total;

    // O·n − R·C for the count `observed` in row r, column c, to about 2^-104 of the larger product
    // (exactly for whole counts whose total is below 2^53).
    Scaled numerator(double observed, std::size_t r, std::size_t c) const {
        const Normalised n = normalised(total), row = normalised(rows[r]), column = normalised(columns[c]);
        const int product_exponent = row.exponent + column.exponent;
        const DoubleDouble product = row.mantissa * column.mantissa;
        if (observed == 0) return {DoubleDouble{} - product, product_exponent};
        const Normalised o = normalised(DoubleDouble{observed, 0.0});
        const int observed_exponent = o.exponent + n.exponent;
        const DoubleDouble observed_product = o.mantissa * n.mantissa;
        const int exponent = std::max(observed_exponent, product_exponent);
        return {times_power_of_two(observed_product, observed_exponent - exponent) -
                    times_power_of_two(product, product_exponent - exponent),
                exponent};
    }

    // A numerator divided by n: accurate to about 1.5 units in the last place.
    double over_total(const Scaled& numerator) const {
        const Normalised n = normalised(total);
        return std::ldexp(numerator.value.value() / n.mantissa.value(), numerator.exponent - n.exponent);
    }

    // O − E.
    double deviation(double observed, std::size_t r, std::size_t c) const {
        return over_total(numerator(observed, r, c));
    }

    // E = R·C/n; it is never a difference, so double precision is all it needs.
    double expected(std::size_t r, std::size_t c) const {
        const Normalised n = normalised(total), row = normalised(rows[r]), column = normalised(columns[c]);
        return std::ldexp(row.mantissa.value() * column.mantissa.value() / n.mantissa.value(),
                          row.exponent + column.exponent - n.exponent);
    }

    // (|O·n − R·C| − n/2)/n = |O − E| − ½ without the cancellation of forming O − E first (the
    // Yates correction); negative when |O − E| < ½.
    double distance_beyond_half(double observed, std::size_t r, std::size_t c) const {
        const Scaled difference = numerator(observed, r, c);
        const Normalised n = normalised(total);
        const DoubleDouble magnitude = difference.value.hi < 0 ? DoubleDouble{} - difference.value : difference.value;
        const Scaled beyond{magnitude - times_power_of_two(n.mantissa, n.exponent - 1 - difference.exponent),
                            difference.exponent};
        return over_total(beyond);
    }
};

inline TableMargins table_margins(const CountTable& table) {
    TableMargins margins;
    margins.rows.assign(table.rows(), DoubleDouble{});
    margins.columns.assign(table.columns(), DoubleDouble{});
    const double total = table.total();
    if (table.whole_counts() && total <= 0x1p53) {
        // The common case: whole counts whose total is below 2^53 add up exactly in doubles,
        // so the table's own totals are already exact.
        for (std::size_t r = 0; r < table.rows(); ++r) margins.rows[r].hi = table.row_total(r);
        for (std::size_t c = 0; c < table.columns(); ++c) margins.columns[c].hi = table.column_total(c);
        margins.total.hi = total;
        return margins;
    }
    for (std::size_t r = 0; r < table.rows(); ++r)
        for (std::size_t c = 0; c < table.columns(); ++c) {
            const double count = table.count(r, c);
            margins.rows[r] = margins.rows[r] + count;
            margins.columns[c] = margins.columns[c] + count;
        }
    for (const DoubleDouble& row : margins.rows) margins.total = margins.total + row.hi + row.lo;
    return margins;
}

}  // namespace assoc::detail
