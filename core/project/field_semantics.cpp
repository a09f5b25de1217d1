#include "core/project/field_semantics.h"

namespace finestra {

Vec3 trueFieldLab(const MagnetCalibration& magnet, const Vec3& magnetLab) { return magnet.trueFieldLab(magnetLab); }

Vec3 magnetFieldLab(const MagnetCalibration& magnet, const Vec3& trueLab) { return magnet.nominalFieldLab(trueLab); }

Vec3 trueFieldLab(const Project& project, const FieldSetting& magnetSetting, const LabFrame& lab) {
  return trueFieldLab(project.magnet, magnetSetting.labVector(lab));
}

Vec3 trueFieldCrystal(const Project& project, const FieldSetting& magnetSetting, const LabFrame& lab) {
  return lab.toCrystal(trueFieldLab(project, magnetSetting, lab));
}

Vec3 projectFieldCrystal(const Project& project, const LabFrame& lab) {
  return trueFieldCrystal(project, project.field, lab);
}

FieldSetting magnetSettingForTrueField(const Project& project, const Vec3& trueLab) {
  const Vec3 magnet = magnetFieldLab(project.magnet, trueLab);
  const auto angles = magnet.norm() > 0 ? anglesOfDirection(magnet) : std::array<double, 2>{0, 0};
  return FieldSetting::fromAngles(magnet.norm(), angles[0], angles[1]);
}

TrueDirection trueDirection(const MagnetCalibration& magnet, const Vec3& unitMagnetLab) {
  // The calibration is the field scale times a rotation: the rotation turns the direction, the
  // scale is the gain.
  return {trueFieldLab(magnet, unitMagnetLab) / magnet.fieldScale, magnet.fieldScale};
}

}  // namespace finestra
