#!/usr/bin/env bash
# The main job: installs what is missing, builds the extension, opens the sample workbook
# (samples/promotions.fods, invented data of a fictional company) in a throwaway headless
# LibreOffice with the extension installed, runs the menu command "Analyse Selection with Assoc"
# (Data ▸ Statistics) on its count table, prints the key figures of the sheet the command made,
# read from its cells, and writes a PDF of that sheet.
#
#   scripts/demo.sh [PDF path]      (default: build/promotions.pdf)
set -euo pipefail
pdf=""
[ $# -ge 1 ] && pdf="$(realpath -m "$1")"
cd "$(dirname "$0")/.."
pdf="${pdf:-$(pwd)/build/promotions.pdf}"

scripts/install-deps.sh
cmake -S . -B build
cmake --build build -j2
oxt="$(pwd)/build/extension/assoc.oxt"

/usr/bin/python3 scripts/demo.py --oxt "$oxt" --workbook samples/promotions.fods --pdf "$pdf"

cat <<EOT

To use Assoc in your own LibreOffice (close LibreOffice first):
  unopkg add "$oxt"
(as root, unopkg installs for every user of the machine only: unopkg add --shared "$oxt")
or in LibreOffice: Tools > Extension Manager > Add..., choose that file, and restart LibreOffice.
Then select a table of counts (or two columns of records) and choose Data > Statistics > Analyse
Selection with Assoc... (or the Assoc toolbar button). The functions are in the Function Wizard's
Statistical category (ASSOC.*); see docs/functions.md.
The user guide, docs/guide.md, works through the other sample workbooks in samples/ (promotions by
office, selection rates, invoice exceptions counted from records).
EOT
