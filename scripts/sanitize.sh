#!/usr/bin/env bash
# Configures, builds and runs the whole test suite under AddressSanitizer + UndefinedBehaviorSanitizer
# (the settings of the "asan" preset, in build/asan unless a folder is given). Any sanitizer report
# aborts the test that triggered it, so ctest fails and this script exits non-zero.
# Usage: scripts/sanitize.sh [build-dir]
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
build="${1:-$root/build/asan}"
gui="${FINESTRA_SANITIZE_GUI:-OFF}"
cmake -S "$root" -B "$build" -G Ninja -DCMAKE_BUILD_TYPE=RelWithDebInfo -DFINESTRA_SANITIZE=ON \
  -DFINESTRA_BUILD_BENCH=OFF -DFINESTRA_BUILD_GUI="$gui"
cmake --build "$build" -j"$(nproc)"
export ASAN_OPTIONS="${ASAN_OPTIONS:-detect_leaks=1:abort_on_error=1:strict_string_checks=1:detect_stack_use_after_return=1}"
export UBSAN_OPTIONS="${UBSAN_OPTIONS:-print_stacktrace=1:halt_on_error=1}"
ctest --test-dir "$build" --output-on-failure --timeout 900 -j"$(nproc)"
