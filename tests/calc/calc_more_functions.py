"""Calc tests of the later ASSOC functions: exact and simulated p-values, odds and risk ratios, cell
tests, goodness of fit, power and sample size, counts from records, strata, paired tables, trend and
selection impact. Run by calc_functions_test.py (which starts the office); not a script of its own.

Expected values: the published figures of tests/reference/published_values.md (section named beside each check)
and values from R 4.2.2, scipy 1.10.1, numpy 1.24.2 and statsmodels 0.13.5 written by
make_reference_values.py into reference_values.json ("functions").
"""

import math
import time

from calc_support import (BRANCHES, BRANCHES_KEPT_COLUMNS, BRANCHES_KEPT_ROWS, ERR_ILLEGAL_ARGUMENT, FUNCTIONS, PARTY,
                          TEAMS, THREE_BY_THREE, CalcTestCase)

EXACT = FUNCTIONS["exact"]
# Invented: five branches of a fictional firm × five outcomes of an invoice check. Too many tables
# with these totals for the exact test within the worksheet's limits (it stops after about 1.5 s
# on the memory limit here).
BEYOND_THE_CAP = [[14, 22, 9, 17, 25], [19, 11, 28, 13, 16], [24, 18, 12, 21, 10], [15, 27, 20, 11, 23],
                  [12, 16, 25, 19, 14]]
# Invented weighted counts (survey weights): the exact and simulated tests need whole counts.
WEIGHTED = [[3.5, 1], [1, 3]]


def column(values):
    return [[v] for v in values]


class ErrorCheckMixin:
    def assertErrorExplained(self, failing, check, explanation):
        """`failing` shows Err:502 and the ASSOC.CHECK formula `check` says `explanation`."""
        cell = self.formula("Z1", failing)
        self.assertEqual(cell.getError(), ERR_ILLEGAL_ARGUMENT, failing)
        text = self.words("Z2", check)
        self.assertIn(explanation, text)
        self.sheet.getCellRangeByName("Z1:Z2").clearContents(0xFFFF)
        return text


