#include "core/units/spectral_units.h"

#include <cmath>

#include "core/common/errors.h"
#include "core/units/constants.h"

namespace finestra {
namespace {
constexpr double kNmGHz = constants::kSpeedOfLight;  // λ[nm] * ν[GHz] = c[m/s]

void requireFinite(double value, const char* what) {
  if (!std::isfinite(value)) throw InputError(what, "value is not a finite number");
}
}  // namespace

std::string_view spectralUnitKey(SpectralUnit unit) {
  switch (unit) {
    case SpectralUnit::GHzAbsolute: return "GHz";
    case SpectralUnit::GHzDetuning: return "GHz_detuning";
    case SpectralUnit::THz: return "THz";
    case SpectralUnit::NmVacuum: return "nm_vac";
    case SpectralUnit::NmAir: return "nm_air";
    case SpectralUnit::MeV: return "meV";
    case SpectralUnit::InvCm: return "cm-1";
  }
  return "GHz";
}

std::string spectralUnitLabel(SpectralUnit unit) {
  switch (unit) {
    case SpectralUnit::GHzAbsolute: return "Frequency (GHz)";
    case SpectralUnit::GHzDetuning: return "Detuning from ZPL (GHz)";
    case SpectralUnit::THz: return "Frequency (THz)";
    case SpectralUnit::NmVacuum: return "Vacuum wavelength (nm)";
    case SpectralUnit::NmAir: return "Air wavelength (nm)";
    case SpectralUnit::MeV: return "Photon energy (meV)";
    case SpectralUnit::InvCm: return "Wavenumber (cm\u207b\u00b9)";
  }
  return {};
}

const std::vector<SpectralUnit>& allSpectralUnits() {
  static const std::vector<SpectralUnit> units{
      SpectralUnit::GHzDetuning, SpectralUnit::GHzAbsolute, SpectralUnit::THz, SpectralUnit::NmVacuum,
      SpectralUnit::NmAir,       SpectralUnit::MeV,         SpectralUnit::InvCm};
  return units;
}

SpectralUnit parseSpectralUnit(std::string_view key, const std::string& where) {
  for (SpectralUnit u : allSpectralUnits())
    if (spectralUnitKey(u) == key) return u;
  throw InputError(where, "unknown spectral unit '" + std::string(key) +
                              "' (expected GHz, GHz_detuning, THz, nm_vac, nm_air, meV or cm-1)");
}

double airRefractiveIndex(double vacuumWavelengthNm) {
  const double sigma2 = std::pow(1e3 / vacuumWavelengthNm, 2);  // (1/λ in µm⁻¹)²
  return 1.0 + 1e-8 * (8342.13 + 2406030.0 / (130.0 - sigma2) + 15997.0 / (38.9 - sigma2));
}

double vacuumToAirNm(double vacuumNm) { return vacuumNm / airRefractiveIndex(vacuumNm); }

double airToVacuumNm(double airNm) {
  double vacuum = airNm;
  for (int i = 0; i < 8; ++i) vacuum = airNm * airRefractiveIndex(vacuum);
  return vacuum;
}

double toAbsoluteGHz(double value, SpectralUnit unit, double referenceGHz) {
  requireFinite(value, "position");
  auto positive = [&](const char* what) {
    if (value <= 0.0) throw InputError("position", std::string(what) + " must be positive");
  };
  switch (unit) {
    case SpectralUnit::GHzAbsolute: positive("an absolute frequency"); return value;
    case SpectralUnit::GHzDetuning: return referenceGHz + value;
    case SpectralUnit::THz: positive("a frequency"); return value * 1e3;
    case SpectralUnit::NmVacuum: positive("a wavelength"); return kNmGHz / value;
    case SpectralUnit::NmAir: positive("a wavelength"); return kNmGHz / airToVacuumNm(value);
    case SpectralUnit::MeV: positive("a photon energy"); return value / constants::kMeVPerGHz;
    case SpectralUnit::InvCm: positive("a wavenumber"); return value / constants::kInvCmPerGHz;
  }
  return value;
}

double fromAbsoluteGHz(double f, SpectralUnit unit, double referenceGHz) {
  switch (unit) {
    case SpectralUnit::GHzAbsolute: return f;
    case SpectralUnit::GHzDetuning: return f - referenceGHz;
    case SpectralUnit::THz: return f * 1e-3;
    case SpectralUnit::NmVacuum: return kNmGHz / f;
    case SpectralUnit::NmAir: return vacuumToAirNm(kNmGHz / f);
    case SpectralUnit::MeV: return f * constants::kMeVPerGHz;
    case SpectralUnit::InvCm: return f * constants::kInvCmPerGHz;
  }
  return f;
}

double unitPerGHz(double f, SpectralUnit unit, double referenceGHz) {
  const double h = std::max(1e-6 * std::abs(f), 1e-3);
  return (fromAbsoluteGHz(f + h, unit, referenceGHz) - fromAbsoluteGHz(f - h, unit, referenceGHz)) /
         (2 * h);
}

}  // namespace finestra
