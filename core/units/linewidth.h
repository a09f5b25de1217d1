#pragma once
// Line-shape widths.
#include <cmath>
#include <numbers>

namespace finestra {

/// Lifetime-limited (natural) FWHM in GHz of a transition whose upper level lives `lifetimeNs`:
/// Γ/2π = 1/(2π τ).
inline double lifetimeLimitedFwhmGHz(double lifetimeNs) {
  return 1.0 / (2.0 * std::numbers::pi * lifetimeNs);
}

}  // namespace finestra
