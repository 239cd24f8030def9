#!/usr/bin/python3
"""A battery of bad and extreme inputs for every ASSOC function, in real headless Calc.

    /usr/bin/python3 tests/calc/calc_bad_input.py --oxt build/extension/assoc.oxt [unittest options]
    /usr/bin/python3 tests/calc/calc_bad_input.py --oxt … --probe     # print what each case gives

Each case puts its cells on a sheet, enters one formula and asserts what the cell shows: an error
code (Err:502 for Assoc's own refusals, whose ASSOC.CHECK text is asserted word for word where it
matters; Err:504 or Calc's own code where Calc refuses before calling Assoc), or a value (against
an outside reference or an exact identity, named beside it: extremes_values.json from mpmath via
make_extremes_values.py, bad_input_values.json from statsmodels and scipy via make_bad_input_values.py),
with ASSOC.CHECK's words. After every case the office must still be alive and a valid formula
(Agresti's X², published_values.md section 3) still right.

Cases come from issue 9 (every input it lists), error cells, booleans, date-formatted cells,
whole-column and whole-row references, inline arrays, 1×1 / 1×n / n×1 ranges, counts from 1e-300
to 1e308, misspelled and blank option words, and every number argument at and beyond its bounds.
CTest runs this file as calc.bad_input (tests/calc/CMakeLists.txt).
"""
import json
import math
import sys
import time
from statistics import NormalDist

from calc_support import ERR_ILLEGAL_ARGUMENT, HERE, PARTY, REFERENCE, CalcTestCase, run_harness, session

ERR_PARAMETER_LIST = 504  # Calc: an error in a range argument; the add-in is not called
ERR_DIV0 = 532            # #DIV/0!
ERR_NA = 32767            # #N/A
PROBE = "--probe" in sys.argv
if PROBE:
    sys.argv.remove("--probe")
EXTREMES = json.loads((HERE / "extremes_values.json").read_text())
BAD_INPUT = json.loads((HERE / "bad_input_values.json").read_text())


class Date:
    """A number shown with Calc's standard date format (what typing 05/01/2024 gives)."""
    def __init__(self, serial):
        self.serial = serial


class Percent:
    """A number shown with Calc's standard percent format."""
    def __init__(self, value):
        self.value = value


# What a case expects of its formula cell.
def error(code=ERR_ILLEGAL_ARGUMENT):
    return ("error", code)


def value(number, tolerance=1e-12):
    return ("value", number, tolerance)


def same_as(formula, factor=1.0, tolerance=1e-12):
    """The value of `formula` (entered in another cell) times `factor`: an identity."""
    return ("same", formula, factor, tolerance)


def text(words):
    return ("text", words)


def satisfies(predicate, description):
    return ("satisfies", predicate, description)


def simulated(trials):
    """A simulated p-value: (1 + k)/(trials + 1) for a whole k from 0 to trials."""
    def whole(p):
        k = p * (trials + 1) - 1
        return abs(k - round(k)) < 1e-6 and 0 <= round(k) <= trials
    return satisfies(whole, f"(1 + k)/{trials + 1} for a whole k")


class Case:
    """`pick` (row, column) chooses the cell of an array result that is asserted (the first by default)."""
    def __init__(self, name, cells, formula, expect, check=None, words=None, array=None, cell="H1", pick=(0, 0)):
        self.name, self.cells, self.formula, self.expect = name, cells, formula, expect
        self.check, self.words, self.array, self.cell, self.pick = check, words, array, cell, pick


# Invented tables (a fictional company's HR data; see calc_support).
TEAMS = [[18, 7], [9, 16]]
THREE = [[10, 20, 30], [20, 20, 20], [30, 20, 10]]
STRATA = [[12, 5, 7, 9], [8, 6, 3, 10], [5, 5, 4, 6]]
RECORDS = [["North", "Yes"], ["South", "No"], ["North", "No"], ["East", "Yes"], ["South", "Yes"], ["North", "Yes"]]


