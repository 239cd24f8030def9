#!/usr/bin/python3
"""Generates core_reference_values.hpp: expected values for the statistics core's tests.

Tools (Debian packages, for generating test values only, never runtime dependencies):
  python3-mpmath 1.2.1 (50-digit and 60-digit arithmetic), python3-scipy 1.10.1,
  python3-numpy 1.24.2, python3-statsmodels 0.13.5.
Run: /usr/bin/python3 tests/reference/generate_core_values.py > tests/reference/core_reference_values.hpp

Every table except the Agresti one is invented for these tests (fictional HR and finance data).
"""
import sys

import mpmath as mp
import numpy as np
import scipy
import scipy.stats as st
import statsmodels
import statsmodels.api as sm
from scipy.stats.contingency import association

mp.mp.dps = 60  # 60 digits: the 1e8 tables cancel about 16 of them in G², leaving over 40

assert mp.__version__ == "1.2.1", mp.__version__
assert scipy.__version__ == "1.10.1", scipy.__version__
assert np.__version__ == "1.24.2", np.__version__
assert statsmodels.__version__.startswith("0.13.5"), statsmodels.__version__

out = []


def emit(line=""):
    out.append(line)


def lit(x, digits=25):
    """A C++ double literal: 17 digits for library doubles, more for mpmath values."""
    if isinstance(x, (mp.mpf, mp.mpc)):
        x = mp.mpf(x)
        if x == 0:
            return "0.0"
        return mp.nstr(x, digits, min_fixed=1, max_fixed=0).replace("e+", "e")
    x = float(x)
    if x == 0:
        return "0.0"
    return repr(x)


def vec(values, digits=25):
    return "{" + ", ".join(lit(v, digits) for v in values) + "}"


# ---------------------------------------------------------------- chi-squared distribution
def upper_tail(x, df):
    """P(X ≥ x) for chi-squared(df), the regularised upper incomplete gamma Q(df/2, x/2)."""
    return mp.gammainc(mp.mpf(df) / 2, mp.mpf(x) / 2, mp.inf, regularized=True)


def critical_value(df, alpha):
    start = mp.mpf(st.chi2.isf(float(alpha), df))
    return mp.findroot(lambda x: upper_tail(x, df) - mp.mpf(alpha), start, tol=mp.mpf(10) ** -55)


# (df, alpha, the NIST/SEMATECH e-Handbook 1.3.6.7.4 upper-tail entry, source status in published_values.md)
NIST = [
    (1, "0.05", "3.841", "from memory"), (2, "0.05", "5.991", "from memory"), (3, "0.05", "7.815", "from memory"),
    (4, "0.05", "9.488", "from memory"), (5, "0.05", "11.070", "added"), (6, "0.05", "12.592", "added"),
    (8, "0.05", "15.507", "from memory"), (10, "0.05", "18.307", "from memory"), (20, "0.05", "31.410", "added"),
    (30, "0.05", "43.773", "added"), (100, "0.05", "124.342", "added"), (1, "0.10", "2.706", "added"),
    (2, "0.10", "4.605", "added"), (1, "0.025", "5.024", "added"), (1, "0.01", "6.635", "from memory"),
    (2, "0.01", "9.210", "added"), (4, "0.01", "13.277", "from memory"), (10, "0.01", "23.209", "added"),
    (30, "0.01", "50.892", "added"), (1, "0.001", "10.828", "added"), (10, "0.001", "29.588", "added"),
]

# Far upper tails, all below 1e-100, down to the edge of double range.
FAR_TAIL = [(500, 1), (1000, 1), (1400, 1), (600, 10), (1000, 30), (1300, 100), (3000, 1000), (1300, 2),
            (7000, 4000)]
# Ordinary and large-df p-values.
ORDINARY = [(3.841458820694124, 1), (0.5, 1), (1e-8, 1), (30.070149095754672, 2), (0.4700239808153477, 3),
            (12.08205480925854, 4), (7.5, 7.5), (150.0, 120), (0.3, 0.5), (1e4, 1e4), (1.001e6, 1e6),
            (1.01e6, 1e6), (1e8, 1e8), (1.001e8, 1e8), (1e10, 1e10)]


