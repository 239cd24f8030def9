# Sourced by scripts/test.sh and scripts/fuzz.sh: the build folders beside build/.
#   build-sanitize/  the core and its unit tests, gcc, AddressSanitizer + UndefinedBehaviorSanitizer
#   build-clang/     the core and its unit tests, clang 14, the same sanitizers, and the fuzz targets
# Core only (no extension, no bench), -O1 with line tables: enough for the sanitizers' reports,
# and much cheaper to build than the main folder.
variant_flags=(-DCMAKE_BUILD_TYPE=Debug "-DCMAKE_CXX_FLAGS_DEBUG=-O1 -g1" -DASSOC_WARNINGS_AS_ERRORS=ON
               -DASSOC_BUILD_EXTENSION=OFF -DASSOC_BUILD_BENCH=OFF)

build_sanitize() {
  cmake -S . -B build-sanitize "${variant_flags[@]}" -DASSOC_SANITIZE=ON "$@"
  cmake --build build-sanitize -j2
}

build_clang() {
  cmake -S . -B build-clang "${variant_flags[@]}" -DCMAKE_CXX_COMPILER=clang++-14 -DASSOC_BUILD_FUZZ=ON "$@"
  cmake --build build-clang -j2
}
