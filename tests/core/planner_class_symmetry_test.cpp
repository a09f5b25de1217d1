// Which orientation classes a field leaves equivalent, on (001), (110) and (111) sample cuts,
// checked against the group theory worked out by hand below and against the model itself.
//
// Class axes (docs/physics.md, Orientation classes): a0 = [111], a1 = [1-1-1], a2 = [-11-1],
// a3 = [-1-11]. Two classes are equivalent at a field B when |B·ai| = |B·aj|: then B lies in the
// plane normal to ai ∓ aj, a reflection plane of the cubic point group m-3m, which swaps the two
// axes (group theory of Oh, e.g. Dresselhaus, Dresselhaus & Jorio, "Group Theory" (Springer 2008),
// character table of Oh, from memory). With time reversal this makes every level, line and decay
// ratio of the two classes equal (Hepp et al., Phys. Rev. Lett. 112, 036405 (2014): the strain-free
// Hamiltonian depends on the field only through its components along and across the axis).
#include <gtest/gtest.h>

#include <cmath>
#include <numbers>

#include "core/planner/class_symmetry.h"
#include "core/planner/planner.h"
#include "core/project/model_setup.h"

using namespace finestra;

namespace {

using Groups = std::vector<std::vector<int>>;
const std::vector<int> kAll{0, 1, 2, 3};
constexpr double kDeg = std::numbers::pi / 180.0;

Groups groupsAt(const Vec3& b) { return classSymmetryAt(b.normalized(), kAll).groups; }

std::array<int, 3> mirrorOf(const Vec3& b, int i, int j) {
  for (const ClassTie& t : classSymmetryAt(b.normalized(), kAll).ties)
    if (t.first == i && t.second == j) return t.mirrorNormal;
  ADD_FAILURE() << "classes " << i << " and " << j << " are not tied";
  return {};
}

// Acute angle (deg) between a field and a ⟨111⟩ axis, from |B·a| / (|B| √3).
double angleTo(const Vec3& b, double dot) { return std::acos(std::abs(dot) / (b.norm() * std::sqrt(3.0))) / kDeg; }

}  // namespace

// (001) cut. In-plane B = (c, s, 0): B·a0 = c+s, B·a1 = c−s, B·a2 = −c+s, B·a3 = −c−s, so
// |B·a0| = |B·a3| and |B·a1| = |B·a2| for EVERY in-plane field: pairs {0,3} and {1,2}, both swapped
// by the (001) plane itself (a0 + a3 = [002], a1 + a2 = [00-2]).
TEST(ClassSymmetry, OnZeroZeroOneEveryInPlaneFieldPairsZeroThreeAndOneTwo) {
  for (double phi : {10.0, 20.0, 63.0, 100.0, 200.0, 333.0}) {
    const Vec3 b(std::cos(phi * kDeg), std::sin(phi * kDeg), 0);
    EXPECT_EQ(groupsAt(b), (Groups{{0, 3}, {1, 2}})) << phi;
    EXPECT_EQ(mirrorOf(b, 0, 3), (std::array<int, 3>{0, 0, 1})) << phi;
    EXPECT_EQ(mirrorOf(b, 1, 2), (std::array<int, 3>{0, 0, 1})) << phi;
  }
}

// (001) cut, special in-plane axes. B = [100]: B·a = 1, 1, −1, −1: all four at 54.74°.
// B = [110]: B·a = 2, 0, 0, −2: {0,3} at acos(2/√6) = 35.26°, {1,2} perpendicular (90°).
// The normal B = [001]: B·a = 1, −1, −1, 1: all four equivalent.
TEST(ClassSymmetry, OnZeroZeroOneSpecialAxesAndTheNormal) {
  EXPECT_EQ(groupsAt(Vec3(1, 0, 0)), (Groups{{0, 1, 2, 3}}));
  EXPECT_EQ(groupsAt(Vec3(0, 0, 1)), (Groups{{0, 1, 2, 3}}));
  const Vec3 b110(1, 1, 0);
  EXPECT_EQ(groupsAt(b110), (Groups{{0, 3}, {1, 2}}));
  for (const ClassTie& t : classSymmetryAt(b110.normalized(), kAll).ties) {
    const double expected = t.first == 0 ? angleTo(b110, 2) : angleTo(b110, 0);
    EXPECT_NEAR(t.axisAngleDeg, expected, 1e-9);
  }
  EXPECT_NEAR(angleTo(b110, 2), 35.2643897, 1e-6);
}

