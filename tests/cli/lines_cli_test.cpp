// finestra-cli on the bundled example and on bad inputs.
#include <gtest/gtest.h>

#include <nlohmann/json.hpp>
#include <unistd.h>

#include "cli_support.h"
#include "core/io/project_file.h"
#include "core/project/model_setup.h"
#include "core/project/evaluate.h"

using namespace finestra;
using finestra::testing::runCli;
using finestra::testing::writeTemp;

namespace {
const std::string kExample = std::string(FINESTRA_SOURCE_DIR) + "/examples/membrane-vector-magnet.json";

std::string projectWith(const std::string& fieldJson, const std::string& extra = "") {
  return R"({"format": "finestra-project", "version": 1, "centre": {"preset": "SiV-"},
             "sample": {"normal": [0,0,1], "in_plane_x": [1,0,0]}, "field": )" +
         fieldJson + extra + "}";
}
}  // namespace

TEST(CliLines, JsonLayoutMatchesTheDocumentedSchemaAndTheEngine) {
  const auto r = runCli("lines " + kExample + " --format json");
  ASSERT_EQ(r.exitCode, 0) << r.err;
  const auto doc = nlohmann::json::parse(r.out);
  const Project project = readProjectFile(kExample);
  const CentreModel model(makeModelSetup(project));
  const auto solutions = solveProjectClasses(model, project);
  ASSERT_EQ(doc.at("classes").size(), 4u);
  for (std::size_t c = 0; c < 4; ++c) {
    const auto& cls = doc["classes"][c];
    EXPECT_EQ(cls.at("class").get<int>(), static_cast<int>(c));
    EXPECT_EQ(cls.at("axis_crystal").size(), 3u);
    EXPECT_EQ(cls.at("ground_GHz").size(), 4u);
    EXPECT_EQ(cls.at("excited_GHz").size(), 4u);
    ASSERT_EQ(cls.at("lines").size(), 16u);
    for (std::size_t k = 0; k < 16; ++k) {
      const auto& line = cls["lines"][k];
      for (const char* key : {"upper", "lower", "label", "frequency_GHz", "intensity", "intensity_crystal_xyz"})
        EXPECT_TRUE(line.contains(key)) << key;
      const OpticalLine& expected = solutions[c].lines[k];
      EXPECT_EQ(line["upper"].get<int>(), expected.upper);
      EXPECT_EQ(line["label"].get<std::string>(), expected.label());
      EXPECT_DOUBLE_EQ(line["frequency_GHz"].get<double>(), expected.frequencyGHz);
      // frequency is absolute: ν_ZPL + E_u(upper) − E_g(lower) from the arrays in the same record
      EXPECT_NEAR(line["frequency_GHz"].get<double>(),
                  model.zplGHz() + cls["excited_GHz"][line["upper"].get<int>()].get<double>() -
                      cls["ground_GHz"][line["lower"].get<int>()].get<double>(),
                  1e-9);
    }
  }
}

TEST(CliLines, TableAndCsvFormats) {
  const auto table = runCli("lines " + kExample);
  ASSERT_EQ(table.exitCode, 0) << table.err;
  EXPECT_NE(table.out.find("frequency (THz)"), std::string::npos);
  const auto csv = runCli("lines " + kExample + " --format csv");
  ASSERT_EQ(csv.exitCode, 0);
  EXPECT_EQ(std::count(csv.out.begin(), csv.out.end(), '\n'), 1 + 64);
}

