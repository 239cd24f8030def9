#!/usr/bin/env bash
# The in-Calc speed benches: builds assoc.oxt, the bench-only transfer-floor add-in and adapter_bench
# in BUILD_DIR (configuring it first if needed), then prints
#   1. adapter_bench: the stages of ASSOC.COUNTS's own work outside Calc (ns per record);
#   2. counts_in_calc.py: ASSOC.COUNTS vs the transfer floor vs a COUNTIFS grid in headless Calc;
#   3. recalc_in_calc.py: first failures of out-of-reach exact tests, cold and warm hard
#      recalculation and loading of a workbook of failing exact cells, and 10,000 ASSOC.PVALUE cells
#      vs a trivial add-in and vs CHITEST.
# Usage: bench/calc/run.sh [BUILD_DIR] [options of counts_in_calc.py, e.g. --rounds 7]
#   (RECALC_OPTIONS="--rounds 9" passes options to recalc_in_calc.py)
# Runs as root or not; takes four to eight minutes. The office, its throwaway profile and its
# temporary folder are removed on exit, also on failure or Ctrl+C (see scripts/assoc_office.py).
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
root="$(cd "$here/../.." && pwd)"
build="$(realpath -m "${1:-$root/build}")"
shift || true

if [[ ! -f "$build/CMakeCache.txt" ]]; then
  cmake -S "$root" -B "$build" -DCMAKE_BUILD_TYPE=RelWithDebInfo
fi
build_type="$(sed -n 's/^CMAKE_BUILD_TYPE:[A-Z]*=//p' "$build/CMakeCache.txt")"
case "$build_type" in
  Release|RelWithDebInfo) ;;
  *) echo "warning: $build is a '$build_type' build; timings of an unoptimised add-in mean little" >&2 ;;
esac
cmake --build "$build" --target assoc_oxt transfer_floor_oxt adapter_bench -j2

echo
"$build/bench/calc/adapter_bench"
echo
/usr/bin/python3 "$here/counts_in_calc.py" --build "$build" "$@"
echo
# shellcheck disable=SC2086  # RECALC_OPTIONS is a list of options
exec /usr/bin/python3 "$here/recalc_in_calc.py" --build "$build" ${RECALC_OPTIONS:-}
