#!/usr/bin/python3
"""Writes reference_values.json: expected values for the Calc tests, computed with general-purpose
reference libraries (never with Assoc itself). Run with Debian's /usr/bin/python3:

    /usr/bin/python3 tests/calc/make_reference_values.py

Tools and versions used for the committed file: scipy 1.10.1, numpy 1.24.2, statsmodels 0.13.5
(Debian 12 packages python3-scipy, python3-numpy, python3-statsmodels). The tables are invented
except the Agresti party table (Agresti 2007, An Introduction to Categorical Data Analysis, 2nd ed.;
counts as read in R's ?chisq.test example), whose published figures the harness checks separately.
"""

import json
import pathlib

import numpy as np
import scipy
import scipy.stats as st
import statsmodels
import statsmodels.api as sm
from scipy.stats.contingency import association, expected_freq

TABLES = {
    # Agresti (2007): females / males × Democrat / Independent / Republican.
    "party": [[762, 327, 468], [484, 239, 477]],
    # Invented: three branches of a fictional company × four outcomes of an invoice check.
    # In the sheet it is laid out with a blank cell (read as 0) and an all-zero row and column
    # that Assoc sets aside; these are the kept counts.
    "branches": [[12, 7, 0, 9], [5, 14, 8, 3], [9, 4, 11, 6]],
    # Invented 2×2: two teams × promoted / not promoted.
    "teams": [[18, 7], [9, 16]],
}

CRITICAL = [(1, 0.05), (2, 0.05), (4, 0.01), (10, 0.001), (7, 0.2), (3, 0.5)]


def bergsma_corrected_v(table, x2):
    """Bias-corrected Cramér's V, Bergsma (2013), J. Korean Stat. Soc. 42, 323-328 (formula in numpy)."""
    n = table.sum()
    r, c = table.shape
    phi2 = max(0.0, x2 / n - (r - 1) * (c - 1) / (n - 1))
    r_tilde = r - (r - 1) ** 2 / (n - 1)
    c_tilde = c - (c - 1) ** 2 / (n - 1)
    return float(np.sqrt(phi2 / min(r_tilde - 1, c_tilde - 1)))


def signed_phi(table):
    """Phi as the Pearson correlation of the two 0/1 indicators over the expanded data (numpy corrcoef)."""
    rows, columns = [], []
    for i in range(2):
        for j in range(2):
            rows += [1 - i] * int(table[i, j])
            columns += [1 - j] * int(table[i, j])
    return float(np.corrcoef(rows, columns)[0, 1])


def values_for(counts):
    t = np.array(counts, dtype=float)
    pearson = st.chi2_contingency(t, correction=False)
    g = st.chi2_contingency(t, correction=False, lambda_="log-likelihood")
    sm_table = sm.stats.Table(t, shift_zeros=False)  # the default adds 0.5 to zero cells
    contributions = np.asarray(sm_table.chi2_contribs)
    result = {
        "counts": counts,
        "expected": expected_freq(t).tolist(),
        "df": int(pearson[2]),
        "pearson": [float(pearson[0]), float(pearson[1])],
        "g": [float(g[0]), float(g[1])],
        "residuals": {
            "pearson": np.asarray(sm_table.resid_pearson).tolist(),
            "adjusted": np.asarray(sm_table.standardized_resids).tolist(),
            "raw": (t - np.asarray(sm_table.fittedvalues)).tolist(),
            "contribution": contributions.tolist(),
            "percent": (100 * contributions / contributions.sum()).tolist(),
        },
        "strength": {
            "cramer": float(association(t.astype(int), method="cramer")),
            "cramer-corrected": bergsma_corrected_v(t, float(pearson[0])),
            "contingency": float(association(t.astype(int), method="pearson")),
            "w": float(np.sqrt(pearson[0] / t.sum())),
        },
    }
    if t.shape == (2, 2):
        yates = st.chi2_contingency(t, correction=True)
        result["yates"] = [float(yates[0]), float(yates[1])]
        result["strength"]["phi"] = signed_phi(t)
    return result


def main():
    data = {
        "generated_by": "tests/calc/make_reference_values.py",
        "tools": {"scipy": scipy.__version__, "numpy": np.__version__, "statsmodels": statsmodels.__version__},
        "tables": {name: values_for(counts) for name, counts in TABLES.items()},
        "critical": [{"df": df, "alpha": alpha, "value": float(st.chi2.isf(alpha, df))} for df, alpha in CRITICAL],
    }
    out = pathlib.Path(__file__).with_name("reference_values.json")
    out.write_text(json.dumps(data, indent=1) + "\n")
    print(f"wrote {out}")


if __name__ == "__main__":
    main()
