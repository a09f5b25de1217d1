// The words of a plan: the recommendation is built from the best-ranked setting, and an
// infeasible request is explained constraint by constraint, checked against a scan of the
// figures the planner evaluated.
#include <gtest/gtest.h>

#include <cmath>
#include <cstdio>
#include <limits>

#include "core/planner/infeasibility.h"
#include "core/planner/plan_advice.h"
#include "core/planner/recommendation.h"
#include "core/project/model_setup.h"

using namespace finestra;

namespace {

CentreModel invented001Model() {
  Project p;  // invented: SiV- in a (001) sample, lab axes along the cubic axes
  p.centre.preset = "SiV-";
  p.sample.normal = Vec3(0, 0, 1);
  p.sample.inPlaneX = Vec3(1, 0, 0);
  return CentreModel(makeModelSetup(p));
}

PlanRequest sphereRequest() {
  PlanRequest r;
  r.targetClass = 0;
  r.magnitudesT = {0.3, 0.5};
  r.settings.magnitudeT = 0.3;
  r.reach.stepDeg = 10;
  r.bestCount = 3;
  return r;
}

std::string printed(const char* format, double v) {
  char buf[64];
  std::snprintf(buf, sizeof buf, format, v);
  return buf;
}

bool holdsAllBut(const PlanRequest& r, const ClassFigures& f, std::size_t skip) {
  for (std::size_t c = 0; c < r.constraints.size(); ++c)
    if (c != skip && !r.constraints[c].holds(f)) return false;
  return true;
}

}  // namespace

TEST(PlanAdvice, RecommendationQuotesTheBestSetting) {
  const CentreModel model = invented001Model();
  PlanRequest request = sphereRequest();
  request.constraints = {{FigureId::SeparationLinewidths, 3.0}};
  const PlanResult result = runPlan(model, request);
  ASSERT_FALSE(result.best.empty());
  const RankedSetting& best = result.best.front();
  const std::string text = planAdvice(model, request, result).recommendation;
  const ClassFigures& t = best.figures[0];
  EXPECT_EQ(text.rfind("Set the magnet to |B| = " + printed("%.3f", best.magnitudeT) + " T, polar " +
                           printed("%.1f", best.direction.polarDeg) + "°, azimuth " +
                           printed("%.1f", best.direction.azimuthDeg) + "°",
                       0),
            0u)
      << text;
  EXPECT_NE(text.find("class 0 has qubit " + printed("%.3f", t.qubitGHz) + " GHz"), std::string::npos) << text;
  EXPECT_NE(text.find(printed("%.1f", t.separationLinewidths) + " linewidths from every other class"), std::string::npos)
      << text;
  EXPECT_EQ(planAdvice(model, request, result).infeasible, nullptr);
}

TEST(PlanAdvice, QualifiersFromOtherFeaturesAreQuoted) {
  RecommendationFacts f;
  f.magnitudeT = 0.5;
  f.direction.polarDeg = 10;
  f.direction.azimuthDeg = 20;
  f.qubitGHz = 12.3456;
  f.cyclicity = 150;
  f.separationLinewidths = 4.25;
  f.cyclicityQualifier = "within ±0.5°";
  f.populationQualifier = "for 90 % of centres";
  EXPECT_EQ(recommendationText(f),
            "Set the magnet to |B| = 0.500 T, polar 10.0°, azimuth 20.0°: class 0 has qubit 12.346 GHz, cyclicity "
            "150.0 within ±0.5°, 4.2 linewidths from every other class for 90 % of centres.");
  f.cyclicity = kCyclicityCap;
  f.separationLinewidths = std::numeric_limits<double>::infinity();
  f.qubitGHz = std::nan("");
  const std::string text = recommendationText(f);
  EXPECT_NE(text.find("forbidden spin flip"), std::string::npos);
  EXPECT_NE(text.find("no other class selected"), std::string::npos);
  EXPECT_NE(text.find("qubit undefined"), std::string::npos);
  EXPECT_EQ(text.find("nan"), std::string::npos);
}

