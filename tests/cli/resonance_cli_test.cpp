// finestra-cli microwave and lambda-systems: exact JSON layouts, agreement with `levels`, the ²⁹Si
// ESR doublet through the command line, and bad options.
#include <gtest/gtest.h>

#include <nlohmann/json.hpp>
#include <set>

#include "cli_support.h"

using finestra::testing::runCli;
using finestra::testing::writeTemp;

namespace {

// Invented scenario: SiV⁻ with ²⁹Si, 10 GHz ground E-strain, 0.5 T along class 0's axis [111]
// (lab = crystal frame: polar 54.7356°, azimuth 45°). The excited-state hyperfine constants are not
// known; zero is set so that the model is complete.
std::string sivProject(double polarDeg, const std::string& isotope = R"("29Si")") {
  return R"({"format": "finestra-project", "version": 1,
    "centre": {"preset": "SiV-", "isotope": )" + isotope + R"(, "parameters": {"A_par_u_MHz": 0, "A_perp_u_MHz": 0}},
    "sample": {"normal": [0,0,1], "in_plane_x": [1,0,0]},
    "field": {"magnitude_T": 0.5, "polar_deg": )" + std::to_string(polarDeg) + R"(, "azimuth_deg": 45},
    "strain": {"eg_ground": {"magnitude_GHz": 10, "angle_deg": 0}},
    "classes": [0, 1]})";
}
constexpr double kAxisPolarDeg = 54.735610317245346;

std::set<std::string> keys(const nlohmann::json& object) {
  std::set<std::string> out;
  for (auto it = object.begin(); it != object.end(); ++it) out.insert(it.key());
  return out;
}

}  // namespace

TEST(CliResonance, MicrowaveJsonLayoutAndHyperfineDoublet) {
  const std::string project = writeTemp("mw_axis.json", sivProject(kAxisPolarDeg));
  // Drive perpendicular to [111] (lab = crystal): [1,-1,0].
  const auto r = runCli("microwave " + project + " --drive-lab 1,-1,0 --format json");
  ASSERT_EQ(r.exitCode, 0) << r.err;
  const auto doc = nlohmann::json::parse(r.out);
  EXPECT_EQ(keys(doc), (std::set<std::string>{"classes"}));
  ASSERT_EQ(doc["classes"].size(), 2u);
  const auto levels = nlohmann::json::parse(runCli("levels " + project + " --format json").out);
  const auto& cls0 = doc["classes"][0];
  EXPECT_EQ(keys(cls0), (std::set<std::string>{"class", "transitions"}));
  ASSERT_EQ(cls0["transitions"].size(), 28u);
  std::vector<double> esr;
  for (const auto& t : cls0["transitions"]) {
    EXPECT_EQ(keys(t), (std::set<std::string>{"lower", "upper", "frequency_GHz", "strength", "nuclear_change", "nuclear_purity"}));
    const auto& ground = levels["classes"][0]["ground_GHz"];
    EXPECT_NEAR(t["frequency_GHz"].get<double>(),
                ground[t["upper"].get<int>()].get<double>() - ground[t["lower"].get<int>()].get<double>(), 1e-12);
    // Lower-branch ESR: levels 0..3, nuclear-preserving, strongly driven by the transverse field.
    if (t["upper"].get<int>() < 4 && t["nuclear_change"] == "preserving" && t["strength"].get<double>() > 1e-3)
      esr.push_back(t["frequency_GHz"].get<double>());
  }
  // Doublet split by A∥ = 70 MHz (Pingault et al., Nat. Commun. 8, 15579 (2017)) to first order.
  ASSERT_EQ(esr.size(), 2u);
  EXPECT_NEAR(std::abs(esr[1] - esr[0]), 0.070, 1e-3);

  const auto details = nlohmann::json::parse(runCli("microwave " + project + " --details --format json").out);
  for (const char* key : {"spin_part", "orbital_part", "nuclear_part", "spin_Sz", "nuclear_mI", "population"})
    EXPECT_TRUE(details["classes"][0]["transitions"][0].contains(key)) << key;
}

