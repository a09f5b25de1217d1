#pragma once
// Phonon-driven transitions between the two orbital branches of one manifold (docs/physics.md,
// Phonons and linewidths). First-order (single-phonon) process in the form of Jahnke et al., New J. Phys. 17,
// 043011 (2015): downward rate χ Δ³ (n(Δ,T) + 1), upward rate χ Δ³ n(Δ,T), with n the
// Bose–Einstein occupation of a phonon of energy hΔ. An optional higher-order term c (T / 1 K)^p
// is added to both directions.
#include "core/centre/parameters.h"
#include "core/common/types.h"

namespace finestra {

/// Bose–Einstein occupation 1/(exp(hΔ/kT) − 1) of a phonon of frequency Δ (GHz) at T (K).
/// 0 at T = 0 or where exp overflows; Δ must be > 0.
double boseEinstein(double splittingGHz, double temperatureK);

/// The phonon constants of one manifold, read from the centre parameters.
struct PhononConstants {
  double chiPerSGHz3 = 0;      ///< single-phonon coupling χ, 1/(s GHz³)
  double higherOrderPerS = 0;  ///< higher-order rate at 1 K, 1/s
  double higherOrderPower = 0; ///< its temperature power p
};

/// Reads the constants of manifold m; throws MissingValueError naming the unknown key.
PhononConstants phononConstants(const CentreParameters& parameters, Manifold m);

/// Rates between the branches of one manifold split by Δ.
struct BranchRates {
  double splittingGHz = 0;  ///< Δ: mean upper-branch minus mean lower-branch energy
  double upPerS = 0;        ///< lower → upper branch (phonon absorbed)
  double downPerS = 0;      ///< upper → lower branch (phonon emitted)
};

/// Throws InputError for a negative or non-finite temperature or splitting.
BranchRates branchRates(const PhononConstants& constants, double splittingGHz, double temperatureK);

}  // namespace finestra
