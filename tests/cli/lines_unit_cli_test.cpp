// finestra-cli lines --unit: each line's position on the chosen spectral unit, checked against the
// SI defining constants (exact since the 2019 redefinition of the SI; BIPM, The International
// System of Units, 9th edition, 2019): c = 299 792 458 m/s, h = 6.626 070 15e-34 J s,
// e = 1.602 176 634e-19 C.
#include <gtest/gtest.h>

#include <nlohmann/json.hpp>
#include <sstream>

#include "cli_support.h"

using finestra::testing::runCli;

namespace {
const std::string kExample = std::string(FINESTRA_SOURCE_DIR) + "/examples/membrane-vector-magnet.json";

constexpr double kSpeedOfLight = 299792458.0;    // m/s, exact (SI 2019)
constexpr double kPlanck = 6.62607015e-34;        // J s, exact (SI 2019)
constexpr double kElementaryCharge = 1.602176634e-19;  // C, exact (SI 2019)

nlohmann::json linesIn(const std::string& unit) {
  const auto r = runCli("lines " + kExample + " --format json --unit " + unit);
  EXPECT_EQ(r.exitCode, 0) << r.err;
  return nlohmann::json::parse(r.out);
}

std::vector<std::string> splitCsvLine(const std::string& line) {
  std::vector<std::string> cells;
  std::stringstream in(line);
  for (std::string cell; std::getline(in, cell, ',');) cells.push_back(cell);
  return cells;
}
}  // namespace

TEST(CliLinesUnit, VacuumWavelengthIsSpeedOfLightOverFrequency) {
  const auto doc = linesIn("nm_vac");
  EXPECT_EQ(doc.at("unit").get<std::string>(), "nm_vac");
  std::size_t checked = 0;
  for (const auto& cls : doc.at("classes"))
    for (const auto& line : cls.at("lines")) {
      const double frequencyHz = line.at("frequency_GHz").get<double>() * 1e9;
      EXPECT_NEAR(line.at("position").get<double>(), kSpeedOfLight / frequencyHz * 1e9, 1e-9);
      ++checked;
    }
  EXPECT_EQ(checked, 64u);
}

TEST(CliLinesUnit, PhotonEnergyIsPlanckTimesFrequency) {
  const auto doc = linesIn("meV");
  for (const auto& cls : doc.at("classes"))
    for (const auto& line : cls.at("lines")) {
      const double expectedMeV = kPlanck * line.at("frequency_GHz").get<double>() * 1e9 / kElementaryCharge * 1e3;
      EXPECT_NEAR(line.at("position").get<double>(), expectedMeV, 1e-9 * expectedMeV);
    }
}

TEST(CliLinesUnit, DetuningTableColumnMatchesTheDetuningColumn) {
  const auto r = runCli("lines " + kExample + " --format csv --unit GHz_detuning");
  ASSERT_EQ(r.exitCode, 0) << r.err;
  std::stringstream in(r.out);
  std::string headerLine;
  std::getline(in, headerLine);
  const auto header = splitCsvLine(headerLine);
  ASSERT_GE(header.size(), 6u);
  EXPECT_NE(header[4].find("GHz"), std::string::npos) << headerLine;  // the added position column
  EXPECT_EQ(header[6], "detuning (GHz)");
  int rows = 0;
  for (std::string line; std::getline(in, line);) {
    const auto cells = splitCsvLine(line);
    ASSERT_EQ(cells.size(), header.size()) << line;
    EXPECT_EQ(cells[4], cells[6]) << line;  // both are ν − ν_ZPL with three decimals
    ++rows;
  }
  EXPECT_EQ(rows, 64);
}

TEST(CliLinesUnit, WithoutUnitTheLayoutIsUnchanged) {
  const auto r = runCli("lines " + kExample + " --format json");
  ASSERT_EQ(r.exitCode, 0) << r.err;
  const auto doc = nlohmann::json::parse(r.out);
  EXPECT_FALSE(doc.contains("unit"));
  EXPECT_FALSE(doc["classes"][0]["lines"][0].contains("position"));
}

TEST(CliLinesUnit, UnknownUnitIsNamedAndNothingIsPrinted) {
  const auto r = runCli("lines " + kExample + " --unit furlongs");
  EXPECT_EQ(r.exitCode, 2) << r.err;
  EXPECT_NE(r.err.find("--unit"), std::string::npos) << r.err;
  EXPECT_TRUE(r.out.empty()) << r.out;
}
