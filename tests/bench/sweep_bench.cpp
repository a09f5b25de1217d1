// The core half of the desktop sweep (gui_sweep_bench.cpp adds the conversion to plot data and
// needs the Qt build): a 2000-point field sweep of the four orientation classes of the bundled
// example, levels followed through crossings and lines labelled, as the worker runs it after an edit.
#include <benchmark/benchmark.h>

#include <sys/resource.h>

#include "core/io/project_file.h"
#include "core/project/model_setup.h"
#include "core/sweep/sweep.h"

namespace {

void BM_SweepCore(benchmark::State& state) {
  finestra::Project project = finestra::readProjectFile(FINESTRA_SOURCE_DIR "/examples/membrane-vector-magnet.json");
  finestra::SweepSpec sweep = project.sweeps.front();
  sweep.points = static_cast<int>(state.range(0));
  for (auto _ : state) {
    const finestra::CentreModel model(finestra::makeModelSetup(project));  // rebuilt: an edit changes it
    const finestra::SweepResult result = finestra::runSweep(model, project, sweep);
    benchmark::DoNotOptimize(result.classes.data());
  }
  rusage usage{};
  getrusage(RUSAGE_SELF, &usage);
  state.counters["peak_MB"] = static_cast<double>(usage.ru_maxrss) / 1024.0;
  state.counters["classes"] = static_cast<double>(project.classes.size());
}
BENCHMARK(BM_SweepCore)->Arg(2000)->Unit(benchmark::kMillisecond)->UseRealTime();

}  // namespace

BENCHMARK_MAIN();
