#pragma once
// Fitting the model directly to raw spectra, one per measurement set (its magnet setting): each
// spectrum is a baseline plus a scale times the sum of Lorentzian lines at the model's line
// positions, weighted by the model's intensity for the detection geometry and the populations of
// the emitting (PL) or absorbing (PLE) level, with one common width per spectrum. Free model
// parameters are chosen as for the peak fit (fit.free); per spectrum a scale, a baseline and a
// width are fitted as well. Overlapping lines need no peak picking, which is where this route
// beats fitting peak positions.
#include <optional>
#include <string>
#include <vector>

#include "core/fit/project_fit.h"
#include "core/optics/spectrum.h"

namespace finestra {

struct SpectrumData {
  std::string name;                 ///< for reports (file name)
  int set = 0;                      ///< index into project.measurements: the field of this spectrum
  std::vector<double> frequencyGHz; ///< absolute
  std::vector<double> signal;
  double noise = 0;                 ///< σ per sample; 0: estimated robustly from the data
  SpectrumKind kind = SpectrumKind::Emission;
};

struct SpectrumFitOptions {
  std::optional<std::vector<std::string>> free;  ///< default: project.fit.free
  std::optional<FitState> start;                 ///< e.g. the peak fit's state; default: the project's
  LeastSquaresOptions solver{2000, 1e-10, 1.0};
  static constexpr std::size_t kMaxSamplesTotal = 500000;
};

struct SpectrumFitResult {
  bool converged = false;
  std::string status;
  double chi2 = 0, chi2PerDof = 0;
  int dof = 0;
  bool errorsScaled = false;
  std::string errorNote;
  /// The free model parameters, then per spectrum "scale[i]", "baseline[i]", "fwhm_GHz[i]".
  std::vector<FittedParameter> parameters;
  Eigen::MatrixXd correlation;
  std::vector<std::string> undetermined, undeterminedCombinations;
  std::vector<double> noise;  ///< σ used per spectrum
  FitState state;
};

/// InputError naming the spectrum for a bad set index, too few samples, non-finite values or more
/// than kMaxSamplesTotal samples in all.
SpectrumFitResult fitSpectra(const Project& project, const std::vector<SpectrumData>& spectra, const SpectrumFitOptions& options = {});

/// The model curve of spectrum `data` for a fitted result (for plots and residual checks).
std::vector<double> spectrumFitCurve(const Project& project, const SpectrumData& data, const SpectrumFitResult& result, int spectrumIndex);

}  // namespace finestra
