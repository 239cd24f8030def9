#!/usr/bin/python3
"""Generates tests/reference/small_sample_values.hpp: expected values for the small-sample and
effect-size routines (odds and risk ratios, goodness of fit, cell tests, power, Cramér's V
interval, exact conditional p-values for the Monte Carlo test).

Tools: python3-scipy 1.10.1, python3-numpy 1.24.2, python3-statsmodels 0.13.5, python3-mpmath 1.2.1
(Debian 12). Run from the repository root:  /usr/bin/python3 tests/reference/small_sample_generate.py
R 4.2.2 (Rscript) cross-checks the power values (pchisq with ncp) and the enumeration of tables
(fisher.test), and the script stops if they disagree.
"""
import math
import subprocess
import sys
from fractions import Fraction
from pathlib import Path

import mpmath as mp
import numpy as np
import scipy
import statsmodels
from scipy import optimize, stats
from statsmodels.stats.contingency_tables import Table, Table2x2
from statsmodels.stats.multitest import multipletests

assert scipy.__version__ == "1.10.1", scipy.__version__
assert statsmodels.__version__.startswith("0.13.5"), statsmodels.__version__
mp.mp.dps = 50

out = []


def r_values(expression):
    """Numbers printed by R 4.2.2 for an expression that yields a numeric vector."""
    text = subprocess.run(["Rscript", "-e", f"cat(sprintf('%.17g', {expression}), sep='\\n')"],
                          check=True, capture_output=True, text=True).stdout
    return [float(v) for v in text.split()]


def emit(name, value):
    out.append(f"inline constexpr double {name} = {float(value)!r};")


def emit_array(name, values):
    body = ", ".join(repr(float(v)) for v in values)
    out.append(f"inline constexpr double {name}[] = {{{body}}};")


def comment(text):
    out.append("")
    for line in text.strip().splitlines():
        out.append("// " + line)


# --- Odds ratio and risk ratio: statsmodels Table2x2 -------------------------------------------
comment("Odds and risk ratios: statsmodels 0.13.5 Table2x2 (Woolf logit interval; log interval for the\n"
        "risk ratio). Aspirin table of published_values.md section 10: placebo 189/10845, aspirin 104/10933.")
aspirin = np.array([[189, 10845], [104, 10933]], dtype=float)
t = Table2x2(aspirin)
emit("aspirin_odds_ratio", t.oddsratio)
lo, hi = t.oddsratio_confint(alpha=0.05)
emit("aspirin_odds_ratio_lower", lo)
emit("aspirin_odds_ratio_upper", hi)
emit("aspirin_log_odds_ratio_se", t.log_oddsratio_se)
lo, hi = t.oddsratio_confint(alpha=0.10)
emit("aspirin_odds_ratio_lower_90", lo)
emit("aspirin_odds_ratio_upper_90", hi)
emit("aspirin_risk_ratio", t.riskratio)
lo, hi = t.riskratio_confint(alpha=0.05)
emit("aspirin_risk_ratio_lower", lo)
emit("aspirin_risk_ratio_upper", hi)
emit("aspirin_log_risk_ratio_se", t.log_riskratio_se)

comment("Zero cell, invented table [[0, 10], [5, 5]]: Haldane–Anscombe, 0.5 added to every cell.\n"
        "Table2x2(table + 0.5, shift_zeros=False); its default shift_zeros=True shifts only the zero cells.")
zero = np.array([[0, 10], [5, 5]], dtype=float)
t = Table2x2(zero + 0.5, shift_zeros=False)
emit("haldane_odds_ratio", t.oddsratio)
lo, hi = t.oddsratio_confint(alpha=0.05)
emit("haldane_odds_ratio_lower", lo)
emit("haldane_odds_ratio_upper", hi)
emit("haldane_risk_ratio", t.riskratio)
lo, hi = t.riskratio_confint(alpha=0.05)
emit("haldane_risk_ratio_lower", lo)
emit("haldane_risk_ratio_upper", hi)

# --- Goodness of fit: scipy.stats.chisquare ---------------------------------------------------
comment("Goodness of fit: scipy 1.10.1 stats.chisquare. Mendel's dihybrid cross (published_values.md section 6,\n"
        "counts from memory) 315/108/101/32 against 9:3:3:1; X² is exactly 196/417.")
