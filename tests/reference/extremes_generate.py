#!/usr/bin/python3
"""Generates tests/reference/extremes_values.hpp: values at the extremes where digits used to be lost.

Every value is computed with mpmath 1.2.1 at 80 significant digits (400 for the fitted cells of the
Breslow-Day test, 700 where counts near 1e308 meet single digits) from the exact double inputs and
the definitions the core documents (Python's fractions where the arithmetic is rational), then
rounded once to a double. The cases are from issues 9 and 15 of the project (counts near 1e8 to
1e308, fitted cells within a hair of their bounds, subnormal alpha) plus a few invented neighbours.

Run from the repository root:  /usr/bin/python3 tests/reference/extremes_generate.py
"""
from fractions import Fraction
from pathlib import Path

import mpmath
from mpmath import mp, mpf

assert mpmath.__version__ == "1.2.1", mpmath.__version__
mp.dps = 80


def chi2_upper(x, df):
    return mp.gammainc(mpf(df) / 2, mpf(x) / 2, mp.inf, regularized=True)


def normal_two_sided(z):
    return mp.erfc(abs(z) / mp.sqrt(2))


def d(value):
    """A C++ double literal that rounds to the value (17 significant digits)."""
    v = float(value)
    return repr(v) if v != 0 else "0.0"


# --- Cochran-Armitage: z = Σ x (s − s̄) / √(p̄ (1 − p̄) Σ n (s − s̄)²), exactly in fractions --------------
TREND = [
    ("issue_15_far_tail", [[2, 273083], [18, 4549]], [24, 20], "issue 15: p 6.732495014e-212 before"),
    ("hundred_thousands", [[95000, 97000, 99000, 101000], [105000, 103000, 101000, 99000]], [1, 2, 3, 4],
     "invented, counts near 1e5"),
    ("ten_millions_small_trend", [[10000000, 10000100, 10000250], [10000000, 9999900, 9999700]], [0, 1, 2],
     "invented, counts near 1e7"),
    ("uneven_scores", [[12, 40, 300000], [30, 45, 290000]], [1.5, 2.25, 1e6], "invented, scores far apart"),
]


def trend(table, scores):
    x, y = table
    s = [Fraction(v) for v in scores]
    n = [Fraction(a + b) for a, b in zip(x, y)]
    total, events = sum(n), Fraction(sum(x))
    mean = sum(ni * si for ni, si in zip(n, s)) / total
    numerator = sum(Fraction(xi) * (si - mean) for xi, si in zip(x, s))
    spread = sum(ni * (si - mean) ** 2 for ni, si in zip(n, s))
    share = events / total
    z2 = numerator ** 2 / (share * (1 - share) * spread)
    z = mp.sqrt(mpf(z2.numerator) / z2.denominator) * (1 if numerator > 0 else -1)
    return z, normal_two_sided(z)


# --- Breslow-Day with Tarone's correction, Mantel-Haenszel -----------------------------------------
STRATA = [
    ("issue_9_counts_of_1e17", [[1e17, 1, 1, 1e17], [5, 6, 7, 8]], "issue 9: p = 1, statistic 0 before"),
    ("issue_9_counts_of_1e120", [[1e120, 1, 1, 1e120], [5, 6, 7, 8]], "issue 9"),
    ("fitted_cell_near_its_bound", [[1, 0, 1000, 1], [40, 10, 10, 40], [30, 15, 12, 35]],
     "invented: stratum 1's fitted b is about 1e-5"),
    ("fitted_cell_a_hair_from_its_bound", [[3, 0, 20000000, 2], [400, 100, 90, 410], [300, 150, 120, 350]],
     "invented: a fitted cell about 1e-8"),
    ("tiny_weight", [[1e-10, 1, 1, 1], [5, 6, 7, 8], [4, 4, 3, 6]], "issue 9: a count of 1e-10"),
    ("issue_9_mantel_haenszel_1e80", [[1e80, 1, 1, 1e80], [5, 6, 7, 8]], "issue 9: p = 1 before"),
    ("issue_9_mantel_haenszel_1e77", [[1e77, 1, 1, 1e77], [5, 6, 7, 8]], "issue 9"),
]