# ---------------------------------------------------------------- tables
def exact_statistics(counts):
    """Everything the core reports for a table, in 60-digit arithmetic from the exact doubles.

    All-zero rows and columns are dropped first, as the core sets them aside."""
    a = [[mp.mpf(float(v)) for v in row] for row in counts]
    a = [row for row in a if any(v != 0 for v in row)]
    keep = [j for j in range(len(a[0])) if any(row[j] != 0 for row in a)]
    a = [[row[j] for j in keep] for row in a]
    r, c = len(a), len(a[0])
    R = [mp.fsum(row) for row in a]
    C = [mp.fsum(a[i][j] for i in range(r)) for j in range(c)]
    n = mp.fsum(R)
    E = [[R[i] * C[j] / n for j in range(c)] for i in range(r)]
    D = [[a[i][j] - E[i][j] for j in range(c)] for i in range(r)]
    x2 = mp.fsum(D[i][j] ** 2 / E[i][j] for i in range(r) for j in range(c))
    g2 = 2 * mp.fsum(a[i][j] * mp.log(a[i][j] / E[i][j]) for i in range(r) for j in range(c) if a[i][j] != 0)
    df = (r - 1) * (c - 1)
    k = min(r, c)
    phi2t = max(mp.mpf(0), x2 / n - mp.mpf((r - 1) * (c - 1)) / (n - 1))
    rt, ct = r - mp.mpf(r - 1) ** 2 / (n - 1), c - mp.mpf(c - 1) ** 2 / (n - 1)
    res = {
        "kept_rows": r, "kept_columns": c, "df": df, "n": n,
        "pearson": x2, "pearson_p": upper_tail(x2, df),
        "likelihood_ratio": g2, "likelihood_ratio_p": upper_tail(g2, df),
        "expected": [E[i][j] for i in range(r) for j in range(c)],
        "raw_residuals": [D[i][j] for i in range(r) for j in range(c)],
        "pearson_residuals": [D[i][j] / mp.sqrt(E[i][j]) for i in range(r) for j in range(c)],
        "adjusted_residuals": [D[i][j] / mp.sqrt(E[i][j] * (1 - R[i] / n) * (1 - C[j] / n))
                               for i in range(r) for j in range(c)],
        "cramers_v": mp.sqrt(x2 / (n * (k - 1))),
        "cramers_v_corrected": mp.sqrt(phi2t / min(rt - 1, ct - 1)),
        "contingency_coefficient": mp.sqrt(x2 / (x2 + n)),
        "cohens_w": mp.sqrt(x2 / n),
    }
    if r == 2 and c == 2:
        res["phi"] = (a[0][0] * a[1][1] - a[0][1] * a[1][0]) / mp.sqrt(R[0] * R[1] * C[0] * C[1])
        res["yates"] = mp.fsum(max(mp.mpf(0), abs(D[i][j]) - mp.mpf(1) / 2) ** 2 / E[i][j]
                               for i in range(r) for j in range(c))
        res["yates_p"] = upper_tail(res["yates"], df)
    return res


def library_statistics(counts):
    """The same quantities from scipy 1.10.1 and statsmodels 0.13.5 (double precision)."""
    t = np.array(counts, dtype=float)
    t = t[t.sum(axis=1) > 0][:, t.sum(axis=0) > 0]
    x2, p, df, expected = st.chi2_contingency(t, correction=False)
    g2, gp, _, _ = st.chi2_contingency(t, correction=False, lambda_="log-likelihood")
    # shift_zeros=False: statsmodels 0.13.5 otherwise replaces zero cells by 0.5, and does so in
    # the array it was given (so on a copy, too, to keep t as it is).
    table = sm.stats.Table(t.copy(), shift_zeros=False)
    n = t.sum()
    r, c = t.shape
    whole = bool(np.all(t == np.floor(t)))
    phi2t = max(0.0, x2 / n - (r - 1) * (c - 1) / (n - 1))
    rt, ct = r - (r - 1) ** 2 / (n - 1), c - (c - 1) ** 2 / (n - 1)
    res = {
        "pearson": x2, "pearson_p": p, "df": df, "likelihood_ratio": g2, "likelihood_ratio_p": gp,
        "expected": expected.ravel(),
        "pearson_residuals": np.asarray(table.resid_pearson).ravel(),
        "adjusted_residuals": np.asarray(table.standardized_resids).ravel(),
        # association() takes whole counts only; for weighted counts V and C come from scipy's X²
        "cramers_v": (association(t.astype(int), method="cramer", correction=False) if whole
                      else np.sqrt(x2 / (n * (min(r, c) - 1)))),
        "contingency_coefficient": (association(t.astype(int), method="pearson", correction=False) if whole
                                    else np.sqrt(x2 / (x2 + n))),
        # Bergsma (2013), from the formula in published_values.md section 11 (no library has it)
        "cramers_v_corrected": np.sqrt(phi2t / min(rt - 1, ct - 1)),
    }
    if t.shape == (2, 2):
        y, yp, _, _ = st.chi2_contingency(t, correction=True)
        res["yates"], res["yates_p"] = y, yp
    return res


