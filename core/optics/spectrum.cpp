#include "core/optics/spectrum.h"

#include <algorithm>
#include <cmath>
#include <numbers>

#include "core/centre/parameter_table.h"
#include "core/common/errors.h"
#include "core/thermal/level_widths.h"
#include "core/thermal/sideband.h"

namespace finestra {

std::vector<WeightedLine> weightLines(const CentreModel& model, const std::vector<ClassSolution>& classes,
                                      SpectrumKind kind) {
  const auto& c = model.setup().conditions;
  const double sidebandFraction = kind == SpectrumKind::Emission && c.phononSideband
                                      ? 1.0 - sidebandShape(model.setup().centre.parameters).debyeWaller
                                      : 0.0;
  std::vector<WeightedLine> out;
  for (const ClassSolution& s : classes) {
    const ManifoldEigen& populated = kind == SpectrumKind::Emission ? s.excited : s.ground;
    const VectorXr pop = levelPopulations(populated.energies, c.temperatureK, c.populations);
    const ClassThermal thermal = classThermal(model, s, c.temperatureK);
    for (std::size_t k = 0; k < s.lines.size(); ++k) {
      const OpticalLine& l = s.lines[k];
      const int level = kind == SpectrumKind::Emission ? l.upper : l.lower;
      out.push_back({s.cls, &l, l.intensity * pop[level], thermal.lineFwhmGHz[k] + c.extraBroadeningGHz,
                     sidebandFraction});
    }
  }
  return out;
}

double lorentzian(double x, double fwhm) {
  const double g = 0.5 * fwhm;
  return g / (std::numbers::pi * (x * x + g * g));
}

double spectrumDensity(const CentreModel& model, const std::vector<WeightedLine>& lines, double f) {
  bool anySideband = false;
  for (const WeightedLine& w : lines) anySideband = anySideband || w.sidebandFraction > 0;
  const SidebandShape shape = anySideband ? sidebandShape(model.setup().centre.parameters) : SidebandShape{};
  double sum = 0;
  for (const WeightedLine& w : lines) {
    const double d = f - w.line->frequencyGHz;
    sum += w.weight * (1.0 - w.sidebandFraction) * lorentzian(d, w.fwhmGHz);
    if (w.sidebandFraction > 0) sum += w.weight * w.sidebandFraction * sidebandDensity(d, shape);
  }
  return sum;
}

SpectrumCurve computeSpectrum(const CentreModel& model, const std::vector<WeightedLine>& lines, SpectralUnit unit,
                              double from, double to, int points) {
  if (points < 2) throw InputError("points", "a spectrum needs at least 2 points");
  requireInRange(quantity("spectrum.points"), points, "points");
  if (!std::isfinite(from) || !std::isfinite(to) || from == to)
    throw InputError("range", "spectrum range (from, to) must be two different finite numbers");
  for (double end : {from, to}) {
    try {
      (void)toAbsoluteGHz(end, unit, model.zplGHz());
    } catch (const InputError& e) {
      throw InputError("range", "spectrum range (from, to) end " + e.message() +
                                    " on unit " + std::string(spectralUnitKey(unit)));
    }
  }
  SpectrumCurve out;
  out.x.resize(static_cast<std::size_t>(points));
  out.y.assign(static_cast<std::size_t>(points), 0.0);
  for (int k = 0; k < points; ++k) {
    const double x = from + (to - from) * k / (points - 1);
    const double f = toAbsoluteGHz(x, unit, model.zplGHz());
    out.x[static_cast<std::size_t>(k)] = x;
    out.y[static_cast<std::size_t>(k)] = spectrumDensity(model, lines, f);
  }
  return out;
}

std::array<double, 2> autoRange(const CentreModel& model, const std::vector<WeightedLine>& lines, SpectralUnit unit) {
  double lo = model.zplGHz(), hi = model.zplGHz(), widest = model.linewidthGHz();
  bool sideband = false;
  for (const WeightedLine& w : lines) {
    lo = std::min(lo, w.line->frequencyGHz);
    hi = std::max(hi, w.line->frequencyGHz);
    widest = std::max(widest, w.fwhmGHz);
    sideband = sideband || w.sidebandFraction > 0;
  }
  if (sideband) {  // reach past the sideband feature
    const SidebandShape shape = sidebandShape(model.setup().centre.parameters);
    lo = std::min(lo, model.zplGHz() - shape.shiftGHz - 2.0 * shape.fwhmGHz);
  }
  // At extreme strain the phonon widths (∝ Δ³) can exceed the optical frequency itself; the
  // margin stays below half the lowest frequency so that every unit of the axis is defined.
  const double margin = std::min(std::max(5.0, 10.0 * widest) + 0.05 * (hi - lo), 0.5 * lo);
  double a = fromAbsoluteGHz(lo - margin, unit, model.zplGHz());
  double b = fromAbsoluteGHz(hi + margin, unit, model.zplGHz());
  if (a > b) std::swap(a, b);
  return {a, b};
}

}  // namespace finestra
