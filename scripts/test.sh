#!/usr/bin/env bash
# The test command: installs what is missing, builds everything with warnings as errors,
# and runs every test (core unit tests and the tests in real headless Calc).
set -euo pipefail
cd "$(dirname "$0")/.."
scripts/install-deps.sh
cmake -S . -B build -DCMAKE_BUILD_TYPE=RelWithDebInfo -DASSOC_WARNINGS_AS_ERRORS=ON
cmake --build build -j2
ctest --test-dir build --output-on-failure -j2
