#pragma once
// Exact tails of the distribution of a count x whose probability is
//     P(x) = K / Π k_i!,   k_i = base_i + sign_i·x (sign ±1),
// at a cost that does not grow with the counts. Two tests use it: Fisher's 2×2 test (x is the top-left
// count of the table and the cells a = x, b = r1 − x, c = c1 − x, d = r2 − c1 + x are hypergeometric)
// and the exact paired test (x is binomial with p = ½ over m changes: cells x and m − x).
//
// Written with ln k! = k ln k − k + s(k), where s(k) stays small (about ½ ln 2πk; stirling.hpp), the
// large parts cancel exactly into deviances (the device of Loader 2000, "Fast and accurate
// computation of binomial probabilities"):
//     ln P(x) = C − Σ s(k_i) − Σ D(k_i, E_i),   D(k, E) = k ln(k/E) + E − k ≥ 0,
// with E_i the cell's expected count and C a constant of the margins. Every cell's k_i − E_i is
// ±δ with δ = x − x_E formed exactly from whole counts (double-double), so ln P(x) keeps its digits
// however large the counts (about 1e-15 of its size): nothing cancels.
//
// A tail is summed outwards from its inner edge, where its terms are largest, each term from the
// last by the ratio of neighbouring probabilities, re-anchored on ln P every 64 steps and added with
// compensation. P is log-concave, so the ratios fall outwards and what is left after a term is at
// most term·ρ/(1 − ρ); the sum stops once that is below 2^-60 of it. Only a tail that lies within a
// few standard deviations of the mode of a wide distribution (every cell a million or more) is still
// going after 4096 steps; its remainder is the Euler–Maclaurin sum: the integral of P over the real
// line (Gauss–Legendre on panels) plus the end corrections P/2 − P′/12 + P‴/720, where the next term
// is below 1e-16 of the sum. So the work is bounded whatever the counts: a few thousand steps and a
// few hundred evaluations of ln P per tail, and about a hundred more to find where a two-sided
// test's tails begin. Counts must be whole and below 2^53.
#include <algorithm>
#include <array>
#include <boost/math/quadrature/gauss.hpp>
#include <boost/math/special_functions/digamma.hpp>
#include <boost/math/special_functions/log1p.hpp>
#include <boost/math/special_functions/polygamma.hpp>
#include <boost/math/special_functions/trigamma.hpp>
#include <chrono>
#include <cmath>
#include <cstddef>
#include <limits>

#include "assoc/work_limits.hpp"
#include "boost_policy.hpp"
#include "exact_limits.hpp"
#include "extended_arithmetic.hpp"
#include "stirling.hpp"