class Battery(CalcTestCase):
    """Runs a list of cases; each test method is one family of bad input."""

    def run_cases(self, cases):
        for case in cases:
            with self.subTest(case.name):
                self.run_case(case)

    def run_case(self, case):
        try:
            self.try_case(case)
        finally:  # a failed case must not leave its cells to the next one
            self.sheet.getCellRangeByName("A1:Z100").clearContents(0xFFFF)
            for corner in (case.cells or {}):
                self.sheet.getCellRangeByName(corner).clearContents(0xFFFF)
        self.assert_office_still_works()

    def try_case(self, case):
        for corner, rows in (case.cells or {}).items():
            self.put_cells(corner, rows)
        started = time.monotonic()
        cell = self.enter(case.cell, case.formula, case.array, case.pick)
        seconds = time.monotonic() - started
        check_text = None
        if case.check is not None:
            check_cell = self.enter("H60", case.check, None)
            check_text = check_cell.getString() if check_cell.getError() == 0 else f"Err:{check_cell.getError()}"
        if PROBE:
            shown = f"Err:{cell.getError()}" if cell.getError() else repr(cell.getString() or cell.getValue())
            print(f"\n[{case.name}] {case.formula} → {shown} ({seconds:.2f} s)\n    CHECK: {check_text}", flush=True)
        else:
            self.assert_expected(case, cell, check_text)

    def enter(self, cell, formula, array, pick=(0, 0)):
        if array:
            block = self.array_formula(array, formula)
            return block.getCellByPosition(pick[1], pick[0])
        return self.formula(cell, formula)

    def put_cells(self, corner, rows):
        """Writes rows at `corner`: None is a blank, "=…" a formula, Date/Percent formatted numbers."""
        start = self.sheet.getCellRangeByName(corner).CellAddress
        formats = session.document.NumberFormats
        locale = uno_locale()
        for r, row in enumerate(rows):
            for c, item in enumerate(row):
                cell = self.sheet.getCellByPosition(start.Column + c, start.Row + r)
                if item is None:
                    continue
                if isinstance(item, Date):
                    cell.setValue(item.serial)
                    cell.NumberFormat = formats.getStandardFormat(DATE, locale)
                elif isinstance(item, Percent):
                    cell.setValue(item.value)
                    cell.NumberFormat = formats.getStandardFormat(PERCENT, locale)
                elif isinstance(item, str) and item.startswith("="):
                    cell.setFormula(item)
                elif isinstance(item, str):
                    cell.setString(item)
                else:
                    cell.setValue(float(item))

    def assert_expected(self, case, cell, check_text):
        kind = case.expect[0]
        code = cell.getError()
        where = f"{case.name}: {case.formula}"
        if kind == "error":
            self.assertEqual(code, case.expect[1], f"{where} shows {code or cell.getString()!r}")
        elif kind == "value":
            self.assertEqual(code, 0, f"{where} shows error {code}")
            self.assertClose(cell.getValue(), case.expect[1], case.expect[2], where)
        elif kind == "same":
            self.assertEqual(code, 0, f"{where} shows error {code}")
            other = self.enter("H50", case.expect[1], None)
            self.assertEqual(other.getError(), 0, f"{case.expect[1]} shows error {other.getError()}")
            self.assertClose(cell.getValue(), other.getValue() * case.expect[2], case.expect[3], where)
        elif kind == "satisfies":
            self.assertEqual(code, 0, f"{where} shows error {code}")
            self.assertTrue(case.expect[1](cell.getValue()), f"{where}: {cell.getValue()!r} is not {case.expect[2]}")
        else:  # text
            self.assertEqual(code, 0, f"{where} shows error {code}")
            self.assertIn(case.expect[1], cell.getString(), where)
        if case.check is not None:
            self.assertTrue(check_text and not check_text.startswith("Err:"), f"{case.check} gave {check_text!r}")
            for words in ([case.words] if isinstance(case.words, str) else case.words or []):
                self.assertIn(words, check_text, f"{where}: ASSOC.CHECK")

    def assert_office_still_works(self):
        self.assertIsNone(session.office.process.poll(), "the office has ended")
        table = self.put(PARTY, column=27)  # AB1:AE3
        self.assertClose(self.number("AG1", f"=ASSOC.STATISTIC({table})"), REFERENCE["party"]["pearson"][0],
                         what="Agresti's X² after the case (scipy chi2_contingency)")
        self.sheet.getCellRangeByName("AB1:AG3").clearContents(0xFFFF)


def at(rows, corner="A1"):
    return {corner: rows}


