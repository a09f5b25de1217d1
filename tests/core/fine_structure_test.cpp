// Zero-field fine structure: the four-line identities, the splitting formula and polarisations.
#include <gtest/gtest.h>

#include <map>

#include "core/optics/spectrum.h"
#include "test_support.h"

using namespace finestra;
using finestra::testing::randomStrain;
using finestra::testing::setupFor;

namespace {
// Zero-field line position of each parent letter: at zero field each line is a Kramers-degenerate
// group, so all sub-lines of one parent share one frequency.
std::map<char, double> parentFrequencies(const ClassSolution& s) {
  std::map<char, double> f;
  for (const OpticalLine& l : s.lines) f[l.parent] = l.frequencyGHz;
  return f;
}
}  // namespace

TEST(FineStructure, FourLineIdentitiesAndOrder) {
  // docs/physics.md, Line labels A–D (exact algebra of the model):
  // A−B = C−D = Δg and A−C = B−D = Δu; A highest, D lowest.
  std::mt19937 rng(11);
  for (const char* preset : {"SiV-", "GeV-", "SnV-"}) {
    for (int trial = 0; trial < 5; ++trial) {
      const CentreModel model(setupFor(preset, {}, randomStrain(rng, 2e-5)));
      for (int cls = 0; cls < 4; ++cls) {
        const ClassSolution s = model.solve(cls, Vec3::Zero());
        auto f = parentFrequencies(s);
        const double dg = model.levels(Manifold::Ground, cls, Vec3::Zero()).energies[2] -
                          model.levels(Manifold::Ground, cls, Vec3::Zero()).energies[0];
        const double du = s.excited.energies[2] - s.excited.energies[0];
        EXPECT_NEAR(f['A'] - f['B'], dg, 1e-9);
        EXPECT_NEAR(f['C'] - f['D'], dg, 1e-9);
        EXPECT_NEAR(f['A'] - f['C'], du, 1e-9);
        EXPECT_NEAR(f['B'] - f['D'], du, 1e-9);
        EXPECT_GT(f['A'], f['B']);
        EXPECT_GT(f['B'], f['C']);  // Δu > Δg for these centres
        EXPECT_GT(f['C'], f['D']);
      }
    }
  }
}

TEST(FineStructure, SplittingFollowsStrainFormula) {
  // Δ_m = √(λ_m² + 4|ε_Eg,m|²) with ε_Eg from the Meesala et al., PRB 97, 205444 (2018) strain form,
  // evaluated here directly from the defect-frame tensor components.
  std::mt19937 rng(5);
  const CentreModel model(setupFor("SiV-"));
  for (int trial = 0; trial < 20; ++trial) {
    const Mat3 strain = randomStrain(rng, 3e-5);
    for (int cls = 0; cls < 4; ++cls) {
      const Mat3 e = defectFrame(cls) * strain * defectFrame(cls).transpose();
      for (Manifold m : {Manifold::Ground, Manifold::Excited}) {
        const bool g = m == Manifold::Ground;
        const double lambda = g ? 48.0 : 259.0;
        const double d = (g ? 1.3 : 1.8) * 1e6, f = (g ? -1.7 : -3.4) * 1e6;  // PHz → GHz
        const double egx = d * (e(0, 0) - e(1, 1)) + f * e(0, 2);
        const double egy = -2 * d * e(0, 1) + f * e(1, 2);
        const double expected = std::sqrt(lambda * lambda + 4 * (egx * egx + egy * egy));
        const ManifoldEigen lv = model.levels(m, cls, Vec3::Zero(), &strain);
        EXPECT_NEAR(lv.energies[2] - lv.energies[0], expected, 1e-7 * expected);
        EXPECT_NEAR(lv.energies[1] - lv.energies[0], 0.0, 1e-9);  // Kramers doublets
        EXPECT_NEAR(lv.energies[3] - lv.energies[2], 0.0, 1e-9);
      }
    }
  }
}

TEST(FineStructure, ZplIsTheCentroidOfTheFourLines) {
  const CentreModel model(setupFor("SiV-"));
  auto f = parentFrequencies(model.solve(0, Vec3::Zero()));
  EXPECT_NEAR((f['A'] + f['B'] + f['C'] + f['D']) / 4, model.zplGHz(), 1e-9);
  // Trade fact (common practice): the SiV⁻ ZPL lies at 737 nm.
  EXPECT_NEAR(fromAbsoluteGHz(model.zplGHz(), SpectralUnit::NmVacuum, 0), 737.0, 0.01);
  // Four-line structure resolved at cryogenic temperature (common practice): the closest pair of
  // lines (Δg = 48 GHz apart) is hundreds of lifetime-limited linewidths apart.
  EXPECT_GT((f['A'] - f['B']) / model.linewidthGHz(), 100.0);
}

TEST(FineStructure, InnerLinesAxialOuterLinesTransverse) {
  // Trade fact (common practice) and docs/physics.md, Optical transitions: at zero field and strain B and C are polarised
  // along the symmetry axis, A and D perpendicular to it; inner lines parallel to each other.
  const CentreModel model(setupFor("SiV-"));
  const Vec3 axis = defectFrame(0).row(2).transpose();
  for (const OpticalLine& l : model.solve(0, Vec3::Zero()).lines) {
    const double along = std::norm(axis.cast<cplx>().dot(l.amplitudeCrystal));
    const double total = l.amplitudeCrystal.squaredNorm();
    if (total < 1e-12) continue;
    if (l.parent == 'B' || l.parent == 'C') EXPECT_NEAR(along / total, 1.0, 1e-9) << l.label();
    else EXPECT_NEAR(along / total, 0.0, 1e-9) << l.label();
  }
}

TEST(FineStructure, ColdEmissionIsDominatedByTheLowerExcitedBranch) {
  // Boltzmann: at 4 K the upper excited branch (259 GHz up) holds exp(−259·0.048/4) ≈ 4.5 % of the
  // population of the lower one, so in PL the C and D lines outshine A and B (common practice).
  const CentreModel model(setupFor("SiV-"));
  std::vector<ClassSolution> solutions{model.solve(0, Vec3::Zero())};
  std::map<char, double> weight;
  for (const WeightedLine& w : weightLines(model, solutions, SpectrumKind::Emission)) weight[w.line->parent] += w.weight;
  EXPECT_GT(weight['C'], 10 * weight['A']);
  EXPECT_GT(weight['D'], 10 * weight['B']);
  // B and C are both axial with |d_z|² = 1, so their weight ratio is the Boltzmann factor alone.
  const double boltzmann = std::exp(-259.0 * 0.0479924307 / 4.0);  // h/k_B = 0.0479924307 K/GHz (CODATA 2018)
  EXPECT_NEAR(weight['B'] / weight['C'], boltzmann, 1e-6 * boltzmann);
}
