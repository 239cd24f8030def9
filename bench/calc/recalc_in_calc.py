"""The in-Calc bench of recalculation and loading: prints figures and ratios (a bench, not a test).

    /usr/bin/python3 bench/calc/recalc_in_calc.py --build BUILD_DIR [--rounds K] [--cells N]
    (bench/calc/run.sh BUILD_DIR builds what it needs first and runs this)

Calc recalculates add-in cells whenever a document loads and on every hard recalculation, so a sheet
pays again and again for what its formulas compute. Four measurements, each side by side with its
yardstick in the same run, in headless offices with assoc.oxt and the bench-only transfer-floor add-in
(bench/calc/floor/) installed into throwaway profiles (automatic calculation off; every timed step is
document.calculateAll(), a hard recalculation of every formula, or a load):

  1. First failure. Every table of bench/exact_suite.txt and of out_of_reach.txt gets =ASSOC.EXACT(table)
     alone on a sheet of a fresh office (nothing remembered yet); the time of that first calculation is
     reported with the outcome. The tables refused (Err:502) are the out-of-reach tables; their first
     failure is compared with the 5-second cap that an exact test used to spend in full before failing.
  2. Hard recalculation of a workbook with failing exact cells: six out-of-reach tables (named in
     WORKBOOK_NAMES), each used by
     ASSOC.EXACT, ASSOC.PVALUE(…;"exact") and ASSOC.CHECK(…;"exact") (18 formulas), built in a second fresh
     office: the first calculateAll (cold: nothing remembered) and the following ones (warm: unchanged).
  3. Loading that workbook saved as .ods (Calc recalculates add-in cells on load): in the same office
     (its answers remembered) and in a third, fresh office (cold), each timed to the moment all 18 cells
     hold their values.
  4. 10,000 cells, each =ASSOC.PVALUE over its own 3×4 table of counts, against the same 10,000 ranges
     given to TRANSFERFLOOR.READTABLE (a trivial add-in function of the same shape — a range, an omitted
     optional argument, an `any` result — that only reads every element: what Calc charges to call any
     add-in function of that shape on a 3×4 range) and against the host's own route to the same p-value,
     =CHITEST(table; expected counts built by MMULT from the margins). Kinds take turns within each
     round; the median of --rounds rounds is reported, with the office's CPU time beside the wall time.

Goals (PASS/MISS lines at the end): a refused table fails within 1 s; warm hard recalculation ≤ 0.5 s;
loading ≤ 3 s; ASSOC.PVALUE ≤ 1.2 × the trivial add-in. Timings on a shared machine are noisy: the
ratios, measured side by side, are the figures to compare; the load average is printed with them.
"""

import argparse
import os
import pathlib
import random
import re
import shutil
import signal
import statistics
import sys
import tempfile
import time

HERE = pathlib.Path(__file__).resolve().parent
ROOT = HERE.parents[1]
sys.path.insert(0, str(ROOT / "scripts"))
sys.path.insert(0, str(HERE))

import assoc_office  # noqa: E402  (the throwaway office of the Calc tests)
from counts_in_calc import CLOCK_TICKS, BenchOffice, column_name, median  # noqa: E402

# The worksheet exact test's time limit, as extension/src/worksheet_limits.hpp sets it.
CAP_SECONDS = float(re.search(r"worksheet_exact_limits\{([0-9.]+),",
                              (ROOT / "extension" / "src" / "worksheet_limits.hpp").read_text()).group(1))
