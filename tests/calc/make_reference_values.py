#!/usr/bin/python3
"""Writes reference_values.json: expected values for the Calc tests, computed with general-purpose
reference libraries (never with Assoc itself). Run with Debian's /usr/bin/python3:

    /usr/bin/python3 tests/calc/make_reference_values.py

Tools and versions used for the committed file: scipy 1.10.1, numpy 1.24.2, statsmodels 0.13.5
(Debian 12 packages python3-scipy, python3-numpy, python3-statsmodels). The tables are invented
except the Agresti party table (Agresti 2007, An Introduction to Categorical Data Analysis, 2nd ed.;
counts as read in R's ?chisq.test example), whose published figures the harness checks separately.

The "functions" section holds the values for the later worksheet functions (exact and simulated
p-values, ratios, cell tests, goodness of fit, power, counts from records, strata, paired, trend,
selection impact), from the same libraries and from R 4.2.2 (Rscript: fisher.test, mantelhaen.test,
prop.trend.test, the UCBAdmissions data set). Their published sources are named beside each entry in
tests/reference/published_values.md and beside each check in calc_functions_test.py.
"""

import json
import math
import pathlib
import subprocess
from fractions import Fraction

import numpy as np
import scipy
import scipy.stats as st
from scipy import optimize
import statsmodels
import statsmodels.api as sm
from scipy.stats.contingency import association, expected_freq
from statsmodels.stats.contingency_tables import SquareTable, StratifiedTable, Table2x2, mcnemar
from statsmodels.stats.multitest import multipletests

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


def r_version():
    return subprocess.run(["Rscript", "-e", "cat(R.version.string)"], check=True, capture_output=True,
                          text=True).stdout


def r_numbers(expression):
    """The numbers R 4.2.2 prints for an expression that yields a numeric vector."""
    text = subprocess.run(["Rscript", "-e", f"cat(sprintf('%.17g', {expression}), sep='\\n')"],
                          check=True, capture_output=True, text=True).stdout
    return [float(v) for v in text.split()]


def r_matrix(counts):
    flat = ", ".join(str(v) for row in counts for v in row)
    return f"matrix(c({flat}), nrow={len(counts)}, byrow=TRUE)"


def tables_with_margins(rows, columns):
    """Every table with these row and column totals (for small tables only)."""
    if len(rows) == 1:
        yield [list(columns)]
        return
    first, rest = rows[0], rows[1:]

    def fill(j, left, room, row):
        if j == len(room) - 1:
            if left <= room[j]:
                yield row + [left]
            return
        for x in range(min(left, room[j]) + 1):
            yield from fill(j + 1, left - x, room, row + [x])

    for row in fill(0, first, list(columns), []):
        for below in tables_with_margins(rest, [c - x for c, x in zip(columns, row)]):
            yield [row] + below


def exact_conditional(counts):
    """Exact p-values given both margins, with exact rational probabilities (Python fractions):
    Fisher's (tables no more probable than the observed) and Pearson's (X² at least the observed)."""
    rows = [sum(r) for r in counts]
    columns = [sum(c) for c in zip(*counts)]
    n = sum(rows)

    def probability(table):
        numerator = math.prod(math.factorial(v) for v in rows + columns)
        return Fraction(numerator, math.factorial(n) * math.prod(math.factorial(v) for r in table for v in r))

    def pearson(table):
        return sum(Fraction((table[i][j] * n - rows[i] * columns[j]) ** 2, n * rows[i] * columns[j])
                   for i in range(len(rows)) for j in range(len(columns)))

    observed_p, observed_x2 = probability(counts), pearson(counts)
    fisher = pearson_p = Fraction(0)
    for table in tables_with_margins(rows, columns):
        prob = probability(table)
        if prob <= observed_p * (1 + Fraction(1, 10**7)):
            fisher += prob
        if pearson(table) >= observed_x2:
            pearson_p += prob
    return float(fisher), float(pearson_p)


# Invented tables for the exact test (fictional firm); tea is Fisher's tea-tasting table
# (Fisher 1935 via R's ?fisher.test; published_values.md section 2).
EXACT_TABLES = {
    "tea": [[3, 1], [1, 3]],
    "teams": TABLES["teams"],
    "sites": [[5, 3, 2], [4, 6, 1]],
    "shifts": [[2, 0, 3, 1], [1, 4, 0, 2], [0, 1, 2, 5]],
    "branches": TABLES["branches"],
    "party": TABLES["party"],
}