namespace assoc::detail {

// D(k, E) = k ln(k/E) + E − k, given difference = k − E to full precision.
inline double deviance(double k, double expected, double difference) {
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

// The time limit of an exact test, read now and then.
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

template <std::size_t N>
class DiscreteTail {
public:
    using Cells = std::array<double, N>;

    // cells_at(x)_i = base_i + sign_i·x; expected_i = E_i; x − x_E = (x·q − u·v)/q exactly;
    // ln P = constant − Σ s(k_i) − Σ D(k_i, E_i, sign_i·(x − x_E)); support [low, high].
    DiscreteTail(const Cells& base, const std::array<int, N>& sign, const Cells& expected, double u, double v, double q,
                 double constant, double low, double high)
        : base_(base), sign_(sign), expected_(expected), u_(u), v_(v), q_(q), constant_(constant), low_(low), high_(high) {}

    double low() const { return low_; }
    double high() const { return high_; }

    Cells cells_at(double x) const {
        Cells k;
        for (std::size_t i = 0; i < N; ++i) k[i] = base_[i] + sign_[i] * x;
        return k;
    }

    // x − x_E to full precision.
    double difference_at(double x) const { return (exact_product(x, q_) - exact_product(u_, v_)).value() / q_; }

    // ln P for the cells k (need not be whole) with `difference` = x − x_E.
    double log_probability(const Cells& k, double difference) const {
        double sum = constant_;
        for (std::size_t i = 0; i < N; ++i)
            sum -= stirling_part(k[i]) + deviance(k[i], expected_[i], sign_[i] * difference);
        return sum;
    }
    double log_probability(double x) const { return log_probability(cells_at(x), difference_at(x)); }

    // A most probable x: P(x − 1) ≤ P(x) ≥ P(x + 1), settled by exact comparisons of whole products.
    double mode() const {
        double m = std::clamp(std::floor(u_ * v_ / q_), low_, high_);
        while (m < high_ && compare_neighbours(m) > 0) m += 1;
        while (m > low_ && compare_neighbours(m - 1) < 0) m -= 1;
        return m;
    }

    // ln Σ P(y) over y = start, start + step, … to the end of the support (step ±1), where P falls
    // from start onwards (start is on the far side of a mode, or is one); −∞ for a start outside.
    double log_tail(double start, double step, const Deadline& deadline) const {
        if (start < low_ || start > high_) return -std::numeric_limits<double>::infinity();
        const double end = step < 0 ? low_ : high_;
        const double log_first = log_probability(start);
        CompensatedSum sum;  // of P(y)/P(start)
        sum.add(1.0);
        Cells k = cells_at(start);
        double x = start, term = 1.0;
        for (unsigned i = 1; x != end; ++i) {
            const double ratio = neighbour_ratio(k, step);
            x += step;
            for (std::size_t j = 0; j < N; ++j) k[j] += sign_[j] * step;
            term = i % 64 == 0 ? std::exp(log_probability(k, difference_at(x)) - log_first) : term * ratio;
            sum.add(term);
            if (term * ratio <= (1 - ratio) * sum.value() * 0x1p-60) break;
            if (i % 4096 == 0) {
                deadline.check();
                if (x != end && ratio > 0.99 && *std::min_element(k.begin(), k.end()) >= 1e6) {
                    sum.add(remainder(x + step, step, log_first));
                    break;
                }
            }
        }
        return log_first + std::log(sum.value());
    }

    // P(X ≤ x), P(X ≥ x) and the two-sided p-value at x: the probability of every y with
    // P(y) ≤ P(x)·(1 + tie), found as two tails, one each side of the mode, whose edges bisection finds.
    double lower(double x, const Deadline& deadline) const {
        const double mode = this->mode();
        return probability(x <= mode ? std::exp(log_tail(x, -1, deadline)) : -std::expm1(log_tail(x + 1, +1, deadline)));
    }
    double upper(double x, const Deadline& deadline) const {
        const double mode = this->mode();
        return probability(x >= mode ? std::exp(log_tail(x, +1, deadline)) : -std::expm1(log_tail(x - 1, -1, deadline)));
    }
    double two_sided(double x, double tie, const Deadline& deadline) const {
        const double mode = this->mode();
        const double threshold = log_probability(x) + std::log1p(tie);
        const auto in_tail = [&](double y) { return log_probability(y) <= threshold; };
        double p = 0.0;
        if (in_tail(low_)) {  // the largest y in [low, mode] still in the lower tail
            double lo = low_, hi = mode;
            while (lo < hi) {
                const double middle = lo + std::floor((hi - lo + 1) / 2);
                if (in_tail(middle)) lo = middle;
                else hi = middle - 1;
            }
            p += std::exp(log_tail(lo, -1, deadline));
        }
        if (mode < high_ && in_tail(high_)) {  // the smallest y in (mode, high] in the upper tail
            double lo = mode + 1, hi = high_;
            while (lo < hi) {
                const double middle = lo + std::floor((hi - lo) / 2);
                if (in_tail(middle)) hi = middle;
                else lo = middle + 1;
            }
            p += std::exp(log_tail(lo, +1, deadline));
        }
        return probability(p);
    }

private:
    static double probability(double p) { return std::clamp(p, 0.0, 1.0); }

    // P(x + step)/P(x) for the cells k at x: the product of the cells that shrink over the product
    // of the growing ones, each plus 1.
    double neighbour_ratio(const Cells& k, double step) const {
        double shrinking = 1, growing = 1;
        for (std::size_t i = 0; i < N; ++i) {
            if (sign_[i] * step < 0) shrinking *= k[i];
            else growing *= k[i] + 1;
        }
        return shrinking / growing;
    }

    // The sign of P(x + 1) − P(x), from the products of neighbour_ratio compared exactly (at most two
    // factors each, every one a whole number below 2^53).
    int compare_neighbours(double x) const {
        const Cells k = cells_at(x);
        DoubleDouble shrinking{1, 0}, growing{1, 0};
        for (std::size_t i = 0; i < N; ++i) {
            if (sign_[i] < 0) shrinking = shrinking * DoubleDouble{k[i], 0};
            else growing = growing * DoubleDouble{k[i] + 1, 0};
        }
        const DoubleDouble gap = shrinking - growing;
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
            Cells k = k0;
            for (std::size_t i = 0; i < N; ++i) k[i] += sign_[i] * step * u;
            return log_probability(k, difference0 + step * u) - log_reference;
        };
        const auto f = [&](double u) { return std::exp(log_f(u)); };
        const Policy policy;
        // ln P′ = −Σ sign ψ(k + 1), ln P″ = −Σ ψ′(k + 1), ln P‴ = −Σ sign ψ″(k + 1), along the step.
        double g1 = 0, g2 = 0, g3 = 0;
        for (std::size_t i = 0; i < N; ++i) {
            g1 -= sign_[i] * step * boost::math::digamma(k0[i] + 1, policy);
            g2 -= boost::math::trigamma(k0[i] + 1, policy);
            g3 -= sign_[i] * step * boost::math::polygamma(2, k0[i] + 1, policy);
        }
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
            integral.add(boost::math::quadrature::gauss<double, 20>::integrate(f, u, next));
            const double log_end = log_f(next);
            // F is log-concave and falling: beyond `next` it adds at most F(next)·width/ln(F(u)/F(next)).
            const double drop = log_start - log_end;
            if (drop > 0 && std::exp(log_end) * (next - u) / drop <= integral.value() * 0x1p-60) break;
            u = next;
            log_start = log_end;
        }
        return integral.value() + corrections;
    }

    Cells base_;
    std::array<int, N> sign_;
    Cells expected_;
    double u_, v_, q_, constant_, low_, high_;
};

}  // namespace assoc::detail
