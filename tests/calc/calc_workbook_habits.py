#!/usr/bin/python3
"""Workbook habits in real headless Calc: each habit of issue 10's table (and a few more of our own)
gives the value its author meant, or a refusal, and ASSOC.CHECK says in words what it found.

    /usr/bin/python3 tests/calc/calc_workbook_habits.py --oxt build/extension/assoc.oxt [unittest options]

The data are invented (a fictional company). Expected values are exact identities: a table with its
total row and column set aside gives the same p-value as the table without them; a paired table whose
columns come in another order gives the same result as the one in order; records counted from whole
columns give the same table as the records counted from their exact ranges. Where a value is new it
is named beside its check (scipy 1.10.1 or exact arithmetic). The guide's section "Workbook habits"
describes each case; CTest runs this file as calc.workbook_habits.
"""
import math
import unittest

from calc_support import ERR_ILLEGAL_ARGUMENT, CalcTestCase, address, run_harness, session

ERR_NO_VALUE_IN_RANGE = 504  # Calc does not call an add-in whose range holds an error cell

# Promotions by department, the same table with and without its totals (invented).
PROMOTIONS = [["Department / Outcome", "Promoted", "Not promoted"], ["Sales", 30, 45], ["Legal", 10, 80],
              ["Support", 22, 41]]
WITH_TOTALS = [["Department / Outcome", "Promoted", "Not promoted", "Total"], ["Sales", 30, 45, 75],
               ["Legal", 10, 80, 90], ["Support", 22, 41, 63], ["Total", 62, 166, 228]]


def column(values):
    return [[v] for v in values]


def setUpModule():
    session.document.lockControllers()  # nothing is painted (uno-notes: a host crash in idle painting)


class HabitCase(CalcTestCase):
    def refused(self, formula, check, *explanations):
        """`formula` shows Err:502 and the ASSOC.CHECK formula `check` says each of `explanations`."""
        cell = self.formula("Z1", formula)
        self.assertEqual(cell.getError(), ERR_ILLEGAL_ARGUMENT, formula)
        text = self.words("Z2", check)
        for explanation in explanations:
            self.assertIn(explanation, text)
        self.sheet.getCellRangeByName("Z1:Z2").clearContents(0xFFFF)
        return text

    def lines(self, cells, formula):
        return {label: value for label, value in self.array(cells, formula)}


class TotalsInsideTheRange(HabitCase):
    def test_a_total_row_and_column_give_the_answer_of_the_table_without_them(self):
        with_totals = self.put(WITH_TOTALS)
        without = self.put(PROMOTIONS, row=10)
        self.assertEqual(self.number("H1", f"=ASSOC.PVALUE({with_totals})"), self.number("H2", f"=ASSOC.PVALUE({without})"))
        self.assertEqual(self.number("H3", f"=ASSOC.EXACT({with_totals})"), self.number("H4", f"=ASSOC.EXACT({without})"))
        text = self.words("H5", f"=ASSOC.CHECK({with_totals})")
        self.assertTrue(text.startswith("Sound:"), text)
        self.assertIn('The row "Total" is a total and was set aside. The column "Total" is a total and was set aside.',
                      text)
        report = self.lines("J1:K22", f"=ASSOC.REPORT({with_totals})")
        self.assertEqual(report["Total count (n)"], 228)
        self.assertIn('The row "Total" is a total and was set aside.', report["Validity"])

    def test_total_words_of_other_languages_and_cases_are_set_aside(self):
        for word in ("Gesamt", "GRAND TOTAL", "Summe", "Totaal", "Total:"):
            with self.subTest(word=word):
                rows = [row[:] for row in WITH_TOTALS]
                rows[-1][0] = word
                table = self.put(rows)
                self.assertEqual(self.number("H1", f"=ASSOC.DF({table})"), 2)
                self.assertIn("is a total and was set aside", self.words("H2", f"=ASSOC.CHECK({table})"))

    def test_a_total_line_without_a_label_is_refused_with_words(self):
        table = self.put([[30, 45], [10, 80], [22, 41], [62, 166]])
        self.refused(f"=ASSOC.PVALUE({table})", f"=ASSOC.CHECK({table})",
                     "Cannot use this table: row 4 holds the sum of rows 1–3 in every column, so it looks like a total",
                     'label it "Total"')

    def test_a_line_labelled_as_data_that_holds_the_sum_is_doubtful_not_sound(self):
        rows = [row[:] for row in WITH_TOTALS]
        rows[-1][0] = "Finance"
        table = self.put([row[:3] for row in rows])
        text = self.words("H1", f"=ASSOC.CHECK({table})")
        self.assertTrue(text.startswith('Doubtful: The row "Finance" holds the sum of the other rows'), text)

    def test_functions_without_the_verdict_say_what_they_set_aside(self):
        table = self.put([["Team", "Yes", "No", "Total"], ["A", 10, 30, 40], ["B", 5, 40, 45], ["Total", 15, 70, 85]])
        paired = self.put([["Before/After", "Yes", "No", "Total"], ["Yes", 20, 5, 25], ["No", 15, 30, 45],
                           ["Total", 35, 35, 70]], row=10)
        for word in ("rates", "ratediff", "trend", "ordinal", "paired"):
            with self.subTest(function=word):
                source = paired if word == "paired" else table
                text = self.words("H1", f'=ASSOC.CHECK({source}; "{word}")')
                self.assertIn('The row "Total" is a total and was set aside. The column "Total" is a total and was '
                              "set aside.", text)

    def test_a_stratum_that_names_everyone_and_holds_the_sums_is_set_aside(self):
        strata = [["Office", "Group", "Yes", "No", "Maybe"], ["North", "Women", 5, 10, 3], ["North", "Men", 8, 9, 4],
                  ["South", "Women", 7, 3, 2], ["South", "Men", 6, 6, 5], ["East", "Women", 2, 6, 1],
                  ["East", "Men", 4, 3, 2]]
        whole = [["All offices", "Women", 14, 19, 6], ["All offices", "Men", 18, 18, 11]]
        with_whole = self.put(strata + whole)
        without = self.put(strata, row=12)
        self.assertEqual(self.number("H1", f"=ASSOC.WITHIN({with_whole})"), self.number("H2", f"=ASSOC.WITHIN({without})"))
        self.assertIn('The rows of "All offices" hold the sums of the other strata and were set aside as totals.',
                      self.words("H3", f'=ASSOC.CHECK({with_whole}; "within")'))
        two_by_two = [row[:4] for row in strata]
        with_whole = self.put(two_by_two + [row[:4] for row in whole], column=8)
        without = self.put(two_by_two, row=12, column=8)
        self.assertEqual(self.number("H4", f"=ASSOC.STRATA({with_whole})"), self.number("H5", f"=ASSOC.STRATA({without})"))
        self.assertIn('The rows of "All offices" hold the sums of the other strata and were set aside as totals.',
                      self.words("H6", f'=ASSOC.CHECK({with_whole}; "strata")'))

    def test_a_line_that_names_everyone_and_holds_the_sum_is_set_aside(self):
        rows = [row[:3] for row in WITH_TOTALS]
        rows[-1][0] = "All staff"
        table = self.put(rows)
        without = self.put(PROMOTIONS, row=10)
        self.assertEqual(self.number("H1", f"=ASSOC.PVALUE({table})"), self.number("H2", f"=ASSOC.PVALUE({without})"))
        text = self.words("H3", f"=ASSOC.CHECK({table})")
        self.assertTrue(text.startswith("Sound:"), text)
        self.assertIn('The row "All staff" is a total and was set aside.', text)


    def test_a_column_of_group_sizes_beside_the_counts_is_set_aside(self):
        rows = [row[:] for row in WITH_TOTALS[:-1]]
        rows[0][3] = "Headcount"
        table = self.put(rows)
        without = self.put(PROMOTIONS, row=10)
        self.assertEqual(self.number("H1", f"=ASSOC.PVALUE({table})"), self.number("H2", f"=ASSOC.PVALUE({without})"))
        text = self.words("H3", f"=ASSOC.CHECK({table})")
        self.assertTrue(text.startswith("Sound:"), text)
        self.assertIn('The column "Headcount" is a total and was set aside.', text)


