#pragma once
// What a plan says in words on top of its numbers: the recommendation, the symmetry statement
// and, when nothing is feasible, the explanation. Shared by the JSON and the table output.
#include <nlohmann/json.hpp>
#include <string>
#include <vector>

#include "core/model/centre_model.h"
#include "core/planner/infeasibility.h"
#include "core/planner/recommendation.h"

namespace finestra {

/// Qualifiers other plan features hand to the recommendation (see RecommendationFacts).
struct RecommendationQualifiers {
  std::string cyclicity;
  std::string population;
};

struct PlanAdvice {
  std::string recommendation;
  nlohmann::ordered_json symmetry;    ///< object
  nlohmann::ordered_json infeasible;  ///< null when some setting is feasible
  std::vector<std::string> lines;     ///< the same in words, for the table output
};

PlanAdvice planAdvice(const CentreModel& model, const PlanRequest& request, const PlanResult& result,
                      const RecommendationQualifiers& qualifiers = {});

}  // namespace finestra