class ExactTest(CalcTestCase, ErrorCheckMixin):
    def test_gives_fishers_tea_tasting_p_values(self):
        table = self.put([[3, 1], [1, 3]])
        # published_values.md section 2: one-sided 17/70, two-sided 34/70 (exact rationals).
        self.assertClose(self.number("F1", f"=ASSOC.EXACT({table})"), 34 / 70, 1e-12, "two-sided")
        self.assertClose(self.number("F2", f'=ASSOC.EXACT({table}; "upper")'), 17 / 70, 1e-12, "upper")
        self.assertClose(self.number("F3", f'=ASSOC.EXACT({table}; "Lower")'), EXACT["tea"]["lower"], 1e-12,
                         "lower (R fisher.test alternative='less')")

    def test_matches_r_on_a_two_by_two_table_both_sides(self):
        table = self.put(TEAMS)
        for side, key in (("two-sided", "two_sided"), ("lower", "lower"), ("upper", "upper")):
            with self.subTest(side=side):
                self.assertClose(self.number("F1", f'=ASSOC.EXACT({table}; "{side}")'), EXACT["teams"][key], 1e-10,
                                 f"{side} (R 4.2.2 fisher.test)")

    def test_matches_r_on_larger_tables(self):
        for name in ("sites", "shifts", "party"):
            with self.subTest(table=name):
                table = self.put(EXACT[name]["counts"])
                self.assertClose(self.number("H1", f"=ASSOC.EXACT({table})"), EXACT[name]["two_sided"], 1e-8,
                                 f"{name} (R 4.2.2 fisher.test)")
                self.sheet.getCellRangeByName("A1:H5").clearContents(0xFFFF)

    def test_reads_headers_blanks_and_set_aside_rows_like_the_other_functions(self):
        # The branches table with a blank, an empty row and an empty column; R fisher.test on the kept counts.
        table = self.put(BRANCHES)
        self.assertClose(self.number("H1", f"=ASSOC.EXACT({table})"), EXACT["branches"]["two_sided"], 1e-8,
                         "branches (R 4.2.2 fisher.test)")

    def test_is_also_the_exact_method_of_pvalue(self):
        table = self.put(EXACT["shifts"]["counts"])
        self.assertEqual(self.number("F1", f'=ASSOC.PVALUE({table}; "EXACT")'), self.number("F2", f"=ASSOC.EXACT({table})"))

    def test_refuses_one_sided_tests_beyond_two_by_two_and_check_says_why(self):
        table = self.put(THREE_BY_THREE)
        self.assertErrorExplained(f'=ASSOC.EXACT({table}; "upper")', f'=ASSOC.CHECK({table}; "upper")',
                                  'ASSOC.EXACT with "upper" cannot be used here: one-sided exact tests ("lower", '
                                  '"upper") apply to 2×2 tables only; this table has 3 rows and 3 columns with counts.')

    def test_refuses_weighted_counts_and_check_says_why(self):
        table = self.put(WEIGHTED)
        self.assertErrorExplained(f"=ASSOC.EXACT({table})", f'=ASSOC.CHECK({table}; "exact")',
                                  "ASSOC.EXACT cannot be used here: the exact test needs whole counts")

    def test_statistic_refuses_the_exact_method_and_check_says_why(self):
        table = self.put(TEAMS)
        self.assertErrorExplained(f'=ASSOC.STATISTIC({table}; "exact")', f'=ASSOC.CHECK({table}; "exact")',
                                  'ASSOC.STATISTIC does not take "exact": the exact test has no chi-squared statistic')

    def test_stops_within_seconds_beyond_its_limits_and_the_office_keeps_working(self):
        table = self.put(BEYOND_THE_CAP)
        started = time.monotonic()
        cell = self.formula("H1", f"=ASSOC.EXACT({table})")
        self.assertEqual(cell.getError(), ERR_ILLEGAL_ARGUMENT)
        self.assertLess(time.monotonic() - started, 15)
        self.sheet.getCellRangeByName("H1").clearContents(0xFFFF)
        text = self.words("H2", f'=ASSOC.CHECK({table}; "exact")')
        # It would run out of both; which one the refusal names depends on which is foreseen first.
        self.assertRegex(text, "needs more (memory|time) than allowed")
        self.assertIn('use ASSOC.SIMULATE(range; ; ; "exact") for a Monte Carlo estimate of the exact p-value instead',
                      text)
        self.sheet.getCellRangeByName("H2").clearContents(0xFFFF)
        self.assertLess(time.monotonic() - started, 30)
        # The office still answers, and the simulated p-value works on the same table.
        self.assertClose(self.number("H3", f"=ASSOC.EXACT({self.put([[3, 1], [1, 3]], row=8)})"), 34 / 70, 1e-12,
                         "tea after the refusal")
        p = self.number("H4", f"=ASSOC.SIMULATE({table}; 1000)")
        self.assertTrue(0 < p <= 1)


class SimulatedPValue(CalcTestCase, ErrorCheckMixin):
    def test_is_within_four_standard_errors_of_the_exact_p_value_of_the_tea_table(self):
        table = self.put([[3, 1], [1, 3]])
        # published_values.md section 2: tables with X² ≥ 2 have probability 34/70 (so do those with G² ≥ G²obs).
        for method in ("pearson", "g"):
            with self.subTest(method=method):
                p, standard_error, trials = self.array("F1:H1", f'=ASSOC.SIMULATE({table}; ; ; "{method}")')[0]
                self.assertEqual(trials, 100000)
                self.assertLess(abs(p - 34 / 70), 4 * standard_error)
                self.assertClose(standard_error, math.sqrt(p * (1 - p) / trials), 1e-12, "standard error (definition)")

    def test_is_near_the_exact_conditional_p_value_of_an_r_by_c_table(self):
        # Exact P(X² ≥ observed | margins) by listing every table (Python fractions, make_reference_values.py).
        shifts = EXACT["shifts"]
        p, standard_error, _ = self.array("H1:J1", f"=ASSOC.SIMULATE({self.put(shifts['counts'])}; 200000; 11)")[0]
        self.assertLess(abs(p - shifts["pearson_conditional"]), 4 * standard_error)

    def test_gives_the_same_p_value_for_the_same_seed(self):
        table = self.put(EXACT["shifts"]["counts"])
        first = self.number("H1", f"=ASSOC.SIMULATE({table}; 20000; 7)")
        again = self.number("H2", f"=ASSOC.SIMULATE({table}; 20000; 7)")
        other = self.number("H3", f"=ASSOC.SIMULATE({table}; 20000; 8)")
        self.assertEqual(first, again)
        self.assertNotEqual(first, other)
        self.assertEqual(self.number("H4", f"=ASSOC.SIMULATE({table}; 20000)"),
                         self.number("H5", f"=ASSOC.SIMULATE({table}; 20000; 1)"))

    def test_refuses_weighted_counts_and_yates_and_check_says_why(self):
        table = self.put(WEIGHTED)
        self.assertErrorExplained(f"=ASSOC.SIMULATE({table})", f'=ASSOC.CHECK({table}; "simulate")',
                                  "ASSOC.SIMULATE cannot be used here: the simulated p-value needs whole counts")
        teams = self.put(TEAMS, row=4)
        self.assertErrorExplained(f'=ASSOC.SIMULATE({teams}; ; ; "yates")', f'=ASSOC.CHECK({teams}; "yates")',
                                  'ASSOC.SIMULATE does not take "yates"')
        self.assertEqual(self.formula("Z3", f"=ASSOC.SIMULATE({teams}; 50)").getError(), ERR_ILLEGAL_ARGUMENT)