def to_mpf(v):
    return mpf(v) if isinstance(v, float) else mpf(int(v))


def breslow_day(strata):
    # A fitted cell can be 1e-118 beside counts of 1e120: 400 digits hold both.
    with mp.workdps(400):
        return [+v for v in _breslow_day(strata)]


def _breslow_day(strata):
    tables = [[to_mpf(v) for v in t] for t in strata]
    r = sum(a * dd / (a + b + c + dd) for a, b, c, dd in tables)
    s = sum(b * c / (a + b + c + dd) for a, b, c, dd in tables)
    psi = r / s
    uncorrected = mpf(0)
    sum_diff, sum_var = mpf(0), mpf(0)
    for a, b, c, dd in tables:
        # (a + δ)(d + δ) = ψ (b − δ)(c − δ):  (1 − ψ) δ² + (a + d + ψ (b + c)) δ + (a d − ψ b c) = 0
        q, l, k = 1 - psi, a + dd + psi * (b + c), a * dd - psi * b * c
        root = mp.sqrt(l * l - 4 * q * k)
        roots = [-2 * k / (l + root)] + ([] if q == 0 else [(-l - root) / (2 * q)])
        low, high = -min(a, dd), min(b, c)
        delta = [x for x in roots if low <= x <= high][0]
        cells = [a + delta, b - delta, c - delta, dd + delta]
        variance = 1 / sum(1 / x for x in cells)
        uncorrected += delta ** 2 / variance
        sum_diff += delta
        sum_var += variance
    corrected = uncorrected - sum_diff ** 2 / sum_var
    return corrected, uncorrected, chi2_upper(corrected, len(strata) - 1), psi


def mantel_haenszel(strata, confidence=mpf("0.95")):
    tables = [[to_mpf(v) for v in t] for t in strata]
    difference, variance = mpf(0), mpf(0)
    r = s = pr = ps_qr = qs = mpf(0)
    for a, b, c, dd in tables:
        n = a + b + c + dd
        r1, r2, c1, c2 = a + b, c + dd, a + c, b + dd
        difference += a - r1 * c1 / n
        variance += r1 * r2 * c1 * c2 / (n * n * (n - 1))
        rk, sk, pk, qk = a * dd / n, b * c / n, (a + dd) / n, (b + c) / n
        r, s, pr, ps_qr, qs = r + rk, s + sk, pr + pk * rk, ps_qr + pk * sk + qk * rk, qs + qk * sk
    excess = abs(difference) - min(mpf("0.5"), abs(difference))
    statistic = excess ** 2 / variance
    psi = r / s
    log_variance = pr / (2 * r * r) + ps_qr / (2 * r * s) + qs / (2 * s * s)
    z = mp.sqrt(2) * mp.erfinv(confidence)
    half = z * mp.sqrt(log_variance)
    return statistic, chi2_upper(statistic, 1), psi, psi * mp.exp(-half), psi * mp.exp(half)


# --- The exact paired test: twice the smaller tail of Binomial(b + c, ½) --------------------------------
PAIRED = [(1000000, 1001500), (1000000000, 1000060000), (1000000000000, 1000002000000), (37, 61), (0, 12)]


def exact_paired(b, c):
    """min(1, 2·P(X ≤ min(b, c))) for X ~ Binomial(b + c, ½), summed down from the observed count."""
    m, k = b + c, min(b, c)
    term = mp.exp(mp.loggamma(m + 1) - mp.loggamma(k + 1) - mp.loggamma(m - k + 1) - m * mp.log(2))
    total, x = term, k
    while x > 0:
        term *= mpf(x) / (m - x + 1)
        x -= 1
        total += term
        if term < total * mpf(10) ** -45:
            break
    return min(2 * total, mpf(1))


# --- 2×2 and r×c tables at the ends of the double range ---------------------------------------------
def table_measures(table):
    with mp.workdps(700):  # 1e308 + 3 must differ from 1e308
        return _table_measures(table)


