// Phonon rates between the orbital branches (core/thermal/phonon_rates): the published form of
// Jahnke et al., New J. Phys. 17, 043011 (2015) — down = χΔ³(n+1), up = χΔ³n — checked against
// exact consequences: detailed balance with CODATA h and k, the Δ³ law, and the T → 0 limit.
#include <gtest/gtest.h>

#include <cmath>

#include "core/common/errors.h"
#include "core/thermal/level_widths.h"
#include "test_support.h"

using namespace finestra;
using finestra::testing::setupFor;

namespace {
// CODATA 2018 / SI 2019 exact values, written out here rather than taken from the code under test.
constexpr double kH = 6.62607015e-34;   // J s
constexpr double kKB = 1.380649e-23;    // J/K

PhononConstants singlePhonon(double chi) { return {chi, 0.0, 5.0}; }
}  // namespace

TEST(ThermalRates, DetailedBalanceIsExact) {
  // up/down = n/(n+1) = exp(−hΔ/kT) for Bose–Einstein n (exact identity).
  for (double deltaGHz : {48.0, 169.0, 850.0})
    for (double t : {0.5, 1.0, 4.0, 10.0, 300.0}) {
      const BranchRates r = branchRates(singlePhonon(176.0), deltaGHz, t);
      const double expected = std::exp(-kH * deltaGHz * 1e9 / (kKB * t));
      EXPECT_NEAR(r.upPerS / r.downPerS, expected, 1e-12 * std::max(expected, 1e-300)) << deltaGHz << " GHz, " << t << " K";
    }
}

TEST(ThermalRates, ZeroTemperatureLeavesOnlySpontaneousEmission) {
  const BranchRates r = branchRates(singlePhonon(2.0), 100.0, 0.0);
  EXPECT_EQ(r.upPerS, 0.0);
  EXPECT_DOUBLE_EQ(r.downPerS, 2.0 * 1e6);  // χΔ³ with Δ = 100 GHz
}

TEST(ThermalRates, HighTemperatureLimitIsLinearInT) {
  // kT ≫ hΔ: n → kT/(hΔ), so up → χΔ² kT/h (classical equipartition limit).
  const double delta = 1.0, t = 300.0;
  const BranchRates r = branchRates(singlePhonon(1.0), delta, t);
  const double classical = delta * delta * kKB * t / (kH * 1e9);
  EXPECT_NEAR(r.upPerS / classical, 1.0, 1e-3);
}

TEST(ThermalRates, DownwardRateScalesAsSplittingCubedUnderStrain) {
  // E-type strain ε raises the ground splitting to Δ = sqrt(λ² + 4ε²) (docs/physics.md, Strain
  // from the zero-field lines; exact algebra of the model); the spontaneous (T = 0) rate
  // then grows as Δ³ (Jahnke et al. 2015).
  ModelSetup plain = setupFor("SiV-");
  ModelSetup strained = plain;
  strained.strain.extraGround.magnitudeGHz = 60.0;
  const CentreModel a(plain), b(strained);
  const ClassThermal ta = classThermal(a, a.solve(0, Vec3::Zero()), 0.0);
  const ClassThermal tb = classThermal(b, b.solve(0, Vec3::Zero()), 0.0);
  const double lambda = 48.0, expectedDelta = std::sqrt(lambda * lambda + 4.0 * 60.0 * 60.0);
  EXPECT_NEAR(ta.ground.rates.splittingGHz, lambda, 1e-9);
  EXPECT_NEAR(tb.ground.rates.splittingGHz, expectedDelta, 1e-9);
  EXPECT_NEAR(tb.ground.rates.downPerS / ta.ground.rates.downPerS, std::pow(expectedDelta / lambda, 3), 1e-9);
}

TEST(ThermalRates, StrainFreezesTheUpwardProcess) {
  // The reason strain engineering helps (Jahnke et al. 2015, discussion): a larger splitting
  // makes n(Δ, T) exponentially smaller, so the phonon limit on coherence grows at fixed T.
  ModelSetup plain = setupFor("SiV-"), strained = setupFor("SiV-");
  strained.strain.extraGround.magnitudeGHz = 200.0;
  const CentreModel a(plain), b(strained);
  const auto la = classThermal(a, a.solve(0, Vec3::Zero()), 1.0).spinCoherenceLimitS;
  const auto lb = classThermal(b, b.solve(0, Vec3::Zero()), 1.0).spinCoherenceLimitS;
  ASSERT_TRUE(la && lb);
  EXPECT_GT(*lb, 100.0 * *la);
}

TEST(ThermalRates, HigherOrderTermAddsItsPowerLaw) {
  const PhononConstants c{0.0, 3.0, 5.0};
  const BranchRates r = branchRates(c, 48.0, 2.0);
  EXPECT_DOUBLE_EQ(r.upPerS, 3.0 * 32.0);
  EXPECT_DOUBLE_EQ(r.downPerS, 3.0 * 32.0);
}

TEST(ThermalRates, BadTemperatureNamesTheKey) {
  try {
    (void)branchRates(singlePhonon(1.0), 48.0, -1.0);
    FAIL();
  } catch (const InputError& e) {
    EXPECT_NE(std::string(e.what()).find("temperature_K"), std::string::npos);
  }
}

TEST(ThermalRates, UnknownCouplingStopsWithTheNameAndWhereToSetIt) {
  const ResolvedCentre c = resolveCentre("SiV-", std::nullopt, {});
  CentreParameters p = c.parameters;
  p.set(Param::PhononChiU, std::nan(""));
  try {
    (void)phononConstants(p, Manifold::Excited);
    FAIL();
  } catch (const MissingValueError& e) {
    const std::string msg = e.what();
    EXPECT_NE(msg.find("phonon_chi_u_per_s_GHz3"), std::string::npos) << msg;
    EXPECT_NE(msg.find("Setup panel"), std::string::npos) << msg;
    // Both places to set it: the project key for file and CLI users, the panel for GUI users.
    EXPECT_NE(msg.find("centre.parameters.phonon_chi_u_per_s_GHz3"), std::string::npos) << msg;
  }
}
