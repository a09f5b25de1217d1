#include "ui/fit/peak_labels.h"

#include "core/common/errors.h"
#include "core/fit/peak_model.h"

namespace finestra::ui {

QString peakLabelText(const std::string& lineLabel, int cls) {
  return peakLabelText(QString::fromStdString(lineLabel), cls);
}

QString peakLabelText(const QString& lineLabel, int cls) { return lineLabel + QStringLiteral("\u00b7cl%1").arg(cls); }

QVector<PeakLabel> labelsOfFit(const FitResult& result) {
  QVector<PeakLabel> labels;
  for (const FittedPeak& p : result.peaks)
    if (p.line && !p.label.empty()) labels.push_back({p.measurement, p.peak, peakLabelText(p.label, p.line->cls)});
  return labels;
}

QVector<PeakLabel> pinnedLabels(const Project& project) {
  QVector<PeakLabel> labels;
  bool anyPinned = false;
  for (const MeasurementSet& set : project.measurements)
    for (const MeasuredPeak& peak : set.peaks) anyPinned = anyPinned || peak.assign.has_value();
  if (!anyPinned) return labels;
  try {
    const FitProblem problem = prepareFitProblem(project, std::vector<std::string>{});
    const CentreModel model(fitStateSetup(problem.start, problem.baseSetup));
    for (const PreparedPeak& peak : problem.peaks) {
      if (!peak.pinned) continue;
      const ClassSolution solution = model.solve(peak.pinned->cls, setFieldCrystal(problem, problem.start, peak.set));
      for (const auto& line : solution.lines)
        if (line.upper == peak.pinned->upper && line.lower == peak.pinned->lower)
          // The parts of OpticalLine::label(), joined here as a QString (GCC 12 misreads the
          // inlined std::string concatenation as an overlapping memcpy: -Wrestrict).
          labels.push_back({peak.set, peak.peak, peakLabelText(QChar(line.parent) + QString::number(line.subIndex), peak.pinned->cls)});
    }
  } catch (const InputError&) {
    return {};
  }
  return labels;
}

}  // namespace finestra::ui
