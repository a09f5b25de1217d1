// Planner speed (issue 5): the 181 × 361 direction map × 4 classes must take under 1 s on 2 cores.
// Every figure is computed (qubit, drive, cyclicity, class separation, both anticrossing scans,
// axis angle). tests/bench/planner_vs_numpy.sh runs this together with the NumPy baseline.
#include <benchmark/benchmark.h>

#include <Eigen/Eigenvalues>

#include "core/project/model_setup.h"
#include "core/planner/planner.h"

using namespace finestra;

namespace {

// Invented scenario: SiV- in a (001) sample with a small shear strain, 0.5 T.
const CentreModel& benchModel() {
  static const CentreModel model = [] {
    Project p;
    p.strain.crystal = strainFromComponents(0, 0, 0, 2e-6, 2e-6, -3e-6);
    return CentreModel(makeModelSetup(p));
  }();
  return model;
}

void BM_PlannerMap181x361(benchmark::State& state) {
  PlannerSettings settings;
  settings.magnitudeT = 0.5;
  const SphereGrid grid;  // 181 × 361
  const int threads = static_cast<int>(state.range(0));
  for (auto _ : state) {
    FigureMap map = computeFigureMap(benchModel(), settings, grid, {}, threads);
    benchmark::DoNotOptimize(map.figures.data());
  }
  state.counters["class_points_per_s"] =
      benchmark::Counter(static_cast<double>(grid.size() * kClassCount), benchmark::Counter::kIsIterationInvariantRate);
}
BENCHMARK(BM_PlannerMap181x361)->Arg(1)->Arg(2)->Unit(benchmark::kMillisecond)->UseRealTime();

// One direction, all four classes, one thread: the kernel's own cost.
void BM_PlannerKernelOneDirection(benchmark::State& state) {
  PlannerSettings settings;
  const PlannerKernel kernel(benchModel(), settings);
  std::array<ClassFigures, kClassCount> out{};
  const Vec3 dir = Vec3(0.3, -0.5, 0.8).normalized();
  for (auto _ : state) {
    kernel.evaluate(dir, 0.5, out);
    benchmark::DoNotOptimize(out.data());
  }
}
BENCHMARK(BM_PlannerKernelOneDirection)->Unit(benchmark::kMicrosecond);

// The two building blocks: one 4×4 self-adjoint eigendecomposition and one closed-form quartic.
void BM_SelfAdjoint4x4(benchmark::State& state) {
  const auto h = LinearHamiltonian4::sample(benchModel().manifold(Manifold::Ground),
                                            benchModel().strainFor(Manifold::Ground, 1), defectFrame(1));
  Matrix4c m;
  h.at(Vec3(0.1, -0.2, 0.4), m);
  Eigen::SelfAdjointEigenSolver<Matrix4c> solver;
  for (auto _ : state) {
    solver.compute(m);
    benchmark::DoNotOptimize(solver.eigenvectors().data());
  }
}
BENCHMARK(BM_SelfAdjoint4x4)->Unit(benchmark::kNanosecond);

void BM_QuarticLevels(benchmark::State& state) {
  const auto h = LinearHamiltonian4::sample(benchModel().manifold(Manifold::Ground),
                                            benchModel().strainFor(Manifold::Ground, 1), defectFrame(1));
  const PauliForm4 form = PauliForm4::fromLinear(h);
  Vec3 b(0.1, -0.2, 0.4);
  for (auto _ : state) {
    benchmark::DoNotOptimize(quarticLevels(form, b));
    b.x() += 1e-9;
  }
}
BENCHMARK(BM_QuarticLevels)->Unit(benchmark::kNanosecond);

}  // namespace

BENCHMARK_MAIN();
