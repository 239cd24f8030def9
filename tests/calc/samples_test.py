#!/usr/bin/python3
"""The sample workbooks in real headless Calc: each opens with the extension installed, recalculates
without an error cell anywhere, and shows the results that reference libraries give for its data.

    /usr/bin/python3 tests/calc/samples_test.py --oxt build/extension/assoc.oxt

Expected values: tests/reference/samples_values.json, written by tests/reference/samples_generate.py
with scipy 1.10.1, numpy 1.24.2, statsmodels 0.13.5 and R 4.2.2 from the samples' input cells. The
counts that ASSOC.COUNTS makes of the invoice records are recounted here in Python from the records
as the recalculated sheet holds them, and the selection rates of ASSOC.IMPACT are exact fractions.
The data are invented (Larkspur Components Ltd is a fictional company).

Every analysis sheet (all but the record sheets a class lists) must also carry a chart, and a heat
map (a colour scale in our HEAT_MAP colours) over each ASSOC.RESIDUALS(...; "adjusted") block, with
the key beside it; a sheet without such a block must be listed, with its reason, as having none.
"""

import argparse
import collections
import json
import math
import pathlib
import sys
import time
import unittest
from fractions import Fraction

ROOT = pathlib.Path(__file__).resolve().parents[2]
sys.path.insert(0, str(ROOT / "scripts"))
import assoc_office  # noqa: E402
from build_samples import HEAT_MAP  # noqa: E402

REFERENCE = json.loads((ROOT / "tests" / "reference" / "samples_values.json").read_text())
SAMPLES = ROOT / "samples"
# Results against scipy/statsmodels/R: the same formulas in double precision agree far closer.
TOLERANCE = 1e-9

office = None


class SampleCase:
    """Opens one workbook for the class and recalculates it (mixed into a TestCase)."""
    workbook = None
    record_sheets = ()    # sheets of records only, not analysis sheets
    without_heat_map = {}  # analysis sheets that rightly have no residual heat map: the reason

    @classmethod
    def setUpClass(cls):
        cls.doc = office.load(SAMPLES / cls.workbook)
        cls.doc.calculateAll()

    @classmethod
    def tearDownClass(cls):
        cls.doc.close(True)

    def named(self, name):
        self.assertTrue(self.doc.NamedRanges.hasByName(name), f"{self.workbook} has no range named {name}")
        return self.doc.NamedRanges.getByName(name).getReferredCells()

    def values(self, name):
        return [list(row) for row in self.named(name).getDataArray()]

    def row(self, name):
        (row,) = self.values(name)
        return row

    def assertClose(self, actual, expected, what, tolerance=TOLERANCE):
        self.assertEqual(len(actual), len(expected), what)
        for i, (got, want) in enumerate(zip(actual, expected)):
            self.assertTrue(math.isclose(got, want, rel_tol=tolerance, abs_tol=1e-300),
                            f"{what}[{i}]: {got!r} differs from {want!r}")

    def test_recalculates_without_error_cells(self):
        from com.sun.star.sheet.FormulaResult import ERROR
        formulas = 0
        for index in range(self.doc.Sheets.Count):
            sheet = self.doc.Sheets.getByIndex(index)
            errors = sheet.queryFormulaCells(ERROR)
            self.assertEqual(errors.getCount(), 0, f"{sheet.Name}: error cells {errors.RangeAddressesAsString}")
            formulas += sheet.queryFormulaCells(1 | 2 | 4).getCount()  # VALUE | STRING | ERROR
        self.assertGreater(formulas, 0)

    def analysis_sheets(self):
        sheets = [self.doc.Sheets.getByIndex(i) for i in range(self.doc.Sheets.Count)]
        return [sheet for sheet in sheets if sheet.Name not in self.record_sheets]

    def test_every_analysis_sheet_has_a_chart(self):
        for sheet in self.analysis_sheets():
            with self.subTest(sheet.Name):
                charts = sheet.Charts
                self.assertGreater(charts.getCount(), 0, f"{sheet.Name} has no chart")
                for index in range(charts.getCount()):
                    self.assertTrue(charts.getByIndex(index).getRanges(), f"{sheet.Name}: a chart without data")

    def test_adjusted_residuals_have_a_heat_map_and_its_key(self):
        from com.sun.star.sheet.ConditionEntryType import COLORSCALE
        colours = [colour for _, colour, _ in HEAT_MAP]
        points = [str(value) for value, _, _ in HEAT_MAP]
        for sheet in self.analysis_sheets():
            with self.subTest(sheet.Name):
                blocks = residual_blocks(sheet)
                if sheet.Name in self.without_heat_map:
                    self.assertEqual(blocks, [], f"{sheet.Name} is listed as having no residual heat map")
                    continue
                self.assertTrue(blocks, f"{sheet.Name} has no ASSOC.RESIDUALS(...; \"adjusted\") block; list it "
                                        "in without_heat_map with the reason if it rightly has none")
                scales = []
                for conditional in sheet.ConditionalFormats.getConditionalFormats():
                    entries = [conditional.getByIndex(i) for i in range(conditional.getCount())]
                    for entry in entries:
                        if entry.getType() == COLORSCALE:
                            scale = entry.ColorScaleEntries
                            self.assertEqual([point.getColor() for point in scale], colours, sheet.Name)
                            self.assertEqual([point.getFormula() for point in scale], points, sheet.Name)
                            scales += [address_tuple(a) for a in conditional.Range.getRangeAddresses()]
                for block in blocks:
                    self.assertTrue(any(covers(scale, block) for scale in scales),
                                    f"{sheet.Name}: no colour scale over the adjusted residuals at {block}")
                search = sheet.createSearchDescriptor()
                search.SearchString = "Heat map (adjusted residuals):"
                self.assertIsNotNone(sheet.findFirst(search), f"{sheet.Name}: the heat map has no key")


