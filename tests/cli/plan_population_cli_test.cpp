// finestra-cli plan with a strain population and an alignment tolerance, on configurations written
// here (invented, outside the project's examples): the output keys, the zero-spread identity, the
// worst case in the cone and the messages for bad options.
#include <gtest/gtest.h>

#include <map>
#include <nlohmann/json.hpp>
#include <string>
#include <utility>

#include "cli_support.h"

using finestra::testing::CliRun;
using finestra::testing::runCli;
using finestra::testing::writeTemp;

namespace {

// SiV- in a (001) sample with lab axes along the cubic axes; an extra E-strain at one angle.
std::string project(const std::string& name, const std::string& field, double egGround = 0, double egExcited = 0) {
  return writeTemp(name + ".json", R"({ "format": "finestra-project", "version": 1,
    "description": "test configuration, invented",
    "centre": { "preset": "SiV-", "isotope": null, "parameters": {} },
    "sample": { "normal": [0,0,1], "in_plane_x": [1,0,0] },
    "field": { "vector_crystal_T": )" + field + R"( },
    "strain": { "eg_ground": { "magnitude_GHz": )" + std::to_string(egGround) + R"(, "angle_deg": 15 },
                "eg_excited": { "magnitude_GHz": )" + std::to_string(egExcited) + R"(, "angle_deg": 15 } },
    "classes": [0,1,2,3] })");
}

// A two-axis magnet turning in the plane that holds [001] and the class-0 axis [111].
std::string request(const std::string& name, const std::string& extra) {
  return writeTemp(name, R"({ "format": "finestra-plan-request", "version": 1, "target_class": 0,
    "magnitudes_T": [0.3], "drive_lab": [1,0,0],
    "reach": { "kind": "plane", "normal_lab": [1,-1,0], "start_lab": [0,0,1], "step_deg": 5 },
    "objective": { "figure": "cyclicity", "goal": "max" }, "best": 200)" + extra + "}");
}

nlohmann::json json(const CliRun& r) {
  EXPECT_EQ(r.exitCode, 0) << r.err;
  return nlohmann::json::parse(r.out);
}

const char* const kFigures[] = {"qubit_GHz", "drive_GHz_per_T", "drive_fraction", "cyclicity", "separation_linewidths",
                                "ground_gap_GHz", "excited_gap_GHz", "axis_angle_deg"};
const char* const kJudged[] = {"drive_GHz_per_T", "drive_fraction", "cyclicity", "separation_linewidths"};

void expectOrdered(const nlohmann::json& q, const std::string& what) {
  if (q["p10"].is_null() || q["p50"].is_null() || q["p90"].is_null()) return;
  EXPECT_LE(q["p10"].get<double>(), q["p50"].get<double>()) << what;
  EXPECT_LE(q["p50"].get<double>(), q["p90"].get<double>()) << what;
}

}  // namespace

TEST(PlanPopulationCli, EveryFigureIsReportedAsQuantilesWithTheWorstInTheCone) {
  const auto req = request("population.json", R"(, "strain_population": { "eg_ground_GHz": [0, 60],
      "eg_excited_GHz": [0, 120], "samples": 24, "seed": 11 }, "alignment_tolerance_deg": 1.5)");
  const auto j = json(runCli("plan " + project("p", "[0,0,0.3]") + " --request " + req + " --format json"));
  EXPECT_EQ(j["samples"].get<int>(), 24);
  EXPECT_EQ(j["seed"].get<int>(), 11);
  EXPECT_EQ(j["strain_population"]["centres"].size(), 24u);
  EXPECT_NE(j["strain_population"]["draw"].get<std::string>().find("shared by the ground and excited"), std::string::npos);
  EXPECT_EQ(j["alignment_cone"]["sampled_to_deg"].get<double>(), 1.5);
  ASSERT_EQ(j["best"].size(), 72u);
  for (const auto& setting : j["best"])
    for (const auto& c : setting["classes"]) {
      for (const char* key : kFigures) {
        ASSERT_TRUE(c[key].is_object()) << key;
        expectOrdered(c[key], key);
      }
      // Each centre's worst in the cone is at most its on-axis value, so every quantile is too.
      for (const char* key : kJudged) {
        const auto& f = c[key];
        ASSERT_TRUE(f.contains("worst_in_cone")) << key;
        expectOrdered(f["worst_in_cone"], key);
        for (const char* p : {"p10", "p50", "p90"})
          if (!f[p].is_null() && !f["worst_in_cone"][p].is_null()) {
            EXPECT_LE(f["worst_in_cone"][p].get<double>(), f[p].get<double>()) << key << " " << p;
          }
      }
    }
  const CliRun table = runCli("plan " + project("p", "[0,0,0.3]") + " --request " + req);
  EXPECT_EQ(table.exitCode, 0) << table.err;
  EXPECT_NE(table.out.find("cyclicity worst in cone p10/p50/p90"), std::string::npos);
}

