// Fit speed: one complete fit (assignment, least squares, uncertainties), default 8 starts.
// 8 free parameters, 60 peaks in 6 measurement sets (issue 4 goal: under 1 s), and 10 free
// parameters, 600 peaks in 60 sets (issue 16 goal: 0.2 s).
#include <benchmark/benchmark.h>

#include <sys/resource.h>

#include "core/fit/project_fit.h"
#include "core/fit/synthetic_peaks.h"

namespace {

using namespace finestra;

// Peak resident memory of the process so far (getrusage; ru_maxrss is in kB on Linux).
double peakResidentMB() {
  rusage usage{};
  getrusage(RUSAGE_SELF, &usage);
  return static_cast<double>(usage.ru_maxrss) / 1024.0;
}

Project benchProject(int sets = 6) {
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
  for (int k = 0; k < sets; ++k) {
    SyntheticSetSpec s;
    s.name = "set " + std::to_string(k);
    // Beyond the first six: the same six directions turned by a few degrees per round.
    const double turn = 7.0 * (k / 6);
    s.field = FieldSetting::fromAngles(0.3 + 0.1 * (k % 6), polar[k % 6] + 0.3 * turn, azimuth[k % 6] + turn);
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
  state.counters["peak_MB"] = peakResidentMB();
}
BENCHMARK(BM_Fit8Parameters60Peaks)->Unit(benchmark::kMillisecond)->UseRealTime();

void BM_Fit10Parameters600Peaks(benchmark::State& state) {
  Project project = benchProject(60);
  project.fit.free.push_back("lambda_g_GHz");
  project.fit.free.push_back("lambda_u_GHz");
  std::size_t peaks = 0;
  for (const auto& m : project.measurements) peaks += m.peaks.size();
  for (auto _ : state) {
    const FitResult r = fitProject(project);
    benchmark::DoNotOptimize(r.chi2);
    state.counters["converged"] = r.converged ? 1 : 0;
  }
  state.counters["peaks"] = static_cast<double>(peaks);
  state.counters["peak_MB"] = peakResidentMB();
}
BENCHMARK(BM_Fit10Parameters600Peaks)->Unit(benchmark::kMillisecond)->UseRealTime();

}  // namespace

BENCHMARK_MAIN();
