// Fisher's exact test for 2×2 tables, at a cost that does not grow with the counts.
//
// With both margins fixed, the top-left count x is hypergeometric:
//     P(x) = r1! r2! c1! c2! / (n! a! b! c! d!),   a = x, b = r1 − x, c = c1 − x, d = r2 − c1 + x.
// Written with ln k! = k ln k − k + s(k), where s(k) = ln k! − k ln k + k stays small (about
// ½ ln 2πk), the large parts cancel exactly into deviances (the device of Loader 2000, "Fast and
// accurate computation of binomial probabilities"):
//     ln P(x) = Σ over margins s(m) − s(n) − Σ over cells s(k) − Σ over cells D(k, E_k),
//     D(k, E) = k ln(k/E) + E − k ≥ 0,   E_k = row total × column total / n (the expected count).
// Every cell's k − E_k is ±(a − E_a), formed exactly from whole counts (double-double), so ln P(x)
// keeps its digits however large the counts (about 1e-15 of its size): nothing cancels.
//
// A tail is summed outwards from its inner edge, where its terms are largest, each term from the
// last by the ratio of neighbouring probabilities (b·c / ((a + 1)(d + 1)) going up), re-anchored
// on ln P every 64 steps and added with compensation. P is log-concave, so the ratios fall outwards
// and what is left after a term is at most term·ρ/(1 − ρ); the sum stops once that is below 2^-60
// of it. Only a tail that lies within a few standard deviations of the mode of a wide distribution
// (every cell a million or more) is still going after 4096 steps; its remainder is the
// Euler–Maclaurin sum: the integral of P over the real line (Gauss–Legendre on panels) plus the
// end corrections P/2 − P′/12 + P‴/720, where the next term is below 1e-16 of the sum. So the work
// is bounded whatever the counts: a few thousand steps and a few hundred evaluations of ln P per
// tail, and about a hundred more to find where the two-sided test's tails begin.
#include "fisher_two_by_two.hpp"

#include <algorithm>
#include <array>
#include <boost/math/quadrature/gauss.hpp>
#include <boost/math/special_functions/digamma.hpp>
#include <boost/math/special_functions/gamma.hpp>
#include <boost/math/special_functions/log1p.hpp>
#include <boost/math/special_functions/polygamma.hpp>
#include <boost/math/special_functions/trigamma.hpp>
#include <chrono>
#include <cmath>
#include <limits>

#include "boost_policy.hpp"
#include "exact_limits.hpp"
#include "extended_arithmetic.hpp"
#include "stirling.hpp"

namespace assoc::detail {
namespace {

constexpr double minus_infinity = -std::numeric_limits<double>::infinity();
// D(k, E) = k ln(k/E) + E − k, given difference = k − E to full precision.
double deviance(double k, double expected, double difference) {
    if (k == 0) return expected;
    const double t = difference / expected;
    if (t < -0.5) return k * std::log(k / expected) - difference;  // no cancellation here
    // E·[(1 + t) ln(1 + t) − t], which keeps its digits for small t.
    return expected * (boost::math::log1pmx(t, Policy()) + t * boost::math::log1p(t, Policy()));
}

// Neumaier's compensated sum.
class CompensatedSum {
public:
    void add(double value) {
        const double sum = sum_ + value;
        compensation_ += std::fabs(sum_) >= std::fabs(value) ? (sum_ - sum) + value : (value - sum) + sum_;
        sum_ = sum;
    }
    double value() const { return sum_ + compensation_; }

private:
    double sum_ = 0.0, compensation_ = 0.0;
};

struct Cells {
    double a, b, c, d;
    double smallest() const { return std::min({a, b, c, d}); }
};

class Deadline {
public:
    explicit Deadline(const ExactLimits& limits) : limits_(limits), start_(Clock::now()) {}
    void check() const {
        if (std::chrono::duration<double>(Clock::now() - start_).count() > limits_.max_seconds)
            throw exact_limit_error(limits_, "time");
    }

private:
    using Clock = std::chrono::steady_clock;
    const ExactLimits& limits_;
    Clock::time_point start_;
};

class Hypergeometric {
public:
    Hypergeometric(double a, double b, double c, double d)
        : row1_(a + b), row2_(c + d), column1_(a + c), total_(a + b + c + d),
          low_(std::max(0.0, column1_ - row2_)), high_(std::min(row1_, column1_)) {
        const double column2 = b + d;
        expected_ = {row1_ * column1_ / total_, row1_ * column2 / total_, row2_ * column1_ / total_,
                     row2_ * column2 / total_};
        margins_part_ = stirling_part(row1_) + stirling_part(row2_) + stirling_part(column1_) + stirling_part(column2) -
                        stirling_part(total_);
    }

