// Physical facts the planner must reproduce (issue 5), checked from the physics, not the code.
#include <gtest/gtest.h>

#include <cmath>
#include <numbers>

#include "core/project/model_setup.h"
#include "core/planner/planner.h"
#include "core/units/constants.h"

using namespace finestra;

namespace {

constexpr double kDeg = std::numbers::pi / 180.0;

// Sample: (001) normal with lab x along [100], so lab and crystal axes coincide.
Project cubicLabProject() {
  Project p;
  p.centre.preset = "SiV-";
  p.sample.normal = Vec3(0, 0, 1);
  p.sample.inPlaneX = Vec3(1, 0, 0);
  return p;
}

std::array<ClassFigures, kClassCount> figuresAt(const CentreModel& model, const PlannerSettings& s, const Vec3& b) {
  std::array<ClassFigures, kClassCount> out{};
  PlannerKernel(model, s).evaluate(b.normalized(), b.norm(), out);
  return out;
}

void expectSameFigures(const ClassFigures& a, const ClassFigures& b, const std::string& what) {
  EXPECT_NEAR(a.qubitGHz, b.qubitGHz, 1e-9) << what;
  EXPECT_NEAR(a.driveFraction, b.driveFraction, 1e-9) << what;
  EXPECT_NEAR(std::log(a.cyclicity), std::log(b.cyclicity), 1e-6) << what;
  EXPECT_NEAR(a.separationLinewidths, b.separationLinewidths, 1e-6) << what;
  EXPECT_NEAR(a.groundGapGHz, b.groundGapGHz, 1e-6) << what;
  EXPECT_NEAR(a.excitedGapGHz, b.excitedGapGHz, 1e-6) << what;
  // The class axis is non-polar (D3d has inversion): θ and 180° − θ are the same geometry.
  EXPECT_NEAR(std::min(a.axisAngleDeg, 180 - a.axisAngleDeg), std::min(b.axisAngleDeg, 180 - b.axisAngleDeg), 1e-9) << what;
}

}  // namespace

// Without strain, B ∥ axis conserves S_z in both manifolds (every term commutes with S_z) and the
// dipole operator does not act on spin, so spin-flipping decay vanishes: cyclicity is largest on
// the axis (Hepp et al., PRL 112, 036405 (2014), model as in docs/physics.md, Zeeman).
TEST(PlannerPhysics, FieldAlongClassAxisMaximisesItsCyclicity) {
  const CentreModel model(makeModelSetup(cubicLabProject()));
  PlannerSettings settings;
  SphereGrid grid;
  grid.polarCount = 37;   // 5° steps
  grid.azimuthCount = 73;
  settings.magnitudeT = 0.5;
  const FigureMap map = computeFigureMap(model, settings, grid);
  for (int cls = 0; cls < kClassCount; ++cls) {
    double best = -1;
    Vec3 bestDir = Vec3::Zero();
    for (int i = 0; i < grid.polarCount; ++i)
      for (int j = 0; j < grid.azimuthCount; ++j)
        if (map.at(i, j, cls).cyclicity > best) {
          best = map.at(i, j, cls).cyclicity;
          bestDir = directionFromAngles(grid.polarDeg(i), grid.azimuthDeg(j));
        }
    const auto a = classAxisIndices(cls);
    const Vec3 axis = Vec3(a[0], a[1], a[2]).normalized();
    // The grid does not contain the axis exactly: the best grid point is the one closest to ±axis.
    EXPECT_GT(std::abs(bestDir.dot(axis)), std::cos(4.0 * kDeg)) << "class " << cls;
    // Exactly on the axis the flip is forbidden, and off axis finite and smaller.
    const auto onAxis = figuresAt(model, settings, 0.5 * axis);
    EXPECT_GE(onAxis[static_cast<std::size_t>(cls)].cyclicity, 1e12) << "class " << cls;
    EXPECT_LT(best, onAxis[static_cast<std::size_t>(cls)].cyclicity);
  }
}

