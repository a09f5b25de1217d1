#include "core/planner/plan_report.h"

#include <cmath>
#include <cstdio>

#include "core/planner/plan_advice.h"
#include "core/planner/alignment_cone.h"
#include "core/thermal/planning_width.h"

namespace finestra {
namespace {

using json = nlohmann::ordered_json;

// JSON has no infinity: an open bound or a missing neighbour class is written as null.
json number(double v) { return std::isfinite(v) ? json(v) : json(nullptr); }
json vec(const Vec3& v) { return json::array({v.x(), v.y(), v.z()}); }

// A spin flip forbidden by symmetry (field exactly along the class axis without strain): the
// computed ratio is the cap, not a number anyone will measure (docs/physics.md, Planner figures).
constexpr const char* kUnboundedCyclicity =
    "cyclicity: unbounded at exact alignment (the spin flip is forbidden by symmetry); a real centre is limited by the "
    "alignment of the field: give alignment_tolerance_deg";

// Undefined figures print as a dash in tables and CSV, never as "nan".
std::string exactOrDash(double v) { return std::isnan(v) ? "—" : exact(v); }

std::string cell(double v, int decimals) {
  if (std::isnan(v)) return "—";
  if (std::isinf(v)) return v > 0 ? "inf" : "-inf";
  return fixed(v, decimals);
}

std::string cyclicityCell(double v) {
  if (v >= kCyclicityCap) return "limited by alignment";
  if (v >= 1e6) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.2e", v);
    return buf;
  }
  return cell(v, 1);
}
// Undefined (degenerate) figures: "-" in tables, null in JSON.

std::vector<std::string> figureCells(const ClassFigures& f) {
  return {cell(f.qubitGHz, 4), cell(f.driveFraction, 4), cyclicityCell(f.cyclicity),
          cell(f.separationLinewidths, 1), cell(f.groundGapGHz, 3), cell(f.excitedGapGHz, 3),
          cell(f.axisAngleDeg, 2)};
}
const std::vector<std::string> kFigureHeaders{"qubit GHz", "drive/free e-", "cyclicity", "separation FWHM",
                                              "ground gap GHz", "excited gap GHz", "axis angle deg"};

std::vector<std::string> joined(std::vector<std::string> a, const std::vector<std::string>& b) {
  a.insert(a.end(), b.begin(), b.end());
  return a;
}

std::string vecCell(const Vec3& v, int decimals) {
  char buf[128];
  std::snprintf(buf, sizeof buf, "[%.*f %.*f %.*f]", decimals, v.x(), decimals, v.y(), decimals, v.z());
  return buf;
}

json figuresValuesJson(const ClassFigures& f) {
  return {{"qubit_GHz", number(f.qubitGHz)},
          {"drive_GHz_per_T", number(f.driveGHzPerT)},
          {"drive_fraction", number(f.driveFraction)},
          {"cyclicity", f.cyclicity >= kCyclicityCap ? json(nullptr) : number(f.cyclicity)},
          {"cyclicity_capped", f.cyclicity >= kCyclicityCap},
          {"separation_linewidths", number(f.separationLinewidths)},
          {"ground_gap_GHz", number(f.groundGapGHz)},
          {"ground_gap_at_T", number(f.groundGapFieldT)},
          {"excited_gap_GHz", number(f.excitedGapGHz)},
          {"excited_gap_at_T", number(f.excitedGapFieldT)},
          {"axis_angle_deg", number(f.axisAngleDeg)}};
}

// Why figures of one class are undefined at this point ("" when all are defined). The drive and
// the cyclicity refer to a pair of levels; where that pair is degenerate (zero field, or a field
// perpendicular to the class axis where the spin sectors cross) no transition is singled out.
std::string undefinedReason(const ClassFigures& f) {
  std::string reason;
  auto add = [&](const char* text) { reason += (reason.empty() ? "" : "; ") + std::string(text); };
  if (std::isnan(f.axisAngleDeg)) add("axis_angle_deg: no field direction at zero field");
  if (std::isnan(f.driveGHzPerT) || std::isnan(f.driveFraction))
    add("drive: the two lowest ground levels are degenerate (zero field or a field perpendicular to the class axis)");
  if (std::isnan(f.cyclicity)) add("cyclicity: the chosen levels are degenerate, no spin-conserving line is singled out");
  if (f.cyclicity >= kCyclicityCap) add(kUnboundedCyclicity);
  if (std::isnan(f.qubitGHz) || std::isnan(f.separationLinewidths) || std::isnan(f.groundGapGHz) || std::isnan(f.excitedGapGHz))
    add("a level splitting is not defined at this point");
  return reason;
}

// With a strain population or an alignment tolerance each figure of a ranked setting is an object
// (quantiles over the centres, the worst within the cone) instead of a single number.
bool robustOutput(const PlanRequest& request) {
  return request.strainPopulation.active() || request.alignmentToleranceDeg.has_value();
}

// Why a reported value is null, "" when it is a number.
std::string nullReason(FigureId id, double v) {
  if (std::isnan(v)) return "undefined: the pair of levels it refers to is degenerate here";
  if (id == FigureId::Cyclicity && v >= kCyclicityCap) return kUnboundedCyclicity;
  if (std::isinf(v)) return "no other selected class to be separated from";
  return "";
}

json valueJson(FigureId id, double v) { return nullReason(id, v).empty() ? json(v) : json(nullptr); }

void addReason(json& entry, FigureId id, std::initializer_list<double> values) {
  for (double v : values)
    if (const std::string reason = nullReason(id, v); !reason.empty()) {
      entry["undefined_reason"] = reason;
      return;
    }
}

json quantilesJson(FigureId id, const Quantiles& q) {
  json out = {{"p10", valueJson(id, q.p10)}, {"p50", valueJson(id, q.p50)}, {"p90", valueJson(id, q.p90)}};
  if (q.undefinedCount > 0) out["undefined_centres"] = q.undefinedCount;
  addReason(out, id, {q.p10, q.p50, q.p90});
  return out;
}

// Without a population the one centre's value is each quantile; exact is on the cone's axis.
json spreadJson(const ClassSpread& spread, bool population, bool cone) {
  json out;
  std::string reasons;
  for (const FigureInfo& info : figureTable()) {
    const FigureSpread& f = spread[static_cast<std::size_t>(info.id)];
    const bool judged = cone && judgedInCone(info.id);
    json entry;
    if (population) {
      entry = quantilesJson(info.id, f.exact);
      if (judged) entry["worst_in_cone"] = quantilesJson(info.id, f.worst);
    } else if (judged) {
      entry = {{"exact", valueJson(info.id, f.exact.p50)}, {"worst_in_cone", valueJson(info.id, f.worst.p50)}};
      addReason(entry, info.id, {f.exact.p50, f.worst.p50});
    } else {
      entry = valueJson(info.id, f.exact.p50);
      if (const std::string reason = nullReason(info.id, f.exact.p50); !reason.empty())
        reasons += (reasons.empty() ? "" : "; ") + std::string(info.key) + ": " + reason;
    }
    out[std::string(info.key)] = entry;
  }
  if (!reasons.empty()) out["undefined_reason"] = reasons;
  return out;
}

json populationJson(const PlanRequest& request, const std::vector<CentreStrain>& drawn) {
  const StrainPopulation& p = request.strainPopulation;
  json centres = json::array();
  for (const CentreStrain& c : drawn)
    centres.push_back({{"eg_ground_GHz", c.groundGHz}, {"eg_excited_GHz", c.excitedGHz}, {"angle_deg", c.angleDeg}});
  return {{"eg_ground_GHz", {p.groundGHz[0], p.groundGHz[1]}},
          {"eg_excited_GHz", {p.excitedGHz[0], p.excitedGHz[1]}},
          {"distribution", "uniform"},
          {"draw", p.angleDeg ? "per centre one uniform fraction places both E-strain magnitudes in their ranges; "
                                "the angle is fixed for every centre"
                              : "per centre one uniform fraction places both E-strain magnitudes in their ranges and "
                                "one random E-strain angle (uniform in 0..360 deg) is shared by the ground and excited "
                                "manifolds"},
          {"replaces", "the project's strain.eg_ground and strain.eg_excited; the crystal strain tensor still applies"},
          {"figures", "quantiles p10, p50, p90 over the centres (linear interpolation between order statistics)"},
          {"centres", centres}};
}

std::string slashCell(FigureId id, const Quantiles& q, int decimals) {
  auto one = [&](double v) { return id == FigureId::Cyclicity ? cyclicityCell(v) : cell(v, decimals); };
  return one(q.p10) + " / " + one(q.p50) + " / " + one(q.p90);
}

std::string spreadCell(FigureId id, const Quantiles& q, bool population, int decimals) {
  if (population) return slashCell(id, q, decimals);
  return id == FigureId::Cyclicity ? cyclicityCell(q.p50) : cell(q.p50, decimals);
}

std::vector<std::string> robustFigureHeaders(bool population, bool cone) {
  std::vector<std::string> headers = kFigureHeaders;
  if (population)
    for (auto& h : headers) h += " p10/p50/p90";
  if (cone)
    for (const char* h : {"drive/free e- worst in cone", "cyclicity worst in cone", "separation worst in cone"})
      headers.push_back(h + std::string(population ? " p10/p50/p90" : ""));
  return headers;
}

// The columns of kFigureHeaders, then the judged figures' worst in the cone when there is one.
std::vector<std::string> spreadCells(const ClassSpread& spread, bool population, bool cone) {
  const std::vector<std::pair<FigureId, int>> columns{
      {FigureId::QubitGHz, 4},       {FigureId::DriveFraction, 4}, {FigureId::Cyclicity, 1},
      {FigureId::SeparationLinewidths, 1}, {FigureId::GroundGapGHz, 3}, {FigureId::ExcitedGapGHz, 3},
      {FigureId::AxisAngleDeg, 2}};
  std::vector<std::string> out;
  for (const auto& [id, decimals] : columns) out.push_back(spreadCell(id, spread[static_cast<std::size_t>(id)].exact, population, decimals));
  if (cone)
    for (const auto& [id, decimals] : columns)
      if (judgedInCone(id)) out.push_back(spreadCell(id, spread[static_cast<std::size_t>(id)].worst, population, decimals));
  return out;
}

// The keys that make a robust run reproducible and say how it was judged (top level of the output).
void addRobustKeys(json& out, const PlanRequest& request, const std::vector<CentreStrain>& drawn) {
  const bool population = request.strainPopulation.active(), cone = request.alignmentToleranceDeg.has_value();
  if (population) {
    out["samples"] = request.strainPopulation.samples;
    out["seed"] = request.strainPopulation.seed;
    out["strain_population"] = populationJson(request, drawn);
  }
  if (population || cone) out["rank_quantile"] = request.rankQuantile;
  if (cone) {
    out["alignment_tolerance_deg"] = *request.alignmentToleranceDeg;
    const std::vector<double> rings = coneRingsDeg(*request.alignmentToleranceDeg);
    out["alignment_cone"] = {{"directions", 1 + kConeRingPoints * static_cast<int>(rings.size())},
                             {"rings_deg", rings},
                             {"sampled_to_deg", rings.empty() ? 0.0 : rings.back()},
                             {"sampling", "the set direction and " + std::to_string(kConeRingPoints) +
                                              " directions on each ring; the tolerance is rounded up to the next ring"},
                             {"judged", "drive, cyclicity and separation: the smallest value found in the cone"}};
  }
}

}  // namespace

