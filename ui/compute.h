#pragma once
// Model results for the views. A request carries a snapshot of the project and the parts the
// shown (or exported) views ask for; the worker computes only those parts and what they are made
// from, on a JobRunner (ui/jobs/job_runner.h): a newer request cancels the older one and results
// of older requests are dropped. Results come back by shared pointer.
#include <QObject>
#include <QString>
#include <memory>
#include <optional>

#include "core/fit/project_fit.h"
#include "core/project/project.h"
#include "core/optics/spectrum.h"
#include "core/sweep/sweep.h"
#include "ui/jobs/job_runner.h"
#include "ui/plot_data.h"

namespace finestra::ui {

class JobBoard;

/// The pieces of a model result a view can ask for. The model itself is always built.
enum class Part : unsigned {
  Solution = 1u << 0,    ///< every selected class solved at the project's field
  Sweep = 1u << 1,       ///< the active sweep, the current point on its axis and the measured peaks on it
  LevelFans = 1u << 2,   ///< tracked levels ready to draw (made from Sweep)
  LineMap = 1u << 3,     ///< line points ready to draw (made from Sweep)
  Spectrum = 1u << 4,    ///< simulated spectrum and its sticks (made from Solution)
  Assignment = 1u << 5,  ///< measured peaks matched to lines with the current parameters
};
Q_DECLARE_FLAGS(Parts, Part)
}  // namespace finestra::ui
// At global scope, like Qt's own: inside the namespace they would hide QCustomPlot's operators.
Q_DECLARE_OPERATORS_FOR_FLAGS(finestra::ui::Parts)
namespace finestra::ui {

inline constexpr Parts kAllParts = Parts(Part::Solution) | Part::Sweep | Part::LevelFans | Part::LineMap |
                                   Part::Spectrum | Part::Assignment;

/// `parts` together with every part they are made from.
Parts withInputs(Parts parts);

struct ComputeRequest {
  Project project;
  Parts parts = kAllParts;
  int sweepIndex = 0;  ///< index into project.sweeps; a default magnitude sweep when there is none
  SpectralUnit unit = SpectralUnit::GHzDetuning;
  SpectrumKind spectrumKind = SpectrumKind::Emission;
  int spectrumPoints = 1500;
  quint64 generation = 0;
};

/// The active sweep solved, with what the sweep plots place on it.
struct SweepPart {
  SweepSpec spec;
  SweepResult result;
  std::optional<double> currentX;  ///< the project's field on the sweep axis
  QVector<PeakMark> peaks;         ///< measured peaks that lie on the sweep's axis
};

struct SpectrumPart {
  SpectrumCurve curve;
  SpectrumPlotData plot;
};

/// One model result: the parts asked for (see `parts`), each present exactly when its flag is set.
struct ComputeResult {
  quint64 generation = 0;
  Project project;
  Parts parts;                                ///< the parts computed (asked for + their inputs)
  std::shared_ptr<const CentreModel> model;   ///< null when the setup could not be built
  std::vector<ClassSolution> current;         ///< Part::Solution
  std::optional<SweepPart> sweep;             ///< Part::Sweep
  std::optional<LevelPlotData> levels;        ///< Part::LevelFans
  std::optional<LinePlotData> lines;          ///< Part::LineMap
  std::optional<SpectrumPart> spectrum;       ///< Part::Spectrum
  std::optional<FitResult> assignment;        ///< Part::Assignment, when the project has measured peaks
  QString assignmentError;                    ///< why the assignment could not be made
  double elapsedMs = 0;
  QString error;  ///< non-empty: the setup is invalid, message names the key at fault
};
using ResultPtr = std::shared_ptr<const ComputeResult>;

/// The sweep a request uses (the chosen one, or 0–3 T along the project's field when none).
SweepSpec activeSweep(const Project& project, int sweepIndex);

/// Runs one request on the calling thread. Throws Cancelled when `control` is cancelled meanwhile.
ResultPtr computeNow(const ComputeRequest& request, const ProgressControl& control = {});

/// Model results for the main window: one job at a time on a JobRunner, newest request wins.
class ComputeController : public QObject {
  Q_OBJECT
public:
  explicit ComputeController(JobBoard* board = nullptr, QObject* parent = nullptr);

  /// Queues a computation of a copy of `request.project`; cancels the one in flight. Returns the
  /// request's generation at once.
  quint64 request(ComputeRequest request);
  /// Cancels the computation in flight (if any).
  void cancel() { runner_.cancel(); }
  bool busy() const { return runner_.busy(); }
  quint64 latestGeneration() const { return runner_.currentJob(); }
  ResultPtr lastResult() const { return last_; }
  JobRunner& runner() { return runner_; }

Q_SIGNALS:
  void resultReady(finestra::ui::ResultPtr result);
  void computeCancelled(quint64 generation);
  void busyChanged(bool busy);
  void progress(double fraction);

private:
  JobRunner runner_;
  ResultPtr last_;
};

}  // namespace finestra::ui

Q_DECLARE_METATYPE(finestra::ui::ResultPtr)
