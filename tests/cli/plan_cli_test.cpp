// finestra-cli plan on configurations written here (outside the project's examples): the physical
// facts of issue 5 through the command line, the request file, and clear errors.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <nlohmann/json.hpp>
#include <string>
#include <sys/wait.h>
#include <unistd.h>

namespace {

struct PlanRun {
  int code = -1;
  std::string out, err;
};

std::string readAll(const std::filesystem::path& p) {
  std::ifstream in(p);
  return {std::istreambuf_iterator<char>(in), std::istreambuf_iterator<char>()};
}

std::filesystem::path scratch(const std::string& name) {
  return std::filesystem::temp_directory_path() / ("finestra_plan_" + std::to_string(::getpid()) + "_" + name);
}

PlanRun plan(const std::string& args) {
  static int counter = 0;
  const auto out = scratch("out" + std::to_string(counter)), err = scratch("err" + std::to_string(counter++));
  const std::string cmd = std::string(FINESTRA_CLI_PATH) + " plan " + args + " >" + out.string() + " 2>" + err.string();
  const int status = std::system(cmd.c_str());
  PlanRun r{WIFEXITED(status) ? WEXITSTATUS(status) : -1, readAll(out), readAll(err)};
  std::filesystem::remove(out);
  std::filesystem::remove(err);
  return r;
}

// An invented configuration: SiV- in a (001) sample with lab axes along the cubic axes.
std::string projectWithField(const std::string& name, const std::string& vectorCrystal, const std::string& strain = "0") {
  const auto path = scratch(name + ".json");
  std::ofstream(path) << R"({ "format": "finestra-project", "version": 1,
    "description": "test configuration, invented",
    "centre": { "preset": "SiV-", "isotope": null, "parameters": {} },
    "sample": { "normal": [0,0,1], "in_plane_x": [1,0,0] },
    "field": { "vector_crystal_T": )" << vectorCrystal << R"( },
    "strain": { "crystal": { "xx": 0, "yy": 0, "zz": 0, "yz": )" << strain << R"(, "zx": 0, "xy": 0 } },
    "classes": [0,1,2,3] })";
  return path.string();
}

nlohmann::json parse(const PlanRun& r) {
  EXPECT_EQ(r.code, 0) << r.err;
  return nlohmann::json::parse(r.out);
}

}  // namespace

TEST(PlanCli, AlongZeroZeroOneAllFourClassesAreEquivalent) {
  const auto j = parse(plan(projectWithField("z", "[0,0,0.5]") + " --what point --drive-lab 1,0,0 --format json"));
  const auto& c = j["classes"];
  ASSERT_EQ(c.size(), 4u);
  for (int k = 1; k < 4; ++k) {
    EXPECT_NEAR(c[k]["qubit_GHz"].get<double>(), c[0]["qubit_GHz"].get<double>(), 1e-9);
    EXPECT_NEAR(c[k]["drive_fraction"].get<double>(), c[0]["drive_fraction"].get<double>(), 1e-9);
    EXPECT_NEAR(c[k]["cyclicity"].get<double>() / c[0]["cyclicity"].get<double>(), 1.0, 1e-6);
    const double angle = c[k]["axis_angle_deg"].get<double>();  // the axis is non-polar: θ ≡ 180° − θ
    EXPECT_NEAR(std::min(angle, 180 - angle), 54.7356103, 1e-6);
  }
}

TEST(PlanCli, AlongOneOneOneClassZeroStandsApart) {
  const auto j = parse(plan(projectWithField("d", "[0.3,0.3,0.3]") + " --what point --drive-lab 1,1,1 --format json"));
  const auto& c = j["classes"];
  EXPECT_NEAR(c[0]["axis_angle_deg"].get<double>(), 0.0, 1e-6);
  EXPECT_TRUE(c[0]["cyclicity_capped"].get<bool>());
  for (int k = 1; k < 4; ++k) {
    EXPECT_NEAR(c[k]["axis_angle_deg"].get<double>(), 109.4712206, 1e-6);
    EXPECT_NEAR(c[k]["qubit_GHz"].get<double>(), c[1]["qubit_GHz"].get<double>(), 1e-9);
    EXPECT_FALSE(c[k]["cyclicity_capped"].get<bool>());
  }
  EXPECT_GT(std::abs(c[0]["qubit_GHz"].get<double>() - c[1]["qubit_GHz"].get<double>()), 1.0);
}

TEST(PlanCli, PerpendicularDriveVanishesOnAxisUnlessStrained) {
  const std::string opts = " --what point --drive-lab 1,-1,0 --format json";
  const auto clean = parse(plan(projectWithField("a", "[0.3,0.3,0.3]") + opts));
  EXPECT_LT(clean["classes"][0]["drive_fraction"].get<double>(), 1e-9);
  const auto strained = parse(plan(projectWithField("s", "[0.3,0.3,0.3]", "5e-5") + opts));
  EXPECT_GT(strained["classes"][0]["drive_fraction"].get<double>(), 1e-3);
}

TEST(PlanCli, RequestFileGivesRegionAndRankedSettings) {
  const auto request = scratch("request.json");
  std::ofstream(request) << R"({ "format": "finestra-plan-request", "version": 1, "target_class": 0,
    "magnitudes_T": [0.4], "drive_lab": [1,0,0], "lines": "C",
    "reach": { "kind": "plane", "normal_lab": [0,1,0], "start_lab": [0,0,1], "step_deg": 2 },
    "constraints": { "qubit_GHz": [5, 20], "cyclicity": [50, null] },
    "objective": { "figure": "separation_linewidths", "goal": "max" }, "best": 3 })";
  const auto j = parse(plan(projectWithField("r", "[0,0,0.4]") + " --request " + request.string() + " --format json"));
  ASSERT_EQ(j["regions"].size(), 1u);
  EXPECT_EQ(j["regions"][0]["reachable"].get<int>(), 180);
  EXPECT_GT(j["regions"][0]["feasible"].get<int>(), 0);
  ASSERT_EQ(j["best"].size(), 3u);
  for (const auto& s : j["best"]) {
    const auto& f = s["classes"][0];
    EXPECT_GE(f["qubit_GHz"].get<double>(), 5.0);
    EXPECT_GE(f["cyclicity"].get<double>(), 50.0);
    EXPECT_NEAR(s["field_lab_T"][1].get<double>(), 0.0, 1e-12);  // in the plane ⟂ lab y
  }
  // CSV: one row per ranked setting after the header.
  const PlanRun csv = plan(projectWithField("r", "[0,0,0.4]") + " --request " + request.string() + " --format csv");
  EXPECT_EQ(csv.code, 0);
  EXPECT_EQ(std::count(csv.out.begin(), csv.out.end(), '\n'), 4);
  std::filesystem::remove(request);
}

TEST(PlanCli, BadRequestNamesTheKey) {
  const auto request = scratch("bad.json");
  std::ofstream(request) << R"({ "format": "finestra-plan-request", "constraints": { "qubit_Hz": [1, 2] } })";
  const PlanRun r = plan(projectWithField("b", "[0,0,0.4]") + " --request " + request.string());
  EXPECT_EQ(r.code, 2);
  EXPECT_NE(r.err.find("constraints.qubit_Hz"), std::string::npos) << r.err;
  EXPECT_NE(r.err.find(request.filename().string()), std::string::npos) << r.err;
  const PlanRun bad = plan(projectWithField("b", "[0,0,0.4]") + " --require cyclicity=abc:");
  EXPECT_EQ(bad.code, 2);
  EXPECT_NE(bad.err.find("--require"), std::string::npos) << bad.err;
  std::filesystem::remove(request);
}
