#pragma once
// The margins of a count table (row totals, column totals, grand total) summed in
// double-double, about 32 significant digits, and O − E = (O·n − R·C)/n formed from them.
// Why not the double totals CountTable keeps: they are rounded once the counts are not
// whole numbers (weighted data) or pass 2^53, and for a nearly independent table
// O·n − R·C is a small difference of large numbers, so a rounded R or n would leave
// only a few correct digits in it.
// Why each factor is scaled by its own power of two: O·n and R·C overflow for counts above
// about 1e154 and underflow for tiny weights, and one factor for the whole table cannot avoid
// both when the counts span a wide range ([[2, 0], [1, 1e308]] has E = 6e-308 beside 1e308).
// Each factor is brought to [1, 2) exactly, the products are formed exactly there, and the two
// are aligned to the larger's exponent before they are subtracted; O − E and E scale back exactly.
#include <algorithm>
#include <cmath>
#include <cstddef>
#include <vector>

#include "assoc/count_table.hpp"
#include "extended_arithmetic.hpp"

namespace assoc::detail {

// x·2^k, exact unless a part underflows.
inline DoubleDouble times_power_of_two(const DoubleDouble& x, int k) { return {std::ldexp(x.hi, k), std::ldexp(x.lo, k)}; }

// A non-zero double-double as mantissa · 2^exponent with the mantissa's high part in ±[1, 2).
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

// x·y − u·v, each factor scaled by its own power of two so that the products neither overflow nor
// underflow, aligned to the larger product's exponent.
inline Scaled difference_of_products(const DoubleDouble& x, const DoubleDouble& y, const DoubleDouble& u,
                                     const DoubleDouble& v) {
    const bool first_zero = x.hi == 0 || y.hi == 0, second_zero = u.hi == 0 || v.hi == 0;
    if (first_zero && second_zero) return {DoubleDouble{}, 0};
    Normalised first{DoubleDouble{}, 0}, second{DoubleDouble{}, 0};
    if (!first_zero) {
        const Normalised a = normalised(x), b = normalised(y);
        first = {a.mantissa * b.mantissa, a.exponent + b.exponent};
    }
    if (!second_zero) {
        const Normalised a = normalised(u), b = normalised(v);
        second = {a.mantissa * b.mantissa, a.exponent + b.exponent};
    }
    if (first_zero) return {DoubleDouble{} - second.mantissa, second.exponent};
    if (second_zero) return {first.mantissa, first.exponent};
    const int exponent = std::max(first.exponent, second.exponent);
    return {times_power_of_two(first.mantissa, first.exponent - exponent) -
                times_power_of_two(second.mantissa, second.exponent - exponent),
            exponent};
}

// A scaled value divided by a positive double-double: accurate to about 1.5 units in the last place.
inline double divided(const Scaled& numerator, const DoubleDouble& denominator) {
    const Normalised d = normalised(denominator);
    return std::ldexp(numerator.value.value() / d.mantissa.value(), numerator.exponent - d.exponent);
}

// x·y/z for positive x, y, z, without overflow or underflow on the way.
inline double product_over(const DoubleDouble& x, const DoubleDouble& y, const DoubleDouble& z) {
    const Normalised a = normalised(x), b = normalised(y), d = normalised(z);
    return std::ldexp(a.mantissa.value() * b.mantissa.value() / d.mantissa.value(), a.exponent + b.exponent - d.exponent);
}

struct TableMargins {
    std::vector<DoubleDouble> rows, columns;
    DoubleDouble total;
    // Whole counts whose total is at most 2^53 (the common case): every margin and every factor of
    // a numerator is a whole double, their products (below 2^106) are exact double-doubles and
    // nothing can overflow or underflow, so scaling by powers of two would change no bit of any
    // result; it is skipped (it cost four times the rest for a small table, and every
    // ASSOC.PVALUE cell of a sheet runs this).
    bool whole_below_2_53 = false;

    // O·n − R·C for the count `observed` in row r, column c, as the determinant O·S − R̂·C̄ of the
    // table collapsed around the cell: R̂ = R − O (the rest of its row), C̄ = C − O (the rest of its
    // column), S = n − R − C̄ (everything else) — the same number (O n − R C = O(R̂ + C̄ + S + O) −
    // (O + R̂)(O + C̄)), but without the cancellation of two products near n·O when the cell holds
    // nearly everything: [[2, 0], [1, 1e308]] gives 2e308 for the last cell, where O·n − R·C needs
    // 616 digits. Exact for whole counts whose total is below 2^53; otherwise to about 2^-104 of
    // the larger product.
    Scaled numerator(double observed, std::size_t r, std::size_t c) const {
        if (whole_below_2_53) return {whole_numerator(observed, rows[r].hi, columns[c].hi, total.hi), 0};
        const DoubleDouble o{observed, 0.0};
        const DoubleDouble row_rest = rows[r] - o, column_rest = columns[c] - o;
        const DoubleDouble others = (total - rows[r]) - column_rest;
        return difference_of_products(o, others, row_rest, column_rest);
    }

    // The numerator for whole counts whose total is at most 2^53: every difference of margins is a
    // whole double, exact in double arithmetic, and the two products are exact double-doubles.
    static DoubleDouble whole_numerator(double observed, double row, double column, double total) {
        const double row_rest = row - observed, column_rest = column - observed;
        const double others = (total - row) - column_rest;
        return exact_product(observed, others) - exact_product(row_rest, column_rest);
    }

    // O − E and E for whole counts whose total is at most 2^53, from the table's own totals: what
    // deviation and expected compute then, for callers that need no copy of the margins.
    static double whole_deviation(double observed, double row, double column, double total) {
        return whole_numerator(observed, row, column, total).value() / total;
    }
    static double whole_expected(double row, double column, double total) { return row * column / total; }

    // A numerator divided by n: accurate to about 1.5 units in the last place.
    double over_total(const Scaled& numerator) const {
        if (whole_below_2_53) return numerator.value.value() / total.hi;  // the exponent is 0
        return divided(numerator, total);
    }

    // O − E.
    double deviation(double observed, std::size_t r, std::size_t c) const {
        if (whole_below_2_53) return whole_deviation(observed, rows[r].hi, columns[c].hi, total.hi);
        return over_total(numerator(observed, r, c));
    }

    // E = R·C/n; it is never a difference, so double precision is all it needs.
    double expected(std::size_t r, std::size_t c) const {
        if (whole_below_2_53) return whole_expected(rows[r].hi, columns[c].hi, total.hi);
        return product_over(rows[r], columns[c], total);
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

// For each total, the sum of all the others, in double-double: from prefix and suffix sums, not as
// n − R, which loses a small remainder when the totals span more than the 32 digits of a
// double-double (1e100 beside 1e300 and 8e307).
inline std::vector<DoubleDouble> sums_of_the_others(const std::vector<DoubleDouble>& totals) {
    std::vector<DoubleDouble> others(totals.size()), suffix(totals.size() + 1);
    for (std::size_t i = totals.size(); i-- > 0;) suffix[i] = suffix[i + 1] + totals[i];
    DoubleDouble prefix;
    for (std::size_t i = 0; i < totals.size(); ++i) {
        others[i] = prefix + suffix[i + 1];
        prefix = prefix + totals[i];
    }
    return others;
}

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
        margins.whole_below_2_53 = true;
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
