// Symmetry invariances that pin the frame conventions (docs/physics.md, Frames;
// docs/physics.md, Check values used by the tests).
// A proper rotation R applied together to the field, the strain tensor and the analyser leaves
// every observable of the ensemble of four classes unchanged when R is a cubic symmetry; one class
// alone is unchanged under its own C3 and its C2 about y, and changed by C2 about x.
#include <gtest/gtest.h>

#include <algorithm>
#include <numbers>

#include "test_support.h"

using namespace finestra;
using finestra::testing::randomStrain;
using finestra::testing::randomVector;

namespace {

struct Observable {
  double frequency, intensity;
};

// Lines of the given classes for a field, strain and analyser (all crystal frame; lab = crystal).
std::vector<Observable> observe(const std::vector<int>& classes, const Vec3& field, const Mat3& strain,
                                const Vec3& analyser) {
  ModelSetup setup = finestra::testing::setupFor("SiV-", {}, strain);
  setup.conditions.analyserLab = analyser;
  const CentreModel model(setup);
  std::vector<Observable> out;
  for (int cls : classes)
    for (const OpticalLine& l : model.solve(cls, field, 4).lines) out.push_back({l.frequencyGHz, l.intensity});
  std::sort(out.begin(), out.end(), [](const Observable& a, const Observable& b) { return a.frequency < b.frequency; });
  return out;
}

double largestDifference(const std::vector<Observable>& a, const std::vector<Observable>& b) {
  double worst = 0;
  for (std::size_t i = 0; i < a.size(); ++i)
    worst = std::max({worst, std::abs(a[i].frequency - b[i].frequency), std::abs(a[i].intensity - b[i].intensity)});
  return worst;
}

struct Configuration {
  Vec3 field, analyser;
  Mat3 strain;
};

Configuration randomConfiguration(std::mt19937& rng) {
  return {randomVector(rng, 1.5), randomVector(rng, 1.0).normalized(), randomStrain(rng, 1e-5)};
}

double changeUnder(const Mat3& r, const std::vector<int>& classes, const Configuration& c) {
  return largestDifference(observe(classes, c.field, c.strain, c.analyser),
                           observe(classes, r * c.field, r * c.strain * r.transpose(), r * c.analyser));
}

Mat3 aboutAxis(const Vec3& axis, double degrees) { return rotationAbout(axis, degrees * std::numbers::pi / 180.0); }

}  // namespace

TEST(Symmetry, EnsembleIsInvariantUnderCubicRotations) {
  std::mt19937 rng(3);
  const std::vector<Mat3> cubic{aboutAxis(Vec3(0, 0, 1), 90), aboutAxis(Vec3(1, 0, 0), 90), aboutAxis(Vec3(1, 1, 1), 120),
                                aboutAxis(Vec3(1, 1, 0), 180), aboutAxis(Vec3(0, 1, 0), 180)};
  for (int trial = 0; trial < 3; ++trial) {
    const Configuration c = randomConfiguration(rng);
    for (const Mat3& r : cubic) EXPECT_LT(changeUnder(r, {0, 1, 2, 3}, c), 1e-7);
  }
}

TEST(Symmetry, EachClassIsInvariantUnderItsOwnC3AndC2y) {
  std::mt19937 rng(4);
  for (int cls = 0; cls < 4; ++cls) {
    const Vec3 x = defectFrame(cls).row(0).transpose(), y = defectFrame(cls).row(1).transpose(),
               z = defectFrame(cls).row(2).transpose();
    const Configuration c = randomConfiguration(rng);
    EXPECT_LT(changeUnder(aboutAxis(z, 120), {cls}, c), 1e-7) << "C3, class " << cls;
    EXPECT_LT(changeUnder(aboutAxis(y, 180), {cls}, c), 1e-7) << "C2y, class " << cls;
    // Negative case: C2 about x is not a symmetry of D3d with our x in a mirror plane.
    EXPECT_GT(changeUnder(aboutAxis(x, 180), {cls}, c), 1e-3) << "C2x, class " << cls;
  }
}

TEST(Symmetry, ClassFramesAreRightHandedAndOnTheirAxes) {
  for (int cls = 0; cls < 4; ++cls) {
    const Mat3& f = defectFrame(cls);
    EXPECT_NEAR((f * f.transpose() - Mat3::Identity()).norm(), 0.0, 1e-14);
    EXPECT_NEAR(f.determinant(), 1.0, 1e-14);
    const auto axis = classAxisIndices(cls);
    EXPECT_NEAR(f.row(2).dot(Vec3(axis[0], axis[1], axis[2]).normalized()), 1.0, 1e-14);
  }
  // Class 0 (docs/physics.md, Frames): x = [11-2]/√6, y = [-110]/√2.
  EXPECT_NEAR(defectFrame(0).row(0).dot(Vec3(1, 1, -2).normalized()), 1.0, 1e-14);
  EXPECT_NEAR(defectFrame(0).row(1).dot(Vec3(-1, 1, 0).normalized()), 1.0, 1e-14);
}

TEST(Symmetry, StrainAngleDoesNotMoveLevels) {
  // docs/physics.md, What line positions tell about strain:
  // an orbital rotation about the axis commutes with spin–orbit, Zeeman and hyperfine,
  // so at fixed |ε_Eg| the levels do not depend on the E-strain angle.
  std::mt19937 rng(8);
  ModelSetup setup = finestra::testing::setupFor("SiV-");
  for (int trial = 0; trial < 5; ++trial) {
    const Vec3 field = randomVector(rng, 2.0);
    std::vector<VectorXr> ground, excited;
    for (double angle : {0.0, 37.0, 90.0, 211.0}) {
      setup.strain.extraGround = {35.0, angle};
      setup.strain.extraExcited = {80.0, angle + 15.0};
      const CentreModel model(setup);
      ground.push_back(model.levels(Manifold::Ground, 0, field).energies);
      excited.push_back(model.levels(Manifold::Excited, 0, field).energies);
    }
    for (std::size_t k = 1; k < ground.size(); ++k) {
      EXPECT_LT((ground[k] - ground[0]).cwiseAbs().maxCoeff(), 1e-9);
      EXPECT_LT((excited[k] - excited[0]).cwiseAbs().maxCoeff(), 1e-9);
    }
  }
}