// [001] makes the same angle (54.74°) with all four ⟨111⟩ axes; the cubic C2 rotations that map
// the classes onto each other map [001] and [100] onto ± themselves, and B → −B leaves every
// figure unchanged (time reversal), so all four classes are equivalent.
TEST(PlannerPhysics, AlongZeroZeroOneAllClassesAreEquivalent) {
  const CentreModel model(makeModelSetup(cubicLabProject()));
  PlannerSettings settings;
  settings.driveLab = Vec3(1, 0, 0);  // [100]
  const auto f = figuresAt(model, settings, Vec3(0, 0, 0.7));
  for (int cls = 1; cls < kClassCount; ++cls)
    expectSameFigures(f[0], f[static_cast<std::size_t>(cls)], "class " + std::to_string(cls));
  EXPECT_NEAR(f[0].axisAngleDeg, std::acos(1 / std::sqrt(3.0)) / kDeg, 1e-9);  // 54.7356°
}

// Along [111]: class 0 is parallel to the field, classes 1–3 make arccos(−1/3) = 109.47° and are
// permuted by the C3 rotation about [111], which fixes the field and a drive along [111].
TEST(PlannerPhysics, AlongOneOneOneClassZeroStandsApart) {
  const CentreModel model(makeModelSetup(cubicLabProject()));
  PlannerSettings settings;
  settings.driveLab = Vec3(1, 1, 1);
  const auto f = figuresAt(model, settings, 0.4 * Vec3(1, 1, 1).normalized());
  EXPECT_NEAR(f[0].axisAngleDeg, 0.0, 1e-6);
  for (int cls = 1; cls < kClassCount; ++cls) {
    EXPECT_NEAR(f[static_cast<std::size_t>(cls)].axisAngleDeg, 109.4712206, 1e-6);
    expectSameFigures(f[1], f[static_cast<std::size_t>(cls)], "class " + std::to_string(cls));
  }
  EXPECT_GT(std::abs(f[0].qubitGHz - f[1].qubitGHz), 1.0);
  EXPECT_GE(f[0].cyclicity, 1e12);
  EXPECT_LT(f[1].cyclicity, 1e6);
}

// Unstrained, B ∥ axis: the lower-branch states are |L_z=+1,↑⟩ and |L_z=−1,↓⟩ (λ > 0, docs/physics.md,
// Spin–orbit), so the qubit splitting is (γ_S + 2 q γ_L)|B| exactly, with γ_L = μ_B/h and γ_S = g_s μ_B/h
// (CODATA 2018).
TEST(PlannerPhysics, QubitFrequencyAlongTheAxisIsTheLinearZeeman) {
  const CentreModel model(makeModelSetup(cubicLabProject()));
  const double b = 0.8, q = model.setup().centre.parameters.get(Param::QG);
  const auto f = figuresAt(model, PlannerSettings{}, b * Vec3(1, 1, 1).normalized());
  const double gammaL = constants::kBohrGHzPerT, gammaS = constants::kElectronG * constants::kBohrGHzPerT;
  EXPECT_NEAR(f[0].qubitGHz, (gammaS + 2 * q * gammaL) * b, 1e-9);
}