class LinesThatHoldNoCounts(HabitCase):
    def test_an_expected_column_beside_the_observed_counts_makes_the_table_doubtful(self):
        table = self.put([["Office", "Observed", "Expected"], ["North", 10, 12], ["South", 20, 18], ["East", 15, 15]])
        text = self.words("H1", f"=ASSOC.CHECK({table})")
        self.assertTrue(text.startswith('Doubtful: The column "Expected" is labelled as a target, a plan or an '
                                        'expected number, not as a number of people or items, and was tested as '
                                        'counts'), text)

    def test_a_row_of_averages_under_the_counts_makes_the_table_doubtful(self):
        table = self.put([["Dept", "Yes", "No"], ["Sales", 30, 45], ["Legal", 10, 80], ["Audit", 20, 61],
                          ["Average", 20, 62]])
        text = self.words("H1", f"=ASSOC.CHECK({table})")
        self.assertTrue(text.startswith('Doubtful: The row "Average" is labelled as an average, a rate or a share'),
                        text)

    def test_a_column_of_blank_answers_from_a_summary_of_records_makes_the_table_doubtful(self):
        table = self.put([["Dept", "Yes", "No", "(empty)"], ["Sales", 12, 30, 3], ["Legal", 8, 25, 2]])
        text = self.words("H1", f"=ASSOC.CHECK({table})")
        self.assertTrue(text.startswith('Doubtful: The column "(empty)" is labelled as a missing value'), text)

    def test_a_row_numbering_the_columns_under_the_header_makes_the_table_doubtful(self):
        table = self.put([["Dept", "Yes", "No"], [None, 1, 2], ["Sales", 12, 30], ["Legal", 8, 25]])
        text = self.words("H1", f"=ASSOC.CHECK({table})")
        self.assertTrue(text.startswith("Doubtful: Row 2 has no label, unlike the other rows"), text)

    def test_a_number_stored_as_text_is_refused_saying_so(self):
        table = self.put([["Dept", "Yes", "No"], ["Sales", "12", 30], ["Legal", 8, 25]])
        self.refused(f"=ASSOC.PVALUE({table})", f"=ASSOC.CHECK({table})", "a number stored as text")

    def test_a_part_line_under_the_line_it_breaks_down_is_refused(self):
        table = self.put([["Dept", "Yes", "No"], ["Sales", 12, 30], ["of which managers", 3, 8], ["Legal", 8, 25]])
        self.refused(f"=ASSOC.PVALUE({table})", f"=ASSOC.CHECK({table})",
                     'the row "of which managers" reads as a part of what the rows before it count')

    def test_a_count_beside_the_whole_group_it_is_part_of_is_refused(self):
        # Invented: hires beside applicants, as typed for selection rates.
        table = self.put([["Office", "Hired", "Applicants"], ["North", 10, 50], ["South", 12, 40]])
        self.refused(f"=ASSOC.PVALUE({table})", f"=ASSOC.CHECK({table})",
                     'the column "Applicants" names the whole group and holds at least as many as the column "Hired"')
        self.refused(f"=ASSOC.RATES({table})", f'=ASSOC.CHECK({table}; "rates")',
                     'replace it with the rest, its counts minus those of the column "Hired"')

    def test_a_plan_typed_in_another_order_is_matched_to_the_counts_by_label(self):
        # Invented: staff by region against a plan listing the regions in another order. By label,
        # X² = 0 + 25/50 + 25/20 = 1.75 on 2 degrees of freedom, p = exp(-1.75/2) (exact identity).
        observed = self.put([["Region", "Staff"], ["North", 30], ["South", 45], ["East", 25]])
        plan = self.put([["Region", "Plan"], ["South", 50], ["North", 30], ["East", 20]], column=3)
        self.assertAlmostEqual(self.number("H1", f"=ASSOC.FIT({observed}; {plan})"), math.exp(-0.875), places=12)
        plan = self.put([["Region", "Plan"], ["South", 50], ["North", 30], ["West", 20]], column=3)
        self.assertEqual(self.formula("H1", f"=ASSOC.FIT({observed}; {plan})").getError(), ERR_ILLEGAL_ARGUMENT)

    def test_bands_typed_out_of_order_are_refused_for_a_trend(self):
        table = self.put([["Service", "5-10 years", "0-2 years", "2-5 years", "10+ years"],
                          ["Promoted", 12, 3, 5, 8], ["Not promoted", 10, 30, 25, 20]])
        self.refused(f"=ASSOC.TREND({table})", f'=ASSOC.CHECK({table}; "trend")',
                     'the columns\' labels name an order ("0-2 years", "2-5 years", "5-10 years" and "10+ years")')

    def test_records_counted_by_a_column_of_ids_are_refused(self):
        ids = self.put([["E101"], ["E102"], ["E103"], ["E104"], ["E105"], ["E106"]])
        answers = self.put([["Yes"], ["No"], ["Yes"], ["No"], ["No"], ["Yes"]], column=1)
        self.refused(f"=ASSOC.PVALUE(ASSOC.COUNTS({ids}; {answers}))", '=ASSOC.CHECK(A1:B6; "counts")',
                     'every record has a row label of its own ("E101", "E102", …), as IDs, names or dates do')

    def test_a_measure_of_each_group_beside_the_counts_makes_the_table_doubtful(self):
        # Invented: promotions by department with the average age typed in a column headed "Age".
        table = self.put([["Dept", "Yes", "No", "Age"], ["Sales", 12, 30, 41], ["Legal", 5, 22, 38], ["IT", 9, 14, 35]])
        text = self.words("H1", f"=ASSOC.CHECK({table})")
        self.assertTrue(text.startswith('Doubtful: The column "Age" is labelled as a measure of each group'), text)

    def test_amounts_of_money_make_the_table_doubtful(self):
        table = self.put([["Region", "Salary (EUR)", "Bonus (EUR)"], ["North", 412000, 38000],
                          ["South", 398000, 41000]])
        text = self.words("H1", f"=ASSOC.CHECK({table})")
        self.assertTrue(text.startswith("Doubtful: Columns 2–3 are labelled as amounts of money or time"), text)