json figuresJson(const ClassFigures& f) {
  json out = figuresValuesJson(f);
  if (const std::string reason = undefinedReason(f); !reason.empty()) out["undefined_reason"] = reason;
  return out;
}

json spinTransitionsJson(const std::vector<SpinTransition>& transitions) {
  json out = json::array();
  for (const auto& t : transitions)
    out.push_back({{"lower", t.lower}, {"upper", t.upper}, {"frequency_GHz", t.frequencyGHz},
                   {"drive_GHz_per_T", t.driveGHzPerT}});
  return out;
}

json planJson(const CentreModel& model, const PlanRequest& request, const PlanResult& result) {
  json constraints = json::array();
  for (const auto& c : request.constraints)
    constraints.push_back({{"figure", std::string(figureInfo(c.figure).key)}, {"min", number(c.min)}, {"max", number(c.max)}});
  const MagnetReach& reach = request.reach;
  json reachJson = {{"kind", reachKindText(reach.kind)}, {"step_deg", reach.stepDeg}};
  if (reach.kind == ReachKind::Plane) reachJson["normal_lab"] = vec(reach.planeNormalLab), reachJson["start_lab"] = vec(reach.planeStartLab);
  if (reach.kind == ReachKind::SampleRotation)
    reachJson["magnet_axis_lab"] = vec(reach.magnetAxisLab), reachJson["rotation_axis_lab"] = vec(reach.rotationAxisLab);

  json regions = json::array();
  for (const auto& r : result.regions) {
    json intervals = json::array();
    for (const auto& i : r.intervals) {
      if (std::isnan(i.polarDeg)) intervals.push_back({{"angle_from_deg", i.fromDeg}, {"angle_to_deg", i.toDeg}});
      else intervals.push_back({{"polar_deg", i.polarDeg}, {"azimuth_from_deg", i.fromDeg}, {"azimuth_to_deg", i.toDeg}});
    }
    regions.push_back({{"magnitude_T", r.magnitudeT}, {"reachable", result.directions.size()},
                       {"feasible", r.feasibleCount}, {"fraction", r.fraction}, {"intervals", intervals}});
  }
  const bool robust = robustOutput(request), population = request.strainPopulation.active();
  const bool cone = request.alignmentToleranceDeg.has_value();
  json best = json::array();
  for (std::size_t k = 0; k < result.best.size(); ++k) {
    const RankedSetting& s = result.best[k];
    json classes = json::array();
    for (int cls : request.settings.classes) {
      const auto axis = classAxisIndices(cls);
      json c = {{"class", cls}, {"axis_crystal", {axis[0], axis[1], axis[2]}}};
      if (robust) c.update(spreadJson(s.spread[static_cast<std::size_t>(cls)], population, cone));
      else c.update(figuresJson(s.figures[static_cast<std::size_t>(cls)]));
      classes.push_back(c);
    }
    best.push_back({{"rank", k + 1},
                    {"magnitude_T", s.magnitudeT},
                    {"polar_deg", s.direction.polarDeg},
                    {"azimuth_deg", s.direction.azimuthDeg},
                    {"magnet_angle_deg", number(s.direction.magnetAngleDeg)},
                    {"field_lab_T", vec(s.fieldLabT)},
                    {"field_crystal_T", vec(s.fieldCrystalT)},
                    {"objective", valueJson(request.objective.figure, s.objectiveValue)},
                    {"classes", classes},
                    {"spin_transitions", spinTransitionsJson(s.spinTransitions)}});
  }
  const PlanAdvice advice = planAdvice(model, request, result);
  json out = {{"recommendation", advice.recommendation}};
  out.update(json{{"target_class", request.targetClass},
          {"lines", lineFamilyText(request.settings.family)},
          {"drive_lab", vec(request.settings.driveLab.normalized())},
          {"linewidth_GHz", separationLinewidthGHz(model)},
          {"reach", reachJson},
          {"constraints", constraints},
          {"objective", {{"figure", std::string(figureInfo(request.objective.figure).key)},
                         {"goal", request.objective.maximise ? "max" : "min"}}},
          {"regions", regions},
          {"best", best}});
  out["symmetry"] = advice.symmetry;
  out["infeasible"] = advice.infeasible;
  addRobustKeys(out, request, result.centres);
  return out;
}

