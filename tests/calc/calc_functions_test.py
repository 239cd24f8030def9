#!/usr/bin/python3
"""The ASSOC.* functions in real headless Calc, through real cells.

    /usr/bin/python3 tests/calc/calc_functions_test.py --oxt build/extension/assoc.oxt [unittest options]

Installs the .oxt into a throwaway profile, starts one headless soffice (scripts/assoc_office.py),
and checks every function against outside references: the published figures in
tests/reference/published_values.md (named beside each check) and values computed with scipy 1.10.1,
numpy 1.24.2 and statsmodels 0.13.5 by make_reference_values.py (stored in reference_values.json).
Also: the Function Wizard's texts, errors for bad input with ASSOC.CHECK explaining them, and
results that survive saving as .ods and loading again. CTest runs it (tests/calc/CMakeLists.txt).

The tests of the functions added later (exact and simulated p-values, ratios, cell tests, goodness of
fit, power, counts from records, strata, paired, trend, selection impact) are in
calc_more_functions.py; both files share the one office through calc_support.py, and this file's
main runs them all.
"""
import time
import unittest

from calc_support import *  # noqa: F401,F403  (the session, the tables, CalcTestCase)
from calc_support import ROOT, assoc_office, run_harness, session
from calc_more_functions import *  # noqa: F401,F403  (the tests of the later functions)


class TheFunctionWizard(CalcTestCase):
    def test_lists_every_function_in_the_statistical_category_with_its_texts(self):
        descriptions = session.office.service("com.sun.star.sheet.FunctionDescriptions")
        statistical = uno.getConstantByName("com.sun.star.sheet.FunctionCategory.STATISTICAL")
        for function in generate.spec.FUNCTIONS:
            with self.subTest(function=function.name):
                self.assertTrue(descriptions.hasByName(function.name))
                entry = {p.Name: p.Value for p in descriptions.getByName(function.name)}
                self.assertEqual(entry["Category"], statistical)
                self.assertEqual(entry["Description"], function.description)
                arguments = entry["Arguments"]
                self.assertEqual([a.Name for a in arguments], [a.name for a in function.arguments])
                self.assertEqual([a.Description for a in arguments],
                                 [generate.argument_description(a) for a in function.arguments])
                # Calc makes any-typed arguments optional; the ranges (tables and others) are required.
                self.assertEqual([a.IsOptional for a in arguments],
                                 [a.kind not in generate.REQUIRED_RANGE_KINDS for a in function.arguments])


class ExpectedCounts(CalcTestCase):
    def test_match_scipy_for_the_agresti_table_with_headers(self):
        table = self.put(PARTY)
        got = self.array("F1:H2", f"=ASSOC.EXPECTED({table})")
        self.assertAllClose(got, REFERENCE["party"]["expected"], what="expected counts (scipy expected_freq)")

    def test_are_the_same_without_headers(self):
        table = self.put(PARTY_BODY)
        got = self.array("F1:H2", f"=ASSOC.EXPECTED({table})")
        self.assertAllClose(got, REFERENCE["party"]["expected"], what="expected counts (scipy expected_freq)")

    def test_keep_the_body_shape_with_zeros_where_rows_and_columns_were_set_aside(self):
        table = self.put(BRANCHES)
        got = self.array("H1:L4", f"=ASSOC.EXPECTED({table})")
        want = expand(REFERENCE["branches"]["expected"], 4, 5, BRANCHES_KEPT_ROWS, BRANCHES_KEPT_COLUMNS)
        self.assertAllClose(got, want, what="expected counts (scipy expected_freq), body shape")


