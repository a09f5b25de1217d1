#include "ui/fit/fit_runner.h"

namespace finestra::ui {

FitOptions assignOnlyOptions() {
  FitOptions options;
  options.free = std::vector<std::string>{};
  options.starts = 1;
  return options;
}

FitOutcomePtr runFitNow(const Project& project, const FitOptions& options, bool assignOnly) {
  auto outcome = std::make_shared<FitOutcome>();
  outcome->project = project;
  outcome->result = fitProject(project, options);
  outcome->assignOnly = assignOnly;
  return outcome;
}

}  // namespace finestra::ui
