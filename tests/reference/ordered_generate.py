#!/usr/bin/python3
"""Expected values for the tests of ordered tables, of association across r×c strata and of
repeated yes/no answers (ASSOC.ORDINAL, ASSOC.STRENGTH "gamma"/"taub", ASSOC.WITHIN, ASSOC.REPEATED).

Run from the repository root with Debian's python3 (numpy 1.24.2, scipy 1.10.1, statsmodels
0.13.5) and R 4.2.2 (Rscript on PATH):

    /usr/bin/python3 tests/reference/ordered_generate.py

It writes two files with the same values: tests/reference/ordered_values.hpp (core tests) and
tests/reference/ordered_values.json (the Calc harness tests/calc/calc_ordered_and_within.py).
The tables are defined here once and written into both files, so the tests read the same counts.

Tools, one per quantity (never Assoc itself):
- linear-by-linear M² = (n − 1) r²: statsmodels Table.test_ordinal_association (its z² is M²); r from
  numpy's weighted covariance of the expanded scores;
- Kendall's τ-b: scipy.stats.kendalltau on the expanded data (one pair of ranks per person);
- Goodman–Kruskal γ: concordant and discordant pairs counted over every pair of people of the
  expanded data with numpy (no library has γ);
- generalized Cochran–Mantel–Haenszel: R's mantelhaen.test on the r×c×K array;
- Cochran's Q: statsmodels cochrans_q; p-values from scipy's chi2.sf (statsmodels forms 1 − cdf).
The tables are invented (a fictional company's staff surveys), except the job-satisfaction table of
Agresti (2007) (from memory; see tests/reference/published_values.md section 14).
"""

import json
import pathlib
import subprocess

import numpy as np
import scipy
import scipy.stats as st
import statsmodels
from statsmodels.stats.contingency_tables import Table, cochrans_q

HERE = pathlib.Path(__file__).resolve().parent
HEADER = HERE / "ordered_values.hpp"
JSON = HERE / "ordered_values.json"

# --- the tables ---------------------------------------------------------------------------------

# Invented: staff by tenure band (rows: under 1 year, 1–2, 3–5, 6–10, over 10 years) and answer to
# "How satisfied are you with your work?" (columns: very dissatisfied … very satisfied). Satisfaction
# falls steadily with tenure; Pearson's test, blind to the order, misses it.
TENURE = [[4, 9, 15, 24, 14],
          [6, 11, 17, 25, 12],
          [8, 13, 20, 21, 9],
          [12, 15, 19, 16, 8],
          [15, 17, 14, 13, 4]]
TENURE_ROW_SCORES = [0.5, 1.5, 4, 8, 15]  # band midpoints in years
TENURE_COLUMN_SCORES = [1, 2, 3, 4, 5]

# Agresti (2007), An Introduction to Categorical Data Analysis, 2nd ed., job satisfaction by income
# (rows: income bands, columns: very dissatisfied … very satisfied). Data, table number and the
# printed C = 1331, D = 849, γ = 0.221 from memory (published_values.md section 14).
JOB = [[1, 3, 10, 6],
       [2, 3, 10, 7],
       [1, 6, 14, 12],
       [0, 1, 9, 11]]

# Agresti (2007) infant malformation (present / absent) by alcohol (published_values.md section 4).
ALCOHOL = [[48, 38, 5, 1, 1], [17066, 14464, 788, 126, 37]]
ALCOHOL_SCORES = [0, 0.5, 1.5, 4, 7]

# Invented: appraisal rating (columns: below, meets, exceeds, outstanding) by department (rows:
# Design, Assembly, Logistics) within three offices (strata). In every office Design is rated a
# little higher.
OFFICE_NAMES = ["Northgate", "Riverside", "Hillcrest"]
DEPARTMENTS = ["Design", "Assembly", "Logistics"]
RATINGS = ["Below", "Meets", "Exceeds", "Outstanding"]
OFFICE_STRATA = [
    [[3, 14, 12, 6], [7, 22, 10, 3], [5, 17, 9, 2]],
    [[2, 9, 10, 5], [8, 25, 9, 2], [6, 14, 8, 1]],
    [[1, 6, 7, 3], [9, 30, 12, 4], [4, 11, 7, 2]],
]

# Invented: exception status (columns: none, minor, major) by region (rows: North, South) within
# four channels (strata); a 2×3×4 array.
CHANNEL_STRATA = [
    [[40, 9, 3], [35, 12, 6]],
    [[22, 7, 2], [18, 9, 5]],
    [[15, 6, 4], [11, 8, 7]],
    [[30, 5, 1], [28, 6, 2]],
]

