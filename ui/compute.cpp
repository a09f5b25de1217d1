#include "ui/compute.h"

#include <spdlog/spdlog.h>

#include "core/common/errors.h"
#include "core/project/evaluate.h"
#include "core/optics/line_info.h"
#include "core/project/model_setup.h"

namespace finestra::ui {

SweepSpec activeSweep(const Project& project, int sweepIndex) {
  if (sweepIndex >= 0 && static_cast<std::size_t>(sweepIndex) < project.sweeps.size())
    return project.sweeps[static_cast<std::size_t>(sweepIndex)];
  SweepSpec fallback;
  fallback.name = "field magnitude 0-3 T";
  fallback.kind = SweepKind::Magnitude;
  fallback.from = 0;
  fallback.to = 3;
  fallback.points = 301;
  return fallback;
}

ResultPtr computeNow(const ComputeRequest& request, const std::atomic<bool>* cancel) {
  QElapsedTimer timer;
  timer.start();
  auto result = std::make_shared<ComputeResult>();
  result->generation = request.generation;
  result->project = request.project;
  result->sweep = activeSweep(request.project, request.sweepIndex);
  ProgressControl control;
  control.cancel = cancel;
  try {
    auto model = std::make_shared<const CentreModel>(makeModelSetup(request.project));
    control.throwIfCancelled();
    result->current = solveProjectClasses(*model, request.project);
    const LabFrame& lab = model->setup().lab;
    result->currentX = sweepCoordinate(result->sweep, lab, request.project.field);
    result->sweepResult = runSweep(*model, request.project, result->sweep, control);
    control.throwIfCancelled();
    const auto weighted = weightLines(*model, result->current, request.spectrumKind);
    const auto range = autoRange(*model, weighted, request.unit);
    result->spectrum = computeSpectrum(*model, weighted, request.unit, range[0], range[1], request.spectrumPoints);
    result->levels = makeLevelPlotData(result->sweepResult);
    result->lines = makeLinePlotData(result->sweepResult, model->zplGHz(), request.unit);
    result->peaks = makePeakMarks(request.project, result->sweep, lab, model->zplGHz(), request.unit);
    result->spectrumPlot =
        makeSpectrumPlotData(result->spectrum, result->current, weighted, model->zplGHz(), request.unit);
    result->model = std::move(model);
  } catch (const InputError& e) {
    result->error = QString::fromStdString(e.what());
  }
  result->elapsedMs = static_cast<double>(timer.nsecsElapsed()) * 1e-6;
  return result;
}

void ComputeWorker::compute(const ComputeRequest& request, const std::shared_ptr<std::atomic<bool>>& cancel) {
  if (request.generation < latestGeneration_->load() || cancel->load()) {
    Q_EMIT cancelled(request.generation);  // superseded before it started
    return;
  }
  try {
    Q_EMIT finished(computeNow(request, cancel.get()));
  } catch (const Cancelled&) {
    Q_EMIT cancelled(request.generation);
  } catch (const std::exception& e) {
    spdlog::error("computation failed: {}", e.what());
    auto failed = std::make_shared<ComputeResult>();
    failed->generation = request.generation;
    failed->project = request.project;
    failed->error = QString::fromStdString(e.what());
    Q_EMIT finished(failed);
  }
}

ComputeController::ComputeController(QObject* parent) : QObject(parent) {
  qRegisterMetaType<ResultPtr>("finestra::ui::ResultPtr");
  auto* worker = new ComputeWorker(latest_);  // owned by the thread: deleted on thread finish
  worker->moveToThread(&thread_);
  worker_ = worker;
  connect(&thread_, &QThread::finished, worker, &QObject::deleteLater);
  connect(worker, &ComputeWorker::finished, this, &ComputeController::onFinished, Qt::QueuedConnection);
  connect(
      worker, &ComputeWorker::cancelled, this,
      [this](quint64 generation) {
        Q_EMIT computeCancelled(generation);
        if (generation == latest_->load()) setBusy(false);
      },
      Qt::QueuedConnection);
  thread_.setObjectName("finestra-compute");
  thread_.start();
}

ComputeController::~ComputeController() {
  cancel();
  thread_.quit();
  thread_.wait();
}

quint64 ComputeController::request(ComputeRequest request) {
  cancel();
  const quint64 generation = latest_->load() + 1;
  latest_->store(generation);
  request.generation = generation;
  cancelFlag_ = std::make_shared<std::atomic<bool>>(false);
  setBusy(true);
  QMetaObject::invokeMethod(
      worker_, [worker = worker_, request = std::move(request), flag = cancelFlag_] {
        if (worker) worker->compute(request, flag);
      },
      Qt::QueuedConnection);
  return generation;
}

void ComputeController::cancel() {
  if (cancelFlag_) cancelFlag_->store(true);
}

void ComputeController::onFinished(const ResultPtr& result) {
  if (result->generation != latest_->load()) {
    spdlog::debug("dropped stale result of generation {}", result->generation);
    return;
  }
  last_ = result;
  setBusy(false);
  Q_EMIT resultReady(result);
}

void ComputeController::setBusy(bool busy) {
  if (busy_ == busy) return;
  busy_ = busy;
  Q_EMIT busyChanged(busy);
}

}  // namespace finestra::ui