FAIL_GOAL = 1.0        # a refused table fails within this many seconds
WARM_GOAL = 0.5        # warm hard recalculation of the failing workbook
LOAD_GOAL = 3.0        # loading the failing workbook
PVALUE_GOAL = 1.2      # ASSOC.PVALUE cells / trivial add-in cells
# The workbook's six tables: tables that the exact test cannot finish within its 5-second, 400 MB
# limits however fast the machine (without the early refusal each stops at the memory limit): three of
# the suite's and three of out_of_reach.txt. Named rather than taken from step 1, whose refusals of
# tables that need only a little more than 5 s depend on the machine and its load.
WORKBOOK_NAMES = ["6x6_n80", "2x15_n400", "5x5_n120", "6x6_n80_r1", "2x15_n400_r2", "5x5_n120_r0"]
WORKBOOK_TABLES = len(WORKBOOK_NAMES)
TABLE_STRIDE = 10      # rows between the tables of a sheet (the suite's tables have at most 8 rows)


def read_suite(path):
    tables = []
    for line in pathlib.Path(path).read_text().splitlines():
        if not line.strip() or line.startswith("#"):
            continue
        name, rows, columns, *counts = line.split()
        rows, columns = int(rows), int(columns)
        values = [float(v) for v in counts]
        tables.append((name, [values[r * columns:(r + 1) * columns] for r in range(rows)]))
    return tables


def load_average():
    return os.getloadavg()[0]


class Workbook:
    """Tables written one below the other on a sheet, and formulas beside them."""

    def __init__(self, document, tables):
        self.document = document
        self.sheet = document.Sheets.getByIndex(0)
        self.ranges = []
        for index, (_, counts) in enumerate(tables):
            top = 1 + index * TABLE_STRIDE
            address = f"A{top}:{column_name(len(counts[0]) - 1)}{top + len(counts) - 1}"
            self.sheet.getCellRangeByName(address).setDataArray(tuple(tuple(row) for row in counts))
            self.ranges.append((top, address))

    def formula_cell(self, index, column):
        top, _ = self.ranges[index]
        return self.sheet.getCellRangeByName(f"{column}{top}")


def cell_outcome(cell):
    """The value of a formula cell, "Err:NNN", or its text."""
    error = cell.getError()
    if error:
        return f"Err:{error}"
    text = cell.getString()
    return cell.getValue() if text and text[0] in "0123456789.-" else text


def office_cpu_seconds(office):
    """Processor time of the office's processes in nanoseconds' resolution: the run time of every
    living thread from /proc/PID/task/TID/schedstat (CPU time in /proc's stat comes in 10 ms ticks,
    too coarse for calls of a few milliseconds), plus, in ticks, that of the threads that have ended
    (the process's utime + stime, which keeps theirs, less its living threads'): without them a
    thread ending during a timed call made its time negative."""
    total = 0.0
    for pid, fields in office.processes():
        living_ticks = 0
        try:
            for task in os.listdir(f"/proc/{pid}/task"):
                with open(f"/proc/{pid}/task/{task}/schedstat") as schedstat:
                    total += int(schedstat.read().split()[0]) / 1e9
                with open(f"/proc/{pid}/task/{task}/stat") as stat:
                    task_fields = stat.read().rsplit(")", 1)[1].split()
                living_ticks += int(task_fields[11]) + int(task_fields[12])
        except OSError:
            continue  # a process or thread that ended meanwhile
        total += max(0, int(fields[11]) + int(fields[12]) - living_ticks) / CLOCK_TICKS
    return total


def time_call(office, action):
    cpu = office_cpu_seconds(office)
    started = time.perf_counter()
    action()
    return time.perf_counter() - started, office_cpu_seconds(office) - cpu


def first_failures(office, suite, say):
    """Step 1: each suite table computed once, alone, in an office that remembers nothing of it."""
    document = office.new_spreadsheet()
    document.lockControllers()
    document.enableAutomaticCalculation(False)
    book = Workbook(document, suite)
    results = []
    for index, (name, counts) in enumerate(suite):
        cell = book.formula_cell(index, "W")
        cell.setFormula(f"=ASSOC.EXACT({book.ranges[index][1]})")
        wall, cpu = time_call(office, document.calculateAll)
        outcome = cell_outcome(cell)
        results.append({"name": name, "wall": wall, "cpu": cpu, "refused": str(outcome).startswith("Err:"),
                        "outcome": outcome, "load": load_average()})
        say(f"  {name:<11} {wall:7.3f} s  {outcome}")
        cell.setFormula("")
    document.close(True)
    return results


