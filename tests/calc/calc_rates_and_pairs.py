#!/usr/bin/python3
"""Calc tests of the figures a memo needs: ASSOC.RATES (rates with Wilson intervals), ASSOC.RATEDIFF
(a difference of rates with Newcombe's interval), ASSOC.PAIRWISE (which groups differ from which) and
ASSOC.STRATARISK (the Mantel–Haenszel common risk ratio with the Greenland–Robins interval), each
through real cells of headless Calc, with a bad-input check that ASSOC.CHECK explains.

    /usr/bin/python3 tests/calc/calc_rates_and_pairs.py --oxt build/extension/assoc.oxt

Expected values: rates_and_pairs_values.json, written by make_rates_and_pairs_values.py with statsmodels
0.13.5, scipy 1.10.1, numpy 1.24.2 and R 4.2.2 (the source of each value is named beside its check), and
exact identities with the other ASSOC functions. The tables are invented (a fictional company's HR data).
"""

import json

from calc_more_functions import ErrorCheckMixin
from calc_support import HERE, CalcTestCase, run_harness

VALUES = json.loads((HERE / "rates_and_pairs_values.json").read_text())
DEPARTMENTS = VALUES["departments"]  # 6 departments; Legal (row 3 of the body, row 4 of the range) has no counts
OFFICES = VALUES["offices"]


class Rates(CalcTestCase, ErrorCheckMixin):
    def test_match_statsmodels_wilson_intervals_row_by_row_and_leave_a_row_without_counts_empty(self):
        table = self.put(DEPARTMENTS)
        block = self.array_formula("E1:H6", f"=ASSOC.RATES({table})")
        for r, expected in enumerate(VALUES["rates"]):
            for c in range(4):
                cell = block.getCellByPosition(c, r)
                self.assertEqual(cell.getError(), 0, f"cell ({r}, {c})")
                if expected is None:
                    self.assertEqual(cell.getString(), "", f"row {r + 1} has no counts: cell {c} stays empty")
                else:
                    # statsmodels 0.13.5 proportion_confint(method="wilson"); n and the rate by definition.
                    self.assertClose(cell.getValue(), expected[c], 1e-12, f"row {r + 1}, column {c + 1}")

    def test_use_the_confidence_level_given(self):
        table = self.put(DEPARTMENTS)
        got = self.array("E1:H2", f"=ASSOC.RATES({table}; 0.9)")
        self.assertAllClose(got, VALUES["rates_90"][:2], 1e-12, "90% Wilson intervals (statsmodels)")

    def test_keep_rates_of_zero_and_one_inside_zero_to_one(self):
        # Exact identities of the Wilson interval: a rate of 0 starts at 0, a rate of 1 ends at 1.
        table = self.put([["", "Promoted", "Not promoted"], ["Archive", 0, 20], ["Board", 12, None]])
        (n0, rate0, lower0, upper0), (n1, rate1, lower1, upper1) = self.array("E1:H2", f"=ASSOC.RATES({table})")
        self.assertEqual((n0, rate0, lower0), (20, 0, 0))
        self.assertTrue(0 < upper0 < 1)
        self.assertEqual((n1, rate1, upper1), (12, 1, 1))
        self.assertTrue(0 < lower1 < 1)

    def test_check_names_the_row_without_counts(self):
        table = self.put(DEPARTMENTS)
        text = self.words("E1", f'=ASSOC.CHECK({table}; "rates")')
        self.assertIn("ASSOC.RATES can be used on this range.", text)
        # Row 4 of the range: the header row is row 1.
        self.assertIn("Row 4 (Legal) has no counts, so it has no rate; its line stays empty.", text)

    def test_refuse_a_single_column_and_check_says_why(self):
        table = self.put([["Promoted"], [12], [7]])
        self.assertErrorExplained(f"=ASSOC.RATES({table})", f'=ASSOC.CHECK({table}; "rates")',
                                  "ASSOC.RATES cannot be used here: rates need at least 2 columns of counts (column 1 "
                                  "the outcome of interest, the others the rest); this range has 1.")