def residual_blocks(sheet):
    """(first column, first row, last column, last row) of each array formula of the sheet that
    computes adjusted residuals."""
    blocks = []
    formulas = sheet.queryFormulaCells(1 | 2 | 4).getCells().createEnumeration()  # VALUE | STRING | ERROR
    while formulas.hasMoreElements():
        cell = formulas.nextElement()
        text = cell.getFormula().upper()
        if ".RESIDUALS(" in text and '"ADJUSTED"' in text:
            cursor = sheet.createCursorByRange(cell)
            cursor.collapseToCurrentArray()
            block = address_tuple(cursor.RangeAddress)
            if block not in blocks:
                blocks.append(block)
    return blocks


def address_tuple(address):
    return address.StartColumn, address.StartRow, address.EndColumn, address.EndRow


def covers(outer, inner):
    return outer[0] <= inner[0] and outer[1] <= inner[1] and outer[2] >= inner[2] and outer[3] >= inner[3]


class QuickStart(SampleCase, unittest.TestCase):
    workbook = "quick_start.fods"
    reference = REFERENCE["quick_start"]

    def test_first_formula_and_its_array_form_match_scipy(self):
        self.assertEqual([row[1:] for row in self.values("QuickTable")[1:]], self.reference["counts"])
        self.assertClose([self.row("QuickPValue")[0]], [self.reference["pearson"][2]], "ASSOC.PVALUE")
        self.assertClose(self.row("QuickStatistic"), self.reference["pearson"], "ASSOC.STATISTIC")
        sheet = self.doc.Sheets.getByName("Quick start")
        expected = [list(row) for row in sheet.getCellRangeByName("C10:E12").getDataArray()]
        for got, want in zip(expected, self.reference["expected"]):
            self.assertClose(got, want, "ASSOC.EXPECTED")


class Promotions(SampleCase, unittest.TestCase):
    workbook = "promotions.fods"
    reference = REFERENCE["promotions"]

    def test_report_fills_its_22_rows_through_the_conclusion_and_the_caution(self):
        report = self.values("AssocReport")
        self.assertEqual(len(report), 22)
        self.assertEqual([report[0][0], report[20][0], report[21][0]], ["Total count (n)", "Conclusion", "Caution"])
        self.assertIn("department and promotion outcome appear associated", report[20][1])
        self.assertIn("not proof of cause, nor of discrimination", report[21][1])

    def test_report_p_value_matches_scipy(self):
        report = {label: value for label, value in self.values("AssocReport")}
        self.assertEqual([row[1:] for row in self.values("CountTable")[1:]], self.reference["counts"])
        self.assertClose([report["Pearson X²"], report["Degrees of freedom"], report["p-value, Pearson X²"]],
                         self.reference["pearson"], "report")