TEST(CliOtherCommands, LevelsSpectrumSweepPresets) {
  EXPECT_EQ(runCli("levels " + kExample + " --format json").exitCode, 0);
  const auto spectrum = runCli("spectrum " + kExample + " --unit nm_air --points 50");
  ASSERT_EQ(spectrum.exitCode, 0) << spectrum.err;
  EXPECT_EQ(std::count(spectrum.out.begin(), spectrum.out.end(), '\n'), 51);
  const auto sweep = runCli("sweep " + kExample + " --format json");
  ASSERT_EQ(sweep.exitCode, 0) << sweep.err;
  EXPECT_EQ(nlohmann::json::parse(sweep.out)["x"].size(), 301u);
  const auto presets = runCli("presets");
  ASSERT_EQ(presets.exitCode, 0);
  for (const char* name : {"SiV-", "GeV-", "SnV-", "PbV-", "from memory", "assumed", "unknown"})
    EXPECT_NE(presets.out.find(name), std::string::npos) << name;
}

struct BadInput {
  std::string name, text, mustMention;
};

void PrintTo(const BadInput& b, std::ostream* os) { *os << b.name; }

class CliBadInput : public ::testing::TestWithParam<BadInput> {};

TEST_P(CliBadInput, NamesTheFaultAndExitsNonZero) {
  const BadInput& b = GetParam();
  const std::string path = writeTemp(b.name + ".json", b.text);
  const auto r = runCli("lines " + path);
  EXPECT_NE(r.exitCode, 0);
  EXPECT_LT(r.exitCode, 128) << "crashed";
  EXPECT_NE(r.err.find(b.mustMention), std::string::npos) << r.err;
  EXPECT_NE(r.err.find(path), std::string::npos) << "message must name the file: " << r.err;
  ::unlink(path.c_str());
}

INSTANTIATE_TEST_SUITE_P(
    Catalogue, CliBadInput,
    ::testing::Values(
        BadInput{"malformed", R"({"format": "finestra-project", "version": 1,, })", ":1:"},
        BadInput{"unknownkey", projectWith(R"({"magnitude_T": 0.1})", R"(, "colour": "red")"), "colour"},
        BadInput{"wrongtype", projectWith(R"({"magnitude_T": "strong"})"), "field.magnitude_T"},
        BadInput{"infinite", projectWith(R"({"magnitude_T": 1e999})"), "out of range"},
        BadInput{"negtemp", projectWith(R"({"magnitude_T": 0.1})", R"(, "conditions": {"temperature_K": -4})"),
                 "conditions.temperature_K"},
        BadInput{"skewaxes",
                 R"({"format": "finestra-project", "version": 1, "centre": {"preset": "SiV-"},
                     "sample": {"normal": [0,0,1], "in_plane_x": [1,0,1]}})",
                 "not perpendicular"},
        BadInput{"zeronormal",
                 R"({"format": "finestra-project", "version": 1, "centre": {"preset": "SiV-"},
                     "sample": {"normal": [0,0,0], "in_plane_x": [1,0,0]}})",
                 "sample.normal"},
        BadInput{"unknownpreset", R"({"format": "finestra-project", "version": 1, "centre": {"preset": "XeV-"}})",
                 "centre.preset"},
        BadInput{"isotopenohf",
                 R"({"format": "finestra-project", "version": 1, "centre": {"preset": "GeV-", "isotope": "73Ge"}})",
                 "A_par_g_MHz"},
        BadInput{"unknownparam",
                 R"({"format": "finestra-project", "version": 1, "centre": {"preset": "SiV-", "parameters": {"lamda_g_GHz": 4}}})",
                 "centre.parameters.lamda_g_GHz"},
        BadInput{"pbvlambda", R"({"format": "finestra-project", "version": 1, "centre": {"preset": "PbV-"}})",
                 "lambda_u_GHz"}),
    [](const ::testing::TestParamInfo<BadInput>& info) { return info.param.name; });

TEST(CliBadInputFiles, MissingFileAndMissingArguments) {
  const auto missing = runCli("lines /nonexistent/project.json");
  EXPECT_NE(missing.exitCode, 0);
  EXPECT_NE(missing.err.find("/nonexistent/project.json"), std::string::npos);
  EXPECT_NE(runCli("lines").exitCode, 0);
  EXPECT_NE(runCli("frobnicate x.json").exitCode, 0);
}