class RateDifference(CalcTestCase, ErrorCheckMixin):
    def test_matches_statsmodels_newcombe_interval(self):
        table = self.put([DEPARTMENTS[0], DEPARTMENTS[1], DEPARTMENTS[2]])
        got = self.array("E1:G1", f"=ASSOC.RATEDIFF({table})")
        # statsmodels 0.13.5 confint_proportions_2indep(method="newcomb", compare="diff").
        self.assertAllClose(got, [VALUES["ratediff"]], 1e-12, "Design − Assembly")
        self.assertClose(self.number("E3", f"=ASSOC.RATEDIFF({table})"), VALUES["ratediff"][0], 1e-15,
                         "a plain entry shows the difference")

    def test_gives_a_difference_of_zero_when_nobody_has_the_outcome(self):
        table = self.put([["", "Promoted", "Not promoted"], ["Archive", 0, 10], ["Board", None, 10]])
        difference, lower, upper = self.array("E1:G1", f"=ASSOC.RATEDIFF({table})")[0]
        self.assertEqual(difference, 0)
        self.assertClose(upper, -lower, 1e-15, "symmetric for equal groups (identity)")

    def test_refuses_a_table_of_three_rows_and_check_says_why(self):
        table = self.put(DEPARTMENTS[:4])
        self.assertErrorExplained(f"=ASSOC.RATEDIFF({table})", f'=ASSOC.CHECK({table}; "ratediff")',
                                  "the rate difference needs a 2×2 table (two groups, the outcome of interest and the "
                                  "rest); this range has 3 rows and 2 columns of counts.")


class Pairwise(CalcTestCase, ErrorCheckMixin):
    REFERENCE = VALUES["pairwise"]

    def check_block(self, got, raw, adjusted, tolerance, what):
        self.assertEqual(len(got), len(self.REFERENCE["names"]))
        for row, names, p, q in zip(got, self.REFERENCE["names"], raw, adjusted):
            self.assertEqual(row[:2], names, what)
            self.assertClose(row[2], p, tolerance, f"{what}: p of {names}")
            self.assertClose(row[3], q, tolerance, f"{what}: adjusted p of {names}")

    def test_match_scipy_per_pair_with_holms_adjustment_by_default(self):
        table = self.put(DEPARTMENTS)
        got = self.array("E1:H10", f"=ASSOC.PAIRWISE({table})")
        # scipy 1.10.1 chi2_contingency(correction=False) per pair; statsmodels multipletests (R p.adjust agrees).
        self.check_block(got, self.REFERENCE["pearson"], self.REFERENCE["holm"], 1e-10, "Pearson, Holm")

    def test_adjust_with_bonferroni_when_asked(self):
        table = self.put(DEPARTMENTS)
        got = self.array("E1:H10", f'=ASSOC.PAIRWISE({table}; "Bonferroni")')
        self.check_block(got, self.REFERENCE["pearson"], self.REFERENCE["bonferroni"], 1e-10, "Bonferroni")

    def test_match_r_fisher_test_per_pair_with_the_exact_method(self):
        table = self.put(DEPARTMENTS)
        got = self.array("E1:H10", f'=ASSOC.PAIRWISE({table}; "holm"; "exact")')
        # R 4.2.2 fisher.test per pair (it sums with a relative tolerance of 1e-7).
        self.check_block(got, self.REFERENCE["exact"], self.REFERENCE["exact_holm"], 1e-7, "exact, Holm")

    def test_give_a_two_row_table_the_p_value_of_pvalue_and_exact(self):
        # Identity: two rows make one pair, whose table is the whole table; one p-value needs no adjustment.
        table = self.put([["", "Yes", "No", "Maybe"], ["Design", 12, 30, 5], ["Assembly", 20, 18, 9]])
        (pair,) = self.array("F1:I1", f"=ASSOC.PAIRWISE({table})")
        self.assertEqual(pair[:2], ["Design", "Assembly"])
        self.assertEqual(pair[2], self.number("F3", f"=ASSOC.PVALUE({table})"))
        self.assertEqual(pair[3], pair[2])
        (exact,) = self.array("F5:I5", f'=ASSOC.PAIRWISE({table}; "none"; "exact")')
        self.assertEqual(exact[2], self.number("F7", f"=ASSOC.EXACT({table})"))

    def test_name_unlabelled_rows_by_their_place(self):
        table = self.put([[12, 30], [0, 0], [20, 18]])
        (pair,) = self.array("E1:H1", f"=ASSOC.PAIRWISE({table})")
        self.assertEqual(pair[:2], ["row 1", "row 3"])

    def test_give_the_smallest_adjusted_p_value_through_min_and_index(self):
        table = self.put(DEPARTMENTS)
        # A plain entry shows the array's top-left value, the first row's label; the guide's formula
        # for the smallest adjusted p-value (statsmodels multipletests, Sales–Logistics).
        self.assertEqual(self.words("E1", f"=ASSOC.PAIRWISE({table})"), "Design")
        self.assertClose(self.number("E2", f"=MIN(INDEX(ASSOC.PAIRWISE({table});0;4))"), min(self.REFERENCE["holm"]),
                         1e-10, "smallest adjusted p-value")

    def test_refuse_an_unknown_adjustment_and_check_says_why(self):
        table = self.put(DEPARTMENTS)
        self.assertErrorExplained(f'=ASSOC.PAIRWISE({table}; "sidak")', f'=ASSOC.CHECK({table}; "sidak")',
                                  '"sidak" is not an option word or the name of an ASSOC function')

    def test_refuse_weighted_counts_for_the_exact_method_and_check_says_why(self):
        # "exact" names ASSOC.EXACT for ASSOC.CHECK, which fails on these counts for the same reason.
        table = self.put([["", "Yes", "No"], ["Design", 3.5, 4], ["Sales", 2, 6], ["Finance", 1, 1]])
        self.assertErrorExplained(f'=ASSOC.PAIRWISE({table}; "holm"; "exact")', f'=ASSOC.CHECK({table}; "exact")',
                                  "the exact test needs whole counts; this table holds counts that are not whole "
                                  "numbers")

    def test_check_names_pairs_whose_chi_squared_p_value_is_doubtful(self):
        table = self.put([["", "Yes", "No"], ["A", 30, 40], ["B", 35, 30], ["C", 1, 3]])
        text = self.words("E1", f'=ASSOC.CHECK({table}; "pairwise")')
        self.assertIn('The chi-squared p-values of the pairs "A"–"C" and "B"–"C" are doubtful (small expected counts); '
                      '"exact" tests each pair exactly.', text)


