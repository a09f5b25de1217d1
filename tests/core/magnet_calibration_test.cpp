// The magnet calibration (field scale and tilt, docs/physics.md, Magnet calibration) is part of the
// project: every computation from a magnet setting applies it, and a fit applied to the project
// keeps it, so the applied project reproduces the fit.
#include <gtest/gtest.h>

#include <cmath>
#include <numbers>

#include "core/common/errors.h"
#include "core/fit/project_fit.h"
#include "core/io/project_file.h"
#include "core/project/model_setup.h"
#include "core/project/sweep_path.h"
#include "core/project/evaluate.h"
#include "core/sweep/sweep.h"

using namespace finestra;

namespace {

constexpr double kDeg = std::numbers::pi / 180.0;

Project demoProject() {
  Project p = readProjectFile(FINESTRA_SOURCE_DIR "/examples/membrane-vector-magnet.json");
  p.magnet = {0.97, 2.5, 40.0};
  return p;
}

}  // namespace

// Geometry of the definition: the tilt rotates about n̂ = (−sin φt, cos φt, 0), so the nominal lab
// z axis tips by the tilt angle toward azimuth φt (exact; docs/physics.md, Magnet calibration).
TEST(MagnetCalibration, TipsLabZTowardTheTiltAzimuthAndScales) {
  const MagnetCalibration m{1.2, 7.0, 30.0};
  const Vec3 z = m.trueFieldLab(Vec3(0, 0, 1));
  const Vec3 expected = 1.2 * Vec3(std::sin(7 * kDeg) * std::cos(30 * kDeg), std::sin(7 * kDeg) * std::sin(30 * kDeg),
                                   std::cos(7 * kDeg));
  EXPECT_LT((z - expected).norm(), 1e-14);
  EXPECT_NEAR(m.trueFieldLab(Vec3(0.3, -0.2, 0.5)).norm(), 1.2 * Vec3(0.3, -0.2, 0.5).norm(), 1e-14);
  const Vec3 b(0.3, -0.2, 0.5);
  EXPECT_LT((m.nominalFieldLab(m.trueFieldLab(b)) - b).norm(), 1e-15);
  EXPECT_TRUE(MagnetCalibration{}.isNominal());
  EXPECT_EQ(MagnetCalibration{}.trueFieldLab(Vec3(0.1, 0.2, 0.3)), Vec3(0.1, 0.2, 0.3));
}

// A calibrated project gives the same lines as an uncalibrated one whose field is set directly to
// the true field.
TEST(MagnetCalibration, ProjectFieldAndSweepsUseTheTrueField) {
  const Project calibrated = demoProject();
  const CentreModel model(makeModelSetup(calibrated));
  Project direct = calibrated;
  direct.magnet = {};
  direct.field.form = FieldSetting::Form::VectorLab;
  direct.field.vector = calibrated.magnet.trueFieldLab(calibrated.field.labVector(model.setup().lab));
  const auto a = solveProjectClasses(model, calibrated), b = solveProjectClasses(model, direct);
  ASSERT_EQ(a.size(), b.size());
  for (std::size_t c = 0; c < a.size(); ++c)
    for (std::size_t k = 0; k < a[c].lines.size(); ++k)
      EXPECT_NEAR(a[c].lines[k].frequencyGHz, b[c].lines[k].frequencyGHz, 1e-9);
  const SweepSpec& sweep = calibrated.sweeps.at(0);  // magnitude sweep along the project's direction
  const Vec3 at1T = sweepField(calibrated, sweep, model.setup().lab, 1.0);
  const Vec3 nominalDirection = calibrated.field.labVector(model.setup().lab).normalized();
  EXPECT_LT((at1T - model.setup().lab.toCrystal(calibrated.magnet.trueFieldLab(nominalDirection))).norm(), 1e-12);
}

TEST(MagnetCalibration, SurvivesSaveAndOpenAndIsCheckedOnRead) {
  const Project p = demoProject();
  const Project back = parseProject(projectToJson(p), "p.json");
  EXPECT_EQ(back.magnet.fieldScale, 0.97);
  EXPECT_EQ(back.magnet.tiltDeg, 2.5);
  EXPECT_EQ(back.magnet.tiltAzimuthDeg, 40.0);
  std::string text = projectToJson(p);
  text.replace(text.find("\"field_scale\": 0.97"), 19, "\"field_scale\": 0.0");
  try {
    parseProject(text, "p.json");
    FAIL() << "a zero field scale was accepted";
  } catch (const InputError& e) {
    EXPECT_NE(std::string(e.what()).find("p.json: magnet.field_scale"), std::string::npos) << e.what();
  }
}

// After "apply to project" the project holds the fitted calibration, strain and parameters: an
// assignment with no free parameter then has the fit's χ².
TEST(MagnetCalibration, AppliedFitReproducesItsChiSquare) {
  const Project project = readProjectFile(FINESTRA_SOURCE_DIR "/examples/fit-demo.json");
  FitOptions options;
  options.starts = 2;
  const FitResult fitted = fitProject(project, options);
  ASSERT_TRUE(fitted.converged);
  const Project applied = applyFitToProject(project, fitted);
  EXPECT_FALSE(applied.magnet.isNominal());
  FitOptions assignOnly;
  assignOnly.free = std::vector<std::string>{};
  assignOnly.starts = 1;
  const FitResult again = fitProject(applied, assignOnly);
  EXPECT_NEAR(again.chi2, fitted.chi2, 1e-6 * fitted.chi2);
}