# Agresti (2007) Table 2.3 (from memory), the Physicians' Health Study: placebo / aspirin × MI / no MI.
ASPIRIN = [[189, 10845], [104, 10933]]
ZERO_CELL = [[0, 10], [5, 5]]  # invented (published_values.md section 10)
# Mendel (1866) dihybrid cross (counts from memory), against 9:3:3:1 (published_values.md section 6).
MENDEL = [315, 108, 101, 32]
MENDEL_SHARES = [9, 3, 3, 1]
# R's ?mcnemar.test: Agresti (1990) p. 350, approval ratings in two surveys (published_values.md section 5).
APPROVAL = [[794, 150], [86, 570]]
# Invented: appraisal ratings of the same staff in two years (below / meets / exceeds).
RATINGS = [[24, 14, 6], [4, 41, 15], [1, 5, 19]]
# Agresti (2007) malformation × maternal alcohol (from memory; published_values.md section 4).
ALCOHOL_PRESENT = [48, 38, 5, 1, 1]
ALCOHOL_ABSENT = [17066, 14464, 788, 126, 37]
ALCOHOL_SCORES = [0, 0.5, 1.5, 4.0, 7.0]
# The four-fifths example of published_values.md section 9 (invented numbers).
IMPACT_SELECTED = [48, 12, 30]
IMPACT_CONSIDERED = [80, 30, 60]
# Invented records of a fictional firm: department and review outcome of each employee, a blank
# outcome (skipped) and a weight per record.
RECORD_DEPARTMENTS = ["Sales", "Legal", "Sales", "Support", "Legal", "Sales", "Support", "Support", "Legal",
                      "Sales", "Support", "Sales", "Legal", "Support", "Sales", "Legal"]
RECORD_OUTCOMES = ["Met", "Exceeded", "Below", "Met", "Met", "Met", "Exceeded", "", "Below", "Exceeded",
                   "Met", "Met", "Met", "Below", "Below", "Exceeded"]
RECORD_WEIGHTS = [1.5, 1, 2, 1, 0.5, 1, 1, 3, 2, 1, 1, 1.5, 1, 2, 1, 1]


def crosstab(rows, columns, weights, row_levels, column_levels):
    table = np.zeros((len(row_levels), len(column_levels)))
    for r, c, w in zip(rows, columns, weights):
        if r and c:
            table[row_levels.index(r), column_levels.index(c)] += w
    return table.tolist()


def first_seen(labels):
    return list(dict.fromkeys(v for v in labels if v))


