#!/usr/bin/env python3
"""Speed of finestra.line_grid from Python against the C++ benchmark BM_LineGrid, same workload.

20 000 field directions (|B| = 0.5 T on the spiral of tests/bench/engine_bench.cpp) x 4 classes of the
default SiV- project. Prints both times (best of several runs) and their ratio; the goal is a Python
call within 1.5x of the C++ benchmark (no per-point Python overhead). A benchmark, not a test.

Usage: PYTHONPATH=BUILD/python python3 tests/bench/python_line_grid_vs_cpp.py BUILD [directions]
"""
import json
import math
import subprocess
import sys
import time

import numpy as np

import finestra


def spiral_fields(count):
    """The field directions of baselineFields() in tests/bench/engine_bench.cpp."""
    t = np.arange(count) / (count - 1)
    theta = np.arccos(-1.0 + 2.0 * t)
    phi = 2.0 * math.pi * t * 7.3
    return 0.5 * np.stack([np.sin(theta) * np.cos(phi), np.sin(theta) * np.sin(phi), np.cos(theta)], axis=1)


def python_seconds(count, repetitions=7):
    project = finestra.Project()
    fields = spiral_fields(count)
    finestra.line_grid(project, fields)  # warm-up
    best = math.inf
    for _ in range(repetitions):
        started = time.perf_counter()
        grid = finestra.line_grid(project, fields)
        best = min(best, time.perf_counter() - started)
        assert grid["frequency_GHz"].shape == (count, 4, 4, 4)
    return best


def cpp_seconds(build, count):
    done = subprocess.run(
        [f"{build}/tests/bench/finestra_engine_bench", f"--benchmark_filter=BM_LineGrid/{count}/",
         "--benchmark_repetitions=7", "--benchmark_format=json"],
        capture_output=True, text=True, check=True)
    runs = [b for b in json.loads(done.stdout)["benchmarks"] if b.get("run_type") == "iteration"]
    if not runs:
        sys.exit(f"BM_LineGrid/{count} is not a registered benchmark size (the C++ benchmark has 2000 and 20000)")
    unit = {"ns": 1e-9, "us": 1e-6, "ms": 1e-3, "s": 1.0}[runs[0]["time_unit"]]
    return min(b["real_time"] for b in runs) * unit


def main():
    if len(sys.argv) < 2:
        sys.exit(__doc__)
    build = sys.argv[1]
    count = int(sys.argv[2]) if len(sys.argv) > 2 else 20000
    cpp = cpp_seconds(build, count)
    python = python_seconds(count)
    print(f"line grid, {count} directions x 4 classes, best of 7")
    print(f"C++ benchmark BM_LineGrid/{count}: {cpp * 1e3:8.2f} ms")
    print(f"Python finestra.line_grid:  {python * 1e3:8.2f} ms")
    print(f"ratio Python/C++ = {python / cpp:.2f} (goal <= 1.5)")


if __name__ == "__main__":
    main()
