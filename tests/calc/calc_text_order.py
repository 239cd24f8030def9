#!/usr/bin/python3
"""The order of texts in real headless Calc: ASSOC.LEVELS and ASSOC.COUNTS list accented and
non-Latin labels as the Unicode Collation Algorithm does (through the office's own collator), and
follow the office's locale setting where a language orders letters its own way (Swedish).

Expected orders: tests/calc/text_order_values.json, written by tests/reference/collation_generate.pl
from Perl's Unicode::Collate 1.31, an implementation of the algorithm independent of the office's.
Run by CTest as calc.text_order_in_headless_calc (see tests/calc/CMakeLists.txt).
"""

import json
import pathlib
from collections import Counter

import uno
from calc_support import CalcTestCase, run_harness, session

SETS = json.loads((pathlib.Path(__file__).resolve().parent / "text_order_values.json").read_text())["sets"]
ROOT_SETS = [name for name, s in SETS.items() if not s["locale"]]
L10N = "/org.openoffice.Setup/L10N"


def column(values):
    return [[v] for v in values]


def settings(update):
    """The office's language settings (the node of Tools ▸ Options ▸ Language Settings ▸ Languages)."""
    provider = session.office.service("com.sun.star.configuration.ConfigurationProvider")
    path = uno.createUnoStruct("com.sun.star.beans.PropertyValue")
    path.Name, path.Value = "nodepath", L10N
    kind = "ConfigurationUpdateAccess" if update else "ConfigurationAccess"
    return provider.createInstanceWithArguments(f"com.sun.star.configuration.{kind}", (path,))


def set_locale_setting(tag):
    node = settings(update=True)
    node.replaceByName("ooSetupSystemLocale", tag)
    node.commitChanges()


class TextOrder(CalcTestCase):
    def levels(self, labels, order=""):
        self.put(column(labels))
        option = f'; "{order}"' if order else ""
        return [row[0] for row in self.array(f"C1:C{len(labels)}", f"=ASSOC.LEVELS(A1:A{len(labels)}{option})")]

    def test_lists_accented_and_non_latin_labels_in_the_unicode_collation_order(self):
        self.assertEqual(settings(update=False).getByName("ooSetupSystemLocale"), "",
                         "the test office should use the default locale setting")
        for name in ROOT_SETS:
            with self.subTest(set=name):
                labels = SETS[name]["labels"]
                self.assertEqual(self.levels(labels), SETS[name]["sorted"])
                self.sheet.getCellRangeByName("A1:C40").clearContents(0xFFFF)

    def test_keeps_the_order_of_first_appearance_when_asked(self):
        labels = SETS["non_latin"]["labels"]
        self.assertEqual(self.levels(labels, "first"), labels)

    def test_counts_records_into_rows_and_columns_in_the_order_of_the_levels(self):
        # Invented records: a department (accented and Cyrillic names) and an outcome per employee.
        departments = ["Zoll", "Éditions", "archiv", "Бухгалтерия", "Éditions", "Zoll", "édition", "archiv", "Zoll"]
        outcomes = ["Ω", "b", "Ä", "b", "Ä", "b", "Ω", "Ä", "Ä"]
        n = len(departments)
        self.put([[d, o] for d, o in zip(departments, outcomes)])
        rows = [r[0] for r in self.array("D1:D5", f"=ASSOC.LEVELS(A1:A{n})")]
        columns = [r[0] for r in self.array("E1:E3", f"=ASSOC.LEVELS(B1:B{n})")]
        self.assertEqual(rows, ["archiv", "édition", "Éditions", "Zoll", "Бухгалтерия"])
        self.assertEqual(columns, ["Ä", "b", "Ω"])
        counted = Counter(zip(departments, outcomes))
        expected = [[counted[(r, c)] for c in columns] for r in rows]
        self.assertEqual(self.array("F1:H5", f"=ASSOC.COUNTS(A1:A{n}; B1:B{n})"), expected)

    def test_follows_the_office_locale_setting(self):
        swedish = SETS["swedish"]
        self.assertEqual(swedish["locale"], "sv-SE")
        try:
            set_locale_setting("sv-SE")
            self.assertEqual(self.levels(swedish["labels"]), swedish["sorted"])
        finally:
            set_locale_setting("")
        # Back to the default order (Å and Ä with A, Ö with O) when the setting is back to default.
        session.document.calculateAll()
        got = [row[0] for row in self.sheet.getCellRangeByName(f"C1:C{len(swedish['labels'])}").getDataArray()]
        self.assertEqual(got, SETS["swedish_in_default_order"]["sorted"])


if __name__ == "__main__":
    run_harness(__doc__)