class TheCasesOfIssue9(Battery):
    """Every input issue 9 lists: each now gives the true value (mpmath, statsmodels or an exact identity)
    or an error that ASSOC.CHECK explains, and CHECK's words say which."""

    def test_give_the_true_value_or_an_explained_error(self):
        exact, strata, wide = EXTREMES["exact"], EXTREMES["strata"], EXTREMES["wide_table"]
        tiny, subnormal = BAD_INPUT["homogeneity_tiny_count"], BAD_INPUT["strata_subnormal"]
        self.run_cases([
            Case("2×2 exact with a total near 2^32", at(exact["froze_calc"]["table"]), "=ASSOC.EXACT(A1:B2)",
                 value(exact["froze_calc"]["two_sided"]), '=ASSOC.CHECK(A1:B2; "exact")',
                 "ASSOC.EXACT can be used on this table."),
            Case("exact p-value through PVALUE, 1e9 against 4", at(exact["billion_beside_small"]["table"]),
                 '=ASSOC.PVALUE(A1:B2; "exact")', value(exact["billion_beside_small"]["two_sided"]),
                 '=ASSOC.CHECK(A1:B2; "pvalue")', "ASSOC.PVALUE can be used on this table."),
            Case("report of 1e9 against 4", at(exact["billion_beside_small"]["table"]),
                 "=ASSOC.REPORT(A1:B2)", value(exact["billion_beside_small"]["two_sided"]), "=ASSOC.CHECK(A1:B2)",
                 "Doubtful: the smallest expected count is 1.32e-07", array="H1:I22", pick=(10, 1)),  # p, exact test
            # p = 0: the statistic (7.2e15, mpmath) is far beyond where the chi-squared tail underflows.
            Case("homogeneity with 1e17", at(strata["homogeneity_1e17"]["cells"]), "=ASSOC.HOMOGENEITY(A1:D2)",
                 value(strata["homogeneity_1e17"]["homogeneity_statistic"]), '=ASSOC.CHECK(A1:D2; "homogeneity")',
                 "ASSOC.HOMOGENEITY can be used on this range.", array="H1:J1", pick=(0, 1)),
            Case("homogeneity with 1e120", at([[1e120, 1, 1, 1e120], [5, 6, 7, 8]]), "=ASSOC.HOMOGENEITY(A1:D2)",
                 value(0), '=ASSOC.CHECK(A1:D2; "homogeneity")', "ASSOC.HOMOGENEITY can be used on this range.",
                 array="H1:J1"),
            Case("strata with 1e80", at(strata["strata_1e80"]["cells"]), "=ASSOC.STRATA(A1:D2)",
                 value(strata["strata_1e80"]["mh_statistic"]), '=ASSOC.CHECK(A1:D2; "strata")',
                 "ASSOC.STRATA can be used on this range.", array="H1:L1", pick=(0, 1)),
            # Exact identity: the Mantel–Haenszel ratio Σ(ad/n)/Σ(bc/n) is (1e154/2e77 + 40/26)/(1/2e77 + 42/26),
            # 5e76·26/42 to 17 digits.
            Case("strata with 1e77", at([[1e77, 1, 1, 1e77], [5, 6, 7, 8]]), "=ASSOC.STRATA(A1:D2)",
                 value(5e76 * 26 / 42), '=ASSOC.CHECK(A1:D2; "strata")', "ASSOC.STRATA can be used on this range.",
                 array="H1:L1", pick=(0, 2)),
            Case("X² of [[2,0],[1,1e308]]", at([[2, 0], [1, 1e308]]), "=ASSOC.STATISTIC(A1:B2)",
                 value(wide["pearson"]),
                 "=ASSOC.CHECK(A1:B2)", "Doubtful: the smallest expected count is 6e-308"),
            Case("p-value of [[2,0],[1,1e308]]", at([[2, 0], [1, 1e308]]), "=ASSOC.PVALUE(A1:B2)", value(0),
                 '=ASSOC.CHECK(A1:B2; "pvalue")', "ASSOC.PVALUE can be used on this table."),
            Case("V of [[2,0],[1,1e308]]", at([[2, 0], [1, 1e308]]), "=ASSOC.STRENGTH(A1:B2)", value(wide["cramers_v"]),
                 '=ASSOC.CHECK(A1:B2; "strength")', "ASSOC.STRENGTH can be used on this table."),
            Case("V's interval of [[2,0],[1,1e308]]", at([[2, 0], [1, 1e308]]), "=ASSOC.VINTERVAL(A1:B2)",
                 value(wide["cramers_v"]), '=ASSOC.CHECK(A1:B2; "vinterval")',
                 "ASSOC.VINTERVAL can be used on this table.", array="H1:J1"),
            # The table's Pearson residual (2 − E)/√E with E = 6e-308 equals √X², the adjusted residual (mpmath).
            Case("residuals of [[2,0],[1,1e308]]", at([[2, 0], [1, 1e308]]), "=ASSOC.RESIDUALS(A1:B2)",
                 value(wide["adjusted"][0][0]), '=ASSOC.CHECK(A1:B2; "residuals")',
                 "ASSOC.RESIDUALS can be used on this table.", array="H1:I2"),
            Case("fit of 28, 2^53, 1, 1e300", at([[28, 2 ** 53, 1, 1e300]]), "=ASSOC.FIT(A1:D1)",
                 value(EXTREMES["fit_extreme_statistic"]), '=ASSOC.CHECK(A1:D1; "fit")',
                 "ASSOC.FIT can be used on this range.", array="H1:J1", pick=(0, 1)),
            # 1.8e308 is past the largest double: the cell holds infinity (calc_extremes.py checks 1.7e308).
            Case("paired with 1.8e308", at([[1.8e308, 1], [2, 3]]), "=ASSOC.PAIRED(A1:B2)", error(),
                 '=ASSOC.CHECK(A1:B2; "paired")',
                 "ASSOC.PAIRED cannot be used here: row 1, column 1 holds an infinite value; counts must be "
                 "ordinary numbers."),
            Case("homogeneity with a count of 1e-10", at(tiny["cells"]), "=ASSOC.HOMOGENEITY(A1:D2)",
                 value(tiny["p"], 1e-9), '=ASSOC.CHECK(A1:D2; "homogeneity")',
                 "ASSOC.HOMOGENEITY can be used on this range."),
            Case("strata with subnormal counts", at(subnormal["cells"]), "=ASSOC.STRATA(A1:D2)",
                 value(subnormal["p"], 1e-9), '=ASSOC.CHECK(A1:D2; "strata")',
                 "ASSOC.STRATA can be used on this range."),
            Case("report at counts of 1e15", at([[1e15, 2], [3, 1e15]]), "=ASSOC.REPORT(A1:B2)", value(2e15 + 5, 0),
                 "=ASSOC.CHECK(A1:B2)", "Sound: the smallest expected count is 5e+14", array="H1:I22", pick=(0, 1)),
        ])


class ErrorCells(Battery):
    """Calc does not call an add-in with an error in a range argument: it shows Err:504 (a fact of the
    host; ASSOC.CHECK cannot see such a range either). An error in a single argument is passed on."""

    def test_in_a_range_stop_calc_before_assoc_is_called(self):
        self.run_cases([
            Case("#DIV/0! in a table", at([[12, "=1/0"], [3, 9]]), "=ASSOC.PVALUE(A1:B2)", error(ERR_PARAMETER_LIST),
                 None),
            Case("#N/A in a table", at([[12, "=NA()"], [3, 9]]), "=ASSOC.STATISTIC(A1:B2)", error(ERR_PARAMETER_LIST)),
            Case("#VALUE! in record labels", at([["a", "x"], ['=1+"a"', "y"], ["b", "x"]]),
                 "=ASSOC.COUNTS(A1:A3; B1:B3)",
                 error(ERR_PARAMETER_LIST), array="H1:I2"),
            Case("an error cell seen by ASSOC.CHECK", at([[12, "=1/0"], [3, 9]]), "=ASSOC.CHECK(A1:B2)",
                 error(ERR_PARAMETER_LIST)),
        ])

    def test_in_a_single_argument_are_passed_on(self):
        self.run_cases([
            Case("#DIV/0! as alpha", None, "=ASSOC.CRITICAL(2; 1/0)", error(ERR_DIV0)),
            Case("#N/A as n", None, "=ASSOC.POWER(0.3; NA(); 1)", error(ERR_NA)),
        ])


