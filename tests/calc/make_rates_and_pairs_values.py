#!/usr/bin/python3
"""Writes rates_and_pairs_values.json: expected values for calc_rates_and_pairs.py (ASSOC.RATES,
ASSOC.RATEDIFF, ASSOC.PAIRWISE, ASSOC.STRATARISK in headless Calc), computed with reference libraries,
never with Assoc. Run with Debian's /usr/bin/python3 from the repository root:

    /usr/bin/python3 tests/calc/make_rates_and_pairs_values.py

Tools: statsmodels 0.13.5 (proportion_confint(method="wilson"), confint_proportions_2indep(method="newcomb"),
multipletests, StratifiedTable.riskratio_pooled, Table2x2), scipy 1.10.1 (chi2_contingency per pair),
numpy 1.24.2, and R 4.2.2 (Rscript: fisher.test per pair, p.adjust). The interval of the common risk
ratio uses the variance of Greenland & Robins (1985), Biometrics 41:55-68, written out below in numpy
(the formula as the R package Hmisc implements it in mhgr(); see tests/reference/rates_and_pairs_generate.py,
which checks it in 50-digit arithmetic). All tables are invented (a fictional company's HR data).
"""

import itertools
import json
import pathlib
import subprocess
import sys

import numpy as np
import scipy
import statsmodels
from scipy import stats
from statsmodels.stats.contingency_tables import StratifiedTable, Table2x2
from statsmodels.stats.multitest import multipletests
from statsmodels.stats.proportion import confint_proportions_2indep, proportion_confint

assert scipy.__version__ == "1.10.1", scipy.__version__
assert statsmodels.__version__.startswith("0.13.5"), statsmodels.__version__

OUT = pathlib.Path(__file__).with_name("rates_and_pairs_values.json")
sys.path.insert(0, str(pathlib.Path(__file__).resolve().parents[1] / "reference"))
from samples_generate import r_matrix, r_numbers as r_values  # noqa: E402  (Rscript helpers, whole counts)

# Promoted / not promoted in 2025 by department at a fictional company; Legal had no promotion round.
DEPARTMENTS = [["Department", "Promoted", "Not promoted"],
               ["Design", 73, 173], ["Assembly", 46, 199], ["Legal", 0, 0], ["Sales", 41, 77],
               ["Finance", 10, 44], ["Logistics", 13, 84]]
# Design promoted, not promoted, Assembly promoted, not promoted, by office (as in samples/hr_review.fods).
OFFICES = [["Office", "Design: promoted", "Design: not promoted", "Assembly: promoted", "Assembly: not promoted"],
           ["Northgate", 41, 56, 10, 11], ["Riverside", 23, 61, 12, 25], ["Hillcrest", 7, 31, 13, 70],
           ["Lakeview", 2, 25, 11, 93]]


def rates(rows, confidence):
    out = []
    for _, yes, no in rows:
        n = yes + no
        if n == 0:
            out.append(None)
            continue
        lower, upper = proportion_confint(yes, n, alpha=1 - confidence, method="wilson")
        out.append([float(n), yes / n, float(lower), float(upper)])
    return out


def pairwise(rows):
    kept = [row for row in rows if sum(row[1:]) > 0]
    names, pearson, exact = [], [], []
    for first, second in itertools.combinations(kept, 2):
        table = np.array([first[1:], second[1:]], dtype=float)
        table = table[:, table.sum(axis=0) > 0]
        names.append([first[0], second[0]])
        pearson.append(float(stats.chi2_contingency(table, correction=False)[1]))
        exact.append(r_values(f"fisher.test({r_matrix(table)})$p.value")[0])
    result = {"names": names, "pearson": pearson, "exact": exact}
    for method in ("holm", "bonferroni"):
        result[method] = [float(p) for p in multipletests(pearson, method=method)[1]]
        assert np.allclose(result[method], r_values(f"p.adjust(c({', '.join(map(repr, pearson))}), method = '{method}')"),
                           rtol=1e-13)
    result["exact_holm"] = [float(p) for p in multipletests(exact, method="holm")[1]]
    return result


def common_risk_ratio(strata, confidence):
    """Mantel-Haenszel estimate (statsmodels) and the Greenland-Robins interval of its logarithm."""
    a, b, c, d = (np.array([s[i] for s in strata], dtype=float) for i in range(4))
    n1, n0 = a + b, c + d
    n = n1 + n0
    r, s = np.sum(a * n0 / n), np.sum(c * n1 / n)
    variance = np.sum((n1 * n0 * (a + c) - a * c * n) / n ** 2) / (r * s)
    ratio = StratifiedTable([np.array([[w, x], [y, z]], dtype=float) for w, x, y, z in strata]).riskratio_pooled
    assert abs(ratio - r / s) < 1e-14 * ratio
    z = stats.norm.isf((1 - confidence) / 2)
    half = z * np.sqrt(variance)
    return [float(ratio), float(ratio * np.exp(-half)), float(ratio * np.exp(half))]


def main():
    body = DEPARTMENTS[1:]
    design, assembly = body[0], body[1]
    difference = design[1] / sum(design[1:]) - assembly[1] / sum(assembly[1:])
    newcombe = confint_proportions_2indep(design[1], sum(design[1:]), assembly[1], sum(assembly[1:]),
                                          method="newcomb", compare="diff", alpha=0.05)
    strata = [row[1:] for row in OFFICES[1:]]
    single = Table2x2(np.array([[design[1], design[2]], [assembly[1], assembly[2]]], dtype=float))
    r_version = subprocess.run(["Rscript", "-e", "cat(R.version.string)"], check=True, capture_output=True,
                               text=True).stdout
    data = {
        "generated_by": "tests/calc/make_rates_and_pairs_values.py",
        "tools": {"scipy": scipy.__version__, "numpy": np.__version__, "statsmodels": statsmodels.__version__,
                  "R": r_version},
        "departments": DEPARTMENTS,
        "offices": OFFICES,
        "rates": rates(body, 0.95),
        "rates_90": rates(body, 0.90),
        "ratediff": [difference, float(newcombe[0]), float(newcombe[1])],
        "pairwise": pairwise(body),
        "stratarisk": common_risk_ratio(strata, 0.95),
        "stratarisk_90": common_risk_ratio(strata, 0.90),
        "riskratio_design_assembly": [float(single.riskratio), *map(float, single.riskratio_confint(alpha=0.05))],
    }
    OUT.write_text(json.dumps(data, indent=1, ensure_ascii=False) + "\n")
    print(f"wrote {OUT}")


if __name__ == "__main__":
    main()
