#!/usr/bin/python3
"""Ordered tables, association within r×c strata, repeated yes/no answers and the simulation that
orders tables as the exact test does, in real headless Calc: ASSOC.ORDINAL, ASSOC.STRENGTH with
"gamma" and "taub", ASSOC.WITHIN, ASSOC.REPEATED and ASSOC.SIMULATE with "exact".

    /usr/bin/python3 tests/calc/calc_ordered_and_within.py --oxt build/extension/assoc.oxt [unittest options]

Expected values: tests/reference/ordered_values.json, written by tests/reference/ordered_generate.py
with statsmodels 0.13.5 (linear-by-linear test, Cochran's Q), scipy 1.10.1 (Kendall's tau-b on the
expanded data), numpy 1.24.2 (pairs for gamma) and R 4.2.2 (mantelhaen.test); the published figures of
tests/reference/published_values.md (section named beside each check); and exact identities between
functions, checked cell against cell. Bad input shows Err:502 and ASSOC.CHECK explains it.
The tables are invented (a fictional company's staff surveys) unless a source is named.
"""
import json
import math

from calc_more_functions import ErrorCheckMixin
from calc_support import ROOT, TEAMS, CalcTestCase, run_harness

ORDERED = json.loads((ROOT / "tests" / "reference" / "ordered_values.json").read_text())
SATISFACTION = ["Very dissatisfied", "Dissatisfied", "Neutral", "Satisfied", "Very satisfied"]
BANDS = ["Under 1 year", "1 to 2 years", "3 to 5 years", "6 to 10 years", "Over 10 years"]
# Bickel, Hammel & O'Connell (1975), Berkeley admissions (counts as in R's UCBAdmissions;
# published_values.md section 7): per department, men admitted, rejected, women admitted, rejected.
ADMISSIONS = [("A", 512, 313, 89, 19), ("B", 353, 207, 17, 8), ("C", 120, 205, 202, 391),
              ("D", 138, 279, 131, 244), ("E", 53, 138, 94, 299), ("F", 22, 351, 24, 317)]
# Invented 3×4 table on which ordering tables by X² estimates another p-value than the exact test's.
THREE_BY_FOUR = [[2, 0, 3, 1], [1, 4, 0, 2], [0, 1, 2, 5]]


def labelled(counts, rows, columns, corner=""):
    return [[corner, *columns]] + [[label, *row] for label, row in zip(rows, counts)]


def long_layout(strata_names, row_names, column_names, counts):
    return [["Stratum", "Row", *column_names]] + [
        [stratum, row, *values] for stratum, table in zip(strata_names, counts) for row, values in zip(row_names, table)]


def waves_as_text(answers):
    return [["Wave 1", "Wave 2", "Wave 3"]] + [["Yes" if a else "No" for a in row] for row in answers]


