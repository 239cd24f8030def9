#!/usr/bin/python3
"""Generates tests/reference/rates_and_pairs_values.hpp: expected values for the tests of rates with
Wilson intervals, rate differences with Newcombe's interval, pairwise comparisons of rows and the
Mantel–Haenszel common risk ratio (tests/core/rates_test.cpp, pairwise_comparisons_test.cpp,
common_risk_ratio_test.cpp).

Tools (Debian 12 packages; for generating test values only): python3-mpmath 1.2.1, python3-scipy 1.10.1,
python3-numpy 1.24.2, python3-statsmodels 0.13.5 and R 4.2.2 (Rscript). Run from the repository root:

    /usr/bin/python3 tests/reference/rates_and_pairs_generate.py

Where two tools compute the same value the script checks that they agree and stops otherwise:
- Wilson intervals: the formula in 50-digit mpmath, checked against statsmodels
  proportion_confint(method="wilson") and R prop.test(correct = FALSE)$conf.int (the same score interval).
- Rate differences: Newcombe (1998), Statistics in Medicine 17:873-890, method 10, in mpmath from the
  Wilson ends, checked against statsmodels confint_proportions_2indep(method="newcomb", compare="diff").
- Pairwise p-values: scipy chi2_contingency(correction=False) per pair, checked against R prop.test
  (correct = FALSE) for two-column tables and chisq.test(correct = FALSE) for wider ones; exact p-values
  from R fisher.test; adjustments from statsmodels multipletests, checked against R p.adjust.
- Common risk ratio: the Mantel-Haenszel estimate from statsmodels StratifiedTable.riskratio_pooled,
  checked against mpmath; the interval from the variance of Greenland & Robins (1985), Biometrics
  41:55-68, in mpmath: V = sum((n1 n0 m1 - a c n) / n^2) / (R S). (The paper itself was not read; the
  formula was read as the R package Hmisc implements it in mhgr(), file R/epi.s, which names it the
  Greenland-Robins interval.) For a single stratum it is checked against statsmodels Table2x2
  riskratio_confint (Katz's log interval), to which it reduces algebraically.

Every table is invented (a fictional company's HR data), except the proportions of Newcombe's worked
examples, whose published intervals are recalled from memory and quoted in the test beside these values.
"""
import itertools
import subprocess
import sys
from pathlib import Path

import mpmath as mp
import numpy as np
import scipy
import statsmodels
from scipy import stats
from statsmodels.stats.contingency_tables import StratifiedTable, Table2x2
from statsmodels.stats.multitest import multipletests
from statsmodels.stats.proportion import confint_proportions_2indep, proportion_confint

assert scipy.__version__ == "1.10.1", scipy.__version__
assert np.__version__ == "1.24.2", np.__version__
assert statsmodels.__version__.startswith("0.13.5"), statsmodels.__version__
assert mp.__version__ == "1.2.1", mp.__version__
mp.mp.dps = 50

OUT = Path(__file__).with_name("rates_and_pairs_values.hpp")
lines = []


def r_values(expression):
    """Numbers printed by R 4.2.2 for an expression that yields a numeric vector."""
    text = subprocess.run(["Rscript", "-e", f"cat(sprintf('%.17g', {expression}), sep='\\n')"],
                          check=True, capture_output=True, text=True).stdout
    return [float(v) for v in text.split()]


def agree(a, b, tolerance, what):
    a, b = float(a), float(b)
    if abs(a - b) > tolerance * max(abs(b), 1e-300) and abs(a - b) > 1e-15:
        sys.exit(f"{what}: {a!r} and {b!r} disagree")


def lit(x):
    x = float(x)
    return "0.0" if x == 0 else repr(x)


def array(values):
    return "{" + ", ".join(lit(v) for v in values) + "}"


def z_of(confidence):
    return mp.sqrt(2) * mp.erfinv(mp.mpf(confidence))


def wilson(count, total, confidence):
    x, n, z = mp.mpf(count), mp.mpf(total), z_of(confidence)
    a = 2 * x + z ** 2
    b = z * mp.sqrt(z ** 2 + 4 * x * (n - x) / n)
    return (a - b) / (2 * (n + z ** 2)), (a + b) / (2 * (n + z ** 2))


