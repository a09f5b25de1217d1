// Level identity along sweeps: tracked levels must pass through true crossings.
#include <gtest/gtest.h>

#include "core/sweep/sweep.h"
#include "core/project/model_setup.h"
#include "test_support.h"

using namespace finestra;

TEST(Tracking, LevelsStayStraightThroughCrossings) {
  // With B along the defect axis and no strain, L_z and S_z are conserved, so every level is
  // exactly linear in |B| (E = ∓λ/2·L_z s_z + q γ_L B L_z + γ_S B s_z / 2); the ground levels cross
  // near γ_S B ≈ λ_g. Tracked levels must keep a constant slope; levels sorted by energy would kink.
  Project project;
  project.centre.preset = "SiV-";
  project.sample = {Vec3(0, 0, 1), Vec3(1, 0, 0)};
  project.field.form = FieldSetting::Form::VectorCrystal;
  project.field.vector = Vec3(1, 1, 1).normalized();
  project.classes = {0};
  SweepSpec sweep;
  sweep.kind = SweepKind::Magnitude;
  sweep.from = 0.1;
  sweep.to = 4.0;
  sweep.points = 157;
  const CentreModel model(makeModelSetup(project));
  const SweepResult r = runSweep(model, project, sweep);
  const Eigen::MatrixXd& g = r.classes[0].groundLevels;
  const double h = r.x[1] - r.x[0];
  double worstCurvature = 0;
  for (Eigen::Index k = 1; k + 1 < g.rows(); ++k)
    worstCurvature = std::max(worstCurvature, (g.row(k + 1) - 2 * g.row(k) + g.row(k - 1)).cwiseAbs().maxCoeff() / (h * h));
  EXPECT_LT(worstCurvature, 1e-4);
  // The fan really contains a crossing: the order of some pair of tracked levels flips.
  bool crossed = false;
  for (Eigen::Index a = 0; a < g.cols(); ++a)
    for (Eigen::Index b = 0; b < g.cols(); ++b)
      crossed = crossed || (g(0, a) < g(0, b) && g(g.rows() - 1, a) > g(g.rows() - 1, b));
  EXPECT_TRUE(crossed);
}

TEST(Tracking, LabelsFollowBranchesFromZeroField) {
  // Along the axis the lower ground branch (L_z s_z = +½) shifts as (q γ_L + γ_S/2)·B·(±1): at 3 T the
  // branch-following labels must still give four lines per parent letter with indices 1..4.
  const CentreModel model(finestra::testing::setupFor("SiV-"));
  const ClassSolution s = model.solve(0, 3.0 * Vec3(1, 1, 1).normalized());
  std::map<char, int> count;
  for (const OpticalLine& l : s.lines) {
    ++count[l.parent];
    EXPECT_GE(l.subIndex, 1);
    EXPECT_LE(l.subIndex, 4);
  }
  for (char p : {'A', 'B', 'C', 'D'}) EXPECT_EQ(count[p], 4) << p;
  // At 3 T the Zeeman shifts exceed λ_g = 48 GHz: the energy-sorted second level already belongs to the
  // upper branch, which only tracking from zero field can tell.
  int upperAmongLowestTwo = s.groundBranch[0] + s.groundBranch[1];
  EXPECT_EQ(upperAmongLowestTwo, 1);
}
