#include "ui/plot_data.h"

#include <algorithm>
#include <cmath>
#include <map>

#include "core/common/errors.h"
#include "core/optics/line_info.h"

namespace finestra::ui {

LevelPlotData makeLevelPlotData(const SweepResult& sweep) {
  LevelPlotData out;
  const QVector<double> x(sweep.x.begin(), sweep.x.end());
  for (const ClassSweep& c : sweep.classes) {
    for (Manifold m : {Manifold::Excited, Manifold::Ground}) {
      const Eigen::MatrixXd& levels = m == Manifold::Ground ? c.groundLevels : c.excitedLevels;
      for (Eigen::Index k = 0; k < levels.cols(); ++k) {
        LevelCurve curve{c.cls, m, static_cast<int>(k), x, QVector<double>(levels.rows())};
        for (Eigen::Index r = 0; r < levels.rows(); ++r) curve.y[static_cast<qsizetype>(r)] = levels(r, k);
        out.curves.push_back(std::move(curve));
      }
    }
  }
  return out;
}

LinePlotData makeLinePlotData(const SweepResult& sweep, double zplGHz, SpectralUnit unit) {
  LinePlotData out;
  out.unit = unit;
  for (const ClassSweep& c : sweep.classes)
    for (const auto& point : c.lines)
      for (const OpticalLine& l : point) out.maxIntensity = std::max(out.maxIntensity, l.intensity);
  if (out.maxIntensity <= 0) return out;
  constexpr int kBins = static_cast<int>(kIntensityBinFloors.size());
  for (const ClassSweep& c : sweep.classes) {
    std::array<LinePointGroup, 2 * kBins> groups;
    for (int g = 0; g < 2 * kBins; ++g) groups[static_cast<std::size_t>(g)] = {c.cls, g >= kBins, g % kBins, {}, {}};
    for (std::size_t k = 0; k < c.lines.size(); ++k) {
      const double x = sweep.x[k];
      for (const OpticalLine& l : c.lines[k]) {
        const double relative = l.intensity / out.maxIntensity;
        int bin = 0;
        while (bin < kBins && relative < kIntensityBinFloors[static_cast<std::size_t>(bin)]) ++bin;
        if (bin == kBins) continue;
        const bool parallel = axisParallelFraction(l, c.cls) >= 0.5;
        LinePointGroup& group = groups[static_cast<std::size_t>((parallel ? kBins : 0) + bin)];
        group.x.push_back(x);
        group.y.push_back(fromAbsoluteGHz(l.frequencyGHz, unit, zplGHz));
      }
    }
    for (auto& g : groups)
      if (!g.x.isEmpty()) out.groups.push_back(std::move(g));
  }
  return out;
}

QVector<PeakMark> makePeakMarks(const Project& project, const SweepSpec& sweep, const LabFrame& lab, double zplGHz,
                                SpectralUnit unit) {
  QVector<PeakMark> out;
  for (std::size_t m = 0; m < project.measurements.size(); ++m) {
    const MeasurementSet& set = project.measurements[m];
    const auto x = sweepCoordinate(sweep, lab, set.field);
    if (!x) continue;
    for (std::size_t p = 0; p < set.peaks.size(); ++p) {
      try {
        const PeakFrequency f = peakFrequency(set.peaks[p], zplGHz);
        const double y = fromAbsoluteGHz(f.frequencyGHz, unit, zplGHz);
        const double err = std::abs(unitPerGHz(f.frequencyGHz, unit, zplGHz)) * f.sigmaGHz;
        out.push_back({static_cast<int>(m), static_cast<int>(p), *x, y, err});
      } catch (const InputError&) {
        continue;  // a peak that cannot be placed (e.g. invalid after a ZPL override) is skipped
      }
    }
  }
  return out;
}

SpectrumPlotData makeSpectrumPlotData(const SpectrumCurve& curve, const std::vector<ClassSolution>& classes,
                                      const std::vector<WeightedLine>& weighted, double zplGHz, SpectralUnit unit) {
  SpectrumPlotData out;
  out.unit = unit;
  out.x = QVector<double>(curve.x.begin(), curve.x.end());
  out.y = QVector<double>(curve.y.begin(), curve.y.end());
  out.curveMax = out.y.isEmpty() ? 0 : *std::max_element(out.y.begin(), out.y.end());
  double maxWeight = 0;
  for (const WeightedLine& w : weighted) maxWeight = std::max(maxWeight, w.weight);
  for (const WeightedLine& w : weighted) {
    if (maxWeight <= 0 || w.weight < 1e-3 * maxWeight) continue;
    for (std::size_t c = 0; c < classes.size(); ++c) {
      const auto& lines = classes[c].lines;
      if (lines.empty() || w.line < lines.data() || w.line >= lines.data() + lines.size()) continue;
      const int index = static_cast<int>(w.line - lines.data());
      out.sticks.push_back({w.cls, static_cast<int>(c), index, fromAbsoluteGHz(w.line->frequencyGHz, unit, zplGHz),
                            out.curveMax * w.weight / maxWeight, QString::fromStdString(w.line->label())});
    }
  }
  return out;
}

void addMeasuredSpectrum(SpectrumPlotData& data, const MeasuredSpectrum& measured, double zplGHz) {
  data.measuredX.clear();
  data.measuredY.clear();
  data.measuredName = QString::fromStdString(measured.name);
  double maxSignal = 0;
  for (double s : measured.signal) maxSignal = std::max(maxSignal, s);
  const double scale = maxSignal > 0 && data.curveMax > 0 ? data.curveMax / maxSignal : 1.0;
  for (std::size_t i = 0; i < measured.position.size(); ++i) {
    try {
      const double f = toAbsoluteGHz(measured.position[i], measured.unit, zplGHz);
      data.measuredX.push_back(fromAbsoluteGHz(f, data.unit, zplGHz));
      data.measuredY.push_back(measured.signal[i] * scale);
    } catch (const InputError&) {
      continue;
    }
  }
}

}  // namespace finestra::ui