# ---------------------------------------------------------------------------------------- Wilson
lines.append("// Wilson score intervals: 50-digit mpmath from the formula; statsmodels proportion_confint")
lines.append("// (method=\"wilson\") and R prop.test(correct = FALSE) agree (checked by the generator).")
lines.append("struct WilsonCase {")
lines.append("    const char* name;")
lines.append("    double count, total, confidence, lower, upper;")
lines.append("};")
WILSON = [
    # Newcombe (1998a), Statistics in Medicine 17:857-872, Table I examples (from memory).
    ("newcombe_81_of_263", 81, 263, 0.95),
    ("newcombe_15_of_148", 15, 148, 0.95),
    ("newcombe_0_of_20", 0, 20, 0.95),
    ("newcombe_1_of_29", 1, 29, 0.95),
    # Invented: promotions in 2025 by department at a fictional company.
    ("design", 73, 246, 0.95),
    ("logistics", 13, 97, 0.95),
    ("finance_90", 10, 54, 0.90),
    ("all_promoted", 12, 12, 0.95),
    ("weighted", 2.5, 7.25, 0.99),
    ("huge", 3.0e11, 1.0e12, 0.95),
    # A tiny weighted count: the textbook (A - B) / (2 (n + z^2)) cancels about 12 digits of the lower
    # end (A and B agree that far), so only the upper end is compared with statsmodels.
    ("tiny_weight", 1e-6, 10, 0.95),
]
lines.append("inline constexpr WilsonCase wilson_cases[] = {")
for name, count, total, confidence in WILSON:
    lower, upper = wilson(count, total, confidence)
    sm_lower, sm_upper = proportion_confint(count, total, alpha=1 - confidence, method="wilson")
    if name != "tiny_weight":
        agree(sm_lower, lower, 1e-9, f"{name} lower (statsmodels)")
    agree(sm_upper, upper, 1e-9, f"{name} upper (statsmodels)")
    if float(count).is_integer() and total < 1e6:
        r_lower, r_upper = r_values(f"prop.test({int(count)}, {int(total)}, conf.level = {confidence}, "
                                    "correct = FALSE)$conf.int")
        agree(r_lower, lower, 1e-9, f"{name} lower (R)")
        agree(r_upper, upper, 1e-9, f"{name} upper (R)")
    lines.append(f'    {{"{name}", {lit(count)}, {lit(total)}, {confidence!r}, {lit(lower)}, {lit(upper)}}},')
lines.append("};")
lines.append("")

# ---------------------------------------------------------------------------------------- Newcombe
lines.append("// Rate differences with Newcombe's hybrid score interval (method 10): mpmath from the Wilson ends;")
lines.append("// statsmodels confint_proportions_2indep(method=\"newcomb\", compare=\"diff\") agrees.")
lines.append("struct NewcombeCase {")
lines.append("    const char* name;")
lines.append("    double count1, total1, count2, total2, confidence, difference, lower, upper;")
lines.append("};")
NEWCOMBE = [
    # Newcombe (1998), Statistics in Medicine 17:873-890, Table II examples (a) to (h) (from memory).
    ("newcombe_a", 56, 70, 48, 80, 0.95),
    ("newcombe_b", 9, 10, 3, 10, 0.95),
    ("newcombe_c", 6, 7, 2, 7, 0.95),
    ("newcombe_d", 5, 56, 0, 29, 0.95),
    ("newcombe_e", 0, 10, 0, 20, 0.95),
    ("newcombe_f", 0, 10, 0, 10, 0.95),
    ("newcombe_g", 10, 10, 0, 20, 0.95),
    ("newcombe_h", 10, 10, 0, 10, 0.95),
    # Invented: Design against Assembly, promotions in 2025.
    ("design_assembly", 73, 246, 46, 245, 0.95),
    ("design_assembly_90", 73, 246, 46, 245, 0.90),
]
lines.append("inline constexpr NewcombeCase newcombe_cases[] = {")
for name, x1, n1, x2, n2, confidence in NEWCOMBE:
    l1, u1 = wilson(x1, n1, confidence)
    l2, u2 = wilson(x2, n2, confidence)
    p1, p2 = mp.mpf(x1) / n1, mp.mpf(x2) / n2
    difference = p1 - p2
    lower = difference - mp.sqrt((p1 - l1) ** 2 + (u2 - p2) ** 2)
    upper = difference + mp.sqrt((u1 - p1) ** 2 + (p2 - l2) ** 2)
    sm_lower, sm_upper = confint_proportions_2indep(x1, n1, x2, n2, method="newcomb", compare="diff",
                                                    alpha=1 - confidence)
    agree(sm_lower, lower, 1e-9, f"{name} lower (statsmodels)")
    agree(sm_upper, upper, 1e-9, f"{name} upper (statsmodels)")
    lines.append(f'    {{"{name}", {lit(x1)}, {lit(n1)}, {lit(x2)}, {lit(n2)}, {confidence!r}, {lit(difference)}, '
                 f'{lit(lower)}, {lit(upper)}}},')