mendel = np.array([315, 108, 101, 32], dtype=float)
shares = np.array([9, 3, 3, 1], dtype=float)
res = stats.chisquare(mendel, f_exp=mendel.sum() * shares / shares.sum())
emit("mendel_statistic", res.statistic)
emit("mendel_p_value", res.pvalue)
res = stats.chisquare(mendel, f_exp=mendel.sum() * shares / shares.sum(), ddof=1)
emit("mendel_p_value_one_estimated", res.pvalue)
comment("Invented: sick-leave days by weekday at a fictional firm, Monday to Friday, against equal shares.")
weekdays = np.array([44, 25, 21, 18, 32], dtype=float)
res = stats.chisquare(weekdays)
emit("weekday_statistic", res.statistic)
emit("weekday_p_value", res.pvalue)

# --- Multiple-testing adjustment: statsmodels multipletests -----------------------------------
comment("Adjusted p-values: statsmodels 0.13.5 multipletests (method 'holm' and 'bonferroni').")
raw = [0.01, 0.04, 0.03, 0.005, 0.2, 0.04, 0.6]
emit_array("adjustment_raw", raw)
emit_array("adjustment_holm", multipletests(raw, method="holm")[1])
emit_array("adjustment_bonferroni", multipletests(raw, method="bonferroni")[1])

comment("Cell p-values of the Agresti (2007) party-identification table (published_values.md section 3):\n"
        "statsmodels Table.standardized_resids (adjusted residuals), 2·scipy norm.sf(|z|), then multipletests,\n"
        "row by row: females D, I, R, males D, I, R.")
party = np.array([[762, 327, 468], [484, 239, 477]], dtype=float)
z = Table(party).standardized_resids.ravel()
raw_cells = 2 * stats.norm.sf(np.abs(z))
emit_array("party_cell_p_none", raw_cells)
emit_array("party_cell_p_holm", multipletests(raw_cells, method="holm")[1])
emit_array("party_cell_p_bonferroni", multipletests(raw_cells, method="bonferroni")[1])
comment("A table with one very strong cell: [[60, 2], [3, 55]]; unadjusted cell p-value (tiny) by\n"
        "mpmath erfc(|z|/√2) at 50 digits, z from statsmodels.")
strong = np.array([[60, 2], [3, 55]], dtype=float)
zs = Table(strong).standardized_resids[0, 0]
emit("strong_cell_p", mp.erfc(abs(mp.mpf(zs)) / mp.sqrt(2)))


# --- Power and sample size: scipy ncx2 --------------------------------------------------------
def power(w, n, df, alpha):
    return stats.ncx2.sf(stats.chi2.isf(alpha, df), df, n * w * w)


comment("Power of the chi-squared test, λ = n·w²: scipy 1.10.1 ncx2.sf(chi2.isf(alpha, df), df, λ)\n"
        "(published_values.md section 8; Cohen 1988 ch. 7). Rows: w, n, df, alpha, power.")
power_cases = [(0.3, 87, 1, 0.05), (0.3, 88, 1, 0.05), (0.1, 785, 1, 0.05), (0.5, 50, 4, 0.01),
               (0.2, 200, 3, 0.05), (0.3, 100, 1, 0.05), (0.05, 10000, 10, 0.05), (0.4, 30, 6, 0.10)]
rows = ", ".join("{%r, %r, %r, %r, %r}" % (w, float(n), float(df), a, float(power(w, n, df, a)))
                 for (w, n, df, a) in power_cases)
r_power = r_values("c(" + ", ".join(f"pchisq(qchisq({a}, {df}, lower.tail=FALSE), {df}, ncp={n}*{w}^2, lower.tail=FALSE)"
                                    for (w, n, df, a) in power_cases) + ")")
worst = max(abs(rp - power(*case)) / rp for rp, case in zip(r_power, power_cases))
assert worst < 1e-10, worst
out.append(f"// R 4.2.2 pchisq(ncp=) agrees to a relative {worst:.1e}.")
out.append("struct PowerCase { double w, n, df, alpha, power; };")
out.append(f"inline constexpr PowerCase power_cases[] = {{{rows}}};")

comment("Sample sizes: the smallest whole n with power ≥ target, by scanning n with scipy ncx2\n"
        "(published_values.md section 8 table). Rows: w, power, df, alpha, n.")