class TestStatistics(CalcTestCase):
    def test_pearson_and_g_match_agresti(self):
        table = self.put(PARTY)
        # Agresti (2007) quotes X² ≈ 30.1 and G² ≈ 30.0 (published_values.md section 3).
        pearson = self.number("F1", f"=ASSOC.STATISTIC({table})")
        g = self.number("F2", f'=ASSOC.STATISTIC({table}; "g")')
        self.assertEqual(round(pearson, 1), 30.1)
        self.assertEqual(round(g, 1), 30.0)
        # Full precision: scipy 1.10.1 chi2_contingency.
        self.assertClose(pearson, REFERENCE["party"]["pearson"][0], what="Pearson X²")
        self.assertClose(g, REFERENCE["party"]["g"][0], what="G²")
        self.assertClose(self.number("F3", f'=ASSOC.STATISTIC({table}; "pearson")'), pearson, 0, "default")

    def test_entered_as_a_row_give_statistic_degrees_of_freedom_and_p_value(self):
        table = self.put(PARTY_BODY)
        got = self.array("F1:H1", f'=ASSOC.STATISTIC({table}; "g")')
        want = REFERENCE["party"]["g"]
        self.assertAllClose(got, [[want[0], 2.0, want[1]]], 1e-10, "G², df, p (scipy)")

    def test_yates_matches_scipy_on_a_two_by_two_table(self):
        table = self.put(TEAMS)
        got = self.array("F1:H1", f'=ASSOC.STATISTIC({table}; "yates")')
        want = REFERENCE["teams"]["yates"]
        self.assertAllClose(got, [[want[0], 1.0, want[1]]], 1e-10, "Yates X², df, p (scipy, correction=True)")

    def test_option_words_ignore_case_and_spaces(self):
        table = self.put(TEAMS)
        self.assertClose(self.number("F1", f'=ASSOC.STATISTIC({table}; " Yates ")'),
                         REFERENCE["teams"]["yates"][0], what="Yates X²")
        self.assertClose(self.number("F2", f'=ASSOC.STATISTIC({table}; "G")'), REFERENCE["teams"]["g"][0], what="G²")

    def test_p_values_match_agresti_and_scipy(self):
        table = self.put(PARTY)
        # published_values.md section 3: p 2.9535891832e-07 (X²) and 3.0335979106e-07 (G²).
        self.assertClose(self.number("F1", f"=ASSOC.PVALUE({table})"), 2.9535891832e-07, 1e-9, "p of X²")
        self.assertClose(self.number("F2", f'=ASSOC.PVALUE({table}; "g")'), 3.0335979106e-07, 1e-9, "p of G²")
        teams = self.put(TEAMS, row=5)
        self.assertClose(self.number("F3", f'=ASSOC.PVALUE({teams}; "yates")'), REFERENCE["teams"]["yates"][1],
                         1e-10, "p of Yates X² (scipy)")

    def test_degrees_of_freedom_count_only_rows_and_columns_with_counts(self):
        self.assertEqual(self.number("H1", f"=ASSOC.DF({self.put(PARTY)})"), 2)
        self.assertEqual(self.number("H2", f"=ASSOC.DF({self.put(BRANCHES, row=5)})"), REFERENCE["branches"]["df"])

    def test_blank_cells_count_as_zero(self):
        with_blank = self.put(BRANCHES)
        with_zero = self.put([[0 if v is None else v for v in row] for row in BRANCHES], row=6)
        self.assertClose(self.number("H1", f"=ASSOC.STATISTIC({with_blank})"), REFERENCE["branches"]["pearson"][0],
                         what="X² of the table with a blank (scipy)")
        self.assertEqual(self.number("H2", f"=ASSOC.STATISTIC({with_zero})"),
                         self.number("H3", f"=ASSOC.STATISTIC({with_blank})"))
        self.assertIn("1 blank cell was read as 0.", self.words("H4", f"=ASSOC.CHECK({with_blank})"))


