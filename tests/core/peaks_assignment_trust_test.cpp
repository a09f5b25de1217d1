// Trust in the assignment: near-ties flagged ambiguous with the second-best line and the cost
// margin, outliers reported with their real distance to the nearest line, and a plausibility
// check that names the unit when the peaks' numbers were written in another unit than labelled.
#include <gtest/gtest.h>

#include <cmath>
#include <random>

#include "core/fit/assignment_trust.h"
#include "core/project/model_setup.h"
#include "fit_test_support.h"

namespace finestra {
namespace {

using namespace finestra::testing;

struct OneSet {
  Project project;
  std::vector<PredictedLine> lines;
};

OneSet oneSetAtField() {
  OneSet s;
  s.project = scenarioProject("SiV-");
  s.project.classes = {0};
  MeasurementSet m;
  m.name = "one";
  m.field = FieldSetting::fromAngles(0.5, 40, 30);
  s.project.measurements.push_back(m);
  const FitProblem problem = prepareFitProblem(s.project, std::vector<std::string>{}, false);
  const CentreModel model(fitStateSetup(problem.start, problem.baseSetup));
  s.lines = predictSetLines(problem, model, problem.start, 0);
  return s;
}

// A strong line and its nearest distinct neighbour, also strong and of similar intensity (weak-line
// penalties differ by < 0.25), at least 1 GHz apart.
std::pair<PredictedLine, PredictedLine> similarPair(const std::vector<PredictedLine>& lines) {
  double top = 0;
  for (const auto& l : lines) top = std::max(top, l.intensity);
  for (const auto& a : lines) {
    const PredictedLine* nearest = nullptr;
    for (const auto& b : lines) {
      const double gap = std::abs(a.frequencyGHz - b.frequencyGHz);
      if (gap > 1e-6 && (!nearest || gap < std::abs(a.frequencyGHz - nearest->frequencyGHz))) nearest = &b;
    }
    if (nearest && a.intensity > 0.2 * top && nearest->intensity > 0.2 * top && std::abs(a.frequencyGHz - nearest->frequencyGHz) > 1.0 &&
        std::abs(std::log(a.intensity / nearest->intensity)) < 0.5)
      return {a, *nearest};
  }
  throw std::runtime_error("no pair");
}

Project withPeakAt(Project p, double frequencyGHz, double sigmaGHz) {
  MeasuredPeak peak;
  peak.position = frequencyGHz;
  peak.unit = SpectralUnit::GHzAbsolute;
  peak.sigma = sigmaGHz;
  p.measurements[0].peaks.push_back(peak);
  return p;
}

// Cost = z² + penalties (peak_assignment.h). A peak on line a with line b 0.1σ away differs in
// cost by 0.01 + a penalty difference below 0.25: a near-tie, flagged; with σ a thousand times
// smaller line b is 100σ away and the margin is about 10⁴: not flagged.
TEST(PeaksAssignmentTrust, NearTieIsAmbiguousAndClearCaseIsNot) {
  const OneSet s = oneSetAtField();
  const auto [a, b] = similarPair(s.lines);
  const double gap = std::abs(a.frequencyGHz - b.frequencyGHz);
  for (const double sigma : {10.0 * gap, 0.01 * gap}) {
    const Project p = withPeakAt(s.project, a.frequencyGHz, sigma);
    const FitProblem problem = prepareFitProblem(p, std::vector<std::string>{});
    const std::vector<std::optional<LineRef>> assignment{a.ref};
    const auto alt = rankPeakAlternatives(problem, problem.start, assignment);
    ASSERT_EQ(alt.size(), 1u);
    if (sigma > gap) {
      EXPECT_TRUE(alt[0].ambiguous) << "margin " << alt[0].costMargin;
      EXPECT_LT(alt[0].costMargin, 0.3);
      EXPECT_FALSE(alt[0].secondLabel.empty());
    } else {
      EXPECT_FALSE(alt[0].ambiguous);
      EXPECT_GT(alt[0].costMargin, 100.0);
    }
  }
}

// An outlier 40 GHz from every line keeps its real residual (nearest line − peak), never 0.
TEST(PeaksAssignmentTrust, OutlierReportsItsRealResidual) {
  const OneSet s = oneSetAtField();
  double top = -1e300;
  for (const auto& l : s.lines) top = std::max(top, l.frequencyGHz);
  const Project p = withPeakAt(s.project, top + 400.0, 0.05);
  const FitProblem problem = prepareFitProblem(p, std::vector<std::string>{});
  const auto alt = rankPeakAlternatives(problem, problem.start, {std::nullopt});
  EXPECT_NEAR(alt[0].nearestResidualGHz, -400.0, 1e-6);
  EXPECT_FALSE(alt[0].nearestLabel.empty());
}

// Synthetic peaks written as THz numbers but labelled GHz: every peak is an outlier and the check
// names THz.
TEST(PeaksAssignmentTrust, ThzNumbersLabelledGhzAreRecognised) {
  const Project base = scenarioProject("SiV-");
  std::mt19937_64 rng(3);
  const FitState truth = scenarioTruth(base, rng);
  const auto sets = makeSyntheticSets(base, truth, sixSettings(0.05), rng);
  Project p = withMeasurements(base, sets);
  const double zpl = CentreModel(makeModelSetup(p)).zplGHz();
  for (auto& m : p.measurements)
    for (auto& peak : m.peaks) {
      peak.position = fromAbsoluteGHz(toAbsoluteGHz(peak.position, peak.unit, zpl), SpectralUnit::THz, zpl);
      peak.sigma = 5e-5;
      peak.unit = SpectralUnit::GHzAbsolute;
    }
  FitOptions o;
  o.free = std::vector<std::string>{};
  o.starts = 1;
  const FitResult r = fitProject(p, o);
  EXPECT_EQ(r.outlierCount, static_cast<int>(r.peaks.size()));
  EXPECT_NE(r.unitCheck.find("look like THz labelled GHz"), std::string::npos) << r.unitCheck;
  for (const auto& pk : r.peaks) EXPECT_GT(std::abs(pk.nearestResidualGHz), 1e5) << "outliers keep their real residual";
}

// With correct units and the truth as start nothing is implausible and the error note says which
// errors are reported.
TEST(PeaksAssignmentTrust, CorrectUnitsPassAndErrorsAreExplained) {
  const Project base = scenarioProject("SiV-");
  std::mt19937_64 rng(4);
  const FitState truth = scenarioTruth(base, rng);
  const auto sets = makeSyntheticSets(base, truth, sixSettings(0.05), rng);
  const Project p = withMeasurements(startingProject(base, truth, rng), sets);
  FitOptions o;
  o.free = scenarioFree();
  o.starts = 4;
  const FitResult r = fitProject(p, o);
  EXPECT_TRUE(r.unitCheck.empty());
  EXPECT_FALSE(r.errorNote.empty());
  for (const auto& par : r.parameters) {
    if (!par.free || !par.determined) continue;
    EXPECT_NEAR(par.scaledError / par.formalError, std::sqrt(r.chi2PerDof), 1e-9);
    EXPECT_DOUBLE_EQ(par.standardError, r.chi2PerDof > 1 ? par.scaledError : par.formalError);
  }
}

}  // namespace
}  // namespace finestra
