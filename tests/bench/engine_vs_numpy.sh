#!/bin/sh
# Runs the engine line-grid benchmark and the NumPy baseline in one go and prints the ratio of
# class-points per second (one field direction × one orientation class: both 4×4 manifolds
# diagonalised, 16 lines, three crystal-axis analyser intensities).
# Usage: tests/bench/engine_vs_numpy.sh BUILD_DIR [directions, default 20000]
# The baseline is tests/bench/numpy_baseline.py beside this script (override with FINESTRA_NUMPY_BASELINE).
set -eu
build=${1:?usage: engine_vs_numpy.sh BUILD_DIR [directions]}
n=${2:-20000}
baseline=${FINESTRA_NUMPY_BASELINE:-$(dirname "$0")/numpy_baseline.py}
bench_json=$(mktemp)
trap 'rm -f "$bench_json"' EXIT
"$build/tests/bench/finestra_engine_bench" --benchmark_filter="BM_LineGrid/$n/" \
  --benchmark_repetitions=5 --benchmark_format=json >"$bench_json"
numpy_line=$(/usr/bin/python3 "$baseline" "$n" 5)
echo "$numpy_line"
/usr/bin/python3 - "$bench_json" "$numpy_line" "$n" <<'PY'
import json, re, sys
bench = json.load(open(sys.argv[1]))
runs = [b for b in bench["benchmarks"] if b.get("run_type") == "iteration"]
ours = max(b["class_points_per_s"] for b in runs)
numpy_rate = float(re.search(r"->\s*([0-9.eE+-]+) class-points/s", sys.argv[2]).group(1))
print(f"engine line grid, {sys.argv[3]} directions x 4 classes, all cores: {ours:.3e} class-points/s "
      f"({4 * int(sys.argv[3]) / ours * 1e3:.1f} ms)")
print(f"numpy baseline, same workload: {numpy_rate:.3e} class-points/s")
print(f"ratio engine/numpy = {ours / numpy_rate:.1f} (goal >= 20)")
PY
