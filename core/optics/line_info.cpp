#include "core/optics/line_info.h"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <limits>
#include <numbers>

#include "core/project/evaluate.h"

namespace finestra {
namespace {

std::string formatted(const char* format, double value) {
  char buffer[64];
  std::snprintf(buffer, sizeof buffer, format, value);
  return buffer;
}

std::string axisText(int cls) {
  const auto a = classAxisIndices(cls);
  std::string s = "[";
  for (int v : a) s += v < 0 ? "-1" : "1";
  return s + "]";
}

}  // namespace

double axisParallelFraction(const OpticalLine& line, int cls) {
  const double total = line.amplitudeCrystal.squaredNorm();
  if (total <= 1e-30) return std::nan("");
  const Vec3 axis = defectFrame(cls).row(2).transpose();
  const cplx along = axis.cast<cplx>().dot(line.amplitudeCrystal);
  return std::norm(along) / total;
}

std::string polarisationText(const OpticalLine& line, int cls) {
  const double parallel = axisParallelFraction(line, cls);
  if (std::isnan(parallel)) return "dark";
  if (parallel >= 0.5) return "\u2225 axis " + formatted("%.0f %%", 100 * parallel);
  return "\u22a5 axis " + formatted("%.0f %%", 100 * (1 - parallel));
}

std::string describeLine(int cls, const OpticalLine& line, double zplGHz) {
  const double f = line.frequencyGHz;
  std::string s = "class " + std::to_string(cls) + " (axis " + axisText(cls) + "), line " + line.label() + "\n";
  s += "excited level " + std::to_string(line.upper) + " \u2192 ground level " + std::to_string(line.lower) + "\n";
  s += formatted("%.3f GHz detuning", fromAbsoluteGHz(f, SpectralUnit::GHzDetuning, zplGHz)) + "\n";
  s += formatted("%.6f THz", fromAbsoluteGHz(f, SpectralUnit::THz, zplGHz)) + "\n";
  s += formatted("%.3f GHz absolute", f) + "\n";
  s += formatted("%.5f nm (vacuum)", fromAbsoluteGHz(f, SpectralUnit::NmVacuum, zplGHz)) + "\n";
  s += formatted("%.5f nm (air)", fromAbsoluteGHz(f, SpectralUnit::NmAir, zplGHz)) + "\n";
  s += formatted("%.5f meV", fromAbsoluteGHz(f, SpectralUnit::MeV, zplGHz)) + "\n";
  s += formatted("%.4f cm\u207b\u00b9", fromAbsoluteGHz(f, SpectralUnit::InvCm, zplGHz)) + "\n";
  s += formatted("intensity %.4f", line.intensity) + "\n";
  s += "polarisation " + polarisationText(line, cls);
  return s;
}

std::vector<LineCandidate> nearestLines(const std::vector<ClassSolution>& classes, double frequencyGHz,
                                        double sigmaGHz, std::size_t count) {
  std::vector<LineCandidate> all;
  for (const ClassSolution& s : classes)
    for (const OpticalLine& l : s.lines) {
      const double d = l.frequencyGHz - frequencyGHz;
      all.push_back({s.cls, l, d, sigmaGHz > 0 ? std::abs(d) / sigmaGHz : std::numeric_limits<double>::infinity()});
    }
  const std::size_t keep = std::min(count, all.size());
  std::partial_sort(all.begin(), all.begin() + static_cast<std::ptrdiff_t>(keep), all.end(),
                    [](const LineCandidate& a, const LineCandidate& b) { return std::abs(a.distanceGHz) < std::abs(b.distanceGHz); });
  all.resize(keep);
  return all;
}

PeakFrequency peakFrequency(const MeasuredPeak& peak, double zplGHz) {
  const double f = toAbsoluteGHz(peak.position, peak.unit, zplGHz);
  return {f, peak.sigma / std::abs(unitPerGHz(f, peak.unit, zplGHz))};
}

std::vector<LineCandidate> nearestLinesForPeak(const CentreModel& model, const Project& project,
                                               const MeasurementSet& measurement, const MeasuredPeak& peak,
                                               std::size_t count) {
  Project atMeasurement = project;
  atMeasurement.field = measurement.field;
  const auto classes = solveProjectClasses(model, atMeasurement);
  const PeakFrequency p = peakFrequency(peak, model.zplGHz());
  return nearestLines(classes, p.frequencyGHz, p.sigmaGHz, count);
}

std::optional<double> sweepCoordinate(const SweepSpec& sweep, const LabFrame& lab, const FieldSetting& field) {
  const Vec3 b = field.labVector(lab);
  switch (sweep.kind) {
    case SweepKind::Magnitude: return b.norm();
    case SweepKind::Angle: {
      const Vec3 n = sweep.planeNormalLab.normalized();
      const Vec3 u = (sweep.startLab - sweep.startLab.dot(n) * n).normalized();
      const Vec3 v = n.cross(u);
      if (b.norm() < 1e-15) return std::nullopt;
      double angle = std::atan2(b.dot(v), b.dot(u)) * 180.0 / std::numbers::pi;
      const double low = std::min(sweep.from, sweep.to);
      while (angle < low) angle += 360.0;
      while (angle >= low + 360.0) angle -= 360.0;
      return angle;
    }
    case SweepKind::Strain: return std::nullopt;
    case SweepKind::Temperature: return std::nullopt;  // a magnet setting has no temperature
  }
  return std::nullopt;
}

}  // namespace finestra
