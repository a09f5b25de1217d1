#include "core/planner/alignment_cone.h"

#include <cmath>
#include <numbers>

#include "core/centre/parameter_table.h"

namespace finestra {
namespace {

void lowerTo(double& worst, double sample) {
  if (std::isnan(sample)) return;
  if (std::isnan(worst) || sample < worst) worst = sample;
}

}  // namespace

void validateAlignmentTolerance(double toleranceDeg, const std::string& key) {
  requireInRange(quantity("planner.alignment_tolerance_deg"), toleranceDeg, key);
}

std::vector<double> coneRingsDeg(double toleranceDeg) {
  std::vector<double> rings;
  if (!(toleranceDeg > 0)) return rings;
  for (double ring : kConeRingsDeg) {
    rings.push_back(ring);
    if (ring >= toleranceDeg) break;
  }
  return rings;
}

std::vector<Vec3> coneDirections(const Vec3& axis, double toleranceDeg) {
  std::vector<Vec3> out{axis};
  const Vec3 u = axis.unitOrthogonal(), v = axis.cross(u);
  for (double ringDeg : coneRingsDeg(toleranceDeg)) {
    const double polar = ringDeg * std::numbers::pi / 180.0;
    for (int k = 0; k < kConeRingPoints; ++k) {
      const double azimuth = 2 * std::numbers::pi * k / kConeRingPoints;
      out.push_back((std::cos(polar) * axis + std::sin(polar) * (std::cos(azimuth) * u + std::sin(azimuth) * v)).normalized());
    }
  }
  return out;
}

bool judgedInCone(FigureId id) {
  return id == FigureId::DriveGHzPerT || id == FigureId::DriveFraction || id == FigureId::Cyclicity ||
         id == FigureId::SeparationLinewidths;
}

void foldWorst(ClassFigures& worst, const ClassFigures& sample) {
  lowerTo(worst.driveGHzPerT, sample.driveGHzPerT);
  lowerTo(worst.driveFraction, sample.driveFraction);
  lowerTo(worst.cyclicity, sample.cyclicity);
  lowerTo(worst.separationLinewidths, sample.separationLinewidths);
}

}  // namespace finestra
