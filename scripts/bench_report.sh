#!/usr/bin/env bash
# One command for the performance report: builds every Google Benchmark program in tests/bench
# (Release), runs each of them and the NumPy baseline (tests/bench/numpy_baseline.py, or
# FINESTRA_NUMPY_BASELINE) in the same run, and prints one table with the machine. Benchmarks that
# report class-points per second (counter class_points_per_s: one field direction × one orientation
# class, both manifolds and all lines, the baseline's unit of work) get the ratio to NumPy.
# Usage: scripts/bench_report.sh [build-dir, default build/release] [numpy directions, default 20000]
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
build="${1:-$root/build/release}"
directions="${2:-20000}"
baseline="${FINESTRA_NUMPY_BASELINE:-$root/tests/bench/numpy_baseline.py}"
python=/usr/bin/python3

cmake -S "$root" -B "$build" -G Ninja -DCMAKE_BUILD_TYPE=Release -DFINESTRA_BUILD_BENCH=ON >/dev/null
mapfile -t benches < <(cmake --build "$build" --target help | sed -n 's/^\([A-Za-z0-9_]*_bench\):.*/\1/p' | sort -u)
[[ ${#benches[@]} -gt 0 ]] || { echo "bench_report.sh: no benchmark targets found" >&2; exit 2; }
cmake --build "$build" -j"$(nproc)" --target "${benches[@]}"

out="$build/bench-report"
rm -rf "$out"; mkdir -p "$out"
for b in "${benches[@]}"; do
  exe="$(find "$build" -type f -perm -u+x -name "$b" | head -n 1)"
  [[ -n "$exe" ]] || { echo "bench_report.sh: built $b but cannot find it" >&2; exit 2; }
  echo "running $b ..." >&2
  QT_QPA_PLATFORM="${QT_QPA_PLATFORM:-offscreen}" "$exe" --benchmark_format=json --benchmark_out="$out/$b.json" \
    --benchmark_out_format=json >/dev/null
done
echo "running NumPy baseline ($directions directions) ..." >&2
"$python" "$baseline" "$directions" 5 | tee "$out/numpy.txt" >&2

"$python" - "$out" <<'PY'
import glob, json, os, re, subprocess, sys
out = sys.argv[1]
numpy_text = open(os.path.join(out, "numpy.txt")).read()
numpy_rate = float(re.search(r"->\s*([0-9.eE+-]+) class-points/s", numpy_text).group(1))
cpu = "unknown"
for line in open("/proc/cpuinfo"):
    if line.startswith("model name"):
        cpu = line.split(":", 1)[1].strip(); break
print(f"machine: {os.cpu_count()} CPUs (nproc {subprocess.run(['nproc'], capture_output=True, text=True).stdout.strip()}), {cpu}")
print(f"NumPy baseline: {numpy_text.strip()}")
rows = [("benchmark", "time/iter", "class-points/s", "ratio to NumPy")]
for path in sorted(glob.glob(os.path.join(out, "*.json"))):
    data = json.load(open(path))
    for b in data.get("benchmarks", []):
        if b.get("run_type") == "aggregate":
            continue
        t = f'{b["real_time"]:.4g} {b["time_unit"]}'
        rate = b.get("class_points_per_s")
        rows.append((b["name"], t, f"{rate:.3e}" if rate else "-", f"{rate / numpy_rate:.2f}x" if rate else "-"))
widths = [max(len(r[i]) for r in rows) for i in range(4)]
for k, r in enumerate(rows):
    print("  ".join(c.ljust(widths[i]) for i, c in enumerate(r)))
    if k == 0:
        print("  ".join("-" * w for w in widths))
PY
