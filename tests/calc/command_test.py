#!/usr/bin/python3
"""The menu command "Analyse Selection with Assoc" in real headless Calc: it is dispatched
(org.assocproject.calc:AnalyseSelection with NoDialog) on a selected table, on two selected record
columns and on bad selections, and the sheet it writes is checked: its formulas, its values against
scipy 1.10.1 / statsmodels 0.13.5 / R 4.2.2 (command_values.json, written by make_command_values.py),
the heat map, the chart, the rates by row, the rate difference and the comparisons of pairs of rows,
that editing a source count changes the results, and that failures leave the document as it was. All
tables are invented.

    /usr/bin/python3 tests/calc/command_test.py --oxt build/extension/assoc.oxt [unittest options]
"""

import json
import random
import sys
import unittest

import calc_support
from calc_support import HERE, ROOT, session
import uno

sys.path.insert(0, str(ROOT / "scripts"))
from assoc_office import properties  # noqa: E402
from build_samples import HEAT_MAP  # noqa: E402

REFERENCE = json.loads((HERE / "command_values.json").read_text())["tables"]
COMMAND = "org.assocproject.calc:AnalyseSelection"
COLORSCALE = 1  # com.sun.star.sheet.ConditionalEntryType.COLORSCALE
VALUE_CELLS = 1  # com.sun.star.sheet.CellFlags.VALUE: numbers typed in, not computed
RECALCULATED = 1e-12  # the same double-precision formulas, recomputed

BRANCHES = [["Branch / Outcome", "Cleared", "Queried", "Returned"],
            ["Northgate", 12, 7, 3],
            ["Riverside", 5, 14, 8],
            ["Hillcrest", 9, 4, 11]]
TEAMS = [["Team / Outcome", "Promoted", "Not promoted"], ["Team A", 18, 7], ["Team B", 9, 16]]
SELECT_HINT = ("Select a table of counts (its labels may be included), or two columns of records, and run the "
               "command again.")


def formula_of(cell):
    """The formula as a user sees it (display names), with ";" between arguments and unquoted sheet names."""
    return cell.FormulaLocal.replace(",", ";").replace("'", "")


def corners(address):
    return address.StartColumn, address.StartRow, address.EndColumn, address.EndRow


def records_of(counts, rows=("Midlands", "North", "South"), columns=("No", "Yes"), seed=3):
    """One (row label, column label) pair per counted item, in a seeded random order."""
    pairs = [(rows[r], columns[c]) for r, row in enumerate(counts) for c, n in enumerate(row) for _ in range(n)]
    random.Random(seed).shuffle(pairs)
    return pairs


