// finestra-cli peaks and strain (from typed lines and from a CSV of many emitters) on the invented
// examples (examples/make-invented-peaks-examples.py states their truth) and on bad input.
#include <gtest/gtest.h>

#include <cmath>
#include <nlohmann/json.hpp>
#include <random>
#include <sstream>

#include "cli_support.h"

namespace finestra {
namespace {

using finestra::testing::runCli;
using finestra::testing::writeTemp;

const std::string kSpectrum = std::string(FINESTRA_SOURCE_DIR) + "/examples/invented-spectrum.csv";
const std::string kEmitters = std::string(FINESTRA_SOURCE_DIR) + "/examples/invented-emitters.csv";

// The example holds Lorentzians at −120, −48, −41 and 75 GHz (FWHM 6, 5, 5, 8), noise σ = 2.
TEST(PeaksCli, JsonHasExactlyTheDocumentedKeysAndFindsTheInventedLines) {
  const auto run = runCli("peaks " + kSpectrum + " --format json");
  ASSERT_EQ(run.exitCode, 0) << run.err;
  const auto doc = nlohmann::ordered_json::parse(run.out);
  std::vector<std::string> keys;
  for (const auto& [k, v] : doc.items()) keys.push_back(k);
  EXPECT_EQ(keys, (std::vector<std::string>{"peaks", "unit", "noise"}));
  EXPECT_EQ(doc["unit"], "GHz_detuning");
  EXPECT_NEAR(doc["noise"].get<double>(), 2.0, 0.2);
  ASSERT_EQ(doc["peaks"].size(), 4u) << run.out;
  const double truth[4] = {-120, -48, -41, 75}, fwhm[4] = {6, 5, 5, 8};
  for (std::size_t k = 0; k < 4; ++k) {
    const auto& p = doc["peaks"][k];
    std::vector<std::string> peakKeys;
    for (const auto& [key, v] : p.items()) peakKeys.push_back(key);
    EXPECT_EQ(peakKeys, (std::vector<std::string>{"position", "sigma", "fwhm", "fwhm_sigma", "area", "area_sigma"}));
    EXPECT_LT(std::abs(p["position"].get<double>() - truth[k]), 3.5 * p["sigma"].get<double>()) << k;
    EXPECT_LT(std::abs(p["fwhm"].get<double>() - fwhm[k]), 3.5 * p["fwhm_sigma"].get<double>()) << k;
  }
}

TEST(PeaksCli, TableNumbersPeaksFromZeroAndSaysWhichErrors) {
  const auto run = runCli("peaks " + kSpectrum);
  ASSERT_EQ(run.exitCode, 0) << run.err;
  EXPECT_NE(run.out.find("4 peaks (lorentzian)"), std::string::npos) << run.out;
  EXPECT_NE(run.out.find("chi2/dof"), std::string::npos);
  const auto csv = runCli("peaks " + kSpectrum + " --format csv");
  ASSERT_EQ(csv.exitCode, 0) << csv.err;
  EXPECT_EQ(csv.out.rfind("peak,position,sigma,fwhm,fwhm_sigma,area,area_sigma,snr\n0,", 0), 0u) << csv.out;
}

TEST(PeaksCli, BadInputNamesTheOptionOrFile) {
  auto run = runCli("peaks " + kSpectrum + " --min-snr 0.1");
  EXPECT_EQ(run.exitCode, 2);
  EXPECT_NE(run.err.find("--min-snr"), std::string::npos) << run.err;
  run = runCli("peaks " + kSpectrum + " --shape sech");
  EXPECT_EQ(run.exitCode, 2);
  EXPECT_NE(run.err.find("--shape"), std::string::npos) << run.err;
  const std::string bad = writeTemp("peaks_bad.csv", "THz,signal\n406.7,1\n406.8,x\n");
  run = runCli("peaks " + bad);
  EXPECT_EQ(run.exitCode, 2);
  EXPECT_NE(run.err.find("peaks_bad.csv:3"), std::string::npos) << run.err;
}

// A one-sample spike on a flat noiseless signal: no peak, and the table says why the candidates
// were dropped, listing at most five of them.
TEST(PeaksCli, TableSaysWhyCandidatesWereDropped) {
  std::string text = "GHz_detuning,signal\n";
  for (int i = 0; i < 50; ++i) text += std::to_string(i) + "," + (i == 25 ? "5" : "0") + "\n";
  const auto run = runCli("peaks " + writeTemp("peaks_spike.csv", text));
  ASSERT_EQ(run.exitCode, 0) << run.err;
  EXPECT_NE(run.out.find("0 peaks"), std::string::npos) << run.out;
  EXPECT_NE(run.out.find("candidate near 25"), std::string::npos) << run.out;
  std::size_t listed = 0;
  for (std::size_t at = run.out.find("dropped: "); at != std::string::npos; at = run.out.find("dropped: ", at + 1)) ++listed;
  EXPECT_GE(listed, 1u);
  EXPECT_LE(listed, 5u) << run.out;
}

TEST(StrainMapCli, CsvHasValueAndSigmaColumnsAndOneRowPerEmitter) {
  const auto run = runCli("strain --centre SiV- --peaks " + kEmitters + " --format csv");
  ASSERT_EQ(run.exitCode, 0) << run.err;
  std::istringstream in(run.out);
  std::string header, row;
  std::getline(in, header);
  EXPECT_NE(header.find("eg_g_GHz,eg_g_sigma_GHz"), std::string::npos) << header;
  EXPECT_NE(header.find("strain_d,strain_d_sigma"), std::string::npos) << header;
  int rows = 0;
  while (std::getline(in, row)) rows += !row.empty();
  EXPECT_EQ(rows, 12);
}

// e11 of the example has A and B swapped: its readings must disagree; e10 follows f-type coupling.
TEST(StrainMapCli, JsonSummaryAndVerdicts) {
  const auto run = runCli("strain --centre SiV- --peaks " + kEmitters + " --format json");
  ASSERT_EQ(run.exitCode, 0) << run.err;
  const auto doc = nlohmann::json::parse(run.out);
  EXPECT_EQ(doc["counts"]["emitters"], 12);
  EXPECT_GE(doc["counts"]["readings_disagree"].get<int>(), 1);
  EXPECT_NE(doc["emitters"][11]["readings"].get<std::string>().find("DISAGREE"), std::string::npos);
  EXPECT_NE(doc["emitters"][0]["readings"].get<std::string>().find("agree within"), std::string::npos);
  EXPECT_EQ(doc["summary"][0]["figure"], "|eps_Eg,g|");
  EXPECT_GT(doc["summary"][0]["median"].get<double>(), 10.0);
  EXPECT_NE(doc["units"].get<std::string>().find("defect frame"), std::string::npos);
  EXPECT_NE(doc["cannot_determine"].get<std::string>().find("orientation"), std::string::npos);
}

TEST(StrainMapCli, TypedLinesGiveTheSameNumbersAsTheCsvRow) {
  // Row e0 of the example typed in by hand.
  const auto typed = runCli("strain --centre SiV- --lines 164.761,103.220,-99.570,-161.007 --sigma 0.05 --unit GHz_detuning --format json");
  ASSERT_EQ(typed.exitCode, 0) << typed.err;
  const auto map = runCli("strain --centre SiV- --peaks " + kEmitters + " --format json");
  const auto a = nlohmann::json::parse(typed.out)["emitters"][0], b = nlohmann::json::parse(map.out)["emitters"][0];
  EXPECT_DOUBLE_EQ(a["eg_strain_g_GHz"]["value"].get<double>(), b["eg_strain_g_GHz"]["value"].get<double>());
  EXPECT_DOUBLE_EQ(a["strain_pure_d"]["sigma"].get<double>(), b["strain_pure_d"]["sigma"].get<double>());
  const auto missing = runCli("strain --centre SiV- --lines 1,2,3,4");
  EXPECT_EQ(missing.exitCode, 2);
  EXPECT_NE(missing.err.find("--sigma"), std::string::npos) << missing.err;
}

// fit-spectrum: an invented truth (the demo project, lines broadened to 3 GHz) simulated by the
// `spectrum` command, scaled, on a baseline, with seeded noise; the fit starts 2 GHz off in both
// E-strain energies and must come back within 3σ with its own σ.
TEST(SpectrumFitCli, RecoversTheInventedEStrainFromARawSpectrum) {
  auto project = nlohmann::json::parse(finestra::testing::slurp(std::string(FINESTRA_SOURCE_DIR) + "/examples/fit-demo.json"));
  project["conditions"]["broadening_GHz"] = 3.0;
  const std::string truthProject = writeTemp("truth_project.json", project.dump());
  const auto simulated = runCli("spectrum " + truthProject + " --unit GHz_detuning --kind PL --from -300 --to 300 --points 1500");
  ASSERT_EQ(simulated.exitCode, 0) << simulated.err;
  std::istringstream in(simulated.out);
  std::string line;
  std::getline(in, line);
  std::vector<std::pair<double, double>> rows;
  double top = 0;
  while (std::getline(in, line)) {
    const auto comma = line.find(',');
    rows.emplace_back(std::stod(line.substr(0, comma)), std::stod(line.substr(comma + 1)));
    top = std::max(top, rows.back().second);
  }
  std::mt19937 rng(5);
  std::normal_distribution<double> noise(0.0, 1.0);
  std::ostringstream csv;
  csv.precision(10);
  csv << "GHz_detuning,counts\n";
  for (const auto& [x, y] : rows) csv << x << ',' << 5.0 + 100.0 * y / top + noise(rng) << '\n';
  const std::string spectrum = writeTemp("raw_spectrum.csv", csv.str());
  project["strain"]["eg_ground"]["magnitude_GHz"] = 11.0;
  project["strain"]["eg_excited"]["magnitude_GHz"] = 25.0;
  const std::string start = writeTemp("start_project.json", project.dump());
  const auto run = runCli("fit-spectrum " + start + " --spectrum 'zero field=" + spectrum +
                          "' --free eg_strain_g_GHz,eg_strain_u_GHz,zpl_offset_GHz --format json");
  ASSERT_EQ(run.exitCode, 0) << run.err;
  const auto doc = nlohmann::json::parse(run.out);
  EXPECT_TRUE(doc["converged"].get<bool>());
  EXPECT_LT(doc["chi2_per_dof"].get<double>(), 1.2);
  const std::map<std::string, double> truth{{"eg_strain_g_GHz", 13.0}, {"eg_strain_u_GHz", 23.0}, {"zpl_offset_GHz", 0.0}};
  for (const auto& p : doc["parameters"]) {
    const auto it = truth.find(p["name"].get<std::string>());
    if (it == truth.end()) continue;
    EXPECT_LT(std::abs(p["value"].get<double>() - it->second), 3 * p["stderr"].get<double>()) << it->first;
    EXPECT_TRUE(p.contains("stderr_formal") && p.contains("stderr_scaled"));
  }
  const auto bad = runCli("fit-spectrum " + start + " --spectrum 'no such set=" + spectrum + "'");
  EXPECT_EQ(bad.exitCode, 2);
  EXPECT_NE(bad.err.find("no such set"), std::string::npos) << bad.err;
}

}  // namespace
}  // namespace finestra
