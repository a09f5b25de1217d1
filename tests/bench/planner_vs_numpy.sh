#!/bin/sh
# Runs the planner benchmark and the NumPy baseline in one go and prints their ratio.
# Usage: tests/bench/planner_vs_numpy.sh BUILD_DIR
# The baseline (tests/bench/numpy_baseline.py beside this script, override with FINESTRA_NUMPY_BASELINE)
# diagonalises both manifolds and computes all 16 lines with crystal-axis intensities for N field
# directions × 4 classes; the planner map computes every planner figure, including two anticrossing
# scans per class, for the same N = 181 × 361 directions. Ratio = NumPy time / planner time.
set -eu
build=${1:?usage: planner_vs_numpy.sh BUILD_DIR}
baseline=${FINESTRA_NUMPY_BASELINE:-$(dirname "$0")/numpy_baseline.py}
n=65341
bench_json=$(mktemp)
trap 'rm -f "$bench_json"' EXIT
"$build/tests/bench/finestra_planner_bench" --benchmark_filter='BM_PlannerMap181x361/2' \
  --benchmark_repetitions=3 --benchmark_report_aggregates_only=true \
  --benchmark_format=json >"$bench_json"
numpy_line=$(/usr/bin/python3 "$baseline" "$n" 3)
echo "$numpy_line"
/usr/bin/python3 - "$bench_json" "$numpy_line" "$n" <<'PY'
import json, re, sys
bench = json.load(open(sys.argv[1]))
ours = min(b["real_time"] for b in bench["benchmarks"] if b.get("aggregate_name") in ("median", "mean", None))
unit = {"ms": 1e-3, "us": 1e-6, "ns": 1e-9, "s": 1.0}[bench["benchmarks"][0]["time_unit"]]
ours_s = ours * unit
numpy_s = float(re.search(r"in ([0-9.]+) ms", sys.argv[2]).group(1)) * 1e-3
print(f"planner map 181x361 x 4 classes, 2 threads: {ours_s*1e3:.1f} ms (goal < 1000 ms)")
print(f"numpy baseline, same {sys.argv[3]} directions x 4 classes: {numpy_s*1e3:.1f} ms")
print(f"ratio numpy/planner = {numpy_s/ours_s:.2f}")
PY