class CommandCase(calc_support.CalcTestCase):
    """Each test has its data sheet (CalcTestCase); the sheets the command makes are removed after it."""

    def setUp(self):
        super().setUp()
        self.made = []

    def tearDown(self):
        for name in self.made:
            if session.document.Sheets.hasByName(name):
                session.document.Sheets.removeByName(name)
        super().tearDown()

    # -- running the command -----------------------------------------------------------------
    def select(self, *addresses):
        controller = session.document.getCurrentController()
        if len(addresses) == 1:
            controller.select(self.sheet.getCellRangeByName(addresses[0]))
        else:
            ranges = session.document.createInstance("com.sun.star.sheet.SheetCellRanges")
            ranges.addRangeAddresses(tuple(self.sheet.getCellRangeByName(a).RangeAddress for a in addresses), False)
            controller.select(ranges)

    def dispatch(self, *addresses, **arguments):
        """Selects the addresses and runs the command; returns (state, result)."""
        self.select(*addresses)
        helper = session.office.service("com.sun.star.frame.DispatchHelper")
        frame = session.document.getCurrentController().getFrame()
        result = helper.executeDispatch(frame, COMMAND, "", 0, properties(NoDialog=True, **arguments))
        if result.State == 1:
            self.made.append(result.Result)
        return result.State, result.Result

    def analyse(self, *addresses, **arguments):
        state, result = self.dispatch(*addresses, **arguments)
        self.assertEqual(state, 1, result)
        session.document.calculateAll()
        return session.document.Sheets.getByName(result)

    def refused(self, message, *addresses, **arguments):
        before = session.document.Sheets.ElementNames
        state, result = self.dispatch(*addresses, **arguments)
        self.assertNotEqual(state, 1)
        self.assertEqual(result, message)
        self.assertEqual(session.document.Sheets.ElementNames, before, "the sheets changed")

    # -- reading the new sheet ---------------------------------------------------------------
    @staticmethod
    def used(sheet):
        cursor = sheet.createCursor()
        cursor.gotoEndOfUsedArea(False)
        return cursor.RangeAddress

    def row_of(self, sheet, label):
        end = self.used(sheet)
        column = sheet.getCellRangeByPosition(0, 0, 0, end.EndRow).getDataArray()
        for row, (text,) in enumerate(column):
            if text == label:
                return row
        self.fail(f"no line labelled {label!r} on {sheet.Name}")

    def cell_right_of(self, sheet, label, offset=1):
        return sheet.getCellByPosition(offset, self.row_of(sheet, label))

    def figure(self, sheet, label, offset=1):
        cell = self.cell_right_of(sheet, label, offset)
        self.assertEqual(cell.getError(), 0, f"{label} shows error {cell.getError()}")
        return cell.getValue()

    def block_below(self, sheet, heading, rows, columns):
        """The numbers of the body under a section heading (its header row and label column skipped)."""
        start = self.row_of(sheet, heading) + 2
        block = sheet.getCellRangeByPosition(1, start, columns, start + rows - 1)
        return block, [list(row) for row in block.getDataArray()]

    def row_of_text_in_b(self, sheet, text):
        column = sheet.getCellRangeByPosition(1, 0, 1, self.used(sheet).EndRow).getDataArray()
        row = next((row for row, (cell,) in enumerate(column) if cell == text), None)
        self.assertIsNotNone(row, f"no {text!r} in column B of {sheet.Name}")
        return row

    def block_under(self, sheet, header, rows, columns, first_column=1):
        """The values of the block under the header row whose column B holds `header` (labels skipped)."""
        start = self.row_of_text_in_b(sheet, header) + 1
        block = sheet.getCellRangeByPosition(first_column, start, first_column + columns - 1, start + rows - 1)
        for cell in (block.getCellByPosition(c, r) for r in range(rows) for c in range(columns)):
            self.assertEqual(cell.getError(), 0, f"a cell under {header!r} shows error {cell.getError()}")
        return [list(row) for row in block.getDataArray()]

    def check_rates(self, sheet, expected):
        """The rates block (n, rate, lower, upper per row) against the reference; None: an empty line."""
        got = self.block_under(sheet, "Row total", len(expected), 4)
        start = self.row_of_text_in_b(sheet, "Row total") + 1
        for r, (row, want) in enumerate(zip(got, expected)):
            if want is None:
                shown = [sheet.getCellByPosition(c, start + r).getString() for c in range(1, 5)]
                self.assertEqual(shown, ["", "", "", ""], f"row {r + 1} has no rate")
            else:
                self.assertAllClose([row], [want], 1e-10, f"rates of row {r + 1}")

    def check_pairs(self, sheet, expected):
        """The pairs block (labels, p-value, adjusted p-value) against the reference."""
        got = self.block_under(sheet, "Compared with", len(expected), 4, first_column=0)
        self.assertEqual([row[:2] for row in got], [row[:2] for row in expected])
        self.assertAllClose([row[2:] for row in got], [row[2:] for row in expected], 1e-10, "pairs")

    def heading(self, sheet, words):
        end = self.used(sheet)
        for row, (text,) in enumerate(sheet.getCellRangeByPosition(0, 0, 0, end.EndRow).getDataArray()):
            if isinstance(text, str) and words in text and text[:1].isdigit():
                return text
        self.fail(f"no section heading with {words!r} on {sheet.Name}")

    def check_tests_against(self, sheet, reference, exact=True):
        self.assertClose(self.figure(sheet, "Pearson X²"), reference["pearson"][0], RECALCULATED, "X²")
        self.assertClose(self.figure(sheet, "p-value"), reference["pearson"][1], 1e-10, "p")
        self.assertEqual(self.figure(sheet, "Degrees of freedom"), reference["df"])
        self.assertClose(self.figure(sheet, "Likelihood-ratio G²"), reference["g"][0], RECALCULATED, "G²")
        self.assertClose(self.figure(sheet, "p-value of G²"), reference["g"][1], 1e-10, "p of G²")
        self.assertClose(self.figure(sheet, "Critical X² at 5%"), reference["critical"], 1e-10, "critical")
        self.assertClose(self.figure(sheet, "Cramér's V"), reference["strength"]["cramer"], RECALCULATED, "V")
        self.assertClose(self.figure(sheet, "Cohen's w"), reference["strength"]["w"], RECALCULATED, "w")
        self.assertClose(self.figure(sheet, "Cramér's V, 95% interval"), reference["v_interval"][0], 1e-8, "V low")
        self.assertClose(self.figure(sheet, "Cramér's V, 95% interval", 2), reference["v_interval"][1], 1e-8, "V high")
        if exact:
            self.assertClose(self.figure(sheet, "Exact p-value"), reference["exact"], 1e-9, "exact p")


