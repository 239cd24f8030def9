#!/usr/bin/python3
"""Generates tests/calc/recalc_values.json: reference p-values for calc_recalc_test.py.

R 4.2.2 `fisher.test` (two-sided, exact for these small r×c tables) on invented 3×4 tables of a
fictional company's invoice checks: a table, the same table with one count changed, and with another
count changed. The Calc test checks that ASSOC.EXACT shows each table's own value however the cells
are edited back and forth (answers remembered by the add-in must be the fresh ones).

Run from the repository root:  /usr/bin/python3 tests/calc/make_recalc_values.py
"""
import json
import subprocess
from pathlib import Path

R_VERSION = subprocess.run(["Rscript", "-e", "cat(R.version.string)"], capture_output=True, text=True).stdout
assert "4.2.2" in R_VERSION, R_VERSION

# Branches (rows) × outcome of an invoice check (columns); invented.
TABLES = {
    "checks": [[6, 2, 1, 3], [1, 5, 2, 0], [2, 1, 6, 2]],
    "one_count_changed": [[6, 2, 1, 3], [1, 5, 2, 0], [2, 1, 7, 2]],
    "another_count_changed": [[5, 2, 1, 3], [1, 5, 2, 0], [2, 1, 6, 2]],
}


def r_fisher(table):
    rows, columns = len(table), len(table[0])
    values = ",".join(str(v) for row in table for v in row)
    script = f"cat(sprintf('%.17g', fisher.test(matrix(c({values}), nrow={rows}, ncol={columns}, byrow=TRUE))$p.value))"
    return float(subprocess.run(["Rscript", "-e", script], capture_output=True, text=True, check=True).stdout)


def main():
    values = {"source": f"{R_VERSION.strip()} fisher.test, two-sided (make_recalc_values.py)",
              "exact": {name: {"table": table, "p": r_fisher(table)} for name, table in TABLES.items()}}
    path = Path(__file__).resolve().parent / "recalc_values.json"
    path.write_text(json.dumps(values, indent=2) + "\n")
    print(f"wrote {path}")


if __name__ == "__main__":
    main()
