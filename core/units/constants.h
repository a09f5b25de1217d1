#pragma once
// Physical constants (CODATA 2018 exact or recommended values) and unit factors.
namespace finestra::constants {

/// Bohr magneton over Planck constant, GHz/T (CODATA 2018: 13.996 244 936 1 GHz/T).
inline constexpr double kBohrGHzPerT = 13.9962449361;
/// Free-electron g-factor magnitude (CODATA 2018: 2.002 319 304 362 56).
inline constexpr double kElectronG = 2.00231930436256;
/// Speed of light in vacuum, m/s (exact, SI 2019).
inline constexpr double kSpeedOfLight = 299792458.0;
/// Planck constant, J s (exact, SI 2019).
inline constexpr double kPlanck = 6.62607015e-34;
/// Elementary charge, C (exact, SI 2019).
inline constexpr double kElementaryCharge = 1.602176634e-19;
/// Boltzmann constant, J/K (exact, SI 2019).
inline constexpr double kBoltzmann = 1.380649e-23;
/// h/k_B expressed in K per GHz: a level at E GHz has Boltzmann factor exp(-E * kHOverKB / T).
inline constexpr double kKelvinPerGHz = kPlanck * 1e9 / kBoltzmann;
/// Photon energy of 1 GHz in meV.
inline constexpr double kMeVPerGHz = kPlanck * 1e9 / kElementaryCharge * 1e3;
/// Wavenumber of 1 GHz in cm^-1.
inline constexpr double kInvCmPerGHz = 1e9 / (kSpeedOfLight * 100.0);
/// Strain couplings are quoted in PHz per unit strain; the engine works in GHz.
inline constexpr double kGHzPerPHz = 1e6;

}  // namespace finestra::constants