// A population of zero spread at the project's own strain and angle is the project's centre: the
// same numbers, to the last digit, as the plan without a population.
TEST(PlanPopulationCli, ZeroSpreadReproducesTheSingleStrainFigures) {
  const auto proj = project("z", "[0,0,0.3]", 20, 45);
  const auto single = json(runCli("plan " + proj + " --request " + request("single.json", "") + " --format json"));
  const auto population = json(runCli("plan " + proj + " --request " + request("single.json", "") +
                                      " --strain-eg-ground-GHz 20,20 --strain-eg-excited-GHz 45,45 --strain-samples 6"
                                      " --strain-seed 3 --strain-angle-deg 15 --format json"));
  ASSERT_EQ(single["best"].size(), population["best"].size());
  ASSERT_FALSE(single["best"].empty());
  for (std::size_t k = 0; k < single["best"].size(); ++k) {
    EXPECT_EQ(single["best"][k]["field_lab_T"], population["best"][k]["field_lab_T"]);
    for (std::size_t c = 0; c < 4; ++c)
      for (const char* key : kFigures) {
        const auto& value = single["best"][k]["classes"][c][key];
        const auto& q = population["best"][k]["classes"][c][key];
        EXPECT_EQ(q["p10"], value) << key;
        EXPECT_EQ(q["p50"], value) << key;
        EXPECT_EQ(q["p90"], value) << key;
      }
  }
}

// The worst case in a wider cone is never better, and a zero tolerance is the exact alignment.
TEST(PlanPopulationCli, WiderToleranceNeverImprovesTheWorstCase) {
  const auto proj = project("t", "[0,0,0.3]", 5, 10);
  const auto req = request("tolerance.json", "");
  std::map<std::pair<double, double>, nlohmann::json> previous;
  for (const char* tolerance : {"0", "0.3", "1", "2.5", "10"}) {
    const auto j = json(runCli("plan " + proj + " --request " + req + " --alignment-tolerance-deg " + tolerance +
                               " --format json"));
    std::map<std::pair<double, double>, nlohmann::json> now;
    for (const auto& s : j["best"]) now[{s["polar_deg"].get<double>(), s["azimuth_deg"].get<double>()}] = s["classes"][0];
    ASSERT_EQ(now.size(), 72u);
    for (const auto& [direction, c] : now) {
      for (const char* key : kJudged) {
        const auto& worst = c[key]["worst_in_cone"];
        if (std::string(tolerance) == "0") {
          EXPECT_EQ(worst, c[key]["exact"]) << key;
        }
        if (previous.empty() || worst.is_null()) continue;
        const auto& before = previous.at(direction)[key]["worst_in_cone"];
        if (!before.is_null()) {
          EXPECT_LE(worst.get<double>(), before.get<double>()) << key << " at " << tolerance;
        }
      }
    }
    previous = now;
  }
}

// Along the class axis without strain the spin flip is forbidden: no 1e15, but a null with the
// reason, and the table says the figure is limited by alignment.
TEST(PlanPopulationCli, CyclicityAtExactAlignmentIsLimitedByAlignment) {
  const auto proj = project("a", "[0.3,0.3,0.3]");
  const auto j = json(runCli("plan " + proj + " --what point --format json"));
  const auto& c0 = j["classes"][0];
  EXPECT_TRUE(c0["cyclicity"].is_null());
  EXPECT_TRUE(c0["cyclicity_capped"].get<bool>());
  EXPECT_NE(c0["undefined_reason"].get<std::string>().find("alignment"), std::string::npos);
  const CliRun table = runCli("plan " + proj + " --what point");
  EXPECT_NE(table.out.find("limited by alignment"), std::string::npos) << table.out;
  EXPECT_EQ(table.out.find("1e+15"), std::string::npos);
}