def build_failing_workbook(document, tables):
    document.lockControllers()
    document.enableAutomaticCalculation(False)
    book = Workbook(document, tables)
    for index in range(len(tables)):
        reference = book.ranges[index][1]
        book.formula_cell(index, "W").setFormula(f"=ASSOC.EXACT({reference})")
        book.formula_cell(index, "X").setFormula(f'=ASSOC.PVALUE({reference};"exact")')
        book.formula_cell(index, "Y").setFormula(f'=ASSOC.CHECK({reference};"exact")')
    return book


def workbook_outcomes(document, count):
    sheet = document.Sheets.getByIndex(0)
    return [[cell_outcome(sheet.getCellRangeByName(f"{column}{1 + i * TABLE_STRIDE}")) for column in "WXY"]
            for i in range(count)]


def failing_workbook(office, tables, rounds, folder, say):
    """Steps 2 and 3 (warm load): cold and warm hard recalculations, saving, loading in the same office."""
    document = office.new_spreadsheet()
    build_failing_workbook(document, tables)
    cold = time_call(office, document.calculateAll)
    cold_outcomes = workbook_outcomes(document, len(tables))
    say(f"  cold hard recalculation {cold[0]:.3f} s")
    warm = [time_call(office, document.calculateAll) for _ in range(rounds)]
    warm_outcomes = workbook_outcomes(document, len(tables))
    say(f"  warm hard recalculations {', '.join(f'{w:.3f}' for w, _ in warm)} s")
    path = folder / "failing_exact_cells.ods"
    # Saved as a user's workbook is, with automatic calculation on: Calc then recalculates the add-in
    # cells when the file loads (a file saved with it off would show its stored values unchecked).
    document.enableAutomaticCalculation(True)
    document.storeToURL(assoc_office.file_url(path), assoc_office.properties(FilterName="calc8"))
    document.close(True)
    loads = []
    for _ in range(rounds):
        timing, outcomes = timed_load(office, path)
        loads.append(timing)
    say(f"  loads in the same office {', '.join(f'{w:.3f}' for w, _ in loads)} s")
    return {"cold": cold, "warm": warm, "loads": loads, "outcomes": cold_outcomes,
            "warm_outcomes": warm_outcomes, "loaded_outcomes": outcomes, "path": path}


def timed_load(office, path):
    """Loads the .ods and reads every formula cell (so that any calculation left pending is done)."""
    holder = {}

    def load():
        document = office.load(path)
        holder["document"] = document
        holder["outcomes"] = workbook_outcomes(document, WORKBOOK_TABLES)

    timing = time_call(office, load)
    holder["document"].close(True)
    return timing, holder["outcomes"]


