#include "ui/jobs/job_runner.h"

#include <QFutureWatcher>
#include <QPromise>
#include <QtConcurrent/QtConcurrentRun>
#include <algorithm>
#include <cmath>
#include <spdlog/spdlog.h>

#include "ui/jobs/job_board.h"

namespace finestra::ui {
namespace {

constexpr int kProgressSteps = 1000;

/// Runs on a pool thread: the job with its cancel flag and progress wired to the promise.
void runJob(QPromise<JobOutcome>& promise, const JobWork& work, const std::shared_ptr<std::atomic<bool>>& flag) {
  promise.setProgressRange(0, kProgressSteps);
  ProgressControl control;
  control.cancel = flag.get();
  // QPromise::setProgressValue is thread-safe and ignores values below the last one, so reports
  // from several core threads cannot make the bar go backwards.
  control.report = [&promise](double fraction) {
    promise.setProgressValue(static_cast<int>(std::lround(std::clamp(fraction, 0.0, 1.0) * kProgressSteps)));
  };
  JobOutcome outcome;
  try {
    control.throwIfCancelled();  // superseded before it started
    outcome.deliver = work(control);
    outcome.cancelled = control.cancelled();
  } catch (const Cancelled&) {
    outcome.cancelled = true;
  } catch (const std::exception& e) {
    outcome.error = QString::fromStdString(e.what());
    if (outcome.error.isEmpty()) outcome.error = QStringLiteral("computation failed");
  }
  promise.addResult(std::move(outcome));
}

}  // namespace

JobRunner::JobRunner(QString name, JobBoard* board, QObject* parent) : QObject(parent), name_(std::move(name)) {
  // A cancelled job may still be running to its next cancel poll when the next one starts: two
  // threads let the new job begin at once.
  pool_.setMaxThreadCount(2);
  if (board) board->add(this);
}

JobRunner::~JobRunner() {
  cancel();
  pool_.waitForDone();
}

quint64 JobRunner::start(JobWork work) {
  cancel();
  const quint64 job = ++current_;
  auto flag = std::make_shared<std::atomic<bool>>(false);
  cancelFlag_ = flag;
  auto* watcher = new QFutureWatcher<JobOutcome>(this);
  connect(watcher, &QFutureWatcherBase::progressValueChanged, this, [this, job](int value) {
    if (job == current_) Q_EMIT progress(static_cast<double>(value) / kProgressSteps);
  });
  connect(watcher, &QFutureWatcherBase::finished, this, [this, job, watcher] { onFinished(job, watcher); });
  watcher->setFuture(QtConcurrent::run(&pool_, runJob, std::move(work), std::move(flag)));
  setBusy(true);
  return job;
}

void JobRunner::cancel() {
  if (cancelFlag_) cancelFlag_->store(true);
}

void JobRunner::onFinished(quint64 job, QFutureWatcher<JobOutcome>* watcher) {
  const JobOutcome outcome = watcher->result();
  watcher->deleteLater();
  if (job != current_) {
    spdlog::debug("{}: dropped the outcome of superseded job {}", name_.toStdString(), job);
    Q_EMIT dropped(job);
    return;
  }
  setBusy(false);
  if (outcome.cancelled) {
    Q_EMIT cancelled(job);
  } else if (!outcome.error.isEmpty()) {
    spdlog::error("{} failed: {}", name_.toStdString(), outcome.error.toStdString());
    Q_EMIT failed(job, outcome.error);
  } else {
    if (outcome.deliver) outcome.deliver();
    Q_EMIT delivered(job);
  }
}

void JobRunner::setBusy(bool busy) {
  if (busy_ == busy) return;
  busy_ = busy;
  Q_EMIT busyChanged(busy);
}

}  // namespace finestra::ui
