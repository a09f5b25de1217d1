// Line descriptions, polarisation character, nearest-line lookup and sweep coordinates.
#include <gtest/gtest.h>

#include <cmath>

#include "core/project/model_setup.h"
#include "core/project/sweep_path.h"
#include "core/project/evaluate.h"
#include "core/optics/line_info.h"

namespace finestra {
namespace {

Project siliconProject(double fieldT) {
  Project p;
  p.field = FieldSetting::fromAngles(fieldT, 54.7356, 0.0);
  return p;
}

TEST(LineInfo, ZeroFieldPolarisationOfTheFourLines) {
  // docs/physics.md, Optical transitions: consequence of the dipole operator: at zero field and strain the inner lines
  // B and C are polarised along the defect axis, the outer lines A and D perpendicular to it.
  const Project p = siliconProject(0.0);
  const CentreModel model(makeModelSetup(p));
  const auto classes = solveProjectClasses(model, p);
  int checked = 0;
  for (const auto& s : classes)
    for (const auto& l : s.lines) {
      const double par = axisParallelFraction(l, s.cls);
      if (std::isnan(par)) continue;
      if (l.parent == 'B' || l.parent == 'C') {
        EXPECT_NEAR(par, 1.0, 1e-9) << l.label();
      }
      if (l.parent == 'A' || l.parent == 'D') {
        EXPECT_NEAR(par, 0.0, 1e-9) << l.label();
      }
      ++checked;
    }
  EXPECT_GT(checked, 0);
}

TEST(LineInfo, DescriptionListsEveryUnit) {
  const Project p = siliconProject(0.5);
  const CentreModel model(makeModelSetup(p));
  const auto classes = solveProjectClasses(model, p);
  const OpticalLine& line = classes[0].lines[0];
  const std::string text = describeLine(0, line, model.zplGHz());
  const std::string label = line.label();  // must outlive the loop (ASan: stack-use-after-scope)
  for (const char* part : {"class 0", "[111]", "GHz detuning", "THz", "GHz absolute", "nm (vacuum)", "nm (air)",
                           "meV", "cm", "intensity", "polarisation", label.c_str()})
    EXPECT_NE(text.find(part), std::string::npos) << part << "\n" << text;
  // Vacuum wavelength λ = c/ν with c exact (SI 2019).
  char expected[32];
  std::snprintf(expected, sizeof expected, "%.5f nm (vacuum)", 299792458.0 / line.frequencyGHz);
  EXPECT_NE(text.find(expected), std::string::npos) << text;
}

TEST(LineInfo, NearestLinesAreSortedAndNearest) {
  const Project p = siliconProject(0.5);
  const CentreModel model(makeModelSetup(p));
  const auto classes = solveProjectClasses(model, p);
  const double target = classes[2].lines[5].frequencyGHz + 0.01;
  const auto near = nearestLines(classes, target, 0.1, 4);
  ASSERT_EQ(near.size(), 4u);
  for (std::size_t i = 1; i < near.size(); ++i)
    EXPECT_LE(std::abs(near[i - 1].distanceGHz), std::abs(near[i].distanceGHz));
  EXPECT_NEAR(std::abs(near[0].distanceGHz), 0.01, 0.01 + 1e-9);
  for (const auto& s : classes)
    for (const auto& l : s.lines) EXPECT_GE(std::abs(l.frequencyGHz - target) + 1e-12, std::abs(near[0].distanceGHz));
  EXPECT_NEAR(near[0].distanceSigma, std::abs(near[0].distanceGHz) / 0.1, 1e-12);
}

TEST(LineInfo, PeakAtPredictedLineFindsThatLine) {
  Project p = siliconProject(0.2);
  const CentreModel model(makeModelSetup(p));
  MeasurementSet m;
  m.field = FieldSetting::fromAngles(0.8, 90.0, 30.0);
  Project atM = p;
  atM.field = m.field;
  const auto classes = solveProjectClasses(model, atM);
  const OpticalLine& chosen = classes[1].lines[3];
  MeasuredPeak peak;
  peak.unit = SpectralUnit::NmVacuum;
  peak.position = fromAbsoluteGHz(chosen.frequencyGHz, SpectralUnit::NmVacuum, model.zplGHz());
  peak.sigma = 1e-4;
  const auto near = nearestLinesForPeak(model, p, m, peak, 3);
  ASSERT_FALSE(near.empty());
  EXPECT_NEAR(near[0].distanceGHz, 0.0, 1e-6);
  EXPECT_NEAR(near[0].line.frequencyGHz, chosen.frequencyGHz, 1e-9);
}

TEST(LineInfo, SweepCoordinateInvertsTheSweepPath) {
  Project p = siliconProject(0.7);
  const LabFrame lab(p.sample.normal, p.sample.inPlaneX);
  SweepSpec angle;
  angle.kind = SweepKind::Angle;
  angle.from = 0;
  angle.to = 180;
  for (double x : {0.0, 37.0, 90.0, 179.0}) {
    FieldSetting f;
    f.form = FieldSetting::Form::VectorCrystal;
    f.vector = sweepField(p, angle, lab, x);
    const auto c = sweepCoordinate(angle, lab, f);
    ASSERT_TRUE(c.has_value());
    EXPECT_NEAR(*c, x, 1e-9);
  }
  SweepSpec magnitude;
  EXPECT_NEAR(*sweepCoordinate(magnitude, lab, p.field), 0.7, 1e-12);
  SweepSpec strain;
  strain.kind = SweepKind::Strain;
  EXPECT_FALSE(sweepCoordinate(strain, lab, p.field).has_value());
}

}  // namespace
}  // namespace finestra
