#include "core/crystal/magnet_calibration.h"

#include <cmath>
#include <numbers>

#include "core/crystal/frames.h"

namespace finestra {

Vec3 MagnetCalibration::trueFieldLab(const Vec3& nominalLab) const {
  const double phi = tiltAzimuthDeg * std::numbers::pi / 180.0;
  const Vec3 axis(-std::sin(phi), std::cos(phi), 0.0);
  return fieldScale * (rotationAbout(axis, tiltDeg * std::numbers::pi / 180.0) * nominalLab);
}

Vec3 MagnetCalibration::nominalFieldLab(const Vec3& trueLab) const {
  const double phi = tiltAzimuthDeg * std::numbers::pi / 180.0;
  const Vec3 axis(-std::sin(phi), std::cos(phi), 0.0);
  return rotationAbout(axis, -tiltDeg * std::numbers::pi / 180.0) * trueLab / fieldScale;
}

}  // namespace finestra
