// Constants and unit conversions against CODATA and handbook values.
#include <gtest/gtest.h>

#include "core/units/constants.h"
#include "core/units/linewidth.h"
#include "core/units/spectral_units.h"

using namespace finestra;

TEST(Constants, Codata2018) {
  // CODATA 2018 recommended values: μ_B/h = 13.996 244 936 1(42) GHz/T, g_e = −2.002 319 304 362 56(35).
  EXPECT_NEAR(constants::kBohrGHzPerT, 13.9962449361, 1e-9);
  EXPECT_NEAR(constants::kElectronG, 2.00231930436256, 1e-13);
  // SI 2019 exact: h = 6.626 070 15e-34 J s, e = 1.602 176 634e-19 C, k_B = 1.380 649e-23 J/K.
  EXPECT_DOUBLE_EQ(constants::kPlanck, 6.62607015e-34);
  EXPECT_NEAR(constants::kKelvinPerGHz, 0.0479924307, 1e-9);  // h·1 GHz / k_B (CODATA 2018)
}

TEST(SpectralUnits, HeliumNeonAirVacuum) {
  // He–Ne laser line: 632.991 nm in vacuum, 632.816 nm in standard air (handbook value).
  EXPECT_NEAR(vacuumToAirNm(632.991), 632.816, 0.001);
  EXPECT_NEAR(airToVacuumNm(632.816), 632.991, 0.001);
  EXPECT_NEAR(airToVacuumNm(vacuumToAirNm(737.0)), 737.0, 1e-9);
}

TEST(SpectralUnits, RoundTripEveryUnit) {
  const double ref = 406774.0, f = 406800.123;
  for (SpectralUnit u : allSpectralUnits())
    EXPECT_NEAR(toAbsoluteGHz(fromAbsoluteGHz(f, u, ref), u, ref), f, 1e-6) << spectralUnitKey(u);
}

TEST(SpectralUnits, PhotonEnergyAndWavenumber) {
  // 737 nm ↔ 1.6823 eV and 13568.5 cm⁻¹ (E = hc/λ with exact SI constants).
  const double f = toAbsoluteGHz(737.0, SpectralUnit::NmVacuum, 0);
  EXPECT_NEAR(fromAbsoluteGHz(f, SpectralUnit::MeV, 0), 1682.29, 0.02);
  EXPECT_NEAR(fromAbsoluteGHz(f, SpectralUnit::InvCm, 0), 1e7 / 737.0, 1e-6);
  // Trade fact (common practice): the SiV⁻ sideband feature near 766 nm lies ≈64 meV below the 737 nm ZPL.
  const double sideband = toAbsoluteGHz(766.0, SpectralUnit::NmVacuum, 0);
  EXPECT_NEAR(fromAbsoluteGHz(f, SpectralUnit::MeV, 0) - fromAbsoluteGHz(sideband, SpectralUnit::MeV, 0), 64.0, 1.0);
}

TEST(Linewidth, LifetimeLimit) {
  // 1/(2π · 1.7 ns) = 93.6 MHz (exact arithmetic; docs/physics.md, Spectra).
  EXPECT_NEAR(lifetimeLimitedFwhmGHz(1.7) * 1e3, 93.6, 0.1);
}

TEST(SpectralUnits, BadValuesAreErrors) {
  EXPECT_THROW(toAbsoluteGHz(-5.0, SpectralUnit::NmVacuum, 0), std::runtime_error);
  EXPECT_THROW(toAbsoluteGHz(std::nan(""), SpectralUnit::THz, 0), std::runtime_error);
  EXPECT_THROW(parseSpectralUnit("furlong", "unit"), std::runtime_error);
}
