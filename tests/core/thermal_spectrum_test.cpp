// Spectra with thermal widths and the phonon sideband; temperature sweeps; the ZPL anchor; values
// the project marks as assumed.
#include <gtest/gtest.h>

#include <cmath>

#include "core/common/errors.h"
#include "core/io/project_file.h"
#include "core/project/evaluate.h"
#include "core/project/model_setup.h"
#include "core/optics/spectrum.h"
#include "core/sweep/sweep.h"
#include "core/thermal/level_widths.h"
#include "core/units/spectral_units.h"
#include "test_support.h"

using namespace finestra;

namespace {
Project sivProject(double temperatureK) {
  Project p;
  p.centre.preset = "SiV-";
  p.field = FieldSetting::fromAngles(0.3, 30, 10);
  p.conditions.temperatureK = temperatureK;
  p.classes = {0, 1};
  return p;
}

double integrate(const CentreModel& model, const std::vector<WeightedLine>& lines, double from, double to, double step) {
  double sum = 0;
  const long n = std::lround((to - from) / step);
  for (long k = 0; k < n; ++k) sum += spectrumDensity(model, lines, from + (k + 0.5) * step) * step;
  return sum;
}
}  // namespace

TEST(ThermalSpectrum, DebyeWallerSplitsTheIntegral) {
  // Trade fact for SiV⁻ (common practice, no source): about 70 % of the emission in the ZPL, a
  // sideband feature about 64 meV below it. The integral of the PL spectrum within ±2 THz of the
  // ZPL is DW of the total, the rest lies in the sideband.
  Project p = sivProject(4.0);
  p.conditions.phononSideband = true;
  const CentreModel model(makeModelSetup(p));
  const auto classes = solveProjectClasses(model, p);
  const auto lines = weightLines(model, classes, SpectrumKind::Emission);
  double total = 0;
  for (const auto& w : lines) total += w.weight;
  const double zpl = model.zplGHz();
  const double nearZpl = integrate(model, lines, zpl - 2000, zpl + 2000, 0.01);
  const double sideband = integrate(model, lines, zpl - 40000, zpl - 2000, 5.0);
  EXPECT_NEAR(nearZpl / total, 0.70, 2e-3);  // Lorentzian tails beyond ±2 THz: ~1e-4
  EXPECT_NEAR(sideband / total, 0.30, 2e-3);
  // Each line carries its own sideband feature 64 meV below it: 64 meV / (h · 1 GHz in meV)
  // ≈ 15.475 THz (CODATA 2018 h and e). The features are far wider than the spread of the lines,
  // so their sum peaks that far below the weight-averaged line position. At 4 K the emission comes
  // mostly from the lower excited branch (lines C and D, about λu/2 ≈ 130 GHz below the centroid),
  // so measuring from the centroid ν_ZPL would be off by about that much.
  double weightedLine = 0, sidebandWeight = 0;
  for (const auto& w : lines) {
    weightedLine += w.weight * w.sidebandFraction * w.line->frequencyGHz;
    sidebandWeight += w.weight * w.sidebandFraction;
  }
  weightedLine /= sidebandWeight;
  double best = 0, at = 0;
  for (double f = zpl - 30000; f < zpl - 2000; f += 10) {
    const double y = spectrumDensity(model, lines, f);
    if (y > best) best = y, at = f;
  }
  EXPECT_NEAR(weightedLine - at, 64.0 / (6.62607015e-34 * 1e9 / 1.602176634e-19 * 1e3), 30.0);
  EXPECT_LT(weightedLine, zpl - 50.0);  // the warm-up check of the sentence above
}

TEST(ThermalSpectrum, WithoutSidebandAllWeightStaysInTheLines) {
  const Project p = sivProject(4.0);
  const CentreModel model(makeModelSetup(p));
  const auto lines = weightLines(model, solveProjectClasses(model, p), SpectrumKind::Emission);
  for (const auto& w : lines) EXPECT_EQ(w.sidebandFraction, 0.0);
}

TEST(ThermalSpectrum, SpectrumWidthsFollowTemperature) {
  // Each line's Lorentzian uses its homogeneous width at the project temperature plus the user's
  // broadening; warmer means broader.
  Project cold = sivProject(2.0), warm = sivProject(20.0);
  cold.conditions.extraBroadeningGHz = warm.conditions.extraBroadeningGHz = 0.05;
  const CentreModel mc(makeModelSetup(cold)), mw(makeModelSetup(warm));
  const auto sc = solveProjectClasses(mc, cold);
  const auto lc = weightLines(mc, sc, SpectrumKind::Excitation);
  const auto lw = weightLines(mw, solveProjectClasses(mw, warm), SpectrumKind::Excitation);
  ASSERT_EQ(lc.size(), lw.size());
  const ClassThermal t = classThermal(mc, sc[0], 2.0);
  EXPECT_DOUBLE_EQ(lc[0].fwhmGHz, t.lineFwhmGHz[0] + 0.05);
  for (std::size_t k = 0; k < lc.size(); ++k) EXPECT_GT(lw[k].fwhmGHz, lc[k].fwhmGHz);
}

