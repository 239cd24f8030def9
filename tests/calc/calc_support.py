"""What the Calc harness files share: the one headless office and its document (`session`, set
up by calc_functions_test.py's main), the reference values, the test tables, and CalcTestCase
with its helpers for writing cells and reading results.
"""

import argparse
import json
import math
import pathlib
import sys
import time
import types
import unittest

HERE = pathlib.Path(__file__).resolve().parent
ROOT = HERE.parents[1]
sys.path.insert(0, str(ROOT / "scripts"))
sys.path.insert(0, str(ROOT / "extension"))

import assoc_office  # noqa: E402
import generate  # noqa: E402  (the wizard texts, from the function table)
import uno  # noqa: E402

REFERENCE = json.loads((HERE / "reference_values.json").read_text())["tables"]
CRITICAL = json.loads((HERE / "reference_values.json").read_text())["critical"]
ERR_ILLEGAL_ARGUMENT = 502  # what Calc shows for IllegalArgumentException

FUNCTIONS = json.loads((HERE / "reference_values.json").read_text())["functions"]

# The running office and the document every test adds its sheet to (set by the harness's main).
session = types.SimpleNamespace(office=None, document=None)
TIMINGS = []

# Agresti (2007), An Introduction to Categorical Data Analysis, 2nd ed., gender × party
# identification; counts read in R's ?chisq.test example ("From Agresti(2007) p.39").
PARTY = [["Gender / Party", "Democrat", "Independent", "Republican"],
         ["Females", 762, 327, 468],
         ["Males", 484, 239, 477]]
PARTY_BODY = [row[1:] for row in PARTY[1:]]
# Invented: branches of a fictional company × outcomes of an invoice check, with a blank cell
# (read as 0), an all-zero row ("Depot") and an all-zero column ("Voided"), both set aside.
BRANCHES = [["", "Cleared", "Queried", "Returned", "Voided", "Escalated"],
            ["Northgate", 12, 7, None, 0, 9],
            ["Riverside", 5, 14, 8, 0, 3],
            ["Depot", 0, 0, 0, 0, 0],
            ["Hillcrest", 9, 4, 11, 0, 6]]
BRANCHES_KEPT_ROWS, BRANCHES_KEPT_COLUMNS = [0, 1, 3], [0, 1, 2, 4]
# Invented 2×2: two teams × promoted / not promoted.
TEAMS = [["", "Promoted", "Not promoted"], ["Team A", 18, 7], ["Team B", 9, 16]]
# A 3×3 table for methods that need 2×2 (invented).
THREE_BY_THREE = [[10, 20, 30], [20, 20, 20], [30, 20, 10]]


def column_name(index):
    name = ""
    index += 1
    while index:
        index, rest = divmod(index - 1, 26)
        name = chr(ord("A") + rest) + name
    return name


def address(column, row, columns=1, rows=1):
    first = f"{column_name(column)}{row + 1}"
    return first if columns == 1 and rows == 1 else f"{first}:{column_name(column + columns - 1)}{row + rows}"


def expand(kept, body_rows, body_columns, kept_rows, kept_columns):
    """A kept-shape reference array spread to the body's shape with 0 in set-aside cells."""
    body = [[0.0] * body_columns for _ in range(body_rows)]
    for i, r in enumerate(kept_rows):
        for j, c in enumerate(kept_columns):
            body[r][c] = kept[i][j]
    return body


class CalcTestCase(unittest.TestCase):
    """Each test works on a sheet of its own in the shared document."""

    def setUp(self):
        name = self.id().rsplit(".", 1)[-1][:31]
        sheets = session.document.Sheets
        sheets.insertNewByName(name, sheets.Count)
        self.sheet = sheets.getByName(name)
        self.started = time.monotonic()

    def tearDown(self):
        # Finished sheets would be recalculated by every later calculateAll().
        session.document.Sheets.removeByName(self.sheet.Name)
        TIMINGS.append((time.monotonic() - self.started, self.id().rsplit(".", 2)[-2:]))

    # Writing
    def put(self, rows, column=0, row=0):
        """Writes a block (None is a blank cell) and returns its address, e.g. "A1:D3"."""
        width = max(len(r) for r in rows)
        data = tuple(tuple("" if v is None else (float(v) if isinstance(v, (int, float)) else v) for v in r)
                     for r in rows)
        self.sheet.getCellRangeByName(address(column, row, width, len(rows))).setDataArray(data)
        return address(column, row, width, len(rows))

    def formula(self, cell, text):
        self.sheet.getCellRangeByName(cell).setFormula(text)
        session.document.calculateAll()
        return self.sheet.getCellRangeByName(cell)

    def array_formula(self, cells, text):
        block = self.sheet.getCellRangeByName(cells)
        block.setArrayFormula(text)
        session.document.calculateAll()
        return block

    # Reading
    def number(self, cell, text):
        result = self.formula(cell, text)
        self.assertEqual(result.getError(), 0, f"{text} shows error {result.getError()}")
        return result.getValue()

    def words(self, cell, text):
        result = self.formula(cell, text)
        self.assertEqual(result.getError(), 0, f"{text} shows error {result.getError()}")
        return result.getString()

    def array(self, cells, text):
        block = self.array_formula(cells, text)
        for r in range(block.Rows.Count):
            for c in range(block.Columns.Count):
                error = block.getCellByPosition(c, r).getError()
                self.assertEqual(error, 0, f"{text}: cell ({r}, {c}) shows error {error}")
        return [list(row) for row in block.getDataArray()]

    # Checking
    def assertClose(self, actual, expected, tolerance=1e-12, what=""):
        self.assertTrue(math.isclose(actual, expected, rel_tol=tolerance, abs_tol=tolerance * 1e-3),
                        f"{what}: {actual!r} differs from {expected!r} (relative tolerance {tolerance})")

    def assertAllClose(self, actual, expected, tolerance=1e-12, what=""):
        self.assertEqual(len(actual), len(expected), f"{what}: rows")
        for r, (got_row, want_row) in enumerate(zip(actual, expected)):
            self.assertEqual(len(got_row), len(want_row), f"{what}: columns of row {r}")
            for c, (got, want) in enumerate(zip(got_row, want_row)):
                self.assertClose(got, want, tolerance, f"{what} [{r}][{c}]")


def run_harness(description):
    """The main of every Calc harness file: installs the .oxt given by --oxt into a throwaway office,
    opens one spreadsheet, runs the unittest cases of the calling module (`__main__`, with whatever it
    imports) and exits 0 only when all passed. Register the file in tests/calc/CMakeLists.txt with
    assoc_calc_harness()."""
    parser = argparse.ArgumentParser(description=description, formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--oxt", required=True, help="the built extension, e.g. build/extension/assoc.oxt")
    known, rest = parser.parse_known_args()
    started = time.monotonic()
    ok = False
    try:
        session.office = assoc_office.ThrowawayOffice(known.oxt, log=lambda m: print(m, flush=True)).__enter__()
        session.document = session.office.new_spreadsheet()
        program = unittest.main(module="__main__", argv=[sys.argv[0], *rest], exit=False, verbosity=2)
        ok = program.result.wasSuccessful()
    finally:
        if session.document is not None:
            try:
                session.document.close(True)
            except Exception:
                pass
        if session.office is not None:
            session.office.close()
    for seconds, name in sorted(TIMINGS, reverse=True)[:5]:
        print(f"  {seconds:5.1f} s  {'.'.join(name)}")
    print(f"Calc harness: {time.monotonic() - started:.1f} s", flush=True)
    sys.exit(0 if ok else 1)
