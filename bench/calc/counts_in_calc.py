"""The in-Calc speed bench of ASSOC.COUNTS: prints figures and ratios (a bench, not a test).

    /usr/bin/python3 bench/calc/counts_in_calc.py --build BUILD_DIR [--records N] [--rounds K]
    (bench/calc/run.sh BUILD_DIR builds what it needs first and runs this)

What it compares, on the same 1,000,000 invented records (two columns of short text labels,
"Region 03" / "Channel 7", drawn at random with a fixed seed) for each level count (5×4, 10×10, 100×50):

  floor     TRANSFERFLOOR.READTWO(A1:A1000000; B1:B1000000): a bench-only add-in (bench/calc/floor/,
            installed beside Assoc, never shipped) with the same kind of parameters as ASSOC.COUNTS
            (any[][]) that reads every element it gets (type check and value) and returns their
            number. It costs what Calc charges to hand the two ranges to any add-in: building the
            Sequence<Sequence<Any>> from the cells, the call, freeing it again.
  COUNTS    ASSOC.COUNTS(A1:A1000000; B1:B1000000) as an array formula over the rows × columns block.
  COUNTIFS  the same table the way it is built without Assoc: one COUNTIFS formula per cell, with the
            levels in a header row and column (=COUNTIFS($A$1:$A$1000000;$D2;$B$1:$B$1000000;E$1)),
            at 5×4 and 10×10 (at 100×50 it is estimated from the 10×10 cost per cell, not run).
  floor 1M×2  TRANSFERFLOOR.READONE(A1:B1000000): the floor for one two-column range, for reference.

How it times: one headless office with both extensions (one throwaway profile), automatic
calculation off. For one measurement the formulas of one kind are written (the only formulas in the
document), then document.calculateAll() is timed with time.perf_counter: calculateAll recalculates
every formula cell of the document, so the clock covers the full computation and never a cached
result; then the formulas are removed again. Each kind is measured once per round and the kinds
take turns within a round, so that load from other work on the machine spreads over all of them;
after one untimed warm-up of each kind, --rounds rounds are timed (the COUNTIFS grid, seconds a
time, only in the first --countifs-rounds) and the median is reported. The
office's CPU time over the same calls (utime + stime of its processes, all threads, from /proc; in
clock ticks of 10 ms) is reported beside the wall time: it is less disturbed by other processes on
a shared machine, and shows whether Calc used more than one thread.
calculateAll of the document with no formulas is timed too (the overhead in every figure).

Checks: the floor returns 2 × records; the ASSOC.COUNTS table equals the COUNTIFS table, and adds
up to the records. The goal: COUNTS ≤ 1.2 × floor at every level count (PASS/MISS line at the end).
"""

import argparse
import os
import pathlib
import random
import signal
import statistics
import sys
import time

HERE = pathlib.Path(__file__).resolve().parent
ROOT = HERE.parents[1]
sys.path.insert(0, str(ROOT / "scripts"))

import assoc_office  # noqa: E402  (the throwaway office of the Calc tests)

GOAL = 1.2  # COUNTS / floor
SHAPES = [(5, 4), (10, 10), (100, 50)]
COUNTIFS_MAX_CELLS = 100  # larger COUNTIFS grids are estimated, not run
FILL_CHUNK = 100_000
CLOCK_TICKS = os.sysconf("SC_CLK_TCK")  # units of utime and stime in /proc/PID/stat


class BenchOffice(assoc_office.ThrowawayOffice):
    """The throwaway office of the Calc tests, with several extensions installed into its profile."""

    def __init__(self, packages, log):
        super().__init__(packages[0], log)
        self.packages = [pathlib.Path(p).resolve() for p in packages]
        for package in self.packages:
            if not package.is_file():
                raise RuntimeError(f"{package} does not exist; build it first (bench/calc/run.sh builds it)")

    def _install_extension(self):
        for package in self.packages:
            self.oxt = package
            super()._install_extension()

    def processes(self):
        """(pid, fields of /proc/PID/stat after the name) of every process in the office's process group."""
        for entry in os.listdir("/proc"):
            if not entry.isdigit():
                continue
            try:
                with open(f"/proc/{entry}/stat") as stat:
                    fields = stat.read().rsplit(")", 1)[1].split()
            except OSError:
                continue  # a process that ended meanwhile
            if int(fields[2]) == self.process.pid:  # its process group
                yield entry, fields

    def cpu_seconds(self):
        """CPU time of the office's processes (utime + stime, which include threads that have ended)."""
        return sum(int(fields[11]) + int(fields[12]) for _, fields in self.processes()) / CLOCK_TICKS


