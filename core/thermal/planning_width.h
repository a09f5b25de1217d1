#pragma once
// The linewidth the magnet planner divides its line separations by (docs/physics.md, Phonons and
// linewidths): the homogeneous FWHM of the C lines (lower excited branch → lower ground branch,
// the lines an experiment drives) of class 0 at the project's strain and
// temperature, at zero field, plus the user's inhomogeneous broadening.
#include "core/model/centre_model.h"

namespace finestra {

/// Throws MissingValueError naming a phonon constant that is unknown.
double separationLinewidthGHz(const CentreModel& model);

}  // namespace finestra
