#pragma once
// Background computation. The GUI hands a snapshot of the project (a copy) to a worker living on
// its own QThread; the worker builds the model, solves the current point, runs the active sweep
// and converts everything into plot data. Results come back by shared pointer through a queued
// signal. Each request gets a generation number: a newer request cancels the older one (through a
// std::atomic<bool> the core polls) and results of any older generation are dropped.
#include <QElapsedTimer>
#include <QObject>
#include <QPointer>
#include <QThread>
#include <atomic>
#include <memory>
#include <optional>

#include "core/project/project.h"
#include "core/optics/spectrum.h"
#include "core/sweep/sweep.h"
#include "ui/plot_data.h"

namespace finestra::ui {

struct ComputeRequest {
  Project project;
  int sweepIndex = 0;  ///< index into project.sweeps; a default magnitude sweep when there is none
  SpectralUnit unit = SpectralUnit::GHzDetuning;
  SpectrumKind spectrumKind = SpectrumKind::Emission;
  int spectrumPoints = 1500;
  quint64 generation = 0;
};

struct ComputeResult {
  quint64 generation = 0;
  Project project;
  SweepSpec sweep;
  std::shared_ptr<const CentreModel> model;  ///< null when the setup could not be built
  std::vector<ClassSolution> current;        ///< every selected class at the project's field
  std::optional<double> currentX;            ///< the project's field on the sweep axis
  SweepResult sweepResult;
  SpectrumCurve spectrum;
  LevelPlotData levels;
  LinePlotData lines;
  QVector<PeakMark> peaks;
  SpectrumPlotData spectrumPlot;
  double elapsedMs = 0;
  QString error;  ///< non-empty: the setup is invalid, message names the key at fault
};
using ResultPtr = std::shared_ptr<const ComputeResult>;

/// The sweep a request uses (the chosen one, or 0–3 T along the project's field when none).
SweepSpec activeSweep(const Project& project, int sweepIndex);

/// Runs one request on the calling thread. Throws Cancelled when `cancel` is set meanwhile.
ResultPtr computeNow(const ComputeRequest& request, const std::atomic<bool>* cancel = nullptr);

class ComputeWorker : public QObject {
  Q_OBJECT
public:
  explicit ComputeWorker(std::shared_ptr<const std::atomic<quint64>> latestGeneration)
      : latestGeneration_(std::move(latestGeneration)) {}
  void compute(const ComputeRequest& request, const std::shared_ptr<std::atomic<bool>>& cancel);

Q_SIGNALS:
  void finished(finestra::ui::ResultPtr result);
  void cancelled(quint64 generation);
  void progress(quint64 generation, double fraction);

private:
  std::shared_ptr<const std::atomic<quint64>> latestGeneration_;
};

class ComputeController : public QObject {
  Q_OBJECT
public:
  explicit ComputeController(QObject* parent = nullptr);
  ~ComputeController() override;

  /// Queues a computation of a copy of `request.project`; cancels the one in flight.
  quint64 request(ComputeRequest request);
  /// Cancels the computation in flight (if any).
  void cancel();
  bool busy() const { return busy_; }
  quint64 latestGeneration() const { return latest_->load(); }
  ResultPtr lastResult() const { return last_; }

Q_SIGNALS:
  void resultReady(finestra::ui::ResultPtr result);
  void computeCancelled(quint64 generation);
  void busyChanged(bool busy);
  void progress(double fraction);

private:
  void onFinished(const ResultPtr& result);
  void setBusy(bool busy);

  QThread thread_;
  QPointer<ComputeWorker> worker_;
  std::shared_ptr<std::atomic<quint64>> latest_ = std::make_shared<std::atomic<quint64>>(0);
  std::shared_ptr<std::atomic<bool>> cancelFlag_;
  ResultPtr last_;
  bool busy_ = false;
};

}  // namespace finestra::ui

Q_DECLARE_METATYPE(finestra::ui::ResultPtr)