TEST(PlanPopulationCli, BadOptionsNameTheOptionAndTheLimit) {
  const auto proj = project("b", "[0,0,0.3]");
  const std::string strain = " --strain-eg-ground-GHz 0,10 --strain-eg-excited-GHz 0,20";
  auto fails = [&](const std::string& args, const std::string& named, const std::string& also = "") {
    const CliRun r = runCli("plan " + proj + " --reach plane --step-deg 30" + args);
    EXPECT_EQ(r.exitCode, 2) << args;
    EXPECT_NE(r.err.find(named), std::string::npos) << r.err;
    if (!also.empty()) {
      EXPECT_NE(r.err.find(also), std::string::npos) << r.err;
    }
  };
  fails(strain + " --strain-samples 5000 --strain-seed 1", "--strain-samples", "4096");
  fails(strain + " --strain-samples 8", "--strain-seed");
  fails(" --strain-eg-ground-GHz 10,0 --strain-eg-excited-GHz 0,20 --strain-samples 8 --strain-seed 1",
        "--strain-eg-ground-GHz", "min is larger than max");
  fails(" --alignment-tolerance-deg 11", "--alignment-tolerance-deg", "10");
  fails(" --rank-quantile 1.5", "--rank-quantile");
  const auto req = request("bad.json", R"(, "strain_population": { "eg_ground_GHz": [0, 1], "eg_excited_GHz": [0, 1],
      "samples": 4, "seed": 1, "distribution": "normal" })");
  const CliRun r = runCli("plan " + proj + " --request " + req);
  EXPECT_EQ(r.exitCode, 2);
  EXPECT_NE(r.err.find("strain_population.distribution"), std::string::npos) << r.err;
  EXPECT_NE(r.err.find("bad.json"), std::string::npos) << r.err;
}

// A map cell with an undefined figure (a field perpendicular to an unstrained class axis: degenerate
// qubit, no drive) is written as null in the JSON map instead of stopping the command.
TEST(PlanPopulationCli, MapJsonWritesUndefinedFiguresAsNull) {
  const CliRun r = runCli("plan " + project("m", "[0,0,0.3]") + " --what map --map-step-deg 45 --format json");
  ASSERT_EQ(r.exitCode, 0) << r.err;
  const auto j = nlohmann::json::parse(r.out);
  bool sawNull = false;
  for (const auto& p : j["points"]) sawNull = sawNull || p["drive_fraction"].is_null();
  EXPECT_TRUE(sawNull) << "polar 90, azimuth 135 is perpendicular to the class-0 axis [111]";
}

// --what point at the project's field: the same quantile objects per class, and along the class-0
// axis of an unstrained centre the cyclicity is unbounded exactly on axis but finite in the cone.
TEST(PlanPopulationCli, PointReportsQuantilesAndTheWorstInTheCone) {
  const auto j = json(runCli("plan " + project("q", "[0.3,0.3,0.3]") +
                             " --what point --alignment-tolerance-deg 1 --strain-eg-ground-GHz 0,0"
                             " --strain-eg-excited-GHz 0,0 --strain-samples 4 --strain-seed 2 --format json"));
  EXPECT_EQ(j["samples"].get<int>(), 4);
  ASSERT_EQ(j["classes"].size(), 4u);
  const auto& cyclicity = j["classes"][0]["cyclicity"];
  EXPECT_TRUE(cyclicity["p50"].is_null());
  EXPECT_NE(cyclicity["undefined_reason"].get<std::string>().find("alignment"), std::string::npos);
  EXPECT_GT(cyclicity["worst_in_cone"]["p50"].get<double>(), 1.0);
  EXPECT_LT(cyclicity["worst_in_cone"]["p50"].get<double>(), 1e12);
  const CliRun table = runCli("plan " + project("q", "[0.3,0.3,0.3]") + " --what point --alignment-tolerance-deg 1");
  EXPECT_EQ(table.exitCode, 0) << table.err;
  EXPECT_NE(table.out.find("limited by alignment"), std::string::npos) << table.out;
  EXPECT_NE(table.out.find("cyclicity worst in cone"), std::string::npos) << table.out;
}