class CriticalValues(CalcTestCase):
    def test_match_the_nist_table(self):
        # NIST/SEMATECH e-Handbook of Statistical Methods 1.3.6.7.4, upper-tail critical values
        # (3 decimals; published_values.md section 1).
        for df, alpha, nist in [(1, 0.05, 3.841), (2, 0.05, 5.991), (4, 0.05, 9.488), (10, 0.05, 18.307),
                                (1, 0.01, 6.635), (4, 0.01, 13.277), (30, 0.01, 50.892), (10, 0.001, 29.588)]:
            with self.subTest(df=df, alpha=alpha):
                self.assertEqual(round(self.number("A1", f"=ASSOC.CRITICAL({df}; {alpha})"), 3), nist)

    def test_match_scipy_to_full_precision(self):
        for entry in CRITICAL:
            with self.subTest(**entry):
                got = self.number("A1", f"=ASSOC.CRITICAL({entry['df']}; {entry['alpha']})")
                self.assertClose(got, entry["value"], 1e-12, "scipy chi2.isf")

    def test_use_alpha_five_percent_when_it_is_omitted(self):
        # published_values.md section 1: df 2, alpha 0.05, mpmath 50-digit root 5.99146454710798199.
        self.assertClose(self.number("A1", "=ASSOC.CRITICAL(2)"), 5.99146454710798199, 1e-12, "df 2")
        self.put([[2]], column=2)
        self.assertClose(self.number("A2", "=ASSOC.CRITICAL(C1)"), 5.99146454710798199, 1e-12, "df from a cell")


class Residuals(CalcTestCase):
    def test_adjusted_residuals_match_agresti(self):
        table = self.put(PARTY)
        got = self.array("F1:H2", f'=ASSOC.RESIDUALS({table}; "adjusted")')
        # Agresti (2007) section 2.4.5 (figures from R's ?chisq.test page): 4.50, 0.70, −5.32.
        self.assertEqual([round(v, 2) for v in got[0]], [4.50, 0.70, -5.32])
        self.assertEqual([round(v, 2) for v in got[1]], [-4.50, -0.70, 5.32])
        self.assertAllClose(got, REFERENCE["party"]["residuals"]["adjusted"], 1e-10,
                            "adjusted residuals (statsmodels Table.standardized_resids)")

    def test_every_kind_matches_statsmodels_in_the_body_shape(self):
        table = self.put(BRANCHES)
        for number, kind in enumerate(["pearson", "adjusted", "raw", "contribution", "percent"]):
            with self.subTest(kind=kind):
                top = 6 * number
                got = self.array(address(7, top, 5, 4), f'=ASSOC.RESIDUALS({table}; "{kind}")')
                want = expand(REFERENCE["branches"]["residuals"][kind], 4, 5, BRANCHES_KEPT_ROWS,
                              BRANCHES_KEPT_COLUMNS)
                self.assertAllClose(got, want, 1e-10, f"{kind} residuals (statsmodels 0.13.5 Table)")

    def test_default_to_pearson_residuals(self):
        table = self.put(TEAMS)
        got = self.array("F1:G2", f"=ASSOC.RESIDUALS({table})")
        self.assertAllClose(got, REFERENCE["teams"]["residuals"]["pearson"], 1e-12, "Pearson residuals")


class Strength(CalcTestCase):
    def test_cramers_v_and_its_correction_match_the_references(self):
        table = self.put(PARTY)
        # published_values.md sections 3 and 11: V = 0.10443580236, bias-corrected 0.10091998278.
        self.assertClose(self.number("F1", f"=ASSOC.STRENGTH({table})"), 0.10443580236, 1e-10, "V")
        self.assertClose(self.number("F2", f'=ASSOC.STRENGTH({table}; "cramer-corrected")'), 0.10091998278, 1e-10,
                         "corrected V")

    def test_every_measure_matches_the_reference_libraries(self):
        for name in ("party", "teams"):
            rows = PARTY if name == "party" else TEAMS
            table = self.put(rows)
            for measure, want in REFERENCE[name]["strength"].items():
                with self.subTest(table=name, measure=measure):
                    # scipy association (cramer, contingency), numpy corrcoef (phi), formulas (w, corrected)
                    got = self.number("H1", f'=ASSOC.STRENGTH({table}; "{measure}")')
                    self.assertClose(got, want, 1e-10, f"{measure} of {name}")

    def test_phi_is_signed(self):
        # Swapping the columns of a 2×2 table turns phi around (exact identity).
        teams = self.put(TEAMS)
        swapped = self.put([[row[0], row[2], row[1]] for row in TEAMS], row=5)
        self.assertClose(self.number("F1", f'=ASSOC.STRENGTH({swapped}; "phi")'),
                         -self.number("F2", f'=ASSOC.STRENGTH({teams}; "phi")'), 1e-14, "phi")