class PValueCells:
    """Step 4: 10,000 formulas, each over its own 3×4 table, of three kinds."""

    KINDS = {
        "floor": "=TRANSFERFLOOR.READTABLE(A{a}:D{b})",
        "PVALUE": "=ASSOC.PVALUE(A{a}:D{b})",
        "CHITEST": ("=CHITEST(A{a}:D{b};MMULT(MMULT(A{a}:D{b};TRANSPOSE(COLUMN(A{a}:D{a})^0));"
                    "MMULT(TRANSPOSE(ROW(A{a}:A{b})^0);A{a}:D{b}))/SUM(A{a}:D{b}))"),
    }

    def __init__(self, office, cells, seed=20240611):
        self.office, self.cells = office, cells
        self.document = office.new_spreadsheet()
        self.document.lockControllers()
        self.document.enableAutomaticCalculation(False)
        self.sheet = self.document.Sheets.getByIndex(0)
        generator = random.Random(seed)
        # Invented counts of a 3×4 breakdown, 1 to 40 per cell (no zero rows or columns).
        data = tuple(tuple(float(generator.randint(1, 40)) for _ in range(4)) for _ in range(3 * cells))
        self.sheet.getCellRangeByName(f"A1:D{3 * cells}").setDataArray(data)
        self.column = self.sheet.getCellRangeByName(f"F1:F{3 * cells}")

    def set(self, kind):
        formula = self.KINDS[kind]
        self.column.setFormulaArray(tuple((formula.format(a=3 * i + 1, b=3 * i + 3) if r == 0 else "",)
                                          for i in range(self.cells) for r in range(3)))

    def values(self, count=50):
        return [self.sheet.getCellRangeByName(f"F{3 * i + 1}").getValue() for i in range(count)]

    def clear(self):
        self.column.clearContents(23)  # values, dates, texts, formulas

    def measure(self, rounds, say):
        timings = {kind: [] for kind in self.KINDS}
        checks = {}
        for round_number in range(rounds + 1):  # round 0: the untimed warm-up, and the values checked
            for kind in self.KINDS:
                self.set(kind)
                timing = time_call(self.office, self.document.calculateAll)
                if round_number == 0:
                    checks[kind] = self.values()
                else:
                    timings[kind].append(timing)
                self.clear()
            if round_number:
                say(f"  round {round_number}: " + ", ".join(f"{k} {timings[k][-1][0]:.3f} s" for k in self.KINDS) +
                    f" (load {load_average():.1f})")
        empty = [time_call(self.office, self.document.calculateAll)[0] for _ in range(3)]
        self.document.close(True)
        return timings, checks, median(empty)