class TableCommand(CommandCase):
    def test_a_labelled_table_gives_a_sheet_named_after_its_variables_right_after_the_data(self):
        table = self.put(BRANCHES, column=1, row=1)
        state, name = self.dispatch(table)
        self.assertEqual((state, name), (1, "Branch × Outcome"))
        names = list(session.document.Sheets.ElementNames)
        self.assertEqual(names.index(name), names.index(self.sheet.Name) + 1)

    def test_the_figures_agree_with_scipy_statsmodels_and_r(self):
        # Reference: command_values.json "branches" (scipy chi2_contingency, statsmodels Table, R fisher.test,
        # the V interval by scipy ncx2 inversion).
        reference = REFERENCE["branches"]
        sheet = self.analyse(self.put(BRANCHES, column=1, row=1))
        self.check_tests_against(sheet, reference)
        _, expected = self.block_below(sheet, self.heading(sheet, "Expected counts"), 3, 3)
        self.assertAllClose(expected, reference["expected"], RECALCULATED, "expected")
        _, residuals = self.block_below(sheet, self.heading(sheet, "Adjusted residuals"), 3, 3)
        self.assertAllClose(residuals, reference["residuals"]["adjusted"], 1e-10, "adjusted residuals")

    def test_every_number_is_a_formula_on_the_source_with_absolute_references(self):
        table = self.put(BRANCHES, column=1, row=1)
        sheet = self.analyse(table)
        typed = sheet.queryContentCells(VALUE_CELLS)
        self.assertEqual(typed.getCount(), 1, "only the significance level is typed in")
        self.assertTrue(typed.getRangeAddressesAsString().endswith(".B5"), typed.getRangeAddressesAsString())
        source = f"${self.sheet.Name}.$B$2:$E$5"
        self.assertEqual(formula_of(self.cell_right_of(sheet, "Pearson X²")), f"=ASSOC.STATISTIC({source})")
        self.assertEqual(formula_of(self.cell_right_of(sheet, "p-value")), f"=ASSOC.PVALUE({source})")
        self.assertEqual(formula_of(self.cell_right_of(sheet, "Verdict (ASSOC.CHECK)")), f"=ASSOC.CHECK({source})")
        first_count = sheet.getCellByPosition(1, self.row_of(sheet, "Northgate"))
        self.assertEqual(formula_of(first_count), f"=${self.sheet.Name}.$C$3")

    def test_the_adjusted_residuals_carry_the_heat_map_of_the_samples(self):
        sheet = self.analyse(self.put(BRANCHES, column=1, row=1))
        block, _ = self.block_below(sheet, self.heading(sheet, "Adjusted residuals"), 3, 3)
        scales = []
        for conditional in sheet.ConditionalFormats.getConditionalFormats():
            for i in range(conditional.getCount()):
                entry = conditional.getByIndex(i)
                if entry.getType() == COLORSCALE:
                    scales.append(([corners(a) for a in conditional.Range.getRangeAddresses()],
                                   [(point.getFormula(), point.getColor()) for point in entry.ColorScaleEntries]))
        # scripts/build_samples.py's HEAT_MAP: the samples' heat maps use the same points and colours.
        self.assertEqual(scales, [([corners(block.RangeAddress)],
                                   [(str(value), colour) for value, colour, _ in HEAT_MAP])])

    def test_the_chart_plots_the_row_percentages_with_their_labels(self):
        sheet = self.analyse(self.put(BRANCHES, column=1, row=1))
        self.assertEqual(sheet.Charts.getCount(), 1)
        chart = sheet.Charts.getByIndex(0)
        (data,) = chart.getRanges()
        header = self.row_of(sheet, self.heading(sheet, "Row percentages")) + 1
        self.assertEqual((data.StartColumn, data.StartRow, data.EndColumn, data.EndRow), (0, header, 3, header + 3))
        shares = sheet.getCellRangeByPosition(1, header + 1, 3, header + 3).getDataArray()
        for row, counts in zip(shares, REFERENCE["branches"]["counts"]):
            self.assertAllClose([list(row)], [[c / sum(counts) for c in counts]], RECALCULATED, "row percentages")
        diagram = chart.EmbeddedObject.Diagram
        self.assertEqual(diagram.getDiagramType(), "com.sun.star.chart.BarDiagram")

    def test_editing_a_source_count_changes_the_results(self):
        self.put(BRANCHES, column=1, row=1)
        sheet = self.analyse("B2:E5")
        self.sheet.getCellRangeByName("C3").setValue(30)
        session.document.calculateAll()
        self.assertEqual(sheet.getCellByPosition(1, self.row_of(sheet, "Northgate")).getValue(), 30)
        self.check_tests_against(sheet, REFERENCE["branches_edited"])

    def test_alpha_is_a_cell_that_the_decision_and_the_critical_value_follow(self):
        sheet = self.analyse(self.put(BRANCHES, column=1, row=1), Alpha=0.01)
        self.assertEqual(self.figure(sheet, "Significance level (alpha)"), 0.01)
        self.assertClose(self.figure(sheet, "Critical X² at 1%"), REFERENCE["branches"]["critical_01"], 1e-10)
        self.assertTrue(self.cell_right_of(sheet, "Decision").getString().startswith(
            "Independence not rejected at the 1% level: p = 0.0110"))
        self.cell_right_of(sheet, "Significance level (alpha)").setValue(0.05)
        session.document.calculateAll()
        self.assertTrue(self.cell_right_of(sheet, "Decision").getString().startswith(
            "Independence rejected at the 5% level: p = 0.0110"))

    def test_the_words_name_the_cells_that_stand_out_and_conclude(self):
        sheet = self.analyse(self.put(BRANCHES, column=1, row=1))
        self.assertEqual(self.cell_right_of(sheet, "Cells that stand out").getString(),
                         "Northgate × Cleared: more than expected (+2.2); Northgate × Returned: fewer than expected "
                         "(-2.0); Riverside × Cleared: fewer than expected (-2.3); Riverside × Queried: more than "
                         "expected (+2.4); Hillcrest × Queried: fewer than expected (-2.2); Hillcrest × Returned: more "
                         "than expected (+2.0).")
        conclusion = sheet.getCellByPosition(1, self.row_of(sheet, self.heading(sheet, "Conclusion")) + 1)
        self.assertEqual(conclusion.getString(), "At the 5% level, branch and outcome appear associated "
                                                 "(p = 0.0110). Read the cautions below.")
        self.assertEqual(self.cell_right_of(sheet, "In words").getString(),
                         "Moderate: Cohen's medium effect (w from 0.3 to 0.5).")
        self.assertTrue(self.cell_right_of(sheet, "Verdict (ASSOC.CHECK)").getString().startswith("Sound:"))

    def test_a_second_run_gets_a_sheet_name_of_its_own(self):
        table = self.put(BRANCHES, column=1, row=1)
        self.assertEqual(self.dispatch(table)[1], "Branch × Outcome")
        self.assertEqual(self.dispatch(table, Placement="end")[1], "Branch × Outcome (2)")
        self.assertEqual(session.document.Sheets.ElementNames[-1], "Branch × Outcome (2)")

    def test_a_large_table_leaves_the_slow_exact_test_out_and_says_so(self):
        # Reference: command_values.json "large" (scipy); 2,485 counts in 10×10 cells.
        large = REFERENCE["large"]
        sheet = self.analyse(self.put(large["counts"]))
        self.check_tests_against(sheet, large, exact=False)
        self.assertTrue(self.cell_right_of(sheet, "Exact p-value").getString().startswith("Not on this sheet"))
        # Named after the data's sheet and range, cut to 31 characters (here the data sheet's own name).
        self.assertTrue(sheet.Name.startswith(f"{self.sheet.Name}"), sheet.Name)


