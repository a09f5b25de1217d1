// finestra-cli fit and strain on the invented demo project and on bad input.
#include <gtest/gtest.h>

#include <nlohmann/json.hpp>

#include "cli_support.h"

namespace finestra {
namespace {

using finestra::testing::runCli;
using finestra::testing::writeTemp;

const std::string kDemo = std::string(FINESTRA_SOURCE_DIR) + "/examples/fit-demo.json";

TEST(FitCli, DemoFitRecoversTheInventedTruth) {
  const auto run = runCli("fit " + kDemo + " --format json");
  ASSERT_EQ(run.exitCode, 0) << run.err;
  const auto doc = nlohmann::json::parse(run.out);
  EXPECT_TRUE(doc["converged"].get<bool>());
  EXPECT_LT(doc["chi2_per_dof"].get<double>(), 2.0);
  EXPECT_TRUE(doc["unidentifiable"].empty());
  // The invented truth written into the demo's description.
  const std::map<std::string, double> truth{{"eg_strain_g_GHz", 14.0}, {"eg_strain_u_GHz", 22.0}, {"field_scale", 0.985},
                                            {"magnet_tilt_deg", 1.8}, {"magnet_tilt_azimuth_deg", 65.0}, {"zpl_offset_GHz", 1.2}};
  for (const auto& p : doc["parameters"]) {
    ASSERT_TRUE(p.contains("name") && p.contains("value") && p.contains("stderr") && p.contains("free"));
    const auto it = truth.find(p["name"].get<std::string>());
    if (it == truth.end()) continue;
    EXPECT_LT(std::abs(p["value"].get<double>() - it->second), 3.5 * p["stderr"].get<double>()) << it->first;
  }
  int outliers = 0;
  for (const auto& a : doc["assignments"]) {
    ASSERT_TRUE(a.contains("measurement") && a.contains("peak") && a.contains("class") && a.contains("upper") &&
                a.contains("lower") && a.contains("residual_GHz"));
    if (a["class"].is_null()) ++outliers;
  }
  EXPECT_EQ(outliers, 1) << "the demo holds one spurious peak";
}

TEST(FitCli, StrainReadsTheZeroFieldSet) {
  const auto run = runCli("strain " + kDemo + " --format json");
  ASSERT_EQ(run.exitCode, 0) << run.err;
  const auto doc = nlohmann::json::parse(run.out);
  EXPECT_EQ(doc["measurement"], "zero field");
  EXPECT_NEAR(doc["eg_strain_g_GHz"]["value"].get<double>(), 14.0, 3 * doc["eg_strain_g_GHz"]["stderr"].get<double>());
  EXPECT_NEAR(doc["eg_strain_u_GHz"]["value"].get<double>(), 22.0, 3 * doc["eg_strain_u_GHz"]["stderr"].get<double>());
  EXPECT_TRUE(doc.contains("mismatch_GHz") && doc.contains("pure_d") && doc.contains("pure_f"));
}

TEST(FitCli, BadInputNamesTheKey) {
  auto run = runCli("fit " + kDemo + " --free lambda_x_GHz");
  EXPECT_EQ(run.exitCode, 2);
  EXPECT_NE(run.err.find("lambda_x_GHz"), std::string::npos) << run.err;
  const std::string noZero = writeTemp("nozero.json", R"({"format":"finestra-project","version":1,
    "centre":{"preset":"SiV-"},"measurements":[{"name":"m","field":{"magnitude_T":0.5,"polar_deg":0,"azimuth_deg":0},
    "peaks":[{"position":406.7,"unit":"THz","sigma":0.001}]}]})");
  run = runCli("strain " + noZero);
  EXPECT_EQ(run.exitCode, 2);
  EXPECT_NE(run.err.find("zero field"), std::string::npos) << run.err;
  EXPECT_NE(run.err.find(noZero), std::string::npos) << run.err;
}

}  // namespace
}  // namespace finestra