class DepartmentChecks:
    """The Departments sheet of hr_review.fods (mixed into HumanResources): rates with intervals, the
    pairwise table, Design against Assembly and the common risk ratio within offices, against
    statsmodels, scipy and R (samples_generate.py, section hr_departments)."""
    departments = REFERENCE["hr_departments"]

    def test_department_inputs_are_those_of_the_reference(self):
        table = self.values("DepartmentTable")[1:]
        self.assertEqual([row[0] for row in table], self.departments["departments"])
        self.assertEqual([row[1:] for row in table], self.departments["counts"])

    def test_department_rates_have_the_wilson_intervals_of_statsmodels(self):
        self.assertClose([self.row("DepartmentPValue")[0]], [self.departments["pearson"][2]], "Pearson p")
        for got, want in zip(self.values("DepartmentRates"), self.departments["rates"]):
            self.assertClose(got, want, "ASSOC.RATES")
            self.assertTrue(got[2] <= got[1] <= got[3], "the interval holds the rate")

    def test_pairwise_table_matches_scipy_with_holms_adjustment(self):
        pairs = self.values("DepartmentPairs")
        self.assertEqual([row[:2] for row in pairs], self.departments["pairs"])
        self.assertClose([row[2] for row in pairs], self.departments["pair_p_values"], "pair p-values")
        self.assertClose([row[3] for row in pairs], self.departments["pair_holm"], "Holm-adjusted")

    def test_design_against_assembly_pooled_and_within_offices_matches_statsmodels(self):
        self.assertClose(self.row("DesignAssemblyDifference"), self.departments["design_assembly_difference"],
                         "ASSOC.RATEDIFF")
        self.assertClose(self.row("DesignAssemblyRiskRatio"), self.departments["design_assembly_risk_ratio"],
                         "ASSOC.RISKRATIO")
        self.assertClose(self.row("CommonRiskRatio"), self.departments["common_risk_ratio"], "ASSOC.STRATARISK")


class HumanResources(DepartmentChecks, SampleCase, unittest.TestCase):
    workbook = "hr_review.fods"
    reference = REFERENCE["hr"]

    def test_inputs_are_those_of_the_reference(self):
        strata = self.values("OfficeStrata")[1:]
        self.assertEqual([row[0] for row in strata], self.reference["offices"])
        self.assertEqual([row[1:] for row in strata], self.reference["strata"])
        self.assertEqual([row[1:] for row in self.values("PooledTable")[1:]], self.reference["pooled"])
        selection = self.values("SelectionTable")[1:]
        self.assertEqual([row[0] for row in selection], self.reference["age_bands"])
        self.assertEqual([row[1] for row in selection], self.reference["selected"])

    def test_pooled_association_matches_scipy_and_statsmodels(self):
        self.assertClose([self.row("PooledPValue")[0]], [self.reference["pooled_pearson"][2]], "pooled p")
        self.assertClose(self.row("PooledOddsRatio"), self.reference["pooled_odds_ratio"], "pooled odds ratio")
        self.assertClose(self.row("PooledRiskRatio"), self.reference["pooled_risk_ratio"], "pooled risk ratio")

    def test_within_offices_the_association_vanishes_as_statsmodels_finds(self):
        strata = self.row("StrataResult")
        self.assertClose(strata, self.reference["strata_result"], "Mantel–Haenszel")
        self.assertClose(self.row("HomogeneityResult"), self.reference["homogeneity"], "Breslow–Day")
        # The paradox itself: significant and above 1 pooled, not significant and below 1 within offices.
        self.assertLess(self.row("PooledPValue")[0], 0.05)
        self.assertGreater(self.row("PooledOddsRatio")[0], 1)
        self.assertGreater(strata[0], 0.05)
        self.assertLess(strata[2], 1)

    def test_selection_rates_and_flags_are_exact_fractions(self):
        selected, considered = self.reference["selected"], self.reference["considered"]
        rates = [Fraction(s, c) for s, c in zip(selected, considered)]
        impact = self.values("ImpactResult")
        self.assertClose([row[0] for row in impact], [float(r) for r in rates], "rates", 1e-15)
        self.assertClose([row[1] for row in impact], [float(r / max(rates)) for r in rates], "ratios", 1e-15)
        flagged = [bool(row[2]) for row in impact]
        self.assertEqual(flagged, [r / max(rates) < Fraction(4, 5) for r in rates])
        self.assertEqual(flagged, [False, False, False, True])

    def test_selection_tests_match_scipy_and_r(self):
        self.assertClose([self.row("SelectionPValue")[0]], [self.reference["selection_pearson"][2]], "Pearson p")
        self.assertClose([self.row("SelectionExact")[0]], [self.reference["selection_exact"]], "exact p",
                         1e-7)  # R's fisher.test sums with a relative tolerance of 1e-7
        p, z = self.row("SelectionTrend")
        reference_p, reference_z = self.reference["selection_trend"]
        self.assertClose([p, abs(z)], [reference_p, reference_z], "trend")
        # The sign: the Cochran–Armitage numerator Σ score·(selected − considered·p̄) (scores 1, 2, …).
        share = Fraction(sum(self.reference["selected"]), sum(self.reference["considered"]))
        numerator = sum((i + 1) * (s - c * share) for i, (s, c) in
                        enumerate(zip(self.reference["selected"], self.reference["considered"])))
        self.assertEqual(z < 0, numerator < 0)