# Tables compared with scipy/statsmodels and with mpmath. (name, counts, what it is)
LIBRARY_TABLES = [
    ("agresti_party", [[762, 327, 468], [484, 239, 477]],
     "Agresti (2007), gender by party identification (counts read in R's ?chisq.test example)"),
    ("promotions_by_department", [[23, 41, 17, 9], [31, 28, 22, 14], [12, 19, 30, 25]],
     "invented: 3 departments by 4 appraisal grades"),
    ("invoice_exceptions_by_region", [[112, 87, 45, 30, 12], [98, 102, 60, 25, 9], [70, 65, 88, 41, 20],
                                      [35, 40, 52, 66, 31]],
     "invented: 4 regions by 5 exception types"),
    ("weighted_survey", [[12.5, 7.25, 3.1], [8.4, 15.75, 6.6], [4.2, 9.9, 18.05]],
     "invented: survey answers with non-integer weights"),
    ("with_empty_team", [[10, 4, 6], [0, 0, 0], [3, 9, 8], [7, 2, 11]],
     "invented: 4 teams by 3 outcomes, the second team has no cases (set aside)"),
    ("with_empty_column", [[14, 0, 9, 5], [6, 0, 12, 11]],
     "invented: 2 shifts by 4 incident kinds, the second kind never occurs (set aside)"),
    ("with_zero_cell", [[0, 5, 8], [6, 3, 2]], "invented: a zero cell, so 0·ln 0 = 0 enters G²"),
    ("small_floor", [[5, 3, 2], [4, 6, 1]], "invented (published_values.md section 11): bias-corrected V floors at 0"),
    ("sick_leave_2x2", [[12, 5], [3, 10]], "invented 2x2: sick leave by contract type"),
]

# Tables with counts near 1e8 and beyond whose statistic is tiny: mpmath only (a double
# library loses about half the digits of O − E here).
LARGE_TABLES = [
    ("near_1e8_2x2", [[1e8, 1e8 + 1], [1e8 + 2, 1e8]], "counts around 1e8, X² about 2e-8"),
    ("near_1e8_one_off", [[1e8, 1e8], [1e8, 1e8 + 1]], "counts 1e8, one cell off by 1"),
    ("near_1e8_3x3", [[1e8, 1e8 + 3, 1e8 - 2], [1e8 + 1, 1e8, 1e8 + 5], [1e8 - 4, 1e8 + 2, 1e8]],
     "3x3, counts around 1e8"),
    ("near_1e8_weighted", [[1e8 + 0.1, 1e8 + 1.3], [1e8 + 2.7, 1e8 + 0.9]],
     "non-integer counts around 1e8 (the exact doubles nearest these decimals)"),
    ("near_1e12_2x2", [[1e12, 1e12 + 7], [1e12 + 3, 1e12]], "counts around 1e12"),
    ("total_above_2_53", [[3e15, 3e15 + 1], [3e15 + 2, 3e15]], "total 1.2e16 is above 2^53, so it is not a double"),
    ("near_1e8_skewed", [[2e8, 1e8 + 1, 5e7], [4e8 + 3, 2e8, 1e8 - 1]], "unequal margins around 1e8"),
]


def emit_table(name, counts, what, with_library):
    ex = exact_statistics(counts)
    rows, cols = len(counts), len(counts[0])
    emit(f"    // {name}: {what}")
    emit("    {")
    emit(f'        "{name}", {rows}, {cols}, {vec(sum(counts, []), 17)},')
    emit(f"        {ex['kept_rows']}, {ex['kept_columns']}, {ex['df']}.0,")
    emit("        // mpmath 1.2.1, 60 digits")
    for key in ["pearson", "pearson_p", "likelihood_ratio", "likelihood_ratio_p"]:
        emit(f"        {lit(ex[key])},")
    for key in ["expected", "raw_residuals", "pearson_residuals", "adjusted_residuals"]:
        emit(f"        {vec(ex[key])},")
    for key in ["cramers_v", "cramers_v_corrected", "contingency_coefficient", "cohens_w"]:
        emit(f"        {lit(ex[key])},")
    for key in ["phi", "yates", "yates_p"]:
        emit(f"        {lit(ex[key]) if key in ex else 'nan'},")
    if with_library:
        lib = library_statistics(counts)
        assert lib["df"] == ex["df"]
        emit("        // scipy 1.10.1 chi2_contingency (correction=False; lambda_=\"log-likelihood\" for G²;")
        emit("        // correction=True for Yates), statsmodels 0.13.5 Table.resid_pearson and")
        emit("        // .standardized_resids, scipy.stats.contingency.association (cramer, pearson),")
        emit("        // Bergsma's formula in numpy 1.24.2")
        emit("        true,")
        for key in ["pearson", "pearson_p", "likelihood_ratio", "likelihood_ratio_p"]:
            emit(f"        {lit(lib[key])},")
        for key in ["expected", "pearson_residuals", "adjusted_residuals"]:
            emit(f"        {vec(lib[key], 17)},")
        for key in ["cramers_v", "cramers_v_corrected", "contingency_coefficient"]:
            emit(f"        {lit(lib[key])},")
        for key in ["yates", "yates_p"]:
            emit(f"        {lit(lib[key]) if key in lib else 'nan'},")
    else:
        emit("        false, nan, nan, nan, nan, {}, {}, {}, nan, nan, nan, nan, nan,")
    emit("    },")


