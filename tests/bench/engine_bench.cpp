// The workload of tests/bench/numpy_baseline.py: N field directions (|B| = 0.5 T, the same
// spiral over the sphere) × 4 classes, both 4-state manifolds diagonalised, 16 lines with three
// crystal-axis analyser intensities. Throughput is reported as class-points per second;
// tests/bench/engine_vs_numpy.sh runs this and the NumPy baseline in one go and prints the ratio.
#include <benchmark/benchmark.h>

#include <sys/resource.h>

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

double peakResidentMB() {
  rusage usage{};
  getrusage(RUSAGE_SELF, &usage);
  return static_cast<double>(usage.ru_maxrss) / 1024.0;  // ru_maxrss is in kB on Linux
}

void runLineGrid(benchmark::State& state, LaneSet lanes) {
  if (!laneSetSupported(lanes)) {
    state.SkipWithError("this CPU does not run this lane kernel");
    return;
  }
  const CentreModel model = silicon();
  const std::vector<Vec3> fields = baselineFields(state.range(0));
  const std::vector<int> classes{0, 1, 2, 3};
  std::vector<LineGridPoint> out;
  for (auto _ : state) {
    evaluateLineGrid(model, fields, classes, out, {}, lanes);
    benchmark::DoNotOptimize(out.data());
  }
  state.counters["class_points_per_s"] =
      benchmark::Counter(static_cast<double>(state.range(0) * 4), benchmark::Counter::kIsIterationInvariantRate);
  state.counters["peak_MB"] = peakResidentMB();
}

/// The widest lane kernel this CPU runs (what the program uses).
void BM_LineGrid(benchmark::State& state) { runLineGrid(state, bestLaneSet()); }
/// Each variant alone, for the ratio between them in one run.
void BM_LineGridScalar(benchmark::State& state) { runLineGrid(state, LaneSet::Scalar); }
void BM_LineGridAvx2(benchmark::State& state) { runLineGrid(state, LaneSet::Avx2); }
void BM_LineGridAvx512(benchmark::State& state) { runLineGrid(state, LaneSet::Avx512); }
}  // namespace

BENCHMARK(BM_LineGrid)->Arg(20000)->Arg(2000)->Unit(benchmark::kMillisecond)->UseRealTime();
BENCHMARK(BM_LineGridScalar)->Arg(20000)->Unit(benchmark::kMillisecond)->UseRealTime();
BENCHMARK(BM_LineGridAvx2)->Arg(20000)->Unit(benchmark::kMillisecond)->UseRealTime();
BENCHMARK(BM_LineGridAvx512)->Arg(20000)->Unit(benchmark::kMillisecond)->UseRealTime();
BENCHMARK_MAIN();