def main():
    parser = argparse.ArgumentParser(description=__doc__.split("\n", 1)[0])
    parser.add_argument("--build", default=str(ROOT / "build"), help="the CMake build folder")
    parser.add_argument("--rounds", type=int, default=7, help="timed rounds (median reported)")
    parser.add_argument("--cells", type=int, default=10_000, help="ASSOC.PVALUE cells in step 4")
    parser.add_argument("--suite", default=str(ROOT / "bench" / "exact_suite.txt"))
    parser.add_argument("--extra", default=str(HERE / "out_of_reach.txt"),
                        help="more tables for steps 1 to 3, in the suite's format")
    parser.add_argument("--cells-only", action="store_true", help="only step 4 (the ASSOC.PVALUE cells)")
    arguments = parser.parse_args()
    build = pathlib.Path(arguments.build).resolve()
    packages = [build / "extension" / "assoc.oxt", build / "bench" / "calc" / "transfer_floor.oxt"]
    suite = read_suite(arguments.suite) + read_suite(arguments.extra)

    def say(message):
        print(message, flush=True)

    signal.signal(signal.SIGHUP, assoc_office._interrupt)
    started = time.perf_counter()
    if arguments.cells_only:
        say(f"load average at the start: {load_average():.1f} (2 cores)")
        with BenchOffice(packages, say) as office:
            timings, checks, empty = PValueCells(office, arguments.cells).measure(arguments.rounds, say)
        print()
        return 0 if report_cells(timings, empty, arguments) else 1
    failures = []
    folder = pathlib.Path(tempfile.mkdtemp(prefix="assoc-recalc-bench-"))
    try:
        say(f"load average at the start: {load_average():.1f} (2 cores)")
        say("1. First failure: each table computed once by ASSOC.EXACT in a fresh office")
        with BenchOffice(packages, say) as office:
            first = first_failures(office, suite, say)
        chosen = [t for t in suite if t[0] in WORKBOOK_NAMES]
        not_refused = [r["name"] for r in first if r["name"] in WORKBOOK_NAMES and not r["refused"]]
        if len(chosen) != WORKBOOK_TABLES or not_refused:
            failures.append(f"the workbook's tables {WORKBOOK_NAMES} are not all in the suite and refused "
                            f"(computed: {not_refused})")
        say(f"2.–3. The workbook of failing exact cells ({', '.join(t[0] for t in chosen)}), in a second fresh office")
        with BenchOffice(packages, say) as office:
            book = failing_workbook(office, chosen, arguments.rounds, folder, say)
            say(f"4. {arguments.cells:,} cells over their own 3×4 tables, same office")
            cells = PValueCells(office, arguments.cells)
            timings, checks, empty = cells.measure(arguments.rounds, say)
        say("3. Loading the saved workbook in a third, fresh office")
        with BenchOffice(packages, say) as office:
            cold_load, cold_load_outcomes = timed_load(office, book["path"])
            say(f"  cold load {cold_load[0]:.3f} s")
        book["cold_load"] = cold_load
        # Checks: every step shows the same outcomes; the floor read 12 elements; the p-values agree.
        # In a fresh office a table may be refused for its time (the forecast) where the first office
        # met the memory limit first, or the other way round: CHECK then names the other limit, which
        # is no difference of outcome.
        def outcomes(rows):
            return [[re.sub(r"needs more (time|memory) than allowed", "needs more than allowed", str(v)) for v in row]
                    for row in rows]
        if outcomes(book["warm_outcomes"]) != outcomes(book["outcomes"]) or \
                outcomes(book["loaded_outcomes"]) != outcomes(book["outcomes"]) or \
                outcomes(cold_load_outcomes) != outcomes(book["outcomes"]):
            failures.append("the workbook's cells differ between calculations: "
                            f"{book['outcomes']} / {book['warm_outcomes']} / {book['loaded_outcomes']} / "
                            f"{cold_load_outcomes}")
        for row in book["outcomes"]:
            if not (str(row[0]).startswith("Err:") and str(row[1]).startswith("Err:") and "cannot be used" in str(row[2])):
                failures.append(f"a workbook table was not refused by all three formulas: {row}")
        if any(v != 12 for v in checks["floor"]):
            failures.append(f"the floor read {checks['floor'][:5]}…, not 12 elements per range")
        if any(abs(p - c) > 1e-9 * max(c, 1e-300) for p, c in zip(checks["PVALUE"], checks["CHITEST"])):
            failures.append("ASSOC.PVALUE and CHITEST disagree: "
                            f"{checks['PVALUE'][:3]} / {checks['CHITEST'][:3]}")
    finally:
        shutil.rmtree(folder, ignore_errors=True)
    report(first, book, timings, empty, arguments, failures, time.perf_counter() - started)
    return 1 if failures else 0


def verdict(ok):
    return "PASS" if ok else "MISS"


def report_cells(timings, empty, arguments):
    """Step 4's table and verdict; True when the goal is met."""
    wall = {k: median([t[0] for t in v]) for k, v in timings.items()}
    cpu = {k: median([t[1] for t in v]) for k, v in timings.items()}
    print(f"4. {arguments.cells:,} cells, each over its own 3×4 table (median of {arguments.rounds} rounds; "
          f"calculateAll with no formulas {empty * 1000:.1f} ms):")
    print(f"   {'':<34} {'seconds':>16} {'/ trivial add-in':>17} {'/ PVALUE':>9}")
    labels = {"floor": "trivial add-in (TRANSFERFLOOR.READTABLE)", "PVALUE": "ASSOC.PVALUE",
              "CHITEST": "CHITEST with MMULT expected counts"}
    for kind in ("floor", "PVALUE", "CHITEST"):
        print(f"   {labels[kind]:<34} {wall[kind]:>9.3f} ({cpu[kind]:.3f}) {wall[kind] / wall['floor']:>16.2f}× "
              f"{wall[kind] / wall['PVALUE']:>8.2f}×")
    spread = ", ".join(f"{k} {min(t[0] for t in v):.3f}–{max(t[0] for t in v):.3f}" for k, v in timings.items())
    print(f"   (spread of the rounds: {spread})")
    pvalue_ratio = wall["PVALUE"] / wall["floor"]
    cpu_ratio = cpu["PVALUE"] / cpu["floor"] if cpu["floor"] else float("nan")
    print(f"{verdict(pvalue_ratio <= PVALUE_GOAL)}: ASSOC.PVALUE ≤ {PVALUE_GOAL}× the trivial add-in "
          f"({pvalue_ratio:.2f}× by wall time, {cpu_ratio:.2f}× by the office's processor time, which other "
          "programs on the machine disturb less)")
    return pvalue_ratio <= PVALUE_GOAL