TEST(CliResonance, MicrowaveWithoutNucleusTableCsvAndSpectrum) {
  const std::string project = writeTemp("mw_plain.json", sivProject(30, "null"));
  const auto json = runCli("microwave " + project + " --format json");
  ASSERT_EQ(json.exitCode, 0) << json.err;
  const auto doc = nlohmann::json::parse(json.out);
  ASSERT_EQ(doc["classes"][0]["transitions"].size(), 6u);
  for (const auto& t : doc["classes"][0]["transitions"]) {
    EXPECT_EQ(t["nuclear_change"], "no nucleus");
    EXPECT_TRUE(t["nuclear_purity"].is_null());
    EXPECT_TRUE(t.contains("undefined_reason"));
  }
  const auto table = runCli("microwave " + project);
  ASSERT_EQ(table.exitCode, 0);
  EXPECT_NE(table.out.find("nuclear change"), std::string::npos);
  const auto csv = runCli("microwave " + project + " --format csv");
  EXPECT_EQ(std::count(csv.out.begin(), csv.out.end(), '\n'), 1 + 12);
  const auto spectrum = runCli("microwave " + project + " --spectrum --points 300 --linewidth-MHz 5");
  ASSERT_EQ(spectrum.exitCode, 0) << spectrum.err;
  EXPECT_EQ(std::count(spectrum.out.begin(), spectrum.out.end(), '\n'), 301);
  const auto excited = runCli("microwave " + project + " --manifold excited --format json");
  ASSERT_EQ(excited.exitCode, 0) << excited.err;
}

TEST(CliResonance, LambdaSystemsJsonLayoutAndCptDips) {
  const std::string project = writeTemp("lambda.json", sivProject(80, "null"));
  const auto r = runCli("lambda-systems " + project + " --format json");
  ASSERT_EQ(r.exitCode, 0) << r.err;
  const auto doc = nlohmann::json::parse(r.out);
  EXPECT_EQ(keys(doc), (std::set<std::string>{"classes"}));
  const auto levels = nlohmann::json::parse(runCli("levels " + project + " --format json").out);
  const auto& systems = doc["classes"][0]["systems"];
  ASSERT_FALSE(systems.empty());
  for (const auto& s : systems) {
    EXPECT_EQ(keys(s), (std::set<std::string>{"excited", "ground", "line_GHz", "two_photon_GHz", "strength"}));
    const auto& ground = levels["classes"][0]["ground_GHz"];
    EXPECT_EQ(s["two_photon_GHz"].get<double>(),
              ground[s["ground"][1].get<int>()].get<double>() - ground[s["ground"][0].get<int>()].get<double>());
  }
  const int e = systems[0]["excited"].get<int>(), g = systems[0]["ground"][0].get<int>();
  const auto pumped = runCli("lambda-systems " + project + " --format json --pump-line " + std::to_string(e) + "," + std::to_string(g));
  ASSERT_EQ(pumped.exitCode, 0) << pumped.err;
  const auto dips = nlohmann::json::parse(pumped.out)["cpt_dips"];
  EXPECT_FALSE(dips["dips"].empty());
  EXPECT_EQ(runCli("lambda-systems " + project + " --rank-by balance").exitCode, 0);
}

TEST(CliResonance, BadOptionsNameTheOption) {
  const std::string project = writeTemp("bad_mw.json", sivProject(30, "null"));
  const auto zero = runCli("microwave " + project + " --drive-lab 0,0,0");
  EXPECT_EQ(zero.exitCode, 2);
  EXPECT_NE(zero.err.find("--drive-lab"), std::string::npos);
  const auto manifold = runCli("microwave " + project + " --manifold middle");
  EXPECT_EQ(manifold.exitCode, 2);
  EXPECT_NE(manifold.err.find("--manifold"), std::string::npos);
  const auto width = runCli("microwave " + project + " --spectrum --linewidth-MHz=-1");
  EXPECT_EQ(width.exitCode, 2);
  EXPECT_NE(width.err.find("--linewidth-MHz"), std::string::npos);
  const auto rank = runCli("lambda-systems " + project + " --rank-by colour");
  EXPECT_EQ(rank.exitCode, 2);
  EXPECT_NE(rank.err.find("--rank-by"), std::string::npos);
  const auto pump = runCli("lambda-systems " + project + " --pump-line 9,0");
  EXPECT_EQ(pump.exitCode, 2);
  EXPECT_NE(pump.err.find("--pump"), std::string::npos);
  const auto pumpClass = runCli("lambda-systems " + project + " --pump-line 0,0 --pump-class 3");
  EXPECT_EQ(pumpClass.exitCode, 2);
  EXPECT_NE(pumpClass.err.find("--pump-class"), std::string::npos);
}