class TwoByTwoCommand(CommandCase):
    def test_the_ratios_compare_the_first_row_for_the_first_column_by_default(self):
        # Reference: command_values.json "teams" (statsmodels Table2x2: Woolf and log intervals).
        sheet = self.analyse(self.put(TEAMS))
        ratios = REFERENCE["teams"]["ratios"]["first_first"]
        self.check_tests_against(sheet, REFERENCE["teams"])
        self.assertAllClose([[self.figure(sheet, "Odds ratio (ASSOC.ODDSRATIO)", c) for c in (1, 2, 3)]],
                            [ratios["odds"]], 1e-10, "odds ratio")
        self.assertAllClose([[self.figure(sheet, "Risk ratio (ASSOC.RISKRATIO)", c) for c in (1, 2, 3)]],
                            [ratios["risk"]], 1e-10, "risk ratio")
        # In a 2×2 table the other three residuals mirror the first: only it is named.
        self.assertEqual(self.cell_right_of(sheet, "Cells that stand out").getString(),
                         "Team A × Promoted: more than expected (+2.6).")

    def test_the_outcome_and_the_group_of_interest_can_be_the_second_ones(self):
        sheet = self.analyse(self.put(TEAMS), OutcomeColumn=2, GroupRow=2)
        ratios = REFERENCE["teams"]["ratios"]["second_second"]
        self.assertAllClose([[self.figure(sheet, "Risk ratio (ASSOC.RISKRATIO)", c) for c in (1, 2, 3)]],
                            [ratios["risk"]], 1e-10, "risk ratio")
        self.assertTrue(self.cell_right_of(sheet, "In words").getString().startswith(
            "Moderate"))
        words = [sheet.getCellByPosition(1, row).getString() for row in range(self.used(sheet).EndRow + 1)]
        self.assertTrue(any(w.startswith("The odds of Not promoted in Team B are 4.57 times those in Team A")
                            for w in words))


