// Least-squares machinery and fit designs: the uncertainty analysis against the textbook
// straight-line result, a degenerate design that must name its undetermined parameters, and
// outlier peaks that must be left unassigned.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>

#include "fit_test_support.h"

namespace finestra {
namespace {

using namespace finestra::testing;

// y = a + b·x with unit σ: cov = (XᵀX)⁻¹ (least-squares theory, common practice).
class StraightLine : public FitModel {
public:
  StraightLine(Eigen::VectorXd x, Eigen::VectorXd y) : x_(std::move(x)), y_(std::move(y)) {}
  int parameterCount() const override { return 2; }
  int residualCount() const override { return static_cast<int>(x_.size()); }
  void residuals(const Eigen::VectorXd& p, Eigen::VectorXd& out) const override {
    out = (p[0] + p[1] * x_.array() - y_.array()).matrix();
  }
  std::unique_ptr<FitModel> clone() const override { return std::make_unique<StraightLine>(*this); }

private:
  Eigen::VectorXd x_, y_;
};

TEST(FitDesign, StraightLineMatchesNormalEquations) {
  Eigen::VectorXd x(5), y(5);
  x << 0, 1, 2, 3, 4;
  y << 1.1, 2.9, 5.2, 7.1, 8.8;
  const StraightLine model(x, y);
  const auto r = minimiseLeastSquares(model, Eigen::Vector2d(0, 0));
  ASSERT_EQ(r.status, LeastSquaresStatus::Converged);
  Eigen::MatrixXd design(5, 2);
  design.col(0).setOnes();
  design.col(1) = x;
  const Eigen::Vector2d exact = (design.transpose() * design).ldlt().solve(design.transpose() * y);
  EXPECT_NEAR(r.x[0], exact[0], 1e-8);
  EXPECT_NEAR(r.x[1], exact[1], 1e-8);
  Eigen::MatrixXd jac;
  model.jacobian(r.x, jac);
  EXPECT_LT((jac - design).cwiseAbs().maxCoeff(), 1e-7) << "central differences of a linear model are exact";
  const auto u = analyseUncertainty(jac, r.chi2);
  // Unit σ: the formal covariance is (DᵀD)⁻¹; the scaled one multiplies it by χ²/dof, and the
  // reported errors are the scaled ones only when χ²/dof > 1 (here χ²/dof ≈ 0.05: formal).
  const Eigen::Matrix2d formal = (design.transpose() * design).inverse();
  const Eigen::Matrix2d cov = formal * (r.chi2 / 3.0);
  ASSERT_LT(r.chi2 / 3.0, 1.0);
  EXPECT_FALSE(u.errorsScaled);
  EXPECT_NEAR(u.formalErrors[0], std::sqrt(formal(0, 0)), 1e-9);
  EXPECT_NEAR(u.scaledErrors[0], std::sqrt(cov(0, 0)), 1e-9);
  EXPECT_NEAR(u.scaledErrors[1], std::sqrt(cov(1, 1)), 1e-9);
  EXPECT_NEAR(u.standardErrors[0], std::sqrt(formal(0, 0)), 1e-9);
  EXPECT_NEAR(u.standardErrors[1], std::sqrt(formal(1, 1)), 1e-9);
  // The same data with σ = 0.1 (residuals ×10, χ² ×100): χ²/dof > 1, so the errors are scaled.
  const auto tight = analyseUncertainty(jac * 10.0, r.chi2 * 100.0);
  ASSERT_GT(r.chi2 * 100.0 / 3.0, 1.0);
  EXPECT_TRUE(tight.errorsScaled);
  EXPECT_NEAR(tight.standardErrors[0], std::sqrt(cov(0, 0)), 1e-9);
  EXPECT_NEAR(u.correlation(0, 1), cov(0, 1) / std::sqrt(cov(0, 0) * cov(1, 1)), 1e-9);
  EXPECT_TRUE(u.undetermined.empty());
}

TEST(FitDesign, DuplicateColumnIsUndetermined) {
  Eigen::MatrixXd jac(4, 3);
  jac << 1, 2, 2, 1, 3, 3, 1, 5, 5, 1, 7, 7;
  const auto u = analyseUncertainty(jac, 1.0);
  EXPECT_EQ(u.undetermined, (std::vector<int>{1, 2}));
  EXPECT_TRUE(std::isfinite(u.standardErrors[0]));
  EXPECT_TRUE(std::isnan(u.standardErrors[1]));
}

// One orientation class only: its lines fix |ε_Eg| per manifold and one A1g combination, which a
// ZPL offset imitates exactly (docs/physics.md, What line positions tell about
// strain). Six tensor components plus the offset cannot all
// be determined, and the E-strain angle never shows in line positions.
TEST(FitDesign, DegenerateDesignNamesUndeterminedParameters) {
  Project base = scenarioProject("SiV-");
  base.classes = {0};
  std::mt19937_64 rng(3);
  FitState truth = initialFitState(base);
  truth.strain.crystal = strainFromComponents(4e-6, -2e-6, 1e-6, 3e-6, -1e-6, 2e-6);
  const auto sets = makeSyntheticSets(base, truth, sixSettings(0.05), rng);
  Project project = withMeasurements(base, sets);
  project.strain = truth.strain;
  FitOptions options;
  options.free = std::vector<std::string>{"strain_xx", "strain_yy", "strain_zz", "strain_yz", "strain_zx", "strain_xy",
                                          "zpl_offset_GHz", "eg_angle_g_deg"};
  options.starts = 1;
  const FitResult r = fitProject(project, options);
  EXPECT_FALSE(r.undetermined.empty());
  EXPECT_FALSE(r.undeterminedCombinations.empty());
  EXPECT_NE(std::find(r.undetermined.begin(), r.undetermined.end(), "eg_angle_g_deg"), r.undetermined.end());
  EXPECT_NE(std::find(r.undetermined.begin(), r.undetermined.end(), "zpl_offset_GHz"), r.undetermined.end());
  for (const auto& name : r.undetermined) EXPECT_TRUE(std::isnan(parameter(r, name).standardError)) << name;
}

TEST(FitDesign, OutlierPeaksStayUnassigned) {
  const Project base = scenarioProject("SiV-");
  std::mt19937_64 rng(11);
  const FitState truth = scenarioTruth(base, rng);
  auto sets = makeSyntheticSets(base, truth, sixSettings(0.05), rng);
  Project project = withMeasurements(startingProject(base, truth, rng), sets);
  // Spurious peaks far (> 1 GHz, i.e. 20σ) from every line of the truth.
  const FitProblem truthProblem = prepareFitProblem(project, std::vector<std::string>{});
  const CentreModel model(fitStateSetup(truth, truthProblem.baseSetup));
  int added = 0;
  for (int s = 0; s < 6 && added < 3; ++s) {
    const auto lines = predictSetLines(truthProblem, model, truth, s);
    for (double offset = 3.0; offset < 200 && added < 3; offset += 0.7) {
      const double f = lines.front().frequencyGHz + offset;
      const bool far = std::all_of(lines.begin(), lines.end(), [&](const auto& l) { return std::abs(l.frequencyGHz - f) > 1.0; });
      if (!far) continue;
      MeasuredPeak spurious;
      spurious.position = f;
      spurious.unit = SpectralUnit::GHzAbsolute;
      spurious.sigma = 0.05;
      project.measurements[static_cast<std::size_t>(s)].peaks.push_back(spurious);
      ++added;
      break;
    }
  }
  ASSERT_EQ(added, 3);
  FitOptions options;
  options.free = scenarioFree();
  options.starts = 8;
  const FitResult r = fitProject(project, options);
  ASSERT_TRUE(r.converged) << r.status;
  EXPECT_EQ(r.outlierCount, 3);
  for (const auto& peak : r.peaks) {
    const bool spurious = peak.peak >= static_cast<int>(sets[static_cast<std::size_t>(peak.measurement)].truth.size());
    EXPECT_EQ(spurious, !peak.line.has_value()) << "measurement " << peak.measurement << " peak " << peak.peak;
  }
  for (const std::string& name : scenarioFree()) {
    const auto& p = parameter(r, name);
    double diff = p.value - truthValue(truth, name);
    if (name == "magnet_tilt_azimuth_deg") diff = std::remainder(diff, 360.0);
    EXPECT_LT(std::abs(diff), 3.5 * p.standardError) << name;
  }
}

}  // namespace
}  // namespace finestra
