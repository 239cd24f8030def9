#pragma once
// Double-double arithmetic (about 106 bits): just enough to form differences of products such as
// O·n − R·C or a·d − ψ·b·c without cancellation. Products are exact through fma; sums are exact
// through two-sum.
#include <cmath>

namespace assoc::detail {

struct DoubleDouble {
    double hi = 0.0;
    double lo = 0.0;
    double value() const { return hi + lo; }
};

// a·b exactly, as an unevaluated sum hi + lo.
inline DoubleDouble exact_product(double a, double b) {
    const double hi = a * b;
    return {hi, std::fma(a, b, -hi)};
}

// a + b exactly (Knuth's two-sum).
inline DoubleDouble exact_sum(double a, double b) {
    const double s = a + b;
    const double bb = s - a;
    return {s, (a - (s - bb)) + (b - bb)};
}

inline DoubleDouble operator-(const DoubleDouble& x, const DoubleDouble& y) {
    DoubleDouble s = exact_sum(x.hi, -y.hi);
    const double tail = s.lo + (x.lo - y.lo);
    return exact_sum(s.hi, tail);
}

// x + y to about 2^-105 relative, whatever the signs.
inline DoubleDouble operator+(const DoubleDouble& x, const DoubleDouble& y) { return x - DoubleDouble{-y.hi, -y.lo}; }

// x / y to about 2^-104 relative (y ≠ 0).
inline DoubleDouble quotient(const DoubleDouble& x, const DoubleDouble& y) {
    const double first = x.hi / y.hi;
    const DoubleDouble product = exact_product(first, y.hi);
    const DoubleDouble rest = x - DoubleDouble{product.hi, product.lo + first * y.lo};
    const double second = rest.hi / y.hi;
    const double sum = first + second;
    return {sum, second - (sum - first)};
}

// The "sloppy" kind of double-double sum and product: accurate for sums of non-negative numbers
// and for products, which is all they are used for.

// hi + lo renormalised when |hi| ≥ |lo| is known (Dekker's fast two-sum).
inline DoubleDouble renormalised(double hi, double lo) {
    const double s = hi + lo;
    return {s, lo - (s - hi)};
}

inline DoubleDouble operator+(const DoubleDouble& x, double y) {
    const DoubleDouble s = exact_sum(x.hi, y);
    return renormalised(s.hi, s.lo + x.lo);
}

// Exact when both low parts are 0 (whole numbers whose product is below 2^106); otherwise about
// 2^-104 relative.
inline DoubleDouble operator*(const DoubleDouble& x, const DoubleDouble& y) {
    const DoubleDouble p = exact_product(x.hi, y.hi);
    return renormalised(p.hi, p.lo + (x.hi * y.lo + x.lo * y.hi));
}

}  // namespace assoc::detail