def report(first, book, timings, empty, arguments, failures, seconds):
    print()
    print(f"Recalculation and loading in Calc (load average now {load_average():.1f} on 2 cores; "
          "wall seconds, office CPU seconds in brackets)")
    print()
    print("1. First failure of the out-of-reach tables (ASSOC.EXACT alone, nothing remembered):")
    print(f"   {'table':<11} {'first failure s':>16} {'/ 5 s cap':>10}   load")
    refused = [r for r in first if r["refused"]]
    for r in refused:
        print(f"   {r['name']:<11} {r['wall']:>9.3f} ({r['cpu']:.2f}) {r['wall'] / CAP_SECONDS:>9.2f}×   {r['load']:.1f}")
    finished = [r for r in first if not r["refused"]]
    if finished:
        slowest = max(finished, key=lambda r: r["wall"])
        print(f"   ({len(finished)} tables finished; the slowest, {slowest['name']}, in {slowest['wall']:.3f} s)")
    worst_failure = max((r["wall"] for r in refused), default=float("nan"))
    print()
    cold_wall, cold_cpu = book["cold"]
    warm_wall = median([w for w, _ in book["warm"]])
    warm_cpu = median([c for _, c in book["warm"]])
    load_wall = median([w for w, _ in book["loads"]])
    load_cpu = median([c for _, c in book["loads"]])
    cold_load_wall, cold_load_cpu = book["cold_load"]
    print(f"2.–3. Workbook of {WORKBOOK_TABLES} out-of-reach tables × (EXACT, PVALUE \"exact\", CHECK \"exact\"):")
    print(f"   {'':<36} {'seconds':>16} {'ratio':>18}")
    print(f"   {'hard recalculation, cold':<36} {cold_wall:>9.3f} ({cold_cpu:.2f})")
    print(f"   {'hard recalculation, warm (median)':<36} {warm_wall:>9.3f} ({warm_cpu:.2f}) "
          f"{warm_wall / cold_wall:>9.3f}× cold")
    print(f"   {'load, same office (median)':<36} {load_wall:>9.3f} ({load_cpu:.2f}) "
          f"{load_wall / cold_wall:>9.3f}× cold recalc")
    print(f"   {'load, fresh office':<36} {cold_load_wall:>9.3f} ({cold_load_cpu:.2f}) "
          f"{cold_load_wall / cold_wall:>9.3f}× cold recalc")
    print()
    report_cells(timings, empty, arguments)
    print()
    if failures:
        print("CHECKS FAILED:")
        for failure in failures:
            print(f"  {failure}")
    print(f"{verdict(worst_failure <= FAIL_GOAL)}: a refused table fails within {FAIL_GOAL:g} s "
          f"(slowest first failure {worst_failure:.3f} s)")
    print(f"{verdict(warm_wall <= WARM_GOAL)}: warm hard recalculation ≤ {WARM_GOAL:g} s ({warm_wall:.3f} s)")
    print(f"{verdict(load_wall <= LOAD_GOAL)}: load ≤ {LOAD_GOAL:g} s in the same office ({load_wall:.3f} s)")
    print(f"{verdict(cold_load_wall <= LOAD_GOAL)}: load ≤ {LOAD_GOAL:g} s in a fresh office ({cold_load_wall:.3f} s)")
    print(f"(bench took {seconds:.0f} s)")


if __name__ == "__main__":
    sys.exit(main())