class BooleansAndDates(Battery):
    """Calc hands a range over as plain numbers: TRUE is 1, FALSE 0, a date its serial number (days
    since 1899-12-30), whatever the cell's format. Assoc reads them as those numbers; ASSOC.CHECK says so
    where a first row or column rises through years or dates, and cannot tell a boolean from a typed 1 or 0."""

    def test_are_read_as_the_numbers_calc_stores(self):
        self.run_cases([
            Case("TRUE among counts", at([[12, "=TRUE()"], [3, 9]]), "=ASSOC.PVALUE(A1:B2)",
                 same_as("=ASSOC.PVALUE({12;1|3;9})"), "=ASSOC.CHECK(A1:B2)", "Doubtful"),
            Case("FALSE among counts", at([[12, "=FALSE()"], [3, 9]]), "=ASSOC.STATISTIC(A1:B2)",
                 same_as("=ASSOC.STATISTIC({12;0|3;9})")),
            Case("a comparison's result among counts", at([[12, "=1>0"], [3, 9]]), "=ASSOC.DF(A1:B2)", value(1)),
            Case("TRUE as an option word", at(THREE), "=ASSOC.STATISTIC(A1:C3; TRUE())", error(),
                 "=ASSOC.CHECK(A1:C3; TRUE())", "The second argument must be an option word"),
            Case("TRUE as alpha", None, "=ASSOC.CRITICAL(2; TRUE())", error(), "=ASSOC.CHECK({2;1}; \"critical\")",
                 "alpha"),
            Case("TRUE and FALSE as labels", at([["=TRUE()"], ["=FALSE()"], ["=TRUE()"]]), "=ASSOC.LEVELS(A1:A3)",
                 value(0), array="H1:H2"),
            Case("a date among counts", at([[12, Date(45292)], [3, 9]]), "=ASSOC.STATISTIC(A1:B2)",
                 same_as("=ASSOC.STATISTIC({12;45292|3;9})")),
            Case("dates as record labels", at([[Date(45292), "Yes"], [Date(45293), "No"], [Date(45292), "No"]]),
                 "=ASSOC.LEVELS(A1:A3)", value(45292), array="H1:H2"),
            # The dates arrive as 45292, 45323, 45352 and are read as counts; CHECK says they look like dates.
            Case("a header row of dates", at([[Date(45292), Date(45323), Date(45352)], [4, 5, 6], [7, 8, 9]]),
                 "=ASSOC.DF(A1:C3)", value(4), "=ASSOC.CHECK(A1:C3)",
                 "Row 1 holds whole numbers that look like dates (a spreadsheet stores a date as its day count: "
                 "45,292 is 1 January 2024), and they were read as counts"),
            Case("a header row of years", at([[2021, 2022, 2023], [4, 5, 6], [7, 8, 9]]), "=ASSOC.DF(A1:C3)",
                 value(4), "=ASSOC.CHECK(A1:C3)", "Row 1 holds whole numbers that look like years"),
            Case("a percent-formatted count", at([[Percent(0.5), 2], [3, 4]]), "=ASSOC.EXACT(A1:B2)", error(),
                 '=ASSOC.CHECK(A1:B2; "exact")'),
        ])


class WholeColumnsAndRows(Battery):
    """Whole-column and whole-row references pass 1,048,576 rows or 16,384 columns to the add-in."""

    def test_read_the_table_they_hold_or_say_why_not(self):
        party = at(PARTY)
        records = at(RECORDS)
        self.run_cases([
            Case("p-value over A:D", party, "=ASSOC.PVALUE(A:D)", same_as("=ASSOC.PVALUE(A1:D3)")),
            Case("expected counts over A:D", party, "=ASSOC.EXPECTED(A:D)", same_as("=ASSOC.EXPECTED(A1:D3)"),
                 array="H1:J2"),
            Case("p-value over rows 1:3", party, "=ASSOC.PVALUE(1:3)", same_as("=ASSOC.PVALUE(A1:D3)"), cell="A20"),
            Case("counts over A:A and B:B", records, "=ASSOC.COUNTS(A:A; B:B)",
                 same_as("=ASSOC.COUNTS(A1:A6; B1:B6)"), array="H1:I3"),
            Case("levels over A:A", records, "=ASSOC.LEVELS(A:A)", text("East"), array="H1:H3"),
            Case("fit over A:A", at([[18], [22], [20], [25]]), "=ASSOC.FIT(A:A)", same_as("=ASSOC.FIT(A1:A4)")),
            Case("strata over A:D", at(STRATA), "=ASSOC.STRATA(A:D)", same_as("=ASSOC.STRATA(A1:D3)")),
            Case("check over A:D", party, "=ASSOC.CHECK(A:D)", text("Sound")),
            Case("a whole column of blanks", None, "=ASSOC.PVALUE(Z:Z)", error(), "=ASSOC.CHECK(Z:Z)",
                 "the range is empty"),
            Case("a whole row of blanks", None, "=ASSOC.STATISTIC(40:40)", error(), "=ASSOC.CHECK(40:40)",
                 "a test of association needs at least 2 rows and 2 columns with counts"),
            # Read as a third row of counts (5, 0); the blank rows between are set aside and CHECK says so.
            Case("a table with a stray number far below", {"A1": TEAMS, "A100000": [[5]]}, "=ASSOC.PVALUE(A:B)",
                 value(BAD_INPUT["stray_row"]["p"], 1e-9), "=ASSOC.CHECK(A:B)",
                 ["199,995 blank cells were read as 0", "Rows 3–99,999 have no counts and were set aside."]),
        ])


