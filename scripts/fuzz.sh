#!/usr/bin/env bash
# Long fuzzing of the core: builds the fuzz targets (build-clang/, as the test command does) and runs
# them one after another, at low priority, each for the given time, keeping what they learn.
#
#   scripts/fuzz.sh                      every target for an hour each
#   scripts/fuzz.sh --seconds 600 exact  one target for 10 minutes
#
# Each target's corpus grows in build-clang/fuzz/work/<target>/corpus (the seeds in fuzz/corpus/ are
# read, never written); a finding stops that target and is saved beside it as crash-*, leak-*,
# timeout-* or oom-*, with the log. Reproduce one with: build-clang/fuzz/<target>_fuzz <file>.
# The summary at the end lists each target's time, runs and findings.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/build_variants.sh

seconds=3600
targets=()
while [ $# -gt 0 ]; do
  case "$1" in
    --seconds) seconds="$2"; shift 2 ;;
    -h|--help) sed -n '2,10p' "$0"; exit 0 ;;
    *) targets+=("$1"); shift ;;
  esac
done

scripts/install-deps.sh
build_clang >/dev/null
if [ ${#targets[@]} -eq 0 ]; then
  for program in build-clang/fuzz/*_fuzz; do
    name=$(basename "$program")
    targets+=("${name%_fuzz}")
  done
fi

summary=()
for target in "${targets[@]}"; do
  work="build-clang/fuzz/work/$target"
  mkdir -p "$work/corpus"
  log="$work/log-$(date +%Y%m%d-%H%M%S).txt"
  echo "fuzz.sh: $target for $seconds s (log: $log)"
  status=0
  nice -n 19 "build-clang/fuzz/${target}_fuzz" -max_total_time="$seconds" -timeout=20 -rss_limit_mb=2048 \
    -dict=fuzz/assoc.dict -artifact_prefix="$work/" -print_final_stats=1 \
    "$work/corpus" "fuzz/corpus/$target" >"$log" 2>&1 || status=$?
  runs=$(sed -n 's/^stat::number_of_executed_units: *//p' "$log" | tail -1)
  if [ "$status" -eq 0 ]; then
    summary+=("$target: ${seconds} s, ${runs:-?} runs, no finding")
  else
    summary+=("$target: stopped with a finding after ${runs:-?} runs: $(grep -m1 -E 'Assoc fuzz finding|ERROR:' "$log" || echo "see $log")")
  fi
done
echo
printf 'fuzz.sh: %s\n' "${summary[@]}"