class RatiosOfATwoByTwoTable(CalcTestCase, ErrorCheckMixin):
    ASPIRIN = [["", "MI", "No MI"], ["Placebo", 189, 10845], ["Aspirin", 104, 10933]]

    def test_odds_ratio_matches_agresti_and_statsmodels(self):
        table = self.put(self.ASPIRIN)
        got = self.array("F1:H1", f"=ASSOC.ODDSRATIO({table})")[0]
        # published_values.md section 10: Agresti (2007) Table 2.3 (from memory): 1.83 (1.44, 2.33).
        self.assertEqual([round(v, 2) for v in got], [1.83, 1.44, 2.33])
        self.assertAllClose([got], [FUNCTIONS["aspirin"]["95"]["odds"]], 1e-9, "OR, Woolf CI (statsmodels Table2x2)")
        got90 = self.array("F3:H3", f"=ASSOC.ODDSRATIO({table}; 0.9)")
        self.assertAllClose(got90, [FUNCTIONS["aspirin"]["90"]["odds"]], 1e-9, "90% (statsmodels)")

    def test_risk_ratio_matches_statsmodels(self):
        table = self.put(self.ASPIRIN)
        got = self.array("F1:H1", f"=ASSOC.RISKRATIO({table})")
        # published_values.md section 10: RR 1.82, log-method CI (1.43, 2.31).
        self.assertEqual([round(v, 2) for v in got[0]], [1.82, 1.43, 2.31])
        self.assertAllClose(got, [FUNCTIONS["aspirin"]["95"]["risk"]], 1e-9, "RR, log CI (statsmodels Table2x2)")

    def test_add_one_half_to_every_cell_when_one_is_zero_and_check_says_so(self):
        table = self.put(FUNCTIONS["zero_cell"]["counts"])
        # published_values.md section 10: 0.5 added to every cell, statsmodels on table + 0.5.
        self.assertAllClose(self.array("F1:H1", f"=ASSOC.ODDSRATIO({table})"), [FUNCTIONS["zero_cell"]["95"]["odds"]],
                            1e-9, "Haldane OR")
        self.assertAllClose(self.array("F2:H2", f"=ASSOC.RISKRATIO({table})"), [FUNCTIONS["zero_cell"]["95"]["risk"]],
                            1e-9, "Haldane RR")
        self.assertIn("Haldane–Anscombe", self.words("F4", f'=ASSOC.CHECK({table}; "oddsratio")'))

    def test_need_a_two_by_two_table_and_check_says_why(self):
        table = self.put(THREE_BY_THREE)
        self.assertErrorExplained(f"=ASSOC.ODDSRATIO({table})", f'=ASSOC.CHECK({table}; "ASSOC.OddsRatio")',
                                  "ASSOC.ODDSRATIO cannot be used here: the odds ratio needs a 2×2 table")
        self.assertErrorExplained(f"=ASSOC.RISKRATIO({table})", f'=ASSOC.CHECK({table}; "riskratio")',
                                  "ASSOC.RISKRATIO cannot be used here: the risk ratio needs a 2×2 table")


