#!/usr/bin/python3
"""Calc tests of ASSOC.VINTERVAL (Cramér's V with its confidence interval) through real cells of headless
Calc: the values against scipy 1.10.1, the identities with ASSOC.STRENGTH and ASSOC.REPORT, the ends at 0,
and a bad-input check that ASSOC.CHECK explains.

    /usr/bin/python3 tests/calc/calc_v_interval.py --oxt build/extension/assoc.oxt

Expected values: v_interval_values.json, written by make_v_interval_values.py (scipy ncx2 inversion); the
tables are invented.
"""

import json

from calc_more_functions import ErrorCheckMixin
from calc_support import HERE, CalcTestCase, run_harness

TABLES = json.loads((HERE / "v_interval_values.json").read_text())["tables"]
# ASSOC.REPORT's lines of the interval of V (report.hpp keeps them in a fixed order; 1-based).
REPORT_V_LOWER, REPORT_V_UPPER = 15, 16


class VInterval(CalcTestCase, ErrorCheckMixin):
    def test_matches_the_inverted_noncentral_chi_squared_of_scipy(self):
        reference = TABLES["quick_start"]
        table = self.put(reference["counts"])
        got = self.array("F1:H1", f"=ASSOC.VINTERVAL({table})")
        # v_interval_values.json: scipy association() and ncx2.sf + brentq.
        self.assertAllClose(got, [[reference["v"], *reference["interval_95"]]], 1e-9, "V with its 95% interval")

    def test_a_plain_entry_shows_the_same_v_as_strength(self):
        table = self.put(TABLES["quick_start"]["counts"])
        # Identity: both are Cramér's V of the same table.
        self.assertEqual(self.number("F1", f"=ASSOC.VINTERVAL({table})"),
                         self.number("F2", f"=ASSOC.STRENGTH({table})"))

    def test_uses_the_confidence_level_given_on_a_range_with_labels_and_a_total_row(self):
        reference = TABLES["training"]
        counts = reference["counts"]
        rows = ([["Job level / Course", "Safety", "Software", "Leadership"]] +
                [[name] + row for name, row in zip(("Operator", "Specialist", "Manager"), counts)] +
                [["Total"] + [sum(column) for column in zip(*counts)]])
        table = self.put(rows)
        got = self.array("F1:H1", f"=ASSOC.VINTERVAL({table}; 0.9)")
        self.assertAllClose(got, [[reference["v"], *reference["interval_90"]]], 1e-9, "V with its 90% interval")

    def test_gives_the_interval_of_the_report(self):
        table = self.put(TABLES["training"]["counts"])
        report = self.array("F1:G22", f"=ASSOC.REPORT({table})")
        got = self.array("I1:K1", f"=ASSOC.VINTERVAL({table})")
        # Identity: ASSOC.REPORT computes its 95% interval the same way.
        self.assertEqual(got[0][1:], [report[REPORT_V_LOWER - 1][1], report[REPORT_V_UPPER - 1][1]])

    def test_starts_at_zero_when_the_test_is_not_significant(self):
        reference = TABLES["not_significant"]
        table = self.put(reference["counts"])
        _, lower, upper = self.array("F1:H1", f"=ASSOC.VINTERVAL({table})")[0]
        self.assertEqual(lower, 0)  # X²'s p-value 0.50 is above α/2: λ = 0 is inside (identity)
        self.assertClose(upper, reference["interval_95"][1], 1e-9, "upper end (scipy)")

    def test_is_zero_to_zero_at_independence_and_check_says_why(self):
        table = self.put([["", "Yes", "No"], ["North", 10, 20], ["South", 5, 10]])
        # Identity: X² = 0, so P(X ≥ 0 | λ) = 1 for every λ, above both targets.
        self.assertEqual(self.array("F1:H1", f"=ASSOC.VINTERVAL({table})"), [[0, 0, 0]])
        text = self.words("F3", f'=ASSOC.CHECK({table}; "vinterval")')
        self.assertIn("The interval is 0 to 0 because X² is smaller than independence itself gives in 97.5% of "
                      "samples", text)

    def test_refuses_a_single_column_and_check_says_why(self):
        table = self.put([["Promoted"], [12], [7]])
        self.assertErrorExplained(f"=ASSOC.VINTERVAL({table})", f'=ASSOC.CHECK({table}; "vinterval")',
                                  "Cannot use this table: the table has only 1 column with counts; a test of "
                                  "association needs at least 2 rows and 2 columns with counts.")


if __name__ == "__main__":
    run_harness(__doc__)
