// The fit's analytic Jacobian (Hellmann–Feynman level derivatives, core/fit/peak_jacobian.cpp)
// against central differences of the residuals, for SiV-, GeV- and SnV-, with and without a
// zero-field measurement set (Kramers-degenerate levels); PbV- is left out because its preset
// lacks the excited spin-orbit splitting and lifetime the synthetic peaks need, and the level derivatives of a
// Hermitian matrix against exact results.
#include <gtest/gtest.h>

#include <cmath>
#include <random>

#include "core/fit/level_derivatives.h"
#include "fit_test_support.h"

namespace finestra {
namespace {

using namespace finestra::testing;

MatrixXc randomHermitian(int n, std::mt19937_64& rng) {
  std::normal_distribution<double> g(0.0, 1.0);
  MatrixXc a(n, n);
  for (int i = 0; i < n; ++i)
    for (int j = 0; j < n; ++j) a(i, j) = {g(rng), g(rng)};
  return (a + a.adjoint()) / 2.0;
}

ManifoldEigen eigenOf(const MatrixXc& h) {
  const Eigen::SelfAdjointEigenSolver<MatrixXc> s(h);
  return {s.eigenvalues(), s.eigenvectors()};
}

// Two levels ±√(a² + c²) of [[a, c], [c, −a]]: dE±/da = ±a/√(a² + c²) (exact, elementary algebra).
TEST(LevelDerivatives, TwoLevelFormula) {
  const double a = 0.3, c = 1.7;
  MatrixXc h(2, 2), dh(2, 2);
  h << a, c, c, -a;
  dh << 1, 0, 0, -1;
  const VectorXr d = levelDerivatives(eigenOf(h), dh);
  const double r = std::hypot(a, c);
  EXPECT_NEAR(d[0], -a / r, 1e-14);
  EXPECT_NEAR(d[1], a / r, 1e-14);
}

// Random H = A + tB with an exactly degenerate pair at t = 0: the derivative of each level of the
// pair is the mean of its one-sided derivatives, the eigenvalues of the pair's block of B (first-order
// degenerate perturbation theory, common practice); the others are ⟨v|B|v⟩. Checked against central
// differences of the ascending eigenvalues, which converge to exactly these values (at a crossing
// they do so linearly in the step, through the pair's second-order shifts; with h = 1e-6 the
// rounding and that error stay below 1e-5, while a mishandled pair is off by O(1)).
TEST(LevelDerivatives, RandomAndDegenerateMatricesAgreeWithCentralDifferences) {
  std::mt19937_64 rng(16);
  for (int trial = 0; trial < 20; ++trial) {
    const int n = trial % 2 ? 8 : 4;
    const MatrixXc b = randomHermitian(n, rng);
    MatrixXc a = randomHermitian(n, rng);
    if (trial % 4 < 2) {  // make levels 1 and 2 exactly degenerate
      ManifoldEigen e = eigenOf(a);
      e.energies[2] = e.energies[1];
      a = e.vectors * e.energies.cast<cplx>().asDiagonal() * e.vectors.adjoint();
      a = (a + a.adjoint()).eval() / 2.0;
    }
    const VectorXr analytic = levelDerivatives(eigenOf(a), b);
    const double h = 1e-6;
    const VectorXr plus = eigenOf(a + h * b).energies, minus = eigenOf(a - h * b).energies;
    const VectorXr numeric = (plus - minus) / (2 * h);
    EXPECT_LT((analytic - numeric).cwiseAbs().maxCoeff(), 1e-5) << "trial " << trial;
  }
}

struct JacobianCase {
  std::string preset;
  bool zeroFieldSet;
};

class FitJacobian : public ::testing::TestWithParam<JacobianCase> {};

// The analytic Jacobian of PeakFitModel equals the central-difference Jacobian of its residuals
// (same step) at a point away from the truth, for fit parameters of every kind: E-strain
// magnitude and angle, crystal strain, field scale, tilt, ZPL offset, spin-orbit, q and g factors.
TEST_P(FitJacobian, AgreesWithCentralDifferences) {
  const JacobianCase c = GetParam();
  std::mt19937_64 rng(3);
  const Project base = scenarioProject(c.preset);
  const FitState truth = scenarioTruth(base, rng);
  std::vector<std::vector<LineRef>> truthLines;
  Project project = withMeasurements(startingProject(base, truth, rng), makeSyntheticSets(base, truth, settingsFor(c.preset), rng), &truthLines);
  if (c.zeroFieldSet) {
    // At zero field every level is a Kramers pair (degenerate); lines of class 1 between all pairs.
    MeasurementSet zero;
    zero.name = "zero field";
    zero.field = FieldSetting::fromAngles(0.0, 0.0, 0.0);
    truthLines.emplace_back();
    const double zplGHz = project.measurements[0].peaks[0].position;
    for (int upper : {0, 2, 3})
      for (int lower : {1, 2}) {
        zero.peaks.push_back({zplGHz + 50.0 * upper - 30.0 * lower, SpectralUnit::GHzAbsolute, 0.05, std::nullopt, std::nullopt});
        truthLines.back().push_back({1, upper, lower});
      }
    project.measurements.push_back(zero);
  }
  const std::vector<std::string> free{"eg_strain_g_GHz", "eg_strain_u_GHz", "eg_angle_g_deg", "strain_zz", "strain_xy",
                                      "field_scale", "magnet_tilt_deg", "magnet_tilt_azimuth_deg", "zpl_offset_GHz",
                                      "lambda_g_GHz", "q_u", "g_spin"};
  auto problem = std::make_shared<const FitProblem>(prepareFitProblem(project, free));
  std::vector<std::optional<LineRef>> assignment;
  for (const auto& set : truthLines)
    for (const LineRef& line : set) assignment.emplace_back(line);
  ASSERT_EQ(assignment.size(), problem->peaks.size());
  const PeakFitModel model(problem, assignment);

  Eigen::VectorXd x(model.parameterCount());
  std::uniform_real_distribution<double> u(-2.0, 2.0);
  for (Eigen::Index k = 0; k < x.size(); ++k) x[k] = u(rng);
  Eigen::MatrixXd analytic;
  model.jacobian(x, analytic);
  const Eigen::MatrixXd numeric = centralDifferenceJacobian(model, x, model.derivativeSteps(x));
  ASSERT_EQ(analytic.rows(), numeric.rows());
  ASSERT_EQ(analytic.cols(), numeric.cols());
  // Residuals are absolute frequencies (~400 THz) over σ: the differences lose about
  // 1e-16 · 4e5 GHz / (σ · 1e-4) of absolute accuracy, i.e. 1e-5 in residual units.
  const double tolerance = 2e-4 * std::max(1.0, numeric.cwiseAbs().maxCoeff());
  EXPECT_LT((analytic - numeric).cwiseAbs().maxCoeff(), tolerance);
  EXPECT_GT(analytic.cwiseAbs().maxCoeff(), 1.0) << "a Jacobian of zeros would agree trivially";
}

INSTANTIATE_TEST_SUITE_P(Centres, FitJacobian,
                         ::testing::Values(JacobianCase{"SiV-", false}, JacobianCase{"GeV-", false},
                                           JacobianCase{"SnV-", false}, JacobianCase{"SiV-", true},
                                           JacobianCase{"GeV-", true}),
                         [](const auto& info) {
                           std::string name = info.param.preset.substr(0, 3);
                           return info.param.zeroFieldSet ? name + "ZeroField" : name;
                         });

}  // namespace
}  // namespace finestra