class CellTests(CalcTestCase, ErrorCheckMixin):
    def test_match_statsmodels_for_each_adjustment(self):
        table = self.put(PARTY)
        for adjust in ("holm", "bonferroni", "none"):
            with self.subTest(adjust=adjust):
                got = self.array("F1:H2", f'=ASSOC.CELLTEST({table}; "{adjust}")')
                # statsmodels standardized_resids, scipy norm.sf, statsmodels multipletests.
                self.assertAllClose(got, FUNCTIONS["celltest_party"][adjust], 1e-8, f"{adjust} p-values")
        self.assertEqual(self.array("F4:H5", f"=ASSOC.CELLTEST({table})"), self.array("F7:H8",
                         f'=ASSOC.CELLTEST({table}; "holm")'))

    def test_leave_cells_of_set_aside_rows_and_columns_empty(self):
        table = self.put(BRANCHES)
        block = self.array_formula("H1:L4", f"=ASSOC.CELLTEST({table})")
        for r in range(4):
            for c in range(5):
                cell = block.getCellByPosition(c, r)
                self.assertEqual(cell.getError(), 0)
                tested = r in BRANCHES_KEPT_ROWS and c in BRANCHES_KEPT_COLUMNS
                if tested:
                    self.assertTrue(0 <= cell.getValue() <= 1)
                else:
                    self.assertEqual(cell.getString(), "", f"untested cell ({r}, {c})")

    def test_refuse_an_unknown_adjustment_and_check_says_so(self):
        table = self.put(THREE_BY_THREE)
        self.assertErrorExplained(f'=ASSOC.CELLTEST({table}; "sidak")', f'=ASSOC.CHECK({table}; "sidak")',
                                  '"sidak" is not an option word or the name of an ASSOC function')


class GoodnessOfFit(CalcTestCase, ErrorCheckMixin):
    def test_matches_mendels_dihybrid_cross(self):
        observed = self.put([FUNCTIONS["mendel"]["observed"]])
        shares = self.put([FUNCTIONS["mendel"]["shares"]], row=1)
        p, statistic, df = self.array("F1:H1", f"=ASSOC.FIT({observed}; {shares})")[0]
        # published_values.md section 6: X² = 196/417 exactly, df 3, p 0.925425895103616 (mpmath).
        self.assertClose(statistic, 196 / 417, 1e-13, "X²")
        self.assertEqual(df, 3)
        self.assertClose(p, 0.925425895103616, 1e-12, "p")

    def test_takes_equal_shares_when_expected_is_omitted_and_lowers_df_for_estimates(self):
        observed = self.put(column(FUNCTIONS["mendel"]["observed"]))
        shares = self.put(column(FUNCTIONS["mendel"]["shares"]), column=1)
        self.assertAllClose(self.array("F1:H1", f"=ASSOC.FIT({observed})"), [FUNCTIONS["mendel"]["equal_shares"]],
                            1e-10, "equal shares (scipy chisquare)")
        self.assertAllClose(self.array("F2:H2", f"=ASSOC.FIT({observed}; {shares}; 1)"),
                            [FUNCTIONS["mendel"]["one_estimated"]], 1e-10, "ddof 1 (scipy chisquare)")

    def test_refuses_a_block_of_counts_and_check_says_why(self):
        table = self.put(THREE_BY_THREE)
        self.assertErrorExplained(f"=ASSOC.FIT({table})", f'=ASSOC.CHECK({table}; "fit")',
                                  "ASSOC.FIT cannot be used here: select one row or one column of numbers")