Table planRegionTable(const PlanRequest& request, const PlanResult& result) {
  Table t;
  const bool sphere = request.reach.kind == ReachKind::Sphere;
  t.headers = {"|B| T", "feasible", "of", "share %", sphere ? "polar deg" : "", sphere ? "azimuth from" : "angle from",
               sphere ? "azimuth to" : "angle to"};
  if (!sphere) t.headers.erase(t.headers.begin() + 4);
  for (const auto& r : result.regions) {
    const std::vector<std::string> head{fixed(r.magnitudeT, 3), std::to_string(r.feasibleCount),
                                        std::to_string(result.directions.size()), fixed(100 * r.fraction, 2)};
    if (r.intervals.empty()) t.rows.push_back(joined(head, sphere ? std::vector<std::string>{"-", "-", "-"}
                                                                  : std::vector<std::string>{"-", "-"}));
    for (const auto& i : r.intervals) {
      std::vector<std::string> tail{fixed(i.fromDeg, 2), fixed(i.toDeg, 2)};
      if (sphere) tail.insert(tail.begin(), fixed(i.polarDeg, 2));
      t.rows.push_back(joined(head, tail));
    }
  }
  return t;
}

Table planBestTable(const PlanRequest& request, const PlanResult& result) {
  Table t;
  const bool population = request.strainPopulation.active(), cone = request.alignmentToleranceDeg.has_value();
  t.headers = joined({"rank", "|B| T", "polar deg", "azimuth deg", "magnet angle deg", "B crystal T"},
                     robustOutput(request) ? robustFigureHeaders(population, cone) : kFigureHeaders);
  for (std::size_t k = 0; k < result.best.size(); ++k) {
    const RankedSetting& s = result.best[k];
    const auto target = static_cast<std::size_t>(request.targetClass);
    t.rows.push_back(joined({std::to_string(k + 1), fixed(s.magnitudeT, 3), fixed(s.direction.polarDeg, 2),
                             fixed(s.direction.azimuthDeg, 2), cell(s.direction.magnetAngleDeg, 2),
                             vecCell(s.fieldCrystalT, 4)},
                            robustOutput(request) ? spreadCells(s.spread[target], population, cone)
                                                  : figureCells(s.figures[target])));
  }
  return t;
}

