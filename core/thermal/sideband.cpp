#include "core/thermal/sideband.h"

#include <cmath>
#include <numbers>

#include "core/common/errors.h"
#include "core/units/constants.h"

namespace finestra {

SidebandShape sidebandShape(const CentreParameters& p) {
  SidebandShape s;
  s.debyeWaller = p.require(Param::DebyeWaller);
  if (!(s.debyeWaller > 0 && s.debyeWaller <= 1)) throw InputError("debye_waller", "must lie in (0, 1]");
  const double shiftMeV = p.require(Param::SidebandShiftMeV);
  const double fwhmMeV = p.require(Param::SidebandFwhmMeV);
  if (!(shiftMeV > 0)) throw InputError("sideband_shift_meV", "must be positive");
  if (!(fwhmMeV > 0)) throw InputError("sideband_fwhm_meV", "must be positive");
  s.shiftGHz = shiftMeV / constants::kMeVPerGHz;
  s.fwhmGHz = fwhmMeV / constants::kMeVPerGHz;
  return s;
}

double sidebandDensity(double detuningGHz, const SidebandShape& s) {
  const double sigma = s.fwhmGHz / (2.0 * std::sqrt(2.0 * std::numbers::ln2));
  const double z = (detuningGHz + s.shiftGHz) / sigma;
  return std::exp(-0.5 * z * z) / (sigma * std::sqrt(2.0 * std::numbers::pi));
}

}  // namespace finestra
