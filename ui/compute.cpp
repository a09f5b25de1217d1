#include "ui/compute.h"

#include <QElapsedTimer>

#include "core/common/errors.h"
#include "core/project/evaluate.h"
#include "core/optics/line_info.h"
#include "core/project/model_setup.h"
#include "ui/fit/fit_runner.h"

namespace finestra::ui {
namespace {

SweepPart computeSweepPart(const CentreModel& model, const ComputeRequest& request, const ProgressControl& control) {
  SweepPart part;
  part.spec = activeSweep(request.project, request.sweepIndex);
  const LabFrame& lab = model.setup().lab;
  part.currentX = sweepCoordinate(part.spec, lab, request.project.field);
  part.result = runSweep(model, request.project, part.spec, control);
  part.peaks = makePeakMarks(request.project, part.spec, lab, model.zplGHz(), request.unit);
  return part;
}

SpectrumPart computeSpectrumPart(const CentreModel& model, const std::vector<ClassSolution>& current,
                                 const ComputeRequest& request) {
  const auto weighted = weightLines(model, current, request.spectrumKind);
  const auto range = autoRange(model, weighted, request.unit);
  SpectrumPart part;
  part.curve = computeSpectrum(model, weighted, request.unit, range[0], range[1], request.spectrumPoints);
  part.plot = makeSpectrumPlotData(part.curve, current, weighted, model.zplGHz(), request.unit);
  return part;
}

/// The assignment with the current parameters: core's fit driver with nothing free and one start.
void computeAssignment(ComputeResult& result, const ProgressControl& control) {
  if (result.project.measurements.empty()) return;
  FitOptions options = assignOnlyOptions();
  options.progress.cancel = control.cancel;
  try {
    result.assignment = fitProject(result.project, options);
  } catch (const InputError& e) {
    result.assignmentError = QString::fromStdString(e.what());
  }
}

}  // namespace

Parts withInputs(Parts parts) {
  if (parts & (Part::LevelFans | Part::LineMap)) parts |= Part::Sweep;
  if (parts & Part::Spectrum) parts |= Part::Solution;
  return parts;
}

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

ResultPtr computeNow(const ComputeRequest& request, const ProgressControl& control) {
  QElapsedTimer timer;
  timer.start();
  auto result = std::make_shared<ComputeResult>();
  result->generation = request.generation;
  result->project = request.project;
  const Parts parts = withInputs(request.parts);
  try {
    auto model = std::make_shared<const CentreModel>(makeModelSetup(request.project));
    control.throwIfCancelled();
    if (parts & Part::Solution) result->current = solveProjectClasses(*model, request.project);
    if (parts & Part::Sweep) result->sweep = computeSweepPart(*model, request, control);
    control.throwIfCancelled();
    if (parts & Part::LevelFans) result->levels = makeLevelPlotData(result->sweep->result);
    if (parts & Part::LineMap)
      result->lines = makeLinePlotData(result->sweep->result, model->zplGHz(), request.unit);
    if (parts & Part::Spectrum) result->spectrum = computeSpectrumPart(*model, result->current, request);
    if (parts & Part::Assignment) computeAssignment(*result, control);
    result->model = std::move(model);
    result->parts = parts;
  } catch (const InputError& e) {
    result->error = QString::fromStdString(e.what());
  }
  result->elapsedMs = static_cast<double>(timer.nsecsElapsed()) * 1e-6;
  return result;
}

ComputeController::ComputeController(JobBoard* board, QObject* parent)
    : QObject(parent), runner_(QStringLiteral("model result"), board) {
  qRegisterMetaType<ResultPtr>("finestra::ui::ResultPtr");
  connect(&runner_, &JobRunner::busyChanged, this, &ComputeController::busyChanged);
  connect(&runner_, &JobRunner::progress, this, &ComputeController::progress);
  connect(&runner_, &JobRunner::cancelled, this, &ComputeController::computeCancelled);
  connect(&runner_, &JobRunner::failed, this, [this](quint64 generation, const QString& message) {
    // Not an input error (those come back inside the result): report it like one, never crash.
    auto failed = std::make_shared<ComputeResult>();
    failed->generation = generation;
    failed->error = message;
    last_ = failed;
    Q_EMIT resultReady(failed);
  });
}

quint64 ComputeController::request(ComputeRequest request) {
  // The job id is the generation: the runner hands over only the newest job's result.
  const quint64 generation = runner_.currentJob() + 1;
  request.generation = generation;
  runner_.start([this, request = std::move(request)](const ProgressControl& control) -> JobDelivery {
    ResultPtr result = computeNow(request, control);
    return [this, result] {
      last_ = result;
      Q_EMIT resultReady(result);
    };
  });
  return generation;
}

}  // namespace finestra::ui
