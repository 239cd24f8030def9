#!/usr/bin/env bash
# The test command: installs what is missing, builds everything with warnings as errors, and runs
# every test: the core unit tests and the tests in real headless Calc (build/); the core unit tests
# again under AddressSanitizer + UndefinedBehaviorSanitizer with gcc (build-sanitize/) and with
# clang 14 (build-clang/), where each fuzz target also runs briefly (scripts/fuzz.sh runs them long).
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/build_variants.sh
scripts/install-deps.sh
started=$SECONDS
lap() { echo "test.sh: $1 after $((SECONDS - started)) s"; }

cmake -S . -B build -DCMAKE_BUILD_TYPE=RelWithDebInfo -DASSOC_WARNINGS_AS_ERRORS=ON
cmake --build build -j2
ctest --test-dir build --output-on-failure -j2
lap "build/ (gcc, core and Calc) passed"

build_sanitize
ctest --test-dir build-sanitize --output-on-failure -j2
lap "build-sanitize/ (gcc, ASan + UBSan) passed"

build_clang
ctest --test-dir build-clang --output-on-failure -j2
lap "build-clang/ (clang 14, ASan + UBSan, fuzz targets) passed"