class Invoices(SampleCase, unittest.TestCase):
    workbook = "invoice_exceptions.fods"
    reference = REFERENCE["finance"]
    record_sheets = ("Invoices",)
    # Paired answers: the question is the balance of the changes, not whether rows and columns are independent.
    without_heat_map = {"Re-audit": "paired answers (McNemar): no test of independence, so no residuals"}

    @classmethod
    def setUpClass(cls):
        super().setUpClass()
        sheet = cls.doc.Sheets.getByName("Invoices")
        count = cls.reference["invoices"]
        cls.records = [dict(zip(("invoice", "region", "channel", "amount", "band", "exception", "reaudit"), row))
                       for row in sheet.getCellRangeByName(f"A2:G{count + 1}").getDataArray()]

    def recount(self, row_key, column_key):
        pairs = collections.Counter((r[row_key], r[column_key]) for r in self.records if r[row_key] and r[column_key])
        rows = sorted({r[row_key] for r in self.records if r[row_key]})
        columns = sorted({r[column_key] for r in self.records if r[column_key]})
        return rows, columns, [[float(pairs[(a, b)]) for b in columns] for a in rows]

    def test_records_are_the_600_of_the_reference(self):
        self.assertEqual(len(self.records), 600)
        self.assertEqual(self.doc.Sheets.getByName("Invoices").getCellByPosition(0, 601).getString(), "")
        bands = {r["band"] for r in self.records}
        self.assertEqual(len(bands), 4)

    def test_counts_from_the_records_match_a_python_recount(self):
        for name, row_key, column_key in (("RegionTable", "region", "exception"),
                                          ("ChannelTable", "channel", "exception"),
                                          ("BandTable", "band", "exception"),
                                          ("ReauditTable", "exception", "reaudit")):
            with self.subTest(name):
                rows, columns, counts = self.recount(row_key, column_key)
                table = self.values(name)
                self.assertEqual(table[0][1:], columns)
                self.assertEqual([row[0] for row in table[1:]], rows)
                self.assertEqual([row[1:] for row in table[1:]], counts)
                reference = self.reference["tables"][{"ReauditTable": "reaudit"}.get(name, row_key)]
                self.assertEqual(counts, reference["counts"])

    def test_region_tests_match_scipy_statsmodels_and_r(self):
        self.assertClose(self.row("RegionStatistic"), self.reference["region_pearson"], "Pearson")
        self.assertClose([self.row("RegionExact")[0]], [self.reference["region_exact"]], "exact", 1e-7)
        cells = self.values("RegionCellTest")
        for got, want in zip(cells, self.reference["region_holm"]):
            self.assertClose(got, want, "Holm-adjusted cell p-values")

    def test_channel_and_size_tests_match_scipy_and_r(self):
        self.assertClose(self.row("ChannelStatistic"), self.reference["channel_pearson"], "Pearson")
        self.assertClose(self.row("ChannelFit"), self.reference["channel_fit"], "goodness of fit")
        p, z = self.row("BandTrend")
        self.assertClose([p, -z], self.reference["band_trend"], "trend")  # column 1 is "No": its share falls

    def test_paired_tests_match_statsmodels(self):
        self.assertClose(self.row("PairedResult"), self.reference["paired_corrected"], "McNemar")
        self.assertClose(self.row("PairedExact"), self.reference["paired_exact"], "exact binomial")


