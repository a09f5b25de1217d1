#pragma once
// The one way the ui layer runs a long computation (model results, fit, planner map and every view
// that comes next). A job is a function run on the runner's thread pool (QtConcurrent::run with a
// QPromise). It receives a ProgressControl: core polls its cancel flag (throwIfCancelled) and its
// progress reports go to the promise. It returns a delivery, a closure holding its result, which
// the runner calls on the GUI thread — only for the newest job, and only if that job was not
// cancelled; the outcome of a superseded job is dropped. start() cancels the job in flight and
// returns at once: the old job winds down on its pool thread while the new one runs, so the GUI
// thread never waits for a running job. A JobBoard lists every runner, so Esc cancels whatever runs.
#include <QObject>
#include <QString>
#include <QThreadPool>
#include <atomic>
#include <functional>
#include <memory>

#include "core/common/progress.h"

template <typename T>
class QFutureWatcher;

namespace finestra::ui {

class JobBoard;

/// Hands a finished job's result to the GUI thread (called there, at most once).
using JobDelivery = std::function<void()>;
/// The work of a job, run on a pool thread. It must not touch widgets; it polls `control` and
/// returns the delivery of its result. A Cancelled exception ends the job as cancelled, any other
/// exception as failed with its message.
using JobWork = std::function<JobDelivery(const ProgressControl& control)>;

/// How a job ended, as seen from the pool thread.
struct JobOutcome {
  JobDelivery deliver;
  bool cancelled = false;
  QString error;  ///< non-empty: the job threw
};

class JobRunner : public QObject {
  Q_OBJECT
public:
  /// `name` is used in log messages ("fit", "planner map"); `board` may be null (tests, headless).
  JobRunner(QString name, JobBoard* board, QObject* parent = nullptr);
  /// Cancels the running job and lets the pool finish its (cancelled) jobs: the only wait, at
  /// destruction, and it lasts until the next cancel poll of the core.
  ~JobRunner() override;

  /// Starts `work`, cancelling the job in flight (its outcome will be dropped). Returns the id of
  /// the new job immediately.
  quint64 start(JobWork work);
  /// Cancels the current job (if any); it reports cancelled() once it has stopped.
  void cancel();
  bool busy() const { return busy_; }
  quint64 currentJob() const { return current_; }
  const QString& name() const { return name_; }

Q_SIGNALS:
  void busyChanged(bool busy);
  void progress(double fraction);             ///< of the current job, 0..1
  void delivered(quint64 job);                ///< the current job's result was handed over
  void cancelled(quint64 job);                ///< the current job stopped because it was cancelled
  void failed(quint64 job, QString message);  ///< the current job threw
  void dropped(quint64 job);                  ///< a superseded job ended; its outcome was discarded

private:
  void onFinished(quint64 job, QFutureWatcher<JobOutcome>* watcher);
  void setBusy(bool busy);

  QString name_;
  QThreadPool pool_;
  quint64 current_ = 0;
  std::shared_ptr<std::atomic<bool>> cancelFlag_;
  bool busy_ = false;
};

}  // namespace finestra::ui
