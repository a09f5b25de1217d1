#include "core/project/sweep_path.h"

#include <cmath>
#include <numbers>

#include "core/project/field_semantics.h"

namespace finestra {
namespace {

// The magnet-setting lab field at sweep coordinate x.
Vec3 magnetSweepFieldLab(const Project& p, const SweepSpec& s, const LabFrame& lab, double x) {
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
  return lab.toCrystal(trueFieldLab(p.magnet, magnetSweepFieldLab(p, s, lab, x)));
}

Mat3 sweepStrain(const Project& p, const SweepSpec& s, double x) {
  if (s.kind != SweepKind::Strain) return p.strain.crystal;
  return p.strain.crystal + x * (s.strainTo - p.strain.crystal);
}

}  // namespace finestra
