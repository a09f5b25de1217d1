#include "core/planner/plan_request.h"

#include <cmath>
#include <limits>

#include "core/centre/parameter_table.h"
#include "core/common/error_location.h"
#include "core/common/errors.h"
#include "core/common/limits.h"
#include "core/io/json_reader.h"
#include "core/io/text_file.h"
#include "core/planner/alignment_cone.h"

namespace finestra {
namespace {

constexpr double kInf = std::numeric_limits<double>::infinity();

double parseBound(const std::string& text, double open, const std::string& where) {
  if (text.empty()) return open;
  std::size_t used = 0;
  double v = 0;
  try {
    v = std::stod(text, &used);
  } catch (const std::exception&) {
    throw InputError(where, "'" + text + "' is not a number");
  }
  if (used != text.size() || !std::isfinite(v)) throw InputError(where, "'" + text + "' is not a finite number");
  return v;
}

void readReach(const JsonObjectReader& r, MagnetReach& reach) {
  r.allowOnly({"kind", "step_deg", "normal_lab", "start_lab", "magnet_axis_lab", "rotation_axis_lab"});
  if (r.has("kind")) reach.kind = parseReachKind(r.string("kind"), r.keyPath("kind"));
  reach.stepDeg = r.number("step_deg", reach.stepDeg);
  if (r.has("normal_lab")) reach.planeNormalLab = r.vec3("normal_lab");
  if (r.has("start_lab")) reach.planeStartLab = r.vec3("start_lab");
  if (r.has("magnet_axis_lab")) reach.magnetAxisLab = r.vec3("magnet_axis_lab");
  if (r.has("rotation_axis_lab")) reach.rotationAxisLab = r.vec3("rotation_axis_lab");
}

void readConstraints(const JsonObjectReader& r, const nlohmann::json& object, std::vector<Constraint>& out) {
  for (const auto& [key, value] : object.items()) {
    const std::string path = r.keyPath(key);
    Constraint c;
    c.figure = parseFigure(key, path);
    if (!value.is_array() || value.size() != 2)
      throw InputError(path, "expected [min, max] (null for an open end)");
    c.min = value[0].is_null() ? -kInf : finiteNumber(value[0], path + "[0]");
    c.max = value[1].is_null() ? kInf : finiteNumber(value[1], path + "[1]");
    if (c.min > c.max) throw InputError(path, "min is larger than max");
    out.push_back(c);
  }
}

std::array<double, 2> readRange(const JsonObjectReader& r, const char* key) {
  const nlohmann::json& value = r.raw(key);
  const std::string path = r.keyPath(key);
  if (!value.is_array() || value.size() != 2) throw InputError(path, "expected [min, max] in GHz");
  return {finiteNumber(value[0], path + "[0]"), finiteNumber(value[1], path + "[1]")};
}

std::uint64_t readSeed(const JsonObjectReader& r) {
  const nlohmann::json& value = r.raw("seed");
  if (!value.is_number_unsigned() || value.get<std::uint64_t>() > kMaxStrainSeed)
    throw InputError(r.keyPath("seed"), "expected an integer from 0 to 2^53 = 9007199254740992");
  return value.get<std::uint64_t>();
}

// "strain_population": {"eg_ground_GHz": [min, max], "eg_excited_GHz": [min, max], "samples": N,
// "seed": S, optional "angle_deg" and "distribution": "uniform"}.
StrainPopulation readStrainPopulation(const JsonObjectReader& r) {
  r.allowOnly({"eg_ground_GHz", "eg_excited_GHz", "samples", "seed", "angle_deg", "distribution"});
  for (const char* key : {"eg_ground_GHz", "eg_excited_GHz", "samples", "seed"})
    if (!r.has(key)) throw InputError(r.keyPath(key), "missing (a strain population needs eg_ground_GHz, eg_excited_GHz, samples and seed)");
  if (r.has("distribution") && r.string("distribution") != "uniform")
    throw InputError(r.keyPath("distribution"), "only \"uniform\" (in magnitude between the bounds) is offered");
  StrainPopulation p;
  p.groundGHz = readRange(r, "eg_ground_GHz");
  p.excitedGHz = readRange(r, "eg_excited_GHz");
  p.samples = r.integer("samples");
  p.seed = readSeed(r);
  if (r.has("angle_deg")) p.angleDeg = r.number("angle_deg");
  validateStrainPopulation(p, r.keyPath(""));
  return p;
}

}  // namespace

ReachKind parseReachKind(const std::string& text, const std::string& where) {
  if (text == "sphere") return ReachKind::Sphere;
  if (text == "plane") return ReachKind::Plane;
  if (text == "sample_rotation") return ReachKind::SampleRotation;
  throw InputError(where, "unknown reach '" + text + "' (valid: sphere, plane, sample_rotation)");
}

Constraint parseConstraintText(const std::string& text, const std::string& where) {
  const auto eq = text.find('=');
  const auto colon = text.find(':', eq == std::string::npos ? 0 : eq);
  if (eq == std::string::npos || colon == std::string::npos)
    throw InputError(where, "expected FIGURE=MIN:MAX (either bound may be empty), got '" + text + "'");
  Constraint c;
  c.figure = parseFigure(text.substr(0, eq), where);
  c.min = parseBound(text.substr(eq + 1, colon - eq - 1), -kInf, where);
  c.max = parseBound(text.substr(colon + 1), kInf, where);
  if (c.min > c.max) throw InputError(where, "min is larger than max in '" + text + "'");
  return c;
}

PlanRequest parsePlanRequest(const std::string& text, const std::string& origin, PlanRequest request) {
  const nlohmann::json doc = parseJsonStrict(text, origin);
  try {
    const JsonObjectReader r(doc, "");
    r.allowOnly({"format", "version", "description", "target_class", "magnitudes_T", "magnitude_T", "drive_lab",
                 "lines", "reach", "constraints", "objective", "best", "gap_scan_samples", "strain_population",
                 "alignment_tolerance_deg", "rank_quantile"});
    if (r.string("format", "finestra-plan-request") != "finestra-plan-request")
      throw InputError("format", "expected \"finestra-plan-request\"");
    if (r.integer("version", 1) != 1) throw InputError("version", "only version 1 is known");
    request.targetClass = r.integer("target_class", request.targetClass);
    if (r.has("magnitude_T") && r.has("magnitudes_T"))
      throw InputError("magnitude_T", "give either magnitude_T or magnitudes_T, not both");
    if (r.has("magnitude_T")) request.magnitudesT = {r.number("magnitude_T")};
    if (r.has("magnitudes_T")) {
      const auto& list = r.raw("magnitudes_T");
      if (!list.is_array() || list.empty()) throw InputError("magnitudes_T", "expected a non-empty array of numbers");
      request.magnitudesT.clear();
      for (std::size_t k = 0; k < list.size(); ++k)
        request.magnitudesT.push_back(finiteNumber(list[k], "magnitudes_T[" + std::to_string(k) + "]"));
    }
    if (r.has("drive_lab")) request.settings.driveLab = r.vec3("drive_lab");
    if (r.has("lines")) request.settings.family = parseLineFamily(r.string("lines"), "lines");
    if (r.has("reach")) readReach(r.object("reach"), request.reach);
    if (r.has("constraints")) {
      const JsonObjectReader c = r.object("constraints");
      request.constraints.clear();
      readConstraints(c, r.raw("constraints"), request.constraints);
    }
    if (r.has("objective")) {
      const JsonObjectReader o = r.object("objective");
      o.allowOnly({"figure", "goal"});
      if (o.has("figure")) request.objective.figure = parseFigure(o.string("figure"), o.keyPath("figure"));
      const std::string goal = o.string("goal", request.objective.maximise ? "max" : "min");
      if (goal != "max" && goal != "min") throw InputError(o.keyPath("goal"), "expected \"max\" or \"min\"");
      request.objective.maximise = goal == "max";
    }
    request.bestCount = r.integer("best", request.bestCount);
    if (r.has("strain_population")) request.strainPopulation = readStrainPopulation(r.object("strain_population"));
    if (r.has("alignment_tolerance_deg")) {
      request.alignmentToleranceDeg = r.number("alignment_tolerance_deg");
      validateAlignmentTolerance(*request.alignmentToleranceDeg);
    }
    request.rankQuantile = r.number("rank_quantile", request.rankQuantile);
    requireInRange(quantity("planner.rank_quantile"), request.rankQuantile, "rank_quantile");
    request.settings.gapScanSamples = r.integer("gap_scan_samples", request.settings.gapScanSamples);
    if (request.settings.gapScanSamples < 2 || request.settings.gapScanSamples > limits::kMaxGapScanSamples)
      throw InputError("gap_scan_samples", "must be between 2 and " + std::to_string(limits::kMaxGapScanSamples));
  } catch (const InputError& e) {
    throw locatedIn(e, origin);
  }
  request.settings.magnitudeT = request.magnitudesT.empty() ? 0.0 : request.magnitudesT.front();
  return request;
}

PlanRequest readPlanRequestFile(const std::string& path, PlanRequest defaults) {
  return parsePlanRequest(readTextFile(path), path, std::move(defaults));
}

}  // namespace finestra