class Ordinal(CalcTestCase, ErrorCheckMixin):
    tenure = ORDERED["tenure"]

    def put_tenure(self):
        return self.put(labelled(self.tenure["counts"], BANDS, SATISFACTION, "Tenure / Satisfaction"))

    def test_matches_statsmodels_on_the_tenure_table(self):
        table = self.put_tenure()
        self.assertAllClose(self.array("H1:K1", f"=ASSOC.ORDINAL({table})"), [self.tenure["ordinal"]], 1e-10,
                            "p, M², df, r (statsmodels test_ordinal_association, numpy)")
        self.assertClose(self.number("H2", f"=ASSOC.ORDINAL({table})"), self.tenure["ordinal"][0], 1e-10,
                         "a plain entry shows the p-value")
        # Pearson's test, blind to the order, misses what the ordered test finds (scipy: p = 0.064).
        self.assertClose(self.number("H3", f"=ASSOC.PVALUE({table})"), self.tenure["pearson_p"], 1e-10, "Pearson")

    def test_takes_scores_from_cells(self):
        table = self.put_tenure()
        rows = self.put([[s] for s in self.tenure["row_scores"]], column=7, row=3)
        columns = self.put([self.tenure["column_scores"]], column=7, row=9)
        self.assertAllClose(self.array("H12:K12", f"=ASSOC.ORDINAL({table}; {rows}; {columns})"),
                            [self.tenure["ordinal_scored"]], 1e-10, "given scores (statsmodels)")

    def test_is_the_trend_test_times_n_minus_one_over_n_for_two_rows(self):
        # Agresti (2007) alcohol table (published_values.md section 4): M² ≈ 6.57; exact identity with ASSOC.TREND.
        alcohol = ORDERED["alcohol"]
        table = self.put(alcohol["counts"])
        scores = self.put([alcohol["column_scores"]], row=3)
        p, m2, df, r = self.array("H1:K1", f"=ASSOC.ORDINAL({table}; ; {scores})")[0]
        self.assertAllClose([[p, m2, df, r]], [alcohol["ordinal"]], 1e-10, "statsmodels")
        self.assertAlmostEqual(m2, 6.57, 2)
        _, z = self.array("H2:I2", f"=ASSOC.TREND({table}; {scores})")[0]
        n = sum(map(sum, alcohol["counts"]))
        self.assertClose(m2, z * z * (n - 1) / n, 1e-12, "M² = (n − 1)/n · z²")
        self.assertClose(r, -z / math.sqrt(n), 1e-12, "r = −z/√n")

    def test_refuses_a_table_with_one_row_of_counts_and_check_says_why(self):
        table = self.put([[3, 4, 5], [0, 0, 0]])
        self.assertErrorExplained(f"=ASSOC.ORDINAL({table})", f'=ASSOC.CHECK({table}; "ordinal")',
                                  "the table has only 1 row with counts (1 row with all zeros set aside)")

    def test_refuses_scores_that_do_not_follow_the_order(self):
        table = self.put_tenure()
        scores = self.put([[1, 2, 5, 4, 6]], row=8)
        self.assertEqual(self.formula("H1", f"=ASSOC.ORDINAL({table}; {scores})").getError(), 502)


class OrderedStrength(CalcTestCase, ErrorCheckMixin):
    def test_gamma_reproduces_agrestis_job_satisfaction_example(self):
        # published_values.md section 14: C = 1331, D = 849, γ = 0.221 (Agresti 2007, from memory).
        job = ORDERED["job"]
        table = self.put(job["counts"])
        gamma = self.number("H1", f'=ASSOC.STRENGTH({table}; "gamma")')
        self.assertClose(gamma, (1331 - 849) / (1331 + 849), 1e-14, "γ from the printed pair counts")
        self.assertAlmostEqual(gamma, 0.221, 3)
        self.assertClose(self.number("H2", f'=ASSOC.STRENGTH({table}; "TauB")'), job["tau_b"], 1e-12,
                         "scipy kendalltau on the expanded data")

    def test_gamma_and_tau_b_of_the_tenure_table_match_pairs_and_scipy(self):
        tenure = ORDERED["tenure"]
        table = self.put(labelled(tenure["counts"], BANDS, SATISFACTION))
        self.assertClose(self.number("H1", f'=ASSOC.STRENGTH({table}; "gamma")'), tenure["gamma"], 1e-12, "γ")
        self.assertClose(self.number("H2", f'=ASSOC.STRENGTH({table}; "taub")'), tenure["tau_b"], 1e-12, "τ-b")

    def test_check_says_gamma_needs_a_table_of_counts(self):
        table = self.put([["Low", "High"], [3, "n/a"], [2, 5]])
        self.assertErrorExplained(f'=ASSOC.STRENGTH({table}; "gamma")', f'=ASSOC.CHECK({table}; "gamma")',
                                  'row 2, column 2 ("High") holds the text "n/a"; counts must be numbers')