class Check(CalcTestCase):
    def test_calls_a_large_table_sound(self):
        text = self.words("F1", f"=ASSOC.CHECK({self.put(PARTY)})")
        self.assertTrue(text.startswith("Sound: the smallest expected count is 246"), text)

    def test_calls_a_sparse_table_doubtful(self):
        # Fisher's tea-tasting table [[3,1],[1,3]]: every expected count is 2 (exact).
        text = self.words("H1", f"=ASSOC.CHECK({self.put([[3, 1], [1, 3]])})")
        self.assertTrue(text.startswith("Doubtful: the smallest expected count is 2,"), text)

    def test_mentions_blanks_and_what_was_set_aside(self):
        text = self.words("H1", f"=ASSOC.CHECK({self.put(BRANCHES)})")
        self.assertIn("1 blank cell was read as 0.", text)
        self.assertIn('The row "Depot" has no counts and was set aside.', text)
        self.assertIn('The column "Voided" has no counts and was set aside.', text)

    def test_says_an_option_word_can_be_used(self):
        text = self.words("F1", f'=ASSOC.CHECK({self.put(TEAMS)}; "Yates")')
        self.assertIn('"yates" can be used on this table.', text)


class ReportBlock(CalcTestCase):
    def test_gives_labels_and_values_for_the_agresti_table(self):
        table = self.put(PARTY)
        block = self.array("F1:G22", f"=ASSOC.REPORT({table})")
        lines = {label: value for label, value in block}
        self.assertEqual(len(lines), 22)
        self.assertEqual(lines["Total count (n)"], 2757)
        self.assertEqual(lines["Degrees of freedom"], 2)
        self.assertClose(lines["Pearson X²"], REFERENCE["party"]["pearson"][0], what="X² (scipy)")
        self.assertClose(lines["p-value, Pearson X²"], 2.9535891832e-07, 1e-9, "p (published_values.md section 3)")
        self.assertClose(lines["Likelihood-ratio G²"], REFERENCE["party"]["g"][0], what="G² (scipy)")
        self.assertClose(lines["p-value, G²"], 3.0335979106e-07, 1e-9, "p of G² (published_values.md section 3)")
        self.assertEqual(lines["Rows with counts"], 2)
        self.assertEqual(lines["Columns with counts"], 3)
        self.assertEqual(lines["Yates-corrected X²"], "2×2 tables only")
        # Exact arithmetic: the smallest expected count is males × Independent, 1200 · 566 / 2757.
        self.assertClose(lines["Smallest expected count"], 1200 * 566 / 2757, 1e-12, "smallest E (exact)")
        self.assertEqual(lines["Share of cells expecting fewer than 5"], 0)
        self.assertTrue(lines["Validity"].startswith("Sound"), lines["Validity"])
        self.assertClose(lines["Critical X² at 5%"], 5.991464547107983, 1e-12, "critical (NIST, scipy)")
        self.assertTrue(lines["Decision at 5%"].startswith("Independence rejected"))
        self.assertClose(lines["Cramér's V"], 0.10443580236, 1e-10, "V (published_values.md section 3)")
        # V = 0.104 (published_values.md section 3) is w = 0.104 for two rows: weak by Cohen's bands.
        self.assertEqual(lines["Conclusion"], "At the 5% level, gender and party appear associated (p = 3.0e-07), but "
                                              "the association is weak: Cramér's V is 0.10 (Cohen's bands for w = "
                                              "V·√(min(rows, columns) − 1): below 0.1 very weak, from 0.1 weak, from "
                                              "0.3 moderate, from 0.5 strong).")
        self.assertIn("not proof of cause, nor of discrimination", lines["Caution"])
        self.assertEqual(block[-1][0], "Caution")

    def test_gives_the_exact_p_value_the_interval_of_v_and_the_cells_that_stand_out(self):
        lines = {label: value for label, value in self.array("F1:G22", f"=ASSOC.REPORT({self.put(PARTY)})")}
        # R 4.2.2 fisher.test (make_reference_values.py).
        self.assertClose(lines["p-value, exact test"], FUNCTIONS["exact"]["party"]["two_sided"], 1e-8,
                         "exact p (R fisher.test)")
        # scipy 1.10.1 ncx2 roots for the observed X² (make_reference_values.py).
        lower, upper = FUNCTIONS["party_v_interval"]
        self.assertClose(lines["Cramér's V, lower 95% limit"], lower, 1e-9, "lower limit of V (scipy)")
        self.assertClose(lines["Cramér's V, upper 95% limit"], upper, 1e-9, "upper limit of V (scipy)")
        # Agresti (2007) section 2.4.5: adjusted residuals 4.50, 0.70, −5.32 (females; males the
        # opposite, so with two rows only the females' cells are named).
        self.assertEqual(lines["Cells that stand out"],
                         "Females × Republican: fewer than expected (adjusted residual -5.3); "
                         "Females × Democrat: more than expected (adjusted residual 4.5)")

    def test_tells_the_exact_p_value_in_its_conclusion_when_the_approximation_is_doubtful(self):
        lines = {label: value for label, value in self.array("F1:G22", f"=ASSOC.REPORT({self.put([[3, 1], [1, 3]])})")}
        # Fisher's tea-tasting table (published_values.md section 2): two-sided exact p = 34/70.
        self.assertClose(lines["p-value, exact test"], 34 / 70, 1e-12, "exact p (Fisher 1935)")
        self.assertTrue(lines["Conclusion"].endswith("the exact test gives p = 0.486."), lines["Conclusion"])
        self.assertEqual(lines["Cells that stand out"], "None: no cell's adjusted residual is beyond ±2")

    def test_takes_alpha_and_gives_yates_for_a_two_by_two_table(self):
        table = self.put(TEAMS)
        block = self.array("F1:G22", f"=ASSOC.REPORT({table}; 0.01)")
        lines = {label: value for label, value in block}
        self.assertClose(lines["Yates-corrected X²"], REFERENCE["teams"]["yates"][0], 1e-10, "Yates (scipy)")
        self.assertClose(lines["Critical X² at 1%"], 6.634896601021217, 1e-12, "critical df 1 at 1% (NIST, scipy)")
        # p = 0.0107 (scipy): not below 1%.
        self.assertTrue(lines["Decision at 1%"].startswith("Independence not rejected"))

    def test_shows_its_first_label_when_entered_in_one_cell(self):
        self.assertEqual(self.words("F1", f"=ASSOC.REPORT({self.put(TEAMS)})"), "Total count (n)")