TEST(ThermalSpectrum, UnknownDebyeWallerStopsASidebandSpectrumWithItsName) {
  Project p;
  p.centre.preset = "PbV-";
  p.centre.overrides = {{"lambda_u_GHz", 12000.0}, {"lifetime_ns", 5.0}};
  p.conditions.phononSideband = true;
  const CentreModel model(makeModelSetup(p));
  try {
    (void)weightLines(model, solveProjectClasses(model, p), SpectrumKind::Emission);
    FAIL();
  } catch (const MissingValueError& e) {
    EXPECT_NE(std::string(e.what()).find("debye_waller"), std::string::npos) << e.what();
  }
}

TEST(ThermalSweep, TemperatureSweepKeepsLevelsAndBroadensLines) {
  Project p = sivProject(4.0);
  SweepSpec s;
  s.kind = SweepKind::Temperature;
  s.from = 1;
  s.to = 20;
  s.points = 5;
  p.sweeps.push_back(s);
  const Project back = parseProject(projectToJson(p), "round trip");
  ASSERT_EQ(back.sweeps.size(), 1u);
  EXPECT_EQ(back.sweeps[0].kind, SweepKind::Temperature);
  const CentreModel model(makeModelSetup(back));
  const SweepResult r = runSweep(model, back, back.sweeps[0]);
  for (const ClassSweep& c : r.classes) {
    EXPECT_NEAR((c.groundLevels.row(0) - c.groundLevels.row(4)).cwiseAbs().maxCoeff(), 0.0, 1e-9);
    ASSERT_EQ(c.lineFwhmGHz.size(), 5u);
    for (std::size_t i = 0; i < c.lineFwhmGHz[0].size(); ++i) EXPECT_GT(c.lineFwhmGHz[4][i], c.lineFwhmGHz[0][i]);
  }
}

TEST(ZplAnchor, CLineLandsOnTheAnchorAndTheCentroidFollowsTheSplittings) {
  // Zero field, no strain: C = ν0 − (λu − λg)/2 (docs/physics.md, Strain from the zero-field lines;
  // exact algebra of the model), so the centroid lies (259 − 48)/2 GHz above the C line for SiV⁻.
  Project p;
  p.centre.preset = "SiV-";
  p.centre.zplAnchor = ZplAnchor{'C', 737.0, false, 4.0};
  const Project back = parseProject(projectToJson(p), "round trip");
  ASSERT_TRUE(back.centre.zplAnchor);
  const ModelSetup setup = makeModelSetup(back);
  const double anchorGHz = toAbsoluteGHz(737.0, SpectralUnit::NmVacuum, 0.0);
  EXPECT_NEAR(setup.centre.parameters.get(Param::ZplTHz) * 1e3 - anchorGHz, (259.0 - 48.0) / 2.0, 1e-6);
  const CentreModel model(setup);
  for (const OpticalLine& l : model.solve(0, Vec3::Zero()).lines) {
    if (l.parent == 'C') {
      EXPECT_NEAR(l.frequencyGHz, anchorGHz, 1e-6);
    }
  }
  EXPECT_NE(setup.centre.provenance[static_cast<std::size_t>(Param::ZplTHz)].source.find("C line"), std::string::npos);
}

TEST(AssumedValues, ProjectMarksAnAssumedExcitedHyperfine) {
  Project p;
  p.centre.preset = "SiV-";
  p.centre.isotope = "29Si";
  EXPECT_THROW(CentreModel(makeModelSetup(p)), MissingValueError);
  p.centre.assumed = {{"A_par_u_MHz", 0.0}, {"A_perp_u_MHz", 0.0}};
  const Project back = parseProject(projectToJson(p), "round trip");
  const ModelSetup setup = makeModelSetup(back);
  EXPECT_NO_THROW(CentreModel{setup});
  const auto& prov = setup.centre.provenance[static_cast<std::size_t>(Param::AParU)];
  EXPECT_EQ(prov.status, ValueStatus::Assumed);
  EXPECT_EQ(prov.value, 0.0);
}