def smallest_n(w, target, df, alpha):
    lam = optimize.brentq(lambda l: stats.ncx2.sf(stats.chi2.isf(alpha, df), df, l) - target, 1e-6, 1e4, xtol=1e-13)
    n = max(1, math.floor(lam / (w * w)) - 2)
    while power(w, n, df, alpha) < target:
        n += 1
    return n


size_cases = []
for target in (0.80, 0.90):
    for df in (1, 2, 4):
        for w in (0.1, 0.3, 0.5):
            size_cases.append((w, target, df, 0.05))
size_cases += [(0.25, 0.95, 3, 0.01), (0.02, 0.8, 1, 0.05)]
rows = ", ".join("{%r, %r, %r, %r, %r}" % (w, p, float(df), a, float(smallest_n(w, p, df, a)))
                 for (w, p, df, a) in size_cases)
out.append("struct SampleSizeCase { double w, power, df, alpha, n; };")
out.append(f"inline constexpr SampleSizeCase sample_size_cases[] = {{{rows}}};")


# --- Cramér's V interval: mpmath Poisson mixture + findroot, checked with scipy ncx2 + brentq ---
def mp_sf(x, df, lam):
    """P(X ≥ x) for X ~ noncentral χ²(df, λ): Σ_j Pois(j; λ/2) · Q((df + 2j)/2, x/2)."""
    x, lam = mp.mpf(x), mp.mpf(lam)
    if lam == 0:
        return mp.gammainc(mp.mpf(df) / 2, x / 2, mp.inf, regularized=True)
    half = lam / 2
    total = mp.mpf(0)
    centre = int(half)
    j_max = centre + 40 + int(12 * mp.sqrt(half + 1))
    for j in range(0, j_max + 1):
        weight = mp.exp(-half + j * mp.log(half) - mp.loggamma(j + 1))
        total += weight * mp.gammainc(mp.mpf(df) / 2 + j, x / 2, mp.inf, regularized=True)
    return total


def mp_noncentrality(x, df, target):
    if mp_sf(x, df, 0) >= target:
        return mp.mpf(0)
    hi = mp.mpf(max(1.0, 2 * x))
    while mp_sf(x, df, hi) < target:
        hi *= 2
    return mp.findroot(lambda l: mp_sf(x, df, l) - target, (mp.mpf(0), hi), solver="anderson", tol=1e-40)


def sp_noncentrality(x, df, target):
    if stats.chi2.sf(x, df) >= target:
        return 0.0
    return optimize.brentq(lambda l: stats.ncx2.sf(x, df, l) - target, 1e-12, 10 * x + 100, xtol=1e-14, rtol=1e-15)


comment("Cramér's V confidence interval by inverting the noncentral chi-squared: λ_L, λ_U solve\n"
        "P(X ≥ X²_obs | λ) = α/2 and 1 − α/2 (0 when λ = 0 already exceeds the target);\n"
        "V = √(λ / (n (min(r, c) − 1))). mpmath 1.2.1, 50 digits (Poisson mixture of regularized gamma tails,\n"
        "findroot); scipy ncx2.sf + brentq agrees to the relative difference noted beside each table.")
v_tables = {
    "party": party,
    "alcohol": np.array([[48, 38, 5, 1, 1], [17066, 14464, 788, 126, 37]], dtype=float),
    "small": np.array([[5, 3, 2], [4, 6, 1]], dtype=float),
    # Invented: training course taken (3 kinds) by job level (3) at a fictional firm.
    "training": np.array([[25, 12, 8], [10, 20, 9], [6, 11, 24]], dtype=float),
}
for name, counts in v_tables.items():
    chi2, _, df, _ = stats.chi2_contingency(counts, correction=False)
    n = counts.sum()
    k = min(counts.shape) - 1
    for conf, suffix in ((0.95, ""), (0.90, "_90")):
        alpha = 1 - conf
        lam_l = mp_noncentrality(chi2, df, alpha / 2)
        lam_u = mp_noncentrality(chi2, df, 1 - alpha / 2)
        sp_l = sp_noncentrality(chi2, df, alpha / 2)
        sp_u = sp_noncentrality(chi2, df, 1 - alpha / 2)
        diff = max(abs(float(lam_l) - sp_l) / max(float(lam_l), 1e-300) if lam_l > 0 else abs(sp_l),
                   abs(float(lam_u) - sp_u) / max(float(lam_u), 1e-300) if lam_u > 0 else abs(sp_u))
        out.append(f"// {name}{suffix}: X² = {chi2!r}, df {df}, n {n:g}; scipy vs mpmath λ relative difference {diff:.1e}")
        emit(f"{name}_lambda_lower{suffix}", lam_l)
        emit(f"{name}_lambda_upper{suffix}", lam_u)
        emit(f"{name}_v_lower{suffix}", min(1, mp.sqrt(lam_l / (n * k))))
        emit(f"{name}_v_upper{suffix}", min(1, mp.sqrt(lam_u / (n * k))))