# Invented: 18 staff asked in three survey waves "Would you recommend the company as a place to
# work?" (1 yes, 0 no); fewer say yes as the waves go on.
WAVES = [[1, 1, 1], [1, 1, 0], [1, 0, 0], [1, 1, 0], [0, 0, 0], [1, 1, 1], [1, 0, 0], [1, 1, 0], [0, 1, 0],
         [1, 1, 1], [1, 0, 1], [1, 1, 0], [0, 0, 0], [1, 0, 0], [1, 1, 1], [1, 1, 0], [0, 0, 1], [1, 0, 0]]

# Invented: 12 trainees, four tasks passed (1) or failed (0).
TASKS = [[1, 1, 0, 1], [1, 0, 0, 1], [1, 1, 1, 1], [0, 0, 0, 1], [1, 1, 0, 0], [1, 0, 0, 1],
         [0, 1, 0, 1], [1, 1, 1, 1], [1, 0, 0, 0], [1, 1, 0, 1], [0, 0, 1, 1], [1, 1, 0, 1]]


# --- reference computations ---------------------------------------------------------------------

def expanded(counts, row_scores=None, column_scores=None):
    """One (row score, column score) pair per person."""
    counts = np.asarray(counts)
    rows = row_scores if row_scores is not None else range(1, counts.shape[0] + 1)
    columns = column_scores if column_scores is not None else range(1, counts.shape[1] + 1)
    xs, ys = [], []
    for i, u in enumerate(rows):
        for j, v in enumerate(columns):
            xs += [u] * int(counts[i, j])
            ys += [v] * int(counts[i, j])
    return np.array(xs, dtype=float), np.array(ys, dtype=float)


def linear_by_linear(counts, row_scores=None, column_scores=None):
    """[p, M², df, r]: statsmodels for M² (z²), numpy for r."""
    table = Table(np.asarray(counts, dtype=float))
    kwargs = {}
    if row_scores is not None:
        kwargs["row_scores"] = np.asarray(row_scores, dtype=float)
    if column_scores is not None:
        kwargs["col_scores"] = np.asarray(column_scores, dtype=float)
    result = table.test_ordinal_association(**kwargs)
    m2 = float(result.zscore) ** 2
    x, y = expanded(counts, row_scores, column_scores)
    r = float(np.corrcoef(x, y)[0, 1])
    return [float(st.chi2.sf(m2, 1)), m2, 1.0, r]


def gamma_by_pairs(counts):
    """(C, D, γ) over every pair of people of the expanded data."""
    x, y = expanded(counts)
    dx = np.sign(x[:, None] - x[None, :])
    dy = np.sign(y[:, None] - y[None, :])
    product = dx * dy
    concordant = int((product > 0).sum()) // 2
    discordant = int((product < 0).sum()) // 2
    return concordant, discordant, (concordant - discordant) / (concordant + discordant)


def tau_b(counts):
    x, y = expanded(counts)
    return float(st.kendalltau(x, y, variant="b").statistic)


def r_numbers(expression):
    out = subprocess.run(["Rscript", "-e", f"cat(format({expression}, digits = 17), sep = '\\n')"],
                         check=True, capture_output=True, text=True).stdout
    return [float(x) for x in out.split()]


def r_array(strata):
    """An R array rows × columns × strata (R fills column by column)."""
    data = np.asarray(strata, dtype=float).transpose(1, 2, 0)  # rows, columns, strata
    flat = ", ".join(str(int(v)) for v in data.flatten(order="F"))
    return f"array(c({flat}), dim = c({data.shape[0]}, {data.shape[1]}, {data.shape[2]}))"


def mantelhaen(strata):
    """[p, statistic, df] from R's mantelhaen.test (generalized CMH for r×c×K, no correction beyond 2×2)."""
    statistic, df, p = r_numbers(f"unlist(mantelhaen.test({r_array(strata)})[c('statistic', 'parameter', 'p.value')])")
    return [p, statistic, df]


def cochran(answers):
    result = cochrans_q(np.asarray(answers))
    return [float(st.chi2.sf(result.statistic, result.df)), float(result.statistic), float(result.df)]


# --- output -------------------------------------------------------------------------------------

