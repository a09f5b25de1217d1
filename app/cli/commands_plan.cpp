#include "app/cli/commands_plan.h"

#include <CLI/CLI.hpp>
#include <iostream>

#include "core/common/error_location.h"
#include "core/centre/parameter_table.h"
#include "core/common/errors.h"
#include "core/common/limits.h"
#include "core/io/project_file.h"
#include "core/project/model_setup.h"
#include "core/project/field_semantics.h"
#include "core/planner/plan_advice.h"
#include "core/planner/alignment_cone.h"
#include "core/planner/plan_report.h"

namespace finestra::cli {
namespace {

Vec3 vectorOption(const std::vector<double>& v, const std::string& option) {
  if (v.size() != 3) throw InputError(option, "expected three comma-separated numbers x,y,z");
  return Vec3(v[0], v[1], v[2]);
}

void print(const nlohmann::ordered_json& json, const std::vector<Table>& tables, OutputFormat format) {
  switch (format) {
    case OutputFormat::Json: std::cout << json.dump(2) << '\n'; break;
    case OutputFormat::Csv: std::cout << tables.back().toCsv(); break;
    case OutputFormat::Table:
      for (std::size_t k = 0; k < tables.size(); ++k) std::cout << (k ? "\n" : "") << tables[k].toText();
      break;
  }
}

std::array<double, 2> rangeOption(const std::vector<double>& v, const std::string& option) {
  if (v.size() != 2) throw InputError(option, "expected two comma-separated numbers MIN,MAX (GHz)");
  return {v[0], v[1]};
}

// The --strain-* options set or override the request's strain population; a population that starts
// on the command line needs all four of ranges, samples and seed.
void applyStrainOptions(const PlanOptions& o, StrainPopulation& p) {
  const bool any = !o.strainGroundGHz.empty() || !o.strainExcitedGHz.empty() || o.strainSamples || o.strainSeed ||
                   o.strainAngleDeg;
  if (!any) return;
  if (!p.active()) {
    const std::pair<bool, const char*> needed[] = {{!o.strainGroundGHz.empty(), "--strain-eg-ground-GHz"},
                                                   {!o.strainExcitedGHz.empty(), "--strain-eg-excited-GHz"},
                                                   {o.strainSamples.has_value(), "--strain-samples"},
                                                   {o.strainSeed.has_value(), "--strain-seed"}};
    for (const auto& [given, option] : needed)
      if (!given)
        throw InputError(option, "needed for a strain population (give --strain-eg-ground-GHz, --strain-eg-excited-GHz, "
                                 "--strain-samples and --strain-seed)");
  }
  if (!o.strainGroundGHz.empty()) p.groundGHz = rangeOption(o.strainGroundGHz, "--strain-eg-ground-GHz");
  if (!o.strainExcitedGHz.empty()) p.excitedGHz = rangeOption(o.strainExcitedGHz, "--strain-eg-excited-GHz");
  if (o.strainSamples) p.samples = *o.strainSamples;
  if (o.strainSeed) p.seed = *o.strainSeed;
  if (o.strainAngleDeg) p.angleDeg = *o.strainAngleDeg;
  // Name the options, not the request keys, in messages about values typed here.
  try {
    validateStrainPopulation(p, "--strain");
  } catch (const InputError& e) {
    std::string where = e.where();
    for (const auto& [key, option] : {std::pair{"--strain.eg_ground_GHz", "--strain-eg-ground-GHz"},
                                      std::pair{"--strain.eg_excited_GHz", "--strain-eg-excited-GHz"},
                                      std::pair{"--strain.samples", "--strain-samples"},
                                      std::pair{"--strain.seed", "--strain-seed"},
                                      std::pair{"--strain.angle_deg", "--strain-angle-deg"}})
      if (where.rfind(key, 0) == 0) where = option + where.substr(std::string(key).size());
    throw InputError(where, e.message());
  }
}

PlanRequest requestFrom(const Project& project, const CentreModel& model, const PlanOptions& o) {
  PlanRequest request;
  request.settings.classes = project.classes;
  request.targetClass = project.classes.empty() ? 0 : project.classes.front();
  request.magnet = project.magnet;  // reach directions and magnitudes are magnet settings
  const double projectMagnitude = project.field.labVector(model.setup().lab).norm();
  request.magnitudesT = {projectMagnitude > 0 ? projectMagnitude : 0.5};
  if (!o.requestFile.empty()) request = readPlanRequestFile(o.requestFile, request);
  if (o.targetClass) request.targetClass = *o.targetClass;
  if (!o.magnitudesT.empty()) request.magnitudesT = o.magnitudesT;
  if (!o.driveLab.empty()) request.settings.driveLab = vectorOption(o.driveLab, "--drive-lab");
  if (!o.lines.empty()) request.settings.family = parseLineFamily(o.lines, "--lines");
  if (!o.reach.empty()) request.reach.kind = parseReachKind(o.reach, "--reach");
  if (o.stepDeg) request.reach.stepDeg = *o.stepDeg;
  if (!o.planeNormalLab.empty()) request.reach.planeNormalLab = vectorOption(o.planeNormalLab, "--plane-normal-lab");
  if (!o.planeStartLab.empty()) request.reach.planeStartLab = vectorOption(o.planeStartLab, "--plane-start-lab");
  if (!o.magnetAxisLab.empty()) request.reach.magnetAxisLab = vectorOption(o.magnetAxisLab, "--magnet-axis-lab");
  if (!o.rotationAxisLab.empty())
    request.reach.rotationAxisLab = vectorOption(o.rotationAxisLab, "--rotation-axis-lab");
  for (const auto& text : o.constraints) request.constraints.push_back(parseConstraintText(text, "--require"));
  if (!o.objective.empty()) request.objective.figure = parseFigure(o.objective, "--objective");
  if (!o.goal.empty()) {
    if (o.goal != "max" && o.goal != "min") throw InputError("--goal", "expected max or min");
    request.objective.maximise = o.goal == "max";
  }
  if (o.best) request.bestCount = *o.best;
  applyStrainOptions(o, request.strainPopulation);
  if (o.alignmentToleranceDeg) {
    validateAlignmentTolerance(*o.alignmentToleranceDeg, "--alignment-tolerance-deg");
    request.alignmentToleranceDeg = *o.alignmentToleranceDeg;
  }
  if (o.rankQuantile) {
    requireInRange(quantity("planner.rank_quantile"), *o.rankQuantile, "--rank-quantile");
    request.rankQuantile = *o.rankQuantile;
  }
  request.settings.magnitudeT = request.magnitudesT.empty() ? 0.0 : request.magnitudesT.front();
  validatePlanRequest(request);
  return request;
}

}  // namespace

void addPlanOptions(CLI::App* cmd, PlanOptions& o) {
  cmd->add_option("--what", o.what, "best (feasible region and ranked settings), map, profile or point")
      ->check(CLI::IsMember({"best", "map", "profile", "point"}));
  cmd->add_option("--request", o.requestFile, "plan request file (JSON, format finestra-plan-request)");
  cmd->add_option("--class", o.targetClass, "target orientation class 0..3");
  cmd->add_option("--magnitudes-T", o.magnitudesT, "field magnitudes to try, comma-separated (T)")->delimiter(',');
  cmd->add_option("--drive-lab", o.driveLab, "microwave field direction in the lab frame, x,y,z")->delimiter(',');
  cmd->add_option("--lines", o.lines, "chosen lines: C (lower excited pair) or A (upper excited pair)");
  cmd->add_option("--reach", o.reach, "magnet reach: sphere, plane or sample_rotation");
  cmd->add_option("--step-deg", o.stepDeg, "angular step of the reachable directions (deg)");
  cmd->add_option("--plane-normal-lab", o.planeNormalLab, "plane reach: normal of the field plane, x,y,z")->delimiter(',');
  cmd->add_option("--plane-start-lab", o.planeStartLab, "plane reach: direction of angle 0, x,y,z")->delimiter(',');
  cmd->add_option("--magnet-axis-lab", o.magnetAxisLab, "sample_rotation reach: magnet axis, x,y,z")->delimiter(',');
  cmd->add_option("--rotation-axis-lab", o.rotationAxisLab, "sample_rotation reach: rotation axis, x,y,z")->delimiter(',');
  cmd->add_option("--require", o.constraints, "wanted range FIGURE=MIN:MAX (repeatable; a bound may be empty)");
  cmd->add_option("--objective", o.objective, "figure to rank by (default cyclicity)");
  cmd->add_option("--goal", o.goal, "max or min");
  cmd->add_option("--best", o.best, "number of ranked settings to report");
  cmd->add_option("--strain-eg-ground-GHz", o.strainGroundGHz, "strain population: MIN,MAX of the ground E-strain |eps_Eg| (GHz)")->delimiter(',');
  cmd->add_option("--strain-eg-excited-GHz", o.strainExcitedGHz, "strain population: MIN,MAX of the excited E-strain |eps_Eg| (GHz)")->delimiter(',');
  cmd->add_option("--strain-samples", o.strainSamples, "strain population: number of centres (1..4096)");
  cmd->add_option("--strain-seed", o.strainSeed, "strain population: seed of the random draw (0..2^53)");
  cmd->add_option("--strain-angle-deg", o.strainAngleDeg, "strain population: one fixed E-strain angle instead of a random one per centre");
  cmd->add_option("--alignment-tolerance-deg", o.alignmentToleranceDeg, "magnet's angular uncertainty (0..10 deg): drive, cyclicity and separation are judged at the worst direction in that cone");
  cmd->add_option("--rank-quantile", o.rankQuantile, "share of the sampled centres a setting must serve (0.01..1, default 0.5; 0.9 ranks a maximised figure by its p10)");
  cmd->add_option("--direction-lab", o.directionLab, "profile: true field direction in the lab, x,y,z (default: the project's true field)")->delimiter(',');
  cmd->add_option("--max-T", o.maxT, "profile: largest magnitude (default: the first magnitude)");
  cmd->add_option("--points", o.points, "profile: number of magnitudes")->check(CLI::Range(quantity("planner.profile_points").minimum, quantity("planner.profile_points").maximum));
  cmd->add_option("--map-step-deg", o.mapStepDeg, "map: grid step in polar and azimuth of the true field (deg)")->check(CLI::Range(limits::kMinMapStepDeg, quantity("planner.step_deg").maximum));
}

int runPlan(const CommonOptions& common, const PlanOptions& o) {
  Project project = readProjectFile(common.project);
  std::optional<CentreModel> model;
  try {
    model.emplace(makeModelSetup(project));
  } catch (const InputError& e) {
    throw locatedIn(e, common.project);
  }
  const PlanRequest request = requestFrom(project, *model, o);
  const PlannerSettings& settings = request.settings;

  if (o.what == "point") {
    const Vec3 field = projectFieldCrystal(project, model->setup().lab);
    if (field.norm() == 0) throw InputError(common.project + ": field", "the project's field is zero; no direction to evaluate");
    if (request.strainPopulation.active() || request.alignmentToleranceDeg) {
      const SampledFigures sampled(*model, settings, request.strainPopulation, request.alignmentToleranceDeg);
      std::vector<CentreFigures> centres;
      sampled.evaluate(field.normalized(), field.norm(), centres);
      std::array<ClassSpread, kClassCount> spread{};
      for (int cls : settings.classes) spread[static_cast<std::size_t>(cls)] = SampledFigures::spread(centres, cls);
      print(pointSpreadJson(*model, request, field, sampled.centres(), spread), {pointSpreadTable(request, spread)},
            common.format);
      return 0;
    }
    std::array<ClassFigures, kClassCount> figures{};
    PlannerKernel(*model, settings).evaluate(field.normalized(), field.norm(), figures);
    std::vector<std::vector<SpinTransition>> transitions;
    for (int cls : settings.classes) transitions.push_back(hyperfineSpinTransitions(*model, settings, cls, field));
    print(pointJson(*model, settings, field, figures, transitions), {pointTable(settings, figures)}, common.format);
    return 0;
  }
  if (o.what == "profile") {
    Vec3 direction = trueFieldLab(project, project.field, model->setup().lab);
    if (!o.directionLab.empty()) direction = vectorOption(o.directionLab, "--direction-lab");
    if (direction.norm() == 0) throw InputError("--direction-lab", "needed: the project's field is zero");
    const auto profile = magnitudeProfile(*model, settings, direction, o.maxT.value_or(request.magnitudesT.front()), o.points);
    print(profileJson(settings, direction, profile), {profileTable(settings, profile)}, common.format);
    return 0;
  }
  if (o.what == "map") {
    SphereGrid grid;
    grid.polarCount = static_cast<int>(std::lround(180.0 / o.mapStepDeg)) + 1;
    grid.azimuthCount = static_cast<int>(std::lround(360.0 / o.mapStepDeg)) + 1;
    const FigureMap map = computeFigureMap(*model, settings, grid);
    const Table table = mapTable(settings, map);
    if (common.format == OutputFormat::Json) {
      nlohmann::ordered_json rows = nlohmann::ordered_json::array();
      for (const auto& r : table.rows) {
        nlohmann::ordered_json row;
        for (std::size_t c = 0; c < r.size(); ++c)  // an undefined figure ("—") is null, never a crash
          row[table.headers[c]] = r[c] == "—" ? nlohmann::ordered_json(nullptr) : nlohmann::ordered_json(std::stod(r[c]));
        rows.push_back(row);
      }
      std::cout << nlohmann::ordered_json{{"magnitude_T", map.magnitudeT}, {"points", rows}}.dump(1) << '\n';
    } else {
      std::cout << table.toCsv();
    }
    return 0;
  }
  const PlanResult result = [&] {
    try {
      return finestra::runPlan(*model, request);
    } catch (const InputError& e) {
      if (!o.stepDeg || e.where() != "reach.step_deg") throw;
      throw InputError("--step-deg", e.message());  // the user typed the option, not the key
    }
  }();
  if (common.format == OutputFormat::Table)  // the advice in words above the tables (JSON carries it as keys)
    for (const std::string& line : planAdvice(*model, request, result).lines) std::cout << line << "\n\n";
  print(planJson(*model, request, result), {planRegionTable(request, result), planBestTable(request, result)},
        common.format);
  return 0;
}

}  // namespace finestra::cli