class StaffSurvey(SampleCase, unittest.TestCase):
    workbook = "staff_survey.fods"
    reference = REFERENCE["staff_survey"]
    record_sheets = ("Wave answers",)
    without_heat_map = {"Waves": "repeated yes/no answers (Cochran's Q): no test of independence, so no residuals"}

    def test_inputs_are_those_of_the_reference(self):
        table = self.values("TenureTable")
        self.assertEqual([row[0] for row in table[1:]], self.reference["bands"])
        self.assertEqual([row[1:] for row in table[1:]], self.reference["counts"])
        self.assertEqual([row[0] for row in self.values("TenureYears")], self.reference["years"])
        self.assertEqual(len(self.values("WaveAnswers")) - 1, self.reference["staff"])

    def test_ordered_tests_match_statsmodels_and_scipy(self):
        self.assertClose(self.row("TenureOrdinal"), self.reference["ordinal"], "ASSOC.ORDINAL")
        self.assertClose(self.row("TenureOrdinalYears"), self.reference["ordinal_years"], "ASSOC.ORDINAL with years")
        self.assertClose(self.row("TenurePearson"), [self.reference["pearson"][2]], "ASSOC.PVALUE")
        self.assertClose(self.row("TenureGamma"), [self.reference["gamma"]], "gamma (pairs counted with numpy)")
        self.assertClose(self.row("TenureTauB"), [self.reference["tau_b"]], "tau-b (scipy kendalltau)")
        # The point of the sheet: the ordered test finds what Pearson's test misses.
        self.assertLess(self.row("TenureOrdinal")[0], 0.001)
        self.assertGreater(self.row("TenurePearson")[0], 0.05)

    def test_within_offices_matches_r_mantelhaen_test(self):
        # R is given Harbour's one-row stratum too; it adds nothing there, as ASSOC.WITHIN sets it aside.
        self.assertClose(self.row("WithinResult"), self.reference["within"], "ASSOC.WITHIN")

    def test_the_simulation_ordered_as_the_exact_test_estimates_its_p_value(self):
        self.assertEqual([row[1:] for row in self.values("LakeviewTable")[1:]], self.reference["lakeview"])
        exact = self.row("LakeviewExact")[0]
        self.assertClose([exact], [self.reference["lakeview_exact"]], "exact (R fisher.test)", 1e-7)
        p, standard_error, trials = self.row("LakeviewSimulatedExact")
        self.assertEqual(trials, 100000)
        self.assertLess(abs(p - exact), 4 * standard_error)

    def test_survey_waves_match_statsmodels_and_r(self):
        self.assertClose(self.row("WaveRepeated"), self.reference["repeated"], "Cochran's Q (statsmodels)")
        self.assertClose(self.row("TwoWaveRepeated"), self.reference["march_july_repeated"], "two waves")
        self.assertClose(self.row("TwoWavePaired"), self.reference["march_july_mcnemar"], "McNemar (R)")


def main():
    global office
    parser = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--oxt", required=True, help="the built extension, e.g. build/extension/assoc.oxt")
    known, rest = parser.parse_known_args()
    started = time.monotonic()
    with assoc_office.ThrowawayOffice(known.oxt, log=lambda m: print(m, flush=True)) as running:
        office = running
        program = unittest.main(argv=[sys.argv[0], *rest], exit=False, verbosity=2)
    print(f"Sample workbooks: {time.monotonic() - started:.1f} s", flush=True)
    sys.exit(0 if program.result.wasSuccessful() else 1)


if __name__ == "__main__":
    main()