class NumbersThatLabel(HabitCase):
    def test_department_codes_typed_as_numbers_make_the_table_doubtful(self):
        table = self.put([["Unit", "Promoted", "Not promoted"], [101, 30, 45], [102, 10, 80], [103, 22, 41]])
        text = self.words("H1", f"=ASSOC.CHECK({table})")
        self.assertTrue(text.startswith("Doubtful: Column 1 holds the whole numbers 101, 102, 103, which count up by "
                                        "one as codes"), text)

    def test_numbers_under_a_label_that_names_codes_make_the_table_doubtful(self):
        table = self.put([["Cost centre no.", "Promoted", "Not promoted"], [4711, 30, 45], [4730, 10, 80],
                          [4802, 22, 41]])
        self.assertTrue(self.words("H1", f"=ASSOC.CHECK({table})").startswith(
            'Doubtful: Column 1 ("Cost centre no.") holds whole numbers under a label that names codes or numbered '
            'categories, and they were read as counts; if they are labels, enter them as text (type an apostrophe '
            "first: '4711)"))

    def test_counts_under_a_category_of_a_numbered_kind_stay_sound(self):
        table = self.put([["Level 1", "Level 2", "Level 3"], [30, 45, 12], [10, 80, 14], [22, 41, 9]])
        self.assertTrue(self.words("H1", f"=ASSOC.CHECK({table})").startswith("Sound:"))

    def test_a_pivot_tables_field_row_above_its_labels_is_refused_saying_what_to_select(self):
        table = self.put([["Count - Employee", "Outcome", None, None], ["Department", "No", "Yes", "Total Result"],
                          ["Finance", 4, 6, 10], ["Sales", 12, 15, 27], ["Total Result", 16, 21, 37]])
        inner = self.put([["Department", "No", "Yes", "Total Result"], ["Finance", 4, 6, 10], ["Sales", 12, 15, 27],
                          ["Total Result", 16, 21, 37]], row=10)
        self.refused(f"=ASSOC.PVALUE({table})", f"=ASSOC.CHECK({table})",
                     "rows 1 and 2 both hold only labels", "select the table from its row of column labels down")
        # The part below the field row is read with the pivot table's totals set aside (an identity).
        plain = self.put([[4, 6], [12, 15]], row=20)
        self.assertEqual(self.number("H1", f"=ASSOC.PVALUE({inner})"), self.number("H2", f"=ASSOC.PVALUE({plain})"))

    def test_counts_an_import_left_as_text_are_refused_as_numbers_stored_as_text(self):
        table = self.put([["Department", "Promoted", "Not promoted"], ["Sales", "30", "45"], ["Legal", "10", "80"]])
        self.assertEqual(self.sheet.getCellRangeByName("B2").getType().value, "TEXT")
        self.refused(f"=ASSOC.PVALUE({table})", f"=ASSOC.CHECK({table})",
                     'the counts are numbers stored as text (as imported or pasted data often is; row 2, column 2 '
                     'holds the text "30")', "enter them again as numbers")


