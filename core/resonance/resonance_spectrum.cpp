#include "core/resonance/resonance_spectrum.h"

#include <algorithm>
#include <cmath>
#include <limits>
#include <string>

#include "core/common/errors.h"

namespace finestra {
namespace {

double weight(const MicrowaveTransition& t) { return t.strength * (t.populationLower - t.populationUpper); }

void validate(const ResonanceSpectrumRequest& r) {
  if (!std::isfinite(r.fwhmGHz) || r.fwhmGHz <= 0) throw InputError("--linewidth-MHz", "must be a finite number > 0");
  if (r.points < 2 || r.points > kMaxResonancePoints)
    throw InputError("--points", "must be between 2 and " + std::to_string(kMaxResonancePoints));
  if (!std::isfinite(r.fromGHz) || !std::isfinite(r.toGHz)) throw InputError("--from-GHz/--to-GHz", "must be finite");
}

}  // namespace

std::pair<double, double> resonanceAutoRange(const std::vector<ClassMicrowave>& classes, double fwhmGHz) {
  double strongest = 0;
  for (const auto& c : classes)
    for (const auto& t : c.transitions)
      if (std::isfinite(t.strength)) strongest = std::max(strongest, std::abs(weight(t)));
  double lo = std::numeric_limits<double>::infinity(), hi = -lo;
  for (const auto& c : classes)
    for (const auto& t : c.transitions)
      if (std::isfinite(t.strength) && std::abs(weight(t)) >= 1e-4 * strongest && strongest > 0) {
        lo = std::min(lo, t.frequencyGHz);
        hi = std::max(hi, t.frequencyGHz);
      }
  if (!(lo <= hi)) return {0.0, 1.0};
  return {std::max(0.0, lo - 10 * fwhmGHz), hi + 10 * fwhmGHz};
}

ResonanceSpectrum resonanceSpectrum(const std::vector<ClassMicrowave>& classes, const ResonanceSpectrumRequest& request) {
  validate(request);
  auto [from, to] = std::pair{request.fromGHz, request.toGHz};
  if (from == to) std::tie(from, to) = resonanceAutoRange(classes, request.fwhmGHz);
  if (!(to > from)) throw InputError("--from-GHz/--to-GHz", "the range must be increasing");
  const double halfWidthSquared = 0.25 * request.fwhmGHz * request.fwhmGHz;
  ResonanceSpectrum out;
  out.frequencyGHz.resize(static_cast<std::size_t>(request.points));
  out.signal.assign(static_cast<std::size_t>(request.points), 0.0);
  for (int k = 0; k < request.points; ++k)
    out.frequencyGHz[static_cast<std::size_t>(k)] = from + (to - from) * k / (request.points - 1);
  double strongest = 0;
  for (const auto& c : classes)
    for (const auto& t : c.transitions)
      if (std::isfinite(t.strength)) strongest = std::max(strongest, std::abs(weight(t)));
  for (const auto& c : classes)
    for (const auto& t : c.transitions) {
      if (!std::isfinite(t.strength)) continue;
      const double w = weight(t);
      // Lines below 1e-12 of the strongest change no printed digit of the curve: skipped for speed.
      if (std::abs(w) <= kNegligibleLineFraction * strongest) continue;
      for (std::size_t k = 0; k < out.signal.size(); ++k) {
        const double x = out.frequencyGHz[k] - t.frequencyGHz;
        out.signal[k] += w * halfWidthSquared / (x * x + halfWidthSquared);
      }
    }
  return out;
}

}  // namespace finestra
