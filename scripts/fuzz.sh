#!/usr/bin/env bash
# Builds the libFuzzer targets with clang (ASan + UBSan + libFuzzer) and fuzzes each for a bounded
# time, starting from the seed corpus in tests/fuzz/corpus/<target>. Crash inputs are copied to
# tests/fuzz/regressions/<target>/ (keep them: ctest replays them in every build) and the script
# exits non-zero. Usage: scripts/fuzz.sh [seconds-per-target, default 60] [build-dir]
# Needs Debian packages clang-14 and libclang-rt-14-dev.
set -euo pipefail
seconds="${1:-60}"
root="$(cd "$(dirname "$0")/.." && pwd)"
build="${2:-$root/build/fuzz}"
cxx="$(command -v clang++-14 || command -v clang++ || true)"
cc="$(command -v clang-14 || command -v clang || true)"
[[ -n "$cxx" && -n "$cc" ]] || { echo "fuzz.sh: clang not found (apt-get install clang-14 libclang-rt-14-dev)" >&2; exit 2; }

cmake -S "$root" -B "$build" -G Ninja -DCMAKE_BUILD_TYPE=RelWithDebInfo \
  -DCMAKE_C_COMPILER="$cc" -DCMAKE_CXX_COMPILER="$cxx" \
  -DFINESTRA_FUZZ=ON -DFINESTRA_SANITIZE=ON -DFINESTRA_BUILD_GUI=OFF -DFINESTRA_BUILD_BENCH=OFF
targets=(project_reader peak_csv spectrum_csv plan_request project_sections)
cmake --build "$build" -j"$(nproc)" --target "${targets[@]/%/_fuzzer}"

export ASAN_OPTIONS="${ASAN_OPTIONS:-detect_leaks=1:abort_on_error=1}"
export UBSAN_OPTIONS="${UBSAN_OPTIONS:-print_stacktrace=1:halt_on_error=1}"
failed=0
for t in "${targets[@]}"; do
  work="$build/fuzz-work/$t"
  rm -rf "$work"; mkdir -p "$work/corpus" "$work/artifacts"
  cp "$root/tests/fuzz/corpus/$t/"* "$work/corpus/"
  echo "== fuzzing $t for ${seconds}s"
  if ! "$build/tests/fuzz/${t}_fuzzer" "$work/corpus" -max_total_time="$seconds" -max_len=65536 \
       -timeout=10 -rss_limit_mb=2048 -print_final_stats=1 -artifact_prefix="$work/artifacts/" 2>"$work/log.txt"; then
    failed=1
    mkdir -p "$root/tests/fuzz/regressions/$t"
    cp "$work/artifacts/"* "$root/tests/fuzz/regressions/$t/" 2>/dev/null || true
    echo "fuzz.sh: $t FOUND A CRASH; inputs copied to tests/fuzz/regressions/$t/" >&2
    tail -n 60 "$work/log.txt" >&2
  fi
  grep -E "stat::number_of_executed_units|cov:|Done" "$work/log.txt" | tail -n 3 || true
done
[[ $failed -eq 0 ]] && echo "fuzz.sh: no crash in ${#targets[@]} targets x ${seconds}s"
exit $failed