class WholeColumnsAndRecords(HabitCase):
    # Invented records: channel and outcome of 8 invoices, with headers in row 1.
    CHANNELS = ["Channel", "Web", "Shop", "Web", "Phone", "Shop", "Web", "Phone", "Web"]
    OUTCOMES = ["Outcome", "Yes", "No", "No", "Yes", "Yes", "No", "No", "Yes"]

    def put_records(self, sheet=None):
        target = sheet or self.sheet
        target.getCellRangeByName("C1:D9").setDataArray(tuple(zip(self.CHANNELS, self.OUTCOMES)))

    def test_a_title_above_records_in_whole_columns_is_refused_saying_where_to_start(self):
        self.put([["Invoices checked in March", None], [None, None], ["Channel", "Outcome"]] +
                 [[c, o] for c, o in zip(self.CHANNELS[1:], self.OUTCOMES[1:])], column=12)
        self.refused("=ASSOC.COUNTS(M:M; N:N)", '=ASSOC.CHECK(M:N; "counts")',
                     'row 1 ("Invoices checked in March") and row 3 ("Channel" and "Outcome") both look like headers',
                     "start every range at its row 4")
        # From the blank row down, the header is left out as for any range drawn with it (an identity).
        self.assertEqual(self.array("H1:I3", "=ASSOC.COUNTS(M2:M11; N2:N11)"),
                         self.array("K1:L3", "=ASSOC.COUNTS(M4:M11; N4:N11)"))

    def test_rows_hidden_by_a_filter_count_only_through_a_weight_column_of_subtotals(self):
        self.put_records()
        for row in range(2, 10):
            self.formula(f"E{row}", f"=SUBTOTAL(103; C{row})")
        rows = self.sheet.getRows()
        try:
            for index in (2, 5):  # sheet rows 3 and 6: a Shop and a Shop record, hidden as a filter hides them
                rows.getByIndex(index).IsVisible = False
            session.document.calculateAll()
            # Hidden rows count like any other, as in SUM; weighted by SUBTOTAL(103; …) they count 0.
            everyone = self.array("H1:I3", "=ASSOC.COUNTS(C2:C9; D2:D9)")
            shown = self.array("K1:L3", "=ASSOC.COUNTS(C2:C9; D2:D9; E2:E9)")
            self.assertEqual(everyone, [[1, 1], [1, 1], [2, 2]])  # Phone, Shop, Web × No, Yes
            self.assertEqual(shown, [[1, 1], [0, 0], [2, 2]])
        finally:
            for index in (2, 5):
                rows.getByIndex(index).IsVisible = True

    def test_a_whole_column_of_records_is_read_without_its_header_and_its_blanks(self):
        self.put_records()
        self.assertEqual(self.array("F1:F3", "=ASSOC.LEVELS(C:C)"), column(["Phone", "Shop", "Web"]))
        self.assertEqual(self.array("G1:H3", "=ASSOC.COUNTS(C:C; D:D)"), self.array("G5:H7", "=ASSOC.COUNTS(C2:C9; D2:D9)"))
        text = self.words("F10", '=ASSOC.CHECK(C:D; "counts")')
        self.assertIn("Counted 8 records into 3 row levels and 2 column levels.", text)
        self.assertIn('Row 1 ("Channel" and "Outcome") was read as a header and left out', text)

    def test_records_drawn_with_their_header_give_the_table_of_the_records_alone(self):
        self.put_records()
        self.assertEqual(self.array("F1:F3", "=ASSOC.LEVELS(C1:C9)"), column(["Phone", "Shop", "Web"]))
        self.assertEqual(self.array("G1:H3", "=ASSOC.COUNTS(C1:C9; D1:D9)"), self.array("G5:H7", "=ASSOC.COUNTS(C2:C9; D2:D9)"))
        text = self.words("F10", '=ASSOC.CHECK(C1:D9; "counts")')
        self.assertIn('Row 1 ("Channel" and "Outcome") was read as a header and left out, since each is a text found '
                      "nowhere else in its range above records whose labels repeat", text)

    def test_whole_columns_on_another_sheet_are_read_the_same_way(self):
        sheets = session.document.Sheets
        sheets.insertNewByName("HabitRecords", sheets.Count)
        try:
            self.put_records(sheets.getByName("HabitRecords"))
            self.assertEqual(self.array("F1:F3", "=ASSOC.LEVELS($HabitRecords.C:C)"), column(["Phone", "Shop", "Web"]))
            self.assertEqual(self.array("G1:H3", "=ASSOC.COUNTS($HabitRecords.C:C; $HabitRecords.D:D)"),
                             [[1, 1], [1, 1], [2, 2]])  # counted by hand from CHANNELS and OUTCOMES
        finally:
            sheets.removeByName("HabitRecords")

    def test_a_total_line_under_the_records_is_refused_with_words(self):
        self.put_records()
        self.sheet.getCellRangeByName("C10:D10").setDataArray((("Total", 8),))
        for formula in ("=ASSOC.COUNTS(C:C; D:D)", "=ASSOC.LEVELS(C1:C10)"):
            with self.subTest(formula=formula):
                self.refused(formula, '=ASSOC.CHECK(C:D; "counts")',
                             'the last record, row 10, holds "Total", which reads as a total line under the records '
                             "rather than a record")

    def test_paired_answers_whose_sides_hold_different_labels_are_said_and_an_order_aligns_them(self):
        before = ["Agree", "Neutral", "Agree", "Neutral", "Agree", "Agree", "Neutral", "Agree"]
        after = ["Agree", "Disagree", "Agree", "Agree", "Disagree", "Agree", "Disagree", "Agree"]
        self.sheet.getCellRangeByName("C1:D8").setDataArray(tuple(zip(before, after)))
        self.sheet.getCellRangeByName("E1:E3").setDataArray((("Agree",), ("Neutral",), ("Disagree",)))
        self.assertIn('The row and column labels share "Agree" but not "Neutral" (rows only) and "Disagree" '
                      "(columns only)", self.words("F10", '=ASSOC.CHECK(C1:D8; "counts")'))
        # Aligned by the order: 3×3 with rows and columns Agree, Neutral, Disagree (counted by hand), whose
        # Bowker statistic is (0−1)²/1 + (1−0)²/1 + (2−0)²/2 = 4 on 3 degrees of freedom; p from scipy
        # 1.10.1, chi2.sf(4, 3). Read by position without the order, the same answers give p = 1.
        self.assertEqual(self.array("G1:I3", "=ASSOC.COUNTS(C1:C8; D1:D8; ; E1:E3)"), [[4, 0, 1], [1, 0, 2], [0, 0, 0]])
        self.assertAlmostEqual(self.number("G5", "=ASSOC.PAIRED(ASSOC.COUNTS(C1:C8; D1:D8; ; E1:E3))"),
                               0.26146412994911117, places=12)

    def test_row_1_stays_a_record_when_its_label_appears_again_below(self):
        self.sheet.getCellRangeByName("C1:C4").setDataArray((("Web",), ("Shop",), ("Web",), ("Shop",)))
        self.assertEqual(self.number("F1", "=ROWS(ASSOC.LEVELS(C:C))"), 2)
        self.assertNotIn("header", self.words("F2", '=ASSOC.CHECK(C:C; "levels")'))

    def test_a_whole_row_reference_and_a_generous_range_give_short_report_lines(self):
        self.put(PROMOTIONS)
        for reference in ("1:4", "A1:K100000"):
            with self.subTest(reference=reference):
                report = self.lines("M10:N31", f"=ASSOC.REPORT({reference})")
                self.assertTrue(all(len(str(value)) < 600 for value in report.values()), reference)
                self.assertLess(len(self.words("M33", f"=ASSOC.CHECK({reference})")), 400)
                self.sheet.getCellRangeByName("M10:N33").clearContents(0xFFFF)

    def test_levels_can_size_their_array_with_rows(self):
        self.put_records()
        self.assertEqual(self.number("F1", "=ROWS(ASSOC.LEVELS(C:C))"), 3)


