#!/usr/bin/python3
"""Writes v_interval_values.json: expected values for calc_v_interval.py (ASSOC.VINTERVAL in headless
Calc), computed with reference libraries, never with Assoc. Run with Debian's /usr/bin/python3 from the
repository root:

    /usr/bin/python3 tests/calc/make_v_interval_values.py

Tools: scipy 1.10.1 and numpy 1.24.2. Cramér's V from scipy.stats.contingency.association; its interval
inverts the noncentral chi-squared distribution of X² (scipy ncx2.sf and brentq, make_command_values.py's
v_interval): the λ with P(X ≥ x | λ) = α/2 and 1 − α/2 for the observed X², V = √(λ / (n (min(r, c) − 1))),
at most 1. All tables are invented (a fictional company's data).
"""

import json
import pathlib

import numpy as np
import scipy
from scipy.stats.contingency import association

from make_command_values import v_interval

assert scipy.__version__ == "1.10.1", scipy.__version__

TABLES = {
    # The guide's quick-start table (scripts/build_samples.py BRANCH_CHECKS): invoice checks by branch.
    "quick_start": [[84, 15, 6], [61, 22, 12], [90, 11, 5]],
    # Training course taken by job level (as tests/core/cramers_v_interval_test.cpp's training table).
    "training": [[25, 12, 8], [10, 20, 9], [6, 11, 24]],
    # Not significant (p = 0.50): the lower end is 0.
    "not_significant": [[5, 3, 2], [4, 6, 1]],
}


def main():
    tables = {}
    for name, counts in TABLES.items():
        v = float(association(np.array(counts), method="cramer", correction=False))
        tables[name] = {"counts": counts, "v": v, "interval_95": v_interval(counts, 0.95),
                        "interval_90": v_interval(counts, 0.90)}
    data = {"generated_by": "tests/calc/make_v_interval_values.py",
            "tools": {"scipy": scipy.__version__, "numpy": np.__version__}, "tables": tables}
    out = pathlib.Path(__file__).with_name("v_interval_values.json")
    out.write_text(json.dumps(data, indent=1) + "\n")
    print(f"wrote {out}")


if __name__ == "__main__":
    main()