// Spin–orbit locking: the two qubit states differ in L_z, and a microwave field ⟂ the axis acts
// on the spin only, so without strain and with B ∥ axis it cannot flip the qubit; strain mixes the
// orbitals and opens it (Pieplow et al., arXiv 2312.02637). In this model only B_z couples to the
// orbit, so without strain L_z stays conserved for every DC field direction and the drive stays
// zero; with strain, a transverse DC field also opens a drive along the axis (docs/physics.md, Planner figures).
TEST(PlannerPhysics, PerpendicularDriveCannotFlipTheLockedQubit) {
  const Vec3 axis = Vec3(1, 1, 1).normalized(), perp = Vec3(1, -1, 0).normalized();
  const Vec3 tilted = 0.5 * (std::cos(20 * kDeg) * axis + std::sin(20 * kDeg) * Vec3(1, 1, -2).normalized());
  PlannerSettings perpendicular, parallel;
  perpendicular.driveLab = perp;  // lab = crystal in this project
  parallel.driveLab = axis;
  {
    const CentreModel model(makeModelSetup(cubicLabProject()));
    EXPECT_LT(figuresAt(model, perpendicular, 0.5 * axis)[0].driveFraction, 1e-9);
    EXPECT_LT(figuresAt(model, perpendicular, tilted)[0].driveFraction, 1e-9);
    EXPECT_LT(figuresAt(model, parallel, tilted)[0].driveFraction, 1e-9);
  }
  {
    Project strained = cubicLabProject();
    strained.strain.extraGround.magnitudeGHz = 30;  // E-type strain comparable to λ_g
    const CentreModel model(makeModelSetup(strained));
    EXPECT_GT(figuresAt(model, perpendicular, 0.5 * axis)[0].driveFraction, 0.05);
    EXPECT_LT(figuresAt(model, parallel, 0.5 * axis)[0].driveFraction, 1e-9);  // S_z is still conserved
    EXPECT_GT(figuresAt(model, parallel, tilted)[0].driveFraction, 0.05);
  }
}

// Orbital quenching: an E-type strain much larger than λ_g pins the orbital state, the spin is then
// almost free (corrections ~ (λ/2ε)²), so the qubit splits by γ_S|B| and a drive ⊥ B flips it with
// the free-electron matrix element γ_S/2 (|⟨↓|S_x|↑⟩| = 1/2) in any field direction (quenching
// of orbital angular momentum by a crystal field: Abragam & Bleaney, EPR of Transition Ions, 1970).
TEST(PlannerPhysics, QuenchedOrbitRecoversTheFreeElectronDrive) {
  Project p = cubicLabProject();
  p.strain.extraGround.magnitudeGHz = 1000;
  const CentreModel model(makeModelSetup(p));
  PlannerSettings settings;
  settings.driveLab = Vec3(0, 1, 0);
  const double gammaS = constants::kElectronG * constants::kBohrGHzPerT;
  for (const Vec3& dir : {Vec3(1, 0, 0), Vec3(1, 0, 1).normalized(), Vec3(0, 0, 1)}) {
    const auto f = figuresAt(model, settings, 0.3 * dir);
    for (int cls = 0; cls < kClassCount; ++cls) {
      EXPECT_NEAR(f[static_cast<std::size_t>(cls)].driveFraction, 1.0, 0.01) << dir.transpose() << " class " << cls;
      EXPECT_NEAR(f[static_cast<std::size_t>(cls)].qubitGHz, gammaS * 0.3, 0.01 * gammaS * 0.3);
    }
  }
}

TEST(PlannerPhysics, ReachableDirectionsFollowTheMagnetGeometry) {
  MagnetReach plane;
  plane.kind = ReachKind::Plane;
  plane.planeNormalLab = Vec3(0, 1, 1);
  plane.planeStartLab = Vec3(1, 0, 0);
  plane.stepDeg = 10;
  const auto inPlane = reachableDirections(plane);
  ASSERT_EQ(inPlane.size(), 36u);
  for (const auto& d : inPlane) EXPECT_NEAR(d.lab.dot(Vec3(0, 1, 1).normalized()), 0.0, 1e-12);

  MagnetReach rotation;
  rotation.kind = ReachKind::SampleRotation;
  rotation.magnetAxisLab = Vec3(1, 0, 1);
  rotation.rotationAxisLab = Vec3(0, 0, 1);
  rotation.stepDeg = 30;
  for (const auto& d : reachableDirections(rotation)) EXPECT_NEAR(d.polarDeg, 45.0, 1e-9);  // a cone

  MagnetReach sphere;
  sphere.stepDeg = 5;
  double total = 0;
  for (const auto& d : reachableDirections(sphere)) total += d.solidAngleWeight;
  EXPECT_NEAR(total, 1.0, 1e-12);
}