class BadInput(CalcTestCase):
    # (what, table, formula of the failing function, ASSOC.CHECK's second argument, its explanation)
    CASES = [
        ("text among the counts", [["", "Yes", "No"], ["North", 3, 7], ["South", 2, "n/a"]],
         "=ASSOC.STATISTIC({t})", None,
         'Cannot use this table: row 3 ("South"), column 3 ("No") holds the text "n/a"; counts must be numbers.'),
        ("a negative count", [[4, 7], [2, -1]], "=ASSOC.PVALUE({t})", None,
         "Cannot use this table: row 2, column 2 holds the number -1; counts cannot be negative."),
        ("a table of one row", [[4, 5, 6]], "=ASSOC.DF({t})", None,
         "Cannot use this table: the table has only 1 row with counts; a test of association needs at least "
         "2 rows and 2 columns with counts."),
        ("an unknown method", THREE_BY_THREE, '=ASSOC.STATISTIC({t}; "chi")', '"chi"',
         '"chi" is not an option word or the name of an ASSOC function; did you mean "phi"?'),
        ("an unknown residual kind", THREE_BY_THREE, '=ASSOC.RESIDUALS({t}; "studentized")', '"studentized"',
         '"studentized" is not an option word or the name of an ASSOC function'),
        ("yates on a 3×3 table", THREE_BY_THREE, '=ASSOC.STATISTIC({t}; "yates")', '"yates"',
         'ASSOC.STATISTIC and ASSOC.PVALUE with "yates" cannot be used here: Yates\' correction applies to '
         "2×2 tables only; this table has 3 rows and 3 columns with counts."),
        ("phi on a 3×3 table", THREE_BY_THREE, '=ASSOC.STRENGTH({t}; "phi")', '"phi"',
         'ASSOC.STRENGTH with "phi" cannot be used here: phi is defined for 2×2 tables only'),
        ("a number as option word", THREE_BY_THREE, "=ASSOC.STATISTIC({t}; 3)", "3",
         "The second argument must be an option word"),
    ]

    def test_gives_err502_and_check_explains_it(self):
        for what, rows, failing, word, explanation in self.CASES:
            with self.subTest(what):
                table = self.put(rows)
                cell = self.formula("H1", failing.format(t=table))
                self.assertEqual(cell.getError(), ERR_ILLEGAL_ARGUMENT, f"{what}: {failing}")
                check = f"=ASSOC.CHECK({table})" if word is None else f"=ASSOC.CHECK({table}; {word})"
                self.assertIn(explanation, self.words("H2", check))
                self.sheet.getCellRangeByName("A1:H3").clearContents(0xFFFF)

    def test_array_functions_fill_every_cell_with_the_error(self):
        block = self.array_formula("F1:H3", f'=ASSOC.RESIDUALS({self.put(THREE_BY_THREE)}; "bogus")')
        self.assertEqual({block.getCellByPosition(c, r).getError() for r in range(3) for c in range(3)},
                         {ERR_ILLEGAL_ARGUMENT})

    def test_critical_value_rejects_alpha_outside_zero_and_one_and_a_missing_df(self):
        self.assertEqual(self.formula("A1", "=ASSOC.CRITICAL(2; 1.5)").getError(), ERR_ILLEGAL_ARGUMENT)
        self.assertEqual(self.formula("A2", '=ASSOC.CRITICAL("two")').getError(), ERR_ILLEGAL_ARGUMENT)
        self.assertEqual(self.formula("A3", "=ASSOC.CRITICAL(C9)").getError(), ERR_ILLEGAL_ARGUMENT)  # blank: 0

    def test_a_huge_range_is_refused_quickly(self):
        started = time.monotonic()
        self.put([[1, 2], [3, 4]])
        self.put([[5]], column=10, row=99999)  # K100000: the range is used up to its last cell
        self.assertEqual(self.formula("M1", "=ASSOC.STATISTIC(A1:K100000)").getError(), ERR_ILLEGAL_ARGUMENT)
        self.assertIn("at most 1,000,000", self.words("M2", "=ASSOC.CHECK(A1:K100000)"))
        self.assertLess(time.monotonic() - started, 30)

    def test_the_office_keeps_working_afterwards(self):
        for what, rows, failing, _, _ in self.CASES:
            self.formula("H1", failing.format(t=self.put(rows)))
        table = self.put(PARTY, row=10)
        self.assertClose(self.number("H12", f"=ASSOC.STATISTIC({table})"), REFERENCE["party"]["pearson"][0],
                         what="X² after the errors")


