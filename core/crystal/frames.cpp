#include "core/crystal/frames.h"

#include <cmath>
#include <numbers>

#include "core/common/errors.h"

namespace finestra {
namespace {

Mat3 makeClassZeroFrame() {
  Mat3 f;
  f.row(0) = Vec3(1, 1, -2).normalized();  // x: lies in a mirror plane
  f.row(2) = Vec3(1, 1, 1).normalized();   // z: the symmetry axis
  f.row(1) = f.row(2).cross(f.row(0));     // y = z × x = [-110]/√2, a C2 axis
  return f;
}

std::array<Mat3, kClassCount> makeClassFrames() {
  const Mat3 f0 = makeClassZeroFrame();
  // Cubic C2 rotations about [100], [010], [001] act on crystal vectors as diagonal sign flips;
  // applied to each axis (a row of F) they multiply F from the right.
  const std::array<Vec3, kClassCount> flips{Vec3(1, 1, 1), Vec3(1, -1, -1), Vec3(-1, 1, -1),
                                            Vec3(-1, -1, 1)};
  std::array<Mat3, kClassCount> frames;
  for (int c = 0; c < kClassCount; ++c) frames[c] = f0 * flips[c].asDiagonal();
  return frames;
}

void requireUsableVector(const Vec3& v, const std::string& where) {
  if (!v.allFinite()) throw InputError(where, "vector has a non-finite component");
  if (v.norm() < 1e-12) throw InputError(where, "vector is zero");
}

}  // namespace

std::array<int, 3> classAxisIndices(int cls) {
  static const std::array<std::array<int, 3>, kClassCount> axes{
      {{1, 1, 1}, {1, -1, -1}, {-1, 1, -1}, {-1, -1, 1}}};
  return axes.at(static_cast<std::size_t>(cls));
}

const Mat3& defectFrame(int cls) {
  static const std::array<Mat3, kClassCount> frames = makeClassFrames();
  return frames.at(static_cast<std::size_t>(cls));
}

Mat3 rotateTensor(const Mat3& frame, const Mat3& tensor) { return frame * tensor * frame.transpose(); }

LabFrame::LabFrame(const Vec3& normal, const Vec3& inPlaneX, const std::string& where) {
  requireUsableVector(normal, where + ".normal");
  requireUsableVector(inPlaneX, where + ".in_plane_x");
  const Vec3 z = normal.normalized();
  const Vec3 x = inPlaneX.normalized();
  if (std::abs(z.dot(x)) > 1e-6)
    throw InputError(where, "in_plane_x is not perpendicular to normal (angle " +
                                std::to_string(std::acos(std::clamp(z.dot(x), -1.0, 1.0)) * 180 /
                                               std::numbers::pi) +
                                " deg)");
  frame_.row(0) = x;
  frame_.row(1) = z.cross(x);
  frame_.row(2) = z;
}

Vec3 directionFromAngles(double polarDeg, double azimuthDeg) {
  const double t = polarDeg * std::numbers::pi / 180.0;
  const double p = azimuthDeg * std::numbers::pi / 180.0;
  return {std::sin(t) * std::cos(p), std::sin(t) * std::sin(p), std::cos(t)};
}

std::array<double, 2> anglesOfDirection(const Vec3& v) {
  const double r = v.norm();
  if (r == 0.0) return {0.0, 0.0};
  const double polar = std::acos(std::clamp(v.z() / r, -1.0, 1.0)) * 180.0 / std::numbers::pi;
  double azimuth = std::atan2(v.y(), v.x()) * 180.0 / std::numbers::pi;
  if (azimuth < 0) azimuth += 360.0;
  return {polar, azimuth};
}

Mat3 rotationAbout(const Vec3& axis, double angleRad) {
  return Eigen::AngleAxisd(angleRad, axis.normalized()).toRotationMatrix();
}

}  // namespace finestra