# --- Exact conditional p-values by full enumeration ----------------------------------------------
def tables_with_margins(rows, cols):
    """Every table of non-negative integers with these row and column totals."""
    r, c = len(rows), len(cols)

    def fill_row(i, col_left):
        if i == r - 1:
            yield [list(col_left)]
            return
        for row in compositions(rows[i], col_left):
            rest = [a - b for a, b in zip(col_left, row)]
            for tail in fill_row(i + 1, rest):
                yield [row] + tail

    def compositions(total, caps):
        if len(caps) == 1:
            if total <= caps[0]:
                yield [total]
            return
        for x in range(0, min(total, caps[0]) + 1):
            if total - x <= sum(caps[1:]):
                for rest in compositions(total - x, caps[1:]):
                    yield [x] + rest

    yield from fill_row(0, list(cols))


def flatten(rows):
    return [x for row in rows for x in row]


def exact_p_values(counts):
    rows = [sum(r) for r in counts]
    cols = [sum(c) for c in zip(*counts)]
    n = sum(rows)
    log_const = sum(mp.loggamma(v + 1) for v in rows + cols) - mp.loggamma(n + 1)
    const = Fraction(math.prod(math.factorial(v) for v in rows + cols), math.factorial(n))

    def probability(t):
        return const / math.prod(math.factorial(x) for row in t for x in row)

    def pearson(t):
        return sum((Fraction(t[i][j]) - Fraction(rows[i] * cols[j], n)) ** 2 / Fraction(rows[i] * cols[j], n)
                   for i in range(len(rows)) for j in range(len(cols)))

    def g(t):
        return 2 * sum(mp.mpf(t[i][j]) * mp.log(mp.mpf(t[i][j]) * n / (rows[i] * cols[j]))
                       for i in range(len(rows)) for j in range(len(cols)) if t[i][j] > 0)

    obs = [list(r) for r in counts]
    p_obs, x_obs, g_obs = probability(obs), pearson(obs), g(obs)
    p_pearson = p_pearson_tol = Fraction(0)
    p_g = p_g_tol = Fraction(0)
    p_fisher = Fraction(0)
    count = 0
    for t in tables_with_margins(rows, cols):
        count += 1
        p = probability(t)
        x, gt = pearson(t), g(t)
        if x >= x_obs:
            p_pearson += p
        if x >= x_obs * (1 - Fraction(1, 10**7)):
            p_pearson_tol += p
        if gt >= g_obs * (1 - mp.mpf(10) ** -30):
            p_g += p
        if gt >= g_obs * (1 - mp.mpf(10) ** -7):
            p_g_tol += p
        if p <= p_obs:
            p_fisher += p
    assert p_pearson == p_pearson_tol and p_g == p_g_tol, "a near-tie within 1e-7 changes the exact p-value"
    return dict(pearson=p_pearson, g=p_g, fisher=p_fisher, tables=count, x2=x_obs, g2=g_obs)


comment("Exact conditional p-values P(statistic ≥ observed | both margins), by enumerating every table with\n"
        "the observed margins (exact rational probabilities; Python fractions, G² with mpmath at 50 digits;\n"
        "counting ties within a relative 1e-7 gives the same p). The Fisher (probability-ordering) p-value of\n"
        "the same enumeration equals R 4.2.2 fisher.test to 1e-12 (checked when generating), which checks the enumeration.\n"
        "tea: Fisher's tea-tasting table (published_values.md section 2, exact Pearson p = 34/70).\n"
        "The others are invented (promotions, shift patterns and training uptake at a fictional firm).")