json pointJson(const CentreModel& model, const PlannerSettings& settings, const Vec3& fieldCrystal,
               const std::array<ClassFigures, kClassCount>& figures,
               const std::vector<std::vector<SpinTransition>>& transitions) {
  json classes = json::array();
  for (std::size_t k = 0; k < settings.classes.size(); ++k) {
    const int cls = settings.classes[k];
    const auto axis = classAxisIndices(cls);
    json c = {{"class", cls}, {"axis_crystal", {axis[0], axis[1], axis[2]}}};
    c.update(figuresJson(figures[static_cast<std::size_t>(cls)]));
    c["spin_transitions"] = spinTransitionsJson(transitions.at(k));
    classes.push_back(c);
  }
  return {{"field_crystal_T", vec(fieldCrystal)},
          {"field_lab_T", vec(model.setup().lab.toLab(fieldCrystal))},
          {"lines", lineFamilyText(settings.family)},
          {"drive_lab", vec(settings.driveLab.normalized())},
          {"linewidth_GHz", separationLinewidthGHz(model)},
          {"classes", classes}};
}

Table pointTable(const PlannerSettings& settings, const std::array<ClassFigures, kClassCount>& figures) {
  Table t;
  t.headers = joined({"class", "drive GHz/T"}, kFigureHeaders);
  for (int cls : settings.classes) {
    const ClassFigures& f = figures[static_cast<std::size_t>(cls)];
    t.rows.push_back(joined({std::to_string(cls), cell(f.driveGHzPerT, 4)}, figureCells(f)));
  }
  return t;
}

