#pragma once
// The middle gap E2 − E1 of a 4-state manifold at many fields at once: the anticrossing scan of the
// magnet planner. Uses the lane kernel (core/optics/line_lanes.h, 8 or 4 fields per instruction)
// where the CPU has one, and quarticMiddleGap (core/hamiltonian/linear4.h) elsewhere and for the
// fields the lanes hand back; both are double precision and agree to rounding.
#include "core/hamiltonian/linear4.h"

namespace finestra {

/// gaps[k] = quarticMiddleGap(form, fields[k]) for k < count; form.closedForm must be true.
void quarticMiddleGaps(const PauliForm4& form, const Vec3* fields, int count, double* gaps);

}  // namespace finestra