def column_name(index):
    name = ""
    index += 1
    while index:
        index, rest = divmod(index - 1, 26)
        name = chr(ord("A") + rest) + name
    return name


class Shape:
    """One sheet of records with `rows` × `columns` levels, and the formulas measured on it."""

    def __init__(self, document, rows, columns, records, seed):
        self.rows, self.columns, self.records = rows, columns, records
        self.label = f"{rows}x{columns}"
        sheets = document.Sheets
        sheets.insertNewByName(f"Records {self.label}", sheets.Count)
        self.sheet = sheets.getByName(f"Records {self.label}")
        generator = random.Random(seed)
        row_names = [f"Region {i + 1:0{len(str(rows))}d}" for i in range(rows)]
        column_names = [f"Channel {i + 1:0{len(str(columns))}d}" for i in range(columns)]
        # Every pair once (so that every level is there), the rest at random; then shuffled.
        pairs = [(r, c) for r in range(rows) for c in range(columns)]
        pairs += [(generator.randrange(rows), generator.randrange(columns)) for _ in range(records - len(pairs))]
        generator.shuffle(pairs)
        self.data = tuple((row_names[r], column_names[c]) for r, c in pairs)
        for start in range(0, records, FILL_CHUNK):
            part = self.data[start:start + FILL_CHUNK]
            self.sheet.getCellRangeByName(f"A{start + 1}:B{start + len(part)}").setDataArray(part)
        # Sorted as ASSOC.COUNTS lists them (same case and width throughout, so plain sorting agrees).
        self.row_levels, self.column_levels = sorted(row_names), sorted(column_names)
        self.first = f"$A$1:$A${records}"
        self.second = f"$B$1:$B${records}"
        # Output blocks from column D on: header column D, header row 1, table from E2.
        self.table = f"E2:{column_name(4 + columns - 1)}{rows + 1}"
        self.floor_cell = "D1"

    def expected_table(self):
        counts = {}
        for pair in self.data:
            counts[pair] = counts.get(pair, 0) + 1
        return [[counts.get((r, c), 0) for c in self.column_levels] for r in self.row_levels]

    # Each kind: write its formulas, and later remove them again.
    def set_floor(self):
        self.sheet.getCellRangeByName(self.floor_cell).setFormula(
            f"=TRANSFERFLOOR.READTWO({self.first};{self.second})")

    def set_floor_one_range(self):
        self.sheet.getCellRangeByName(self.floor_cell).setFormula(
            f"=TRANSFERFLOOR.READONE($A$1:$B${self.records})")

    def clear_floor(self):
        self.sheet.getCellRangeByName(self.floor_cell).setFormula("")

    def floor_value(self):
        cell = self.sheet.getCellRangeByName(self.floor_cell)
        return cell.getValue() if cell.getError() == 0 else f"error {cell.getError()}"

    def set_counts(self):
        self.sheet.getCellRangeByName(self.table).setArrayFormula(f"=ASSOC.COUNTS({self.first};{self.second})")

    def clear_counts(self):
        self.sheet.getCellRangeByName(self.table).setArrayFormula("")

    def set_countifs(self):
        self.sheet.getCellRangeByName(f"D2:D{self.rows + 1}").setDataArray(tuple((v,) for v in self.row_levels))
        self.sheet.getCellRangeByName(f"E1:{column_name(4 + self.columns - 1)}1").setDataArray(
            (tuple(self.column_levels),))
        formulas = tuple(tuple(f"=COUNTIFS({self.first};$D{r + 2};{self.second};{column_name(4 + c)}$1)"
                               for c in range(self.columns)) for r in range(self.rows))
        self.sheet.getCellRangeByName(self.table).setFormulaArray(formulas)

    def clear_countifs(self):
        self.sheet.getCellRangeByName(f"D1:{column_name(4 + self.columns - 1)}{self.rows + 1}").clearContents(
            1 | 2 | 4 | 16)  # values, dates, texts, formulas

    def table_values(self):
        block = self.sheet.getCellRangeByName(self.table)
        errors = [block.getCellByPosition(c, r).getError() for r in range(self.rows) for c in range(self.columns)]
        if any(errors):
            return f"errors {sorted(set(e for e in errors if e))}"
        return [[int(v) for v in row] for row in block.getDataArray()]