exact_tables = {
    "tea": [[3, 1], [1, 3]],
    "two_by_three": [[5, 3, 2], [4, 6, 1]],
    "three_by_three": [[3, 0, 1], [1, 4, 0], [0, 2, 5]],
    "three_by_four": [[2, 0, 3, 1], [1, 4, 0, 2], [0, 1, 2, 5]],
    "three_by_two": [[6, 1], [2, 7], [1, 5]],
}
for name, counts in exact_tables.items():
    r = exact_p_values(counts)
    matrix = "matrix(c(" + ", ".join(str(x) for x in flatten(counts)) + f"), nrow={len(counts)}, byrow=TRUE)"
    (r_fisher,) = r_values(f"fisher.test({matrix})$p.value")
    assert abs(r_fisher - float(r["fisher"])) <= 1e-12 * r_fisher, (name, r_fisher, float(r["fisher"]))
    out.append(f"// {name} {counts}: {r['tables']} tables with these margins")
    emit(f"exact_{name}_pearson_p", r["pearson"])
    emit(f"exact_{name}_g_p", r["g"])
    emit(f"exact_{name}_fisher_p", r["fisher"])
    emit(f"exact_{name}_statistic", r["x2"])
assert exact_p_values(exact_tables["tea"])["pearson"] == Fraction(34, 70)


def exact_pearson_p_two_rows(counts):
    """Exact P(X² ≥ observed | margins) for a 2-row table, summing over the free cells of row 1
    (log-probabilities with math.lgamma, summed with math.fsum); for tables too large to list as
    fractions. Near-ties within a relative 1e-9 would be reported."""
    rows = [sum(r) for r in counts]
    cols = [sum(c) for c in zip(*counts)]
    n = sum(rows)
    lf = lambda k: math.lgamma(k + 1)
    const = sum(lf(v) for v in rows + cols) - lf(n)
    expected = [[rows[i] * cols[j] / n for j in range(len(cols))] for i in range(2)]

    def x2(first):
        second = [c - f for c, f in zip(cols, first)]
        return sum((t[j] - expected[i][j]) ** 2 / expected[i][j] for i, t in enumerate((first, second))
                   for j in range(len(cols)))

    observed = x2(counts[0])
    terms = []
    near = 0

    def walk(prefix, left):
        nonlocal near
        j = len(prefix)
        if j == len(cols) - 1:
            if left <= cols[j]:
                first = prefix + [left]
                value = x2(first)
                if abs(value - observed) <= 1e-7 * observed and value != observed:
                    near += abs(value - observed) > 1e-9 * observed
                if value >= observed * (1 - 1e-9):
                    logp = const - sum(lf(x) + lf(c - x) for x, c in zip(first, cols))
                    terms.append(math.exp(logp))
            return
        for x in range(0, min(left, cols[j]) + 1):
            walk(prefix + [x], left - x)

    walk([], rows[0])
    assert near == 0, "a near-tie between 1e-9 and 1e-7"
    return math.fsum(terms), observed


comment("Larger two-row tables (invented: promotions by site at a fictional firm), exact Pearson p by summing\n"
        "the hypergeometric probabilities of every table with X² ≥ observed; cross-checked for the 2×2 with\n"
        "scipy 1.10.1 stats.hypergeom (both tails |x − E| ≥ |observed − E|).")
large_tables = {
    "large_two_by_two": [[222, 278], [578, 922]],
    "large_two_by_three": [[41, 75, 84], [109, 125, 166]],
}
for name, counts in large_tables.items():
    p, x2 = exact_pearson_p_two_rows(counts)
    out.append(f"// {name} {counts}: X² = {x2!r}")
    emit(f"exact_{name}_pearson_p", p)
a, r1, c1, n = 222, 500, 800, 2000
e = r1 * c1 / n
hg = stats.hypergeom(n, c1, r1)
scipy_p = hg.cdf(math.floor(e - abs(a - e))) + hg.sf(math.ceil(e + abs(a - e)) - 1)
check, _ = exact_pearson_p_two_rows(large_tables["large_two_by_two"])
assert abs(scipy_p - check) <= 1e-10 * check, (scipy_p, check)

header = ["#pragma once",
          "// Generated by tests/reference/small_sample_generate.py; do not edit by hand.",
          "// scipy 1.10.1, numpy 1.24.2, statsmodels 0.13.5, mpmath 1.2.1 (Debian 12).",
          "namespace assoc::reference {"]
Path(__file__).with_name("small_sample_values.hpp").write_text("\n".join(header + out + ["", "}  // namespace assoc::reference", ""]))
print("wrote small_sample_values.hpp", file=sys.stderr)