// (001) sample with the lab x axis along [110]: the in-plane pairs do not depend on which in-plane
// reference is chosen (the magnet's plane is still (001)), but the lab azimuth of the special
// directions moves: lab azimuth 0 is now crystal [110] ({0,3},{1,2}), lab azimuth 45° is [010]
// (all four, B·a = 1, −1, 1, −1).
TEST(ClassSymmetry, InPlaneReferenceMovesTheSpecialAzimuths) {
  const LabFrame lab(Vec3(0, 0, 1), Vec3(1, 1, 0));
  EXPECT_EQ(groupsAt(lab.toCrystal(directionFromAngles(90, 0))), (Groups{{0, 3}, {1, 2}}));
  EXPECT_EQ(groupsAt(lab.toCrystal(directionFromAngles(90, 45))), (Groups{{0, 1, 2, 3}}));
  EXPECT_EQ(groupsAt(lab.toCrystal(directionFromAngles(90, 17))), (Groups{{0, 3}, {1, 2}}));
}

// (111) cut. The normal B = [111]: B·a = 3, −1, −1, −1: class 0 alone on its axis, 1, 2, 3 at
// acos(1/3) = 70.53°. In-plane B = [1-10]: B·a = 0, 2, −2, 0: {0,3} perpendicular, {1,2} at 35.26°.
// In-plane B = [11-2]: B·a = 0, 2, 2, −4: {1,2} only; 0 (90°) and 3 (19.47°) alone.
TEST(ClassSymmetry, OnOneOneOneCut) {
  EXPECT_EQ(groupsAt(Vec3(1, 1, 1)), (Groups{{0}, {1, 2, 3}}));
  const auto along = classSymmetryAt(Vec3(1, 1, 1).normalized(), kAll);
  for (const ClassTie& t : along.ties) EXPECT_NEAR(t.axisAngleDeg, std::acos(1.0 / 3) / kDeg, 1e-9);
  EXPECT_EQ(groupsAt(Vec3(1, -1, 0)), (Groups{{0, 3}, {1, 2}}));
  EXPECT_EQ(groupsAt(Vec3(1, 1, -2)), (Groups{{0}, {1, 2}, {3}}));
  EXPECT_EQ(mirrorOf(Vec3(1, 1, -2), 1, 2), (std::array<int, 3>{1, -1, 0}));  // a1 − a2 = [2-20]
}

// (110) cut. In-plane B = α[1-10]/√2 + β[001]: B·a0 = β = B·a3, B·a1 = √2α − β, B·a2 = −√2α − β.
// So {0,3} for every in-plane field (swapped by the (110) plane itself: a0 − a3 = [220]); 1 and 2
// apart unless α = 0 or β = 0. B = [001]: all four. B = [1-10]: {0,3} at 90°, {1,2}. B = [1-11]
// (in the plane): B·a = 1, 1, −3, 1: class 2 alone on its axis, {0,1,3}.
TEST(ClassSymmetry, OnOneOneZeroCut) {
  for (double t : {15.0, 40.0, 110.0, 250.0}) {
    const Vec3 b = std::cos(t * kDeg) * Vec3(1, -1, 0).normalized() + std::sin(t * kDeg) * Vec3(0, 0, 1);
    EXPECT_EQ(groupsAt(b), (Groups{{0, 3}, {1}, {2}})) << t;
    EXPECT_EQ(mirrorOf(b, 0, 3), (std::array<int, 3>{1, 1, 0})) << t;
  }
  EXPECT_EQ(groupsAt(Vec3(0, 0, 1)), (Groups{{0, 1, 2, 3}}));
  EXPECT_EQ(groupsAt(Vec3(1, -1, 0)), (Groups{{0, 3}, {1, 2}}));
  EXPECT_EQ(groupsAt(Vec3(1, -1, 1)), (Groups{{0, 1, 3}, {2}}));
  EXPECT_EQ(groupsAt(Vec3(1, 1, 0)), (Groups{{0, 3}, {1, 2}}));  // the normal: B·a = 2, 0, 0, −2
}