// Two ranges that exclude each other: every point fails exactly one of them, so the excluded
// shares add up to 1 and equal the shares each blocks by itself; the compromise for "qubit <= 9"
// is the smallest qubit among the points with qubit above 9.
TEST(PlanAdvice, ExclusiveRangesAreExplainedWithTheNearestCompromise) {
  const CentreModel model = invented001Model();
  PlanRequest request = sphereRequest();
  // Touching at 9 GHz: a point fails both only if its qubit is exactly 9 (or undefined).
  request.constraints = {{FigureId::QubitGHz, -std::numeric_limits<double>::infinity(), 9.0},
                         {FigureId::QubitGHz, std::nextafter(9.0, 10.0)}};
  const PlanResult result = runPlan(model, request);
  const auto why = explainInfeasibility(request, result);
  ASSERT_TRUE(why.has_value());
  ASSERT_EQ(why->constraints.size(), 2u);
  const auto& low = why->constraints[0];
  const auto& high = why->constraints[1];
  EXPECT_TRUE(low.metAnywhere);
  EXPECT_TRUE(high.metAnywhere);
  EXPECT_NEAR(low.excludedShare + high.excludedShare, 1.0, 1e-12);
  EXPECT_NEAR(low.soleBlockerShare, low.excludedShare, 1e-12);
  EXPECT_EQ(low.neverTogetherWith, std::vector<std::size_t>{1});
  double smallestHigh = std::numeric_limits<double>::infinity();
  for (const ClassFigures& f : result.targetFiguresLow)  // one exact centre: low and high agree
    if (holdsAllBut(request, f, 0)) smallestHigh = std::min(smallestHigh, f.qubitGHz);
  EXPECT_EQ(low.nearestValue, smallestHigh);
  const std::string& sentence = why->sentences[0];
  EXPECT_NE(sentence.find("qubit_GHz <= 9 is never met together with qubit_GHz >= 9"), std::string::npos) << sentence;
  EXPECT_NE(sentence.find("best compromise: |B| = "), std::string::npos) << sentence;
  EXPECT_EQ(planAdvice(model, request, result).recommendation.rfind("No reachable setting meets every wanted range", 0), 0u);
}

// A range met nowhere: it excludes the whole reachable set; its compromise is the largest value
// among the points meeting the other range.
TEST(PlanAdvice, RangeMetNowhereIsNamedAndItsBestValueFound) {
  const CentreModel model = invented001Model();
  PlanRequest request = sphereRequest();
  request.constraints = {{FigureId::QubitGHz, 0.0, 1000.0}, {FigureId::AxisAngleDeg, 200.0}};
  const PlanResult result = runPlan(model, request);
  const auto why = explainInfeasibility(request, result);
  ASSERT_TRUE(why.has_value());
  const auto& angle = why->constraints[1];
  EXPECT_FALSE(angle.metAnywhere);
  EXPECT_NEAR(angle.excludedShare, 1.0, 1e-12);
  double largest = -1;
  for (const ClassFigures& f : result.targetFiguresLow)  // one exact centre: low and high agree
    if (holdsAllBut(request, f, 1)) largest = std::max(largest, f.axisAngleDeg);
  EXPECT_EQ(angle.nearestValue, largest);
  EXPECT_NE(why->sentences[1].find("axis_angle_deg >= 200 is met nowhere in the reachable set"), std::string::npos);
  EXPECT_NEAR(why->constraints[0].excludedShare, 0.0, 1e-12);  // the qubit range holds everywhere
}

TEST(PlanAdvice, FeasibleRequestHasNoExplanation) {
  const CentreModel model = invented001Model();
  PlanRequest request = sphereRequest();
  request.constraints = {{FigureId::QubitGHz, 1.0, 30.0}};
  EXPECT_FALSE(explainInfeasibility(request, runPlan(model, request)).has_value());
}

// The symmetry part of the advice: a (001) sample and a magnet turning in the sample plane.
TEST(PlanAdvice, SamplePlaneReachWarnsThatTheTargetIsNeverAlone) {
  const CentreModel model = invented001Model();
  PlanRequest request = sphereRequest();
  request.reach.kind = ReachKind::Plane;
  request.reach.planeNormalLab = Vec3(0, 0, 1);
  const PlanResult result = runPlan(model, request);
  const PlanAdvice advice = planAdvice(model, request, result);
  EXPECT_EQ(advice.symmetry["sample_normal"], "(001)");
  EXPECT_EQ(advice.symmetry["along_sample_normal"]["groups"], nlohmann::json::parse("[[0,1,2,3]]"));
  EXPECT_EQ(advice.symmetry["always_tied_with"], nlohmann::json::parse("[3]"));
  EXPECT_NE(advice.symmetry["warning"].get<std::string>().find("(001) plane"), std::string::npos);
  EXPECT_TRUE(advice.symmetry["strain_free"].get<bool>());
}
