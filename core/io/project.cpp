#include <cmath>
#include <numbers>

#include "core/common/errors.h"
#include "core/io/project.h"

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

Vec3 projectFieldCrystal(const Project& p, const LabFrame& lab) {
  return lab.toCrystal(p.magnet.trueFieldLab(p.field.labVector(lab)));
}

ModelSetup makeModelSetup(const Project& p) {
  ModelSetup s{resolveCentre(p.centre.preset, p.centre.isotope, p.centre.overrides),
               LabFrame(p.sample.normal, p.sample.inPlaneX, "sample"), p.strain, p.conditions};
  applyAssumedValues(s.centre, p.centre.assumed);
  if (p.centre.zplAnchor) s = anchorZpl(std::move(s), *p.centre.zplAnchor);
  return s;
}

namespace {

// The nominal (magnet-setting) lab field at sweep coordinate x.
Vec3 nominalSweepFieldLab(const Project& p, const SweepSpec& s, const LabFrame& lab, double x) {
  const Vec3 nominal = p.field.labVector(lab);
  switch (s.kind) {
    case SweepKind::Magnitude: {
      const Vec3 dir = nominal.norm() > 0 ? Vec3(nominal.normalized()) : Vec3(0, 0, 1);
      return x * dir;
    }
    case SweepKind::Angle: {
      const Vec3 n = s.planeNormalLab.normalized();
      const Vec3 u = (s.startLab - s.startLab.dot(n) * n).normalized();
      const Vec3 v = n.cross(u);
      const double a = x * std::numbers::pi / 180.0;
      return nominal.norm() * (std::cos(a) * u + std::sin(a) * v);
    }
    case SweepKind::Strain: return nominal;
    case SweepKind::Temperature: return nominal;
  }
  return Vec3::Zero();
}

}  // namespace

Vec3 sweepField(const Project& p, const SweepSpec& s, const LabFrame& lab, double x) {
  return lab.toCrystal(p.magnet.trueFieldLab(nominalSweepFieldLab(p, s, lab, x)));
}

Mat3 sweepStrain(const Project& p, const SweepSpec& s, double x) {
  if (s.kind != SweepKind::Strain) return p.strain.crystal;
  return p.strain.crystal + x * (s.strainTo - p.strain.crystal);
}

}  // namespace finestra
