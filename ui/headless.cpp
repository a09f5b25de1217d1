#include "ui/headless.h"

#include <QEventLoop>
#include <QFileInfo>
#include <qcustomplot.h>

#include "core/common/errors.h"
#include "core/io/peak_csv.h"
#include "ui/document.h"
#include "ui/figure_export.h"
#include "ui/jobs/job_runner.h"

namespace finestra::ui {

void runHeadlessExport(const HeadlessExport& job) {
  const ViewEntry* entry = findView(job.view);
  if (!entry) {
    QStringList keys;
    for (const ViewEntry& v : viewCatalogue()) keys << v.key;
    throw InputError("--export-view", "unknown view '" + job.view.toStdString() + "' (one of " + keys.join(", ").toStdString() + ")");
  }
  ProjectDocument document;
  document.open(job.project);
  if (!job.peaksCsv.isEmpty()) {
    const auto sets = readPeakCsv(job.peaksCsv.toStdString());
    document.edit("Import peaks", [&](Project& p) { p.measurements.insert(p.measurements.end(), sets.begin(), sets.end()); });
  }
  if (!job.spectrumCsv.isEmpty()) document.setMeasuredSpectrum(readSpectrumCsv(job.spectrumCsv.toStdString()));
  const int sweepCount = static_cast<int>(document.project().sweeps.size());
  if (job.display.sweepIndex < 0 || (job.display.sweepIndex >= sweepCount && job.display.sweepIndex != 0))
    throw InputError("--sweep", "index " + std::to_string(job.display.sweepIndex) + " but the project has " +
                                    std::to_string(sweepCount) + " sweeps (indices from 0)");
  ComputeRequest request;
  request.project = document.project();
  request.parts = entry->parts;
  request.sweepIndex = job.display.sweepIndex;
  request.unit = job.display.unit;
  request.spectrumKind = job.display.spectrumKind;
  const ResultPtr result = computeNow(request);
  if (!result->error.isEmpty()) throw InputError(job.project.toStdString(), result->error.toStdString());
  const ViewContext context{&document, nullptr};
  std::unique_ptr<ResultView> view = entry->make(context);
  view->applyDisplay(job.display);
  view->resize(job.width, job.height);
  view->showResult(result);
  if (!waitForViewJobs(*view)) throw InputError("--export-view", "view '" + job.view.toStdString() + "': its computation failed");
  const QString suffix = QFileInfo(job.out).suffix().toLower();
  if (suffix == "csv") {
    exportTableCsv(view->dataTable(), job.out);
    return;
  }
  if (!view->figure()) throw InputError("--export-view", "view '" + job.view.toStdString() + "' has no figure; use --out FILE.csv");
  exportFigure(*view->figure(), job.out, job.width, job.height);
}

bool waitForViewJobs(ResultView& view) {
  JobRunner* runner = view.ownJobs();
  if (!runner || !runner->busy()) return true;
  // The runner reports the end of its job through queued signals, so none can be missed between
  // the busy() check and exec().
  bool ok = false;
  QEventLoop loop;
  QObject::connect(runner, &JobRunner::delivered, &loop, [&] { ok = true; loop.quit(); });
  QObject::connect(runner, &JobRunner::cancelled, &loop, &QEventLoop::quit);
  QObject::connect(runner, &JobRunner::failed, &loop, &QEventLoop::quit);
  loop.exec();
  return ok;
}

}  // namespace finestra::ui
