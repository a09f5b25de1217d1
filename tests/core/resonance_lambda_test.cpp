// Λ systems of the optical lines: Raman detuning, spin selection with an axial field, the spin Λ
// of a tilted field, and the coherent-population-trapping dips of a pumped line.
#include <gtest/gtest.h>

#include <cmath>

#include "core/common/errors.h"
#include "core/resonance/lambda_systems.h"
#include "test_support.h"

using namespace finestra;

namespace {

Vec3 fieldAtTilt(int cls, double magnitudeT, double tiltDeg) {
  const double t = tiltDeg * M_PI / 180.0;
  return defectFrame(cls).transpose() * (magnitudeT * Vec3(std::sin(t), 0, std::cos(t)));
}

bool oppositeSpin(const LambdaSystem& s) { return s.spinProjection[0] * s.spinProjection[1] < 0; }

ClassLambda lambdasAt(const CentreModel& model, const Vec3& field, ClassSolution* solutionOut = nullptr) {
  ClassSolution solution = model.solve(0, field);
  ClassLambda lambdas = lambdaSystems(solution, model.manifold(Manifold::Ground).nuclearDim, LambdaRanking::Product);
  if (solutionOut) *solutionOut = std::move(solution);
  return lambdas;
}

}  // namespace

TEST(ResonanceLambda, TwoPhotonDetuningIsTheGroundLevelDifference) {
  std::mt19937 rng(7);
  for (const char* preset : {"SiV-", "SnV-"}) {
    const CentreModel model(finestra::testing::setupFor(preset, {}, finestra::testing::randomStrain(rng, 1e-5)));
    ClassSolution solution;
    const ClassLambda lambdas = lambdasAt(model, fieldAtTilt(0, 0.8, 50), &solution);
    ASSERT_FALSE(lambdas.systems.empty()) << preset;
    for (const LambdaSystem& s : lambdas.systems) {
      const double levels = solution.ground.energies[s.ground[1]] - solution.ground.energies[s.ground[0]];
      EXPECT_EQ(s.twoPhotonGHz, levels);
      // The two legs are absolute optical frequencies (~4e5 GHz): their difference carries the
      // rounding of numbers of that size.
      EXPECT_NEAR(s.lineGHz[0] - s.lineGHz[1], levels, 1e-9);
      EXPECT_GE(s.balance, 0.0);
      EXPECT_LE(s.balance, 1.0);
      EXPECT_LE(s.branching[0] + s.branching[1], 1.0 + 1e-12);
    }
    for (std::size_t k = 1; k < lambdas.systems.size(); ++k)
      EXPECT_GE(lambdas.systems[k - 1].product, lambdas.systems[k].product);  // ranked by product
  }
}

TEST(ResonanceLambda, AxialFieldHasOnlyOrbitalLambdasAndATiltOpensTheSpinLambda) {
  // With B along the symmetry axis and no strain S_z is conserved and the electric dipole does not
  // act on spin, so spin-flipping optical lines are dark (Hepp et al., PRL 112, 036405 (2014)); a
  // transverse field mixes the spin projections and both legs of the spin Λ of SiV⁻ become
  // allowed, the scheme used for coherent population trapping of the SiV⁻ spin (Rogers et al.,
  // PRL 113, 263602 (2014), from memory).
  const CentreModel model(finestra::testing::setupFor("SiV-"));
  const ClassLambda axial = lambdasAt(model, fieldAtTilt(0, 0.5, 0));
  int orbital = 0;
  for (const LambdaSystem& s : axial.systems) {
    EXPECT_FALSE(oppositeSpin(s)) << "excited " << s.excited << " ground " << s.ground[0] << "," << s.ground[1];
    if (!oppositeSpin(s)) ++orbital;
  }
  // Each excited level links its spin partner in the lower and in the upper ground branch.
  EXPECT_EQ(orbital, 4);

  const ClassLambda tilted = lambdasAt(model, fieldAtTilt(0, 0.5, 70));
  int spinLambdas = 0;
  for (const LambdaSystem& s : tilted.systems)
    if (oppositeSpin(s)) ++spinLambdas;
  EXPECT_GT(spinLambdas, 0);
}

TEST(ResonanceLambda, CptDipsSitAtTheOtherLegOfEachLambda) {
  const CentreModel model(finestra::testing::setupFor("SiV-"));
  ClassSolution solution;
  const ClassLambda lambdas = lambdasAt(model, fieldAtTilt(0, 0.5, 70), &solution);
  ASSERT_FALSE(lambdas.systems.empty());
  const LambdaSystem& pumped = lambdas.systems.front();
  const auto dips = cptDips(solution, lambdas, pumped.excited, pumped.ground[0]);
  ASSERT_FALSE(dips.empty());
  bool found = false;
  for (const CptDip& d : dips) {
    // Two-photon resonance: the probe is detuned from the pump by the ground splitting.
    const OpticalLine& probeLeg = solution.lines[static_cast<std::size_t>(d.excited * 4 + d.ground)];
    EXPECT_NEAR(d.probeGHz, probeLeg.frequencyGHz, 1e-9);
    found = found || d.ground == pumped.ground[1];
  }
  EXPECT_TRUE(found);
  EXPECT_THROW(cptDips(solution, lambdas, 4, 0), InputError);
  EXPECT_THROW(parseLambdaRanking("brightest", "--rank-by"), InputError);
}
