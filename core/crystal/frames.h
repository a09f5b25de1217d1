#pragma once
// Crystal, defect and lab frames (docs/physics.md, Frames).
//
// A frame is stored as a rotation matrix whose rows are the frame's unit axes written in crystal
// coordinates, so that v_frame = F v_crystal and v_crystal = Fᵀ v_frame.
#include <array>
#include <string>

#include "core/common/types.h"

namespace finestra {

inline constexpr int kClassCount = 4;

/// Symmetry axis of orientation class `cls` (0..3) as an integer crystal direction:
/// [111], [1-1-1], [-11-1], [-1-11].
std::array<int, 3> classAxisIndices(int cls);

/// Defect frame of class `cls`. Class 0: z=[111]/√3, x=[11-2]/√6, y=z×x=[-110]/√2; classes 1..3
/// are obtained by applying the cubic C2 about [100], [010], [001] to all three axes of class 0.
const Mat3& defectFrame(int cls);

/// Strain tensor (symmetric, crystal frame) rotated into a frame: ε' = F ε Fᵀ.
Mat3 rotateTensor(const Mat3& frame, const Mat3& tensor);

/// Lab (sample) frame: z along the sample normal, x along the in-plane reference direction.
class LabFrame {
public:
  /// Both directions in crystal coordinates. Throws InputError naming `where` when a vector is
  /// zero or not finite, or when the two are not perpendicular (|cos| > 1e-6).
  LabFrame(const Vec3& normalCrystal, const Vec3& inPlaneXCrystal, const std::string& where = "sample");
  LabFrame() : LabFrame(Vec3(0, 0, 1), Vec3(1, 0, 0)) {}

  const Mat3& matrix() const { return frame_; }
  Vec3 toCrystal(const Vec3& lab) const { return frame_.transpose() * lab; }
  Vec3 toLab(const Vec3& crystal) const { return frame_ * crystal; }

private:
  Mat3 frame_;
};

/// Unit vector from a polar angle (from lab z) and azimuth (from lab x), degrees.
Vec3 directionFromAngles(double polarDeg, double azimuthDeg);
/// Polar and azimuth (degrees, azimuth in [0, 360)) of a non-zero vector.
std::array<double, 2> anglesOfDirection(const Vec3& v);

/// Rotation matrix about a unit axis by `angleRad` (right-handed).
Mat3 rotationAbout(const Vec3& axis, double angleRad);

}  // namespace finestra
