#!/usr/bin/python3
"""The demo behind scripts/demo.sh: opens the sample workbook in a throwaway headless office with
the built extension installed, selects its count table and runs the menu command "Analyse
Selection with Assoc" on it (Data ▸ Statistics; dispatched as org.assocproject.calc:AnalyseSelection
without its dialog), prints the key figures of the sheet the command made, read from its cells, and
writes a PDF of that sheet.

    /usr/bin/python3 scripts/demo.py --oxt build/extension/assoc.oxt \
        --workbook samples/promotions.fods --pdf build/promotions.pdf
"""

import argparse
import pathlib
import shutil
import sys
import textwrap
import time

sys.path.insert(0, str(pathlib.Path(__file__).resolve().parent))
from assoc_office import ThrowawayOffice, file_url, properties  # noqa: E402
import uno  # noqa: E402  (importable once assoc_office has checked for it)

COMMAND = "org.assocproject.calc:AnalyseSelection"
# The lines of the analysis sheet the demo prints: the label in column A, how many values beside it.
KEY_FIGURES = [("Pearson X²", 1), ("Degrees of freedom", 1), ("p-value", 1), ("Exact p-value", 1),
               ("Decision", 1), ("Cramér's V", 1), ("Cramér's V, 95% interval", 2), ("In words", 1),
               ("Verdict (ASSOC.CHECK)", 1), ("Cells that stand out", 1), ("Pairs that differ at 5%", 1)]


def named_block(doc, name):
    return doc.NamedRanges.getByName(name).getReferredCells()


def print_table(block):
    rows = [[block.getCellByPosition(c, r).getString() for c in range(block.Columns.Count)]
            for r in range(block.Rows.Count)]
    widths = [max(len(row[c]) for row in rows) for c in range(len(rows[0]))]
    for row in rows:
        print("  " + "  ".join(text.ljust(width) if c == 0 else text.rjust(width)
                               for c, (text, width) in enumerate(zip(row, widths))))


def print_line(label, text, width=26):
    lines = textwrap.wrap(text, 100 - width) or [""]
    print(f"  {label.ljust(width)}  {lines[0]}")
    for more in lines[1:]:
        print(f"  {'':{width}}  {more}")


def shown(cell):
    return f"(error {cell.getError()})" if cell.getError() else cell.getString()


def print_key_figures(sheet):
    end = sheet.createCursor()
    end.gotoEndOfUsedArea(False)
    last = end.RangeAddress.EndRow
    labels = [row[0] for row in sheet.getCellRangeByPosition(0, 0, 0, last).getDataArray()]
    for label, count in KEY_FIGURES:
        if label not in labels:
            continue
        row = labels.index(label)
        print_line(label, "  to  ".join(shown(sheet.getCellByPosition(1 + i, row)) for i in range(count)))
    for row, text in enumerate(labels):
        if isinstance(text, str) and text.endswith("Conclusion") and text[:1].isdigit():
            print_line("Conclusion", shown(sheet.getCellByPosition(1, row + 1)))
        if isinstance(text, str) and text.endswith("Before you act on this"):
            for caution in labels[row + 1:row + 4]:
                print_line("Caution" if caution == labels[row + 1] else "", caution)


def main():
    parser = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--oxt", required=True)
    parser.add_argument("--workbook", required=True)
    parser.add_argument("--pdf", required=True)
    options = parser.parse_args()
    pdf = pathlib.Path(options.pdf).resolve()
    pdf.parent.mkdir(parents=True, exist_ok=True)

    with ThrowawayOffice(options.oxt, log=lambda message: print(f"[office] {message}")) as office:
        # A copy: the office locks the file it opens, and the demo changes the workbook.
        workbook = office.scratch_path(pathlib.Path(options.workbook).name)
        shutil.copy(options.workbook, workbook)
        doc = office.load(workbook)
        try:
            doc.lockControllers()
            doc.calculateAll()
            sheet = doc.Sheets.getByIndex(0)
            print()
            print(sheet.getCellRangeByName("A1").getString())
            print()
            table = named_block(doc, "CountTable")
            print_table(table)
            print()
            controller = doc.getCurrentController()
            controller.select(table)
            dispatcher = office.service("com.sun.star.frame.DispatchHelper")
            started = time.monotonic()
            result = dispatcher.executeDispatch(controller.getFrame(), COMMAND, "", 0, properties(NoDialog=True))
            seconds = time.monotonic() - started
            if result.State != 1:
                raise SystemExit(f"The command failed: {result.Result}")
            print(f"Data ▸ Statistics ▸ Analyse Selection with Assoc, on {table.AbsoluteName.replace('$', '')}, "
                  f"made the sheet \"{result.Result}\" in {seconds:.2f} s.")
            print("Its key figures, read from the cells (every one a live ASSOC formula on the table):")
            analysis = doc.Sheets.getByName(result.Result)
            doc.calculateAll()
            print_key_figures(analysis)
            print()
            filter_data = uno.Any("[]com.sun.star.beans.PropertyValue", properties(Selection=analysis))
            doc.storeToURL(file_url(pdf), properties(FilterName="calc_pdf_Export", FilterData=filter_data))
            print(f"PDF of the sheet the command made: {pdf}")
        finally:
            doc.close(True)


if __name__ == "__main__":
    main()