    double low() const { return low_; }
    double high() const { return high_; }

    Cells cells_at(double x) const { return {x, row1_ - x, column1_ - x, row2_ - column1_ + x}; }

    // x − E_a to full precision: (x·n − r1·c1)/n with both products exact.
    double difference_at(double x) const {
        return (exact_product(x, total_) - exact_product(row1_, column1_)).value() / total_;
    }

    // ln P for the cells k, with `difference` = k.a − E_a (the other cells differ from their
    // expected counts by −difference, −difference and +difference). Cells need not be whole.
    double log_probability(const Cells& k, double difference) const {
        const double stirling = stirling_part(k.a) + stirling_part(k.b) + stirling_part(k.c) + stirling_part(k.d);
        const double deviances = deviance(k.a, expected_[0], difference) + deviance(k.b, expected_[1], -difference) +
                                 deviance(k.c, expected_[2], -difference) + deviance(k.d, expected_[3], difference);
        return margins_part_ - stirling - deviances;
    }
    double log_probability(double x) const { return log_probability(cells_at(x), difference_at(x)); }

    // A most probable x: P(x − 1) ≤ P(x) ≥ P(x + 1), settled by exact comparisons of whole products.
    double mode() const {
        double m = std::clamp(std::floor(expected_[0]), low_, high_);
        while (m < high_ && compare_neighbours(m) > 0) m += 1;
        while (m > low_ && compare_neighbours(m - 1) < 0) m -= 1;
        return m;
    }

    // ln Σ P(y) over y = start, start + step, … to the end of the support (step ±1), where P falls
    // from start onwards (start is on the far side of a mode, or is one).
    double log_tail(double start, double step, const Deadline& deadline) const {
        const double end = step < 0 ? low_ : high_;
        const double log_first = log_probability(start);
        CompensatedSum sum;  // of P(y)/P(start)
        sum.add(1.0);
        Cells k = cells_at(start);
        double x = start, term = 1.0;
        for (unsigned i = 1; x != end; ++i) {
            const double ratio = step < 0 ? k.a * k.d / ((k.b + 1) * (k.c + 1)) : k.b * k.c / ((k.a + 1) * (k.d + 1));
            x += step;
            k = step < 0 ? Cells{k.a - 1, k.b + 1, k.c + 1, k.d - 1} : Cells{k.a + 1, k.b - 1, k.c - 1, k.d + 1};
            term = i % 64 == 0 ? std::exp(log_probability(k, difference_at(x)) - log_first) : term * ratio;
            sum.add(term);
            if (term * ratio <= (1 - ratio) * sum.value() * 0x1p-60) break;
            if (i % 4096 == 0) {
                deadline.check();
                if (x != end && ratio > 0.99 && k.smallest() >= 1e6) {
                    sum.add(remainder(x + step, step, log_first));
                    break;
                }
            }
        }
        return log_first + std::log(sum.value());
    }

private:
    // The sign of P(x + 1) − P(x), i.e. of b·c − (a + 1)(d + 1) at x.
    int compare_neighbours(double x) const {
        const Cells k = cells_at(x);
        const DoubleDouble gap = exact_product(k.b, k.c) - exact_product(k.a + 1, k.d + 1);
        const double sign = gap.hi != 0 ? gap.hi : gap.lo;
        return sign > 0 ? 1 : sign < 0 ? -1 : 0;
    }

