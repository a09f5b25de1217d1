#pragma once
// Runs core's fitProject on a snapshot of the project in a worker QThread, with progress and
// cancel. One run at a time: starting a new one cancels the previous, whose result is dropped.
// "Assign only" is the same driver with no free parameter and one start: the assignment the
// current parameters give, with residuals and χ².
#include <QObject>
#include <QPointer>
#include <QString>
#include <atomic>
#include <memory>

#include "core/fit/project_fit.h"

class QThread;

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

/// Runs on the calling thread (headless export, tests). InputError for bad input.
FitOutcomePtr runFitNow(const Project& project, const FitOptions& options, bool assignOnly);

class FitRunner : public QObject {
  Q_OBJECT
public:
  explicit FitRunner(QObject* parent = nullptr);
  ~FitRunner() override;  ///< cancels and waits for the worker

  /// Starts a run on a copy of `project`; cancels the one in flight.
  void start(const Project& project, FitOptions options, bool assignOnly);
  void cancel();
  bool busy() const { return busy_; }
  /// Blocks until the worker thread (if any) has ended; queued signals still need the event loop.
  void wait();

Q_SIGNALS:
  void progress(double fraction);
  void finished(finestra::ui::FitOutcomePtr outcome);
  void cancelled();
  void failed(QString message);
  void busyChanged(bool busy);

private:
  void setBusy(bool busy);

  QPointer<QThread> worker_;
  std::shared_ptr<std::atomic<bool>> cancel_;
  quint64 generation_ = 0;
  bool busy_ = false;
};

}  // namespace finestra::ui

Q_DECLARE_METATYPE(finestra::ui::FitOutcomePtr)
