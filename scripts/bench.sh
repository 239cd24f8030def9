#!/usr/bin/env bash
# The bench command: speed figures and ratios (never part of the tests).
#   1. the exact test against R's fisher.test on bench/exact_suite.txt (R is only a yardstick), and
#      the validation of its early refusal (suite and random tables of its sizes, confusion figures);
#   2. counting raw records in the core (ns per record, growth with the number of levels);
#   3. in real Calc: ASSOC.COUNTS against the cost of handing the ranges to any add-in and against
#      a COUNTIFS grid; first failures, recalculation and loading of a workbook of failing exact
#      cells; 10,000 ASSOC.PVALUE cells against a trivial add-in and CHITEST;
#   4. the functions of ordered tables, r×c strata and repeated answers against 50 ms a call, in the
#      core and in real Calc.
#   5. the menu command: how long it takes to build its analysis sheet (goal: under 0.5 s for 10×10).
# Timings are noisy while other work runs on the machine: the load average is printed with them.
# Installs what it needs (R for step 1), builds in build/, prints everything to the terminal.
set -euo pipefail
cd "$(dirname "$0")/.."
scripts/install-deps.sh --bench
cmake -S . -B build -DCMAKE_BUILD_TYPE=RelWithDebInfo
cmake --build build -j2 --target exact_bench counts_bench ordered_bench exact_refusal_validation
mkdir -p build/bench

echo "== 1. Exact test: Assoc vs R fisher.test (R timings first, about 6 minutes)"
Rscript bench/exact_reference.R bench/exact_suite.txt > build/bench/exact_r.csv
build/bench/exact_bench bench/exact_suite.txt build/bench/exact_r.csv
echo
echo "== 1b. Early refusal of the exact test: suite and random tables, with and without the forecast"
build/bench/exact_refusal_validation bench/exact_suite.txt || true  # a MISS is reported, not fatal

echo
echo "== 2. Counting 1,000,000 raw records in the core"
build/bench/counts_bench

if [ -x bench/calc/run.sh ]; then
  echo
  echo "== 3. ASSOC.COUNTS in headless Calc"
  bench/calc/run.sh build
fi

echo
echo "== 4. ASSOC.ORDINAL, ASSOC.WITHIN, ASSOC.REPEATED against 50 ms a call (core, then headless Calc)"
build/bench/ordered_bench
if [ -x bench/calc/run.sh ]; then
  /usr/bin/python3 bench/calc/ordered_in_calc.py --build build
fi

echo
echo "== 5. The menu command: building the analysis sheet in headless Calc"
cmake --build build -j2 --target assoc_oxt
/usr/bin/python3 bench/calc/command_bench.py --oxt build/extension/assoc.oxt
