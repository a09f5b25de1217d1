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
        for (std::size_t c = 0; c < r.size(); ++c) row[table.headers[c]] = std::stod(r[c]);
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