class WholeColumnsAndRows(CalcTestCase):
    """Trailing blank rows and columns are not part of a range, so a whole-column reference (A:E), a
    whole-row one (1:3) or a range drawn generously below a growing table reads as the table it holds."""

    def test_a_whole_column_reference_reads_the_table_it_holds(self):
        self.put(PARTY)
        # published_values.md section 3: Agresti's X² 30.0701 (scipy to full precision).
        self.assertClose(self.number("H1", "=ASSOC.STATISTIC(A:D)"), REFERENCE["party"]["pearson"][0],
                         what="X² over A:D (scipy)")
        self.assertEqual(self.number("H2", "=ASSOC.DF(A:D)"), 2)

    def test_a_whole_row_reference_reads_the_table_it_holds(self):
        self.put(PARTY)
        self.assertClose(self.number("A5", "=ASSOC.PVALUE(1:3)"), 2.9535891832e-07, 1e-9,
                         "p of X² over rows 1:3 (published_values.md section 3)")

    def test_a_range_drawn_below_the_table_gives_the_same_array_as_the_table(self):
        table = self.put(PARTY)
        exact = self.array("H1:J2", f"=ASSOC.EXPECTED({table})")
        generous = self.array("H4:J5", "=ASSOC.EXPECTED(A1:F100000)")
        self.assertEqual(generous, exact)

    def test_check_speaks_of_the_table_not_of_the_blank_rows(self):
        self.put(TEAMS)
        text = self.words("H1", "=ASSOC.CHECK(A1:C300000)")
        self.assertLess(len(text), 400)
        self.assertNotIn("set aside", text)


