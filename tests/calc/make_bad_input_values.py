#!/usr/bin/python3
"""Writes tests/calc/bad_input_values.json: reference values for the cases of calc_bad_input.py that are
not in extremes_values.json (make_extremes_values.py).

statsmodels 0.13.5 (StratifiedTable: Breslow–Day with Tarone's adjustment, Mantel–Haenszel with the
continuity correction, the pooled odds ratio) and scipy 1.10.1 (chi2_contingency without Yates'
correction) on the battery's extreme tables.

Run from the repository root:  /usr/bin/python3 tests/calc/make_bad_input_values.py
"""
import json
import pathlib

import numpy as np
import scipy
import statsmodels
from scipy.stats import chi2_contingency
from statsmodels.stats.contingency_tables import StratifiedTable

HERE = pathlib.Path(__file__).resolve().parent


def strata(cells):
    """The strata of a range whose rows hold a, b, c, d of one 2×2 table each."""
    return StratifiedTable([np.array([[a, b], [c, d]], dtype=float) for a, b, c, d in cells])


def main():
    tiny_count = [[1e-10, 5, 6, 7], [5, 6, 7, 8]]
    homogeneity = strata(tiny_count).test_equal_odds(adjust=True)
    subnormal = [[5e-324, 1, 1, 5e-324], [5, 6, 7, 8]]
    mantel_haenszel = strata(subnormal).test_null_odds(correction=True)
    beside = [[1e-300, 7], [2, 9]]
    statistic, p, _, _ = chi2_contingency(np.array(beside, dtype=float), correction=False)
    # TEAMS with a stray 5 in column A far below: a third row (5, 0) once the blank rows are set aside.
    stray = [[18, 7], [9, 16], [5, 0]]
    stray_statistic, stray_p, _, _ = chi2_contingency(np.array(stray, dtype=float), correction=False)
    values = {
        "source": f"statsmodels {statsmodels.__version__}, scipy {scipy.__version__} via tests/calc/make_bad_input_values.py",
        "homogeneity_tiny_count": {"cells": tiny_count, "p": homogeneity.pvalue, "statistic": homogeneity.statistic},
        "strata_subnormal": {"cells": subnormal, "p": mantel_haenszel.pvalue, "statistic": mantel_haenszel.statistic,
                             "odds_ratio": strata(subnormal).oddsratio_pooled},
        "tiny_beside_ordinary": {"cells": beside, "p": p, "statistic": statistic},
        "stray_row": {"cells": stray, "p": stray_p, "statistic": stray_statistic},
    }
    (HERE / "bad_input_values.json").write_text(json.dumps(values) + "\n")


if __name__ == "__main__":
    main()