lines.append("};")
lines.append("")


# ---------------------------------------------------------------------------------------- pairwise
def r_matrix(counts):
    flat = ", ".join(repr(float(v)) for row in counts for v in row)
    return f"matrix(c({flat}), nrow = {len(counts)}, byrow = TRUE)"


def pair_table(counts, i, j):
    """The 2×c table of rows i and j, columns of zeros in both left out."""
    table = np.array([counts[i], counts[j]], dtype=float)
    return table[:, table.sum(axis=0) > 0]


def pairwise(name, counts, comment):
    rows = [i for i, row in enumerate(counts) if sum(row) > 0]
    pairs, pearson, exact = [], [], []
    for i, j in itertools.combinations(rows, 2):
        table = pair_table(counts, i, j)
        pairs.append((i, j))
        if table.shape[1] < 2:
            pearson.append(1.0)
            exact.append(1.0)
            continue
        x2, p, df, _ = stats.chi2_contingency(table, correction=False)
        if table.shape[1] == 2:
            (r_p,) = r_values(f"prop.test({r_matrix(table)}, correct = FALSE)$p.value")
        else:
            (r_p,) = r_values(f"suppressWarnings(chisq.test({r_matrix(table)}, correct = FALSE))$p.value")
        agree(r_p, p, 1e-10, f"{name} pair {i},{j} Pearson (R)")
        pearson.append(float(p))
        (fisher,) = r_values(f"fisher.test({r_matrix(table)})$p.value")
        exact.append(fisher)
    results = {}
    for method in ("holm", "bonferroni"):
        adjusted = multipletests(pearson, method=method)[1]
        r_adjusted = r_values(f"p.adjust(c({', '.join(repr(p) for p in pearson)}), method = '{method}')")
        for a, b in zip(adjusted, r_adjusted):
            agree(b, a, 1e-12, f"{name} {method} (R p.adjust)")
        results[method] = adjusted
    results["exact_holm"] = multipletests(exact, method="holm")[1]
    lines.append(f"// {comment}")
    lines.append(f"namespace {name} {{")
    lines.append(f"inline constexpr double counts[{len(counts)}][{len(counts[0])}] = "
                 "{" + ", ".join(array(row) for row in counts) + "};")
    lines.append(f"inline constexpr std::size_t first[] = {{{', '.join(str(i) for i, _ in pairs)}}};")
    lines.append(f"inline constexpr std::size_t second[] = {{{', '.join(str(j) for _, j in pairs)}}};")
    lines.append(f"inline constexpr double pearson[] = {array(pearson)};")
    lines.append(f"inline constexpr double holm[] = {array(results['holm'])};")
    lines.append(f"inline constexpr double bonferroni[] = {array(results['bonferroni'])};")
    lines.append(f"inline constexpr double exact[] = {array(exact)};  // R fisher.test")
    lines.append(f"inline constexpr double exact_holm[] = {array(results['exact_holm'])};")
    lines.append(f"}}  // namespace {name}")
    lines.append("")


lines.append("// Pairwise comparisons of rows: for each pair (first, second) of rows with counts (0-based places in")
lines.append("// the body), scipy chi2_contingency(correction=False) on the pair's table (R agrees), R fisher.test,")
lines.append("// and the adjustments of statsmodels multipletests (R p.adjust agrees).")
pairwise("departments", [[73, 173], [46, 199], [41, 77], [10, 44], [13, 84]],
         "Invented: promoted / not promoted in 2025 by department (Design, Assembly, Sales, Finance, Logistics).")
pairwise("branches", [[12, 7, 0, 9], [5, 14, 0, 3], [0, 0, 0, 0], [9, 4, 11, 6], [3, 8, 2, 0]],
         "Invented: outcomes of an invoice check by branch; row 3 is all zeros, and rows 1 and 2 have no counts "
         "in column 3 (left out of their pair's table).")
pairwise("one_column", [[5, 0], [7, 0], [2, 6]],
         "Invented: rows 1 and 2 have all their counts in column 1, so their pair's p-value is 1.")

