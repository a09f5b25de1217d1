#pragma once
// Phonon sideband of the emission (docs/physics.md, Phonon sideband): a fraction DW (the
// Debye–Waller factor) of every line's emission stays in the zero-phonon line; the rest forms a
// sideband, modelled as one Gaussian feature a fixed energy below the line.
#include "core/centre/parameters.h"

namespace finestra {

struct SidebandShape {
  double debyeWaller = 1;  ///< fraction of the emission in the zero-phonon line, in (0, 1]
  double shiftGHz = 0;     ///< feature position below its zero-phonon line (GHz, > 0)
  double fwhmGHz = 0;      ///< feature FWHM (GHz, > 0)
};

/// Reads the shape from the centre parameters (meV converted with CODATA h and e); throws
/// MissingValueError naming an unknown value and InputError for values out of range.
SidebandShape sidebandShape(const CentreParameters& parameters);

/// Area-normalised sideband density per GHz at `detuningGHz` from its zero-phonon line.
double sidebandDensity(double detuningGHz, const SidebandShape& shape);

}  // namespace finestra
