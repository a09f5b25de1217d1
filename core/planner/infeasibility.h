#pragma once
// Why no reachable setting meets every wanted range, and the nearest compromise (issue 11, item 2).
// An infeasible request is an answer, not an error: the plan reports this explanation.
#include <optional>
#include <string>
#include <vector>

#include "core/planner/planner.h"

namespace finestra {

/// One wanted range seen over the whole reachable set (every direction at every magnitude; each
/// point weighted by its direction's share divided by the number of magnitudes).
struct ConstraintShortfall {
  Constraint constraint;
  double excludedShare = 0;    ///< share where this range fails
  double soleBlockerShare = 0; ///< share where only this range fails (relaxing it alone frees these)
  bool metAnywhere = false;    ///< the range alone holds somewhere
  bool othersMetSomewhere = false;  ///< some point meets every other range
  std::vector<std::size_t> neverTogetherWith;  ///< other ranges never met at the same point as this one
  /// Among the points meeting every other range: the one whose figure lies nearest to this range.
  std::optional<std::size_t> magnitudeIndex, directionIndex;
  double nearestValue = 0;
};

struct Infeasibility {
  std::vector<ConstraintShortfall> constraints;
  std::vector<std::string> sentences;  ///< one per range, in words
};

/// "cyclicity >= 100", "qubit_GHz in [8, 14]", "drive_fraction <= 0.5".
std::string constraintText(const Constraint& c);

/// Nothing when some magnitude has a feasible direction. Needs result.targetFiguresLow and targetFiguresHigh.
std::optional<Infeasibility> explainInfeasibility(const PlanRequest& request, const PlanResult& result);

}  // namespace finestra