class PowerAndSampleSize(CalcTestCase, ErrorCheckMixin):
    def test_match_cohen_and_scipy(self):
        power = FUNCTIONS["power"]
        # published_values.md section 8: power at N = 87 is 0.799055746 and at N = 88 is 0.803527484 (R agrees).
        self.assertClose(self.number("A1", "=ASSOC.POWER(0.3; 87; 1)"), power["w0.3_n87_df1"], 1e-9, "N 87")
        self.assertClose(self.number("A2", "=ASSOC.POWER(0.3; 88; 1)"), power["w0.3_n88_df1"], 1e-9, "N 88")
        self.assertClose(self.number("A3", "=ASSOC.POWER(0.5; 50; 2; 0.01)"), power["w0.5_n50_df2_alpha0.01"], 1e-9,
                         "alpha 1% (scipy ncx2)")
        # Cohen (1988) Table 7.4.6 prints 87 (from memory); the smallest N reaching .80 is 88.
        self.assertEqual(self.number("A4", "=ASSOC.SAMPLESIZE(0.3; 0.8; 1)"), 88)
        self.assertEqual(self.number("A5", "=ASSOC.SAMPLESIZE(0.1; 0.9; 4)"), power["n_w0.1_p0.9_df4"])
        self.assertEqual(self.number("A6", "=ASSOC.SAMPLESIZE(0.5; 0.8; 2)"), power["n_w0.5_p0.8_df2"])

    def test_refuse_a_fractional_df_and_check_says_why(self):
        numbers = self.put([[0.3, 88, 1.5]], row=9)
        self.assertErrorExplained("=ASSOC.POWER(0.3; 88; 1.5)", f'=ASSOC.CHECK({numbers}; "power")',
                                  "ASSOC.POWER cannot be used here")
        self.assertErrorExplained("=ASSOC.SAMPLESIZE(0; 0.8; 1)", f'=ASSOC.CHECK({self.put([[0, 0.8, 1]], row=11)}; '
                                  '"samplesize")', "ASSOC.SAMPLESIZE cannot be used here: the effect size w must be above 0")


class CountsFromRecords(CalcTestCase, ErrorCheckMixin):
    RECORDS = FUNCTIONS["records"]

    def put_records(self):
        n = len(self.RECORDS["departments"])
        self.put(column(self.RECORDS["departments"]), column=0)
        self.put(column(self.RECORDS["outcomes"]), column=1)
        self.put(column(self.RECORDS["weights"]), column=2)
        return f"A1:A{n}", f"B1:B{n}", f"C1:C{n}"

    def test_count_the_records_in_sorted_order_and_in_order_of_appearance(self):
        rows, columns, _ = self.put_records()
        # numpy counting in make_reference_values.py; the blank outcome is skipped.
        self.assertAllClose(self.array("E1:G3", f"=ASSOC.COUNTS({rows}; {columns})"), self.RECORDS["counts_sorted"],
                            0, "sorted")
        self.assertAllClose(self.array("E5:G7", f'=ASSOC.COUNTS({rows}; {columns}; ; "first")'),
                            self.RECORDS["counts_first"], 0, "first")

    def test_add_up_weights(self):
        rows, columns, weights = self.put_records()
        self.assertAllClose(self.array("E1:G3", f"=ASSOC.COUNTS({rows}; {columns}; {weights})"),
                            self.RECORDS["weighted_sorted"], 1e-14, "weighted")

    def test_levels_give_the_labels_in_the_same_orders(self):
        rows, columns, _ = self.put_records()
        self.assertEqual(self.array("E1:E3", f"=ASSOC.LEVELS({rows})"), column(self.RECORDS["departments_sorted"]))
        self.assertEqual(self.array("F1:F3", f'=ASSOC.LEVELS({columns}; "first")'),
                         column(self.RECORDS["outcomes_first"]))

    def test_feed_the_other_functions_directly(self):
        rows, columns, _ = self.put_records()
        self.put(self.RECORDS["counts_sorted"], column=10)
        self.assertEqual(self.number("E1", f"=ASSOC.STATISTIC(ASSOC.COUNTS({rows}; {columns}))"),
                         self.number("E2", "=ASSOC.STATISTIC(K1:M3)"))

    def test_give_a_label_whose_records_were_all_skipped_a_row_of_zeros(self):
        # "Legal" appears only with blank outcomes: ASSOC.LEVELS lists it, so ASSOC.COUNTS has its row.
        self.put(column(["Sales", "Legal", "Sales", "Legal", "Support"]), column=0)
        self.put(column(["Yes", None, "No", None, "Yes"]), column=1)
        self.assertEqual(self.array("E1:E3", "=ASSOC.LEVELS(A1:A5)"), column(["Legal", "Sales", "Support"]))
        self.assertEqual(self.array("F1:G3", "=ASSOC.COUNTS(A1:A5; B1:B5)"), [[0, 0], [1, 1], [0, 1]])

    def test_check_tells_what_was_counted_and_why_all_blank_labels_fail(self):
        self.put_records()
        n = len(self.RECORDS["departments"])
        text = self.words("E1", f'=ASSOC.CHECK(A1:B{n}; "counts")')
        self.assertIn(f"Counted {n - 1} of {n} records into 3 row levels and 3 column levels.", text)
        self.assertIn("1 record has a blank label and was skipped.", text)
        self.put(column(["North", "South"]), column=8)
        self.assertErrorExplained("=ASSOC.COUNTS(I1:I2; J1:J2)", '=ASSOC.CHECK(I1:J2; "counts")',
                                  "ASSOC.COUNTS cannot be used here: every record has a blank label")
        self.assertErrorExplained("=ASSOC.LEVELS(J1:J2)", '=ASSOC.CHECK(J1:J2; "levels")',
                                  "ASSOC.LEVELS cannot be used here: the labels are all blank")

    def test_check_asks_for_both_columns_when_given_one(self):
        self.put_records()
        self.assertIn("to try ASSOC.COUNTS, give ASSOC.CHECK its 2 ranges side by side as the columns of one range "
                      "(and the optional ones after them); this range has 1 column",
                      self.words("E1", '=ASSOC.CHECK(A:A; "counts")'))