def _table_measures(table):
    rows = [[to_mpf(v) for v in row] for row in table]
    n = sum(sum(row) for row in rows)
    rt = [sum(row) for row in rows]
    ct = [sum(col) for col in zip(*rows)]
    e = [[rt[i] * ct[j] / n for j in range(len(ct))] for i in range(len(rt))]
    x2 = sum((rows[i][j] - e[i][j]) ** 2 / e[i][j] for i in range(len(rt)) for j in range(len(ct)))
    g2 = 2 * sum(rows[i][j] * mp.log(rows[i][j] / e[i][j]) for i in range(len(rt)) for j in range(len(ct))
                 if rows[i][j] > 0)
    yates = None
    if len(rt) == 2 and len(ct) == 2:
        yates = sum(max(mpf(0), abs(rows[i][j] - e[i][j]) - mpf("0.5")) ** 2 / e[i][j]
                    for i in range(2) for j in range(2))
    k = min(len(rt), len(ct))
    v = mp.sqrt(x2 / (n * (k - 1)))
    adjusted = [[(rows[i][j] - e[i][j]) / mp.sqrt(e[i][j] * (1 - rt[i] / n) * (1 - ct[j] / n))
                 for j in range(len(ct))] for i in range(len(rt))]
    return dict(x2=x2, g2=g2, yates=yates, v=v, w=mp.sqrt(x2 / n), expected=e, adjusted=adjusted, n=n)


