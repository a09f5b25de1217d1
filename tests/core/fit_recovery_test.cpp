// Fits of synthetic measurements made by the core model plus seeded noise: the truth must be
// recovered within 3σ, the pulls (fit − truth)/σ must have unit width (honest uncertainties), and
// resolved peaks must be assigned to the lines that made them. A start that lands in a wrong
// minimum must say so (not converged, χ²/dof well above 1, or peaks left as outliers).
#include <gtest/gtest.h>

#include <cmath>

#include "fit_test_support.h"

namespace finestra {
namespace {

using namespace finestra::testing;

struct Tally {
  std::vector<double> pulls;
  int beyond3 = 0, failedAndSaidSo = 0, wrongAssignments = 0, resolvedPeaks = 0;
  void add(double p) {
    pulls.push_back(p);
    if (std::abs(p) > 3) ++beyond3;
  }
  double width() const {
    double mean = 0, sq = 0;
    for (double p : pulls) mean += p;
    mean /= static_cast<double>(pulls.size());
    for (double p : pulls) sq += (p - mean) * (p - mean);
    return std::sqrt(sq / static_cast<double>(pulls.size() - 1));
  }
};

void runSeeds(const std::string& preset, int seeds, Tally& tally) {
  const Project base = scenarioProject(preset);
  for (int seed = 1; seed <= seeds; ++seed) {
    std::mt19937_64 rng(static_cast<std::uint64_t>(seed) * 7919ULL + preset.size());
    const FitState truth = scenarioTruth(base, rng);
    std::vector<std::vector<LineRef>> truthLines;
    const auto sets = makeSyntheticSets(base, truth, settingsFor(preset), rng);
    const Project project = withMeasurements(startingProject(base, truth, rng), sets, &truthLines);
    FitOptions options;
    options.free = scenarioFree(preset);
    options.starts = 8;
    options.seed = static_cast<unsigned>(seed);
    const FitResult r = fitProject(project, options);
    // The data hold no outliers: a fit that leaves peaks unexplained found a wrong minimum.
    if (!r.converged || r.chi2PerDof > 2.0 || r.outlierCount > 0) {
      ++tally.failedAndSaidSo;
      continue;
    }
    ASSERT_TRUE(r.undetermined.empty()) << preset << " seed " << seed;
    for (const std::string& name : options.free->size() ? *options.free : std::vector<std::string>{}) {
      const FittedParameter& p = parameter(r, name);
      double diff = p.value - truthValue(truth, name);
      if (name == "magnet_tilt_azimuth_deg") diff = std::remainder(diff, 360.0);
      tally.add(diff / p.standardError);
    }
    for (const FittedPeak& peak : r.peaks) {
      ++tally.resolvedPeaks;
      const LineRef& expected = truthLines[static_cast<std::size_t>(peak.measurement)][static_cast<std::size_t>(peak.peak)];
      if (!peak.line || !(*peak.line == expected)) ++tally.wrongAssignments;
    }
  }
}

class FitRecovery : public ::testing::TestWithParam<std::string> {};

// Criterion: for Gaussian noise and a locally linear model the pulls are N(0,1) (least-squares
// theory, common practice); 3σ is exceeded with probability 0.27 %.
TEST_P(FitRecovery, TruthWithinThreeSigmaAndUnitPullWidth) {
  Tally tally;
  const int seeds = 12;
  runSeeds(GetParam(), seeds, tally);
  RecordProperty("pull_width", std::to_string(tally.width()));
  RecordProperty("failed_fits", std::to_string(tally.failedAndSaidSo));
  EXPECT_LE(tally.failedAndSaidSo, 1) << "fits that ended in a (reported) wrong minimum, of " << seeds;
  EXPECT_LE(tally.beyond3, 2) << "pulls beyond 3 sigma out of " << tally.pulls.size();
  // About 90 pulls: the sample width scatters by about 1/sqrt(2·90) = 0.075.
  EXPECT_NEAR(tally.width(), 1.0, 0.25) << GetParam();
  EXPECT_EQ(tally.wrongAssignments, 0) << "of " << tally.resolvedPeaks << " resolved peaks";
}

INSTANTIATE_TEST_SUITE_P(Centres, FitRecovery, ::testing::Values("SiV-", "GeV-", "SnV-"),
                         [](const auto& info) { return info.param.substr(0, 3); });

}  // namespace
}  // namespace finestra
