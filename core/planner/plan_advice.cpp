#include "core/planner/plan_advice.h"

#include "core/planner/class_symmetry.h"

namespace finestra {
namespace {

using json = nlohmann::ordered_json;

// The equivalence statement is exact for a centre without strain or static distortion; the
// reflection behind it does not in general preserve a strain (see class_symmetry.cpp).
bool strainFree(const CentreModel& model) {
  const auto noDistortion = [](const ManifoldModel& m) { return m.jtX == 0 && m.jtY == 0; };
  return model.setup().strain == StrainSetting{} && noDistortion(model.manifold(Manifold::Ground)) &&
         noDistortion(model.manifold(Manifold::Excited));
}

json symmetryAt(const Vec3& fieldCrystal, const std::vector<int>& classes, const Vec3& driveCrystal,
                std::vector<std::string>& reasons) {
  const ClassSymmetry s = classSymmetryAt(fieldCrystal, classes, driveCrystal);
  reasons.clear();
  for (const auto& group : s.groups)
    if (group.size() > 1) reasons.push_back(describeGroup(s, group));
  return {{"field_crystal", millerDirection(fieldCrystal)}, {"groups", s.groups}, {"reasons", reasons}};
}

std::string joinedReasons(const std::vector<std::string>& reasons) {
  if (reasons.empty()) return "every class stands apart";
  std::string text;
  for (const auto& r : reasons) text += (text.empty() ? "" : "; ") + r;
  return text;
}

}  // namespace

PlanAdvice planAdvice(const CentreModel& model, const PlanRequest& request, const PlanResult& result,
                      const RecommendationQualifiers& qualifiers) {
  PlanAdvice advice;
  const LabFrame& lab = model.setup().lab;
  const std::vector<int>& classes = request.settings.classes;
  const Vec3 driveCrystal = lab.toCrystal(request.settings.driveLab.normalized());
  const Vec3 normal = lab.toCrystal(Vec3::UnitZ()), inPlane = lab.toCrystal(Vec3::UnitX());
  const std::string cut = millerPlane(normal);

  // Recommendation or infeasibility.
  const std::optional<Infeasibility> infeasible = explainInfeasibility(request, result);
  if (!result.best.empty()) {
    RecommendationFacts facts = recommendationFacts(request, result.best.front());
    facts.cyclicityQualifier = qualifiers.cyclicity;
    facts.populationQualifier = qualifiers.population;
    advice.recommendation = recommendationText(facts);
  } else if (infeasible) {
    advice.recommendation = "No reachable setting meets every wanted range; see the explanation below.";
  } else {
    advice.recommendation = "No feasible setting can be ranked: the objective is undefined wherever every range holds.";
  }
  advice.lines.push_back("Recommendation: " + advice.recommendation);

  // Symmetry.
  std::vector<std::string> reasons;
  advice.symmetry = {{"sample_normal", cut}, {"sample_in_plane_x", millerDirection(inPlane)},
                     {"tested", "classes are equivalent where the true field makes the same angle with their axes "
                                "(equal |cos|); that is exactly where a crystal mirror containing the field maps "
                                "one class onto the other"},
                     {"strain_free", strainFree(model)}};
  if (!strainFree(model))
    advice.symmetry["note"] = "the project's strain or static distortion is left out of this statement; it can lift "
                              "these equivalences";
  advice.symmetry["along_sample_normal"] = symmetryAt(normal, classes, driveCrystal, reasons);
  advice.lines.push_back("Symmetry, field along the sample normal " + millerDirection(normal) + " of the " + cut +
                         " sample: " + joinedReasons(reasons) + ".");
  if (!result.best.empty() && result.best.front().fieldCrystalT.norm() > 0) {
    advice.symmetry["at_best"] = symmetryAt(result.best.front().fieldCrystalT, classes, driveCrystal, reasons);
    advice.lines.push_back("Symmetry at the recommended setting: " + joinedReasons(reasons) + ".");
  } else {
    advice.symmetry["at_best"] = nullptr;
  }
  std::vector<double> weights;
  for (const auto& d : result.directions) weights.push_back(d.solidAngleWeight);
  const ReachSymmetry reach =
      targetSymmetryOverReach(result.trueDirectionsCrystal, weights, request.targetClass, classes);
  advice.symmetry["target_alone_share"] = reach.targetAloneShare;
  advice.symmetry["always_tied_with"] = reach.alwaysTiedWith;
  advice.symmetry["warning"] = reach.warning.empty() ? json(nullptr) : json(reach.warning);
  if (!reach.warning.empty()) advice.lines.push_back("Warning: " + reach.warning + ".");
  if (!strainFree(model)) advice.lines.push_back("Note: " + advice.symmetry["note"].get<std::string>() + ".");

  // Infeasibility.
  advice.infeasible = nullptr;
  if (infeasible) {
    json ranges = json::array();
    for (std::size_t c = 0; c < infeasible->constraints.size(); ++c) {
      const ConstraintShortfall& s = infeasible->constraints[c];
      json entry = {{"constraint", constraintText(s.constraint)},
                    {"figure", std::string(figureInfo(s.constraint.figure).key)},
                    {"excluded_share", s.excludedShare},
                    {"sole_blocker_share", s.soleBlockerShare},
                    {"met_anywhere", s.metAnywhere},
                    {"never_together_with", json::array()}};
      for (std::size_t d : s.neverTogetherWith) entry["never_together_with"].push_back(constraintText(infeasible->constraints[d].constraint));
      if (s.magnitudeIndex && s.directionIndex) {
        const ReachableDirection& d = result.directions[*s.directionIndex];
        entry["best_compromise"] = {{"magnitude_T", request.magnitudesT[*s.magnitudeIndex]},
                                    {"polar_deg", d.polarDeg},
                                    {"azimuth_deg", d.azimuthDeg},
                                    {"magnet_angle_deg", std::isnan(d.magnetAngleDeg) ? json(nullptr) : json(d.magnetAngleDeg)},
                                    {"value", std::isnan(s.nearestValue) ? json(nullptr) : json(s.nearestValue)}};
      } else {
        entry["best_compromise"] = nullptr;
      }
      entry["explanation"] = infeasible->sentences[c];
      ranges.push_back(entry);
    }
    advice.infeasible = {{"reachable_points", result.directions.size() * request.magnitudesT.size()},
                         {"constraints", ranges}};
    for (const auto& s : infeasible->sentences) advice.lines.push_back("Infeasible: " + s);
  }
  return advice;
}

}  // namespace finestra
