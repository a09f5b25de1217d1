#pragma once
// The fit as a job: core's fitProject on a snapshot of the project. "Assign only" is the same
// driver with no free parameter and one start: the assignment the current parameters give, with
// residuals and χ². The fit view runs it on its JobRunner (ui/jobs/job_runner.h) with progress
// and cancel; the model worker runs the assignment as Part::Assignment.
#include <memory>

#include "core/fit/project_fit.h"

namespace finestra::ui {

/// A finished run: the result and the project it was computed for.
struct FitOutcome {
  Project project;
  FitResult result;
  bool assignOnly = false;
};
using FitOutcomePtr = std::shared_ptr<const FitOutcome>;

/// The driver options of an assignment with the current parameters (no free parameter, one start).
FitOptions assignOnlyOptions();

/// Runs on the calling thread (a job, headless export, tests). InputError for bad input;
/// Cancelled when options.progress is cancelled meanwhile.
FitOutcomePtr runFitNow(const Project& project, const FitOptions& options, bool assignOnly);

}  // namespace finestra::ui
