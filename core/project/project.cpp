#include "core/project/project.h"

namespace finestra {

Vec3 FieldSetting::labVector(const LabFrame& lab) const {
  switch (form) {
    case Form::Angles: return magnitudeT * directionFromAngles(polarDeg, azimuthDeg);
    case Form::VectorLab: return vector;
    case Form::VectorCrystal: return lab.toLab(vector);
  }
  return Vec3::Zero();
}

Vec3 FieldSetting::crystalVector(const LabFrame& lab) const { return lab.toCrystal(labVector(lab)); }

FieldSetting FieldSetting::fromAngles(double magnitudeT, double polarDeg, double azimuthDeg) {
  FieldSetting f;
  f.form = Form::Angles;
  f.magnitudeT = magnitudeT;
  f.polarDeg = polarDeg;
  f.azimuthDeg = azimuthDeg;
  return f;
}

Mat3 strainFromComponents(double xx, double yy, double zz, double yz, double zx, double xy) {
  Mat3 e;
  e << xx, xy, zx, xy, yy, yz, zx, yz, zz;
  return e;
}

}  // namespace finestra