json pointSpreadJson(const CentreModel& model, const PlanRequest& request, const Vec3& fieldCrystal,
                     const std::vector<CentreStrain>& drawn, const std::array<ClassSpread, kClassCount>& spread) {
  const PlannerSettings& settings = request.settings;
  const bool population = request.strainPopulation.active(), cone = request.alignmentToleranceDeg.has_value();
  json classes = json::array();
  for (int cls : settings.classes) {
    const auto axis = classAxisIndices(cls);
    json c = {{"class", cls}, {"axis_crystal", {axis[0], axis[1], axis[2]}}};
    c.update(spreadJson(spread[static_cast<std::size_t>(cls)], population, cone));
    classes.push_back(c);
  }
  json out = {{"field_crystal_T", vec(fieldCrystal)},
              {"field_lab_T", vec(model.setup().lab.toLab(fieldCrystal))},
              {"lines", lineFamilyText(settings.family)},
              {"drive_lab", vec(settings.driveLab.normalized())},
              {"linewidth_GHz", separationLinewidthGHz(model)},
              {"classes", classes}};
  addRobustKeys(out, request, drawn);
  return out;
}

Table pointSpreadTable(const PlanRequest& request, const std::array<ClassSpread, kClassCount>& spread) {
  const bool population = request.strainPopulation.active(), cone = request.alignmentToleranceDeg.has_value();
  Table t;
  t.headers = joined({"class"}, robustFigureHeaders(population, cone));
  for (int cls : request.settings.classes)
    t.rows.push_back(joined({std::to_string(cls)}, spreadCells(spread[static_cast<std::size_t>(cls)], population, cone)));
  return t;
}