emit("// Generated by tests/reference/generate_core_values.py: do not edit by hand.")
emit("// Tools: mpmath 1.2.1 (60 digits), scipy 1.10.1, numpy 1.24.2, statsmodels 0.13.5")
emit("// (Debian packages python3-mpmath, python3-scipy, python3-numpy, python3-statsmodels).")
emit("#pragma once")
emit("#include <cstddef>")
emit("#include <limits>")
emit("#include <vector>")
emit()
emit("namespace assoc::reference {")
emit()
emit("inline constexpr double nan = std::numeric_limits<double>::quiet_NaN();")
emit()
emit("// An upper-tail critical value: the NIST/SEMATECH e-Handbook of Statistical Methods,")
emit("// section 1.3.6.7.4, table of upper-tail critical values (as printed, 3 decimals; the")
emit("// source status of each entry is in tests/reference/published_values.md section 1), and the root of")
emit("// Q(df/2, c/2) = alpha found with mpmath 1.2.1 findroot at 60 digits.")
emit("struct CriticalValue {")
emit("    double df, alpha, nist, mpmath_root;")
emit("};")
emit("inline const std::vector<CriticalValue> nist_critical_values = {")
for df, alpha, nist, status in NIST:
    root = critical_value(df, mp.mpf(alpha))
    assert abs(root - mp.mpf(nist)) <= mp.mpf("0.0005"), (df, alpha, root, nist)
    emit(f"    {{{df}, {alpha}, {nist}, {lit(root)}}},  // NIST entry {status}")
emit("};")
emit()
emit("// P(X ≥ statistic) for X ~ chi-squared(df): mpmath 1.2.1 gammainc(df/2, statistic/2, inf,")
emit("// regularized=True) at 60 digits, printed to 25.")
emit("struct UpperTail {")
emit("    double statistic, df, p_value;")
emit("};")
emit("inline const std::vector<UpperTail> far_tail_p_values = {  // all below 1e-100")
for x, df in FAR_TAIL:
    p = upper_tail(x, df)
    assert p < mp.mpf("1e-100") and p > mp.mpf("1e-307"), (x, df, p)
    emit(f"    {{{lit(float(x))}, {lit(float(df))}, {lit(p)}}},")
emit("};")
emit("inline const std::vector<UpperTail> ordinary_p_values = {")
for x, df in ORDINARY:
    emit(f"    {{{lit(float(x))}, {lit(float(df))}, {lit(upper_tail(x, df))}}},")
emit("};")
emit()
emit("// A table with everything the core reports about it. Counts are the body as typed, all-zero")
emit("// rows and columns included; the other matrices have the kept shape, row by row.")
emit("struct ReferenceTable {")
emit("    const char* name;")
emit("    std::size_t rows, columns;")
emit("    std::vector<double> counts;")
emit("    std::size_t kept_rows, kept_columns;")
emit("    double df;")
emit("    // mpmath 1.2.1 at 60 digits, from the exact double counts")
emit("    double pearson, pearson_p, likelihood_ratio, likelihood_ratio_p;")
emit("    std::vector<double> expected, raw_residuals, pearson_residuals, adjusted_residuals;")
emit("    double cramers_v, cramers_v_corrected, contingency_coefficient, cohens_w;")
emit("    double phi, yates, yates_p;  // 2x2 only, else nan")
emit("    // scipy 1.10.1 / statsmodels 0.13.5, when has_library_values")
emit("    bool has_library_values;")
emit("    double scipy_pearson, scipy_pearson_p, scipy_likelihood_ratio, scipy_likelihood_ratio_p;")
emit("    std::vector<double> scipy_expected, statsmodels_pearson_residuals, statsmodels_adjusted_residuals;")
emit("    double scipy_cramers_v, numpy_cramers_v_corrected, scipy_contingency_coefficient;")
emit("    double scipy_yates, scipy_yates_p;  // 2x2 only, else nan")
emit("};")
emit()
emit("// Tables checked against scipy/statsmodels and mpmath.")
emit("inline const std::vector<ReferenceTable> library_tables = {")
for name, counts, what in LIBRARY_TABLES:
    emit_table(name, counts, what, True)
emit("};")
emit()
emit("// Tables with counts around 1e8 and above whose statistic is tiny: mpmath only.")
emit("inline const std::vector<ReferenceTable> large_count_tables = {")
for name, counts, what in LARGE_TABLES:
    emit_table(name, counts, what, False)
emit("};")
emit()
emit("}  // namespace assoc::reference")

sys.stdout.write("\n".join(out) + "\n")