// A magnet turning in the (110) sample plane can never single out class 0 (always tied to 3), but
// can single out class 1 (apart from 2 except at two pairs of directions).
TEST(ClassSymmetry, ReachInTheOneOneZeroPlaneWarnsForClassZeroOnly) {
  MagnetReach reach;
  reach.kind = ReachKind::Plane;
  reach.stepDeg = 5;
  reach.planeNormalLab = Vec3(0, 0, 1);
  reach.planeStartLab = Vec3(1, 0, 0);
  const LabFrame lab(Vec3(1, 1, 0), Vec3(0, 0, 1));
  std::vector<Vec3> crystal;
  std::vector<double> weights;
  for (const auto& d : reachableDirections(reach)) crystal.push_back(lab.toCrystal(d.lab)), weights.push_back(d.solidAngleWeight);
  const ReachSymmetry zero = targetSymmetryOverReach(crystal, weights, 0, kAll);
  EXPECT_EQ(zero.targetAloneShare, 0.0);
  EXPECT_EQ(zero.alwaysTiedWith, (std::vector<int>{3}));
  EXPECT_NE(zero.warning.find("class 0 cannot be singled out"), std::string::npos) << zero.warning;
  EXPECT_NE(zero.warning.find("(110) plane"), std::string::npos) << zero.warning;
  // Class 1 ties with 2 only at [001] (α = 0) and [1-10] (β = 0), each in both senses: 4 of 72.
  const ReachSymmetry one = targetSymmetryOverReach(crystal, weights, 1, kAll);
  EXPECT_NEAR(one.targetAloneShare, 68.0 / 72.0, 1e-12);
  EXPECT_TRUE(one.warning.empty());
  // Among the selected classes only: without class 3, class 0 is alone almost everywhere.
  EXPECT_GT(targetSymmetryOverReach(crystal, weights, 0, {0, 1, 2}).targetAloneShare, 0.9);
}

// The model agrees: at a (110)-plane field classes 0 and 3 have the same qubit, cyclicity and
// gaps to rounding, and the same drive when the microwave field lies in the mirror ([001]) but not
// for the other drive directions tried (off the mirror, not along its normal); classes 1 and 2
// differ. The strain used is one the (110) mirror keeps, so the equivalence survives it.
TEST(ClassSymmetry, ModelFiguresFollowTheTies) {
  Project p;
  p.centre.preset = "SiV-";
  p.sample.normal = Vec3(0, 0, 1);
  p.sample.inPlaneX = Vec3(1, 0, 0);  // lab = crystal
  // A uniaxial strain along [001] lies in the (110) mirror, so the mirror keeps it; its E part
  // gives the qubit a drive (zero for the strain-free centre, docs/physics.md, Planner figures).
  p.strain.crystal = strainFromComponents(0, 0, 1e-4, 0, 0, 0);
  const CentreModel model(makeModelSetup(p));
  const Vec3 b = (std::cos(40 * kDeg) * Vec3(1, -1, 0).normalized() + std::sin(40 * kDeg) * Vec3(0, 0, 1)).normalized();
  for (const Vec3& drive : {Vec3(0, 0, 1), Vec3(1, 0, 0), Vec3(1, 2, 3), Vec3(0.3, -0.5, 0.2)}) {
    PlannerSettings settings;
    settings.driveLab = drive;
    std::array<ClassFigures, kClassCount> f{};
    PlannerKernel(model, settings).evaluate(b, 0.4, f);
    const auto ties = classSymmetryAt(b, kAll, drive).ties;
    ASSERT_EQ(ties.size(), 1u);
    EXPECT_NEAR(f[0].qubitGHz, f[3].qubitGHz, 1e-9);
    EXPECT_NEAR(std::log(f[0].cyclicity), std::log(f[3].cyclicity), 1e-6);
    EXPECT_NEAR(f[0].groundGapGHz, f[3].groundGapGHz, 1e-6);
    EXPECT_NEAR(f[0].excitedGapGHz, f[3].excitedGapGHz, 1e-6);
    EXPECT_GT(std::abs(f[1].qubitGHz - f[2].qubitGHz), 1e-3);
    if (ties.front().driveAlsoEqual) {
      EXPECT_NEAR(f[0].driveGHzPerT, f[3].driveGHzPerT, 1e-9);
    } else {
      EXPECT_GT(std::abs(f[0].driveGHzPerT - f[3].driveGHzPerT), 1e-6);
    }
    EXPECT_EQ(ties.front().driveAlsoEqual, drive == Vec3(0, 0, 1));
  }
}

TEST(ClassSymmetry, MillerTextOfLowAndHighIndexDirections) {
  EXPECT_EQ(millerPlane(Vec3(0, 0, 2)), "(001)");
  EXPECT_EQ(millerDirection(Vec3(1, -1, 0) / std::sqrt(2.0)), "[1-10]");
  EXPECT_EQ(millerDirection(Vec3(1, 1, -2)), "[11-2]");
  EXPECT_EQ(millerDirection(Vec3(0.1, 0.2, 0.97)).front(), '[');
  EXPECT_NE(millerDirection(Vec3(0.1234, 0.2, 0.97)).find("0.124"), std::string::npos);
}
