#!/usr/bin/python3
"""Writes command_values.json: expected values for the Calc tests of the menu command
(command_test.py), computed with reference libraries, never with Assoc. Run with Debian's
/usr/bin/python3:

    /usr/bin/python3 tests/calc/make_command_values.py

Tools: scipy 1.10.1, numpy 1.24.2, statsmodels 0.13.5 (through make_reference_values.values_for:
chi2_contingency, expected_freq, statsmodels Table's adjusted residuals, association) and R 4.2.2
(fisher.test for the exact p-values). The interval of Cramér's V inverts the noncentral
chi-squared distribution as report.hpp describes: the λ with P(X ≥ x | λ) = 0.025 and 0.975 for the
observed X² (scipy ncx2 and brentq), V = √(λ / (n (min(r, c) − 1))). Odds and risk ratios with their
95% intervals from statsmodels Table2x2 (Woolf's and the log method). Rates by row with their Wilson
intervals from statsmodels proportion_confint(method="wilson"), the rate difference with Newcombe's
interval from statsmodels confint_proportions_2indep(method="newcomb"), and every pair of rows from
scipy chi2_contingency (without correction) with Holm's adjustment from statsmodels multipletests.
All tables are invented.
"""

import itertools
import json
import math
import pathlib

import numpy as np
import scipy
import scipy.stats as st
import statsmodels
from scipy import optimize
from statsmodels.stats.contingency_tables import Table2x2
from statsmodels.stats.multitest import multipletests
from statsmodels.stats.proportion import confint_proportions_2indep, proportion_confint

from make_reference_values import r_matrix, r_numbers, r_version, values_for

TABLES = {
    # Three branches of a fictional company × outcomes of an invoice check.
    "branches": [[12, 7, 3], [5, 14, 8], [9, 4, 11]],
    # The same with Northgate's cleared count edited from 12 to 30 (the test edits the source cell).
    "branches_edited": [[30, 7, 3], [5, 14, 8], [9, 4, 11]],
    # Two teams × promoted / not promoted.
    "teams": [[18, 7], [9, 16]],
    # Regions × exception, counted from records the test writes (levels sorted: Midlands, North,
    # South × No, Yes).
    "records": [[30, 12], [22, 25], [15, 28]],
    # A 10×10 table with 2,485 counts: the exact test is too slow for the sheet to keep it live.
    "large": [[10 + (r * 7 + c * 3) % 40 for c in range(10)] for r in range(10)],
}


def rates(counts, outcome=0):
    """Each row's n, rate of column `outcome` and its 95% Wilson interval (None for a row without counts)."""
    out = []
    for row in counts:
        n = sum(row)
        if n == 0:
            out.append(None)
            continue
        lower, upper = proportion_confint(row[outcome], n, alpha=0.05, method="wilson")
        out.append([float(n), row[outcome] / n, float(lower), float(upper)])
    return out


def rate_difference(counts):
    """Row 1's rate of column 1 minus row 2's, with Newcombe's 95% interval."""
    (a, b), (c, d) = counts
    lower, upper = confint_proportions_2indep(a, a + b, c, c + d, method="newcomb", compare="diff", alpha=0.05)
    return [a / (a + b) - c / (c + d), float(lower), float(upper)]


def pairwise(counts, names):
    """Every pair of rows: Pearson's p-value of the pair's table and the Holm-adjusted p-value."""
    pairs, p_values = [], []
    for (i, first), (j, second) in itertools.combinations(enumerate(counts), 2):
        table = np.array([first, second], dtype=float)
        table = table[:, table.sum(axis=0) > 0]
        pairs.append([names[i], names[j]])
        p_values.append(float(st.chi2_contingency(table, correction=False)[1]))
    adjusted = [float(p) for p in multipletests(p_values, method="holm")[1]]
    return [[*pair, p, q] for pair, p, q in zip(pairs, p_values, adjusted)]


def v_interval(counts, confidence=0.95):
    t = np.array(counts, dtype=float)
    x2, _, df, _ = st.chi2_contingency(t, correction=False)
    n, k = t.sum(), min(t.shape)

    def bound(tail):
        if st.chi2.sf(x2, df) >= tail:
            return 0.0
        return optimize.brentq(lambda lam: st.ncx2.sf(x2, df, lam) - tail, 0, 10 * x2 + 100, xtol=1e-14, rtol=1e-15)
    alpha = round(1 - confidence, 12)  # 0.05, not 0.050000000000000044
    return [min(1.0, math.sqrt(bound(tail) / (n * (k - 1)))) for tail in (alpha / 2, 1 - alpha / 2)]


def ratios(counts):
    t = Table2x2(np.array(counts, dtype=float), shift_zeros=False)
    return {"odds": [float(t.oddsratio), *map(float, t.oddsratio_confint(alpha=0.05))],
            "risk": [float(t.riskratio), *map(float, t.riskratio_confint(alpha=0.05))]}


def command_values(counts, exact=True):
    values = values_for(counts)
    values["critical"] = float(st.chi2.isf(0.05, values["df"]))
    values["critical_01"] = float(st.chi2.isf(0.01, values["df"]))
    values["v_interval"] = v_interval(counts)
    values["rates"] = rates(counts)
    if exact:
        values["exact"] = r_numbers(f"fisher.test({r_matrix(counts)}, workspace=2e8)$p.value")[0]
    return values


# The row labels the test gives each table (the large one's rows are unlabelled: "row 1", …).
ROW_NAMES = {"branches": ["Northgate", "Riverside", "Hillcrest"], "branches_edited": ["Northgate", "Riverside", "Hillcrest"],
             "records": ["Midlands", "North", "South"], "large": [f"row {r + 1}" for r in range(10)]}


def main():
    tables = {name: command_values(counts, exact=name != "large") for name, counts in TABLES.items()}
    for name, names in ROW_NAMES.items():
        tables[name]["pairwise"] = pairwise(TABLES[name], names)
    # OutcomeColumn 3: the rates of Returned, the other two columns being the rest.
    tables["branches"]["rates_third"] = rates(TABLES["branches"], outcome=2)
    # A table with a labelled total row and total column (the source's totals are set aside).
    tables["teams_with_totals"] = {"rates": rates(TABLES["teams"]) + [None]}
    teams = TABLES["teams"]
    tables["teams"]["ratios"] = {
        # The default arrangement: column 1 (Promoted) is the outcome, row 1 (Team A) the group.
        "first_first": ratios(teams),
        # OutcomeColumn 2, GroupRow 2: Not promoted for Team B against Team A.
        "second_second": ratios([[teams[1][1], teams[1][0]], [teams[0][1], teams[0][0]]]),
    }
    tables["teams"]["rate_difference"] = {
        "first_first": rate_difference(teams),
        "second_second": rate_difference([[teams[1][1], teams[1][0]], [teams[0][1], teams[0][0]]]),
    }
    tables["teams"]["rates_second"] = rates(teams, outcome=1)
    data = {
        "generated_by": "tests/calc/make_command_values.py",
        "tools": {"scipy": scipy.__version__, "numpy": np.__version__, "statsmodels": statsmodels.__version__,
                  "R": r_version()},
        "tables": tables,
    }
    out = pathlib.Path(__file__).with_name("command_values.json")
    out.write_text(json.dumps(data, indent=1) + "\n")
    print(f"wrote {out}")


if __name__ == "__main__":
    main()