class Strata(CalcTestCase, ErrorCheckMixin):
    ADMISSIONS = FUNCTIONS["admissions"]

    def put_departments(self):
        rows = [["Department", "Men admitted", "Men rejected", "Women admitted", "Women rejected"]]
        rows += [[name, *counts] for name, counts in zip(self.ADMISSIONS["departments"], self.ADMISSIONS["strata"])]
        return self.put(rows)

    def test_mantel_haenszel_matches_statsmodels_and_r_for_the_berkeley_admissions(self):
        table = self.put_departments()
        # published_values.md section 7 (Bickel et al. 1975; counts of R's UCBAdmissions): corrected χ² 1.4269462286,
        # p 0.2322634628, common OR 0.9046968283, CI (0.7719073618, 1.0603297644).
        self.assertAllClose(self.array("H1:L1", f"=ASSOC.STRATA({table})"), [self.ADMISSIONS["corrected"]], 1e-9,
                            "corrected (statsmodels StratifiedTable)")
        self.assertAllClose(self.array("H2:L2", f'=ASSOC.STRATA({table}; "uncorrected")'),
                            [self.ADMISSIONS["uncorrected"]], 1e-9, "uncorrected")

    def test_breslow_day_matches_statsmodels(self):
        table = self.put_departments()
        # published_values.md section 7: Tarone-corrected 18.825501252, p 0.0020714014, df 5.
        self.assertAllClose(self.array("H1:J1", f"=ASSOC.HOMOGENEITY({table})"), [self.ADMISSIONS["homogeneity"]],
                            1e-9, "Breslow–Day, Tarone (statsmodels)")

    def test_read_stacked_two_by_two_tables_the_same_way(self):
        one_row_each = self.put_departments()
        stacked = []
        for a, b, c, d in self.ADMISSIONS["strata"]:
            stacked += [[a, b], [c, d]]
        blocks = self.put(stacked, column=7, row=10)
        self.assertEqual(self.array("H1:L1", f"=ASSOC.STRATA({blocks})"),
                         self.array("H3:L3", f"=ASSOC.STRATA({one_row_each})"))
        self.assertEqual(self.array("H5:J5", f"=ASSOC.HOMOGENEITY({blocks})"),
                         self.array("H7:J7", f"=ASSOC.HOMOGENEITY({one_row_each})"))

    def test_refuse_a_range_of_three_columns_and_check_says_why(self):
        table = self.put(THREE_BY_THREE)
        self.assertErrorExplained(f"=ASSOC.STRATA({table})", f'=ASSOC.CHECK({table}; "strata")',
                                  "ASSOC.STRATA cannot be used here: strata must be given as one row of 4 counts")
        self.assertErrorExplained(f"=ASSOC.HOMOGENEITY({table})", f'=ASSOC.CHECK({table}; "homogeneity")',
                                  "ASSOC.HOMOGENEITY cannot be used here: strata must be given")


