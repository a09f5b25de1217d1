// The batch line kernel (closed-form 4×4 eigen-decomposition) against the general model path
// (self-adjoint solver). Exact mathematical checks: H v = λ v, orthonormal eigenvectors, and the
// same lines as CentreModel::lines, including at degenerate points where the kernel falls back.
#include <gtest/gtest.h>

#include <random>

#include "core/common/errors.h"
#include "core/project/model_setup.h"
#include "core/optics/line_grid.h"

using namespace finestra;

namespace {

CentreModel strainedModel(const std::string& preset, bool staticJahnTeller) {
  Project p;
  p.centre.preset = preset;
  if (staticJahnTeller) p.centre.overrides["jt_x_u_GHz"] = 5.0;
  if (preset == "PbV-") {  // unknown in the preset; any value serves here
    p.centre.overrides["lambda_u_GHz"] = 12000.0;
    p.centre.overrides["lifetime_ns"] = 5.0;
  }
  p.strain.crystal = strainFromComponents(2e-5, -1e-5, 4e-6, 6e-6, -3e-6, 9e-6);
  return CentreModel(makeModelSetup(p));
}

Vec3 randomField(std::mt19937& rng, double magnitude) {
  std::normal_distribution<double> n;
  return magnitude * Vec3(n(rng), n(rng), n(rng)).normalized();
}

// Σ of a quantity over every line whose frequency lies within `tolerance` of `frequency`: invariant
// under the choice of basis inside degenerate levels.
template <typename Get>
double groupSum(const std::vector<double>& freqs, Get get, double frequency, double tolerance) {
  double sum = 0;
  for (std::size_t k = 0; k < freqs.size(); ++k)
    if (std::abs(freqs[k] - frequency) < tolerance) sum += get(k);
  return sum;
}

void expectSameLines(const CentreModel& model, int cls, const Vec3& field, const LineGridKernel& kernel) {
  LineGridPoint point;
  kernel.evaluate(cls, field, point);
  const ManifoldEigen g = model.levels(Manifold::Ground, cls, field);
  const ManifoldEigen u = model.levels(Manifold::Excited, cls, field);
  const std::vector<OpticalLine> reference = model.lines(cls, g, u);
  ASSERT_EQ(reference.size(), 16u);
  std::vector<double> kernelFreq(16), referenceFreq(16);
  for (std::size_t k = 0; k < 16; ++k) {
    kernelFreq[k] = point.frequencyGHz[k];
    referenceFreq[k] = reference[k].frequencyGHz;
    EXPECT_NEAR(point.frequencyGHz[k], reference[k].frequencyGHz, 1e-7) << "line " << k << " field " << field.transpose();
  }
  for (std::size_t k = 0; k < 16; ++k)
    for (std::size_t axis = 0; axis < 3; ++axis) {
      const double mine = groupSum(kernelFreq, [&](std::size_t n) { return point.intensityCrystal[n][axis]; },
                                   kernelFreq[k], 1e-6);
      const double theirs = groupSum(referenceFreq, [&](std::size_t n) { return reference[n].intensityCrystal[axis]; },
                                     kernelFreq[k], 1e-6);
      EXPECT_NEAR(mine, theirs, 1e-9 + 1e-7 * theirs) << "line " << k << " axis " << axis;
    }
}

}  // namespace

TEST(ClosedFormEigen4, SolvesTheEigenproblemExactly) {
  for (const bool jt : {false, true}) {
    const CentreModel model = strainedModel("SiV-", jt);
    std::mt19937 rng(11);
    for (int cls = 0; cls < 4; ++cls)
      for (Manifold m : {Manifold::Ground, Manifold::Excited}) {
        const auto h = LinearHamiltonian4::sample(model.manifold(m), model.strainFor(m, cls), defectFrame(cls));
        const PauliForm4 form = PauliForm4::fromLinear(h);
        ASSERT_TRUE(form.closedForm);
        for (double magnitude : {1e-4, 0.01, 0.5, 3.0, 30.0}) {
          const Vec3 b = randomField(rng, magnitude);
          ManifoldEigen4 e;
          ASSERT_TRUE(closedFormEigen4(form, b, e));
          Matrix4c hb;
          h.at(b, hb);
          const double scale = hb.norm();
          EXPECT_LT((hb * e.vectors - e.vectors * e.energies.asDiagonal()).norm(), 1e-10 * scale) << magnitude;
          EXPECT_LT((e.vectors.adjoint() * e.vectors - Matrix4c::Identity()).norm(), 1e-10) << magnitude;
          for (int i = 0; i < 3; ++i) EXPECT_LE(e.energies[i], e.energies[i + 1]);
        }
      }
  }
}

