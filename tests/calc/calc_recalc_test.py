#!/usr/bin/python3
"""Recalculation in real headless Calc: the add-in remembers the answers of its long computations
(extension/cache/), and a remembered answer must be the one a fresh calculation gives.

    /usr/bin/python3 tests/calc/calc_recalc_test.py --oxt build/extension/assoc.oxt [unittest options]

Exact p-values are checked against R 4.2.2 fisher.test (recalc_values.json, written by
make_recalc_values.py) while cells are edited back and forth and the sheet is recalculated; the
simulation, which has no outside reference, is checked for giving the same value for the same seed
and another value for another seed; a table out of the exact test's reach is refused, with the same
words, every time. No timings are asserted (the speed is measured by bench/calc/recalc_in_calc.py).
"""
import json

from calc_support import HERE, CalcTestCase, run_harness, session

RECALC = json.loads((HERE / "recalc_values.json").read_text())["exact"]
# bench/exact_suite.txt "6x6_n80": invented, far beyond what the exact test can do within its limits.
OUT_OF_REACH = [[1, 0, 1, 1, 0, 1], [5, 3, 4, 4, 3, 1], [1, 4, 6, 2, 2, 1],
                [1, 3, 5, 2, 5, 4], [0, 0, 7, 1, 4, 2], [1, 0, 1, 2, 1, 1]]


class RememberedAnswers(CalcTestCase):
    def recalculate(self):
        session.document.calculateAll()

    def exact_value(self, cell):
        result = self.sheet.getCellRangeByName(cell)
        self.assertEqual(result.getError(), 0, f"{cell} shows error {result.getError()}")
        return result.getValue()

    def test_an_exact_p_value_is_the_same_on_every_hard_recalculation(self):
        table = self.put(RECALC["checks"]["table"])
        first = self.number("G1", f"=ASSOC.EXACT({table})")
        self.assertClose(first, RECALC["checks"]["p"], 1e-10, "first calculation")
        for _ in range(2):
            self.recalculate()
            self.assertEqual(self.exact_value("G1"), first)

    def test_changing_one_count_gives_the_changed_tables_own_p_value_and_changing_it_back_the_first(self):
        table = self.put(RECALC["checks"]["table"])
        self.number("G1", f"=ASSOC.EXACT({table})")
        cell = self.sheet.getCellRangeByName("C3")  # row 3, column 3: 6 → 7
        for value, name in ((7, "one_count_changed"), (6, "checks"), (7, "one_count_changed")):
            cell.setValue(value)
            self.recalculate()
            self.assertClose(self.exact_value("G1"), RECALC[name]["p"], 1e-10, f"count {value}")

    def test_two_cells_on_tables_that_differ_in_one_count_each_show_their_own_p_value(self):
        first = self.put(RECALC["checks"]["table"])
        second = self.put(RECALC["another_count_changed"]["table"], row=5)
        self.formula("G1", f"=ASSOC.EXACT({first})")
        self.formula("G6", f"=ASSOC.EXACT({second})")
        self.assertClose(self.exact_value("G1"), RECALC["checks"]["p"], 1e-10, "first table")
        self.assertClose(self.exact_value("G6"), RECALC["another_count_changed"]["p"], 1e-10, "second table")

    def test_the_exact_method_of_pvalue_shows_what_exact_shows(self):
        table = self.put(RECALC["one_count_changed"]["table"])
        exact = self.number("G1", f"=ASSOC.EXACT({table})")
        self.assertEqual(self.number("G2", f'=ASSOC.PVALUE({table};"exact")'), exact)
        self.assertClose(exact, RECALC["one_count_changed"]["p"], 1e-10, "ASSOC.EXACT")

    def test_a_simulation_gives_the_same_value_for_the_same_seed_and_another_for_another_seed(self):
        table = self.put(RECALC["checks"]["table"])
        self.put([[7]], column=8)  # the seed, in I1
        first = self.number("G1", f"=ASSOC.SIMULATE({table};2000;I1)")
        seed = self.sheet.getCellRangeByName("I1")
        seed.setValue(8)
        self.recalculate()
        other = self.exact_value("G1")
        self.assertNotEqual(other, first)
        seed.setValue(7)
        self.recalculate()
        self.assertEqual(self.exact_value("G1"), first)

    def test_a_table_out_of_reach_is_refused_with_the_same_words_on_every_recalculation(self):
        table = self.put(OUT_OF_REACH)
        refused = self.formula("H1", f"=ASSOC.EXACT({table})")
        self.assertEqual(refused.getError(), 502)
        words = self.words("H2", f'=ASSOC.CHECK({table};"exact")')
        self.assertIn("ASSOC.EXACT cannot be used here: the exact test for this table needs more", words)
        self.assertIn('use ASSOC.SIMULATE(range; ; ; "exact") for a Monte Carlo estimate of the exact p-value instead',
                      words)
        for _ in range(2):
            self.recalculate()
            self.assertEqual(self.sheet.getCellRangeByName("H1").getError(), 502)
            self.assertEqual(self.sheet.getCellRangeByName("H2").getString(), words)


if __name__ == "__main__":
    run_harness(__doc__)
