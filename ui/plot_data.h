#pragma once
// Conversion of core results into ready-to-draw series. Pure functions of core output: no widget
// is needed, so the benchmark and the tests call them directly. No physics is computed here;
// frequencies are only re-expressed on the chosen spectral axis.
#include <QString>
#include <QVector>
#include <array>
#include <optional>

#include "core/io/spectrum_csv.h"
#include "core/optics/spectrum.h"
#include "core/sweep/sweep.h"

namespace finestra::ui {

/// One tracked level of one class in one manifold along the sweep.
struct LevelCurve {
  int cls = 0;
  Manifold manifold = Manifold::Ground;
  int level = 0;  ///< tracked identity: colour key that survives crossings
  QVector<double> x, y;
};

struct LevelPlotData {
  QVector<LevelCurve> curves;
};

LevelPlotData makeLevelPlotData(const SweepResult& sweep);

/// Relative-intensity classes of line points: bin 0 strongest. Points weaker than the last
/// threshold (relative to the strongest line of the sweep) are left out.
inline constexpr std::array<double, 4> kIntensityBinFloors{0.4, 0.12, 0.03, 0.004};

/// Points of one class, one polarisation character and one intensity bin.
struct LinePointGroup {
  int cls = 0;
  bool axisParallel = false;  ///< dipole mostly along the defect axis
  int bin = 0;
  QVector<double> x, y;
};

struct LinePlotData {
  SpectralUnit unit = SpectralUnit::GHzDetuning;
  QVector<LinePointGroup> groups;
  double maxIntensity = 0;
};

/// Line positions on `unit` (detuning from `zplGHz`) along the sweep, grouped for drawing.
LinePlotData makeLinePlotData(const SweepResult& sweep, double zplGHz, SpectralUnit unit);

/// A measured peak placed on a sweep plot.
struct PeakMark {
  int measurement = 0, peak = 0;
  double x = 0, y = 0, yError = 0;
};

/// Peaks of every measurement that has a position on the sweep's axis, on `unit`.
QVector<PeakMark> makePeakMarks(const Project& project, const SweepSpec& sweep, const LabFrame& lab,
                                double zplGHz, SpectralUnit unit);

/// A stick of the simulated spectrum: one line at the current point.
struct Stick {
  int cls = 0;
  int classIndex = 0, lineIndex = 0;  ///< into the current class solutions
  double x = 0, height = 0;
  QString label;
};

struct SpectrumPlotData {
  SpectralUnit unit = SpectralUnit::GHzDetuning;
  QVector<double> x, y;
  QVector<Stick> sticks;  ///< heights scaled so that the tallest equals the curve maximum
  double curveMax = 0;
  QVector<double> measuredX, measuredY;  ///< measured spectrum scaled to curveMax, on `unit`
  QString measuredName;
};

/// Spectrum and sticks from the core curve and weighted lines of `classes`.
SpectrumPlotData makeSpectrumPlotData(const SpectrumCurve& curve, const std::vector<ClassSolution>& classes,
                                      const std::vector<WeightedLine>& weighted, double zplGHz, SpectralUnit unit);
/// Adds a measured spectrum converted to the plot's unit (points that cannot be converted dropped).
void addMeasuredSpectrum(SpectrumPlotData& data, const MeasuredSpectrum& measured, double zplGHz);

}  // namespace finestra::ui