class SubtotalsAndSummaries(HabitCase):
    def test_a_subtotal_without_a_label_inside_the_table_is_refused_with_words(self):
        table = self.put([["Dept", "Yes", "No"], ["Sales", 30, 45], ["Legal", 10, 80], [None, 40, 125],
                          ["Audit", 22, 41], ["Tax", 5, 9]])
        self.refused(f"=ASSOC.PVALUE({table})", f"=ASSOC.CHECK({table})",
                     "row 4 holds the sum of rows 2–3 above it in every column, so it looks like a subtotal")

    def test_a_labelled_subtotal_is_set_aside(self):
        with_subtotal = self.put([["Dept", "Yes", "No"], ["Sales", 30, 45], ["Legal", 10, 80], ["Subtotal", 40, 125],
                                  ["Audit", 22, 41], ["Tax", 5, 9]])
        without = self.put([["Dept", "Yes", "No"], ["Sales", 30, 45], ["Legal", 10, 80], ["Audit", 22, 41], ["Tax", 5, 9]],
                           row=10)
        self.assertEqual(self.number("H1", f"=ASSOC.PVALUE({with_subtotal})"), self.number("H2", f"=ASSOC.PVALUE({without})"))

    def test_a_column_of_row_percentages_beside_the_counts_is_refused_with_words(self):
        table = self.put([["Dept", "Yes", "No", "% yes"], ["Sales", 30, 45, 0.4], ["Legal", 10, 80, 0.111],
                          ["Audit", 22, 41, 0.349]])
        self.refused(f"=ASSOC.PVALUE({table})", f"=ASSOC.CHECK({table})",
                     'the column "% yes" is labelled as percentages and holds numbers from 0 to 100, so it holds no counts')

    def test_two_rows_with_one_label_are_doubted_not_sound(self):
        table = self.put([["Dept", "Yes", "No"], ["Sales", 30, 45], ["Legal", 10, 80], ["Sales", 22, 41]])
        text = self.words("H1", f"=ASSOC.CHECK({table})")
        self.assertTrue(text.startswith('Doubtful: Rows 2 and 4 have the same label, "Sales"'), text)


