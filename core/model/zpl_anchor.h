#pragma once
// Anchoring the ZPL to a line the user knows (docs/physics.md, Anchoring the ZPL).
// The engine's ZPL parameter is the centroid of the four zero-field lines of the unstrained centre;
// trade values are usually the wavelength of one bright line at a stated temperature. Given
// "line X at T = λ", the centroid is solved so that line X of the unstrained centre at zero field
// and temperature T (thermal ZPL shift included) falls at λ.
#include "core/model/centre_model.h"

namespace finestra {

struct ZplAnchor {
  char line = 'C';          ///< parent letter A, B, C or D
  double wavelengthNm = 0;  ///< where that line is measured
  bool air = false;         ///< wavelength in standard air (Edlén) rather than vacuum
  double temperatureK = 4;  ///< temperature of the measurement

  bool operator==(const ZplAnchor&) const = default;
};

/// The setup with zpl_THz replaced by the centroid that puts the anchor line at its wavelength
/// (status "set by user", source naming the anchor). Throws InputError for a bad anchor.
ModelSetup anchorZpl(ModelSetup setup, const ZplAnchor& anchor);

}  // namespace finestra