class PairedTables(CalcTestCase, ErrorCheckMixin):
    PAIRED = FUNCTIONS["paired"]

    def test_mcnemar_matches_the_approval_table(self):
        table = self.put(self.PAIRED["approval"])
        # published_values.md section 5: X² uncorrected 17.36 (Agresti 1990 via R's ?mcnemar.test), corrected 16.8178.
        uncorrected = self.array("F1:H1", f'=ASSOC.PAIRED({table}; "uncorrected")')
        self.assertEqual(round(uncorrected[0][1], 2), 17.36)
        self.assertAllClose(uncorrected, [self.PAIRED["uncorrected"]], 1e-9, "uncorrected (statsmodels mcnemar)")
        self.assertAllClose(self.array("F2:H2", f"=ASSOC.PAIRED({table})"), [self.PAIRED["corrected"]], 1e-9,
                            "corrected, the default (statsmodels)")
        self.assertAllClose(self.array("F3:H3", f'=ASSOC.PAIRED({table}; "exact")'), [self.PAIRED["exact"]], 1e-9,
                            "exact binomial (statsmodels)")

    def test_bowker_is_the_default_for_a_larger_square_table(self):
        table = self.put(self.PAIRED["ratings"])
        self.assertAllClose(self.array("F1:H1", f"=ASSOC.PAIRED({table})"), [self.PAIRED["bowker"]], 1e-9,
                            "Bowker (statsmodels SquareTable.symmetry)")

    def test_refuse_mcnemar_words_on_a_larger_table_and_a_table_that_is_not_square(self):
        ratings = self.put(self.PAIRED["ratings"])
        self.assertErrorExplained(f'=ASSOC.PAIRED({ratings}; "corrected")', f'=ASSOC.CHECK({ratings}; "corrected")',
                                  'ASSOC.PAIRED with "corrected" cannot be used here')
        wide = self.put([[3, 4, 5], [6, 7, 8]], row=5)
        self.assertErrorExplained(f"=ASSOC.PAIRED({wide})", f'=ASSOC.CHECK({wide}; "paired")',
                                  "ASSOC.PAIRED cannot be used here: a paired table must be square")


class Trend(CalcTestCase, ErrorCheckMixin):
    ALCOHOL = FUNCTIONS["alcohol"]

    def test_matches_r_prop_trend_test_for_the_alcohol_table(self):
        table = self.put([["", "0", "<1", "1-2", "3-5", ">=6"], ["Present", *self.ALCOHOL["present"]],
                          ["Absent", *self.ALCOHOL["absent"]]])
        scores = self.put([self.ALCOHOL["scores"]], row=4)
        got = self.array("H1:I1", f"=ASSOC.TREND({table}; {scores})")
        # published_values.md section 4: R prop.trend.test χ² = 6.570133945 = z², p 0.0103704146.
        self.assertAllClose(got, [self.ALCOHOL["trend"]], 1e-9, "p, z (R 4.2.2 prop.trend.test)")
        self.assertEqual(round(got[0][1] ** 2, 2), 6.57)

    def test_reads_the_categories_down_the_rows_too(self):
        rows = [[p, a] for p, a in zip(self.ALCOHOL["present"], self.ALCOHOL["absent"])]
        table = self.put(rows)
        scores = self.put(column(self.ALCOHOL["scores"]), column=3)
        self.assertAllClose(self.array("H1:I1", f"=ASSOC.TREND({table}; {scores})"), [self.ALCOHOL["trend"]], 1e-9,
                            "k×2 layout (R prop.trend.test)")

    def test_refuses_a_table_without_two_outcomes_and_check_says_why(self):
        table = self.put(THREE_BY_THREE)
        self.assertErrorExplained(f"=ASSOC.TREND({table})", f'=ASSOC.CHECK({table}; "trend")',
                                  "ASSOC.TREND cannot be used here")


