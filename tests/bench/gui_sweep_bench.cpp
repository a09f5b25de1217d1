// Live-response budget of the desktop application (issue 3): a 2000-point field sweep of the four
// orientation classes recomputed by core and converted into plot data (levels, line map), as the
// worker does after every edit. Target: < 100 ms per iteration.
#include <benchmark/benchmark.h>

#include "core/io/project_file.h"
#include "core/project/model_setup.h"
#include "ui/plot_data.h"

namespace {

void BM_SweepToPlotData(benchmark::State& state) {
  finestra::Project project = finestra::readProjectFile(FINESTRA_SOURCE_DIR "/examples/membrane-vector-magnet.json");
  finestra::SweepSpec sweep = project.sweeps.front();
  sweep.points = static_cast<int>(state.range(0));
  for (auto _ : state) {
    const finestra::CentreModel model(finestra::makeModelSetup(project));  // rebuilt: an edit changes it
    const finestra::SweepResult result = finestra::runSweep(model, project, sweep);
    auto levels = finestra::ui::makeLevelPlotData(result);
    auto lines = finestra::ui::makeLinePlotData(result, model.zplGHz(), finestra::SpectralUnit::GHzDetuning);
    benchmark::DoNotOptimize(levels.curves.data());
    benchmark::DoNotOptimize(lines.groups.data());
  }
  state.counters["classes"] = static_cast<double>(project.classes.size());
}
BENCHMARK(BM_SweepToPlotData)->Arg(2000)->Unit(benchmark::kMillisecond)->UseRealTime();

}  // namespace

BENCHMARK_MAIN();