class MemoFigures(CommandCase):
    """The rates by row, the rate difference (2×2) and the comparisons of pairs of rows (3 rows or more)."""

    def test_the_rates_and_the_pairs_of_a_three_row_table_agree_with_statsmodels_and_scipy(self):
        # Reference: command_values.json "branches" (statsmodels Wilson intervals; scipy per pair, Holm by statsmodels).
        sheet = self.analyse(self.put(BRANCHES, column=1, row=1))
        self.check_rates(sheet, REFERENCE["branches"]["rates"])
        self.assertEqual(sheet.getCellByPosition(2, self.row_of(sheet, self.heading(sheet, "Rates by row")) + 1)
                         .getString(), "Rate of Cleared")
        self.check_pairs(sheet, REFERENCE["branches"]["pairwise"])
        # All three adjusted p-values are 0.088.
        self.assertEqual(self.cell_right_of(sheet, "Pairs that differ at 5%").getString(),
                         "None: no pair of rows differs at the 5% level once the p-values are adjusted.")
        self.cell_right_of(sheet, "Significance level (alpha)").setValue(0.1)
        session.document.calculateAll()
        self.assertEqual(self.cell_right_of(sheet, "Pairs that differ at 10%").getString(),
                         "Northgate and Riverside (adjusted p = 0.0883); Northgate and Hillcrest (adjusted p = 0.0883); "
                         "Riverside and Hillcrest (adjusted p = 0.0883).")

    def test_the_rates_of_another_outcome_count_the_other_columns_as_the_rest(self):
        sheet = self.analyse(self.put(BRANCHES, column=1, row=1), OutcomeColumn=3)
        self.check_rates(sheet, REFERENCE["branches"]["rates_third"])

    def test_an_outcome_beyond_the_columns_is_refused(self):
        self.put(BRANCHES)
        self.refused("The outcome of interest must be one of the 3 columns with counts (OutcomeColumn from 1 to 3); "
                     "it is column 4.", "A1:D4", OutcomeColumn=4)

    def test_a_2x2_table_gets_the_rate_difference_with_newcombes_interval(self):
        # Reference: command_values.json "teams" (statsmodels confint_proportions_2indep, method "newcomb").
        sheet = self.analyse(self.put(TEAMS))
        self.check_rates(sheet, REFERENCE["teams"]["rates"])
        self.assertAllClose([[self.figure(sheet, "Rate difference (ASSOC.RATEDIFF)", c) for c in (1, 2, 3)]],
                            [REFERENCE["teams"]["rate_difference"]["first_first"]], 1e-10, "rate difference")
        words = [sheet.getCellByPosition(1, row).getString() for row in range(self.used(sheet).EndRow + 1)]
        # The figures as command_values.json rounds them (statsmodels Table2x2 and confint_proportions_2indep).
        self.assertIn("The odds of Promoted in Team A are 4.57 times those in Team B (95% interval 1.38 to 15.11). "
                      "The share with Promoted is 72.0% in Team A against 36.0% in Team B: 2.00 times as high (1.12 to "
                      "3.56), a difference of 36.0 percentage points (8.4 to 56.9). An interval that includes 1 (for "
                      "a ratio) or 0 (for the difference) is compatible with no difference.", words)
        column = sheet.getCellRangeByPosition(0, 0, 0, self.used(sheet).EndRow).getDataArray()
        self.assertFalse(any("differ from which" in text for (text,) in column), "no pairs for 2 rows")

    def test_the_rate_difference_follows_the_chosen_outcome_and_group(self):
        sheet = self.analyse(self.put(TEAMS), OutcomeColumn=2, GroupRow=2)
        self.check_rates(sheet, REFERENCE["teams"]["rates_second"])
        self.assertAllClose([[self.figure(sheet, "Rate difference (ASSOC.RATEDIFF)", c) for c in (1, 2, 3)]],
                            [REFERENCE["teams"]["rate_difference"]["second_second"]], 1e-10, "rate difference")

    def test_a_table_sorted_no_before_yes_gets_the_rates_of_yes_unless_no_is_chosen(self):
        # Invented teams, the columns in sorted order; rates are count over row total (exact identities).
        sorted_teams = [["Team / Outcome", "No", "Yes"], ["Team A", 7, 18], ["Team B", 16, 9]]
        sheet = self.analyse(self.put(sorted_teams))
        self.assertEqual([round(row[1], 12) for row in self.block_under(sheet, "Row total", 2, 4)], [0.72, 0.36])
        self.assertAlmostEqual(self.figure(sheet, "Rate difference (ASSOC.RATEDIFF)", 1), 0.36, places=12)
        sheet = self.analyse(self.put(sorted_teams), OutcomeColumn=1)
        self.assertEqual([round(row[1], 12) for row in self.block_under(sheet, "Row total", 2, 4)], [0.28, 0.64])

    def test_a_large_table_gets_the_interval_of_v_and_every_pair(self):
        # Reference: command_values.json "large" (scipy ncx2 inversion; scipy per pair, Holm by statsmodels).
        sheet = self.analyse(self.put(REFERENCE["large"]["counts"]))
        self.assertClose(self.figure(sheet, "Cramér's V, 95% interval"), REFERENCE["large"]["v_interval"][0], 1e-8)
        self.check_pairs(sheet, REFERENCE["large"]["pairwise"])
        self.check_rates(sheet, REFERENCE["large"]["rates"])

    def test_the_totals_of_the_source_stay_out_of_the_sheets_totals_shares_and_rates(self):
        teams = [row + [total] for row, total in zip(TEAMS, ["Total", 25, 25])] + [["Total", 27, 23, 50]]
        sheet = self.analyse(self.put(teams))
        _, counts = self.block_below(sheet, self.heading(sheet, "Observed counts"), 4, 4)
        self.assertEqual(counts, [[18, 7, 25, 25], [9, 16, 25, 25], [27, 23, 50, 50], [27, 23, 50, 50]])
        _, shares = self.block_below(sheet, self.heading(sheet, "Row percentages"), 3, 3)
        self.assertAllClose([row[:2] for row in shares], [[0.72, 0.28], [0.36, 0.64], [0.54, 0.46]], RECALCULATED,
                            "row percentages")
        self.assertEqual([row[2] for row in shares], ["", "", ""])
        # The source's Total row keeps an empty line among the rates (statsmodels for the others).
        self.check_rates(sheet, REFERENCE["teams_with_totals"]["rates"])


