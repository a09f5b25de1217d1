#include "core/peaks/peak_sum_model.h"

#include <cmath>

namespace finestra {

double shapeProfile(LineShape shape, double offset, const PeakWidths& w) {
  switch (shape) {
    case LineShape::Lorentzian: return lorentzianProfile(offset, w.gamma);
    case LineShape::Gaussian: return gaussianProfile(offset, w.sigma);
    case LineShape::Voigt: return voigtProfile(offset, w.sigma, w.gamma);
  }
  return 0;
}

double shapeFwhm(LineShape shape, const PeakWidths& w) {
  switch (shape) {
    case LineShape::Lorentzian: return 2.0 * w.gamma;
    case LineShape::Gaussian: return gaussianFwhmFromSigma(w.sigma);
    case LineShape::Voigt: return voigtFwhm(w.sigma, w.gamma);
  }
  return 0;
}

PeakSumModel::PeakSumModel(std::shared_ptr<const SampledSpectrum> data, double noise, LineShape shape, int peakCount, double origin)
    : data_(std::move(data)), noise_(noise), shape_(shape), peaks_(peakCount), origin_(origin) {}

PeakWidths PeakSumModel::widths(const Eigen::VectorXd& x, int k) const {
  const int o = peakOffset(shape_, k);
  PeakWidths w;
  switch (shape_) {
    case LineShape::Lorentzian: w.gamma = std::exp(x[o + 2]); break;
    case LineShape::Gaussian: w.sigma = std::exp(x[o + 2]); break;
    case LineShape::Voigt:
      w.sigma = std::exp(x[o + 2]);
      w.gamma = std::exp(x[o + 3]);
      break;
  }
  return w;
}

double PeakSumModel::profile(const Eigen::VectorXd& x, int k, double at) const {
  const int o = peakOffset(shape_, k);
  return shapeProfile(shape_, at - x[o], widths(x, k));
}

double PeakSumModel::value(const Eigen::VectorXd& x, double at) const {
  double v = x[0] + x[1] * (at - origin_);
  for (int k = 0; k < peaks_; ++k) v += x[peakOffset(shape_, k) + 1] * profile(x, k, at);
  return v;
}

void PeakSumModel::residuals(const Eigen::VectorXd& x, Eigen::VectorXd& out) const {
  const auto& pos = data_->position;
  out.resize(static_cast<Eigen::Index>(pos.size()));
  for (std::size_t i = 0; i < pos.size(); ++i) out[static_cast<Eigen::Index>(i)] = (value(x, pos[i]) - data_->signal[i]) / noise_;
}

void PeakSumModel::jacobian(const Eigen::VectorXd& x, Eigen::MatrixXd& out) const {
  const auto& pos = data_->position;
  const auto n = static_cast<Eigen::Index>(pos.size());
  out.setZero(n, parameterCount());
  for (Eigen::Index i = 0; i < n; ++i) {
    out(i, 0) = 1.0 / noise_;
    out(i, 1) = (pos[static_cast<std::size_t>(i)] - origin_) / noise_;
  }
  const int perPeak = parametersPerPeak(shape_);
  Eigen::VectorXd plus = x, minus = x;
  for (int k = 0; k < peaks_; ++k) {
    const int o = peakOffset(shape_, k);
    const double area = x[o + 1];
    // ∂/∂area is the profile itself.
    for (Eigen::Index i = 0; i < n; ++i) out(i, o + 1) = profile(x, k, pos[static_cast<std::size_t>(i)]) / noise_;
    for (int j = 0; j < perPeak; ++j) {
      if (j == 1) continue;
      const int c = o + j;
      // Position steps scale with the width; log-width steps are relative already.
      const PeakWidths w = widths(x, k);
      const double h = j == 0 ? 1e-5 * (w.sigma + w.gamma) : 1e-5;
      plus[c] = x[c] + h;
      minus[c] = x[c] - h;
      for (Eigen::Index i = 0; i < n; ++i) {
        const double at = pos[static_cast<std::size_t>(i)];
        out(i, c) = area * (profile(plus, k, at) - profile(minus, k, at)) / (2.0 * h * noise_);
      }
      plus[c] = minus[c] = x[c];
    }
  }
}

}  // namespace finestra