// Along the axis of an unstrained centre the orbital Zeeman term q γ_L B_z cancels the spin–orbit
// coupling of one spin near B_z = λ/(2 q γ_L) (17.1 T for the SiV⁻ ground preset): one orbital
// coupling block vanishes and the kernel must switch to its projector path without losing accuracy.
TEST(ClosedFormEigen4, StaysExactWhereOrbitalZeemanCancelsSpinOrbit) {
  Project p;
  p.centre.preset = "SiV-";
  const CentreModel model(makeModelSetup(p));
  const auto h = LinearHamiltonian4::sample(model.manifold(Manifold::Ground), model.strainFor(Manifold::Ground, 0),
                                            defectFrame(0));
  const PauliForm4 form = PauliForm4::fromLinear(h);
  const Vec3 axis = Vec3(1, 1, 1).normalized();
  const double lambda = 48.0, q = 0.1, gammaL = 13.996244936;  // preset values; μ_B/h CODATA 2018
  const double crossing = lambda / (2 * q * gammaL);
  for (double offset : {-0.3, -0.02, -1e-3, 1e-3, 0.02, 0.3}) {
    const Vec3 b = (crossing + offset) * axis;
    ManifoldEigen4 e;
    ASSERT_TRUE(closedFormEigen4(form, b, e)) << offset;
    Matrix4c hb;
    h.at(b, hb);
    EXPECT_LT((hb * e.vectors - e.vectors * e.energies.asDiagonal()).norm(), 1e-10 * hb.norm()) << offset;
    EXPECT_LT((e.vectors.adjoint() * e.vectors - Matrix4c::Identity()).norm(), 1e-10) << offset;
  }
}

// Time-reversal symmetry makes every level a Kramers pair at zero field (docs/physics.md, The centres): the
// closed form declines and the caller must use the self-adjoint solver.
TEST(ClosedFormEigen4, DeclinesKramersDegenerateLevels) {
  const CentreModel model = strainedModel("SnV-", false);
  const auto h = LinearHamiltonian4::sample(model.manifold(Manifold::Ground), model.strainFor(Manifold::Ground, 0),
                                            defectFrame(0));
  ManifoldEigen4 e;
  EXPECT_FALSE(closedFormEigen4(PauliForm4::fromLinear(h), Vec3::Zero(), e));
}

TEST(LineGrid, EqualsTheModelLinesForEveryCentre) {
  for (const std::string preset : {"SiV-", "GeV-", "SnV-", "PbV-"}) {
    const CentreModel model = strainedModel(preset, preset == "GeV-");
    const LineGridKernel kernel(model);
    std::mt19937 rng(5);
    for (int cls = 0; cls < 4; ++cls) {
      expectSameLines(model, cls, Vec3::Zero(), kernel);  // degenerate: solver fallback
      for (double magnitude : {1e-9, 1e-3, 0.2, 1.0, 9.0, 30.0}) expectSameLines(model, cls, randomField(rng, magnitude), kernel);
    }
  }
}

TEST(LineGrid, BatchEqualsPointEvaluationAndRejectsBadClasses) {
  const CentreModel model = strainedModel("SiV-", false);
  std::mt19937 rng(3);
  std::vector<Vec3> fields;
  for (int k = 0; k < 300; ++k) fields.push_back(randomField(rng, 0.7));
  std::vector<LineGridPoint> grid;
  evaluateLineGrid(model, fields, {2, 0}, grid);
  ASSERT_EQ(grid.size(), 600u);
  const LineGridKernel kernel(model);
  LineGridPoint single;
  kernel.evaluate(0, fields[123], single);
  for (std::size_t k = 0; k < 16; ++k) EXPECT_DOUBLE_EQ(grid[123 * 2 + 1].frequencyGHz[k], single.frequencyGHz[k]);
  EXPECT_THROW(evaluateLineGrid(model, fields, {4}, grid), InputError);
}

TEST(LineGrid, RefusesAnIsotope) {
  Project p;
  p.centre.preset = "SiV-";
  p.centre.isotope = "29Si";
  EXPECT_THROW(LineGridKernel{CentreModel(makeModelSetup(p))}, InputError);
}
