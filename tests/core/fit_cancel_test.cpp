// The fit driver's cooperative cancel and its progress reports (used by the desktop worker).
#include <gtest/gtest.h>

#include <algorithm>
#include <atomic>
#include <mutex>
#include <vector>

#include "core/common/progress.h"
#include "core/fit/project_fit.h"
#include "core/io/project_file.h"

using namespace finestra;

namespace {
const std::string kFitDemo = FINESTRA_SOURCE_DIR "/examples/fit-demo.json";
}  // namespace

TEST(FitDriver, CancelFlagStopsTheFitAndProgressCountsStarts) {
  const Project project = readProjectFile(kFitDemo);
  std::atomic<bool> stop{true};
  FitOptions cancelled;
  cancelled.progress.cancel = &stop;
  EXPECT_THROW(fitProject(project, cancelled), Cancelled);

  FitOptions watched;
  watched.starts = 4;
  std::mutex mutex;
  std::vector<double> fractions;
  watched.progress.report = [&](double f) {
    const std::lock_guard lock(mutex);
    fractions.push_back(f);
  };
  fitProject(project, watched);
  std::sort(fractions.begin(), fractions.end());
  EXPECT_EQ(fractions, (std::vector<double>{0.25, 0.5, 0.75, 1.0}));
}
