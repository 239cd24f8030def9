#pragma once
// Double-double arithmetic (about 106 bits): just enough to form O·n − R·C without
// cancellation. Products are exact through fma; sums are exact through two-sum.
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

}  // namespace assoc::detail