class RecordsCommand(CommandCase):
    def write_records(self, column=0):
        pairs = records_of(REFERENCE["records"]["counts"])
        rows = [["Region", "Exception"]] + [list(pair) for pair in pairs]
        self.put(rows, column=column)
        return len(rows)

    def check_counted(self, sheet):
        reference = REFERENCE["records"]
        heading = self.heading(sheet, "Counts from the records")
        _, counts = self.block_below(sheet, heading, 3, 2)
        self.assertEqual(counts, reference["counts"])
        header = self.row_of(sheet, heading) + 1
        self.assertEqual(sheet.getCellRangeByPosition(0, header, 2, header + 3).getDataArray(),
                         (("Region / Exception", "No", "Yes"), ("Midlands", 30.0, 12.0), ("North", 22.0, 25.0),
                          ("South", 15.0, 28.0)))
        self.check_tests_against(sheet, reference)

    def test_two_adjacent_record_columns_are_counted_by_levels_and_counts_formulas(self):
        rows = self.write_records()
        sheet = self.analyse(f"A1:B{rows}")
        self.assertEqual(sheet.Name, "Region × Exception")
        self.check_counted(sheet)
        self.check_pairs(sheet, REFERENCE["records"]["pairwise"])
        counts = sheet.getCellByPosition(1, self.row_of(sheet, "Midlands"))
        self.assertEqual(formula_of(counts),
                         f"{{=ASSOC.COUNTS(${self.sheet.Name}.$A$2:$A${rows};${self.sheet.Name}.$B$2:$B${rows})}}")

    def test_whole_columns_are_cut_to_the_rows_in_use(self):
        rows = self.write_records()
        sheet = self.analyse("A1:B1048576")
        self.check_counted(sheet)
        self.assertIn(f"$A$2:$A${rows}", sheet.getCellByPosition(1, self.row_of(sheet, "Midlands")).getFormula())

    def test_two_columns_selected_apart_are_read_left_to_right(self):
        rows = self.write_records()
        # Move the second column to D, so that the two are apart.
        self.sheet.getCellRangeByName(f"D1:D{rows}").setDataArray(
            self.sheet.getCellRangeByName(f"B1:B{rows}").getDataArray())
        self.sheet.getCellRangeByName(f"B1:B{rows}").clearContents(7)
        self.check_counted(self.analyse(f"D1:D{rows}", f"A1:A{rows}"))

    def test_a_new_record_changes_the_counts(self):
        rows = self.write_records()
        sheet = self.analyse(f"A1:B{rows + 1}")
        self.put([["South", "Yes"]], row=rows)
        session.document.calculateAll()
        _, counts = self.block_below(sheet, self.heading(sheet, "Counts from the records"), 3, 2)
        self.assertEqual(counts[2], [15.0, 29.0])


