#pragma once
// Line shapes of the peak finder, each normalised to unit area:
// Lorentzian (homogeneous, lifetime-limited or dephasing), Gaussian (inhomogeneous), and their
// convolution, the Voigt profile, evaluated from the Faddeeva function w(z) of libcerf:
//   V(x; σ, γ) = Re w((x + iγ)/(σ√2)) / (σ√(2π))   (Armstrong, JQSRT 7, 61 (1967)).
#include <string>
#include <string_view>

namespace finestra {

enum class LineShape { Lorentzian, Gaussian, Voigt };

/// "lorentzian", "gaussian", "voigt".
std::string_view lineShapeKey(LineShape shape);
/// Parses a key (case-sensitive, as lineShapeKey); InputError naming `where` otherwise.
LineShape parseLineShape(std::string_view key, const std::string& where);

/// Unit-area Lorentzian at offset x from its centre with half width at half maximum γ > 0.
double lorentzianProfile(double x, double gamma);
/// Unit-area Gaussian at offset x with standard deviation σ > 0.
double gaussianProfile(double x, double sigma);
/// Unit-area Voigt profile (Gaussian σ ⊗ Lorentzian HWHM γ), both > 0, via libcerf.
double voigtProfile(double x, double sigma, double gamma);
/// Faddeeva function Re w(x + iy) (libcerf), exposed for checks against tabulated values.
double faddeevaReal(double x, double y);

/// Full width at half maximum of the Voigt profile, solved numerically on voigtProfile to a
/// relative 1e-10 (no approximate formula).
double voigtFwhm(double sigma, double gamma);

/// FWHM ↔ width-parameter conversions: Gaussian FWHM = 2√(2 ln 2) σ, Lorentzian FWHM = 2γ.
double gaussianSigmaFromFwhm(double fwhm);
double gaussianFwhmFromSigma(double sigma);

}  // namespace finestra