# ---------------------------------------------------------------------------------------- risk ratio
lines.append("// Mantel-Haenszel common risk ratio: strata a, b, c, d (rows the groups, column 1 the outcome).")
lines.append("// Estimate: statsmodels StratifiedTable.riskratio_pooled (mpmath agrees). Interval: the Greenland-Robins")
lines.append("// (1985) variance of the log ratio in 50-digit mpmath.")
lines.append("struct CommonRiskRatioCase {")
lines.append("    const char* name;")
lines.append("    double strata[6][4];")
lines.append("    std::size_t count;")
lines.append("    double confidence, ratio, lower, upper, log_standard_error;")
lines.append("};")


def common_risk_ratio(strata, confidence):
    r = s = v = mp.mpf(0)
    for a, b, c, d in strata:
        a, b, c, d = (mp.mpf(x) for x in (a, b, c, d))
        n1, n0 = a + b, c + d
        n = n1 + n0
        if n1 == 0 or n0 == 0 or a + c == 0:
            continue
        r += a * n0 / n
        s += c * n1 / n
        v += (n1 * n0 * (a + c) - a * c * n) / n ** 2
    ratio = r / s
    se = mp.sqrt(v / (r * s))
    z = z_of(confidence)
    return ratio, ratio * mp.exp(-z * se), ratio * mp.exp(z * se), se


RISK = [
    # Invented: Design promoted, not promoted, Assembly promoted, not promoted, by office (the HR sample).
    ("offices", [(41, 56, 10, 11), (23, 61, 12, 25), (7, 31, 13, 70), (2, 25, 11, 93)], 0.95),
    ("offices_90", [(41, 56, 10, 11), (23, 61, 12, 25), (7, 31, 13, 70), (2, 25, 11, 93)], 0.90),
    # Invented: a stratum with a zero cell, one with an empty row and one without any outcome; the
    # last two add nothing.
    ("sparse", [(0, 12, 3, 9), (4, 6, 1, 9), (5, 0, 0, 0), (0, 7, 0, 8), (6, 2, 5, 7), (1, 3, 2, 2)], 0.95),
]
lines.append("inline constexpr CommonRiskRatioCase common_risk_ratio_cases[] = {")
for name, strata, confidence in RISK:
    ratio, lower, upper, se = common_risk_ratio(strata, confidence)
    used = [s for s in strata if s[0] + s[1] > 0 and s[2] + s[3] > 0 and s[0] + s[2] > 0]
    table = StratifiedTable([np.array([[a, b], [c, d]], dtype=float) for a, b, c, d in used])
    agree(table.riskratio_pooled, ratio, 1e-12, f"{name} ratio (statsmodels)")
    padded = [list(s) for s in strata] + [[0, 0, 0, 0]] * (6 - len(strata))
    lines.append(f'    {{"{name}", {{{", ".join(array(s) for s in padded)}}}, {len(strata)}, {confidence!r}, '
                 f"{lit(ratio)}, {lit(lower)}, {lit(upper)}, {lit(se)}}},")
lines.append("};")

# One stratum: the Greenland-Robins interval is Katz's log interval (statsmodels Table2x2).
single = (73, 173, 46, 199)
ratio, lower, upper, se = common_risk_ratio([single], 0.95)
katz = Table2x2(np.array([[single[0], single[1]], [single[2], single[3]]], dtype=float))
agree(katz.riskratio, ratio, 1e-12, "single stratum ratio (Katz)")
for a, b in zip(katz.riskratio_confint(alpha=0.05), (lower, upper)):
    agree(a, b, 1e-12, "single stratum interval (Katz)")
agree(katz.log_riskratio_se, se, 1e-12, "single stratum standard error (Katz)")
lines.append("")

header = [
    "#pragma once",
    "// Generated by tests/reference/rates_and_pairs_generate.py; do not edit by hand.",
    f"// mpmath {mp.__version__}, scipy {scipy.__version__}, numpy {np.__version__}, statsmodels "
    f"{statsmodels.__version__}, {subprocess.run(['Rscript', '-e', 'cat(R.version.string)'], check=True, capture_output=True, text=True).stdout}.",
    "#include <cstddef>",
    "#include <stdexcept>",
    "#include <string>",
    "",
    "namespace assoc::reference {",
    "",
    "// The case of `cases` called `name`; a name that is not there throws, so a typo in a test fails loudly.",
    "template <class Case, std::size_t N>",
    "const Case& case_named(const Case (&cases)[N], const std::string& name) {",
    "    for (const Case& c : cases)",
    "        if (name == c.name) return c;",
    "    throw std::out_of_range(\"no reference case \" + name);",
    "}",
    "",
]
OUT.write_text("\n".join(header + lines + ["}  // namespace assoc::reference", ""]))
print(f"wrote {OUT}")