class RefusedSelections(CommandCase):
    def test_a_single_cell(self):
        self.put(BRANCHES)
        self.refused("Only one cell is selected. " + SELECT_HINT, "B2")

    def test_a_single_column(self):
        self.put(BRANCHES)
        self.refused("Only one column is selected. " + SELECT_HINT + " (To count records, select their two columns; "
                     "hold Ctrl to select columns that are not side by side.)", "B1:B4")

    def test_labels_beside_one_column_of_counts(self):
        self.put([["Design", 41], ["Assembly", 10], ["Sales", 7]])
        self.refused("The selection holds one column of labels and one column of numbers, like a list of counts by "
                     "one category. A test of association needs a table with at least two columns of counts, or two "
                     "columns of records. To read the two columns as records anyway, choose \"two columns of "
                     "records\" as the way to read the selection.", "A1:B3")

    def test_text_among_the_counts(self):
        self.put([["", "Yes", "No"], ["North", 4, "n/a"], ["South", 2, 7]])
        self.refused("The selection cannot be read as a table of counts: Row 2 (\"North\"), column 3 (\"No\") holds "
                     "the text \"n/a\"; counts must be numbers. " + SELECT_HINT, "A1:C3")

    def test_a_cell_that_shows_an_error(self):
        self.put(BRANCHES)
        self.sheet.getCellRangeByName("C3").setFormula("=1/0")
        self.refused("Cell C3 of the selection shows an error. Correct it (or leave it out of the selection) and "
                     "run the command again.", "A1:D4")

    def test_three_separate_parts(self):
        self.put(BRANCHES)
        self.refused("The selection has 3 separate parts. Select one block of cells, or two columns of records "
                     "(hold Ctrl to select the second).", "A1:A2", "C1:C2", "D3:D4")

    def test_an_unknown_reading(self):
        self.put(BRANCHES)
        self.refused("ReadAs must be \"table\", \"records\" or \"automatic\", not \"list\".", "A1:D4", ReadAs="list")

    def test_a_significance_level_of_one(self):
        self.put(BRANCHES)
        self.refused("The significance level (alpha) must be between 0 and 1, for example 0.05; it is 1.", "A1:D4",
                     Alpha=1.0)


