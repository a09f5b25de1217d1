// finestra-cli plan on a project with a magnet calibration: the reach is a set of magnet settings,
// so the plan equals the plan of the same project without calibration whose reach and magnitudes
// are the true fields (the calibration is a scale times a rotation, docs/architecture.md, Magnet tilt).
#include <gtest/gtest.h>

#include <cstdio>
#include <nlohmann/json.hpp>
#include <unistd.h>

#include "cli_support.h"
#include "core/project/field_semantics.h"

using namespace finestra;
using finestra::testing::runCli;
using finestra::testing::writeTemp;

namespace {

// Invented calibration (not a measured one).
const MagnetCalibration kMagnet{0.97, 4.0, 35.0};

std::string projectFile(const std::string& name, bool calibrated) {
  std::string text = R"({"format": "finestra-project", "version": 1, "description": "test configuration, invented",
    "centre": {"preset": "SiV-"}, "sample": {"normal": [0,0,1], "in_plane_x": [1,1,0]},
    "field": {"vector_lab_T": [0, 0, 0.35]},
    "strain": {"crystal": {"xx": 0, "yy": 0, "zz": 0, "yz": 2e-6, "zx": 2e-6, "xy": -3e-6}})";
  if (calibrated) text += R"(, "magnet": {"field_scale": 0.97, "tilt_deg": 4.0, "tilt_azimuth_deg": 35.0})";
  return writeTemp(name, text + "}");
}

std::string vectorText(const Vec3& v) {
  char buffer[128];
  std::snprintf(buffer, sizeof buffer, "%.17g,%.17g,%.17g", v[0], v[1], v[2]);
  return buffer;
}

std::string numberText(double x) {
  char buffer[64];
  std::snprintf(buffer, sizeof buffer, "%.17g", x);
  return buffer;
}

nlohmann::json plan(const std::string& project, const Vec3& normal, const Vec3& start, double magnitudeT) {
  const auto r = runCli("plan " + project + " --format json --class 1 --reach plane --step-deg 5 --plane-normal-lab " +
                        vectorText(normal) + " --plane-start-lab " + vectorText(start) + " --magnitudes-T " +
                        numberText(magnitudeT) + " --require qubit_GHz=4:14 --require cyclicity=20: --objective qubit_GHz --best 6");
  EXPECT_EQ(r.exitCode, 0) << r.err;
  return nlohmann::json::parse(r.out);
}

TEST(CliPlanCalibration, CalibratedProjectPlansAsTheUncalibratedProjectAtTheTrueField) {
  const Vec3 normal(1, 0, 0), start(0, 0, 1);
  const double magnitude = 0.35;
  const auto rotate = [](const Vec3& v) -> Vec3 { return trueFieldLab(kMagnet, v) / kMagnet.fieldScale; };
  const std::string calibrated = projectFile("calibrated.json", true), nominal = projectFile("nominal.json", false);
  const auto a = plan(calibrated, normal, start, magnitude);
  const auto b = plan(nominal, rotate(normal), rotate(start), magnitude * kMagnet.fieldScale);
  std::remove(calibrated.c_str());
  std::remove(nominal.c_str());

  ASSERT_EQ(a.at("regions").size(), 1u);
  EXPECT_EQ(a["regions"][0].at("feasible"), b["regions"][0].at("feasible"));
  EXPECT_NEAR(a["regions"][0]["fraction"].get<double>(), b["regions"][0]["fraction"].get<double>(), 1e-12);
  EXPECT_GT(a["regions"][0]["feasible"].get<int>(), 0);
  ASSERT_EQ(a.at("best").size(), b.at("best").size());
  ASSERT_FALSE(a["best"].empty());
  for (std::size_t r = 0; r < a["best"].size(); ++r) {
    const auto& x = a["best"][r];
    EXPECT_NEAR(x["objective"].get<double>(), b["best"][r]["objective"].get<double>(), 1e-9) << "rank " << r;
    // Mirror-symmetric settings tie on the objective; compare each with its twin at the same magnet angle.
    const nlohmann::json* twin = nullptr;
    for (const auto& y : b["best"])
      if (y["magnet_angle_deg"] == x["magnet_angle_deg"]) twin = &y;
    ASSERT_NE(twin, nullptr) << "rank " << r;
    EXPECT_NEAR(x["magnitude_T"].get<double>() * kMagnet.fieldScale, (*twin)["magnitude_T"].get<double>(), 1e-15);
    for (const char* key : {"field_lab_T", "field_crystal_T"})
      for (int c = 0; c < 3; ++c)
        EXPECT_NEAR(x[key][c].get<double>(), (*twin)[key][c].get<double>(), 1e-12) << key << " rank " << r;
  }
}

}  // namespace
