#!/usr/bin/python3
"""The demo behind scripts/demo.sh: opens the sample workbook in a throwaway headless office with
the built extension installed, recalculates it, prints the key results as the cells show them,
and writes a PDF of the sheet.

    /usr/bin/python3 scripts/demo.py --oxt build/extension/assoc.oxt \
        --workbook samples/promotions.fods --pdf build/promotions.pdf
"""

import argparse
import pathlib
import sys
import textwrap

sys.path.insert(0, str(pathlib.Path(__file__).resolve().parent))
from assoc_office import ThrowawayOffice, file_url, properties  # noqa: E402


def named_block(doc, name):
    return doc.NamedRanges.getByName(name).getReferredCells()


def print_table(block):
    rows = [[block.getCellByPosition(c, r).getString() for c in range(block.Columns.Count)]
            for r in range(block.Rows.Count)]
    widths = [max(len(row[c]) for row in rows) for c in range(len(rows[0]))]
    for row in rows:
        print("  " + "  ".join(text.ljust(width) if c == 0 else text.rjust(width)
                               for c, (text, width) in enumerate(zip(row, widths))))


def print_report(block):
    labels = [block.getCellByPosition(0, r) for r in range(block.Rows.Count)]
    width = max(len(cell.getString()) for cell in labels)
    for r, label in enumerate(labels):
        value = block.getCellByPosition(1, r)
        if value.getError():
            shown = f"(error {value.getError()})"
        else:
            shown = value.getString()
        lines = textwrap.wrap(shown, 100 - width) or [""]
        print(f"  {label.getString().ljust(width)}  {lines[0]}")
        for more in lines[1:]:
            print(f"  {'':{width}}  {more}")


def main():
    parser = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--oxt", required=True)
    parser.add_argument("--workbook", required=True)
    parser.add_argument("--pdf", required=True)
    options = parser.parse_args()
    pdf = pathlib.Path(options.pdf).resolve()
    pdf.parent.mkdir(parents=True, exist_ok=True)

    with ThrowawayOffice(options.oxt, log=lambda message: print(f"[office] {message}")) as office:
        doc = office.load(options.workbook)
        try:
            doc.calculateAll()
            sheet = doc.Sheets.getByIndex(0)
            print()
            print(sheet.getCellRangeByName("A1").getString())
            print(sheet.getCellRangeByName("A2").getString())
            print()
            print_table(named_block(doc, "CountTable"))
            print()
            print("ASSOC.REPORT, read from the recalculated cells:")
            print_report(named_block(doc, "AssocReport"))
            print()
            doc.storeToURL(file_url(pdf), properties(FilterName="calc_pdf_Export"))
            print(f"PDF of the sheet: {pdf}")
        finally:
            doc.close(True)


if __name__ == "__main__":
    main()