class PercentagesAndWeights(HabitCase):
    def test_percentages_typed_instead_of_counts_are_refused(self):
        table = self.put([["", "Promoted", "Not promoted"], ["Sales", 40.0, 60.0], ["Legal", 11.1, 88.9]])
        self.refused(f"=ASSOC.PVALUE({table})", f"=ASSOC.CHECK({table})",
                     "every row adds up to 100 and some entries are not whole numbers, so these look like percentages",
                     "enter the counts instead")
        shares = self.put([[0.4, 0.6], [0.111, 0.889]], row=5)
        self.refused(f"=ASSOC.REPORT({shares})", f"=ASSOC.CHECK({shares})", "these look like shares (proportions)")

    def test_counts_that_are_not_whole_are_never_sound_and_amounts_are_no_weights(self):
        # Invoices of two regions with their amounts used (wrongly) as weights.
        self.put(column(["North", "North", "South", "South", "North", "South"]), column=0)
        self.put(column(["Paid", "Late", "Paid", "Late", "Paid", "Paid"]), column=1)
        self.put(column([1200.5, 80.25, 990.0, 15.75, 310.0, 2400.0]), column=2)
        p = self.number("H1", "=ASSOC.PVALUE(ASSOC.COUNTS(A1:A6; B1:B6; C1:C6))")
        self.assertTrue(0 <= p <= 1)
        verdict = self.words("H2", "=ASSOC.CHECK(ASSOC.COUNTS(A1:A6; B1:B6; C1:C6))")
        self.assertTrue(verdict.startswith("Doubtful: Some counts are not whole numbers (weighted data)"), verdict)
        self.assertIn("never for amounts such as pay or invoice values", verdict)
        counted = self.words("H3", '=ASSOC.CHECK(A1:C6; "counts")')
        self.assertIn("it must be a frequency weight", counted)

    def test_a_blank_weight_skips_its_record_and_a_negative_one_is_refused_naming_its_row(self):
        self.put([["Dept", "Outcome", "Weight"], ["Sales", "Yes", 2], ["Legal", "No", None], ["Sales", "No", 3],
                  ["Legal", "Yes", 1]])
        self.assertEqual(self.array("H1:I2", "=ASSOC.COUNTS(A1:A5; B1:B5; C1:C5)"), [[0, 1], [3, 2]])
        text = self.words("H4", '=ASSOC.CHECK(A1:C5; "counts")')
        self.assertIn('Row 1 ("Dept" and "Outcome") was read as a header and left out, since its weight is the text '
                      '"Weight".', text)
        self.assertIn("1 record has a blank weight (row 3 of the ranges) and was skipped", text)
        self.put([[-4]], column=2, row=3)
        self.refused("=ASSOC.COUNTS(A1:A5; B1:B5; C1:C5)", '=ASSOC.CHECK(A1:C5; "counts")',
                     "the weight in row 4 is -4; a weight says how many people or items a record stands for, so it "
                     "cannot be negative")


class LabelsThatMeanSomething(HabitCase):
    def test_a_paired_table_is_read_by_its_labels_whatever_the_order_of_its_columns(self):
        reordered = self.put([["Before / After", "No", "Yes"], ["Yes", 5, 30], ["No", 40, 10]])
        aligned = self.put([["", "Yes", "No"], ["Yes", 30, 5], ["No", 10, 40]], row=5)
        self.assertEqual(self.array("H1:J1", f"=ASSOC.PAIRED({reordered})"), self.array("H2:J2", f"=ASSOC.PAIRED({aligned})"))
        self.assertIn("The columns were matched to the rows by their labels",
                      self.words("H3", f'=ASSOC.CHECK({reordered}; "paired")'))
        mismatched = self.put([["", "Agree", "Disagree"], ["Yes", 30, 5], ["No", 10, 40]], row=10)
        self.refused(f"=ASSOC.PAIRED({mismatched})", f'=ASSOC.CHECK({mismatched}; "paired")',
                     "a paired table needs the same categories as rows and as columns, matched by their labels")

    def test_a_before_and_after_table_given_to_the_test_of_independence_points_to_the_paired_test(self):
        table = self.put([["Before / After", "Yes", "No"], ["Yes", 30, 5], ["No", 10, 40]])
        hint = "the paired test (ASSOC.PAIRED) fits it, not this test of independence"
        self.assertIn(hint, self.words("H1", f"=ASSOC.CHECK({table})"))
        self.assertIn(hint, self.lines("H3:I24", f"=ASSOC.REPORT({table})")["Validity"])

    def test_stacked_strata_of_three_rows_are_refused_saying_what_was_found(self):
        table = self.put([["Office", "Group", "Promoted", "Not promoted"], ["North", "Women", 5, 10], [None, "Men", 7, 9],
                          [None, "Not stated", 1, 2], ["South", "Women", 4, 11], [None, "Men", 6, 8],
                          [None, "Not stated", 1, 3]])
        self.refused(f"=ASSOC.STRATA({table})", f'=ASSOC.CHECK({table}; "strata")',
                     '"North" has 3 rows ("Women", "Men" and "Not stated")', "each stratum needs exactly 2 rows")
        repeating = self.put([["", "Promoted", "Not promoted"], ["Women", 5, 10], ["Men", 7, 9], ["Not stated", 1, 2],
                              ["Women", 4, 11], ["Men", 6, 8], ["Not stated", 1, 3]], row=10)
        self.refused(f"=ASSOC.STRATA({repeating})", f'=ASSOC.CHECK({repeating}; "strata")',
                     "the row labels repeat every 3 rows")

    def test_stacked_strata_named_in_a_first_column_are_read_by_that_column(self):
        named = self.put([["Office", "Group", "Promoted", "Not promoted"], ["North", "Women", 5, 10], [None, "Men", 7, 9],
                          ["South", "Women", 4, 11], [None, "Men", 6, 8]])
        plain = self.put([[5, 10], [7, 9], [4, 11], [6, 8]], row=8)
        self.assertEqual(self.array("H1:L1", f"=ASSOC.STRATA({named})"), self.array("H2:L2", f"=ASSOC.STRATA({plain})"))

    def test_labels_that_differ_only_by_spaces_are_one_label_and_check_says_so(self):
        self.put(column(["No", "No ", " Yes", "Yes", "No"]), column=0)
        self.put(column(["North", "South", "North", "South", "South"]), column=1)
        self.assertEqual(self.array("H1:H2", "=ASSOC.LEVELS(A1:A5)"), column(["No", "Yes"]))
        self.assertIn('The row labels "No" and "No " differ only by spaces at the start or end and were counted as one '
                      'label, "No"; so was 1 other spelling with spaces at the start or end.',
                      self.words("H4", '=ASSOC.CHECK(A1:B5; "counts")'))


