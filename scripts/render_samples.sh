#!/usr/bin/env bash
# Regenerates the user guide's screenshots (docs/images/*.png) from the sample workbooks: builds the
# extension, then renders each shot in a throwaway headless LibreOffice (scripts/render_samples.py),
# and takes the shots of the menu command (menu, dialog, the sheet it makes) from a real Calc window
# on a virtual screen (tests/calc/command_visible_test.py, which needs Xvfb).
#
#   scripts/render_samples.sh [output folder]      (default: docs/images)
set -euo pipefail
out=""
[ $# -ge 1 ] && out="$(realpath -m "$1")"
cd "$(dirname "$0")/.."
scripts/install-deps.sh --render
cmake -S . -B build
cmake --build build -j2 --target assoc_oxt
/usr/bin/python3 scripts/render_samples.py --oxt "$(pwd)/build/extension/assoc.oxt" ${out:+--out "$out"}
/usr/bin/python3 tests/calc/command_visible_test.py --oxt "$(pwd)/build/extension/assoc.oxt" \
  --shots "${out:-$(pwd)/docs/images}"
