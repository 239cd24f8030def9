#!/usr/bin/python3
"""Generates tests/reference/fisher_large_values.hpp: Fisher's exact test on 2×2 tables with large counts.

Every value is computed with mpmath 1.2.1 at 60 significant digits from the definition,
P(x) = C(r1, x) C(r2, c1 − x) / C(n, c1), with ln P from mpmath's loggamma:
- two-sided: the sum of P(y) over every y with P(y) ≤ P(observed)·(1 + 1e-7) (the tie margin);
  the two tails begin where bisection on ln P finds them; lower: P(X ≤ a); upper: P(X ≥ a);
- a tail is summed term by term (each term from the last by the exact ratio of neighbouring
  probabilities) until the terms fall below 1e-45 of the sum; a tail too long for that (a standard
  deviation of 20,000 or more, or more than 3 million terms) is summed by Euler–Maclaurin instead: mpmath's quad of P over the real line plus
  the end corrections through the fifth derivative (mpmath's diff). The script checks the two
  routes against each other on a table where both apply.
Independent checks, asserted by the script and noted beside each value:
- exact rational arithmetic (Python's fractions and math.comb) where the support is small or the
  total is at most 5,000: the definition itself, no rounding;
- R 4.2.2 fisher.test where R accepts the counts (each below 2^31) and the support is at most
  10 million tables (R holds it all in memory): its relative difference from mpmath is recorded.

Run from the repository root:  /usr/bin/python3 tests/reference/fisher_large_generate.py
"""
import math
import subprocess
from fractions import Fraction
from pathlib import Path

import mpmath
from mpmath import mp, mpf

assert mpmath.__version__ == "1.2.1", mpmath.__version__
R_VERSION = subprocess.run(["Rscript", "-e", "cat(R.version.string)"], capture_output=True, text=True).stdout
assert "4.2.2" in R_VERSION, R_VERSION
mp.dps = 60
TIE = mpf(1) + mpf(10) ** -7
DIRECT_LIMIT = 3_000_000

# (name, [[a, b], [c, d]], comment): invented tables unless the comment says otherwise.
CASES = [
    ("froze_calc", [[4294967000, 0], [1, 1]], "the table that froze Calc for 24-51 s (issue 9)"),
    ("billion_beside_small", [[10**9, 5], [4, 7]], "took 2.2 s (issue 9)"),
    ("totals_of_millions", [[2184746, 1745229], [2218678, 1809224]],
     "lost digits before (1.4e-9; issue 15)"),
    ("total_near_1_6_million", [[400123, 399000], [401500, 398400]], "invented, total about 1.6 million"),
    ("millions_far_tail", [[1500000, 1000000], [1000000, 1500000]], "invented, p far below 1e-300"),
    ("millions_near_mode", [[2000000, 2000100], [2000050, 2000000]], "invented, observed near the mode"),
    ("wide_near_mode", [[50000000, 50003000], [50001000, 49998000]],
     "invented, every cell 5e7: the tails need Euler-Maclaurin"),
    ("wide_two_standard_deviations", [[50000000, 50000000], [50014000, 49986000]],
     "invented, every cell 5e7, observed about 2 sd from the mode"),
    ("hundred_billion_near_mode", [[50000000000, 50000200000], [50000100000, 50000000000]],
     "invented, every cell 5e10"),
    ("near_two_to_the_53", [[1125899906842624, 1125899906800000], [1125899906800000, 1125899906842624]],
     "invented, total about 4.5e15, below 2^53"),
    ("huge_and_tiny_cells", [[10**15, 3], [2, 10**12]], "invented, cells of 1e15 beside single digits"),
    ("one_table_each_side", [[4294967000, 1], [1, 0]], "invented, a support of two tables"),
    ("small_checked_by_fractions", [[17, 3], [8, 14]], "invented, small enough for exact fractions"),
    ("moderate_checked_by_fractions", [[1200, 800], [1100, 900]], "invented, total 4,000"),
]


def log_p(margins, x):
    r1, r2, c1, c2, n = margins
    a, b, c, d = x, r1 - x, c1 - x, r2 - c1 + x
    lg = lambda k: mp.loggamma(mpf(k) + 1)  # noqa: E731
    return lg(r1) + lg(r2) + lg(c1) + lg(c2) - lg(n) - lg(a) - lg(b) - lg(c) - lg(d)