    // Σ P(y)/P(reference) over y = from, from + step, … by Euler–Maclaurin, where every cell is a
    // million or more and the terms fall by less than 1% a step (so the sum ends far inside the
    // support and its next correction, P⁽⁵⁾/30240, is below 1e-16 of it).
    double remainder(double from, double step, double log_reference) const {
        const Cells k0 = cells_at(from);
        const double difference0 = difference_at(from);
        // F(u) = P(from + step·u)/P(reference) for real u ≥ 0.
        const auto log_f = [&](double u) {
            const double s = step * u;
            return log_probability({k0.a + s, k0.b - s, k0.c - s, k0.d + s}, difference0 + s) - log_reference;
        };
        const auto f = [&](double u) { return std::exp(log_f(u)); };
        const Policy policy;
        const auto derivative = [&](auto polygamma, int sign) {  // Σ ± polygamma(k + 1), signs a −, b +, c +, d −
            return sign * (-polygamma(k0.a + 1) + polygamma(k0.b + 1) + polygamma(k0.c + 1) - polygamma(k0.d + 1));
        };
        const double g1 = step * derivative([&](double v) { return boost::math::digamma(v, policy); }, 1);
        const double g2 = -(boost::math::trigamma(k0.a + 1, policy) + boost::math::trigamma(k0.b + 1, policy) +
                            boost::math::trigamma(k0.c + 1, policy) + boost::math::trigamma(k0.d + 1, policy));
        const double g3 = step * derivative([&](double v) { return boost::math::polygamma(2, v, policy); }, 1);
        const double f0 = f(0);
        const double corrections = f0 / 2 - f0 * g1 / 12 + f0 * (g3 + 3 * g1 * g2 + g1 * g1 * g1) / 720;

        // The integral, panel by panel: each panel at most half a standard deviation wide and no
        // wider than the distance over which the falling slope alone takes off e^4.
        const double width = std::min(0.5 / std::sqrt(-g2), 4 / std::max(std::fabs(g1), 1e-300));
        const double room = (step < 0 ? from - low_ : high_ - from) - 1;  // keep clear of the support's end
        CompensatedSum integral;
        double u = 0, log_start = log_f(0);
        for (int panel = 0; panel < 10000 && u < room; ++panel) {
            const double next = std::min(u + width, room);
            const double piece = boost::math::quadrature::gauss<double, 20>::integrate(f, u, next);
            integral.add(piece);
            const double log_end = log_f(next);
            // F is log-concave and falling: beyond `next` it adds at most F(next)·width/ln(F(u)/F(next)).
            const double drop = log_start - log_end;
            if (drop > 0 && std::exp(log_end) * (next - u) / drop <= integral.value() * 0x1p-60) break;
            u = next;
            log_start = log_end;
        }
        return integral.value() + corrections;
    }

    double row1_, row2_, column1_, total_, low_, high_;
    std::array<double, 4> expected_{};  // E of cells a, b, c, d
    double margins_part_ = 0;
};

}  // namespace

double fisher_two_by_two_p_value(double a, double b, double c, double d, Side side, const ExactLimits& limits) {
    const Hypergeometric h(a, b, c, d);
    if (h.low() == h.high()) return 1.0;  // one table has these margins
    const Deadline deadline(limits);
    const double mode = h.mode();
    // ln P(X ≤ x) for x at or below the mode, ln P(X ≥ x) for x at or above it.
    const auto below = [&](double x) { return x < h.low() ? minus_infinity : h.log_tail(x, -1, deadline); };
    const auto above = [&](double x) { return x > h.high() ? minus_infinity : h.log_tail(x, +1, deadline); };
    const auto probability = [](double p) { return std::clamp(p, 0.0, 1.0); };

    switch (side) {
    case Side::lower: return probability(a <= mode ? std::exp(below(a)) : -std::expm1(above(a + 1)));
    case Side::upper: return probability(a >= mode ? std::exp(above(a)) : -std::expm1(below(a - 1)));
    case Side::two_sided: break;
    }
    // The tables no more probable than the observed one form two tails, one each side of the mode;
    // find where each begins by bisection.
    const double threshold = h.log_probability(a) + std::log1p(exact_tie_tolerance);
    const auto in_tail = [&](double x) { return h.log_probability(x) <= threshold; };
    double p = 0.0;
    if (in_tail(h.low())) {  // the largest x in [low, mode] still in the lower tail
        double lo = h.low(), hi = mode;
        while (lo < hi) {
            const double middle = lo + std::floor((hi - lo + 1) / 2);
            if (in_tail(middle)) lo = middle;
            else hi = middle - 1;
        }
        p += std::exp(below(lo));
    }
    if (mode < h.high() && in_tail(h.high())) {  // the smallest x in (mode, high] in the upper tail
        double lo = mode + 1, hi = h.high();
        while (lo < hi) {
            const double middle = lo + std::floor((hi - lo) / 2);
            if (in_tail(middle)) hi = middle;
            else lo = middle + 1;
        }
        p += std::exp(above(lo));
    }
    return probability(p);
}

}  // namespace assoc::detail
