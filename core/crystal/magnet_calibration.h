#pragma once
// The magnet's calibration: what the field really is when the magnet is set to B_nominal
// (docs/physics.md, Magnet calibration): B_true = field_scale · R(n̂, tilt) · B_nominal in the lab frame,
// n̂ = (−sin φt, cos φt, 0), so the nominal lab z direction tips by the tilt toward azimuth φt.
// A fit finds it; the project keeps it, and every computation from a magnet setting applies it.
#include "core/common/types.h"

namespace finestra {

struct MagnetCalibration {
  double fieldScale = 1;      ///< true / nominal magnitude
  double tiltDeg = 0;         ///< rotation of the magnet frame against the lab frame
  double tiltAzimuthDeg = 0;  ///< lab azimuth toward which the nominal z direction tips

  bool isNominal() const { return fieldScale == 1 && tiltDeg == 0; }
  Vec3 trueFieldLab(const Vec3& nominalLab) const;
  /// The magnet setting that produces `trueLab` (the inverse of trueFieldLab).
  Vec3 nominalFieldLab(const Vec3& trueLab) const;

  bool operator==(const MagnetCalibration&) const = default;
};

}  // namespace finestra