def function_values():
    values = {}

    exact = {}
    for name, counts in EXACT_TABLES.items():
        matrix = r_matrix(counts)
        (r_two_sided,) = r_numbers(f"fisher.test({matrix}, workspace=2e8)$p.value")
        entry = {"counts": counts, "two_sided": r_two_sided}
        if sum(map(sum, counts)) <= 30:  # small enough to list every table in Python
            fisher, pearson_p = exact_conditional(counts)
            assert abs(fisher - r_two_sided) <= 1e-12 * r_two_sided, (name, fisher, r_two_sided)
            entry["pearson_conditional"] = pearson_p
        if len(counts) == 2 and len(counts[0]) == 2:
            entry["lower"] = r_numbers(f"fisher.test({matrix}, alternative='less')$p.value")[0]
            entry["upper"] = r_numbers(f"fisher.test({matrix}, alternative='greater')$p.value")[0]
            scipy_p = st.fisher_exact(counts)[1]
            assert abs(scipy_p - r_two_sided) <= 1e-12 * r_two_sided
        exact[name] = entry
    values["exact"] = exact

    def ratios(counts, alpha):
        t = Table2x2(np.array(counts, dtype=float), shift_zeros=False)
        return {"odds": [float(t.oddsratio), *map(float, t.oddsratio_confint(alpha=alpha))],
                "risk": [float(t.riskratio), *map(float, t.riskratio_confint(alpha=alpha))]}
    values["aspirin"] = {"counts": ASPIRIN, "95": ratios(ASPIRIN, 0.05), "90": ratios(ASPIRIN, 0.10)}
    # Haldane–Anscombe: 0.5 added to every cell (statsmodels' shift_zeros would change the zero cell only).
    values["zero_cell"] = {"counts": ZERO_CELL, "95": ratios((np.array(ZERO_CELL) + 0.5).tolist(), 0.05)}

    party = np.array(TABLES["party"], dtype=float)
    z = np.asarray(sm.stats.Table(party, shift_zeros=False).standardized_resids)
    raw_p = 2 * st.norm.sf(np.abs(z))
    values["celltest_party"] = {
        method: (multipletests(raw_p.ravel(), method=method)[1].reshape(z.shape).tolist() if method != "none"
                 else raw_p.tolist())
        for method in ("holm", "bonferroni", "none")}

    x2, p = st.chisquare(MENDEL, f_exp=np.array(MENDEL_SHARES) * sum(MENDEL) / sum(MENDEL_SHARES))
    x2_equal, p_equal = st.chisquare(MENDEL)
    _, p_one_estimated = st.chisquare(MENDEL, f_exp=np.array(MENDEL_SHARES) * sum(MENDEL) / sum(MENDEL_SHARES),
                                      ddof=1)
    values["mendel"] = {"observed": MENDEL, "shares": MENDEL_SHARES, "fit": [float(p), float(x2), 3.0],
                        "equal_shares": [float(p_equal), float(x2_equal), 3.0],
                        "one_estimated": [float(p_one_estimated), float(x2), 2.0]}

    def power(w, n, df, alpha=0.05):
        return float(st.ncx2.sf(st.chi2.isf(alpha, df), df, n * w * w))

    def sample_size(w, target, df, alpha=0.05):
        n = 1
        while power(w, n, df, alpha) < target:
            n += 1
        return n
    values["power"] = {"w0.3_n87_df1": power(0.3, 87, 1), "w0.3_n88_df1": power(0.3, 88, 1),
                       "w0.5_n50_df2_alpha0.01": power(0.5, 50, 2, 0.01),
                       "n_w0.3_p0.8_df1": sample_size(0.3, 0.8, 1), "n_w0.1_p0.9_df4": sample_size(0.1, 0.9, 4),
                       "n_w0.5_p0.8_df2": sample_size(0.5, 0.8, 2)}

    departments_sorted = sorted(set(v for v in RECORD_DEPARTMENTS if v))
    outcomes_sorted = sorted(set(v for v in RECORD_OUTCOMES if v))
    values["records"] = {
        "departments": RECORD_DEPARTMENTS, "outcomes": RECORD_OUTCOMES, "weights": RECORD_WEIGHTS,
        "departments_sorted": departments_sorted, "outcomes_sorted": outcomes_sorted,
        "departments_first": first_seen(RECORD_DEPARTMENTS), "outcomes_first": first_seen(RECORD_OUTCOMES),
        "counts_sorted": crosstab(RECORD_DEPARTMENTS, RECORD_OUTCOMES, [1] * len(RECORD_WEIGHTS),
                                  departments_sorted, outcomes_sorted),
        "counts_first": crosstab(RECORD_DEPARTMENTS, RECORD_OUTCOMES, [1] * len(RECORD_WEIGHTS),
                                 first_seen(RECORD_DEPARTMENTS), first_seen(RECORD_OUTCOMES)),
        "weighted_sorted": crosstab(RECORD_DEPARTMENTS, RECORD_OUTCOMES, RECORD_WEIGHTS,
                                    departments_sorted, outcomes_sorted),
    }

    ucb = r_numbers("as.vector(aperm(UCBAdmissions, c(2, 1, 3)))")  # Gender × Admit × Dept, men first
    # Per department: men admitted, women admitted, men rejected, women rejected; a stratum is a, b, c, d.
    strata = [[ucb[4 * k + 0], ucb[4 * k + 2], ucb[4 * k + 1], ucb[4 * k + 3]] for k in range(6)]
    st_table = StratifiedTable([np.array([[a, b], [c, d]]) for a, b, c, d in strata])
    corrected = st_table.test_null_odds(correction=True)
    uncorrected = st_table.test_null_odds(correction=False)
    lower, upper = st_table.oddsratio_pooled_confint(alpha=0.05)
    tarone = st_table.test_equal_odds(adjust=True)
    r_mh = r_numbers("c(mantelhaen.test(UCBAdmissions)$statistic, mantelhaen.test(UCBAdmissions)$p.value, "
                     "mantelhaen.test(UCBAdmissions)$estimate, mantelhaen.test(UCBAdmissions)$conf.int)")
    assert abs(r_mh[0] - corrected.statistic) <= 1e-10 * r_mh[0] and abs(r_mh[2] - st_table.oddsratio_pooled) <= 1e-12
    values["admissions"] = {
        "strata": strata, "departments": list("ABCDEF"),
        "corrected": [float(st.chi2.sf(corrected.statistic, 1)), float(corrected.statistic),
                      float(st_table.oddsratio_pooled), float(lower), float(upper)],
        "uncorrected": [float(st.chi2.sf(uncorrected.statistic, 1)), float(uncorrected.statistic),
                        float(st_table.oddsratio_pooled), float(lower), float(upper)],
        "homogeneity": [float(st.chi2.sf(tarone.statistic, 5)), float(tarone.statistic), 5.0],
    }

    approval = np.array(APPROVAL)
    m_corrected = mcnemar(approval, exact=False, correction=True)
    m_uncorrected = mcnemar(approval, exact=False, correction=False)
    m_exact = mcnemar(approval, exact=True)
    bowker = SquareTable(np.array(RATINGS), shift_zeros=False).symmetry()
    values["paired"] = {
        "approval": APPROVAL, "ratings": RATINGS,
        "corrected": [float(st.chi2.sf(m_corrected.statistic, 1)), float(m_corrected.statistic), 1.0],
        "uncorrected": [float(st.chi2.sf(m_uncorrected.statistic, 1)), float(m_uncorrected.statistic), 1.0],
        "exact": [float(m_exact.pvalue), float(m_exact.statistic), 0.0],
        "bowker": [float(st.chi2.sf(bowker.statistic, bowker.df)), float(bowker.statistic), float(bowker.df)],
    }

    totals = [a + b for a, b in zip(ALCOHOL_PRESENT, ALCOHOL_ABSENT)]
    vector = lambda v: "c(" + ", ".join(str(x) for x in v) + ")"  # noqa: E731
    statistic, p_trend = r_numbers(f"unlist(prop.trend.test({vector(ALCOHOL_PRESENT)}, {vector(totals)}, "
                                   f"{vector(ALCOHOL_SCORES)})[c('statistic', 'p.value')])")
    values["alcohol"] = {"present": ALCOHOL_PRESENT, "absent": ALCOHOL_ABSENT, "scores": ALCOHOL_SCORES,
                         "trend": [p_trend, math.sqrt(statistic)]}

    # Cramér's V interval of the party table: the noncentralities λ with P(X ≥ x | λ) = 0.025 and 0.975
    # for the observed X² (scipy ncx2 and brentq), V = √(λ / (n (min(r, c) − 1))).
    x2, _, df, _ = st.chi2_contingency(party, correction=False)
    n = party.sum()
    bounds = [optimize.brentq(lambda lam: st.ncx2.sf(x2, df, lam) - tail, 1e-9, 1000, xtol=1e-14, rtol=1e-15)
              for tail in (0.025, 0.975)]
    values["party_v_interval"] = [math.sqrt(lam / n) for lam in bounds]

    rates = [Fraction(s, c) for s, c in zip(IMPACT_SELECTED, IMPACT_CONSIDERED)]
    values["impact"] = {"selected": IMPACT_SELECTED, "considered": IMPACT_CONSIDERED,
                        "rates": [float(r) for r in rates], "ratios": [float(r / max(rates)) for r in rates]}
    return values


def main():
    data = {
        "generated_by": "tests/calc/make_reference_values.py",
        "tools": {"scipy": scipy.__version__, "numpy": np.__version__, "statsmodels": statsmodels.__version__,
                  "R": r_version()},
        "tables": {name: values_for(counts) for name, counts in TABLES.items()},
        "critical": [{"df": df, "alpha": alpha, "value": float(st.chi2.isf(alpha, df))} for df, alpha in CRITICAL],
        "functions": function_values(),
    }
    out = pathlib.Path(__file__).with_name("reference_values.json")
    out.write_text(json.dumps(data, indent=1) + "\n")
    print(f"wrote {out}")


if __name__ == "__main__":
    main()
