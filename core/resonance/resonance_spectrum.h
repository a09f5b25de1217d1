#pragma once
// Simulated microwave resonance spectrum: absorption of a weak drive by thermally populated levels.
#include <vector>

#include "core/resonance/microwave.h"

namespace finestra {

/// Largest number of points of one resonance spectrum.
inline constexpr int kMaxResonancePoints = 1000000;

/// Lines weaker than this fraction of the strongest population-weighted line are left out of the curve.
inline constexpr double kNegligibleLineFraction = 1e-12;

struct ResonanceSpectrumRequest {
  double fromGHz = 0, toGHz = 0;  ///< equal: automatic range around the defined transitions
  int points = 2001;
  double fwhmGHz = 0.001;         ///< Lorentzian full width at half maximum of every line
};

struct ResonanceSpectrum {
  std::vector<double> frequencyGHz, signal;
};

/// signal(ν) = Σ_t strength_t (p_lower − p_upper) L(ν − ν_t), L a Lorentzian of peak 1 and FWHM
/// `fwhmGHz`: the linear-response absorption of a weak drive (Abragam, The Principles of Nuclear
/// Magnetism, Oxford 1961, ch. II). With thermal populations the population difference is the
/// Boltzmann one; an ODMR contrast under optical pumping has the same positions and strengths but
/// pumped populations. Transitions with undefined strength, and those below kNegligibleLineFraction of the strongest,
/// are left out. Throws InputError naming
/// the key for a bad range, point count or width.
ResonanceSpectrum resonanceSpectrum(const std::vector<ClassMicrowave>& classes, const ResonanceSpectrumRequest& request);

/// Automatic range: the transitions carrying at least 1e-4 of the strongest population-weighted
/// strength, padded by 10 widths on both sides.
std::pair<double, double> resonanceAutoRange(const std::vector<ClassMicrowave>& classes, double fwhmGHz);

}  // namespace finestra
