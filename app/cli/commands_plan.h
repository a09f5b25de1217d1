#pragma once
// finestra-cli plan: the magnet planner (issue 5). Settings come from the project (centre, sample,
// strain, classes, current field), an optional plan request file, and options; later wins.
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "app/cli/commands.h"

namespace CLI {
class App;
}

namespace finestra::cli {

struct PlanOptions {
  std::string what = "best";  ///< best, map, profile or point
  std::string requestFile;
  std::optional<int> targetClass;
  std::vector<double> magnitudesT;
  std::vector<double> driveLab;
  std::string lines;
  std::string reach;
  std::optional<double> stepDeg;
  std::vector<double> planeNormalLab, planeStartLab, magnetAxisLab, rotationAxisLab;
  std::vector<std::string> constraints;
  std::string objective, goal;
  std::optional<int> best;
  std::vector<double> strainGroundGHz, strainExcitedGHz;  ///< MIN,MAX of a strain population
  std::optional<int> strainSamples;
  std::optional<std::uint64_t> strainSeed;
  std::optional<double> strainAngleDeg;
  std::optional<double> alignmentToleranceDeg;
  std::optional<double> rankQuantile;
  std::vector<double> directionLab;  ///< profile direction (default: the project's field)
  std::optional<double> maxT;
  int points = 101;
  double mapStepDeg = 1.0;
};

/// Adds the plan options to `command`.
void addPlanOptions(CLI::App* command, PlanOptions& options);
int runPlan(const CommonOptions& common, const PlanOptions& options);

}  // namespace finestra::cli
