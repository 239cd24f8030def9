#!/usr/bin/python3
"""Measures the office's resident memory around exact tests in headless Calc: before, at the peak and
after an ASSOC.EXACT that stops at its 400 MB working-memory cap, and after one that finishes. The
goal (issue 9): afterwards the office is back within 50 MB of where it was (the add-in frees the
test's work structures and gives the heap's free pages back to the system).

Usage:  /usr/bin/python3 bench/calc/exact_memory.py --oxt build/extension/assoc.oxt [--rounds 3]
Prints one line per run: RSS before, peak (VmHWM, the process's high-water mark so far), after, and
after − before, in MB; exits 1 when any "after" is more than 50 MB above its "before".
"""
import argparse
import pathlib
import subprocess
import sys
import time

ROOT = pathlib.Path(__file__).resolve().parents[2]
sys.path.insert(0, str(ROOT / "scripts"))

import assoc_office  # noqa: E402

# Invented: five branches × five outcomes of an invoice check; the exact test stops at its memory cap
# (tests/calc/calc_more_functions.py, BEYOND_THE_CAP).
AT_THE_CAP = [[14, 22, 9, 17, 25], [19, 11, 28, 13, 16], [24, 18, 12, 21, 10], [15, 27, 20, 11, 23],
              [12, 16, 25, 19, 14]]
# Invented: a 3×4 table the exact test finishes within its caps, holding some tens of MB.
FINISHES = [[35, 27, 40], [30, 35, 35], [40, 32, 28]]


def office_pid(launcher):
    """The soffice.bin process in the launcher's process group."""
    out = subprocess.run(["ps", "-o", "pid=,comm=", "-g", str(launcher)], capture_output=True, text=True).stdout
    for line in out.splitlines():
        pid, comm = line.split(None, 1)
        if comm.strip().startswith("soffice.bin"):
            return int(pid)
    raise RuntimeError("soffice.bin not found")


def memory(pid):
    """(resident, high-water mark) in MB from /proc."""
    fields = {}
    for line in pathlib.Path(f"/proc/{pid}/status").read_text().splitlines():
        key, _, value = line.partition(":")
        if key in ("VmRSS", "VmHWM"):
            fields[key] = int(value.split()[0]) / 1024
    return fields["VmRSS"], fields["VmHWM"]


def put(sheet, rows):
    sheet.getCellRangeByName(f"A1:{chr(ord('A') + len(rows[0]) - 1)}{len(rows)}").setDataArray(
        tuple(tuple(float(v) for v in row) for row in rows))
    return f"A1:{chr(ord('A') + len(rows[0]) - 1)}{len(rows)}"


def main():
    parser = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--oxt", required=True)
    parser.add_argument("--rounds", type=int, default=3)
    args = parser.parse_args()
    worst = 0.0
    with assoc_office.ThrowawayOffice(args.oxt) as office:
        document = office.new_spreadsheet()
        sheet = document.Sheets.getByIndex(0)
        pid = office_pid(office.process.pid)
        # Load the add-in and let the office settle before the first figure.
        sheet.getCellRangeByName("H1").setFormula(f"=ASSOC.EXACT({put(sheet, [[3, 1], [1, 3]])})")
        document.calculateAll()
        time.sleep(2)
        print(f"{'run':<28} {'before':>8} {'peak':>8} {'after':>8} {'after-before':>13}   result")
        for round_number in range(args.rounds):
            for name, table in (("exact at its 400 MB cap", AT_THE_CAP), ("exact that finishes", FINISHES)):
                sheet.getCellRangeByName("A1:Z30").clearContents(0xFFFF)
                document.calculateAll()
                before, _ = memory(pid)
                cell = sheet.getCellRangeByName("H1")
                started = time.monotonic()
                cell.setFormula(f"=ASSOC.EXACT({put(sheet, table)})")
                document.calculateAll()
                seconds = time.monotonic() - started
                result = f"Err:{cell.getError()}" if cell.getError() else f"p = {cell.getValue():.6g}"
                time.sleep(1)
                after, peak = memory(pid)
                worst = max(worst, after - before)
                print(f"{name:<28} {before:8.0f} {peak:8.0f} {after:8.0f} {after - before:13.0f}   {result} in "
                      f"{seconds:.1f} s (round {round_number + 1})", flush=True)
        document.close(True)
    print(f"largest growth: {worst:.0f} MB (goal: at most 50 MB)")
    sys.exit(0 if worst <= 50 else 1)


if __name__ == "__main__":
    main()