class SavedDocuments(CalcTestCase):
    def test_give_the_same_results_after_saving_as_ods_and_loading_again(self):
        doc = session.office.new_spreadsheet()
        try:
            sheet = doc.Sheets.getByIndex(0)
            sheet.getCellRangeByName("A1:D3").setDataArray(
                tuple(tuple(float(v) if isinstance(v, int) else v for v in row) for row in PARTY))
            formulas = {"F1": "=ASSOC.STATISTIC(A1:D3)", "F2": '=ASSOC.PVALUE(A1:D3; "g")', "F3": "=ASSOC.DF(A1:D3)",
                        "F4": "=ASSOC.CRITICAL(F3; 0.01)", "F5": '=ASSOC.STRENGTH(A1:D3; "cramer-corrected")',
                        "F6": '=ASSOC.CHECK(A1:D3; "yates")'}
            for cell, text in formulas.items():
                sheet.getCellRangeByName(cell).setFormula(text)
            arrays = {"H1:J2": '=ASSOC.RESIDUALS(A1:D3; "adjusted")', "H4:J5": "=ASSOC.EXPECTED(A1:D3)",
                      "L1:M22": "=ASSOC.REPORT(A1:D3)"}
            for cells, text in arrays.items():
                sheet.getCellRangeByName(cells).setArrayFormula(text)
            doc.calculateAll()
            before = sheet.getCellRangeByName("A1:M22").getDataArray()
            path = session.office.scratch_path("saved.ods")
            doc.storeToURL(assoc_office.file_url(path), assoc_office.properties(FilterName="calc8"))
        finally:
            doc.close(True)
        self.assertIn(b"ORG.ASSOCPROJECT.CALC.FUNCTIONS.STATISTIC", _content_xml(path).upper())

        loaded = session.office.load(path)
        try:
            loaded.calculateAll()
            sheet = loaded.Sheets.getByIndex(0)
            after = sheet.getCellRangeByName("A1:M22").getDataArray()
            self.assertEqual(after, before)
            self.assertEqual(sheet.getCellRangeByName("F1").getError(), 0)
            self.assertEqual(sheet.getCellRangeByName("F1").FormulaLocal, "=ASSOC.STATISTIC(A1:D3)")
        finally:
            loaded.close(True)


class TheSampleWorkbook(CalcTestCase):
    def test_computes_without_error_cells(self):
        doc = session.office.load(ROOT / "samples" / "promotions.fods")
        try:
            doc.calculateAll()
            sheet = doc.Sheets.getByIndex(0)
            cursor = sheet.createCursor()
            cursor.gotoEndOfUsedArea(False)
            used = sheet.getCellRangeByPosition(0, 0, cursor.RangeAddress.EndColumn, cursor.RangeAddress.EndRow)
            errors = [(c, r) for r in range(used.Rows.Count) for c in range(used.Columns.Count)
                      if used.getCellByPosition(c, r).getError() != 0]
            self.assertEqual(errors, [])
            self.assertTrue(doc.NamedRanges.hasByName("AssocReport"))
        finally:
            doc.close(True)


def _content_xml(path):
    import zipfile
    with zipfile.ZipFile(path) as archive:
        return archive.read("content.xml")


if __name__ == "__main__":
    run_harness(__doc__)