def main():
    r_version = subprocess.run(["Rscript", "-e", "cat(R.version.string)"], check=True, capture_output=True,
                               text=True).stdout
    c_job, d_job, gamma_job = gamma_by_pairs(JOB)
    values = {
        "tenure": {"counts": TENURE, "row_scores": TENURE_ROW_SCORES, "column_scores": TENURE_COLUMN_SCORES,
                   "pearson_p": float(st.chi2_contingency(np.array(TENURE), correction=False)[1]),
                   "ordinal": linear_by_linear(TENURE),
                   "ordinal_scored": linear_by_linear(TENURE, TENURE_ROW_SCORES, TENURE_COLUMN_SCORES),
                   "gamma": gamma_by_pairs(TENURE)[2], "tau_b": tau_b(TENURE)},
        "job": {"counts": JOB, "concordant": c_job, "discordant": d_job, "gamma": gamma_job, "tau_b": tau_b(JOB),
                "ordinal": linear_by_linear(JOB)},
        "alcohol": {"counts": ALCOHOL, "column_scores": ALCOHOL_SCORES,
                    "ordinal": linear_by_linear(ALCOHOL, None, ALCOHOL_SCORES)},
        "offices": {"strata": OFFICE_NAMES, "rows": DEPARTMENTS, "columns": RATINGS, "counts": OFFICE_STRATA,
                    "within": mantelhaen(OFFICE_STRATA)},
        "channels": {"counts": CHANNEL_STRATA, "within": mantelhaen(CHANNEL_STRATA)},
        "waves": {"answers": WAVES, "repeated": cochran(WAVES)},
        "tasks": {"answers": TASKS, "repeated": cochran(TASKS)},
    }
    JSON.write_text(json.dumps({"generated_by": "tests/reference/ordered_generate.py",
                                "tools": {"numpy": np.__version__, "scipy": scipy.__version__,
                                          "statsmodels": statsmodels.__version__, "R": r_version},
                                **values}, indent=1) + "\n")

    lines = ["#pragma once",
             "// Generated by tests/reference/ordered_generate.py: do not edit.",
             f"// numpy {np.__version__}, scipy {scipy.__version__}, statsmodels {statsmodels.__version__}, {r_version}",
             "#include <cstddef>",
             "",
             "namespace assoc::reference::ordered_values {"]

    def number(name, value):
        lines.append(f"inline constexpr double {name} = {float(value)!r};")

    def array(name, rows):
        shape = "".join(f"[{n}]" for n in np.shape(rows))
        body = json.dumps(rows).replace("[", "{").replace("]", "}")
        lines.append(f"inline constexpr double {name}{shape} = {body};")

    def row(name, parts, labels=("p", "statistic", "df", "r")):
        for label, value in zip(labels, parts):
            number(f"{name}_{label}", value)

    tenure = values["tenure"]
    lines.append("// Invented tenure band × satisfaction (5×5). Pearson p: scipy chi2_contingency. Linear-by-linear:")
    lines.append("// statsmodels Table.test_ordinal_association (M² = z²), r: numpy corrcoef of the expanded scores.")
    array("tenure_counts", TENURE)
    array("tenure_row_scores", TENURE_ROW_SCORES)
    array("tenure_column_scores", TENURE_COLUMN_SCORES)
    number("tenure_pearson_p", tenure["pearson_p"])
    row("tenure_ordinal", tenure["ordinal"])
    row("tenure_scored", tenure["ordinal_scored"])
    lines.append("// γ: concordant and discordant pairs over all pairs of the expanded data (numpy);")
    lines.append("// τ-b: scipy.stats.kendalltau on the expanded data.")
    number("tenure_gamma", tenure["gamma"])
    number("tenure_tau_b", tenure["tau_b"])
    lines.append("// Agresti (2007) job satisfaction by income (from memory, published_values.md section 14): pairs")
    lines.append("// counted with numpy, τ-b by scipy kendalltau, M² by statsmodels (scores 1, 2, 3, 4).")
    array("job_counts", JOB)
    number("job_concordant", c_job)
    number("job_discordant", d_job)
    number("job_gamma", gamma_job)
    number("job_tau_b", values["job"]["tau_b"])
    row("job_ordinal", values["job"]["ordinal"])
    lines.append("// Agresti (2007) alcohol table, column scores 0, 0.5, 1.5, 4, 7: statsmodels M² (published ≈6.57).")
    row("alcohol_ordinal", values["alcohol"]["ordinal"])
    lines.append("// Invented appraisal ratings (4) by department (3) within offices (3): R mantelhaen.test.")
    array("office_counts", OFFICE_STRATA)
    row("office_within", values["offices"]["within"], ("p", "statistic", "df"))
    lines.append("// Invented exception status (3) by region (2) within channels (4): R mantelhaen.test.")
    array("channel_counts", CHANNEL_STRATA)
    row("channel_within", values["channels"]["within"], ("p", "statistic", "df"))
    lines.append("// Invented yes/no answers, one row per person: statsmodels cochrans_q, p by scipy chi2.sf.")
    array("wave_answers", WAVES)
    row("wave_repeated", values["waves"]["repeated"], ("p", "statistic", "df"))
    array("task_answers", TASKS)
    row("task_repeated", values["tasks"]["repeated"], ("p", "statistic", "df"))
    lines += ["}  // namespace assoc::reference::ordered_values", ""]
    HEADER.write_text("\n".join(lines))
    print(f"wrote {HEADER.relative_to(HERE.parents[1])} and {JSON.relative_to(HERE.parents[1])}")


if __name__ == "__main__":
    main()