class Failures(CommandCase):
    def test_a_failure_while_writing_removes_the_half_built_sheet_and_says_why(self):
        self.put(BRANCHES)
        for phase in ("colour_scale", "cells", "looks", "chart"):
            self.refused(f"The sheet could not be made: a failure on purpose after {phase}", "A1:D4",
                         FailAfter=phase)
        self.assertEqual(self.analyse("A1:D4").Name, "Branch × Outcome")


class Availability(unittest.TestCase):
    def handler_for(self, frame):
        return session.office.context.ServiceManager.createInstanceWithArgumentsAndContext(
            "org.assocproject.calc.AnalyseCommand", (frame,), session.office.context)

    def url(self, complete):
        url = uno.createUnoStruct("com.sun.star.util.URL")
        url.Complete = complete
        _, url = session.office.service("com.sun.star.util.URLTransformer").parseStrict(url)
        return url

    def test_a_calc_frame_gets_the_command_through_its_protocol(self):
        frame = session.document.getCurrentController().getFrame()
        self.assertIsNotNone(frame.queryDispatch(self.url(COMMAND), "", 0))
        self.assertIsNotNone(self.handler_for(frame).queryDispatch(self.url(COMMAND), "", 0))

    def test_a_frame_without_a_spreadsheet_gets_no_command(self):
        empty_frame = session.office.service("com.sun.star.frame.Frame")
        self.assertIsNone(self.handler_for(empty_frame).queryDispatch(self.url(COMMAND), "", 0))

    def test_an_unknown_command_of_the_protocol_is_not_dispatched(self):
        frame = session.document.getCurrentController().getFrame()
        self.assertIsNone(self.handler_for(frame).queryDispatch(self.url("org.assocproject.calc:Other"), "", 0))


if __name__ == "__main__":
    calc_support.run_harness(__doc__)
