// Line shapes of the peak finder against exact limits and identities from outside the project.
#include <gtest/gtest.h>

#include <cmath>
#include <numbers>

#include "core/common/errors.h"
#include "core/peaks/line_shape.h"

using namespace finestra;

// Pure Lorentzian limit: σ → 0 leaves the Lorentzian γ/(π(x² + γ²)) (definition of the convolution).
TEST(PeaksLineShape, VoigtTendsToLorentzianWhenGaussianVanishes) {
  for (double x : {0.0, 0.3, 1.0, 5.0}) {
    const double gamma = 0.7;
    EXPECT_NEAR(voigtProfile(x, 1e-7, gamma) / lorentzianProfile(x, gamma), 1.0, 1e-6) << x;
  }
}

// Pure Gaussian limit: γ → 0 leaves exp(−x²/2σ²)/(σ√(2π)).
TEST(PeaksLineShape, VoigtTendsToGaussianWhenLorentzianVanishes) {
  for (double x : {0.0, 0.5, 1.5, 3.0}) {
    const double sigma = 1.3;
    EXPECT_NEAR(voigtProfile(x, sigma, 1e-9) / gaussianProfile(x, sigma), 1.0, 1e-6) << x;
  }
}

// At the centre the Voigt profile is Re w(iy)/(σ√(2π)), y = γ/(σ√2), and w(iy) = exp(y²) erfc(y)
// for real y (definition of w, Abramowitz & Stegun, Handbook, 7.1.3; Voigt as Re w:
// Armstrong, JQSRT 7, 61 (1967), and A&S 7.4.13). erfc from the C++ standard library.
TEST(PeaksLineShape, VoigtAtCentreEqualsScaledComplementaryErrorFunction) {
  for (double y : {0.1, 0.5, 1.0, 2.0, 4.0}) {
    const double sigma = 0.8, gamma = y * sigma * std::sqrt(2.0);
    const double expected = std::exp(y * y) * std::erfc(y) / (sigma * std::sqrt(2 * std::numbers::pi));
    EXPECT_NEAR(voigtProfile(0.0, sigma, gamma) / expected, 1.0, 1e-12) << y;
    EXPECT_NEAR(faddeevaReal(0.0, y), std::exp(y * y) * std::erfc(y), 1e-13) << y;
  }
  // Tabulated value: exp(1)·erfc(1) = 0.4275835762 (A&S Table 7.1 gives erfc(1) = 0.1572992070).
  EXPECT_NEAR(faddeevaReal(0.0, 1.0), 0.4275835762, 1e-9);
}

// Independent check off centre: the convolution integral ∫G(t;σ) L(x−t;γ) dt by the trapezoid rule.
TEST(PeaksLineShape, VoigtEqualsNumericalConvolution) {
  const double sigma = 1.0, gamma = 0.5;
  for (double x : {0.0, 0.7, 2.5}) {
    double sum = 0;
    const double h = 1e-3;
    for (double t = -12.0; t <= 12.0; t += h) sum += gaussianProfile(t, sigma) * lorentzianProfile(x - t, gamma);
    EXPECT_NEAR(voigtProfile(x, sigma, gamma), sum * h, 1e-7) << x;
  }
}

// FWHM limits (2γ and 2√(2 ln 2) σ) and the approximation of Olivero & Longbothum, JQSRT 17, 233
// (1977), f_V ≈ 0.5346 f_L + √(0.2166 f_L² + f_G²), stated there to hold to 0.02 %.
TEST(PeaksLineShape, VoigtFwhmMatchesLimitsAndPublishedApproximation) {
  EXPECT_NEAR(voigtFwhm(1e-9, 0.4), 0.8, 1e-7);
  EXPECT_NEAR(voigtFwhm(1.0, 1e-10), 2.0 * std::sqrt(2.0 * std::log(2.0)), 1e-7);
  for (double gamma : {0.1, 0.5, 1.0, 3.0}) {
    const double sigma = 0.9, fl = 2 * gamma, fg = gaussianFwhmFromSigma(sigma);
    const double approx = 0.5346 * fl + std::sqrt(0.2166 * fl * fl + fg * fg);
    EXPECT_NEAR(voigtFwhm(sigma, gamma) / approx, 1.0, 3e-4) << gamma;
  }
}

TEST(PeaksLineShape, UnknownShapeKeyNamesTheKey) {
  EXPECT_EQ(parseLineShape("voigt", "--shape"), LineShape::Voigt);
  try {
    parseLineShape("sech", "--shape");
    FAIL();
  } catch (const InputError& e) {
    EXPECT_NE(std::string(e.what()).find("--shape"), std::string::npos);
    EXPECT_NE(std::string(e.what()).find("sech"), std::string::npos);
  }
}