class OutcomeColumnOrder(HabitCase):
    # Invented: a pivot table of promotions by team, its columns sorted "No" before "Yes".
    SORTED = [["Team", "No", "Yes", "Total Result"], ["Team A", 7, 18, 25], ["Team B", 16, 9, 25],
              ["Total Result", 23, 27, 50]]

    def test_a_first_column_that_reads_as_the_absence_of_another_is_refused_by_the_measures_of_column_1(self):
        table = self.put(self.SORTED)
        for function in ("ODDSRATIO", "RISKRATIO", "RATEDIFF", "RATES"):
            with self.subTest(function=function):
                self.refused(f"=ASSOC.{function}({table})", f'=ASSOC.CHECK({table}; "{function.lower()}")',
                             'the first column of counts, "No", reads as the absence of the column "Yes"',
                             'put the column "Yes" first. If "No" is the outcome you mean, leave the header row out')
        # The test of independence does not depend on the order of the columns.
        self.assertTrue(self.words("H1", f"=ASSOC.CHECK({table})").startswith("Sound:"))

    def test_the_same_counts_without_the_header_row_are_measured_as_given(self):
        self.put(self.SORTED)
        # The odds of column 1 ("No") in row 1 over row 2: (7·9)/(18·16), an exact identity.
        self.assertAlmostEqual(self.number("H1", "=ASSOC.ODDSRATIO(A2:C3)"), 7 * 9 / (18 * 16), places=14)

    def test_the_outcome_first_is_measured(self):
        table = self.put([["Team", "Promoted", "Not promoted"], ["Team A", 18, 7], ["Team B", 9, 16]])
        # The risk of "Promoted" in Team A over Team B: (18/25)/(9/25) = 2, an exact identity.
        self.assertAlmostEqual(self.number("H1", f"=ASSOC.RISKRATIO({table})"), 2.0, places=14)


class OrdersAndSpellings(HabitCase):
    SCALE = ["Poor", "Fair", "Good", "Excellent"]

    def test_an_answer_scale_orders_the_levels_and_the_counts(self):
        self.put(column(["Good", "Poor", "Excellent", "Good", "Fair", "Poor"]), column=0)
        self.put(column(["North", "South", "North", "South", "South", "North"]), column=1)
        self.put(column(self.SCALE), column=3)
        self.assertEqual(self.array("H1:H4", "=ASSOC.LEVELS(A1:A6; D1:D4)"), column(self.SCALE))
        # Counted by hand: rows Poor, Fair, Good, Excellent; columns North, South (sorted: the scale lists neither).
        self.assertEqual(self.array("I1:J4", "=ASSOC.COUNTS(A1:A6; B1:B6; ; D1:D4)"), [[1, 1], [0, 1], [1, 1], [1, 0]])
        self.assertIn("ASSOC.COUNTS can be used on this range.", self.words("I6", '=ASSOC.CHECK(A1:B6; "counts")'))

    def test_labels_missing_from_the_order_are_refused_naming_them(self):
        self.put(column(["Good", "Poor", "Excellent"]), column=0)
        self.put(column(["Poor", "Good"]), column=1)
        # ASSOC.CHECK takes the order as the column after the labels (for COUNTS: after the weights).
        self.refused("=ASSOC.LEVELS(A1:A3; B1:B2)", '=ASSOC.CHECK(A1:B3; "levels")',
                     'ASSOC.LEVELS cannot be used here: the order lists 2 labels but not "Excellent", found in the '
                     "labels; list every label in the order's range.")
        # Answers, offices, no weights (a blank column), the scale: ASSOC.COUNTS tried with the scale.
        self.put([["Good", "North", None, "Poor"], ["Poor", "South", None, "Good"], ["Excellent", "North", None,
                                                                                   "Excellent"]], column=3)
        text = self.words("H3", '=ASSOC.CHECK(D1:G3; "counts")')
        self.assertIn("ASSOC.COUNTS can be used on this range.", text)
        self.assertIn("The order lists none of the column labels, so they were sorted.", text)

    def test_an_order_of_a_hundred_labels_works(self):
        labels = [f"Band {i:03d}" for i in range(100)]
        self.put(column(list(reversed(labels))), column=3)
        self.put(column(labels[::3] + labels[1::3] + labels[2::3]), column=0)
        got = self.array("H1:H100", "=ASSOC.LEVELS(A1:A100; D1:D100)")
        self.assertEqual(got, column(list(reversed(labels))))

    def test_an_unknown_option_word_gets_the_nearest_word(self):
        table = self.put(PROMOTIONS)
        self.refused(f'=ASSOC.PVALUE({table}; "exat")', f'=ASSOC.CHECK({table}; "exat")', 'did you mean "exact"?')
        self.assertIn('did you mean "pearson"?', self.words("H3", f'=ASSOC.CHECK({table}; "pearsn")'))


class TextResultsLikeTypedText(HabitCase):
    def test_labels_of_levels_compare_equal_to_typed_text(self):
        self.put(column(["IT", "HR", "IT", "Sales"]), column=0)
        self.array_formula("C1:C3", "=ASSOC.LEVELS(A1:A4)")
        self.formula("D1", "=ASSOC.LEVELS(A1:A4)")
        checks = {"E1": '=C2="IT"', "E2": '=EXACT(C2;"IT")', "E3": '=COUNTIF(C1:C3;"IT")', "E4": '=MATCH("IT";C1:C3;0)',
                  "E5": '=D1="HR"', "E6": '=COUNTIF(A1:A4;C2)', "E7": '=VLOOKUP("Sales";C1:C3;1;0)="Sales"'}
        for cell, text in checks.items():
            self.sheet.getCellRangeByName(cell).setFormula(text)
        session.document.calculateAll()
        got = {cell: self.sheet.getCellRangeByName(cell).getString() for cell in checks}
        self.assertEqual(got, {"E1": "TRUE", "E2": "TRUE", "E3": "1", "E4": "2", "E5": "TRUE", "E6": "2", "E7": "TRUE"})

    def test_the_words_of_check_compare_equal_to_the_same_text(self):
        table = self.put(PROMOTIONS)
        self.formula("H1", f"=ASSOC.CHECK({table})")
        self.assertEqual(self.words("H2", '=H1=H1&""'), "TRUE")
        self.assertEqual(self.words("H3", '=EXACT(H1;H1&"")'), "TRUE")

    def test_texts_beside_numbers_compare_through_the_documented_workaround(self):
        # Calc 7.4 keeps texts of a result that also holds numbers out of its text pool (see the guide);
        # `&""` gives the typed form, and an empty element is empty.
        table = self.put(PROMOTIONS)
        self.array_formula("H1:I22", f"=ASSOC.REPORT({table})")
        self.assertEqual(self.words("K1", '=H1&""="Total count (n)"'), "TRUE")
        self.array_formula("K2", '=MATCH("Validity"; H1:H22&""; 0)')
        self.assertEqual(self.sheet.getCellRangeByName("K2").getValue(), 19)


