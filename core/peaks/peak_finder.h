#pragma once
// Peak finding on a measured spectrum: robust noise and baseline, candidates from the smoothed
// signal, then one least-squares fit of all peaks together (overlapping peaks share the fit), with
// peaks added where the residual still shows structure and dropped when below the stated
// signal-to-noise. Positions, FWHM and areas come with standard errors (formal, or scaled by
// √(χ²/dof) when χ²/dof > 1).
#include <string>
#include <vector>

#include "core/peaks/line_shape.h"
#include "core/peaks/noise_baseline.h"

namespace finestra {

struct PeakFinderOptions {
  LineShape shape = LineShape::Lorentzian;
  double minSnr = 5.0;  ///< least peak height above the baseline, in units of the noise σ
  int maxPeaks = 50;    ///< limit on the peaks fitted together

  static constexpr double kMinSnrLowest = 2.0, kMinSnrHighest = 1e6;
  static constexpr int kMaxPeaksLimit = 200;
  static constexpr std::size_t kMaxSamples = 200000;
};

struct FoundPeak {
  double position = 0, positionSigma = 0;
  double fwhm = 0, fwhmSigma = 0;
  double area = 0, areaSigma = 0;  ///< signal × position unit
  double height = 0;               ///< above the baseline
  double snr = 0;                  ///< height / noise
};

struct PeakFinderResult {
  std::vector<FoundPeak> peaks;  ///< ascending position
  LineShape shape = LineShape::Lorentzian;
  double noise = 0;              ///< σ of one sample
  bool noiseFloored = false;     ///< the data showed no noise; a floor of 1e-9 × the signal's size (1e-9 for an all-zero signal) was used
  LinearBaseline baseline;
  double chi2 = 0, chi2PerDof = 0;
  int dof = 0;
  bool errorsScaled = false;
  bool converged = false;
  std::string status;
  std::vector<std::string> dropped;  ///< candidates fitted and then dropped, each with its position and reason
};

/// Samples in any order (sorted here); InputError naming `origin` for mismatched lengths, fewer
/// than 8 samples, non-finite values or more than kMaxSamples samples, and naming the option
/// ("min_snr", "max_peaks") with its limits for options out of range.
PeakFinderResult findPeaks(const std::vector<double>& position, const std::vector<double>& signal, const PeakFinderOptions& options,
                           const std::string& origin);

/// The sentence the CLI and GUI print about which errors are reported.
std::string errorScalingNote(bool scaled, double chi2PerDof);

}  // namespace finestra