class InlineArrays(Battery):
    def test_are_read_like_ranges(self):
        self.run_cases([
            Case("p-value of an inline 2×2", at(TEAMS), "=ASSOC.PVALUE({18;7|9;16})", same_as("=ASSOC.PVALUE(A1:B2)")),
            # published_values.md section 2: Fisher's tea tasting, two-sided p = 34/70.
            Case("exact test of an inline table", None, "=ASSOC.EXACT({3;1|1;3})", value(34 / 70)),
            Case("an inline row", None, "=ASSOC.STATISTIC({1;2;3})", error(), "=ASSOC.CHECK({1;2;3})",
                 "only 1 row with counts"),
            Case("an inline array with text", None, '=ASSOC.PVALUE({1;"x"|3;4})', error(), '=ASSOC.CHECK({1;"x"|3;4})',
                 'holds the text "x"'),
            # In an inline array ";" separates columns and "|" rows: three records (a, x), (b, y), (a, y).
            Case("inline labels for counts", None, '=ASSOC.COUNTS({"a";"b";"a"}; {"x";"y";"y"})', value(1),
                 array="H1:I2"),
            Case("inline labels for levels", None, '=ASSOC.LEVELS({"b";"a";"b"})', text("a"), array="H1:H2"),
            Case("inline groups for impact", None, "=ASSOC.IMPACT({5;3}; {10;10})", value(0.5), array="H1:J2"),
            Case("an inline array as alpha", None, "=ASSOC.CRITICAL(2; {0.05;0.01})", error(),
                 '=ASSOC.CHECK({2;0.05;0.01}; "critical")', "in one row or column (1 to 2 numbers)"),
        ])


class SmallShapes(Battery):
    """1×1, 1×n and n×1 ranges where a function needs more."""

    def test_are_refused_with_words(self):
        self.run_cases([
            Case("a single cell as a table", at([[5]]), "=ASSOC.PVALUE(A1)", error(), "=ASSOC.CHECK(A1)",
                 "only 1 row with counts"),
            Case("one row as a table", at([[4, 5, 6]]), "=ASSOC.DF(A1:C1)", error(), "=ASSOC.CHECK(A1:C1)",
                 "only 1 row with counts"),
            Case("one column as a table", at([[4], [5], [6]]), "=ASSOC.EXPECTED(A1:A3)", error(), "=ASSOC.CHECK(A1:A3)",
                 "only 1 column with counts", array="H1:H3"),
            Case("one category to fit", at([[5]]), "=ASSOC.FIT(A1)", error(), '=ASSOC.CHECK(A1; "fit")',
                 "at least 2 categories"),
            Case("a 1×1 paired table", at([[5]]), "=ASSOC.PAIRED(A1)", error(), '=ASSOC.CHECK(A1; "paired")'),
            Case("one row for a trend", at([[1, 2, 3]]), "=ASSOC.TREND(A1:C1)", error(),
                 '=ASSOC.CHECK(A1:C1; "trend")'),
            Case("one stratum", at([[12, 5, 7, 9]]), "=ASSOC.STRATA(A1:D1)", error(), '=ASSOC.CHECK(A1:D1; "strata")',
                 "at least 2 strata"),
            Case("one group for impact", at([[5, 10]]), "=ASSOC.IMPACT(A1; B1)", error(),
                 '=ASSOC.CHECK(A1:B1; "impact")',
                 "at least 2 groups", array="H1:J1"),
            Case("one row of rates", at([[5, 5]]), "=ASSOC.RATES(A1:B1)", value(10), '=ASSOC.CHECK(A1:B1; "rates")',
                 "ASSOC.RATES can be used on this range", array="H1:K1"),
            Case("one row for a rate difference", at([[5, 5]]), "=ASSOC.RATEDIFF(A1:B1)", error(),
                 '=ASSOC.CHECK(A1:B1; "ratediff")'),
            Case("one row for the ordinal test", at([[1, 2, 3]]), "=ASSOC.ORDINAL(A1:C1)", error(),
                 '=ASSOC.CHECK(A1:C1; "ordinal")'),
            Case("one occasion of answers", at([[1], [0], [1]]), "=ASSOC.REPEATED(A1:A3)", error(),
                 '=ASSOC.CHECK(A1:A3; "repeated")', "at least 2 occasions"),
            Case("one row of strata in long form", at([["A", "x", 3]]), "=ASSOC.WITHIN(A1:C1)", error(),
                 '=ASSOC.CHECK(A1:C1; "within")'),
            Case("a single cell for the report", at([[5]]), "=ASSOC.REPORT(A1)", error(), "=ASSOC.CHECK(A1)",
                 array="H1:I22"),
            Case("a single label", at([["North"]]), "=ASSOC.LEVELS(A1)", text("North")),
            Case("a single record", at([["North", "Yes"]]), "=ASSOC.COUNTS(A1; B1)", value(1)),
            Case("V's interval of one row", at([[4, 5, 6]]), "=ASSOC.VINTERVAL(A1:C1)", error(),
                 '=ASSOC.CHECK(A1:C1; "vinterval")', "only 1 row with counts", array="H1:J1"),
            Case("pairwise with one row", at([[4, 5, 6]]), "=ASSOC.PAIRWISE(A1:C1)", error(),
                 '=ASSOC.CHECK(A1:C1; "pairwise")', array="H1:K1"),
        ])


