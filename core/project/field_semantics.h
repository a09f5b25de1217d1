#pragma once
// What a magnet setting means: the one place where the magnet calibration (docs/architecture.md,
// Magnet tilt) turns a setting into the true field the centres see. Every computation from a
// magnet setting — the project field, sweeps, measurements, fits, planner reach, CLI and GUI —
// goes through these functions; the inverse (true field → setting) sits beside them.
#include "core/crystal/frames.h"
#include "core/crystal/magnet_calibration.h"
#include "core/project/project.h"

namespace finestra {

/// True field (lab frame, T) produced by the magnet set to `magnetLab` (lab frame, T).
Vec3 trueFieldLab(const MagnetCalibration& magnet, const Vec3& magnetLab);
/// The magnet setting (lab frame, T) that produces `trueLab`: the inverse of trueFieldLab.
Vec3 magnetFieldLab(const MagnetCalibration& magnet, const Vec3& trueLab);

/// True field (crystal frame, T) of a magnet setting of this project (its field, a measurement's
/// field, ...): the project's calibration applied.
Vec3 trueFieldCrystal(const Project& project, const FieldSetting& magnetSetting, const LabFrame& lab);
/// The same in the lab frame.
Vec3 trueFieldLab(const Project& project, const FieldSetting& magnetSetting, const LabFrame& lab);
/// True field (crystal frame, T) of the project's own magnet setting.
Vec3 projectFieldCrystal(const Project& project, const LabFrame& lab);
/// The magnet setting, as angles, that produces the true lab field `trueLab` in this project.
FieldSetting magnetSettingForTrueField(const Project& project, const Vec3& trueLab);

/// Where a unit magnet direction really points. The calibration is linear (a scale times a
/// rotation), so the magnet set to B·d̂ gives B·gain along `lab` for every magnitude B.
struct TrueDirection {
  Vec3 lab = Vec3::UnitZ();  ///< unit vector, lab frame
  double gain = 1;           ///< true magnitude per magnet magnitude
};
/// `unitMagnetLab` must be a unit vector (lab frame).
TrueDirection trueDirection(const MagnetCalibration& magnet, const Vec3& unitMagnetLab);

}  // namespace finestra
