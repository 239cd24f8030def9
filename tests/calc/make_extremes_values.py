#!/usr/bin/python3
"""Writes tests/calc/extremes_values.json: the expected values of calc_extremes.py.

The values come from the same mpmath 1.2.1 (and exact fraction) computations as the core's
regression tests, by importing tests/reference/fisher_large_generate.py and
tests/reference/extremes_generate.py; only the cases the Calc checks use are computed here (the
fast ones).

Run from the repository root:  /usr/bin/python3 tests/calc/make_extremes_values.py
"""
import importlib.util
import json
import pathlib
import sys

ROOT = pathlib.Path(__file__).resolve().parents[2]


def load(name):
    spec = importlib.util.spec_from_file_location(name, ROOT / "tests" / "reference" / f"{name}.py")
    module = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(module)
    return module


def main():
    sys.argv = sys.argv[:1]
    fisher = load("fisher_large_generate")
    extremes = load("extremes_generate")
    mp = extremes.mp
    values = {"source": "mpmath 1.2.1 via tests/reference/fisher_large_generate.py and extremes_generate.py"}

    values["exact"] = {}
    for name, table in (("froze_calc", [[4294967000, 0], [1, 1]]), ("billion_beside_small", [[10**9, 5], [4, 7]]),
                        ("totals_of_millions", [[2184746, 1745229], [2218678, 1809224]])):
        two, lower, upper = fisher.p_values(table)
        values["exact"][name] = {"table": table, "two_sided": float(two), "lower": float(lower), "upper": float(upper)}

    strata = {"homogeneity_1e17": [[1e17, 1, 1, 1e17], [5, 6, 7, 8]],
              "strata_1e80": [[1e80, 1, 1, 1e80], [5, 6, 7, 8]],
              "near_bound": [[1, 0, 1000, 1], [40, 10, 10, 40], [30, 15, 12, 35]]}
    values["strata"] = {}
    for name, cells in strata.items():
        corrected, _, bd_p, _ = extremes.breslow_day(cells)
        mh, mh_p, psi, lower, upper = extremes.mantel_haenszel(cells)
        values["strata"][name] = {"cells": cells, "homogeneity_statistic": float(corrected),
                                  "homogeneity_p": float(bd_p), "mh_statistic": float(mh), "mh_p": float(mh_p),
                                  "odds_ratio": float(psi), "lower": float(lower), "upper": float(upper)}

    wide = extremes.table_measures([[2.0, 0.0], [1.0, 1e308]])
    values["wide_table"] = {"pearson": float(wide["x2"]), "likelihood_ratio": float(wide["g2"]),
                            "cramers_v": float(wide["v"]),
                            "adjusted": [[float(v) for v in row] for row in wide["adjusted"]]}
    yates = extremes.table_measures([[99999997, 99999999], [99999999, 99999999]])
    values["yates_near_1e8"] = {"statistic": float(yates["yates"]), "p": float(extremes.chi2_upper(yates["yates"], 1))}
    z, p = extremes.trend([[2, 273083], [18, 4549]], [24, 20])
    values["trend_far_tail"] = {"z": float(z), "p": float(p)}
    big = extremes.table_measures([[1e15, 2e15], [3e15, 1e15 + 7]])
    values["counts_of_1e15"] = {"cramers_v": float(big["v"]), "adjusted_top_left": float(big["adjusted"][0][0])}
    values["paired_million"] = float(extremes.exact_paired(1000000, 1001500))
    with mp.workdps(700):
        observed = [mp.mpf(28), mp.mpf(2) ** 53, mp.mpf(1), mp.mpf(1e300)]
        e = sum(observed) / 4
        values["fit_extreme_statistic"] = float(sum((o - e) ** 2 / e for o in observed))

    (ROOT / "tests" / "calc" / "extremes_values.json").write_text(json.dumps(values, indent=1) + "\n")


if __name__ == "__main__":
    main()