class ErrorCells(HabitCase):
    def test_an_error_cell_stops_the_host_and_iferror_entered_as_an_array_gets_past_it(self):
        self.put([[30, 45], [10, 80], [22, None]])
        self.sheet.getCellRangeByName("B3").setFormula("=NA()")
        self.assertEqual(self.formula("H1", "=ASSOC.PVALUE(A1:B3)").getError(), ERR_NO_VALUE_IN_RANGE)
        self.assertEqual(self.formula("H2", "=ASSOC.CHECK(A1:B3)").getError(), ERR_NO_VALUE_IN_RANGE)
        self.array_formula("H3", '=ASSOC.PVALUE(IFERROR(A1:B3; ""))')
        self.array_formula("H4", '=ASSOC.CHECK(IFERROR(A1:B3; ""))')
        self.put([[30, 45], [10, 80], [22, None]], column=3)
        self.assertEqual(self.sheet.getCellRangeByName("H3").getValue(), self.number("H5", "=ASSOC.PVALUE(D1:E3)"))
        self.assertIn("1 blank cell was read as 0.", self.sheet.getCellRangeByName("H4").getString())


class SelectionImpactWithRealRanges(HabitCase):
    def test_a_group_with_nobody_considered_is_left_empty_and_the_others_answered(self):
        self.put([["Selected", "Considered"], [12, 40], [0, 0], [5, 30], [9, 20]])
        block = self.array_formula("H1:J4", "=ASSOC.IMPACT(A:A; B:B)")
        strings = [[block.getCellByPosition(c, r).getString() for c in range(3)] for r in range(4)]
        self.assertEqual([row[2] for row in strings], ["below four-fifths of the highest rate",
                                                       "no one considered: no selection rate",
                                                       "below four-fifths of the highest rate", ""])
        self.assertEqual(strings[1][:2], ["", ""])
        # Exact fractions: rates 12/40, 5/30, 9/20; ratios to 9/20.
        self.assertAlmostEqual(block.getCellByPosition(1, 0).getValue(), (12 / 40) / (9 / 20), places=14)
        self.assertEqual(self.words("L1", '=J4=""'), "TRUE")
        text = self.words("L2", '=ASSOC.CHECK(A:B; "impact")')
        self.assertIn("Row 1 holds text and was read as a header", text)
        self.assertIn("No one is considered in the group in row 3", text)


class WordsForAMemo(HabitCase):
    def test_a_tiny_significant_association_reads_as_very_weak(self):
        table = self.put([["", "Yes", "No"], ["A", 500000, 500300], ["B", 498000, 501700]])
        conclusion = self.lines("H1:I22", f"=ASSOC.REPORT({table})")["Conclusion"]
        # Exact arithmetic on the counts: V = 0.0017, far below Cohen's 0.1.
        self.assertIn("appear associated (p = 0.0162), but the association is very weak: Cramér's V is 0.0017", conclusion)

    def test_a_corner_without_a_slash_does_not_garble_the_conclusion(self):
        table = self.put([["Headcount 2024", "Promoted", "Not promoted"], ["Sales", 30, 45], ["Legal", 10, 80]])
        conclusion = self.lines("H1:I22", f"=ASSOC.REPORT({table})")["Conclusion"]
        self.assertIn("the rows (Sales, Legal) and the columns (Promoted, Not promoted) appear associated", conclusion)

    def test_an_interval_of_v_from_zero_to_zero_is_explained(self):
        table = self.put([[2000, 2001], [2001, 2000]])
        report = self.lines("H1:I22", f"=ASSOC.REPORT({table})")
        self.assertEqual(report["Cramér's V, upper 95% limit"], 0)
        self.assertIn("Cramér's V's 95% interval is 0 to 0", report["Conclusion"])

    def test_cells_of_a_two_column_table_are_named_on_the_first_columns_side(self):
        table = self.put([["", "Promoted", "Not promoted"], ["Sales", 60, 10], ["Legal", 10, 60], ["Support", 35, 35]])
        standouts = self.lines("H1:I22", f"=ASSOC.REPORT({table})")["Cells that stand out"]
        self.assertIn("Sales × Promoted: more than expected", standouts)
        self.assertIn("Legal × Promoted: fewer than expected", standouts)
        self.assertNotIn("Not promoted:", standouts)

    def test_messages_name_rows_as_the_range_counts_them_with_their_labels(self):
        table = self.put([["", "Yes", "No"], ["North", 3, 7], ["South", 2, "n/a"]])
        self.assertIn('row 3 ("South"), column 3 ("No") holds the text "n/a"', self.words("H1", f"=ASSOC.CHECK({table})"))


if __name__ == "__main__":
    run_harness(__doc__)