class StrataRisk(CalcTestCase, ErrorCheckMixin):
    def test_matches_statsmodels_and_the_greenland_robins_interval_across_offices(self):
        strata = self.put(OFFICES)
        # statsmodels 0.13.5 StratifiedTable.riskratio_pooled; the interval from Greenland & Robins (1985).
        self.assertAllClose(self.array("G1:I1", f"=ASSOC.STRATARISK({strata})"), [VALUES["stratarisk"]], 1e-12,
                            "95%")
        self.assertAllClose(self.array("G2:I2", f"=ASSOC.STRATARISK({strata}; 0.9)"), [VALUES["stratarisk_90"]],
                            1e-12, "90%")
        self.assertClose(self.number("G4", f"=ASSOC.STRATARISK({strata})"), VALUES["stratarisk"][0], 1e-13,
                         "a plain entry shows the ratio")

    def test_equals_riskratio_for_a_single_stratum(self):
        # Identity: one stratum with counts (the empty second one adds nothing) gives ASSOC.RISKRATIO's
        # estimate and interval (statsmodels Table2x2 for the values).
        design, assembly = DEPARTMENTS[1], DEPARTMENTS[2]
        strata = self.put([["Office", "a", "b", "c", "d"], ["Northgate", design[1], design[2], assembly[1], assembly[2]],
                           ["Depot", 0, 0, 0, 0]])
        two_by_two = self.put([["", "Promoted", "Not promoted"], design, assembly], row=5)
        common = self.array("G1:I1", f"=ASSOC.STRATARISK({strata})")[0]
        single = self.array("G2:I2", f"=ASSOC.RISKRATIO({two_by_two})")[0]
        for got, want, reference in zip(common, single, VALUES["riskratio_design_assembly"]):
            self.assertClose(got, want, 1e-13, "STRATARISK against RISKRATIO")
            self.assertClose(got, reference, 1e-12, "against statsmodels")
        text = self.words("G3", f'=ASSOC.CHECK({strata}; "stratarisk")')
        self.assertIn("The stratum 2 (Depot) has an empty row and adds nothing to the common risk ratio.", text)

    def test_refuses_a_range_of_three_columns_and_check_says_why(self):
        strata = self.put([[1, 2, 3], [4, 5, 6]])
        self.assertErrorExplained(f"=ASSOC.STRATARISK({strata})", f'=ASSOC.CHECK({strata}; "stratarisk")',
                                  "strata must be given as one row of 4 counts (a, b, c, d) per stratum, or as 2×2 "
                                  "tables stacked in 2 columns; this range has 3 columns of counts.")


if __name__ == "__main__":
    run_harness(__doc__)
