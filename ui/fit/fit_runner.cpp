#include "ui/fit/fit_runner.h"

#include <QThread>

#include "core/common/errors.h"

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

FitRunner::FitRunner(QObject* parent) : QObject(parent) {
  qRegisterMetaType<FitOutcomePtr>("finestra::ui::FitOutcomePtr");
}

FitRunner::~FitRunner() {
  cancel();
  wait();
}

void FitRunner::start(const Project& project, FitOptions options, bool assignOnly) {
  cancel();
  cancel_ = std::make_shared<std::atomic<bool>>(false);
  const quint64 generation = ++generation_;
  const std::shared_ptr<std::atomic<bool>> flag = cancel_;
  // Each worker owns its snapshot and flag; a superseded one finishes quietly (generation check).
  QThread* thread = QThread::create([this, project, options, assignOnly, flag, generation]() mutable {
    options.progress.cancel = flag.get();
    options.progress.report = [this, generation](double fraction) {
      QMetaObject::invokeMethod(this, [this, generation, fraction] {
        if (generation == generation_) Q_EMIT progress(fraction);
      }, Qt::QueuedConnection);
    };
    try {
      FitOutcomePtr outcome = runFitNow(project, options, assignOnly);
      QMetaObject::invokeMethod(this, [this, generation, outcome] {
        if (generation == generation_) Q_EMIT finished(outcome);
      }, Qt::QueuedConnection);
    } catch (const Cancelled&) {
      QMetaObject::invokeMethod(this, [this, generation] {
        if (generation == generation_) Q_EMIT cancelled();
      }, Qt::QueuedConnection);
    } catch (const std::exception& e) {
      const QString message = QString::fromStdString(e.what());
      QMetaObject::invokeMethod(this, [this, generation, message] {
        if (generation == generation_) Q_EMIT failed(message);
      }, Qt::QueuedConnection);
    }
  });
  connect(thread, &QThread::finished, thread, &QObject::deleteLater);
  connect(thread, &QThread::finished, this, [this, generation] {
    if (generation == generation_) setBusy(false);
  });
  if (worker_) worker_->wait();  // the previous run was cancelled: it stops at its next round
  worker_ = thread;
  setBusy(true);
  thread->start();
}

void FitRunner::cancel() {
  if (cancel_) cancel_->store(true);
}

void FitRunner::wait() {
  if (worker_) worker_->wait();
}

void FitRunner::setBusy(bool busy) {
  if (busy_ == busy) return;
  busy_ = busy;
  Q_EMIT busyChanged(busy);
}

}  // namespace finestra::ui