def log_p_real(margins, x):
    """ln P extended to real x through the gamma function (for the Euler-Maclaurin route)."""
    r1, r2, c1, c2, n = margins
    cells = [x, r1 - x, c1 - x, r2 - c1 + x]
    lg = lambda k: mp.loggamma(k + 1)  # noqa: E731
    return lg(mpf(r1)) + lg(mpf(r2)) + lg(mpf(c1)) + lg(mpf(c2)) - lg(mpf(n)) - sum(lg(k) for k in cells)


def support(margins):
    r1, r2, c1, c2, n = margins
    return max(0, c1 - r2), min(r1, c1)


def mode(margins):
    r1, r2, c1, c2, n = margins
    low, high = support(margins)
    return min(max((r1 + 1) * (c1 + 1) // (n + 2), low), high)


def tail_direct(margins, start, step):
    """Σ P(y) for y = start, start + step, … (P falling from start), term by term."""
    r1, r2, c1, c2, n = margins
    low, high = support(margins)
    end = low if step < 0 else high
    first = mp.exp(log_p(margins, start))
    total, term, x, count = first, first, start, 0
    while x != end:
        a, b, c, d = x, r1 - x, c1 - x, r2 - c1 + x
        ratio = mpf(a * d) / ((b + 1) * (c + 1)) if step < 0 else mpf(b * c) / ((a + 1) * (d + 1))
        term *= ratio
        x += step
        total += term
        count += 1
        if term < total * mpf(10) ** -45 and ratio < 1:
            break
        if count > DIRECT_LIMIT:
            return None
    return total


def tail_euler_maclaurin(margins, start, step):
    """The same sum by Euler-Maclaurin: ∫ P + P/2 − P'/12 + P'''/720 − P⁽⁵⁾/30240 at the start."""
    low, high = support(margins)
    reference = log_p_real(margins, mpf(start))
    f = lambda u: mp.exp(log_p_real(margins, start + step * u) - reference)  # noqa: E731
    r1, r2, c1, c2, n = margins
    variance = mpf(r1) * r2 * c1 * c2 / (mpf(n) ** 2 * (n - 1))
    sd = mp.sqrt(variance)
    room = (start - low) if step < 0 else (high - start)
    edges = [mpf(0)]
    while edges[-1] < room and (len(edges) < 3 or f(edges[-1]) > mpf(10) ** -50):
        edges.append(min(edges[-1] + sd / 4, mpf(room)))
    integral = mp.quad(f, edges)
    derivatives = [mp.diff(f, 0, k) for k in (1, 3, 5)]
    s = integral + f(0) / 2 - derivatives[0] / 12 + derivatives[1] / 720 - derivatives[2] / 30240
    return s * mp.exp(reference)


def tail(margins, start, step):
    low, high = support(margins)
    if not low <= start <= high:
        return mpf(0)
    r1, r2, c1, c2, n = margins
    sd = math.sqrt(r1 * r2 * c1 * c2 / (n * n * (n - 1)))
    direct = tail_direct(margins, start, step) if sd < 20000 else None
    return direct if direct is not None else tail_euler_maclaurin(margins, start, step)


def p_values(table):
    (a, b), (c, d) = table
    margins = (a + b, c + d, a + c, b + d, a + b + c + d)
    low, high = support(margins)
    m = mode(margins)
    # The mode as a maximiser: move to a neighbour that is more probable (the floor formula is one).
    lower = tail(margins, a, -1) if a <= m else 1 - tail(margins, a + 1, +1)
    upper = tail(margins, a, +1) if a >= m else 1 - tail(margins, a - 1, -1)
    threshold = log_p(margins, a) + mp.log(TIE)
    in_tail = lambda x: log_p(margins, x) <= threshold  # noqa: E731
    two = mpf(0)
    if in_tail(low):
        lo, hi = low, m
        while lo < hi:
            mid = lo + (hi - lo + 1) // 2
            lo, hi = (mid, hi) if in_tail(mid) else (lo, mid - 1)
        two += tail(margins, lo, -1)
    if m < high and in_tail(high):
        lo, hi = m + 1, high
        while lo < hi:
            mid = lo + (hi - lo) // 2
            lo, hi = (lo, mid) if in_tail(mid) else (mid + 1, hi)
        two += tail(margins, lo, +1)
    return min(two, mpf(1)), min(lower, mpf(1)), min(upper, mpf(1))


def fraction_p_values(table):
    """Exact rational p-values, or None when the support is too large to enumerate."""
    (a, b), (c, d) = table
    r1, r2, c1, n = a + b, c + d, a + c, a + b + c + d
    low, high = max(0, c1 - r2), min(r1, c1)
    if high - low > 5000 or (n > 5000 and high - low > 50):
        return None
    denominator = math.comb(n, c1)
    p = {x: Fraction(math.comb(r1, x) * math.comb(r2, c1 - x), denominator) for x in range(low, high + 1)}
    observed = p[a]
    two = sum(v for v in p.values() if v <= observed * Fraction(10**7 + 1, 10**7))
    lower = sum(v for x, v in p.items() if x <= a)
    upper = sum(v for x, v in p.items() if x >= a)
    return two, lower, upper


def r_p_values(table):
    """R's p-values, or None where R refuses the counts or would hold the whole support in memory."""
    (a, b), (c, d) = table
    if max(a, b, c, d) >= 2**31 or min(a + b, a + c, b + d, c + d) > 10**7:
        return None
    script = (f"m <- matrix(c({a}, {c}, {b}, {d}), 2); "
              "cat(sapply(c('two.sided', 'less', 'greater'), "
              "function(s) sprintf('%.17g', fisher.test(m, alternative = s)$p.value)))")
    out = subprocess.run(["Rscript", "-e", script], capture_output=True, text=True, check=True).stdout
    return [float(v) for v in out.split()]


def relative(x, y):
    return 0.0 if x == y else float(abs(mpf(x) - mpf(y)) / abs(mpf(y)))


def check_routes_agree():
    """Direct summation and Euler-Maclaurin on the same tail (some 60,000 terms)."""
    (a, b), (c, d) = [[100000000, 100002000], [100001000, 99999000]]
    margins = (a + b, c + d, a + c, b + d, a + b + c + d)
    start = mode(margins) + 1
    direct, em = tail_direct(margins, start, +1), tail_euler_maclaurin(margins, start, +1)
    assert relative(em, direct) < 1e-30, (em, direct)
    print("direct and Euler-Maclaurin agree to", relative(em, direct), flush=True)


def main():
    check_routes_agree()
    lines = ["#pragma once",
             "// Generated by tests/reference/fisher_large_generate.py; do not edit by hand.",
             f"// mpmath {mpmath.__version__} at {mp.dps} digits; exact fractions; {R_VERSION.strip()} fisher.test.",
             "namespace assoc::reference {", "",
             "struct FisherCase {",
             "    const char* name;",
             "    double a, b, c, d;",
             "    double two_sided, lower, upper;",
             "};", "",
             "inline constexpr FisherCase fisher_large[] = {"]
    for name, table, comment in CASES:
        two, lower, upper = p_values(table)
        notes = [comment]
        exact = fraction_p_values(table)
        if two < mpf(2) ** -1074:
            notes.append(f"two-sided p = {mp.nstr(two, 5)}, below the smallest double")
        if exact is not None:
            for value, fraction in zip((two, lower, upper), exact):
                assert relative(value, mpf(fraction.numerator) / fraction.denominator) < 1e-40, (name, value, fraction)
            notes.append("exact fractions agree")
        r = r_p_values(table)
        if r is not None:
            worst = max(relative(x, y) for x, y in zip(r, (two, lower, upper)) if y >= mpf(2) ** -1074)
            notes.append(f"R fisher.test agrees to {worst:.1e}")
        else:
            notes.append("R not run (counts of 2^31 or more, or a support above 10 million)")
        values = ", ".join(repr(float(v)) for v in (two, lower, upper))
        (a, b), (c, d) = table
        lines.append(f"    // {'; '.join(notes)}")
        lines.append(f"    {{\"{name}\", {a}.0, {b}.0, {c}.0, {d}.0, {values}}},")
        print(name, values, notes, flush=True)
    lines += ["};", "", "}  // namespace assoc::reference", ""]
    Path("tests/reference/fisher_large_values.hpp").write_text("\n".join(lines))


if __name__ == "__main__":
    main()
