#pragma once
// A sampled spectrum modelled as a straight baseline plus a sum of peaks of one line shape, as a
// FitModel: residuals (model − signal)/noise. Parameter vector:
//   [baseline offset, baseline slope, then per peak: position, area, ln w₁ (, ln w₂)]
// with w₁ = HWHM γ (Lorentzian), σ (Gaussian), σ (Voigt) and w₂ = γ (Voigt only); widths enter
// as logarithms so that they stay positive.
#include <memory>
#include <vector>

#include "core/fit/fit_model.h"
#include "core/peaks/line_shape.h"
#include "core/peaks/noise_baseline.h"

namespace finestra {

struct SampledSpectrum {
  std::vector<double> position;  ///< ascending
  std::vector<double> signal;
};

/// Widths of one peak in the shape's own parameters (γ: HWHM, σ: Gaussian standard deviation).
struct PeakWidths {
  double sigma = 0, gamma = 0;
};

class PeakSumModel : public FitModel {
public:
  PeakSumModel(std::shared_ptr<const SampledSpectrum> data, double noise, LineShape shape, int peakCount, double origin);

  static int parametersPerPeak(LineShape shape) { return shape == LineShape::Voigt ? 4 : 3; }
  static constexpr int kBaselineParameters = 2;
  int peakCount() const { return peaks_; }
  LineShape shape() const { return shape_; }

  int parameterCount() const override { return kBaselineParameters + peaks_ * parametersPerPeak(shape_); }
  int residualCount() const override { return static_cast<int>(data_->position.size()); }
  void residuals(const Eigen::VectorXd& x, Eigen::VectorXd& out) const override;
  /// Baseline columns analytic; each peak's columns by central differences of that peak alone.
  void jacobian(const Eigen::VectorXd& x, Eigen::MatrixXd& out) const override;
  std::unique_ptr<FitModel> clone() const override { return std::make_unique<PeakSumModel>(*this); }

  /// Index of peak k's first parameter (its position).
  static int peakOffset(LineShape shape, int k) { return kBaselineParameters + k * parametersPerPeak(shape); }
  PeakWidths widths(const Eigen::VectorXd& x, int k) const;
  /// Unit-area profile of peak k at abscissa `at`.
  double profile(const Eigen::VectorXd& x, int k, double at) const;
  /// Model value (baseline + all peaks) at abscissa `at`.
  double value(const Eigen::VectorXd& x, double at) const;
  double origin() const { return origin_; }

private:
  std::shared_ptr<const SampledSpectrum> data_;
  double noise_ = 1;
  LineShape shape_;
  int peaks_ = 0;
  double origin_ = 0;  ///< baseline slope is about this abscissa
};

/// Unit-area profile of a shape with the given widths (σ ignored for Lorentzian, γ for Gaussian).
double shapeProfile(LineShape shape, double offset, const PeakWidths& widths);
/// FWHM of a shape with the given widths.
double shapeFwhm(LineShape shape, const PeakWidths& widths);

}  // namespace finestra
