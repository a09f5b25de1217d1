// Closed-form strain estimate from the four zero-field lines, checked against the splitting
// formula Δ_m = √(λ_m² + 4|ε_Eg,m|²) with ε_Egx = d(ε_xx−ε_yy) + f ε_zx, ε_Egy = −2d ε_xy + f ε_yz
// (Meesala et al., PRB 97, 205444 (2018), form as recalled), evaluated by hand here.
#include <gtest/gtest.h>

#include <cmath>
#include <random>

#include "core/common/errors.h"
#include "core/crystal/frames.h"
#include "core/strain/zero_field_input.h"
#include "core/project/model_setup.h"
#include "test_support.h"

namespace finestra {
namespace {

using namespace finestra::testing;

ZeroFieldLines linesOf(const CentreModel& model, double sigma) {
  const ClassSolution s = model.solve(0, Vec3::Zero());
  ZeroFieldLines lines;
  for (const auto& l : s.lines) {
    if (l.intensity < 1e-9 && l.intensityCrystal[0] + l.intensityCrystal[1] + l.intensityCrystal[2] < 1e-9) continue;
    lines.frequencyGHz[static_cast<std::size_t>(l.parent - 'A')] = l.frequencyGHz;
  }
  lines.sigmaGHz.fill(sigma);
  return lines;
}

TEST(StrainZeroField, MatchesMeesalaSplittingFormula) {
  std::mt19937 rng(5);
  for (const std::string preset : {"SiV-", "GeV-", "SnV-"}) {
    for (int trial = 0; trial < 5; ++trial) {
      // Strain given in the defect frame of class 0, rotated to the crystal frame for the model.
      const Mat3 defect = randomStrain(rng, 2e-5);
      const Mat3& frame = defectFrame(0);
      const Mat3 crystal = frame.transpose() * defect * frame;
      const CentreModel model(setupFor(preset, {}, crystal));
      const ZeroFieldStrainEstimate e = estimateZeroFieldStrain(linesOf(model, 0.01), model.manifold(Manifold::Ground),
                                                                model.manifold(Manifold::Excited), model.zplGHz());
      const auto& p = model.setup().centre.parameters;
      auto expectedEg = [&](double dPHz, double fPHz) {
        const double d = dPHz * 1e6, f = fPHz * 1e6;  // GHz per unit strain
        return std::hypot(d * (defect(0, 0) - defect(1, 1)) + f * defect(2, 0), -2 * d * defect(0, 1) + f * defect(1, 2));
      };
      const double egG = expectedEg(p.get(Param::DG), p.get(Param::FG));
      const double egU = expectedEg(p.get(Param::DU), p.get(Param::FU));
      EXPECT_NEAR(e.egGroundGHz.value, egG, 1e-6 * (1 + egG)) << preset;
      EXPECT_NEAR(e.egExcitedGHz.value, egU, 1e-6 * (1 + egU)) << preset;
      const double lg = p.get(Param::LambdaG), lu = p.get(Param::LambdaU);
      EXPECT_NEAR(e.deltaG.value, std::sqrt(lg * lg + 4 * egG * egG), 1e-6);
      EXPECT_NEAR(e.deltaU.value, std::sqrt(lu * lu + 4 * egU * egU), 1e-6);
      EXPECT_NEAR(e.mismatchGHz.value, 0.0, 1e-6) << "A-B-C+D vanishes for the model's own lines";
      // A1g: ZPL shift = (t⊥u − t⊥g)(ε_xx+ε_yy) + (t∥u − t∥g) ε_zz in the defect frame.
      const double shift = (p.get(Param::TperpU) - p.get(Param::TperpG)) * 1e6 * (defect(0, 0) + defect(1, 1)) +
                           (p.get(Param::TparU) - p.get(Param::TparG)) * 1e6 * defect(2, 2);
      EXPECT_NEAR(e.zplShiftGHz.value, shift, 1e-6);
    }
  }
}

TEST(StrainZeroField, PureDStrainReadsBackAndRatioMatches) {
  Mat3 defect = Mat3::Zero();
  defect(0, 0) = 1e-5;
  defect(1, 1) = -1e-5;  // pure d-type: |(ε_xx−ε_yy, −2ε_xy)| = 2e-5
  const Mat3& frame = defectFrame(0);
  const CentreModel model(setupFor("SiV-", {}, frame.transpose() * defect * frame));
  const auto e = estimateZeroFieldStrain(linesOf(model, 0.01), model.manifold(Manifold::Ground),
                                         model.manifold(Manifold::Excited), model.zplGHz());
  EXPECT_NEAR(e.pureD.combined.value, 2e-5, 1e-10);
  EXPECT_LT(std::abs(e.pureD.ratioPull), 1e-3);
  EXPECT_GT(std::abs(e.pureF.ratioPull), 3.0) << "the f-type reading must be seen to disagree";
}

// Propagated uncertainties against the scatter of estimates from noisy lines (Monte Carlo).
TEST(StrainZeroField, UncertaintiesMatchMonteCarloScatter) {
  const Mat3& frame = defectFrame(0);
  Mat3 defect = Mat3::Zero();
  defect(0, 1) = defect(1, 0) = 1e-5;
  const CentreModel model(setupFor("SiV-", {}, frame.transpose() * defect * frame));
  const ZeroFieldLines exact = linesOf(model, 0.1);
  std::mt19937_64 rng(9);
  std::normal_distribution<double> noise(0.0, 0.1);
  std::vector<double> eg, dg, mismatch;
  double quotedEg = 0, quotedDg = 0, quotedMismatch = 0;
  for (int k = 0; k < 4000; ++k) {
    ZeroFieldLines noisy = exact;
    for (double& f : noisy.frequencyGHz) f += noise(rng);
    const auto e = estimateZeroFieldStrain(noisy, model.manifold(Manifold::Ground), model.manifold(Manifold::Excited), model.zplGHz());
    eg.push_back(e.egGroundGHz.value);
    dg.push_back(e.deltaG.value);
    mismatch.push_back(e.mismatchGHz.value);
    quotedEg = e.egGroundGHz.standardError;
    quotedDg = e.deltaG.standardError;
    quotedMismatch = e.mismatchGHz.standardError;
  }
  auto sd = [](const std::vector<double>& v) {
    double m = 0, s = 0;
    for (double x : v) m += x;
    m /= static_cast<double>(v.size());
    for (double x : v) s += (x - m) * (x - m);
    return std::sqrt(s / static_cast<double>(v.size() - 1));
  };
  EXPECT_NEAR(sd(dg) / quotedDg, 1.0, 0.05);
  EXPECT_NEAR(sd(eg) / quotedEg, 1.0, 0.08);
  EXPECT_NEAR(sd(mismatch) / quotedMismatch, 1.0, 0.05);
}

TEST(StrainZeroField, ProjectSelectionByOrderAndPins) {
  Project p;
  const CentreModel model(makeModelSetup(p));
  MeasurementSet set;
  set.name = "zero field";
  set.field = FieldSetting::fromAngles(0, 0, 0);
  const ZeroFieldLines lines = linesOf(model, 0.05);
  for (int k : {2, 0, 3, 1}) {  // shuffled C, A, D, B
    MeasuredPeak peak;
    peak.position = lines.frequencyGHz[static_cast<std::size_t>(k)];
    peak.unit = SpectralUnit::GHzAbsolute;
    peak.sigma = 0.05;
    set.peaks.push_back(peak);
  }
  p.measurements.push_back(set);
  auto sel = selectZeroFieldLines(p, model, std::nullopt);
  EXPECT_EQ(sel.peak, (std::array<int, 4>{1, 3, 0, 2}));
  // Pinning peak 0 (really C) as line A (upper excited 2, lower ground 0) overrides the order.
  p.measurements[0].peaks[0].assign = PinnedAssignment{0, 2, 0};
  sel = selectZeroFieldLines(p, model, std::nullopt);
  EXPECT_EQ(sel.peak[0], 0);
  EXPECT_TRUE(sel.pinned[0]);
  p.measurements[0].peaks.pop_back();
  EXPECT_THROW(selectZeroFieldLines(p, model, std::nullopt), InputError);
  EXPECT_THROW(selectZeroFieldLines(p, model, std::string("nothing")), InputError);
}

}  // namespace
}  // namespace finestra
