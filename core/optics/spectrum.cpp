#include "core/optics/spectrum.h"

#include <algorithm>
#include <cmath>
#include <numbers>

#include "core/common/errors.h"

namespace finestra {

std::vector<WeightedLine> weightLines(const CentreModel& model, const std::vector<ClassSolution>& classes,
                                      SpectrumKind kind) {
  const auto& c = model.setup().conditions;
  std::vector<WeightedLine> out;
  for (const ClassSolution& s : classes) {
    const ManifoldEigen& populated = kind == SpectrumKind::Emission ? s.excited : s.ground;
    const VectorXr pop = levelPopulations(populated.energies, c.temperatureK, c.populations);
    for (const OpticalLine& l : s.lines) {
      const int level = kind == SpectrumKind::Emission ? l.upper : l.lower;
      out.push_back({s.cls, &l, l.intensity * pop[level]});
    }
  }
  return out;
}

double lorentzian(double x, double fwhm) {
  const double g = 0.5 * fwhm;
  return g / (std::numbers::pi * (x * x + g * g));
}

SpectrumCurve computeSpectrum(const CentreModel& model, const std::vector<WeightedLine>& lines, SpectralUnit unit,
                              double from, double to, int points) {
  if (points < 2) throw InputError("points", "a spectrum needs at least 2 points");
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
  const double width = model.linewidthGHz();
  SpectrumCurve out;
  out.x.resize(static_cast<std::size_t>(points));
  out.y.assign(static_cast<std::size_t>(points), 0.0);
  for (int k = 0; k < points; ++k) {
    const double x = from + (to - from) * k / (points - 1);
    const double f = toAbsoluteGHz(x, unit, model.zplGHz());
    double sum = 0;
    for (const WeightedLine& w : lines) sum += w.weight * lorentzian(f - w.line->frequencyGHz, width);
    out.x[static_cast<std::size_t>(k)] = x;
    out.y[static_cast<std::size_t>(k)] = sum;
  }
  return out;
}

std::array<double, 2> autoRange(const CentreModel& model, const std::vector<WeightedLine>& lines, SpectralUnit unit) {
  double lo = model.zplGHz(), hi = model.zplGHz();
  for (const WeightedLine& w : lines) {
    lo = std::min(lo, w.line->frequencyGHz);
    hi = std::max(hi, w.line->frequencyGHz);
  }
  const double margin = std::max(5.0, 10.0 * model.linewidthGHz()) + 0.05 * (hi - lo);
  double a = fromAbsoluteGHz(lo - margin, unit, model.zplGHz());
  double b = fromAbsoluteGHz(hi + margin, unit, model.zplGHz());
  if (a > b) std::swap(a, b);
  return {a, b};
}

}  // namespace finestra