def main():
    out = ["#pragma once",
           "// Generated by tests/reference/extremes_generate.py; do not edit by hand.",
           f"// mpmath {mpmath.__version__} at {mp.dps} digits (Python fractions where the arithmetic is rational).",
           "namespace assoc::reference {", ""]

    out += ["struct TrendCase {", "    const char* name;", "    int categories;", "    double first[4], second[4], scores[4];",
            "    double z, p_value;", "};", "", "inline constexpr TrendCase trend_extremes[] = {"]
    for name, table, scores, comment in TREND:
        z, p = trend(table, scores)
        k = len(scores)
        out.append(f"    // {comment}")
        out.append(f"    {{\"{name}\", {k}, {{{', '.join(d(v) for v in table[0])}}}, {{{', '.join(d(v) for v in table[1])}}}, "
                   f"{{{', '.join(d(v) for v in scores)}}}, {d(z)}, {d(p)}}},")
    out += ["};", ""]

    out += ["struct StrataCase {", "    const char* name;", "    int strata;", "    double cells[3][4];",
            "    double homogeneity_statistic, homogeneity_uncorrected, homogeneity_p;",
            "    double mh_statistic, mh_p, common_odds_ratio, lower, upper;", "};", "",
            "inline constexpr StrataCase strata_extremes[] = {"]
    for name, strata, comment in STRATA:
        corrected, uncorrected, bd_p, psi = breslow_day(strata)
        mh, mh_p, psi2, lower, upper = mantel_haenszel(strata)
        assert abs(psi - psi2) <= abs(psi) * mpf(10) ** -50
        cells = ", ".join("{" + ", ".join(d(v) for v in t) + "}" for t in strata)
        out.append(f"    // {comment}; Breslow-Day p = {mp.nstr(bd_p, 6)}, Mantel-Haenszel p = {mp.nstr(mh_p, 6)}")
        out.append(f"    {{\"{name}\", {len(strata)}, {{{cells}}}, {d(corrected)}, {d(uncorrected)}, {d(bd_p)}, "
                   f"{d(mh)}, {d(mh_p)}, {d(psi)}, {d(lower)}, {d(upper)}}},")
    out += ["};", ""]

    out += ["// The exact paired test: min(1, 2 P(X ≤ min(b, c))) for X ~ Binomial(b + c, ½), summed term by term.",
            "struct PairedCase {", "    double b, c, p_value;", "};", "", "inline constexpr PairedCase paired_exact[] = {"]
    for b, c in PAIRED:
        out.append(f"    {{{d(b)}, {d(c)}, {d(exact_paired(b, c))}}},")
    out += ["};", ""]

    # Yates at counts near 1e8 (issue 15), and the table whose small cells once underflowed (issue 9).
    yates_table = [[99999997, 99999999], [99999999, 99999999]]
    m = table_measures(yates_table)
    out += ["// Yates at counts near 1e8: |ad − bc|/n − ½ is 7.5e-9 (issue 15: 2.50000000711e-25 before).",
            f"inline constexpr double yates_near_1e8[4] = {{{', '.join(d(v) for r in yates_table for v in r)}}};",
            f"inline constexpr double yates_near_1e8_statistic = {d(m['yates'])};",
            f"inline constexpr double yates_near_1e8_p = {d(chi2_upper(m['yates'], 1))};", ""]

    wide = [[2.0, 0.0], [1.0, 1e308]]
    m = table_measures(wide)
    out += ["// [[2, 0], [1, 1e308]]: X², V, φ, w and the residuals once overflowed (issue 9).",
            f"inline constexpr double wide_table_pearson = {d(m['x2'])};",
            f"inline constexpr double wide_table_likelihood_ratio = {d(m['g2'])};",
            f"inline constexpr double wide_table_yates = {d(m['yates'])};",
            f"inline constexpr double wide_table_cramers_v = {d(m['v'])};",
            f"inline constexpr double wide_table_w = {d(m['w'])};",
            f"inline constexpr double wide_table_expected[4] = {{{', '.join(d(v) for r in m['expected'] for v in r)}}};",
            f"inline constexpr double wide_table_adjusted[4] = {{{', '.join(d(v) for r in m['adjusted'] for v in r)}}};",
            ""]

    big = [[1e15, 2e15], [3e15, 1e15 + 7]]
    m = table_measures(big)
    out += ["// Counts of 1e15 (issue 9's report).",
            f"inline constexpr double counts_of_1e15_cramers_v = {d(m['v'])};",
            f"inline constexpr double counts_of_1e15_adjusted_top_left = {d(m['adjusted'][0][0])};", ""]

    # Goodness of fit on 28, 2^53, 1, 1e300 with equal shares (issue 9).
    with mp.workdps(700):
        observed = [mpf(28), mpf(2) ** 53, mpf(1), mpf(1e300)]
        total = sum(observed)
        expected = total / 4
        fit = +sum((o - expected) ** 2 / expected for o in observed)
    near = [mpf(100000001), mpf(100000000), mpf(99999999), mpf(100000003)]
    shares = [mpf(1), mpf(1), mpf(1), mpf(1)]
    e2 = sum(near) / 4
    fit2 = sum((o - e2) ** 2 / e2 for o in near)
    out += ["// Goodness of fit with equal shares: 28, 2^53, 1, 1e300 (issue 9), and counts near 1e8.",
            f"inline constexpr double fit_extreme_statistic = {d(fit)};",
            f"inline constexpr double fit_near_1e8_statistic = {d(fit2)};",
            f"inline constexpr double fit_near_1e8_p = {d(chi2_upper(fit2, 3))};", ""]
    assert shares

    # Critical values for alpha below the smallest normal double (issue 15).
    out += ["struct CriticalCase {", "    double df, alpha, critical;", "};", "",
            "// x with Q(df/2, x/2) = alpha, solved by mpmath's findroot on the regularised upper gamma.",
            "inline constexpr CriticalCase subnormal_alpha_critical[] = {"]
    for df in (1, 5, 100, 10**6):
        for alpha in (2e-308, 1e-310, 5e-324):
            target = mpf(alpha)
            guess = mpf(df) + 2 * mp.sqrt(2 * mpf(df) * 750) + 1500
            x = mp.findroot(lambda t: mp.log(chi2_upper(t, df)) - mp.log(target), guess, tol=mpf(10) ** -40)
            out.append(f"    {{{d(df)}, {d(alpha)}, {d(x)}}},")
    out += ["};", "", "}  // namespace assoc::reference", ""]
    Path("tests/reference/extremes_values.hpp").write_text("\n".join(out))


if __name__ == "__main__":
    main()
