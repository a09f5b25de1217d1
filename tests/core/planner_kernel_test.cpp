// The planner's fast kernel against the general solver: the closed-form quartic, the linear
// rebuild of H(B) and every figure against the straightforward reference evaluation.
#include <gtest/gtest.h>

#include <Eigen/Eigenvalues>
#include <algorithm>
#include <random>

#include "core/project/model_setup.h"
#include "core/planner/fast_kernel.h"
#include "core/planner/reference.h"

using namespace finestra;

namespace {

CentreModel strainedSiV() {
  Project p;
  p.centre.preset = "SiV-";
  p.centre.overrides["jt_x_g_GHz"] = 3.0;  // a static distortion, so every Pauli component is exercised
  p.strain.crystal = strainFromComponents(1e-5, -4e-6, 2e-6, 3e-6, -5e-6, 7e-6);
  return CentreModel(makeModelSetup(p));
}

Vec3 randomUnit(std::mt19937& rng) {
  std::normal_distribution<double> n;
  return Vec3(n(rng), n(rng), n(rng)).normalized();
}

}  // namespace

TEST(PlannerKernel, LinearRebuildEqualsTheHamiltonian) {
  const CentreModel model = strainedSiV();
  std::mt19937 rng(7);
  for (int cls = 0; cls < kClassCount; ++cls) {
    const StrainTerms s = model.strainFor(Manifold::Excited, cls);
    const auto h = LinearHamiltonian4::sample(model.manifold(Manifold::Excited), s, defectFrame(cls));
    for (int k = 0; k < 20; ++k) {
      const Vec3 b = 3.0 * randomUnit(rng);
      Matrix4c rebuilt;
      h.at(b, rebuilt);
      const Matrix4c direct = electronicHamiltonian(model.manifold(Manifold::Excited), s, defectFrame(cls) * b);
      EXPECT_LT((rebuilt - direct).cwiseAbs().maxCoeff(), 1e-10);
    }
  }
}

TEST(PlannerKernel, QuarticLevelsMatchTheSelfAdjointSolver) {
  const CentreModel model = strainedSiV();
  std::mt19937 rng(11);
  for (Manifold m : {Manifold::Ground, Manifold::Excited})
    for (int cls = 0; cls < kClassCount; ++cls) {
      const auto h = LinearHamiltonian4::sample(model.manifold(m), model.strainFor(m, cls), defectFrame(cls));
      const PauliForm4 form = PauliForm4::fromLinear(h);
      ASSERT_TRUE(form.closedForm);
      for (int k = 0; k < 50; ++k) {
        const Vec3 b = (k % 5) * 2.0 * randomUnit(rng);
        Matrix4c hm;
        h.at(b, hm);
        const Vector4r exact = Eigen::SelfAdjointEigenSolver<Matrix4c>(hm).eigenvalues();
        const Vector4r closed = quarticLevels(form, b);
        const double scale = exact.cwiseAbs().maxCoeff();
        EXPECT_LT((exact - closed).cwiseAbs().maxCoeff(), 1e-7 * scale) << "B = " << b.transpose();
      }
    }
}

TEST(PlannerKernel, FiguresAgreeWithTheReferenceEvaluation) {
  const CentreModel model = strainedSiV();
  PlannerSettings settings;
  settings.driveLab = Vec3(0.3, -0.5, 0.8);
  const PlannerKernel kernel(model, settings);
  std::mt19937 rng(3);
  for (int k = 0; k < 25; ++k) {
    const Vec3 dir = randomUnit(rng);
    const double magnitude = 0.2 + 0.2 * k;  // up to 5 T: crosses the ground anticrossing region
    std::array<ClassFigures, kClassCount> fast{};
    kernel.evaluate(dir, magnitude, fast);
    const auto ref = referenceFigures(model, settings, dir, magnitude, 2000);
    for (int cls = 0; cls < kClassCount; ++cls) {
      const ClassFigures& a = fast[static_cast<std::size_t>(cls)];
      const ClassFigures& b = ref[static_cast<std::size_t>(cls)];
      EXPECT_NEAR(a.qubitGHz, b.qubitGHz, 1e-9);
      EXPECT_NEAR(a.driveGHzPerT, b.driveGHzPerT, 1e-9);
      EXPECT_NEAR(a.cyclicity, b.cyclicity, 1e-6 * b.cyclicity);
      EXPECT_NEAR(a.separationLinewidths, b.separationLinewidths, 1e-6);
      EXPECT_NEAR(a.axisAngleDeg, b.axisAngleDeg, 1e-9);
      // The refined search must find the dense sampling's minimum (within 2 MHz) and may only
      // undercut it by what the sampling can miss (slope ≲ 2γ_S·|B| over one of 2000 steps).
      const double slack = 2 * 28.1 * magnitude / 2000;
      EXPECT_LE(a.groundGapGHz, b.groundGapGHz + 2e-3);
      EXPECT_GE(a.groundGapGHz, b.groundGapGHz - slack);
      EXPECT_LE(a.excitedGapGHz, b.excitedGapGHz + 2e-3);
      EXPECT_GE(a.excitedGapGHz, b.excitedGapGHz - slack);
    }
  }
}

// ²⁹Si (I = 1/2) with isotropic A: in a field where the electron Zeeman energy (~10 GHz) is far
// above A, first-order perturbation theory gives two allowed ESR lines (Δm_I = 0) split by A
// (Breit & Rabi, Phys. Rev. 38, 2082 (1931), high-field limit); they straddle the electronic qubit.
TEST(PlannerKernel, HyperfineTransitionsResolveTheNuclearSpin) {
  Project p;
  p.centre.isotope = "29Si";
  p.centre.overrides["A_par_u_MHz"] = 0;  // the excited-state hyperfine plays no part here
  p.centre.overrides["A_perp_u_MHz"] = 0;
  p.strain.crystal = strainFromComponents(0, 0, 0, 3e-5, 0, 0);  // opens the magnetic-dipole transition
  const CentreModel model(makeModelSetup(p));
  const double a = model.manifold(Manifold::Ground).aPar;
  PlannerSettings settings;
  settings.driveLab = Vec3(1, 0, 0);
  const Vec3 field = 0.35 * Vec3(1, 1, 1).normalized();
  auto transitions = hyperfineSpinTransitions(model, settings, 0, field);
  ASSERT_GE(transitions.size(), 2u);
  std::sort(transitions.begin(), transitions.end(), [](const auto& x, const auto& y) { return x.driveGHzPerT > y.driveGHzPerT; });
  const double split = std::abs(transitions[0].frequencyGHz - transitions[1].frequencyGHz);
  EXPECT_NEAR(split, a, 0.1 * a);
  std::array<ClassFigures, kClassCount> fast{};
  PlannerKernel(model, settings).evaluate(field.normalized(), field.norm(), fast);
  const double centre = 0.5 * (transitions[0].frequencyGHz + transitions[1].frequencyGHz);
  EXPECT_NEAR(centre, fast[0].qubitGHz, 0.1 * a);
}