class Timer:
    def __init__(self, office, document):
        self.office, self.document = office, document

    def recalculate(self):
        """Wall and office CPU seconds of one calculateAll()."""
        cpu = self.office.cpu_seconds()
        started = time.perf_counter()
        self.document.calculateAll()
        wall = time.perf_counter() - started
        return wall, self.office.cpu_seconds() - cpu

    def measure(self, set_up, clear, read=None):
        set_up()
        try:
            result = self.recalculate()
            value = read() if read else None
        finally:
            clear()
        return result, value


def median(values):
    return statistics.median(values) if values else float("nan")


def main():
    parser = argparse.ArgumentParser(description=__doc__.split("\n", 1)[0])
    parser.add_argument("--build", default=str(ROOT / "build"), help="the CMake build folder")
    parser.add_argument("--records", type=int, default=1_000_000)
    parser.add_argument("--rounds", type=int, default=7, help="timed rounds (median reported)")
    parser.add_argument("--countifs-rounds", type=int, default=2,
                        help="timed rounds of the COUNTIFS grid (seconds each; its ratio needs no more)")
    arguments = parser.parse_args()
    build = pathlib.Path(arguments.build).resolve()
    packages = [build / "extension" / "assoc.oxt", build / "bench" / "calc" / "transfer_floor.oxt"]
    records, rounds = arguments.records, arguments.rounds

    def say(message):
        print(message, flush=True)

    signal.signal(signal.SIGHUP, assoc_office._interrupt)  # clean up when the terminal goes away, too
    bench_started = time.perf_counter()
    with BenchOffice(packages, say) as office:
        descriptions = office.service("com.sun.star.sheet.FunctionDescriptions")
        for name in ("ASSOC.COUNTS", "TRANSFERFLOOR.READTWO", "TRANSFERFLOOR.READONE"):
            if not descriptions.hasByName(name):
                raise RuntimeError(f"{name} is not registered in the office; is its .oxt broken?")
        document = office.new_spreadsheet()
        document.enableAutomaticCalculation(False)  # formulas are calculated only when timed
        timer = Timer(office, document)
        results = {}
        failures = []
        for index, (rows, columns) in enumerate(SHAPES):
            started = time.perf_counter()
            shape = Shape(document, rows, columns, records, seed=20240601 + index)
            say(f"{shape.label}: {records:,} records written in {time.perf_counter() - started:.1f} s")
            run_countifs = rows * columns <= COUNTIFS_MAX_CELLS
            kinds = {
                "floor": (shape.set_floor, shape.clear_floor, shape.floor_value),
                "counts": (shape.set_counts, shape.clear_counts, shape.table_values),
                "floor1": (shape.set_floor_one_range, shape.clear_floor, shape.floor_value),
            }
            if run_countifs:
                kinds["countifs"] = (shape.set_countifs, shape.clear_countifs, shape.table_values)
            timings = {kind: [] for kind in kinds}
            values = {}
            for round_number in range(rounds + 1):  # round 0 is the untimed warm-up
                for kind, (set_up, clear, read) in kinds.items():
                    if kind == "countifs" and round_number > arguments.countifs_rounds:
                        continue
                    timing, value = timer.measure(set_up, clear, read if round_number == 0 else None)
                    if round_number == 0:
                        values[kind] = value
                    else:
                        timings[kind].append(timing)
            empty = [timer.recalculate() for _ in range(3)]
            # Checks: the floor read everything, COUNTS and COUNTIFS give the expected table.
            expected = shape.expected_table()
            for kind in ("floor", "floor1"):
                if values[kind] != 2 * records:
                    failures.append(f"{shape.label}: {kind} read {values[kind]}, not {2 * records:,} elements")
            if values["counts"] != expected:
                failures.append(f"{shape.label}: ASSOC.COUNTS gave {str(values['counts'])[:200]}, not the table "
                                "of the records")
            if run_countifs and values["countifs"] != expected:
                failures.append(f"{shape.label}: the COUNTIFS grid gave {str(values['countifs'])[:200]}")
            results[shape.label] = {
                "cells": rows * columns,
                "wall": {kind: median([t[0] for t in timings[kind]]) for kind in kinds},
                "cpu": {kind: median([t[1] for t in timings[kind]]) for kind in kinds},
                "spread": {kind: (min(t[0] for t in timings[kind]), max(t[0] for t in timings[kind]))
                           for kind in kinds},
                "empty": median([e[0] for e in empty]),
            }
            say(f"{shape.label}: measured in {time.perf_counter() - started:.1f} s")
            # The sheet's records are no longer needed; fewer cells keep the office small.
            document.Sheets.removeByName(shape.sheet.Name)
    report(results, records, rounds, arguments.countifs_rounds, failures, time.perf_counter() - bench_started)
    return 1 if failures else 0


