// The workload of tests/bench/numpy_baseline.py: N field directions (|B| = 0.5 T, the same
// spiral over the sphere) × 4 classes, both 4-state manifolds diagonalised, 16 lines with three
// crystal-axis analyser intensities. Throughput is reported as class-points per second;
// tests/bench/engine_vs_numpy.sh runs this and the NumPy baseline in one go and prints the ratio.
#include <benchmark/benchmark.h>

#include <cmath>
#include <numbers>

#include "core/optics/line_grid.h"

using namespace finestra;

namespace {
std::vector<Vec3> baselineFields(long n) {
  std::vector<Vec3> fields(static_cast<std::size_t>(n));
  for (long k = 0; k < n; ++k) {
    const double t = static_cast<double>(k) / static_cast<double>(n - 1);
    const double theta = std::acos(-1.0 + 2.0 * t), phi = 2.0 * std::numbers::pi * t * 7.3;
    fields[static_cast<std::size_t>(k)] =
        0.5 * Vec3(std::sin(theta) * std::cos(phi), std::sin(theta) * std::sin(phi), std::cos(theta));
  }
  return fields;
}

CentreModel silicon() {
  return CentreModel(ModelSetup{resolveCentre("SiV-", std::nullopt, {}), LabFrame(), {}, {}});
}

void BM_LineGrid(benchmark::State& state) {
  const CentreModel model = silicon();
  const std::vector<Vec3> fields = baselineFields(state.range(0));
  const std::vector<int> classes{0, 1, 2, 3};
  std::vector<LineGridPoint> out;
  for (auto _ : state) {
    evaluateLineGrid(model, fields, classes, out);
    benchmark::DoNotOptimize(out.data());
  }
  state.counters["class_points_per_s"] =
      benchmark::Counter(static_cast<double>(state.range(0) * 4), benchmark::Counter::kIsIterationInvariantRate);
}
}  // namespace

BENCHMARK(BM_LineGrid)->Arg(20000)->Arg(2000)->Unit(benchmark::kMillisecond)->UseRealTime();
BENCHMARK_MAIN();