class CountsFromTinyToHuge(Battery):
    """Counts from 1e-300 to 1e308. Scaling every count by k multiplies X² by k (an identity)."""

    def test_give_a_number_or_an_explained_error(self):
        scaled = lambda k: [[v * k for v in row] for row in THREE]  # noqa: E731
        self.run_cases([
            Case("counts of 1e-300", at(scaled(1e-300)), "=ASSOC.STATISTIC(A1:C3)",
                 same_as("=ASSOC.STATISTIC({10;20;30|20;20;20|30;20;10})", 1e-300, 1e-10), "=ASSOC.CHECK(A1:C3)",
                 "Doubtful: Some counts are not whole numbers (weighted data)"),
            Case("counts of 1e-5", at(scaled(1e-5)), "=ASSOC.STATISTIC(A1:C3)",
                 same_as("=ASSOC.STATISTIC({10;20;30|20;20;20|30;20;10})", 1e-5, 1e-10)),
            Case("counts of 1e12", at(scaled(1e12)), "=ASSOC.STATISTIC(A1:C3)",
                 same_as("=ASSOC.STATISTIC({10;20;30|20;20;20|30;20;10})", 1e12, 1e-10)),
            Case("counts of 1e200", at(scaled(1e200)), "=ASSOC.STATISTIC(A1:C3)",
                 same_as("=ASSOC.STATISTIC({10;20;30|20;20;20|30;20;10})", 1e200, 1e-10), "=ASSOC.CHECK(A1:C3)",
                 "Sound: the smallest expected count is 2e+201"),
            # X² = n(ad − bc)²/(R₁R₂C₁C₂) ≈ 2.5e307: its p-value underflows to 0; the last cell expects
            # 4/(1e308 + 3).
            Case("one count of 1e308", at([[1e308, 1], [1, 1]]), "=ASSOC.PVALUE(A1:B2)", value(0),
                 "=ASSOC.CHECK(A1:B2)", "Doubtful: the smallest expected count is 4e-308"),
            # The ratio is 1e-300, but √(1/a) = 1e150 puts its limits at 0 and infinity.
            Case("odds ratio with 1e-300", at([[1e-300, 1], [1, 1]]), "=ASSOC.ODDSRATIO(A1:B2)", error(),
                 '=ASSOC.CHECK(A1:B2; "oddsratio")',
                 "ASSOC.ODDSRATIO cannot be used here: the ratio or its confidence limits are too large or too small "
                 "for a spreadsheet number with these counts."),
            Case("fractional counts for the exact test", at([[2.5, 1], [1, 3]]), "=ASSOC.EXACT(A1:B2)", error(),
                 '=ASSOC.CHECK(A1:B2; "exact")',
                 "the exact test needs whole counts; this table holds counts that are not whole numbers"),
            Case("a simulation beyond 1e9 counts", at([[1e9, 1], [1, 1e9]]), "=ASSOC.SIMULATE(A1:B2)", error(),
                 '=ASSOC.CHECK(A1:B2; "simulate")', "the simulated p-value takes tables of up to 1,000,000,000"),
            Case("a negative count", at([[4, 7], [2, -1]]), "=ASSOC.PVALUE(A1:B2)", error(), "=ASSOC.CHECK(A1:B2)",
                 "row 2, column 2 holds the number -1; counts cannot be negative"),
            Case("a count of 1e-300 beside ordinary ones", at(BAD_INPUT["tiny_beside_ordinary"]["cells"]),
                 "=ASSOC.PVALUE(A1:B2)", value(BAD_INPUT["tiny_beside_ordinary"]["p"], 1e-9), "=ASSOC.CHECK(A1:B2)",
                 "Doubtful: Some counts are not whole numbers (weighted data)"),
        ])


def unknown(word, nearest=None):
    """ASSOC.CHECK's words for a word it does not know (check.cpp: unknown_word)."""
    said = f'"{word}" is not an option word or the name of an ASSOC function; '
    return said + (f'did you mean "{nearest}"?' if nearest else
                   "the words and names are listed in the Function Wizard and in functions.md.")


