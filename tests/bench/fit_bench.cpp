// Fit speed (issue 4): 8 free parameters, 60 peaks in 6 measurement sets, default 8 starts.
// Target: one complete fit (assignment, least squares, uncertainties) under 1 s.
#include <benchmark/benchmark.h>

#include "core/fit/project_fit.h"
#include "core/fit/synthetic_peaks.h"

namespace {

using namespace finestra;

Project benchProject() {
  Project base;
  base.centre.preset = "SiV-";
  base.sample.inPlaneX = Vec3(1, 1, 0);
  FitState truth = initialFitState(base);
  truth.strain.extraGround = {14.0, 30.0};
  truth.strain.extraExcited = {22.0, 200.0};
  truth.fieldScale = 0.99;
  truth.tiltDeg = 2.0;
  truth.tiltAzimuthDeg = 40;
  truth.zplOffsetGHz = 1.0;
  const double polar[6] = {35, 65, 80, 20, 50, 75}, azimuth[6] = {20, 75, 150, 200, 290, 330};
  std::vector<SyntheticSetSpec> specs;
  for (int k = 0; k < 6; ++k) {
    SyntheticSetSpec s;
    s.name = "set " + std::to_string(k);
    s.field = FieldSetting::fromAngles(0.3 + 0.1 * k, polar[k], azimuth[k]);
    s.maxPeaks = 10;
    s.resolutionGHz = 0.5;
    specs.push_back(s);
  }
  std::mt19937_64 rng(1);
  Project p = base;
  for (auto& set : makeSyntheticSets(base, truth, specs, rng)) p.measurements.push_back(set.measurement);
  p.strain.extraGround = {13.0, 0};
  p.strain.extraExcited = {23.0, 0};
  p.fit.free = {"eg_strain_g_GHz", "eg_strain_u_GHz", "field_scale", "magnet_tilt_deg", "magnet_tilt_azimuth_deg",
                "zpl_offset_GHz", "q_g", "q_u"};
  p.fit.starts = 8;
  return p;
}

void BM_Fit8Parameters60Peaks(benchmark::State& state) {
  const Project project = benchProject();
  std::size_t peaks = 0;
  for (const auto& m : project.measurements) peaks += m.peaks.size();
  for (auto _ : state) {
    const FitResult r = fitProject(project);
    benchmark::DoNotOptimize(r.chi2);
    state.counters["converged"] = r.converged ? 1 : 0;
  }
  state.counters["peaks"] = static_cast<double>(peaks);
}
BENCHMARK(BM_Fit8Parameters60Peaks)->Unit(benchmark::kMillisecond)->UseRealTime();

}  // namespace

BENCHMARK_MAIN();
