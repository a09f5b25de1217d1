#pragma once
// The path of a sweep through field or strain space (see SweepSpec in core/project/project.h).
#include "core/project/project.h"

namespace finestra {

/// True field (crystal frame, T) at parameter value `x` of a sweep: the sweep path is a path of
/// magnet settings, and the magnet calibration is applied to each (core/project/field_semantics.h).
Vec3 sweepField(const Project& project, const SweepSpec& sweep, const LabFrame& lab, double x);
/// Crystal strain at parameter value `x` of a sweep.
Mat3 sweepStrain(const Project& project, const SweepSpec& sweep, double x);

}  // namespace finestra
