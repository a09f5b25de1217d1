#pragma once
// Spectral axes and conversions between them. Internally every optical frequency is an absolute
// frequency in GHz; detuning is measured from a reference (the centre's ZPL).
#include <string>
#include <string_view>
#include <vector>

namespace finestra {

enum class SpectralUnit {
  GHzAbsolute,  ///< "GHz": absolute optical frequency in GHz
  GHzDetuning,  ///< "GHz_detuning": frequency minus the reference, GHz
  THz,          ///< "THz"
  NmVacuum,     ///< "nm_vac": vacuum wavelength
  NmAir,        ///< "nm_air": wavelength in standard dry air (Edlén 1966)
  MeV,          ///< "meV": photon energy
  InvCm,        ///< "cm-1": vacuum wavenumber
};

/// File/CLI key of a unit ("GHz", "THz", "nm_vac", ...).
std::string_view spectralUnitKey(SpectralUnit unit);
/// Axis label for plots and tables, e.g. "Vacuum wavelength (nm)".
std::string spectralUnitLabel(SpectralUnit unit);
/// Parses a unit key; throws InputError naming `where` for an unknown key.
SpectralUnit parseSpectralUnit(std::string_view key, const std::string& where);
const std::vector<SpectralUnit>& allSpectralUnits();

/// Converts a position on `unit` to absolute frequency (GHz). `referenceGHz` is used for detuning.
/// Throws InputError for non-positive wavelengths/frequencies or non-finite values.
double toAbsoluteGHz(double value, SpectralUnit unit, double referenceGHz);
/// Converts an absolute frequency (GHz) to a position on `unit`.
double fromAbsoluteGHz(double frequencyGHz, SpectralUnit unit, double referenceGHz);
/// d(position)/d(frequency) at a frequency: converts a frequency uncertainty to the unit's.
double unitPerGHz(double frequencyGHz, SpectralUnit unit, double referenceGHz);

/// Refractive index of standard dry air (15 °C, 101.325 kPa, 0.03 % CO2) at a vacuum wavelength,
/// Edlén, Metrologia 2, 71 (1966), dispersion formula for standard air.
double airRefractiveIndex(double vacuumWavelengthNm);
double vacuumToAirNm(double vacuumNm);
/// Inverse of vacuumToAirNm by fixed-point iteration (converges to 1e-12 nm in a few steps).
double airToVacuumNm(double airNm);

}  // namespace finestra
