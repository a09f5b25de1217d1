// finestra-cli plan prints a recommendation, the symmetry statement and, for a request that no
// setting meets, an explanation with exit code 0; on files written here (an invented scenario).
#include <gtest/gtest.h>

#include <nlohmann/json.hpp>

#include "cli_support.h"

using namespace finestra::testing;

namespace {

// Invented: SiV- in a (110) sample, lab x along [001].
std::string project110() {
  return writeTemp("advice_110.json", R"({ "format": "finestra-project", "version": 1,
    "description": "test configuration, invented",
    "centre": { "preset": "SiV-", "isotope": null, "parameters": {} },
    "sample": { "normal": [1,1,0], "in_plane_x": [0,0,1] },
    "field": { "vector_crystal_T": [0,0,0.4] },
    "classes": [0,1,2,3] })");
}

// A two-axis magnet turning in the sample plane, and two ranges no setting meets together.
std::string infeasibleRequest() {
  return writeTemp("advice_request.json", R"({ "format": "finestra-plan-request", "version": 1,
    "target_class": 0, "magnitudes_T": [0.4],
    "reach": { "kind": "plane", "step_deg": 5, "normal_lab": [0,0,1], "start_lab": [1,0,0] },
    "constraints": { "cyclicity": [1e12, null], "qubit_GHz": [null, 1] } })");
}

}  // namespace

TEST(PlanAdviceCli, InfeasibleRequestIsExplainedAndExitsZero) {
  const CliRun json = runCli("plan " + project110() + " --request " + infeasibleRequest() + " --format json");
  ASSERT_EQ(json.exitCode, 0) << json.err;
  const auto doc = nlohmann::ordered_json::parse(json.out);
  EXPECT_EQ(doc.begin().key(), "recommendation");
  EXPECT_EQ(doc["recommendation"].get<std::string>().rfind("No reachable setting meets every wanted range", 0), 0u);
  ASSERT_TRUE(doc["infeasible"].is_object());
  const auto& ranges = doc["infeasible"]["constraints"];
  ASSERT_EQ(ranges.size(), 2u);
  for (const auto& r : ranges) {
    EXPECT_GE(r["excluded_share"].get<double>(), 0.0);
    EXPECT_LE(r["excluded_share"].get<double>(), 1.0);
    EXPECT_FALSE(r["explanation"].get<std::string>().empty());
  }
  // In the (110) sample plane class 0 always has the same angle to the field as class 3.
  EXPECT_EQ(doc["symmetry"]["sample_normal"], "(110)");
  EXPECT_EQ(doc["symmetry"]["always_tied_with"], nlohmann::json::parse("[3]"));
  EXPECT_NE(doc["symmetry"]["warning"].get<std::string>().find("(110) plane"), std::string::npos);

  const CliRun table = runCli("plan " + project110() + " --request " + infeasibleRequest());
  ASSERT_EQ(table.exitCode, 0) << table.err;
  EXPECT_EQ(table.out.rfind("Recommendation: No reachable setting", 0), 0u) << table.out;
  EXPECT_NE(table.out.find("Infeasible: cyclicity >= 1e+12"), std::string::npos) << table.out;
  EXPECT_NE(table.out.find("Warning: class 0 cannot be singled out"), std::string::npos) << table.out;
}

TEST(PlanAdviceCli, FeasiblePlanStartsWithTheRecommendation) {
  const CliRun run = runCli("plan " + project110() + " --class 1 --step-deg 10 --require separation_linewidths=2: --format json");
  ASSERT_EQ(run.exitCode, 0) << run.err;
  const auto doc = nlohmann::ordered_json::parse(run.out);
  EXPECT_EQ(doc.begin().key(), "recommendation");
  EXPECT_EQ(doc["recommendation"].get<std::string>().rfind("Set the magnet to |B| = 0.400 T", 0), 0u) << doc["recommendation"];
  EXPECT_TRUE(doc["infeasible"].is_null());
  EXPECT_TRUE(doc["symmetry"]["warning"].is_null());
  // A 10° sphere grid puts some rows and columns exactly on crystal mirrors; off them class 1 is alone.
  EXPECT_GT(doc["symmetry"]["target_alone_share"].get<double>(), 0.5);
  EXPECT_LT(doc["symmetry"]["target_alone_share"].get<double>(), 1.0);
}