class OptionWords(Battery):
    """Every option word misspelled, or given blank."""

    def test_misspelled_are_refused_and_check_lists_the_words(self):
        # ASSOC.CHECK names the word and the nearest words it knows, or where the words are listed.
        self.run_cases([
            Case("statistic 'pearsn'", at(THREE), '=ASSOC.STATISTIC(A1:C3; "pearsn")', error(),
                 '=ASSOC.CHECK(A1:C3; "pearsn")', unknown('pearsn', 'pearson')),
            Case("p-value 'exactt'", at(THREE), '=ASSOC.PVALUE(A1:C3; "exactt")', error(),
                 '=ASSOC.CHECK(A1:C3; "exactt")', unknown('exactt', 'exact')),
            Case("residuals 'studentized'", at(THREE), '=ASSOC.RESIDUALS(A1:C3; "studentized")', error(),
                 '=ASSOC.CHECK(A1:C3; "studentized")', unknown('studentized'), array="H1:J3"),
            Case("strength 'cramers'", at(THREE), '=ASSOC.STRENGTH(A1:C3; "cramers")', error(),
                 '=ASSOC.CHECK(A1:C3; "cramers")', unknown('cramers', 'cramer')),
            Case("exact 'both'", at(TEAMS), '=ASSOC.EXACT(A1:B2; "both")', error(), '=ASSOC.CHECK(A1:B2; "both")',
                 unknown('both')),
            Case("simulate 'fisher'", at(TEAMS), '=ASSOC.SIMULATE(A1:B2; ; ; "fisher")', error(),
                 '=ASSOC.CHECK(A1:B2; "fisher")', unknown('fisher')),
            Case("simulate 'yates'", at(TEAMS), '=ASSOC.SIMULATE(A1:B2; ; ; "yates")', error(),
                 '=ASSOC.CHECK(A1:B2; "yates")'),
            Case("celltest 'holms'", at(THREE), '=ASSOC.CELLTEST(A1:C3; "holms")', error(),
                 '=ASSOC.CHECK(A1:C3; "holms")', unknown('holms', 'holm'), array="H1:J3"),
            Case("counts 'random'", at(RECORDS), '=ASSOC.COUNTS(A1:A6; B1:B6; ; "random")', error(),
                 '=ASSOC.CHECK(A1:B6; "random")', unknown('random'), array="H1:I3"),
            Case("levels 'alphabetical'", at(RECORDS), '=ASSOC.LEVELS(A1:A6; "alphabetical")', error(),
                 '=ASSOC.CHECK(A1:A6; "alphabetical")', unknown('alphabetical'), array="H1:H3"),
            Case("strata 'continuity'", at(STRATA), '=ASSOC.STRATA(A1:D3; "continuity")', error(),
                 '=ASSOC.CHECK(A1:D3; "continuity")', unknown('continuity')),
            Case("paired 'mcnemar'", at(TEAMS), '=ASSOC.PAIRED(A1:B2; "mcnemar")', error(),
                 '=ASSOC.CHECK(A1:B2; "mcnemar")', unknown('mcnemar')),
            Case("pairwise 'fisher'", at(THREE), '=ASSOC.PAIRWISE(A1:C3; "holm"; "fisher")', error(),
                 '=ASSOC.CHECK(A1:C3; "fisher")', unknown('fisher'), array="H1:K3"),
            Case("check 'nonsense'", at(THREE), '=ASSOC.CHECK(A1:C3; "nonsense")', text('"nonsense"')),
            Case("repeated with a yes label nobody gave", at([["Yes", "No"], ["No", "No"]]),
                 '=ASSOC.REPEATED(A1:B2; "Ja")', error(), '=ASSOC.CHECK(A1:B2; "repeated")'),
        ])

    def test_blank_or_empty_say_to_leave_the_argument_out(self):
        self.run_cases([
            Case("statistic with a blank cell as its word", at(THREE), "=ASSOC.STATISTIC(A1:C3; Z9)", error(),
                 "=ASSOC.CHECK(A1:C3; Z9)", "The second argument must be an option word"),
            Case("statistic with an empty text as its word", at(THREE), '=ASSOC.STATISTIC(A1:C3; "")',
                 same_as("=ASSOC.STATISTIC(A1:C3)")),
            Case("p-value with a space as its word", at(THREE), '=ASSOC.PVALUE(A1:C3; " ")',
                 same_as("=ASSOC.PVALUE(A1:C3)"), '=ASSOC.CHECK(A1:C3; " ")', "Sound: the smallest expected"),
            Case("residuals with a word in capitals and spaces", at(THREE), '=ASSOC.RESIDUALS(A1:C3; " Adjusted ")',
                 same_as('=ASSOC.RESIDUALS(A1:C3; "adjusted")'), array="H1:J3"),
            Case("check with an empty word", at(THREE), '=ASSOC.CHECK(A1:C3; "")',
                 text("Sound: the smallest expected")),
        ])


