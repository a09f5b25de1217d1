#include "core/thermal/phonon_rates.h"

#include <cmath>

#include "core/common/errors.h"
#include "core/units/constants.h"

namespace finestra {

double boseEinstein(double splittingGHz, double temperatureK) {
  if (temperatureK <= 0) return 0.0;
  const double x = splittingGHz * constants::kKelvinPerGHz / temperatureK;  // hΔ/kT
  if (x > 700) return 0.0;                                                  // exp would overflow
  return 1.0 / std::expm1(x);
}

PhononConstants phononConstants(const CentreParameters& p, Manifold m) {
  const bool ground = m == Manifold::Ground;
  PhononConstants c;
  c.chiPerSGHz3 = p.require(ground ? Param::PhononChiG : Param::PhononChiU);
  c.higherOrderPerS = p.require(ground ? Param::HigherOrderCoefG : Param::HigherOrderCoefU);
  c.higherOrderPower = p.require(ground ? Param::HigherOrderPowerG : Param::HigherOrderPowerU);
  const auto key = [&](Param id) { return std::string(paramInfo(id).key); };
  if (c.chiPerSGHz3 < 0) throw InputError(key(ground ? Param::PhononChiG : Param::PhononChiU), "must not be negative");
  if (c.higherOrderPerS < 0)
    throw InputError(key(ground ? Param::HigherOrderCoefG : Param::HigherOrderCoefU), "must not be negative");
  if (c.higherOrderPower < 0 || c.higherOrderPower > 20)
    throw InputError(key(ground ? Param::HigherOrderPowerG : Param::HigherOrderPowerU), "must lie between 0 and 20");
  return c;
}

BranchRates branchRates(const PhononConstants& c, double splittingGHz, double temperatureK) {
  if (!std::isfinite(temperatureK) || temperatureK < 0)
    throw InputError("temperature_K", "must be a finite, non-negative number");
  if (!std::isfinite(splittingGHz) || splittingGHz < 0)
    throw InputError("splitting", "branch splitting must be finite and non-negative");
  BranchRates r;
  r.splittingGHz = splittingGHz;
  // Δ → 0 with T > 0: Δ³ n → Δ² kT/h → 0, so both rates vanish continuously.
  if (splittingGHz > 0) {
    const double n = boseEinstein(splittingGHz, temperatureK);
    const double base = c.chiPerSGHz3 * splittingGHz * splittingGHz * splittingGHz;
    r.upPerS = base * n;
    r.downPerS = base * (n + 1.0);
  }
  if (c.higherOrderPerS > 0 && temperatureK > 0) {
    const double extra = c.higherOrderPerS * std::pow(temperatureK, c.higherOrderPower);
    r.upPerS += extra;
    r.downPerS += extra;
  }
  return r;
}

}  // namespace finestra
