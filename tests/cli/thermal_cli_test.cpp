// finestra-cli thermal: the JSON layout of issue 12 and clear errors.
#include <gtest/gtest.h>

#include <cmath>
#include <nlohmann/json.hpp>
#include <numbers>

#include "cli_support.h"

using namespace finestra::testing;

namespace {
const char* kProject = R"({"format": "finestra-project", "version": 1,
  "centre": {"preset": "SiV-"}, "field": {"magnitude_T": 0.0, "polar_deg": 0, "azimuth_deg": 0},
  "conditions": {"temperature_K": 4.0}, "classes": [0, 2]})";
}

TEST(ThermalCli, JsonHasTheIssueLayout) {
  const std::string path = writeTemp("thermal.json", kProject);
  const CliRun r = runCli("thermal " + path + " --temperatures-K 0,0.1,1,4,10 --format json");
  ASSERT_EQ(r.exitCode, 0) << r.err;
  const auto j = nlohmann::json::parse(r.out);
  ASSERT_EQ(j.at("classes").size(), 2u);
  const auto& rows = j["classes"][0].at("rows");
  ASSERT_EQ(rows.size(), 5u);
  for (const auto& row : rows) {
    for (const char* key : {"temperature_K", "ground", "excited", "spin_coherence_limit_s", "lines"})
      EXPECT_TRUE(row.contains(key)) << key;
    for (const char* m : {"ground", "excited"})
      for (const char* key : {"splitting_GHz", "up_per_s", "down_per_s"}) EXPECT_TRUE(row[m].contains(key)) << key;
    for (const auto& line : row["lines"])
      for (const char* key : {"upper", "lower", "label", "fwhm_GHz"}) EXPECT_TRUE(line.contains(key)) << key;
  }
  // T = 0: no upward process, the limit is undefined and says why.
  EXPECT_TRUE(rows[0]["spin_coherence_limit_s"].is_null());
  EXPECT_TRUE(rows[0].contains("undefined_reason"));
  // Detailed balance at 4 K (CODATA h, k exact): up/down = exp(−hΔ/kT).
  const auto& g = rows[3]["ground"];
  const double ratio = g["up_per_s"].get<double>() / g["down_per_s"].get<double>();
  EXPECT_NEAR(ratio, std::exp(-6.62607015e-34 * g["splitting_GHz"].get<double>() * 1e9 / (1.380649e-23 * 4.0)), 1e-12);
  // T = 0 C line: lifetime limit 1/(2π · 1.7 ns) = 94 MHz (docs/physics.md check values).
  for (const auto& line : rows[0]["lines"]) {
    if (line["label"].get<std::string>()[0] == 'C') {
      EXPECT_NEAR(line["fwhm_GHz"].get<double>(), 1.0 / (2 * std::numbers::pi * 1.7), 1e-9);
    }
  }
  std::filesystem::remove(path);
}

TEST(ThermalCli, BathT2StarGovernsWhenShorter) {
  std::string text = kProject;
  text.replace(text.find("\"temperature_K\": 4.0"), 20, "\"temperature_K\": 4.0, \"bath_t2star_s\": 1e-9");
  const std::string path = writeTemp("thermal_bath.json", text);
  const CliRun r = runCli("thermal " + path + " --temperatures-K 4 --format json");
  ASSERT_EQ(r.exitCode, 0) << r.err;
  const auto row = nlohmann::json::parse(r.out)["classes"][0]["rows"][0];
  EXPECT_DOUBLE_EQ(row.at("spin_coherence_s").get<double>(), 1e-9);
  std::filesystem::remove(path);
}

TEST(ThermalCli, BadTemperaturesAreNamed) {
  const std::string path = writeTemp("thermal_bad.json", kProject);
  const CliRun r = runCli("thermal " + path + " --temperatures-K 4,-1");
  EXPECT_NE(r.exitCode, 0);
  EXPECT_NE(r.err.find("--temperatures-K"), std::string::npos) << r.err;
  EXPECT_NE(r.err.find("1000 K"), std::string::npos) << r.err;
  std::filesystem::remove(path);
}

TEST(ThermalCli, TableMarksUndefinedWithADash) {
  const std::string path = writeTemp("thermal_table.json", kProject);
  const CliRun r = runCli("thermal " + path + " --temperatures-K 0,4");
  ASSERT_EQ(r.exitCode, 0) << r.err;
  EXPECT_NE(r.out.find("—"), std::string::npos) << r.out;
  EXPECT_EQ(r.out.find("nan"), std::string::npos) << r.out;
  std::filesystem::remove(path);
}
