#pragma once
// Figure export without a window: loads a project, computes on the calling thread, fills the
// chosen view (from viewCatalogue()) and writes its figure (.png/.svg/.pdf) or data (.csv).
#include <QString>
#include <optional>

#include "ui/result_view.h"

namespace finestra::ui {

struct HeadlessExport {
  QString project;
  QString view = "lines";
  QString out;
  int width = 1400, height = 900;
  DisplaySettings display;
  QString peaksCsv;     ///< optional measured peaks to add before computing
  QString spectrumCsv;  ///< optional measured spectrum to overlay
};

/// Throws InputError naming the file, key or view at fault.
void runHeadlessExport(const HeadlessExport& job);

/// Runs the event loop until the view's own job (if one runs) has ended: for exporting without a
/// window and for tests, never inside the interactive application. Returns false when the job
/// failed or was cancelled.
bool waitForViewJobs(ResultView& view);

}  // namespace finestra::ui
