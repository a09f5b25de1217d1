#include "core/io/measured_validity.h"

#include <cmath>
#include <cstdio>

#include "core/common/errors.h"

namespace finestra {
namespace {

// Any reference frequency gives the same width; detunings are taken from a ZPL of 0.
constexpr double kReferenceGHz = 0.0;

std::string scientific(double v) {
  char buffer[32];
  std::snprintf(buffer, sizeof buffer, "%.3g", v);
  return buffer;
}

}  // namespace

void checkMeasuredPosition(double position, SpectralUnit unit, const std::string& where) {
  double frequency = 0;
  try {
    frequency = toAbsoluteGHz(position, unit, kReferenceGHz);  // throws for non-positive wavelengths
  } catch (const InputError& e) {
    throw InputError(where, e.message());
  }
  if (unit == SpectralUnit::GHzDetuning) {
    if (std::abs(frequency) > kMaxDetuningGHz)
      throw InputError(where, scientific(position) + " GHz is too far from the ZPL (at most " +
                                  scientific(kMaxDetuningGHz) + " GHz detuning)");
    return;
  }
  if (!(frequency > 0) || frequency > kMaxOpticalFrequencyGHz)
    throw InputError(where, scientific(position) + " " + std::string(spectralUnitKey(unit)) +
                                " is not an optical position (accepted: up to 3000 THz, 100 nm)");
}

void checkPeakSigma(double sigma, double position, SpectralUnit unit, const std::string& where) {
  if (!(sigma > 0)) throw InputError(where, "uncertainty must be positive");
  const double width = std::abs(toAbsoluteGHz(position + sigma, unit, kReferenceGHz) -
                                toAbsoluteGHz(position, unit, kReferenceGHz));
  if (!(width >= kMinPeakSigmaGHz))
    throw InputError(where, "uncertainty " + scientific(sigma) + " " + std::string(spectralUnitKey(unit)) +
                                " is below the smallest accepted (1 kHz as a frequency)");
}

}  // namespace finestra
