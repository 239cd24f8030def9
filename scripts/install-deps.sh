#!/usr/bin/env bash
# Installs the Debian packages Assoc needs to build and test (and, with --bench or
# --reference, the reference tools; with --render, what the guide's screenshots need).
# Uses sudo when not root; skips what is installed.
set -euo pipefail

# libreoffice-calc (not the -nogui variant): the same office runs headless for the tests and in a
# window under a virtual X server (xvfb) for the visible test of the menu command, which takes its
# screenshots with python3-pil.
# clang-14 and libclang-rt-14-dev (its sanitizer and libFuzzer runtimes): the second compiler and the
# fuzz targets of the test command (build-clang/); gcc's sanitizer runtimes come with g++.
packages=(cmake g++ make libboost-math-dev libgtest-dev libicu-dev clang-14 libclang-rt-14-dev
          libreoffice-dev libreoffice-calc python3 python3-uno python3-pil poppler-utils xvfb xauth)
for arg in "$@"; do
  case "$arg" in
    --bench) packages+=(r-base-core) ;;
    --reference) packages+=(python3-scipy python3-statsmodels python3-mpmath r-base-core) ;;
    --render) packages+=(python3-pil fonts-liberation2) ;;
    *) echo "install-deps.sh: unknown option $arg" >&2; exit 2 ;;
  esac
done

missing=()
for p in "${packages[@]}"; do
  dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
done
[ ${#missing[@]} -eq 0 ] && exit 0

if [ "$(id -u)" -eq 0 ]; then as_root=(); else as_root=(sudo); fi
echo "Installing: ${missing[*]}"
"${as_root[@]}" apt-get update -qq
DEBIAN_FRONTEND=noninteractive "${as_root[@]}" apt-get install -y -qq --no-install-recommends "${missing[@]}"
