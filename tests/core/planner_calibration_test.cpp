// A calibrated magnet in the planner: the plan of a project with a magnet calibration equals the plan
// of the same project without calibration whose reach and magnitudes are the true fields (exact
// identity of the two descriptions up to rounding; the calibration is a scale times a rotation,
// docs/architecture.md, Magnet tilt).
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <numbers>

#include "core/crystal/frames.h"
#include "core/planner/planner.h"
#include "core/project/field_semantics.h"
#include "core/project/model_setup.h"

using namespace finestra;

namespace {

// Invented calibration (not a measured one): 3 % weak, tilted 4° toward lab azimuth 35°.
const MagnetCalibration kMagnet{0.97, 4.0, 35.0};

CentreModel demoModel() {
  Project p;  // (001) sample, lab x along [110]; a small invented shear strain
  p.strain.crystal = strainFromComponents(0, 0, 0, 2e-6, 2e-6, -3e-6);
  return CentreModel(makeModelSetup(p));
}

PlanRequest calibratedRequest(ReachKind kind) {
  PlanRequest r;
  r.targetClass = 1;
  r.magnitudesT = {0.35, 0.6};
  r.settings.magnitudeT = 0.35;
  r.settings.driveLab = Vec3(1, 0, 0);
  r.reach.kind = kind;
  r.reach.stepDeg = 5;
  r.reach.planeNormalLab = Vec3(1, 0, 0);
  r.reach.planeStartLab = Vec3(0, 0, 1);
  r.reach.magnetAxisLab = Vec3(1, 0, 1);
  r.reach.rotationAxisLab = Vec3(0, 0, 1);
  r.constraints = {{FigureId::QubitGHz, 4.0, 14.0}, {FigureId::Cyclicity, 20.0}};
  r.objective = {FigureId::QubitGHz, true};
  r.bestCount = 8;
  r.magnet = kMagnet;
  return r;
}

// The same request described by true fields: no calibration, every magnet vector replaced by the
// true vector it gives (rotation), every magnitude multiplied by the scale.
PlanRequest atTrueField(PlanRequest r) {
  auto rotate = [](const Vec3& v) -> Vec3 { return trueFieldLab(kMagnet, v) / kMagnet.fieldScale; };
  if (r.reach.kind == ReachKind::Plane) {
    r.reach.planeNormalLab = rotate(r.reach.planeNormalLab);
    r.reach.planeStartLab = rotate(r.reach.planeStartLab);
  } else {
    r.reach.magnetAxisLab = rotate(r.reach.magnetAxisLab);  // the sample turns about the same lab axis
  }
  for (double& b : r.magnitudesT) b *= kMagnet.fieldScale;
  r.settings.magnitudeT = r.magnitudesT.front();
  r.magnet = MagnetCalibration{};
  return r;
}

void expectNear(const Vec3& a, const Vec3& b, const char* what) {
  EXPECT_LT((a - b).norm(), 1e-12 * std::max(1.0, b.norm())) << what;
}

void expectSamePlan(ReachKind kind) {
  const CentreModel model = demoModel();
  const PlanRequest calibrated = calibratedRequest(kind);
  const PlanRequest reference = atTrueField(calibrated);
  const PlanResult a = runPlan(model, calibrated);
  const PlanResult b = runPlan(model, reference);

  ASSERT_EQ(a.directions.size(), b.directions.size());
  ASSERT_EQ(a.regions.size(), b.regions.size());
  for (std::size_t m = 0; m < a.regions.size(); ++m) {
    EXPECT_DOUBLE_EQ(a.regions[m].magnitudeT, calibrated.magnitudesT[m]);  // reported as set on the magnet
    EXPECT_EQ(a.regions[m].feasible, b.regions[m].feasible) << "magnitude " << m;
    EXPECT_NEAR(a.regions[m].fraction, b.regions[m].fraction, 1e-12);
  }
  // The test means something only if some settings are feasible and some are not.
  ASSERT_GT(a.regions[0].feasibleCount, 0);
  ASSERT_LT(a.regions[0].feasibleCount, static_cast<int>(a.directions.size()));

  ASSERT_EQ(a.best.size(), b.best.size());
  ASSERT_FALSE(a.best.empty());
  // Mirror-symmetric directions tie on the objective, and rounding may order a tie either way:
  // the ranked objective values must agree in order, each setting must have its twin in b.
  for (std::size_t r = 0; r < a.best.size(); ++r) {
    const RankedSetting& x = a.best[r];
    const auto k = static_cast<std::size_t>(calibrated.targetClass);
    EXPECT_NEAR(x.figures[k].qubitGHz, b.best[r].figures[k].qubitGHz, 1e-9) << "rank " << r;
    const auto twin = std::find_if(b.best.begin(), b.best.end(), [&](const RankedSetting& y) {
      return y.direction.magnetAngleDeg == x.direction.magnetAngleDeg &&
             std::abs(y.magnitudeT - x.magnitudeT * kMagnet.fieldScale) < 1e-15;
    });
    ASSERT_NE(twin, b.best.end()) << "rank " << r << ": no setting at magnet angle " << x.direction.magnetAngleDeg;
    const RankedSetting& y = *twin;
    expectNear(x.fieldLabT, y.fieldLabT, "true lab field");
    expectNear(x.fieldCrystalT, y.fieldCrystalT, "true crystal field");
    // The magnet setting of the calibrated plan produces its true field.
    Vec3 expected = trueFieldLab(kMagnet, x.magnitudeT * x.direction.lab);
    if (kind == ReachKind::SampleRotation)  // magnet along its axis, then the sample turned by ψ
      expected = rotationAbout(calibrated.reach.rotationAxisLab.normalized(), -x.direction.magnetAngleDeg * std::numbers::pi / 180) *
                 trueFieldLab(kMagnet, x.magnitudeT * calibrated.reach.magnetAxisLab.normalized());
    expectNear(expected, x.fieldLabT, "magnet setting → true field");
    for (int c : calibrated.settings.classes) {
      const auto j = static_cast<std::size_t>(c);
      EXPECT_NEAR(x.figures[j].qubitGHz, y.figures[j].qubitGHz, 1e-9) << "rank " << r << " class " << c;
      EXPECT_NEAR(x.figures[j].cyclicity, y.figures[j].cyclicity, 1e-6 * std::abs(y.figures[j].cyclicity))
          << "rank " << r << " class " << c;
    }
  }
}

TEST(PlannerCalibration, CalibratedPlaneReachEqualsThePlanAtTheTrueField) { expectSamePlan(ReachKind::Plane); }

TEST(PlannerCalibration, CalibratedSampleRotationEqualsThePlanAtTheTrueField) {
  expectSamePlan(ReachKind::SampleRotation);
}

TEST(PlannerCalibration, ACalibrationChangesThePlan) {
  // Without the calibration in the request the same reach gives other true fields.
  const CentreModel model = demoModel();
  PlanRequest calibrated = calibratedRequest(ReachKind::Plane);
  PlanRequest nominal = calibrated;
  nominal.magnet = MagnetCalibration{};
  const PlanResult a = runPlan(model, calibrated), b = runPlan(model, nominal);
  ASSERT_FALSE(a.best.empty());
  ASSERT_FALSE(b.best.empty());
  EXPECT_GT((a.best[0].fieldLabT - b.best[0].fieldLabT).norm() + std::abs(a.best[0].figures[1].qubitGHz - b.best[0].figures[1].qubitGHz), 1e-6);
}

TEST(FieldSemantics, TrueDirectionIsTheCalibratedUnitVectorAndTheScale) {
  const Vec3 d = Vec3(0.3, -0.5, 0.8).normalized();
  const TrueDirection t = trueDirection(kMagnet, d);
  EXPECT_NEAR(t.lab.norm(), 1.0, 1e-15);
  EXPECT_DOUBLE_EQ(t.gain, 0.97);
  expectNear(0.42 * t.gain * t.lab, trueFieldLab(kMagnet, 0.42 * d), "linear in the magnitude");
  const Project p = [] {
    Project q;
    q.magnet = kMagnet;
    q.field = FieldSetting::fromAngles(0.5, 60, 20);
    return q;
  }();
  const LabFrame lab(p.sample.normal, p.sample.inPlaneX);
  // Inverse beside the forward map: the setting for a true field gives that true field back.
  const FieldSetting back = magnetSettingForTrueField(p, trueFieldLab(p, p.field, lab));
  expectNear(back.labVector(lab), p.field.labVector(lab), "setting round trip");
}

}  // namespace
