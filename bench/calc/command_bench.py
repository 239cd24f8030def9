#!/usr/bin/python3
"""How long the menu command takes to build its analysis sheet, in a throwaway headless office
(scripts/bench.sh runs it; the goal is under 0.5 s for a 10×10 table).

For each invented table the command is dispatched (org.assocproject.calc:AnalyseSelection,
NoDialog) several times; the bench prints the median of
  - dispatch: the whole dispatch as a macro sees it (executeDispatch returns when the sheet is made);
  - in the command: the command's own time, and its phases (reading the selection, the exact-test
    probe, laying out, writing the cells, formats, merges, the chart, the heat map), which the
    command prints to the office's log when ASSOC_COMMAND_TIMES is set;
  - first values: reading every value of the new sheet afterwards, which makes Calc compute any
    formula it had not computed yet (the ASSOC.* functions themselves).

    /usr/bin/python3 bench/calc/command_bench.py --oxt build/extension/assoc.oxt [--rounds 5]
"""

import argparse
import os
import pathlib
import random
import statistics
import sys
import time

ROOT = pathlib.Path(__file__).resolve().parents[2]
sys.path.insert(0, str(ROOT / "scripts"))
os.environ["ASSOC_COMMAND_TIMES"] = "1"  # read by the office started below
from assoc_office import ThrowawayOffice, properties  # noqa: E402

COMMAND = "org.assocproject.calc:AnalyseSelection"
GOAL_SECONDS = 0.5


def table(rows, columns, total, seed):
    """An invented table of whole counts adding up to about `total`, with labels."""
    rng = random.Random(seed)
    weights = [[rng.uniform(0.5, 1.5) for _ in range(columns)] for _ in range(rows)]
    scale = total / sum(map(sum, weights))
    body = [[float(max(1, round(w * scale))) for w in row] for row in weights]
    return ([["Team / Grade"] + [f"Grade {c + 1}" for c in range(columns)]] +
            [[f"Team {r + 1}"] + body[r] for r in range(rows)])


def records(count, row_levels, column_levels, seed):
    rng = random.Random(seed)
    return [["Region", "Channel"]] + [[f"Region {rng.randrange(row_levels) + 1}",
                                       f"Channel {rng.randrange(column_levels) + 1}"] for _ in range(count)]


CASES = [
    ("3×3 table, n = 90 (the exact test is quick: kept live)", lambda: table(3, 3, 90, 1)),
    ("10×10 table, n = 150", lambda: table(10, 10, 150, 2)),
    ("10×10 table, n = 2,500", lambda: table(10, 10, 2500, 3)),
    ("10×10 table, n = 100,000", lambda: table(10, 10, 100000, 4)),
    ("two record columns, 10,000 records, 10×10 levels", lambda: records(10000, 10, 10, 5)),
]


def phases(log_path, seen):
    """The phase times of the runs logged since `seen` lines."""
    lines = [line for line in log_path.read_text(errors="replace").splitlines() if line.startswith("assoc-command-times")]
    runs = []
    for line in lines[seen:]:
        runs.append({key: float(value) for key, value in (part.split("=") for part in line.split()[1:])})
    return runs, len(lines)


def main():
    parser = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--oxt", required=True)
    parser.add_argument("--rounds", type=int, default=5)
    options = parser.parse_args()
    print(f"load average before: {os.getloadavg()[0]:.1f} (2 cores; other work on the machine slows every figure)")
    with ThrowawayOffice(options.oxt) as office:
        doc = office.new_spreadsheet()
        doc.lockControllers()
        dispatcher = office.service("com.sun.star.frame.DispatchHelper")
        controller = doc.getCurrentController()
        log = office.folder / "soffice.log"
        seen = 0
        worst = 0.0
        for title, make in CASES:
            data = make()
            sheet = doc.Sheets.getByIndex(0)
            sheet.getCellRangeByPosition(0, 0, 25, 20000).clearContents(7)
            area = sheet.getCellRangeByPosition(0, 0, len(data[0]) - 1, len(data) - 1)
            area.setDataArray(tuple(tuple(row) for row in data))
            walls, values = [], []
            for _ in range(options.rounds + 1):  # the first run loads the chart and filter code: not counted
                controller.select(area)
                started = time.perf_counter()
                try:
                    result = dispatcher.executeDispatch(controller.getFrame(), COMMAND, "", 0,
                                                        properties(NoDialog=True))
                except Exception:
                    print(log.read_text(errors="replace")[-3000:])
                    raise
                wall = time.perf_counter() - started
                if result.State != 1:
                    raise SystemExit(f"{title}: the command failed: {result.Result}")
                made = doc.Sheets.getByName(result.Result)
                started = time.perf_counter()
                made.getCellRangeByPosition(0, 0, 14, 160).getDataArray()
                values.append(time.perf_counter() - started)
                walls.append(wall)
                doc.Sheets.removeByName(result.Result)
            runs, seen = phases(log, seen)
            walls, values, runs = walls[1:], values[1:], runs[1:]
            inside = statistics.median(run["total"] for run in runs)
            keys = [k for k in runs[0] if k != "total"]
            parts = ", ".join(f"{k} {1000 * statistics.median(run[k] for run in runs):.0f}" for k in keys
                              if statistics.median(run[k] for run in runs) >= 0.002)
            dispatch = statistics.median(walls)
            worst = max(worst, dispatch + statistics.median(values))
            print(f"\n{title}\n  dispatch {dispatch:.3f} s (in the command {inside:.3f} s; ms: {parts})\n"
                  f"  first values {statistics.median(values):.3f} s; sheet ready {dispatch + statistics.median(values):.3f} s")
        doc.close(True)
    print(f"\nload average after: {os.getloadavg()[0]:.1f}")
    verdict = "met" if worst < GOAL_SECONDS else "NOT met"
    print(f"Goal (a sheet for a 10×10 table in under {GOAL_SECONDS} s, dispatch plus first values): {verdict}; "
          f"slowest case {worst:.3f} s (median of {options.rounds} rounds)")


if __name__ == "__main__":
    main()
