#pragma once
// Which orientation classes a field direction cannot tell apart, and why (docs/physics.md,
// Orientation classes). Pure geometry of the four ⟨111⟩ axes and the cubic mirrors; no model.
#include <optional>
#include <string>
#include <vector>

#include "core/crystal/frames.h"

namespace finestra {

/// Two classes that are images of each other under a crystal mirror containing the field.
struct ClassTie {
  int first = 0, second = 0;
  std::array<int, 3> mirrorNormal{};  ///< Miller indices of the mirror plane (crystal)
  double axisAngleDeg = 0;           ///< angle of both axes to the field, folded to 0..90
  bool driveAlsoEqual = false;       ///< the microwave direction is in the mirror or along its normal
};

struct ClassSymmetry {
  std::vector<std::vector<int>> groups;  ///< selected classes in groups of equivalent ones (sorted)
  std::vector<ClassTie> ties;            ///< every equivalent pair with its mirror
};

/// Classes among `classes` that the unit crystal direction `fieldCrystal` leaves equivalent:
/// equal |cos| of the field's angle to their axes (tolerance 1e-9). `driveCrystal` (optional, any
/// length) decides ClassTie::driveAlsoEqual.
ClassSymmetry classSymmetryAt(const Vec3& fieldCrystal, const std::vector<int>& classes,
                              const std::optional<Vec3>& driveCrystal = std::nullopt);

/// The group holding `cls` (just {cls} when it is alone).
std::vector<int> groupOf(const ClassSymmetry& s, int cls);

/// "classes 0 and 3 are mirror images in the (001) plane, which contains the field: same angle to
/// the field (90.0°)" plus a note on the drive.
std::string describeTie(const ClassTie& tie);
/// One sentence for a group of equivalent classes ("" for a class that stands alone).
std::string describeGroup(const ClassSymmetry& s, const std::vector<int>& group);

/// "(001)" / "[1-10]": integer Miller indices of a crystal vector when it is a low-index direction
/// (all indices within ±6 after scaling, 1e-6 relative), else the unit vector with 3 decimals.
std::string millerPlane(const Vec3& normalCrystal);
std::string millerDirection(const Vec3& directionCrystal);

/// Over a set of reachable true field directions (crystal, unit) with weights summing to 1:
/// where the target is alone, and which classes it coincides with everywhere.
struct ReachSymmetry {
  double targetAloneShare = 0;            ///< weight of the directions where the target is alone
  std::vector<int> alwaysTiedWith;        ///< classes equivalent to the target at every direction
  std::string warning;                    ///< empty when the target can be singled out somewhere
};
ReachSymmetry targetSymmetryOverReach(const std::vector<Vec3>& directionsCrystal, const std::vector<double>& weights,
                                      int targetClass, const std::vector<int>& classes);

}  // namespace finestra