Table mapTable(const PlannerSettings& settings, const FigureMap& map) {
  Table t;
  t.headers = {"polar_deg", "azimuth_deg", "class"};
  for (const auto& info : figureTable()) t.headers.emplace_back(info.key);
  for (int i = 0; i < map.grid.polarCount; ++i)
    for (int j = 0; j < map.grid.azimuthCount; ++j)
      for (int cls : settings.classes) {
        const ClassFigures& f = map.at(i, j, cls);
        std::vector<std::string> row{exact(map.grid.polarDeg(i)), exact(map.grid.azimuthDeg(j)), std::to_string(cls)};
        for (const auto& info : figureTable()) row.push_back(exactOrDash(figureValue(f, info.id)));
        t.rows.push_back(std::move(row));
      }
  return t;
}

Table profileTable(const PlannerSettings& settings, const std::vector<ProfilePoint>& profile) {
  Table t;
  t.headers = {"magnitude_T", "class"};
  for (const auto& info : figureTable()) t.headers.emplace_back(info.key);
  for (const auto& p : profile)
    for (int cls : settings.classes) {
      std::vector<std::string> row{exact(p.magnitudeT), std::to_string(cls)};
      for (const auto& info : figureTable()) row.push_back(exactOrDash(figureValue(p.figures[static_cast<std::size_t>(cls)], info.id)));
      t.rows.push_back(std::move(row));
    }
  return t;
}

json profileJson(const PlannerSettings& settings, const Vec3& directionLab, const std::vector<ProfilePoint>& profile) {
  json points = json::array();
  for (const auto& p : profile) {
    json classes = json::array();
    for (int cls : settings.classes) {
      json c = {{"class", cls}};
      c.update(figuresJson(p.figures[static_cast<std::size_t>(cls)]));
      classes.push_back(c);
    }
    points.push_back({{"magnitude_T", p.magnitudeT}, {"classes", classes}});
  }
  return {{"direction_lab", vec(directionLab.normalized())}, {"points", points}};
}

}  // namespace finestra
