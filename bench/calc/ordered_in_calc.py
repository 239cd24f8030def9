"""The new functions of issue 13 in headless Calc, against their goal of 50 ms a call (a bench, not a test).

    /usr/bin/python3 bench/calc/ordered_in_calc.py --build BUILD_DIR [--rounds K]
    (bench/calc/run.sh builds assoc.oxt and the transfer floor first; scripts/bench.sh runs this)

Inputs (invented, seeded): a labelled 20×20 table with 1,000,000 counts in all (ASSOC.ORDINAL,
ASSOC.STRENGTH "gamma"); 5 and 20 strata of 20×20 in the long layout with 1,000,000 counts in all
(ASSOC.WITHIN); 10,000 people × 10 survey waves of "Yes"/"No" with a header row, and the same as 1/0
(ASSOC.REPEATED). Each formula is timed alone in the document as counts_in_calc.py times ASSOC.COUNTS:
calculateAll() with automatic calculation off, one untimed warm-up, the median of --rounds rounds
(not less the cost of calculateAll() with no formula, which is printed beside: a few ms, and noisy). Beside ASSOC.REPEATED, TRANSFERFLOOR.READONE over
the same range (the bench-only add-in of bench/calc/floor/ that only reads what it gets) shows what
Calc charges to hand a range of 100,000 cells to any add-in; the rest is Assoc's own work.
"""

import argparse
import pathlib
import random
import sys

HERE = pathlib.Path(__file__).resolve().parent
sys.path.insert(0, str(HERE))

from counts_in_calc import ROOT, BenchOffice, Timer, median  # noqa: E402

GOAL_SECONDS = 0.050


def ordered_counts(rows, columns, total, rng):
    weights = [[rng.uniform(0.5, 1.5) * (1 + 0.02 * r * c) for c in range(columns)] for r in range(rows)]
    scale = total / sum(map(sum, weights))
    return [[float(int(w * scale)) for w in row] for row in weights]


def main():
    parser = argparse.ArgumentParser(description=__doc__.split("\n", 1)[0])
    parser.add_argument("--build", default=str(ROOT / "build"), help="the CMake build folder")
    parser.add_argument("--rounds", type=int, default=7, help="timed rounds (median reported)")
    arguments = parser.parse_args()
    build = pathlib.Path(arguments.build).resolve()
    packages = [build / "extension" / "assoc.oxt", build / "bench" / "calc" / "transfer_floor.oxt"]
    rng = random.Random(13)

    with BenchOffice(packages, lambda m: print(m, flush=True)) as office:
        document = office.new_spreadsheet()
        document.lockControllers()
        document.enableAutomaticCalculation(False)
        sheet = document.Sheets.getByIndex(0)
        timer = Timer(office, document)

        def put(cell, rows):
            block = sheet.getCellRangeByName(cell).getCellByPosition(0, 0)
            address = block.CellAddress
            width = max(len(r) for r in rows)
            target = sheet.getCellRangeByPosition(address.Column, address.Row, address.Column + width - 1,
                                                  address.Row + len(rows) - 1)
            target.setDataArray(tuple(tuple(r) for r in rows))
            a = target.RangeAddress
            return sheet.getCellRangeByPosition(a.StartColumn, a.StartRow, a.EndColumn, a.EndRow).AbsoluteName

        table = ordered_counts(20, 20, 1e6, rng)
        labelled = put("A1", [[""] + [f"Answer {c + 1}" for c in range(20)]] +
                       [[f"Band {r + 1}"] + row for r, row in enumerate(table)])
        strata = {}
        for count, corner in ((5, "A30"), (20, "A200")):
            rows = [["Office", "Band"] + [f"Answer {c + 1}" for c in range(20)]]
            for k in range(count):
                for r, row in enumerate(ordered_counts(20, 20, 1e6 / count, rng)):
                    rows.append([f"Office {k + 1}", f"Band {r + 1}"] + row)
            strata[count] = put(corner, rows)
        people = []
        for _ in range(10_000):
            leaning = rng.random()
            people.append([rng.random() < 0.3 + 0.5 * leaning - 0.01 * j for j in range(10)])
        header = [f"Wave {j + 1}" for j in range(10)]
        texts = put("Z1", [header] + [["Yes" if a else "No" for a in row] for row in people])
        numbers = put("AL1", [header] + [[1.0 if a else 0.0 for a in row] for row in people])
        cases = [
            ("ASSOC.ORDINAL, 20×20, n = 1,000,000", f"=ASSOC.ORDINAL({labelled})"),
            ("ASSOC.STRENGTH \"gamma\", 20×20", f'=ASSOC.STRENGTH({labelled}; "gamma")'),
            ("ASSOC.WITHIN, 5 strata of 20×20, n = 1,000,000", f"=ASSOC.WITHIN({strata[5]})"),
            ("ASSOC.WITHIN, 20 strata of 20×20, n = 1,000,000", f"=ASSOC.WITHIN({strata[20]})"),
            ("ASSOC.REPEATED, 10,000 × 10 texts", f"=ASSOC.REPEATED({texts})"),
            ("  transfer floor of the same range", f"=TRANSFERFLOOR.READONE({texts})"),
            ("ASSOC.REPEATED, 10,000 × 10 of 1/0", f"=ASSOC.REPEATED({numbers})"),
            ("  transfer floor of the same range", f"=TRANSFERFLOOR.READONE({numbers})"),
        ]
        formula_cell = sheet.getCellRangeByName("BA1")
        timings = {index: [] for index in range(len(cases))}
        values = {}
        for round_number in range(arguments.rounds + 1):  # round 0: untimed warm-up
            for index, (_, formula) in enumerate(cases):
                def set_up(text=formula):
                    formula_cell.setFormula(text)

                def clear():
                    formula_cell.clearContents(16)  # formulas

                def read():
                    return formula_cell.getError() or formula_cell.getValue()
                timing, value = timer.measure(set_up, clear, read if round_number == 0 else None)
                if round_number == 0:
                    values[index] = value
                else:
                    timings[index].append(timing[0])
        empty = median([timer.recalculate()[0] for _ in range(5)])

    print()
    print(f"In headless Calc: wall time of calculateAll() with one formula, median of {arguments.rounds} rounds "
          f"(calculateAll() with no formula: {empty * 1000:.1f} ms)")
    misses = 0
    for index, (label, _) in enumerate(cases):
        seconds = median(timings[index])
        floor = label.startswith("  ")
        verdict = "" if floor else ("under 50 ms" if seconds < GOAL_SECONDS else "MISS (over 50 ms)")
        misses += 0 if floor or seconds < GOAL_SECONDS else 1
        print(f"  {label:<52} {seconds * 1000:8.1f} ms  {verdict}   (result {values[index]:.6g})")
    print("All within the goal of 50 ms." if misses == 0 else f"{misses} figure(s) MISS the goal of 50 ms.")
    return 0


if __name__ == "__main__":
    sys.exit(main())
