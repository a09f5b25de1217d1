#include "core/peaks/line_shape.h"

#include <cerf.h>

#include <cmath>
#include <numbers>

#include "core/common/errors.h"

namespace finestra {
namespace {

const double kFwhmPerSigma = 2.0 * std::sqrt(2.0 * std::numbers::ln2);

}  // namespace

std::string_view lineShapeKey(LineShape shape) {
  switch (shape) {
    case LineShape::Lorentzian: return "lorentzian";
    case LineShape::Gaussian: return "gaussian";
    case LineShape::Voigt: return "voigt";
  }
  return "lorentzian";
}

LineShape parseLineShape(std::string_view key, const std::string& where) {
  for (LineShape s : {LineShape::Lorentzian, LineShape::Gaussian, LineShape::Voigt})
    if (lineShapeKey(s) == key) return s;
  throw InputError(where, "unknown line shape '" + std::string(key) + "' (use lorentzian, gaussian or voigt)");
}

double lorentzianProfile(double x, double gamma) { return gamma / (std::numbers::pi * (x * x + gamma * gamma)); }

double gaussianProfile(double x, double sigma) {
  const double u = x / sigma;
  return std::exp(-0.5 * u * u) / (sigma * std::sqrt(2.0 * std::numbers::pi));
}

double voigtProfile(double x, double sigma, double gamma) { return ::voigt(x, sigma, gamma); }

double faddeevaReal(double x, double y) { return ::re_w_of_z(x, y); }

double voigtFwhm(double sigma, double gamma) {
  // The profile falls monotonically from its centre; bisect for the half-maximum point between 0
  // and a bound that is surely beyond it (the sum of the two component half widths, doubled).
  const double half = 0.5 * voigtProfile(0.0, sigma, gamma);
  double lo = 0.0, hi = 2.0 * (0.5 * kFwhmPerSigma * sigma + gamma);
  while (voigtProfile(hi, sigma, gamma) > half) hi *= 2.0;
  for (int i = 0; i < 200 && hi - lo > 1e-10 * hi; ++i) {
    const double mid = 0.5 * (lo + hi);
    (voigtProfile(mid, sigma, gamma) > half ? lo : hi) = mid;
  }
  return lo + hi;  // 2 × the midpoint
}

double gaussianSigmaFromFwhm(double fwhm) { return fwhm / kFwhmPerSigma; }
double gaussianFwhmFromSigma(double sigma) { return sigma * kFwhmPerSigma; }

}  // namespace finestra