class Within(CalcTestCase, ErrorCheckMixin):
    def test_matches_r_mantelhaen_test_on_three_by_four_strata(self):
        offices = ORDERED["offices"]
        strata = self.put(long_layout(offices["strata"], offices["rows"], offices["columns"], offices["counts"]))
        self.assertAllClose(self.array("H1:J1", f"=ASSOC.WITHIN({strata})"), [offices["within"]], 1e-10,
                            "p, statistic, df (R mantelhaen.test)")

    def test_matches_r_on_two_by_three_strata_without_a_header(self):
        channels = ORDERED["channels"]
        rows = long_layout(["Web", "Post", "Phone", "Desk"], ["North", "South"], ["None", "Minor", "Major"],
                           channels["counts"])[1:]
        strata = self.put(rows)
        self.assertAllClose(self.array("H1:J1", f"=ASSOC.WITHIN({strata})"), [channels["within"]], 1e-10,
                            "R mantelhaen.test")

    def test_equals_the_uncorrected_mantel_haenszel_statistic_for_two_by_two_strata(self):
        long = [["Department", "Sex", "Admitted", "Rejected"]]
        for department, *counts in ADMISSIONS:
            long += [[department, "Men", counts[0], counts[1]], [department, "Women", counts[2], counts[3]]]
        within = self.put(long)
        wide = self.put([["", "a", "b", "c", "d"], *[list(row) for row in ADMISSIONS]], column=8)
        p, statistic, df = self.array("O1:Q1", f"=ASSOC.WITHIN({within})")[0]
        mh_p, mh_statistic = self.array("O2:P2", f'=ASSOC.STRATA({wide}; "uncorrected")')[0]
        self.assertClose(statistic, mh_statistic, 1e-12, "exact identity with ASSOC.STRATA")
        self.assertClose(p, mh_p, 1e-12, "p")
        self.assertEqual(df, 1)

    def test_check_names_a_stratum_set_aside(self):
        channels = ORDERED["channels"]
        rows = long_layout(["Web", "Post", "Phone", "Desk"], ["North", "South"], ["None", "Minor", "Major"],
                           channels["counts"])
        rows += [["Kiosk", "North", 4, 2, 1]]
        strata = self.put(rows)
        self.assertAllClose(self.array("H1:J1", f"=ASSOC.WITHIN({strata})"), [channels["within"]], 1e-10,
                            "the stratum with one row adds nothing")
        self.assertIn('The stratum "Kiosk" has fewer than 2 rows or 2 columns with counts and adds nothing to the test.',
                      self.words("H2", f'=ASSOC.CHECK({strata}; "within")'))

    def test_refuses_a_stratum_split_in_two_and_check_says_why(self):
        strata = self.put([["A", "x", 1, 2], ["B", "x", 3, 4], ["A", "y", 5, 6], ["B", "y", 2, 2]])
        self.assertErrorExplained(f"=ASSOC.WITHIN({strata})", f'=ASSOC.CHECK({strata}; "within")',
                                  'ASSOC.WITHIN cannot be used here: the stratum "A" comes back at row 3 after rows of '
                                  "another stratum; keep each stratum's rows together (sort the range by its first "
                                  "column).")


