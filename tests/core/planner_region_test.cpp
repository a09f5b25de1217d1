// The reported feasible region and ranking agree with a brute-force scan that evaluates every
// reachable direction with the straightforward reference evaluation and applies the ranges itself.
#include <gtest/gtest.h>

#include <atomic>

#include "core/project/model_setup.h"
#include "core/planner/planner.h"

using namespace finestra;

namespace {

CentreModel demoModel() {
  Project p;  // (001) sample, lab x along [110]; a small invented shear strain
  p.strain.crystal = strainFromComponents(0, 0, 0, 2e-6, 2e-6, -3e-6);
  return CentreModel(makeModelSetup(p));
}

PlanRequest demoRequest(ReachKind kind) {
  PlanRequest r;
  r.targetClass = 1;
  r.magnitudesT = {0.35, 0.6};
  r.settings.magnitudeT = 0.35;
  r.settings.driveLab = Vec3(1, 0, 0);
  r.reach.kind = kind;
  r.reach.stepDeg = kind == ReachKind::Sphere ? 15 : 5;
  r.reach.planeNormalLab = Vec3(1, 0, 0);  // lab x = [110]: the plane holds the class-1 axis [1-1-1]
  r.reach.planeStartLab = Vec3(0, 0, 1);
  r.reach.magnetAxisLab = Vec3(1, 0, 1);
  r.reach.rotationAxisLab = Vec3(0, 0, 1);
  r.constraints = {{FigureId::QubitGHz, 4.0, 14.0},
                   {FigureId::Cyclicity, 20.0},
                   // 1.5 linewidths: with thermal C-line widths at the project's 4 K the best plane
                   // direction here is just under 3, and the check needs feasible directions.
                   {FigureId::SeparationLinewidths, 1.5},
                   {FigureId::DriveFraction, 0.002}};
  r.objective = {FigureId::QubitGHz, true};
  r.bestCount = 5;
  return r;
}

void checkAgainstBruteForce(ReachKind kind) {
  const CentreModel model = demoModel();
  const PlanRequest request = demoRequest(kind);
  const PlanResult result = runPlan(model, request);
  ASSERT_EQ(result.regions.size(), request.magnitudesT.size());
  double bestBrute = -1;
  int feasibleTotal = 0;
  for (std::size_t m = 0; m < request.magnitudesT.size(); ++m) {
    const FeasibleRegion& region = result.regions[m];
    ASSERT_EQ(region.feasible.size(), result.directions.size());
    for (std::size_t k = 0; k < result.directions.size(); ++k) {
      const Vec3 dir = model.setup().lab.toCrystal(result.directions[k].lab);
      const auto f = referenceFigures(model, request.settings, dir, request.magnitudesT[m], 200);
      const ClassFigures& t = f[static_cast<std::size_t>(request.targetClass)];
      const bool ok = t.qubitGHz >= 4 && t.qubitGHz <= 14 && t.cyclicity >= 20 && t.separationLinewidths >= 1.5 &&
                      t.driveFraction >= 0.002;
      EXPECT_EQ(ok, region.feasible[k] != 0) << "direction " << k << " magnitude " << request.magnitudesT[m];
      if (ok) bestBrute = std::max(bestBrute, t.qubitGHz), ++feasibleTotal;
    }
  }
  ASSERT_GT(feasibleTotal, 0) << "the scenario must have feasible settings to be a useful check";
  ASSERT_FALSE(result.best.empty());
  EXPECT_NEAR(result.best.front().figures[1].qubitGHz, bestBrute, 1e-9);
  for (std::size_t k = 1; k < result.best.size(); ++k)
    EXPECT_GE(result.best[k - 1].figures[1].qubitGHz, result.best[k].figures[1].qubitGHz);
  for (const auto& s : result.best) {
    EXPECT_NEAR(s.fieldLabT.norm(), s.magnitudeT, 1e-12);
    EXPECT_LT((model.setup().lab.toCrystal(s.fieldLabT) - s.fieldCrystalT).norm(), 1e-12);
    EXPECT_LT((directionFromAngles(s.direction.polarDeg, s.direction.azimuthDeg) - s.direction.lab).norm(), 1e-9);
  }
}

}  // namespace

TEST(PlannerRegion, SphereRegionAgreesWithBruteForce) { checkAgainstBruteForce(ReachKind::Sphere); }
TEST(PlannerRegion, PlaneRegionAgreesWithBruteForce) { checkAgainstBruteForce(ReachKind::Plane); }
TEST(PlannerRegion, RotationRegionAgreesWithBruteForce) { checkAgainstBruteForce(ReachKind::SampleRotation); }

TEST(PlannerRegion, IntervalsCoverExactlyTheFeasibleDirections) {
  const CentreModel model = demoModel();
  const PlanResult result = runPlan(model, demoRequest(ReachKind::Sphere));
  const FeasibleRegion& region = result.regions.front();
  int covered = 0;
  for (const auto& interval : region.intervals)
    for (std::size_t k = 0; k < result.directions.size(); ++k) {
      const auto& d = result.directions[k];
      if (d.polarDeg == interval.polarDeg && d.azimuthDeg >= interval.fromDeg && d.azimuthDeg <= interval.toDeg) {
        EXPECT_TRUE(region.feasible[k]);
        ++covered;
      }
    }
  EXPECT_EQ(covered, region.feasibleCount);
}

TEST(PlannerRegion, CancelStopsTheComputation) {
  const CentreModel model = demoModel();
  std::atomic<bool> cancel{true};
  ProgressControl control;
  control.cancel = &cancel;
  EXPECT_THROW(runPlan(model, demoRequest(ReachKind::Sphere), control), Cancelled);
  PlannerSettings settings;
  EXPECT_THROW(computeFigureMap(model, settings, SphereGrid{}, control), Cancelled);
}

TEST(PlannerRegion, ProgressReachesOne) {
  const CentreModel model = demoModel();
  std::atomic<double> last{0};
  ProgressControl control;
  control.report = [&](double f) {
    double seen = last.load();
    while (f > seen && !last.compare_exchange_weak(seen, f)) {
    }
  };
  SphereGrid grid;
  grid.polarCount = 19;
  grid.azimuthCount = 37;
  computeFigureMap(model, PlannerSettings{}, grid, control);
  EXPECT_DOUBLE_EQ(last.load(), 1.0);
}