class SelectionImpact(CalcTestCase, ErrorCheckMixin):
    IMPACT = FUNCTIONS["impact"]

    def test_flags_the_group_below_four_fifths(self):
        selected = self.put(column(self.IMPACT["selected"]), column=1)
        considered = self.put(column(self.IMPACT["considered"]), column=2)
        block = self.array("E1:G3", f"=ASSOC.IMPACT({selected}; {considered})")
        # published_values.md section 9: rates .6, .4, .5; ratios 1, 2/3, 5/6; only G2 below 0.8 (29 CFR 1607.4(D)).
        self.assertAllClose([row[:2] for row in block], [list(v) for v in zip(self.IMPACT["rates"],
                                                                              self.IMPACT["ratios"])], 1e-14, "rates")
        # The flag column as the cells show it (an unflagged group's flag is an empty element).
        flags = self.sheet.getCellRangeByName("G1:G3")
        self.assertEqual([flags.getCellByPosition(0, r).getString() for r in range(3)],
                         ["", "below four-fifths of the highest rate", ""])

    def test_takes_another_threshold(self):
        selected = self.put(column(self.IMPACT["selected"]), column=1)
        considered = self.put(column(self.IMPACT["considered"]), column=2)
        block = self.array("E1:G3", f"=ASSOC.IMPACT({selected}; {considered}; 0.9)")
        self.assertEqual(len(block), 3)
        flags = self.sheet.getCellRangeByName("G1:G3")
        self.assertEqual([flags.getCellByPosition(0, r).getString() for r in range(3)],
                         ["", "below 90% of the highest rate", "below 90% of the highest rate"])

    def test_refuses_more_selected_than_considered_and_check_says_why_with_the_caution(self):
        self.put([[40, 30], [12, 30], [30, 60]], column=1)
        self.assertErrorExplained("=ASSOC.IMPACT(B1:B3; C1:C3)", '=ASSOC.CHECK(B1:C3; "impact")',
                                  "ASSOC.IMPACT cannot be used here: the group in row 1 has more selected (40) than considered "
                                  "(30)")
        self.put([[48, 80], [12, 30], [30, 60]], column=1, row=5)
        text = self.words("E9", '=ASSOC.CHECK(B6:C8; "impact")')
        self.assertTrue(text.startswith("ASSOC.IMPACT can be used on this range."), text)
        self.assertIn("law", text)


class CheckWithFunctionNames(CalcTestCase):
    def test_accepts_names_with_or_without_the_prefix_in_any_case(self):
        table = self.put(THREE_BY_THREE)
        for name in ("oddsratio", "ASSOC.ODDSRATIO", " Assoc.OddsRatio "):
            with self.subTest(name=name):
                self.assertIn("ASSOC.ODDSRATIO cannot be used here", self.words("F1", f'=ASSOC.CHECK({table}; "{name}")'))

    def test_gives_the_verdict_only_for_functions_that_test_independence(self):
        self.assertTrue(self.words("F1", f'=ASSOC.CHECK({self.put(TEAMS)}; "exact")').startswith("Sound:"))
        text = self.words("F2", f'=ASSOC.CHECK({self.put(FUNCTIONS["paired"]["approval"], row=5)}; "paired")')
        self.assertEqual(text, "ASSOC.PAIRED can be used on this range.")

    def test_leaves_out_a_function_that_cannot_use_the_range_when_another_can(self):
        # "corrected" is a word of ASSOC.STRATA and of ASSOC.PAIRED; a 2×2 paired table is no strata range.
        text = self.words("F1", f'=ASSOC.CHECK({self.put(FUNCTIONS["paired"]["approval"])}; "corrected")')
        self.assertEqual(text, '"corrected" can be used on this range.')


class ReportLimits(CalcTestCase):
    def test_report_says_why_the_exact_test_was_not_computed_within_its_short_limits(self):
        table = self.put(BEYOND_THE_CAP)
        started = time.monotonic()
        lines = {label: value for label, value in self.array("H1:I22", f"=ASSOC.REPORT({table})")}
        self.assertLess(time.monotonic() - started, 15)
        self.assertTrue(lines["p-value, exact test"].startswith("Not computed: the exact test for this table needs "
                                                                "more"), lines["p-value, exact test"])
        self.assertIn("ASSOC.SIMULATE", lines["p-value, exact test"])
        self.assertClose(lines["Pearson X²"], self.number("K1", f"=ASSOC.STATISTIC({table})"), 0, "X²")

    def test_report_says_weighted_counts_have_no_exact_p_value(self):
        lines = {label: value for label, value in self.array("H1:I22", f"=ASSOC.REPORT({self.put(WEIGHTED)})")}
        self.assertEqual(lines["p-value, exact test"], "Not computed: the exact test needs whole counts; this table "
                                                       "holds counts that are not whole numbers.")


__all__ = [name for name, value in dict(globals()).items() if isinstance(value, type) and name[0].isupper()
           and issubclass(value, CalcTestCase) and value is not CalcTestCase]