class Repeated(CalcTestCase, ErrorCheckMixin):
    def test_matches_statsmodels_on_three_waves_of_text_answers(self):
        waves = ORDERED["waves"]
        answers = self.put(waves_as_text(waves["answers"]))
        self.assertAllClose(self.array("H1:J1", f'=ASSOC.REPEATED({answers}; "yes")'), [waves["repeated"]], 1e-10,
                            "p, Q, df (statsmodels cochrans_q)")
        self.assertAllClose(self.array("H2:J2", f"=ASSOC.REPEATED({answers})"), [waves["repeated"]], 1e-10,
                            "without the yes label")

    def test_matches_statsmodels_on_four_tasks_of_ones_and_zeros(self):
        tasks = ORDERED["tasks"]
        answers = self.put(tasks["answers"])
        self.assertAllClose(self.array("H1:J1", f"=ASSOC.REPEATED({answers})"), [tasks["repeated"]], 1e-10,
                            "statsmodels cochrans_q")

    def test_check_says_which_label_was_yes_and_how_many_people_were_set_aside(self):
        waves = ORDERED["waves"]
        rows = waves_as_text(waves["answers"]) + [["Yes", None, "No"], [None, None, None]]
        answers = self.put(rows)
        self.assertAllClose(self.array("H1:J1", f"=ASSOC.REPEATED({answers})"), [waves["repeated"]], 1e-10,
                            "the person with a blank is set aside")
        text = self.words("H2", f'=ASSOC.CHECK({answers}; "repeated")')
        self.assertIn('"Yes" was counted as yes', text)
        self.assertIn("1 person with a blank answer was set aside (row 20 of the range)", text)

    def test_equals_the_uncorrected_paired_test_for_two_occasions(self):
        # Exact identity: Q for two occasions is McNemar's (b − c)²/(b + c); people from the TEAMS counts.
        (a, b), (c, d) = [row[1:] for row in TEAMS[1:]]
        people = [[1, 1]] * a + [[1, 0]] * b + [[0, 1]] * c + [[0, 0]] * d
        answers = self.put(people)
        square = self.put([[a, b], [c, d]], column=4)
        p, q, df = self.array("H1:J1", f"=ASSOC.REPEATED({answers})")[0]
        paired = self.array("H2:J2", f'=ASSOC.PAIRED({square}; "uncorrected")')[0]
        self.assertAllClose([[p, q, df]], [paired], 1e-12, "ASSOC.PAIRED uncorrected")

    def test_reads_a_first_column_of_employee_numbers_as_the_peoples_labels(self):
        tasks = ORDERED["tasks"]
        numbered = [[4400 + i] + row for i, row in enumerate(tasks["answers"])]
        answers = self.put(numbered)
        self.assertAllClose(self.array("H1:J1", f"=ASSOC.REPEATED({answers})"), [tasks["repeated"]], 1e-10,
                            "statsmodels cochrans_q, without the column of numbers")
        self.assertIn("Column 1 holds a different entry on every row and no answer, so it was read as the people's "
                      "names or numbers", self.words("H2", f'=ASSOC.CHECK({answers}; "repeated")'))

    def test_refuses_a_third_label_and_check_says_why(self):
        answers = self.put([["Yes", "No"], ["Maybe", "Yes"]])
        self.assertErrorExplained(f"=ASSOC.REPEATED({answers})", f'=ASSOC.CHECK({answers}; "repeated")',
                                  'the answers hold more than two labels ("Yes", "No" and "Maybe")')


class SimulatedExactTest(CalcTestCase, ErrorCheckMixin):
    def test_estimates_the_exact_p_value_not_the_chi_squared_ones(self):
        table = self.put(THREE_BY_FOUR)
        exact = self.number("H1", f"=ASSOC.EXACT({table})")
        p, standard_error, trials = self.array("H2:J2", f'=ASSOC.SIMULATE({table}; 200000; 5; "exact")')[0]
        self.assertEqual(trials, 200000)
        self.assertLess(abs(p - exact), 4 * standard_error)
        # Ordered by X², the same random tables estimate another p-value (exact: 0.0300, from the
        # complete enumeration of tests/reference/small_sample_generate.py).
        pearson = self.number("H3", f"=ASSOC.SIMULATE({table}; 200000; 5)")
        self.assertGreater(abs(pearson - exact), 8 * standard_error)

    def test_refuses_weighted_counts_and_check_says_why(self):
        table = self.put([[3.5, 1], [1, 3]])
        self.assertErrorExplained(f'=ASSOC.SIMULATE({table}; ; ; "exact")', f'=ASSOC.CHECK({table}; "simulate")',
                                  "ASSOC.SIMULATE cannot be used here: the simulated p-value needs whole counts")


if __name__ == "__main__":
    run_harness(__doc__)