def report(results, records, rounds, countifs_rounds, failures, seconds):
    print()
    print(f"ASSOC.COUNTS in Calc: {records:,} records of two text labels; wall seconds of calculateAll(), "
          f"median of {rounds} rounds ({min(rounds, countifs_rounds)} for COUNTIFS)")
    header = f"{'levels':<8} {'floor s':>8} {'COUNTS s':>9} {'COUNTS/floor':>13} {'COUNTIFS s':>11} " \
             f"{'COUNTIFS/COUNTS':>16} {'floor 1M×2 s':>13}"
    print(header)
    print("-" * len(header))
    per_cell = None
    for label, result in results.items():
        wall = result["wall"]
        if "countifs" in wall:
            countifs, mark = wall["countifs"], ""
            per_cell = countifs / result["cells"]
        elif per_cell is not None:
            countifs, mark = per_cell * result["cells"], " (est.)"
        else:
            countifs, mark = float("nan"), ""
        print(f"{label:<8} {wall['floor']:>8.3f} {wall['counts']:>9.3f} {wall['counts'] / wall['floor']:>12.2f}× "
              f"{countifs:>11.2f} {countifs / wall['counts']:>15.1f}×{mark} {wall['floor1']:>12.3f}")
    print()
    print("Office CPU seconds over the same calls (all threads; medians):")
    for label, result in results.items():
        cpu = result["cpu"]
        countifs = f", COUNTIFS {cpu['countifs']:.3f}" if "countifs" in cpu else ""
        print(f"  {label:<8} floor {cpu['floor']:.3f}, COUNTS {cpu['counts']:.3f} "
              f"(COUNTS/floor {cpu['counts'] / cpu['floor']:.2f}×){countifs}, floor 1M×2 {cpu['floor1']:.3f}")
    print("Spread of the wall times (fastest – slowest round):")
    for label, result in results.items():
        spread = ", ".join(f"{kind} {low:.3f}–{high:.3f}" for kind, (low, high) in result["spread"].items())
        print(f"  {label:<8} {spread}; calculateAll with no formulas {result['empty'] * 1000:.1f} ms")
    print("(est.): COUNTIFS not run at this size; the 10×10 cost per formula cell times the cells.")
    print()
    ratios = {label: result["wall"]["counts"] / result["wall"]["floor"] for label, result in results.items()}
    worst = max(ratios, key=ratios.get)
    if failures:
        print("CHECKS FAILED:")
        for failure in failures:
            print(f"  {failure}")
    cpu_ratios = {label: result["cpu"]["counts"] / result["cpu"]["floor"] for label, result in results.items()}
    cpu_worst = max(cpu_ratios, key=cpu_ratios.get)
    verdict = "PASS" if ratios[worst] <= GOAL else "MISS"
    detail = (f"worst {ratios[worst]:.2f}× at {worst}" if verdict == "PASS" else
              f"worst {ratios[worst]:.2f}× at {worst}, {(ratios[worst] / GOAL - 1) * 100:.0f}% over the goal "
              f"({results[worst]['wall']['counts'] - GOAL * results[worst]['wall']['floor']:.3f} s too slow)")
    print(f"{verdict}: ASSOC.COUNTS ≤ {GOAL}× the transfer floor at every level count ({detail})")
    print(f"      (by office CPU time instead of wall time: worst {cpu_ratios[cpu_worst]:.2f}× at {cpu_worst}, "
          f"{'within' if cpu_ratios[cpu_worst] <= GOAL else 'over'} the goal)")
    print(f"(bench took {seconds:.0f} s)")


if __name__ == "__main__":
    sys.exit(main())