class NumberArguments(Battery):
    """Every number argument at and beyond its bounds."""

    def test_at_their_bounds_give_values(self):
        self.run_cases([
            # Identity: chi-squared with 1 df is Z², so its upper 5% point is the normal 97.5% point squared
            # (NIST/SEMATECH e-Handbook 1.3.6.7.4 prints 3.841).
            Case("critical value, df 1", None, "=ASSOC.CRITICAL(1; 0.05)",
                 value(NormalDist().inv_cdf(0.975) ** 2, 1e-12)),
            # Wilson & Hilferty (1931), PNAS 17:684: ν(1 − 2/(9ν) + z√(2/(9ν)))³; far below 1e-9 off at 1e10 df.
            Case("critical value at the df cap", None, "=ASSOC.CRITICAL(10000000000; 0.05)",
                 value(1e10 * (1 - 2 / 9e10 + NormalDist().inv_cdf(0.95) * math.sqrt(2 / 9e10)) ** 3, 1e-9)),
            Case("critical value, alpha 1e-300", None, "=ASSOC.CRITICAL(2; 1e-300)",
                 value(-2 * math.log(1e-300), 1e-12)),  # exact: for 2 df, P(X ≥ c) = e^(−c/2)
            # A simulated p-value is (1 + k)/(trials + 1) for a whole k: checked as such, not for its value.
            Case("simulation with 100 trials", at(TEAMS), "=ASSOC.SIMULATE(A1:B2; 100)", simulated(100)),
            Case("simulation with the largest seed", at(TEAMS), "=ASSOC.SIMULATE(A1:B2; 1000; 4294967295)",
                 simulated(1000)),
            Case("impact at threshold 1", at([[5, 3], [10, 10]]), "=ASSOC.IMPACT(A1:B1; A2:B2; 1)", value(0.5),
                 array="H1:J2"),
            Case("power at w = 0", None, "=ASSOC.POWER(0; 100; 1)", value(0.05, 1e-9)),  # no effect: power is alpha
            Case("power with n of 1e300", None, "=ASSOC.POWER(0.3; 1e300; 2)", value(1)),  # miss below e^-750
            Case("confidence 0.999999 for the odds ratio", at(TEAMS), "=ASSOC.ODDSRATIO(A1:B2; 0.999999)",
                 same_as("=ASSOC.ODDSRATIO(A1:B2)")),
        ])

    def test_beyond_their_bounds_are_refused_with_words(self):
        self.run_cases([
            Case("critical value, df 0", None, "=ASSOC.CRITICAL(0; 0.05)", error(),
                 '=ASSOC.CHECK({0;0.05}; "critical")'),
            Case("critical value, df above the cap", None, "=ASSOC.CRITICAL(10000000001; 0.05)", error(),
                 '=ASSOC.CHECK({10000000001;0.05}; "critical")',
                 "the degrees of freedom must be at most 10,000,000,000"),
            Case("critical value, alpha 0", None, "=ASSOC.CRITICAL(2; 0)", error(), '=ASSOC.CHECK({2;0}; "critical")'),
            Case("critical value, alpha 1", None, "=ASSOC.CRITICAL(2; 1)", error(), '=ASSOC.CHECK({2;1}; "critical")'),
            Case("critical value, df as text", None, '=ASSOC.CRITICAL("two")', error()),
            Case("odds ratio, confidence 1", at(TEAMS), "=ASSOC.ODDSRATIO(A1:B2; 1)", error(),
                 '=ASSOC.CHECK(A1:B2; "oddsratio")'),
            Case("risk ratio, confidence -0.5", at(TEAMS), "=ASSOC.RISKRATIO(A1:B2; -0.5)", error()),
            Case("simulation with 99 trials", at(TEAMS), "=ASSOC.SIMULATE(A1:B2; 99)", error()),
            Case("simulation with 10,000,001 trials", at(TEAMS), "=ASSOC.SIMULATE(A1:B2; 10000001)", error()),
            Case("simulation with 100.5 trials", at(TEAMS), "=ASSOC.SIMULATE(A1:B2; 100.5)", error()),
            Case("simulation with seed -1", at(TEAMS), "=ASSOC.SIMULATE(A1:B2; 1000; -1)", error()),
            Case("simulation with seed 2^32", at(TEAMS), "=ASSOC.SIMULATE(A1:B2; 1000; 4294967296)", error()),
            Case("fit with too many estimated parameters", at([[18, 22, 20]]), "=ASSOC.FIT(A1:C1; ; 2)", error(),
                 '=ASSOC.CHECK(A1:C1; "fit")'),
            Case("fit with -1 estimated parameters", at([[18, 22, 20]]), "=ASSOC.FIT(A1:C1; ; -1)", error()),
            Case("power with w below 0", None, "=ASSOC.POWER(-0.1; 100; 1)", error(),
                 '=ASSOC.CHECK({-0.1;100;1}; "power")'),
            Case("power with n of 0", None, "=ASSOC.POWER(0.3; 0; 1)", error()),
            Case("power with df 1.5", None, "=ASSOC.POWER(0.3; 100; 1.5)", error()),
            Case("power with df above 1e6", None, "=ASSOC.POWER(0.3; 100; 1000001)", error()),
            Case("sample size for a power at alpha", None, "=ASSOC.SAMPLESIZE(0.3; 0.05; 1)", error(),
                 '=ASSOC.CHECK({0.3;0.05;1}; "samplesize")'),
            Case("sample size for a power of 1", None, "=ASSOC.SAMPLESIZE(0.3; 1; 1)", error()),
            Case("sample size beyond 1e12", None, "=ASSOC.SAMPLESIZE(1e-7; 0.8; 1)", error(),
                 '=ASSOC.CHECK({1e-7;0.8;1}; "samplesize")'),
            Case("sample size for w typed as a percentage", None, "=ASSOC.SAMPLESIZE(30; 0.8; 1)", error(),
                 '=ASSOC.CHECK({30;0.8;1}; "samplesize")'),
            Case("impact threshold 0", at([[5, 3], [10, 10]]), "=ASSOC.IMPACT(A1:B1; A2:B2; 0)", error(),
                 array="H1:J2"),
            Case("impact threshold 1.01", at([[5, 3], [10, 10]]), "=ASSOC.IMPACT(A1:B1; A2:B2; 1.01)", error(),
                 array="H1:J2"),
            Case("rates at confidence 1", at(TEAMS), "=ASSOC.RATES(A1:B2; 1)", error(), array="H1:K2"),
            Case("rate difference at confidence 0", at(TEAMS), "=ASSOC.RATEDIFF(A1:B2; 0)", error()),
            Case("V's interval at confidence 1", at(THREE), "=ASSOC.VINTERVAL(A1:C3; 1)", error(), array="H1:J1"),
            Case("common risk ratio at confidence 2", at(STRATA), "=ASSOC.STRATARISK(A1:D3; 2)", error()),
            Case("report at alpha 0", at(THREE), "=ASSOC.REPORT(A1:C3; 0)", error(), array="H1:I22"),
            Case("report at alpha 1", at(THREE), "=ASSOC.REPORT(A1:C3; 1)", error(), array="H1:I22"),
        ])


DATE = PERCENT = None


def uno_locale():
    from com.sun.star.lang import Locale
    return Locale("en", "US", "")


def number_format_types():
    import uno
    global DATE, PERCENT
    DATE = uno.getConstantByName("com.sun.star.util.NumberFormat.DATE")
    PERCENT = uno.getConstantByName("com.sun.star.util.NumberFormat.PERCENT")


if __name__ == "__main__":
    number_format_types()
    run_harness(__doc__)
