#!/usr/bin/python3
"""How Calc spreads an array result over a range larger than the result, as docs/guide.md
("Array ranges larger than the result") and docs/functions.md state it: #N/A in the extra cells,
except that a result of one row is repeated down every row, a result of one column across every
column, and a single value in every cell; Calc's own array functions behave the same way.

Expected values: the shapes are the convention under test; the numbers are those of the 3×3 table
below, whose X² = 20 on 4 degrees of freedom is exact arithmetic (every expected count is 20).
Run by CTest as calc.array_spread_in_headless_calc (see tests/calc/CMakeLists.txt).
"""

from calc_support import THREE_BY_THREE, CalcTestCase, run_harness

NA = 32767  # the error code of #N/A
TEXT_RESULT = 2  # com.sun.star.sheet.FormulaResult.STRING


class ArraySpread(CalcTestCase):
    def block(self, cells, formula):
        """The values of an array formula's cells, with "#N/A" where a cell shows that error."""
        block = self.array_formula(cells, formula)
        rows = []
        for r in range(block.Rows.Count):
            row = []
            for c in range(block.Columns.Count):
                cell = block.getCellByPosition(c, r)
                error = cell.getError()
                self.assertIn(error, (0, NA), f"{formula}: cell ({r}, {c}) shows error {error}")
                row.append("#N/A" if error == NA else
                           cell.getString() if cell.FormulaResultType2 == TEXT_RESULT else cell.getValue())
            rows.append(row)
        return rows

    def test_repeats_a_one_row_result_down_the_extra_rows_and_fills_na_beyond_its_end(self):
        table = self.put(THREE_BY_THREE)
        rows = self.block("E1:I3", f"=ASSOC.STATISTIC({table})")
        statistic, df = rows[0][0], rows[0][1]
        self.assertEqual((statistic, df), (20.0, 4.0))
        for row in rows:
            self.assertEqual(row[:3], rows[0][:3])
            self.assertEqual(row[3:], ["#N/A", "#N/A"])

    def test_repeats_a_one_row_result_entered_down_a_column_instead_of_listing_its_parts(self):
        table = self.put(THREE_BY_THREE)
        self.assertEqual(self.block("E1:E3", f"=ASSOC.STATISTIC({table})"), [[20.0], [20.0], [20.0]])
        listed = self.block("F1:F3", f"=TRANSPOSE(ASSOC.STATISTIC({table}))")
        self.assertEqual([row[0] for row in listed[:2]], [20.0, 4.0])

    def test_repeats_a_one_column_result_across_the_extra_columns(self):
        self.put([["a"], ["b"], ["c"], ["a"]])
        rows = self.block("C1:E5", "=ASSOC.LEVELS(A1:A4)")
        self.assertEqual(rows[:3], [["a"] * 3, ["b"] * 3, ["c"] * 3])
        self.assertEqual(rows[3:], [["#N/A"] * 3] * 2)

    def test_repeats_a_single_value_in_every_cell(self):
        table = self.put(THREE_BY_THREE)
        rows = self.block("E1:F2", f"=ASSOC.DF({table})")
        self.assertEqual(rows, [[4.0, 4.0], [4.0, 4.0]])

    def test_fills_na_around_a_result_of_several_rows_and_columns(self):
        table = self.put(THREE_BY_THREE)
        rows = self.block("E1:H4", f"=ASSOC.EXPECTED({table})")
        self.assertEqual(rows[:3], [[20.0, 20.0, 20.0, "#N/A"]] * 3)
        self.assertEqual(rows[3], ["#N/A"] * 4)

    def test_spreads_the_offices_own_array_functions_the_same_way(self):
        self.put([[1], [2], [3]])
        rows = self.block("C1:E3", "=TRANSPOSE(A1:A3)")
        self.assertEqual(rows, [[1.0, 2.0, 3.0]] * 3)


if __name__ == "__main__":
    run_harness(__doc__)
