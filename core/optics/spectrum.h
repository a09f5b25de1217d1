#pragma once
// Simulated spectra: Lorentzian lines weighted by intensity and populations, summed over classes.
#include <vector>

#include "core/model/centre_model.h"
#include "core/units/spectral_units.h"

namespace finestra {

enum class SpectrumKind {
  Emission,   ///< PL: lines weighted by the population of their excited level
  Excitation  ///< PLE: lines weighted by the population of their ground level
};

/// A line ready for a spectrum: frequency, weight (intensity × population) and width.
struct WeightedLine {
  int cls = 0;
  const OpticalLine* line = nullptr;
  double weight = 0;
  double fwhmGHz = 0;           ///< homogeneous width at the temperature plus the user broadening
  double sidebandFraction = 0;  ///< share of the weight in the phonon sideband (1 − Debye–Waller), PL only
};

/// Lines of the given class solutions weighted for a spectrum kind and the model's conditions.
/// Widths: each line's homogeneous FWHM at the conditions' temperature (core/thermal) plus the
/// user broadening, an extra inhomogeneous term added to the Lorentzian width. With
/// conditions.phononSideband, PL lines give 1 − DW of their weight to the sideband.
std::vector<WeightedLine> weightLines(const CentreModel& model, const std::vector<ClassSolution>& classes,
                                      SpectrumKind kind);

/// Area-normalised Lorentzian with full width at half maximum `fwhm`, per GHz.
double lorentzian(double detuningGHz, double fwhmGHz);

/// Lines' Lorentzians plus, for lines with a sideband fraction, their sideband densities, at
/// absolute frequency `frequencyGHz` (intensity per GHz).
double spectrumDensity(const CentreModel& model, const std::vector<WeightedLine>& lines, double frequencyGHz);

struct SpectrumCurve {
  std::vector<double> x;  ///< positions on the requested unit
  std::vector<double> y;  ///< intensity per GHz (arbitrary scale)
};

/// Evaluates the spectrum at `points` positions evenly spaced on `unit` between `from` and `to`.
/// Throws InputError for fewer than 2 points or an empty range.
SpectrumCurve computeSpectrum(const CentreModel& model, const std::vector<WeightedLine>& lines, SpectralUnit unit,
                              double from, double to, int points);

/// A range on `unit` covering every line with a margin of `marginLinewidths` linewidths (at least
/// 5 GHz) on each side; returned as {from, to} in increasing order of the unit's value.
std::array<double, 2> autoRange(const CentreModel& model, const std::vector<WeightedLine>& lines, SpectralUnit unit);

}  // namespace finestra
