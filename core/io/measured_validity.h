#pragma once
// One validity rule for measured values, shared by every reader (project file, peaks CSV, spectrum
// CSV) so that what one reader accepts the others accept too.
#include <string>

#include "core/units/spectral_units.h"

namespace finestra {

/// Smallest accepted peak uncertainty, as a frequency: 1 kHz, far below any optical line width of
/// these centres (the lifetime limit alone is ~100 MHz). Smaller values only square into overflowing
/// fit weights.
inline constexpr double kMinPeakSigmaGHz = 1e-6;
/// Largest accepted absolute optical frequency (3000 THz, 100 nm, 12 eV): beyond any ZPL of the
/// group-IV centres (400-620 THz) by far.
inline constexpr double kMaxOpticalFrequencyGHz = 3.0e6;
/// Largest accepted |detuning| from the ZPL (100 THz).
inline constexpr double kMaxDetuningGHz = 1.0e5;

/// Throws InputError naming `where` unless `position` on `unit` is a finite optical position within
/// the limits above (wavelengths and wavenumbers positive).
void checkMeasuredPosition(double position, SpectralUnit unit, const std::string& where);

/// Throws InputError naming `where` unless `sigma` (on the unit of the peak) is positive and at least
/// kMinPeakSigmaGHz wide at `position`.
void checkPeakSigma(double sigma, double position, SpectralUnit unit, const std::string& where);

}  // namespace finestra
